/**
 * One value cell of a case table: a finite number, or blank (zero). Text that
 * reads as a decimal number counts only where numbers come as text (CSV files).
 */
import { DECIMAL_TEXT, isBlank, type Cell } from "../cells.js";
import { problem, type Problem } from "../problems.js";

export interface ValueOptions {
  /** Accept numbers written as text ("12.5"): right for CSV files, wrong for worksheet cells. */
  numbersAsText?: boolean;
}

/** One value cell: a finite number, or blank (zero). Anything else is a located problem. */
export function readValue(
  cell: Cell,
  place: { row: number; column: number },
  header: string,
  options: ValueOptions,
  problems: Problem[],
): number {
  if (typeof cell === "number") {
    if (Number.isFinite(cell)) return cell;
    problems.push(problem("cases-not-a-number", `${cell} is not a finite number`, { ...place, header }));
    return 0;
  }
  if (isBlank(cell)) return 0;
  if (typeof cell === "string") {
    const text = cell.trim();
    if (options.numbersAsText && DECIMAL_TEXT.test(text)) return Number(text);
    const hint = /^[+-]?[\d.,]+$/.test(text) ? " (a number stored as text? convert it)" : "";
    problems.push(problem("cases-not-a-number", `"${text}" is not a number${hint}`, { ...place, header }));
    return 0;
  }
  problems.push(problem("cases-not-a-number", `${String(cell).toUpperCase()} is not a number`, { ...place, header }));
  return 0;
}
