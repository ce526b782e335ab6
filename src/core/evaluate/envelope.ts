/**
 * The envelope of a case table: per component (or per result row of a
 * cases-as-columns table) the largest and smallest value over every concrete
 * row, each with the row that gives it.
 */
import type { CaseTable } from "../cases/readCaseTable.js";
import { fail, ok, type Result } from "../problems.js";
import type { Plan, RowRef } from "../plan/types.js";
import { extremes } from "./extremes.js";
import { noRows, rowLabel } from "./rows.js";

export interface EnvelopeValue {
  value: number;
  row: RowRef;
  label: string;
}

export interface EnvelopeEntry {
  /** Component name, or result-row id for a cases-as-columns table. */
  result: string;
  max: EnvelopeValue;
  min: EnvelopeValue;
}

export function envelope(plan: Plan, table: CaseTable): Result<EnvelopeEntry[]> {
  const out: EnvelopeEntry[] = [];
  for (let c = 0; c < table.components.length; c++) {
    const entry = envelopeOf(plan, table.components[c], table.values[c]);
    if (!entry) return fail(noRows(plan));
    out.push(entry);
  }
  return ok(out);
}

/** One component's envelope from its case values: what a streaming reader calls per result row. */
export function envelopeOf(plan: Plan, result: string, x: ArrayLike<number>): EnvelopeEntry | null {
  const e = extremes(plan, x);
  if (!e) return null;
  return {
    result,
    max: { value: e.max.value, row: e.max.row, label: rowLabel(plan, e.max.row) },
    min: { value: e.min.value, row: e.min.row, label: rowLabel(plan, e.min.row) },
  };
}
