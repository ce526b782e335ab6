/**
 * The demo workbook: the invented workshop's case table and the LW.* formulas
 * over it, so that opening it in Excel with the Loadwright add-in loaded shows
 * live results.
 *
 * How the formulas are stored: Excel keeps a call to an add-in's custom
 * function in the file as _xldudf_<NAMESPACE>_<NAME> (LW.ENVELOPE is stored as
 * _xldudf_LW_ENVELOPE) and shows it as LW.ENVELOPE; written as "LW.ENVELOPE"
 * the file would open with #NAME?. Each formula is a dynamic-array formula
 * (markDynamicArrays), so its result spills instead of showing "@".
 */
import ExcelJS from "exceljs";
import { CAUTIONS } from "../output/preamble.js";
import { markDynamicArrays } from "./dynamicArrayFormulas.js";

export interface DemoCase {
  header: string[];
  rows: (string | number)[][];
}

export interface DemoWorkbookInput {
  cases: DemoCase;
  ruleset: string;
  parameters: [string, number][];
  criteria: string[];
  /** A row label and result to explain (as the command line printed them). */
  explain: { row: string; component: string };
}

/** The stored form of an add-in function call: LW.ENVELOPE → _xldudf_LW_ENVELOPE. */
export function storedFunctionName(name: string): string {
  return `_xldudf_${name.replace(/\./g, "_")}`;
}

/** A formula as the file stores it, from the text a user types (without "="). */
export function storedFormula(typed: string): string {
  return typed.replace(/\bLW\.([A-Z]+)\(/g, (_m, fn: string) => `${storedFunctionName(`LW.${fn}`)}(`);
}

const TITLE = "Loadwright demo: column base reactions of a small steel-framed workshop (kN)";
const INVENTED = "INVENTED numbers, for the demo only: not a real structure, not an analysis, not for design.";

function absolute(column: number, row: number): string {
  let n = column + 1;
  let letters = "";
  while (n > 0) {
    letters = String.fromCharCode(65 + ((n - 1) % 26)) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return `$${letters}$${row}`;
}

export async function demoWorkbook(input: DemoWorkbookInput): Promise<Uint8Array> {
  const book = new ExcelJS.Workbook();
  book.creator = "Loadwright demo";
  book.calcProperties.fullCalcOnLoad = true;

  // Cases: title, cautions, the case table, the ruleset and the parameters.
  const cases = book.addWorksheet("Cases");
  cases.getCell("A1").value = TITLE;
  cases.getCell("A1").font = { bold: true, size: 13 };
  cases.getCell("A2").value = INVENTED;
  cases.getCell("A2").font = { bold: true, color: { argb: "FFC00000" } };
  CAUTIONS.forEach((c, i) => (cases.getCell(3 + i, 1).value = `Caution: ${c}`));
  const top = 7;
  const all = [input.cases.header, ...input.cases.rows];
  all.forEach((row, r) => row.forEach((value, c) => (cases.getCell(top + r, 1 + c).value = value)));
  cases.getRow(top).font = { bold: true };
  const width = input.cases.header.length;
  const bottom = top + all.length - 1;
  const table = `Cases!${absolute(0, top)}:${absolute(width - 1, bottom)}`;
  const headers = `Cases!${absolute(1, top)}:${absolute(width - 1, top)}`;
  const side = width + 1; // one blank column after the table
  cases.getCell(top, side + 1).value = "ruleset";
  cases.getCell(top, side + 2).value = input.ruleset;
  cases.getCell(top + 1, side + 1).value = "parameters (invented)";
  input.parameters.forEach(([name, value], i) => {
    cases.getCell(top + 2 + i, side + 1).value = name;
    cases.getCell(top + 2 + i, side + 2).value = value;
  });
  const ruleset = `Cases!${absolute(side + 1, top)}`;
  const params = `Cases!${absolute(side, top + 2)}:${absolute(side + 1, top + 1 + input.parameters.length)}`;
  const stampRow = top + 3 + input.parameters.length;
  cases.getCell(stampRow, side + 1).value = "ruleset in use:";
  formula(cases, stampRow + 1, side + 1, `LW.RULESET(${ruleset})`);
  cases.getColumn(1).width = 12;

  const envelope = book.addWorksheet("Envelope");
  heading(envelope, "Envelope: per result, the largest and smallest value over every combination row");
  formula(envelope, 4, 1, `LW.ENVELOPE(${table},${ruleset},${params})`);

  const governing = book.addWorksheet("Governing");
  heading(governing, "Governing rows: the rows chosen by these criteria, with every concurrent value");
  input.criteria.forEach((c, i) => (governing.getCell(4 + i, 1).value = c));
  const criteria = `${absolute(0, 4)}:${absolute(0, 3 + input.criteria.length)}`;
  formula(governing, 5 + input.criteria.length, 1, `LW.GOVERNING(${table},${ruleset},${criteria},${params})`);

  const combos = book.addWorksheet("Combinations");
  heading(combos, "Combination rows with their clause and the factor on every case");
  formula(combos, 4, 1, `LW.COMBOS(${ruleset},${params},${headers})`);

  const explain = book.addWorksheet("Explain");
  heading(explain, "One value written out: factors, where each comes from, products and sum");
  explain.getCell("A4").value = "row";
  explain.getCell("B4").value = input.explain.row;
  explain.getCell("A5").value = "result";
  explain.getCell("B5").value = input.explain.component;
  formula(explain, 7, 1, `LW.EXPLAIN(${table},${ruleset},$B$4,$B$5,${params})`);

  const written = new Uint8Array(await book.xlsx.writeBuffer());
  return markDynamicArrays(written);
}

function heading(sheet: ExcelJS.Worksheet, text: string): void {
  sheet.getCell("A1").value = text;
  sheet.getCell("A1").font = { bold: true };
  sheet.getCell("A2").value = INVENTED;
  sheet.getCell("A2").font = { color: { argb: "FFC00000" } };
}

/** A spilling formula anchored at one cell. */
function formula(sheet: ExcelJS.Worksheet, row: number, column: number, typed: string): void {
  const cell = sheet.getCell(row, column);
  cell.value = { formula: storedFormula(typed), shareType: "array", ref: cell.address } as ExcelJS.CellFormulaValue;
}
