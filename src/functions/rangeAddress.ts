/**
 * Where an argument range sits on the sheet, from Excel's parameter addresses
 * ("Loads!B3:F9", "'Column bases'!$A$1:$D$12"), so that a problem at row r,
 * column c of the range is reported as the cell the user can click.
 */
import { columnLetters } from "../core/index.js";

export interface RangeAddress {
  /** The sheet part as Excel wrote it, quotes included ("'Column bases'"), or "" when absent. */
  sheet: string;
  /** 0-based row and column of the range's top-left cell. */
  top: number;
  left: number;
}

const CELL = /^\$?([A-Za-z]{1,3})\$?(\d{1,7})$/;

/** Null for anything that is not a cell or range reference (a typed constant, an omitted argument). */
export function parseRangeAddress(address: string | null | undefined): RangeAddress | null {
  if (!address) return null;
  const bang = address.lastIndexOf("!");
  const sheet = bang >= 0 ? address.slice(0, bang) : "";
  const first = (bang >= 0 ? address.slice(bang + 1) : address).split(":")[0].trim();
  const m = CELL.exec(first);
  if (!m) return null;
  return { sheet, top: Number(m[2]) - 1, left: columnIndex(m[1].toUpperCase()) };
}

function columnIndex(letters: string): number {
  let n = 0;
  for (const ch of letters) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

/** The A1 name of row r, column c of an argument: "Loads!C5", or "cell C5" (counted within the argument) when its place is unknown. */
export function cellName(range: RangeAddress | null, row: number, column: number): string {
  if (!range) return `cell ${columnLetters(column)}${row + 1}`;
  const a1 = `${columnLetters(range.left + column)}${range.top + row + 1}`;
  return range.sheet ? `${range.sheet}!${a1}` : a1;
}

/** A whole row of an argument: "Loads!row 7", or "row 3" (counted within the argument). */
export function rowName(range: RangeAddress | null, row: number): string {
  if (!range) return `row ${row + 1}`;
  return `${range.sheet ? `${range.sheet}!` : ""}row ${range.top + row + 1}`;
}

/** A whole column of an argument: "Loads!column D", or "column B" (counted within the argument). */
export function columnName(range: RangeAddress | null, column: number): string {
  if (!range) return `column ${columnLetters(column)}`;
  return `${range.sheet ? `${range.sheet}!` : ""}column ${columnLetters(range.left + column)}`;
}
