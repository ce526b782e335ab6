/** The factored matrix: every concrete row with the value of every component. */
import type { CaseTable } from "../cases/readCaseTable.js";
import { fail, ok, type Result } from "../problems.js";
import type { Plan, RowRef } from "../plan/types.js";
import { notFiniteProblem } from "./notFinite.js";
import { DEFAULT_ROW_LIMIT, listRows, noRows, rowLabel, rowValues } from "./rows.js";

export interface FactoredRow {
  row: RowRef;
  label: string;
  combination: string;
  values: number[];
}

export function factored(plan: Plan, table: CaseTable, rowLimit = DEFAULT_ROW_LIMIT): Result<FactoredRow[]> {
  if (plan.rowCount === 0) return fail(noRows(plan));
  const rows = listRows(plan, rowLimit);
  if (!rows.ok) return rows;
  const out: FactoredRow[] = [];
  for (const ref of rows.value) {
    const label = rowLabel(plan, ref);
    const values = rowValues(plan, table, ref);
    const c = values.findIndex((v) => !Number.isFinite(v));
    if (c >= 0) return fail(notFiniteProblem(JSON.stringify(table.components[c]), label, table.componentPlaces?.[c]));
    out.push({ row: ref, label, combination: plan.combinations[ref.combination].combination.id, values });
  }
  return ok(out);
}
