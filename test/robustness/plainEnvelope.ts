/**
 * The envelope read plainly, for holding the fast one to it on hostile values:
 * every concrete row listed (enumerateRows) and summed on its own (rowValue,
 * in the plan's order); "not finite" where any row's sum is not finite, else
 * the largest and smallest sums. The property tests hold the fast envelope to
 * brute force on ordinary values; this holds it, on values near the largest
 * double, to the rule that no row may be passed over.
 */
import { enumerateRows, findShippedRuleset, planForTable, readCaseTable, rowValue, type Cell, type Plan, type Ruleset } from "../../src/core/index.js";

export type PlainEnvelope = { notFinite: true } | { notFinite: false; max: number; min: number };

export function plainEnvelope(plan: Plan, x: ArrayLike<number>): PlainEnvelope {
  let max = -Infinity;
  let min = Infinity;
  for (const ref of enumerateRows(plan)) {
    const v = rowValue(plan, ref, x);
    if (!Number.isFinite(v)) return { notFinite: true };
    if (v > max) max = v;
    if (v < min) min = v;
  }
  return { notFinite: false, max, min };
}

export function shippedRuleset(id: string): Ruleset {
  const found = findShippedRuleset(id);
  if (!found) throw new Error(`${id} is not shipped`);
  return found.ruleset;
}

/** Per result row of a cases-as-columns matrix (values already numbers): the plain envelope; null if the table does not read. */
export function plainEnvelopes(ruleset: Ruleset, matrix: Cell[][], numbersAsText: boolean): { id: string; envelope: PlainEnvelope }[] | null {
  const table = readCaseTable(matrix, ruleset, { orientation: "columns", numbersAsText });
  if (!table.ok) return null;
  const plan = planForTable(ruleset, {}, table.value);
  if (!plan.ok) return null;
  return table.value.components.map((id, c) => ({ id, envelope: plainEnvelope(plan.value, table.value.values[c]) }));
}
