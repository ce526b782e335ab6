/**
 * A block of cells on a named worksheet, and its A1 address as a formula or a
 * message writes it: `Loads!$A$1:$D$5`, `'Column bases'!F2`. Rows and columns
 * are 0-based here; addresses are 1-based as a spreadsheet shows them. Sheet
 * names are quoted where a formula needs it (anything but letters, digits,
 * "_" and ".", a leading digit, or a name that reads as a cell), with a quote
 * inside doubled.
 */
import { columnLetters } from "../core/index.js";

export interface SheetArea {
  sheet: string;
  /** 0-based row and column of the top-left cell. */
  top: number;
  left: number;
  rows: number;
  columns: number;
}

/** The last row and column of the worksheet grid (Office Open XML, as Excel uses it). */
export const GRID_ROWS = 1_048_576;
export const GRID_COLUMNS = 16_384;

/** A cell (or range) reference as typed: an optional sheet, then A1 or A1:B2, "$" allowed. */
const REFERENCE = /^(?:('(?:[^']|'')+'|[^'!:]+)!)?\$?([A-Za-z]{1,3})\$?(\d{1,7})(?::\$?([A-Za-z]{1,3})\$?(\d{1,7}))?$/;

/** The sheet part of a reference as a formula needs it: bare where it may be, else in quotes. */
export function sheetPrefix(sheet: string): string {
  const bare = /^[A-Za-z_][A-Za-z0-9_.]*$/.test(sheet) && !/^[A-Za-z]{1,3}\d+$/.test(sheet) && !/^[Rr]\d*[Cc]\d*$/.test(sheet);
  return bare ? `${sheet}!` : `'${sheet.replace(/'/g, "''")}'!`;
}

export function cellAddress(row: number, column: number, absolute = false): string {
  const d = absolute ? "$" : "";
  return `${d}${columnLetters(column)}${d}${row + 1}`;
}

/** `A1:D5` (or `A1` for one cell), without the sheet. */
export function areaAddress(area: SheetArea, absolute = false): string {
  const first = cellAddress(area.top, area.left, absolute);
  if (area.rows === 1 && area.columns === 1) return first;
  return `${first}:${cellAddress(area.top + area.rows - 1, area.left + area.columns - 1, absolute)}`;
}

/** `Loads!A1:D5`: the area as a message names it, sheet always given. */
export function areaName(area: SheetArea): string {
  return `${sheetPrefix(area.sheet)}${areaAddress(area)}`;
}

/** The area as a formula on `fromSheet` refers to it: absolute, with the sheet only where it is another. */
export function areaReference(area: SheetArea, fromSheet: string): string {
  return `${area.sheet === fromSheet ? "" : sheetPrefix(area.sheet)}${areaAddress(area, true)}`;
}

/** The cell at row r, column c of an area (0-based within it), with its sheet: "Loads!C4". */
export function cellInArea(area: SheetArea, row: number, column: number): string {
  return `${sheetPrefix(area.sheet)}${cellAddress(area.top + row, area.left + column)}`;
}

export type ParsedReference = { sheet: string | null; top: number; left: number; rows: number; columns: number };

/** "Loads!A1:D5", "'My sheet'!$B$2", "F1" → the area (sheet null where none is written); null when it is not one A1 reference. */
export function parseReference(text: string): ParsedReference | null {
  const m = REFERENCE.exec(text.trim());
  if (!m) return null;
  const sheet = m[1] === undefined ? null : m[1].startsWith("'") ? m[1].slice(1, -1).replace(/''/g, "'") : m[1];
  const a = { row: Number(m[3]) - 1, column: columnIndex(m[2]) };
  const b = m[4] === undefined ? a : { row: Number(m[5]) - 1, column: columnIndex(m[4]) };
  if ([a, b].some((p) => p.row < 0 || p.row >= GRID_ROWS || p.column >= GRID_COLUMNS)) return null;
  const top = Math.min(a.row, b.row);
  const left = Math.min(a.column, b.column);
  return { sheet, top, left, rows: Math.abs(a.row - b.row) + 1, columns: Math.abs(a.column - b.column) + 1 };
}

function columnIndex(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

/** Whether the area fits on the worksheet grid. */
export function onGrid(area: SheetArea): boolean {
  return area.top >= 0 && area.left >= 0 && area.top + area.rows <= GRID_ROWS && area.left + area.columns <= GRID_COLUMNS;
}
