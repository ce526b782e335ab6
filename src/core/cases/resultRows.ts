/**
 * The result rows of a cases-as-columns table, read one at a time: each row's
 * id (its first idColumns cells joined with " / ", or "row N" where they are
 * blank), its values (one per case), and the refusal of an id seen before. The
 * whole-table reader (readCaseTable: worksheet ranges, JSON files, small CSV
 * files) and the command line's streamed CSV reader both read rows here, so a
 * table gives the same ids, values and messages whichever way it arrives.
 *
 * Memory: to refuse a repeated id the reader keeps every id it has seen, with
 * the row it was first seen on — the ids only (strings and row numbers), never
 * the values. That is all a streamed file of a million rows holds on to.
 */
import { cellText, isBlank, type Cell } from "../cells.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import type { LoadCase } from "./caseHeaders.js";
import { idTable } from "./idTable.js";
import { readValue } from "./readValue.js";

export interface ResultRow {
  id: string;
  /** One value per case, in the order of the reader's cases. */
  values: Float64Array;
}

export interface ResultRowOptions {
  /** How many leading columns name a result row (default 1). */
  idColumns?: number;
  /** Accept numbers written as text ("12.5"): right for CSV files, wrong for worksheet cells. */
  numbersAsText?: boolean;
}

export interface ResultRowReader {
  readonly cases: readonly LoadCase[];
  readonly idColumns: number;
  /**
   * One row of the table (0-based `row`, the header row being row 0): its id and
   * values, null for a blank row, or every problem of the row — a repeated id
   * first (with the row where it was first seen), then each value cell that is
   * not a number.
   */
  read(cells: readonly Cell[], row: number): Result<ResultRow | null>;
  /** A row's id from its id cells: the cells joined with " / ", or "row N" where all are blank. */
  idOf(idCells: readonly Cell[], row: number): string;
  /** Remember an id at a row; a problem naming both rows if it was seen before. */
  claim(id: string, row: number): Problem | null;
  /** How many distinct ids the reader holds. */
  readonly idCount: number;
}

export function resultRowReader(cases: readonly LoadCase[], options: ResultRowOptions = {}): ResultRowReader {
  const idColumns = options.idColumns ?? 1;
  const valueOptions = { numbersAsText: options.numbersAsText ?? false };
  const firstRowOf = idTable();

  const idOf = (idCells: readonly Cell[], row: number): string => {
    let id = "";
    for (let c = 0; c < idColumns; c++) {
      const text = cellText(idCells[c]);
      if (text !== "") id = id === "" ? text : `${id} / ${text}`;
    }
    return id === "" ? `row ${row + 1}` : id;
  };

  // A criterion or an explanation names a result by its id: two rows with one id would be ambiguous.
  const claim = (id: string, row: number): Problem | null => {
    const first = firstRowOf.claim(id, row);
    if (first < 0) return null;
    return problem("cases-duplicate-header", `result "${id}" appears twice`, { row, column: 0, header: id, also: { row: first, column: 0 } });
  };

  return {
    cases,
    idColumns,
    idOf,
    claim,
    get idCount() {
      return firstRowOf.size;
    },
    read(cells, row) {
      if (cells.every(isBlank)) return ok(null);
      const problems: Problem[] = [];
      const id = idOf(cells, row);
      const repeated = claim(id, row);
      if (repeated) problems.push(repeated);
      const values = new Float64Array(cases.length);
      for (let k = 0; k < cases.length; k++) {
        values[k] = readValue(cells[k + idColumns], { row, column: k + idColumns }, cases[k].header, valueOptions, problems);
      }
      return problems.length > 0 ? fail(...problems) : ok({ id, values });
    },
  };
}
