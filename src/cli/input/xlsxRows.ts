/**
 * A worksheet's rows, read as its XML is inflated (never held whole), within a
 * range: each row's cells as the core reads them — numbers, text (shared and
 * inline strings, a formula's saved text), booleans and error values as the
 * text a spreadsheet shows for them (TRUE, #DIV/0!), so that they are answered
 * as the same cells of a CSV file are — and, apart, the cells the core must not
 * be given as they are: a number shown as a date or a time, and a formula
 * whose value was never saved. The merged areas come after the cells in the
 * part (ISO/IEC 29500-1 §18.3.1.55 mergeCells [memory: clause number]), so
 * they are known once the last row has been read.
 *
 * saxes reads the XML (the strict parser the audit and the spreadsheet library
 * use), here without namespace processing: a worksheet's elements are matched by
 * their local names, whatever prefix a writer gave them.
 */
import { SaxesParser, type SaxesTagPlain } from "saxes";
import { columnLetters, type Cell } from "../../core/index.js";
import { CliError } from "../cliError.js";
import type { DateStyles } from "./xlsxStyles.js";
import type { WorkbookPackage } from "./workbookPackage.js";

/** A rectangle of the sheet, 1-based and inclusive; bottom and right may be Infinity (to the sheet's end). */
export interface SheetArea {
  top: number;
  left: number;
  bottom: number;
  right: number;
}

export interface OddCell {
  /** Index into the record's cells. */
  column: number;
  /** What is wrong, as a sentence without the place. */
  message: string;
}

export interface SheetRecord {
  /** The sheet's row number (1-based). */
  row: number;
  /** The row's cells from the range's left column; as long as its last cell in the range. */
  cells: Cell[];
  /** Cells refused as they stand, or null. */
  odd: OddCell[] | null;
}

export interface SheetRows {
  records: AsyncGenerator<SheetRecord>;
  /** The range read: the one given, or the sheet's used range as saved (its dimension), open to the right and below. */
  area(): SheetArea;
  /** Merged areas of the sheet, once every record has been read. */
  merges(): SheetArea[];
  /** Characters of the part read so far. */
  charactersRead(): number;
}

export interface SheetRowsOptions {
  part: string;
  sharedStrings: readonly string[];
  dates: DateStyles;
  /** The range to read; null for the sheet's used range. */
  range: SheetArea | null;
  /** Names the sheet in messages about the part itself. */
  sheet: string;
  /** The sheet as a reference names it ("Results!", "'Load cases'!"), for messages about a cell. */
  prefix: string;
}

/** "AB12" → { row: 12, column: 28 }, or null. */
export function parseCellAddress(text: string): { row: number; column: number } | null {
  let column = 0;
  let k = 0;
  for (; k < text.length; k++) {
    const c = text.charCodeAt(k) | 0x20;
    if (c < 0x61 || c > 0x7a) break;
    column = column * 26 + (c - 0x60);
  }
  if (k === 0 || k > 3 || k === text.length) return null;
  let row = 0;
  for (let j = k; j < text.length; j++) {
    const d = text.charCodeAt(j) - 0x30;
    if (d < 0 || d > 9) return null;
    row = row * 10 + d;
  }
  return row >= 1 ? { row, column } : null;
}

/** "A1:Q2000" (or "A1") → an area, or null. */
export function parseArea(text: string): SheetArea | null {
  const [a, b, ...rest] = text.replace(/\$/g, "").trim().split(":");
  if (rest.length > 0) return null;
  const first = parseCellAddress(a ?? "");
  const second = b === undefined ? first : parseCellAddress(b);
  if (!first || !second) return null;
  return {
    top: Math.min(first.row, second.row),
    left: Math.min(first.column, second.column),
    bottom: Math.max(first.row, second.row),
    right: Math.max(first.column, second.column),
  };
}

export function sheetRows(pkg: WorkbookPackage, options: SheetRowsOptions): SheetRows {
  const { part, sharedStrings, dates } = options;
  const parser = new SaxesParser<{ xmlns: false; position: true }>({ xmlns: false, position: true });
  const merges: SheetArea[] = [];
  let area: SheetArea | null = options.range;
  let characters = 0;

  const ready: SheetRecord[] = [];
  let row = 0;
  let column = 0;
  let cells: Cell[] = [];
  let odd: OddCell[] | null = null;
  let inRow = false;
  let rowWanted = false;

  // The cell being read.
  let cellColumn = 0;
  let cellType = "n";
  let cellStyle = 0;
  let cellWanted = false;
  let value: string | null = null;
  let formula: string | null = null;
  let inline: string | null = null;
  let capture: "v" | "f" | "t" | null = null;
  let phonetic = 0;
  let text = "";

  const local = (name: string) => {
    const colon = name.indexOf(":");
    return colon < 0 ? name : name.slice(colon + 1);
  };
  const refuse = (message: string): never => {
    throw new CliError(`${pkg.file}: ${part} (sheet "${options.sheet}") line ${parser.line}, column ${parser.column + 1}: ${message}`);
  };

  parser.on("error", (e) => refuse(`not well-formed XML: ${e.message.replace(/^\d+:\d+: /, "")}`));
  parser.on("opentag", (tag: SaxesTagPlain) => {
    switch (local(tag.name)) {
      case "dimension": {
        const used = parseArea(String(tag.attributes.ref ?? ""));
        // The used range as saved fixes where the table starts; it stays open to the right and below.
        if (!area && used && used.bottom > used.top - 1) area = { top: used.top, left: used.left, bottom: Infinity, right: Infinity };
        return;
      }
      case "row": {
        const r = tag.attributes.r;
        row = r !== undefined ? Number(r) : row + 1;
        if (!Number.isInteger(row) || row < 1) refuse(`a row's number r="${String(r)}" is not a row number`);
        area ??= { top: 1, left: 1, bottom: Infinity, right: Infinity };
        inRow = true;
        rowWanted = row >= area.top && row <= area.bottom;
        column = 0;
        cells = [];
        odd = null;
        return;
      }
      case "c": {
        const r = tag.attributes.r;
        if (r !== undefined) {
          const at = parseCellAddress(String(r));
          if (!at) return refuse(`a cell's reference r="${String(r)}" is not a cell address`);
          if (inRow && at.row !== row) return refuse(`cell ${String(r)} is written in row ${row}`);
          column = at.column;
        } else column++;
        cellColumn = column;
        cellType = String(tag.attributes.t ?? "n");
        cellStyle = Number(tag.attributes.s ?? 0);
        const a = area as SheetArea;
        cellWanted = rowWanted && column >= a.left && column <= a.right;
        if (rowWanted && column < a.left && options.range === null) {
          throw new CliError(
            `${pkg.file} ${options.prefix}${columnLetters(column - 1)}${row}: the cell lies left of the sheet's used range as saved (from column ${columnLetters(a.left - 1)}); say where the table is with --range`,
          );
        }
        value = null;
        formula = null;
        inline = null;
        return;
      }
      case "v":
      case "f":
        if (cellWanted) {
          capture = local(tag.name) as "v" | "f";
          text = "";
        }
        return;
      case "is":
        if (cellWanted) inline = "";
        return;
      case "t":
        if (cellWanted && inline !== null && phonetic === 0) {
          capture = "t";
          text = "";
        }
        return;
      case "rPh":
        phonetic++;
        return;
      case "mergeCell": {
        const merged = parseArea(String(tag.attributes.ref ?? ""));
        if (merged) merges.push(merged);
        return;
      }
    }
  });
  parser.on("text", (t) => {
    if (capture) text += t;
  });
  parser.on("cdata", (t) => {
    if (capture) text += t;
  });
  parser.on("closetag", (tag) => {
    switch (local(tag.name)) {
      case "v":
        if (capture === "v") value = text;
        capture = null;
        return;
      case "f":
        if (capture === "f") formula = text;
        capture = null;
        return;
      case "t":
        if (capture === "t") inline = (inline ?? "") + text;
        capture = null;
        return;
      case "rPh":
        phonetic--;
        return;
      case "c":
        if (cellWanted) placeCell();
        cellWanted = false;
        return;
      case "row":
        if (rowWanted && cells.length > 0) ready.push({ row, cells, odd });
        inRow = false;
        rowWanted = false;
        return;
    }
  });

  function placeCell(): void {
    const index = cellColumn - (area as SheetArea).left;
    const read = cellValue();
    if (read === null) return;
    while (cells.length < index) cells.push(null);
    if (typeof read === "object") {
      cells[index] = null;
      (odd ??= []).push({ column: index, message: read.odd });
    } else cells[index] = read;
  }

  /** The cell as the core reads it, null where it is empty, or why it is refused. */
  function cellValue(): string | number | null | { odd: string } {
    switch (cellType) {
      case "s": {
        if (value === null) return null;
        const s = sharedStrings[Number(value)];
        return s ?? refuse(`a cell names shared string ${value}, which the shared strings part does not hold`);
      }
      case "inlineStr":
        return inline;
      case "str":
        return value ?? noSavedValue();
      case "b":
        return value === null ? noSavedValue() : value.trim() === "1" ? "TRUE" : "FALSE";
      case "e":
        return value ?? noSavedValue();
      case "d":
        return value === null ? noSavedValue() : { odd: `the date ${value} is not a load effect or a name; write the value as a number` };
      default: {
        if (value === null || value.trim() === "") return noSavedValue();
        const n = Number(value);
        if (!Number.isFinite(n)) return value;
        const date = dates.dateFormat(cellStyle);
        if (date !== undefined) {
          return { odd: `the number ${value} is shown as a date or a time (${date}), so it is a count of days, not a load effect or a name; format the cell as a number (or as text, for a name)` };
        }
        return n;
      }
    }
  }

  function noSavedValue(): null | { odd: string } {
    if (formula === null) return null;
    const shown = formula.length > 60 ? `${formula.slice(0, 57)}…` : formula;
    return {
      odd: `the cell holds the formula =${shown} but no saved value (the program that wrote the workbook did not calculate it); open the workbook in a spreadsheet program, recalculate and save it, or paste the values`,
    };
  }

  async function* records(): AsyncGenerator<SheetRecord> {
    for await (const piece of pkg.textPieces(part)) {
      characters += piece.length;
      parser.write(piece);
      for (const record of ready) yield record;
      ready.length = 0;
    }
    parser.close();
    for (const record of ready) yield record;
    ready.length = 0;
  }

  return {
    records: records(),
    area: () => area ?? { top: 1, left: 1, bottom: Infinity, right: Infinity },
    merges: () => merges,
    charactersRead: () => characters,
  };
}
