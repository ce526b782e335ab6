/**
 * The case table argument (either orientation, headers included), and the
 * lighter form LW.COMBOS also takes: a single row or column of case headers.
 */
import {
  EMPTY_CASE_MAP,
  isBlank,
  problem,
  readCaseHeaders,
  readCaseTable,
  type CaseTable,
  type PlanCase,
  type Result,
  type Ruleset,
} from "../core/index.js";
import { asMatrix, isEmptyArgument, trimTrailingEmpty } from "./excelCells.js";
import type { TableOptions } from "./formula.js";

export function readCasesArgument(raw: unknown, ruleset: Ruleset, options: TableOptions): Result<CaseTable> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) {
    return { ok: false, problems: [problem("cases-empty", "the case table is empty: select it with its header row and header column")] };
  }
  return readCaseTable(trimTrailingEmpty(m), ruleset, {
    orientation: options.orientation,
    idColumns: options.idColumns,
    map: options.map,
  });
}

/** Omitted: null (one column per load symbol). A single row or column: case headers, a blank first cell skipped. Otherwise a case table. */
export function readCaseHeadersArgument(raw: unknown, ruleset: Ruleset): Result<PlanCase[] | null> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) return { ok: true, value: null };
  const trimmed = trimTrailingEmpty(m);
  const oneRow = trimmed.length === 1;
  const oneColumn = trimmed.every((r) => r.length === 1);
  if (oneRow || oneColumn) {
    const cells = oneRow ? trimmed[0] : trimmed.map((r) => r[0]);
    const skip = isBlank(cells[0]) ? 1 : 0;
    return readCaseHeaders(cells.slice(skip), ruleset, EMPTY_CASE_MAP, (i) =>
      oneRow ? { row: 0, column: i + skip } : { row: i + skip, column: 0 },
    );
  }
  const table = readCaseTable(trimmed, ruleset, { map: EMPTY_CASE_MAP });
  return table.ok ? { ok: true, value: table.value.cases } : table;
}
