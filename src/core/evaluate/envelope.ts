/**
 * The envelope of a case table: per component (or per result row of a
 * cases-as-columns table) the largest and smallest value over every concrete
 * row, each with the row that gives it.
 */
import type { CaseTable } from "../cases/readCaseTable.js";
import { fail, ok, type Result } from "../problems.js";
import type { Plan, RowRef } from "../plan/types.js";
import { compiledPlanOf, rowRefOf } from "../plan/compiledPlan.js";
import { sharedEvaluator } from "./extremes.js";
import { notFiniteProblem, type ComponentPlace } from "./notFinite.js";
import { labelOf, noRows } from "./rows.js";

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
    const entry = envelopeOf(plan, table.components[c], table.values[c], table.componentPlaces?.[c]);
    if (!entry.ok) return entry;
    out.push(entry.value);
  }
  return ok(out);
}

/** One component's envelope from its case values; a row without a finite value is refused, naming the component (at `place`) and the row. */
export function envelopeOf(plan: Plan, result: string, x: ArrayLike<number>, place?: ComponentPlace): Result<EnvelopeEntry> {
  const compiled = compiledPlanOf(plan);
  const e = sharedEvaluator(compiled).evaluate(x);
  if (!e) return fail(noRows(plan));
  if (!e.finite) return fail(notFiniteProblem(JSON.stringify(result), labelOf(compiled, e.faultBranch, e.faultChoices), place));
  return ok({
    result,
    max: { value: e.maxValue, row: rowRefOf(compiled, e.maxBranch, e.maxChoices), label: labelOf(compiled, e.maxBranch, e.maxChoices) },
    min: { value: e.minValue, row: rowRefOf(compiled, e.minBranch, e.minChoices), label: labelOf(compiled, e.minBranch, e.minChoices) },
  });
}
