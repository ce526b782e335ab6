/**
 * One value cell of a case table: a finite number, or blank (zero). Text that
 * reads as a decimal number counts only where numbers come as text (CSV files),
 * and only where it reads as a finite number: "1e400" is beyond the largest
 * double and would read as Infinity, so it is refused, as Infinity and NaN are.
 */
import { DECIMAL_TEXT, isBlank, type Cell } from "../cells.js";
import { problem, type Problem } from "../problems.js";

/** The error values a spreadsheet cell can hold, as Excel writes them into CSV files and range values. */
const EXCEL_ERROR = /^#(NULL!|DIV\/0!|VALUE!|REF!|NAME\?|NUM!|N\/A|GETTING_DATA|SPILL!|CALC!|FIELD!|BLOCKED!|CONNECT!|BUSY!|UNKNOWN!)$/;

/** A long cell's text, cut for a message (a field of a megabyte is not repeated whole). */
function shortened(text: string): string {
  return text.length <= 60 ? text : `${text.slice(0, 40)}… (${text.length.toLocaleString("en-US")} characters)`;
}

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
    if (options.numbersAsText && DECIMAL_TEXT.test(text)) {
      const value = Number(text);
      if (Number.isFinite(value)) return value;
      problems.push(problem("cases-not-a-number", `"${shortened(text)}" is beyond the largest number Loadwright can hold (about ±1.8 × 10^308)`, { ...place, header }));
      return 0;
    }
    if (EXCEL_ERROR.test(text)) {
      problems.push(problem("cases-not-a-number", `${text} is an error value, not a number (the formula that should have given it failed)`, { ...place, header }));
      return 0;
    }
    const hint = /^[+-]?[\d.,]+$/.test(text) ? " (a number stored as text? convert it)" : "";
    problems.push(problem("cases-not-a-number", `"${shortened(text)}" is not a number${hint}`, { ...place, header }));
    return 0;
  }
  problems.push(problem("cases-not-a-number", `${String(cell).toUpperCase()} is not a number`, { ...place, header }));
  return 0;
}
