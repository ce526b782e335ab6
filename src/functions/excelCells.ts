/**
 * What Excel hands a custom function, made regular before the core reads it.
 * Ranges arrive as any[][]; a blank cell arrives as null, "" or (older desktop
 * builds) 0. Blank value cells read as zero everywhere. Where a range holds only
 * text (ruleset rows, parameter names, criteria, options) a row of blanks and
 * zeros is a blank row, and trailing rows and columns of a case table that hold
 * only blanks and zeros are outside the table: no header can be 0, so such a
 * row or column is what an older build sends for empty cells.
 */
import { isBlank, type Cell } from "../core/index.js";

/** A range, a single value, or null for an omitted argument, as rows of cells. */
export function asMatrix(raw: unknown): Cell[][] | null {
  if (raw === null || raw === undefined) return null;
  if (!Array.isArray(raw)) return [[asCell(raw)]];
  if (raw.length === 0) return [];
  if (!Array.isArray(raw[0])) return [raw.map(asCell)];
  return raw.map((row) => (Array.isArray(row) ? row.map(asCell) : [asCell(row)]));
}

/** A single value: a one-cell range is read as its cell. */
export function asScalar(raw: unknown): { value: Cell } | { cells: number } {
  const m = asMatrix(raw);
  if (m === null) return { value: null };
  const count = m.reduce((n, r) => n + r.length, 0);
  if (count === 1) return { value: m[0][0] };
  if (count === 0) return { value: null };
  return { cells: count };
}

function asCell(value: unknown): Cell {
  if (value === null || value === undefined) return null;
  if (typeof value === "string" || typeof value === "number" || typeof value === "boolean") return value;
  // An error value in a cell (CustomFunctions.Error: a code such as "#N/A") reads as its code, which the core names as an error value.
  const code = (value as { code?: unknown }).code;
  if (typeof code === "string" && code.startsWith("#")) return code;
  // Anything else Excel may hand over (an entity, a rich value) is shown as its JSON text, which no reader takes for a number.
  try {
    return JSON.stringify(value) ?? typeof value;
  } catch {
    return typeof value;
  }
}

const blankOrZero = (c: Cell) => isBlank(c) || c === 0;

/** True when the argument was omitted or every cell is blank. */
export function isEmptyArgument(m: Cell[][] | null): boolean {
  return m === null || m.every((row) => row.every(isBlank));
}

/** Text-only ranges: a row of blanks and zeros is blank. */
export function blankZeroRows(m: Cell[][]): Cell[][] {
  return m.map((row) => (row.every(blankOrZero) ? row.map(() => null) : row));
}

/** Case tables: trailing rows and columns of blanks and zeros dropped (the core's rule, which the task pane's preview shares). */
export { trimTrailingEmpty } from "../core/index.js";
