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

const blankOrZero = (c: Cell) => isBlank(c) || c === 0;

/** The longest row's length (a loop: spreading a range of 100,000 rows into Math.max would overflow the stack). */
export function widthOf(rows: readonly (readonly unknown[])[]): number {
  let width = 0;
  for (const r of rows) if (r.length > width) width = r.length;
  return width;
}

/**
 * A case table as a range gives it: trailing rows and columns that hold only
 * blanks and zeros are outside it (no header can be 0, and an older Excel
 * build sends 0 for an empty cell), so a generous selection reads as the table.
 */
export function trimTrailingEmpty(m: Cell[][]): Cell[][] {
  let rows = m.length;
  while (rows > 0 && m[rows - 1].every(blankOrZero)) rows--;
  const kept = m.slice(0, rows);
  let width = widthOf(kept);
  while (width > 0 && kept.every((r) => r.length < width || blankOrZero(r[width - 1]))) width--;
  return kept.map((r) => (r.length > width ? r.slice(0, width) : r));
}
