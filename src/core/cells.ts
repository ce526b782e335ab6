/** What a worksheet range or a parsed CSV line gives the core: one value per cell. */
export type Cell = string | number | boolean | null | undefined;

/**
 * Blank as every Excel build sends it: null (web, newer desktop), "" or
 * undefined. An older desktop build sends 0 for a blank, which cannot be told
 * from a typed 0; both read as zero, so the results agree.
 */
export function isBlank(cell: Cell): boolean {
  return cell === null || cell === undefined || (typeof cell === "string" && cell.trim() === "");
}

/** A cell as text, trimmed: numbers as Excel would show them in general format. */
export function cellText(cell: Cell): string {
  if (cell === null || cell === undefined) return "";
  return String(cell).trim();
}

/** "12.5", "-3", "1e3": a number written as text (CSV fields, typed parameters). */
export const DECIMAL_TEXT = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
