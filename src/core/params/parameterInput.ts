/**
 * The two ways a user gives parameters: a range of name/value pairs, or text
 * such as "SDS=1.2; rho=1.3" (a cell, a command-line option).
 */
import { cellText, DECIMAL_TEXT, isBlank, type Cell } from "../cells.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";

/** Parameter name → value as given (a number, or the name of a choice). */
export type ParameterInput = Record<string, number | string>;

const NAME = /^[\p{L}_][\p{L}\p{N}_]*$/u;

/** "SDS=1.2; rho=1.3" — pairs separated by ";" or new lines. */
export function parseParameterText(text: string): Result<ParameterInput> {
  const out: ParameterInput = {};
  const problems: Problem[] = [];
  let offset = 0;
  for (const piece of text.split(/[;\n]/)) {
    const start = offset;
    offset += piece.length + 1;
    if (piece.trim() === "") continue;
    const eq = piece.indexOf("=");
    const position = start + piece.search(/\S/) + 1;
    if (eq < 0) {
      problems.push(problem("parameter-syntax", `"${piece.trim()}" is not name=value`, { position }));
      continue;
    }
    const name = piece.slice(0, eq).trim();
    const value = piece.slice(eq + 1).trim();
    if (!NAME.test(name)) {
      problems.push(problem("parameter-syntax", `"${name}" is not a parameter name`, { position }));
      continue;
    }
    if (name in out) {
      problems.push(problem("parameter-syntax", `${name} is given twice`, { position, header: name }));
      continue;
    }
    if (value === "") {
      problems.push(problem("parameter-syntax", `${name} has no value after "="`, { position: start + eq + 2, header: name }));
      continue;
    }
    out[name] = numberOrText(value);
  }
  return problems.length > 0 ? fail(...problems) : ok(out);
}

/** A range of [name, value] rows; blank rows are skipped. */
export function parameterPairs(rows: Cell[][]): Result<ParameterInput> {
  const out: ParameterInput = {};
  const problems: Problem[] = [];
  rows.forEach((row, r) => {
    if (row.every(isBlank)) return;
    if (row.length < 2) {
      problems.push(problem("parameter-syntax", "a parameters range has two columns: name and value", { row: r, column: 0 }));
      return;
    }
    const name = cellText(row[0]);
    const cell = row[1];
    if (!NAME.test(name)) {
      problems.push(problem("parameter-syntax", `"${name}" is not a parameter name`, { row: r, column: 0 }));
      return;
    }
    if (name in out) {
      problems.push(problem("parameter-syntax", `${name} is given twice`, { row: r, column: 0, header: name }));
      return;
    }
    if (isBlank(cell)) {
      problems.push(problem("parameter-syntax", `${name} has no value`, { row: r, column: 1, header: name }));
      return;
    }
    if (typeof cell === "boolean") {
      problems.push(problem("parameter-not-number", `${name} is ${String(cell).toUpperCase()}, not a number or a choice`, { row: r, column: 1, header: name }));
      return;
    }
    out[name] = typeof cell === "number" ? cell : numberOrText(cellText(cell));
  });
  return problems.length > 0 ? fail(...problems) : ok(out);
}

/** "1.2" → 1.2; anything that is not a plain decimal number stays text (a choice, or an error later). */
export function numberOrText(value: string): number | string {
  return DECIMAL_TEXT.test(value) ? Number(value) : value;
}
