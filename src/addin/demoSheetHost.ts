/**
 * The sheet host in a plain browser: a small workbook kept in the page, with
 * one worksheet "Demo" holding an invented case table, selected from the
 * start. The pane reads, previews, inserts formulas and writes the reviewer's
 * copy here as it does in Excel; formulas are kept as text (nothing computes
 * them outside Excel) and nothing is saved. The numbers are invented for the
 * demo and are not an analysis of anything.
 */
import { problem, type Cell, type Result } from "../core/index.js";
import type { SheetCell } from "../sheet/reviewerSheet.js";
import { cellAddress, parseReference, type SheetArea } from "../sheet/sheetArea.js";
import type { RangeRead, SheetHost } from "../sheet/sheetHost.js";

export const DEMO_SHEET = "Demo";

/** Invented for the demo: a column's axial force P, shear V and moment M per load case (cases as rows), for the invented demo ruleset's symbols. */
export const DEMO_TABLE: readonly (readonly Cell[])[] = [
  ["", "P", "V", "M"],
  ["D", 120, 4, 18],
  ["L", 80, 6, 25],
  ["S", 30, 2, 9],
  ["W:N", -15, 12, 40],
  ["W:E", 10, 9, -32],
];

interface DemoCell {
  value: Cell;
  formula: string;
}

const failed = (message: string): Result<never> => ({ ok: false, problems: [problem("sheet-range", message)] });

export function demoSheetHost(): SheetHost {
  const sheets = new Map<string, Map<string, DemoCell>>([[DEMO_SHEET, new Map()]]);
  const demo = sheets.get(DEMO_SHEET) as Map<string, DemoCell>;
  DEMO_TABLE.forEach((row, r) => row.forEach((value, c) => (value === "" ? undefined : demo.set(cellAddress(r, c), { value, formula: "" }))));
  const selected: SheetArea = { sheet: DEMO_SHEET, top: 0, left: 0, rows: DEMO_TABLE.length, columns: DEMO_TABLE[0].length };

  const readArea = (area: SheetArea, name: string | null = null): Result<RangeRead> => {
    const sheet = sheets.get(area.sheet);
    if (!sheet) return failed(`there is no worksheet named "${area.sheet}" in the demo (it has ${[...sheets.keys()].join(", ")})`);
    const values: Cell[][] = [];
    const formulas: string[][] = [];
    for (let r = 0; r < area.rows; r++) {
      values.push([]);
      formulas.push([]);
      for (let c = 0; c < area.columns; c++) {
        const cell = sheet.get(cellAddress(area.top + r, area.left + c));
        values[r].push(cell?.value ?? null);
        formulas[r].push(cell?.formula ?? "");
      }
    }
    return { ok: true, value: { area, name, values, formulas } };
  };

  return {
    where: "the invented demo table in this page (no workbook; nothing is saved)",
    selection: () => Promise.resolve(readArea(selected)),
    read: (reference) => {
      const parsed = parseReference(reference);
      if (!parsed) return Promise.resolve(failed(`"${reference.trim()}" is not a range such as Demo!A1:D6 (the demo defines no names)`));
      return Promise.resolve(readArea({ ...parsed, sheet: parsed.sheet ?? DEMO_SHEET }));
    },
    readArea: (area) => Promise.resolve(readArea(area)),
    write: (sheetName, cells, options) => {
      const sheet = sheets.get(sheetName);
      if (!sheet) return Promise.resolve(failed(`there is no worksheet named "${sheetName}" in the demo`));
      if (options?.clear) {
        for (let r = 0; r < options.clear.rows; r++) for (let c = 0; c < options.clear.columns; c++) sheet.delete(cellAddress(options.clear.top + r, options.clear.left + c));
      }
      for (const cell of cells) sheet.set(cell.address, demoCell(cell));
      return Promise.resolve({ ok: true, value: true } as const);
    },
    addSheet: (name) => {
      let chosen = name;
      for (let n = 2; [...sheets.keys()].some((k) => k.toLowerCase() === chosen.toLowerCase()); n++) chosen = `${name.slice(0, 26)} (${n})`;
      sheets.set(chosen, new Map());
      return Promise.resolve({ ok: true, value: chosen } as const);
    },
  };
}

function demoCell(cell: SheetCell): DemoCell {
  switch (cell.kind) {
    case "formula":
      return { value: null, formula: `=${cell.formula}` };
    case "number":
    case "text":
      return { value: cell.value, formula: "" };
  }
}

