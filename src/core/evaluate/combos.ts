/**
 * The combination list a checker reads: every concrete row with its clause and
 * the factor on every case (or on every symbol, without a case table).
 */
import { ok, type Result } from "../problems.js";
import type { Plan, RowRef } from "../plan/types.js";
import { DEFAULT_ROW_LIMIT, listRows, rowContributions, rowLabel } from "./rows.js";

export interface ComboRow {
  row: RowRef;
  label: string;
  combination: string;
  clause: string;
  /** Factor per case index (0 where the row does not load the case). */
  factors: number[];
}

export function comboRows(plan: Plan, rowLimit = DEFAULT_ROW_LIMIT): Result<ComboRow[]> {
  const rows = listRows(plan, rowLimit);
  if (!rows.ok) return rows;
  return ok(
    rows.value.map((ref) => {
      const factors = new Array<number>(plan.cases.length).fill(0);
      for (const c of rowContributions(plan, ref)) factors[c.caseIndex] = c.factor;
      const { combination } = plan.combinations[ref.combination];
      return { row: ref, label: rowLabel(plan, ref), combination: combination.id, clause: combination.clause, factors };
    }),
  );
}
