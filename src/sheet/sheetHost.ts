/**
 * What the task pane asks of a spreadsheet, and nothing more: read the
 * selection, a typed range or a defined name; read a block before writing
 * over it; write cells (one loop over a list of cells with A1 addresses) after
 * clearing a block; add a worksheet. Inside Excel the add-in's entry hands the
 * pane an implementation over Office.js; in a plain browser, one over the
 * invented demo table kept in the page. The pane's logic sees only this
 * interface, so it runs the same against either, and against a test's stand-in.
 */
import type { Cell, Result } from "../core/index.js";
import type { SheetCell } from "./reviewerSheet.js";
import { cellAddress, type SheetArea } from "./sheetArea.js";

export interface RangeRead {
  area: SheetArea;
  /** The defined name the range was read by, or null for an address or the selection. */
  name: string | null;
  /** One value per cell: a number, text, TRUE/FALSE, or null for an empty cell. */
  values: Cell[][];
  /** The formula of each cell as typed ("=LW.ENVELOPE(…)"), or "" for a constant or an empty cell. */
  formulas: string[][];
}

export interface WriteOptions {
  /** Cleared (contents only) before the cells are written: the whole block a confirmation named. */
  clear?: SheetArea;
}

export interface SheetHost {
  /** Where the cells are, in words: "the open workbook", "the demo table in this page". */
  readonly where: string;
  /** The selected block of cells, with its values and formulas. */
  selection(): Promise<Result<RangeRead>>;
  /** "Loads!A1:D5", "A1:D5" (on the active sheet) or a name defined in the workbook. */
  read(reference: string): Promise<Result<RangeRead>>;
  /** A block given by its place, as it is before anything is written there. */
  readArea(area: SheetArea): Promise<Result<RangeRead>>;
  /** The cells (addresses on `sheet`): text stays text, numbers numbers, formulas formulas. */
  write(sheet: string, cells: readonly SheetCell[], options?: WriteOptions): Promise<Result<true>>;
  /** A new worksheet named `name`, or `name (2)`, `name (3)` … where that is taken; gives the name used. */
  addSheet(name: string): Promise<Result<string>>;
}

/** The cells of a block that hold anything (a value, a formula, a spilled result), as A1 addresses. */
export function filledCells(read: RangeRead): string[] {
  const out: string[] = [];
  read.values.forEach((row, r) =>
    row.forEach((value, c) => {
      const formula = read.formulas[r]?.[c] ?? "";
      const empty = (value === null || value === undefined || value === "") && formula === "";
      if (!empty) out.push(cellAddress(read.area.top + r, read.area.left + c));
    }),
  );
  return out;
}

