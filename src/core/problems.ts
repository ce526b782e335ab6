/**
 * Problems are values, not exceptions: every fallible core operation returns a
 * Result that either holds its value or lists every problem it found, each with
 * a kind, a place and a sentence a user can act on. Adapters (formulas, task
 * pane, command line) only reformat the place; the wording lives here.
 */

export type ProblemKind =
  // ruleset file
  | "ruleset-json"
  | "ruleset-field"
  | "ruleset-duplicate"
  | "ruleset-name-clash"
  // the rulesets a workbook can name
  | "ruleset-unknown"
  | "ruleset-store"
  // any input read from JSON or text: beyond a stated limit (src/core/limits.ts), or a field name that reaches prototypes
  | "input-limit"
  | "input-forbidden-key"
  // the firm library: reading it from a file or an address, and where a workbook keeps its address
  | "library-read"
  | "library-link"
  // other values kept with a workbook (the cautions' acknowledgement)
  | "settings-write"
  // expressions
  | "expression-syntax"
  | "expression-unknown-name"
  | "expression-structure"
  | "expression-attribute"
  | "expression-not-finite"
  // parameters
  | "parameter-unknown"
  | "parameter-missing"
  | "parameter-not-number"
  | "parameter-out-of-range"
  | "parameter-not-allowed"
  | "parameter-syntax"
  // case tables
  | "cases-empty"
  | "cases-header"
  | "cases-unknown-symbol"
  | "cases-duplicate-header"
  | "cases-not-a-number"
  | "cases-ragged"
  | "cases-orientation"
  | "cases-map"
  | "cases-option"
  // evaluation
  | "too-many-rows"
  | "unknown-row"
  | "unknown-component"
  | "criterion-syntax"
  | "result-not-finite"
  // the worksheet a surface reads or writes (the task pane's sheet host)
  | "sheet-range";

/** Where a problem is. Every field is optional; adapters show the ones present. */
export interface Place {
  /** JSON path inside a ruleset file, e.g. ["combinations", 2, "expression"]. */
  path?: (string | number)[];
  /** Combination id (ruleset entry) the problem belongs to. */
  entry?: string;
  /** 1-based character position inside an expression or criterion. */
  position?: number;
  /** 0-based row and column inside an input matrix (case table, ruleset rows, map, params). */
  row?: number;
  column?: number;
  /** The header the problem concerns (case header, component name, parameter name). */
  header?: string;
  /** A second place in the same matrix the problem concerns (the first of two duplicate headers). */
  also?: { row: number; column: number };
}

export interface Problem {
  kind: ProblemKind;
  /** One sentence naming what is wrong, without the place (see `describeProblem`). */
  message: string;
  place: Place;
}

export type Result<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

export function ok<T>(value: T): Result<T> {
  return { ok: true, value };
}

export function fail<T = never>(...problems: Problem[]): Result<T> {
  return { ok: false, problems };
}

export function problem(kind: ProblemKind, message: string, place: Place = {}): Problem {
  return { kind, message, place };
}

/** Spreadsheet column letters for a 0-based column index: 0 → A, 27 → AB. */
export function columnLetters(column: number): string {
  let n = column + 1;
  let letters = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    letters = String.fromCharCode(65 + r) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

/** A JSON path as a reader writes it: combinations[2].expression */
export function formatPath(path: (string | number)[]): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else if (/^[A-Za-z_][A-Za-z0-9_]*$/.test(part)) out += out === "" ? part : `.${part}`;
    else out += `[${JSON.stringify(part)}]`;
  }
  return out;
}

export interface DescribeOptions {
  /** Turns a 0-based matrix row/column into the user's own reference (A1 address, file line). */
  cell?: (row: number, column: number, place: Place) => string;
}

/** The place, in words, as a prefix: `combination "3", character 14`. */
export function describePlace(place: Place, options: DescribeOptions = {}): string {
  const parts: string[] = [];
  if (place.path && place.path.length > 0) parts.push(formatPath(place.path));
  if (place.entry !== undefined) parts.push(`combination "${place.entry}"`);
  if (place.position !== undefined) parts.push(`character ${place.position}`);
  if (place.row !== undefined && place.column !== undefined) {
    parts.push(
      options.cell
        ? options.cell(place.row, place.column, place)
        : `cell ${columnLetters(place.column)}${place.row + 1}`,
    );
  } else if (place.row !== undefined) {
    parts.push(`row ${place.row + 1}`);
  } else if (place.column !== undefined) {
    parts.push(`column ${columnLetters(place.column)}`);
  }
  return parts.join(", ");
}

/** Place and message in one line: `combination "3", character 14: unknown name "rhoE" …`. */
export function describeProblem(p: Problem, options: DescribeOptions = {}): string {
  const where = describePlace(p.place, options);
  const also = p.place.also ? ` (also at ${describePlace({ row: p.place.also.row, column: p.place.also.column }, options).replace(/^cell /, "")})` : "";
  return where === "" ? `${p.message}${also}` : `${where}: ${p.message}${also}`;
}

/** The same problems placed inside a larger document: the prefix goes before each JSON path. */
export function withinPath(problems: Problem[], prefix: (string | number)[]): Problem[] {
  return problems.map((p) => ({ ...p, place: { ...p.place, path: [...prefix, ...(p.place.path ?? [])] } }));
}
