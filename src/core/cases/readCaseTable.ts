/**
 * A table of load-case results, in either orientation:
 *
 *   cases as rows (a reactions table)        cases as columns (an analysis export)
 *   ┌──────┬─────┬─────┐                    ┌────────┬─────┬─────┬─────┐
 *   │      │  N  │  V  │  ← components      │ result │  D  │  L  │ W:N │  ← cases
 *   │ D    │ 120 │ 4.0 │                    │ C1 top │ 120 │  80 │ -15 │
 *   │ W:N  │ -15 │ 9.0 │                    │ C1 bot │ 125 │  80 │ -30 │
 *   └──────┴─────┴─────┘                    └────────┴─────┴─────┴─────┘
 *
 * Internally both become values[component][case], where a "component" is a
 * result row of a cases-as-columns table. Blank value cells read as zero.
 */
import { cellText, isBlank, widthOf, type Cell } from "../cells.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import type { Ruleset } from "../ruleset/model.js";
import { EMPTY_CASE_MAP, namesLoadSymbol, readCaseHeaders, type CaseMap, type LoadCase } from "./caseHeaders.js";
import { resultRowReader } from "./resultRows.js";
import { readValue } from "./readValue.js";

export type Orientation = "rows" | "columns";

export interface CaseTable {
  orientation: Orientation;
  cases: LoadCase[];
  /** Component names (cases as rows) or result-row ids (cases as columns). */
  components: string[];
  /** values[component][case] */
  values: Float64Array[];
  map: CaseMap;
  /** Where each component was named (its header cell, or a result row's first id cell) in the matrix read, for locating a problem with its values. */
  componentPlaces?: { row: number; column: number }[];
}

export interface CaseTableOptions {
  /** "auto" (default) reads the orientation off the headers where only one reading fits. */
  orientation?: Orientation | "auto";
  /** Cases as columns: how many leading columns identify a result row (default 1). */
  idColumns?: number;
  map?: CaseMap;
  /** Accept numbers written as text ("12.5"): right for CSV files, wrong for worksheet cells. */
  numbersAsText?: boolean;
}

export function readCaseTable(matrix: Cell[][], ruleset: Ruleset, options: CaseTableOptions = {}): Result<CaseTable> {
  const map = options.map ?? EMPTY_CASE_MAP;
  const idColumns = options.idColumns ?? 1;
  const rows = trimBlankEdges(matrix);
  const width = widthOf(rows);
  if (rows.length < 2 || width < 2) {
    return fail(problem("cases-empty", "the case table needs a header row, a header column and at least one value"));
  }
  // A blank row (a CSV's empty line) is skipped later, whatever its width.
  const raggedAt = rows.findIndex((r) => r.length !== width && !r.every(isBlank));
  if (raggedAt >= 0) {
    return fail(problem("cases-ragged", `it has ${rows[raggedAt].length} cells where the header row has ${width}`, { row: raggedAt }));
  }
  let orientation = options.orientation ?? "auto";
  if (orientation === "auto") {
    const decided = detectOrientation(rows, ruleset, map, idColumns);
    if (!decided.ok) return decided;
    orientation = decided.value;
  }
  return orientation === "rows" ? readCasesAsRows(rows, ruleset, map, options) : readCasesAsColumns(rows, ruleset, map, idColumns, options);
}

/** Drop fully blank rows at the end and fully blank columns at the right (a generously selected range). */
function trimBlankEdges(matrix: Cell[][]): Cell[][] {
  let rows = matrix.length;
  while (rows > 0 && matrix[rows - 1].every(isBlank)) rows--;
  let width = widthOf(matrix.slice(0, rows));
  while (width > 0 && matrix.slice(0, rows).every((r) => isBlank(r[width - 1]))) width--;
  return matrix.slice(0, rows).map((r) => (r.length > width ? r.slice(0, width) : r));
}

/**
 * Cases as columns when the first row's headers read as cases, as rows when the
 * first column's do. Where neither reads fully, the side where most do is taken,
 * so that one mistyped header is reported by name rather than as "no cases".
 */
function detectOrientation(rows: Cell[][], ruleset: Ruleset, map: CaseMap, idColumns: number): Result<Orientation> {
  const share = (cells: Cell[]) => (cells.length === 0 ? 0 : cells.filter((c) => namesLoadSymbol(cellText(c), ruleset, map)).length / cells.length);
  const firstRow = rows[0].slice(idColumns).filter((c) => !isBlank(c));
  const firstColumn = rows.slice(1).map((r) => r[0]).filter((c) => !isBlank(c));
  const asColumns = share(firstRow);
  const asRows = share(firstColumn);
  if (asColumns === 1 && asRows < 1) return ok("columns");
  if (asRows === 1 && asColumns < 1) return ok("rows");
  if (asRows < 1 && asColumns < 1 && Math.max(asRows, asColumns) >= 0.5 && asRows !== asColumns) return ok(asRows > asColumns ? "rows" : "columns");
  if (asRows === 1 && asColumns === 1) {
    return fail(problem("cases-orientation", "both the first row and the first column read as load cases; say which holds the cases (orientation rows or columns)"));
  }
  const symbols = ruleset.symbols.map((s) => s.name).join(", ");
  return fail(
    problem(
      "cases-orientation",
      `neither the first row nor the first column holds load cases: headers must be a load symbol (${symbols}) or SYMBOL:name, e.g. W:N`,
    ),
  );
}

function readCasesAsRows(rows: Cell[][], ruleset: Ruleset, map: CaseMap, options: CaseTableOptions): Result<CaseTable> {
  const problems: Problem[] = [];
  const body = rows.slice(1).map((r, i) => ({ cells: r, row: i + 1 })).filter((r) => !r.cells.every(isBlank));
  const headers = readCaseHeaders(body.map((r) => r.cells[0]), ruleset, map, (i) => ({ row: body[i].row, column: 0 }));
  if (!headers.ok) for (const p of headers.problems) problems.push(p);
  const components = componentNames(rows[0].slice(1), (i) => ({ row: 0, column: i + 1 }), problems);
  if (problems.length > 0 || !headers.ok) return fail(...problems);
  const values = components.map(() => new Float64Array(body.length));
  body.forEach((r, k) => {
    for (let c = 0; c < components.length; c++) {
      const v = readValue(r.cells[c + 1], { row: r.row, column: c + 1 }, `${headers.value[k].header} / ${components[c]}`, options, problems);
      values[c][k] = v;
    }
  });
  if (problems.length > 0) return fail(...problems);
  const componentPlaces = components.map((_, c) => ({ row: 0, column: c + 1 }));
  return ok({ orientation: "rows", cases: headers.value, components, values, map, componentPlaces });
}

function readCasesAsColumns(rows: Cell[][], ruleset: Ruleset, map: CaseMap, idColumns: number, options: CaseTableOptions): Result<CaseTable> {
  const problems: Problem[] = [];
  const headers = readCaseHeaders(rows[0].slice(idColumns), ruleset, map, (i) => ({ row: 0, column: i + idColumns }));
  if (!headers.ok) return headers;
  const cases = headers.value;
  const reader = resultRowReader(cases, { idColumns, numbersAsText: options.numbersAsText ?? false });
  const components: string[] = [];
  const values: Float64Array[] = [];
  const componentPlaces: { row: number; column: number }[] = [];
  for (let r = 1; r < rows.length; r++) {
    const row = reader.read(rows[r], r);
    if (!row.ok) for (const p of row.problems) problems.push(p);
    else if (row.value) {
      components.push(row.value.id);
      values.push(row.value.values);
      componentPlaces.push({ row: r, column: 0 });
    }
  }
  if (problems.length > 0) return fail(...problems);
  if (components.length === 0) return fail(problem("cases-empty", "the case table has no result rows"));
  return ok({ orientation: "columns", cases, components, values, map, componentPlaces });
}

function componentNames(cells: Cell[], at: (i: number) => { row: number; column: number }, problems: Problem[]): string[] {
  const names: string[] = [];
  const seen = new Map<string, number>();
  cells.forEach((cell, i) => {
    const name = cellText(cell);
    const first = seen.get(name);
    if (name === "") problems.push(problem("cases-header", "the component header is empty", at(i)));
    else if (first !== undefined) problems.push(problem("cases-duplicate-header", `component "${name}" appears twice`, { ...at(i), header: name, also: at(first) }));
    else seen.set(name, i);
    names.push(name);
  });
  return names;
}
