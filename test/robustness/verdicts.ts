/**
 * What the robustness classes require of an answer, in one place:
 *
 * - the command line ends with status 0 or 1 (never 70, "internal error", or a
 *   stack trace), and every error line names the file and where in it — a line
 *   (and column), or the whole file where the problem is the whole file's;
 * - no output holds NaN or Infinity;
 * - a formula's #VALUE! message names the cell (or the argument, where the
 *   problem is the whole table's).
 */
import { parse } from "csv-parse/sync";
import type { Outcome } from "../../src/functions/runFormula.js";
import { errorLines, type CliOutcome } from "./cliInProcess.js";

/** Problems that are about the file or table as a whole, and rightly name no line. */
const WHOLE_FILE = [
  /^the file is empty; a case file starts with a header row/,
  /^the case table has no result rows( below its header row)?$/,
  /^the case table needs a header row, a header column and at least one value$/,
  /^(neither|both) the first row (nor|and) the first column/,
  /^no combination of \S+ applies to this case table/,
  /^is a directory, not a case file$/,
  /^no such file$/,
  /^cannot be read \(/,
  /^not valid JSON: /,
  /^not readable as CSV: /,
  /^JSON nested more than \d+ deep/,
  /^the file shrank while it was read/,
  /^a JSON case file is an array of rows/,
  /^the ruleset expands to [\d,]+ concrete rows for this case table, more than the limit/,
  // A criterion over several results: it names them, and the row.
  /^criterion ".*" has no finite value in row ".*"/,
];

/** Lines that follow a located line and carry no place of their own. */
const FOLLOWERS = [/^if column [A-Z]+ is part of each result row's name/, /^… and [\d,]+ more problems?$/];

/** Problems with an option's value, placed by the option (and the character in it). */
const OPTION = /^--(criterion "[^\n]*"(, character \d+)?|row|component|param): /;

/** Whether one error line of a run on `file` says where its problem is. */
export function locatedLine(line: string, file: string): boolean {
  if (FOLLOWERS.some((re) => re.test(line)) || OPTION.test(line)) return true;
  if (line.startsWith(`${file} line `)) return /^ line \d+/.test(line.slice(file.length));
  if (!line.startsWith(`${file}: `)) return false;
  const sentence = line.slice(file.length + 2);
  return WHOLE_FILE.some((re) => re.test(sentence));
}

/** A run's verdict; throws (a crash) on status 70, a usage error, a stack trace or a run with neither output nor error. */
export function cliVerdict(run: CliOutcome, file: string, output: (stdout: string) => string | null = noNonFinite): { located: boolean; wrongOutput: string | null } {
  if (run.status === 70 || /internal error/.test(run.stderr)) throw new Error(`internal error: ${run.stderr.trim()}`);
  if (/^\s+at /m.test(run.stderr)) throw new Error(`a stack trace on standard error: ${run.stderr.trim()}`);
  if (run.status !== 0 && run.status !== 1) throw new Error(`exit status ${run.status}: ${run.stderr.trim()}`);
  const errors = errorLines(run.stderr);
  if (run.status === 1 && errors.length === 0) throw new Error(`status 1 without an error line: ${run.stderr.trim()}`);
  if (run.status === 0 && errors.length > 0) throw new Error(`status 0 with error lines: ${errors.join(" | ")}`);
  return { located: errors.every((l) => locatedLine(l, file)), wrongOutput: output(run.stdout) };
}

/** CSV output (the header row and the first column hold names, which may be any text): no field elsewhere is NaN or Infinity. */
export function noNonFinite(stdout: string): string | null {
  if (!/NaN|Infinity/.test(stdout)) return null;
  const rows = parse(stdout, { relax_column_count: true }) as string[][];
  for (const row of rows.slice(1)) {
    for (const field of row.slice(1)) if (/^[-+]?(NaN|Infinity)$/.test(field.trim())) return `"${field}" written in ${JSON.stringify(row)}`;
  }
  return null;
}

/** The envelope's CSV output (result,max,max row,min,min row): every max and min a finite number. */
export function envelopeCsvOutput(stdout: string): string | null {
  if (stdout === "") return null;
  const rows = parse(stdout, { relax_column_count: false }) as string[][];
  if (rows[0].join(",") !== "result,max,max row,min,min row") return `unexpected header ${JSON.stringify(rows[0])}`;
  for (const row of rows.slice(1)) {
    for (const k of [1, 3]) if (!(row[k] !== "" && Number.isFinite(Number(row[k])))) return `"${row[k]}" is not a finite number in ${JSON.stringify(row)}`;
  }
  return null;
}

/** A formula's outcome: a result of finite numbers and text, or a message placed at a cell of `range` (or the whole argument). */
export function formulaVerdict(outcome: Outcome, sheet: string): { located: boolean; wrongOutput: string | null } {
  if (outcome.ok) {
    for (const row of outcome.value) {
      for (const cell of row) if (typeof cell === "number" && !Number.isFinite(cell)) return { located: true, wrongOutput: `${cell} in ${JSON.stringify(row)}` };
    }
    return { located: true, wrongOutput: null };
  }
  if (/internal error/.test(outcome.message)) throw new Error(outcome.message);
  // The argument, then its cell (or, in a criterion, its character).
  const placed = new RegExp(`^(cases|criteria|ruleset|params|options), (${sheet}![A-Z]+\\d+\\b|character \\d+)`);
  const whole = /^(cases: (the case table (is empty|needs a header row|has no result rows)|(neither|both) the first row|no combination of \S+ applies|criterion ")|LW\.\w+ would return about [\d.]+ MB)/;
  const parts = outcome.message.split(" | ").filter((p) => !/^\(and [\d,]+ more problems?\)$/.test(p));
  return { located: parts.every((p) => placed.test(p) || whole.test(p)), wrongOutput: null };
}
