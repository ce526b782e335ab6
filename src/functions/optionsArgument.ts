/**
 * The options argument of the table formulas: two-cell rows (or text
 * "orientation=columns; E=orthogonal") holding
 *   orientation | rows or columns   which way the case table runs (default: read off its headers)
 *   id columns  | n                 cases as columns: how many leading columns name a result row (default 1)
 * and case map rows, passed to the core's case map:
 *   header | symbol                 a header written any other way belongs to that load symbol
 *   symbol | sum, each, orthogonal  how that symbol's several cases combine
 */
import { EMPTY_CASE_MAP, cellText, isBlank, problem, readCaseMap, type Cell, type Problem, type ProblemKind, type Result, type Ruleset } from "../core/index.js";
import { asMatrix, blankZeroRows, isEmptyArgument } from "./excelCells.js";
import type { TableOptions } from "./formula.js";

export const DEFAULT_OPTIONS: TableOptions = { orientation: "auto", idColumns: 1, map: EMPTY_CASE_MAP };

const ORIENTATION = "orientation";
const ID_COLUMNS = "id columns";

interface Entry {
  name: string;
  value: Cell;
  /** Where the entry was written: a cell of the range, and a character position for text. */
  place: { row: number; column: number; position?: number };
}

export function readOptionsArgument(raw: unknown, ruleset: Ruleset): Result<TableOptions> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) return { ok: true, value: DEFAULT_OPTIONS };
  const entries = readEntries(blankZeroRows(m));
  if (!entries.ok) return entries;

  const problems: Problem[] = [];
  const options: TableOptions = { ...DEFAULT_OPTIONS };
  const mapRows: Cell[][] = [];
  const mapPlaces: Entry["place"][] = [];
  const seen = new Set<string>();
  for (const e of entries.value) {
    const key = e.name.toLowerCase().replace(/[\s_]+/g, " ");
    if (key === ORIENTATION || key === ID_COLUMNS) {
      if (seen.has(key)) {
        problems.push(optionProblem("cases-option", `${key} is given twice`, e.place));
        continue;
      }
      seen.add(key);
    }
    if (key === ORIENTATION) {
      const v = cellText(e.value).toLowerCase();
      if (v === "rows" || v === "columns") options.orientation = v;
      else problems.push(optionProblem("cases-orientation", `orientation must be "rows" (cases down the first column) or "columns" (cases across the first row), not "${cellText(e.value)}"`, e.place));
    } else if (key === ID_COLUMNS) {
      const n = typeof e.value === "number" ? e.value : Number(cellText(e.value));
      if (Number.isInteger(n) && n >= 1) options.idColumns = n;
      else problems.push(optionProblem("cases-option", `id columns must be a whole number of 1 or more, not "${cellText(e.value)}"`, e.place));
    } else {
      mapRows.push([e.name, e.value]);
      mapPlaces.push(e.place);
    }
  }
  if (mapRows.length > 0) {
    const map = readCaseMap(mapRows, ruleset);
    if (!map.ok) {
      problems.push(
        ...map.problems.map((p) => {
          const at = mapPlaces[p.place.row ?? 0];
          return { ...p, place: { ...p.place, ...at, column: at.position === undefined ? at.column + (p.place.column ?? 0) : at.column } };
        }),
      );
    } else {
      options.map = map.value;
    }
  }
  return problems.length > 0 ? { ok: false, problems } : { ok: true, value: options };
}

function optionProblem(kind: ProblemKind, message: string, place: Entry["place"]): Problem {
  return problem(kind, message, place);
}

/** Two-cell rows, or cells of "name=value; …" text in a single column. */
function readEntries(m: Cell[][]): Result<Entry[]> {
  const width = m.reduce((w, r) => Math.max(w, r.length), 0);
  const out: Entry[] = [];
  const problems: Problem[] = [];
  m.forEach((row, r) => {
    if (row.every(isBlank)) return;
    if (width >= 2) {
      const name = cellText(row[0]);
      if (name === "") {
        problems.push(optionProblem("cases-option", "an options row starts with a name: orientation, id columns, a case header or a load symbol", { row: r, column: 0 }));
        return;
      }
      out.push({ name, value: row[1] ?? null, place: { row: r, column: 0 } });
      return;
    }
    const text = cellText(row[0]);
    let offset = 0;
    for (const piece of text.split(/[;\n]/)) {
      const start = offset;
      offset += piece.length + 1;
      if (piece.trim() === "") continue;
      const position = start + piece.search(/\S/) + 1;
      const eq = piece.indexOf("=");
      if (eq < 0) {
        problems.push(optionProblem("cases-option", `"${piece.trim()}" is not name=value (e.g. "orientation=columns; E=orthogonal")`, { row: r, column: 0, position }));
        continue;
      }
      out.push({ name: piece.slice(0, eq).trim(), value: piece.slice(eq + 1).trim(), place: { row: r, column: 0, position } });
    }
  });
  return problems.length > 0 ? { ok: false, problems } : { ok: true, value: out };
}
