/** What the table formulas share: the plan for the arguments read, and the size of row labels for the payload guard. */
import { cachedPlanForTable, enumerateRows, rowLabel, type Plan, type Problem, type Result } from "../../core/index.js";
import { given, type FormulaArguments } from "../formula.js";

export function planOf(args: FormulaArguments): Result<Plan> {
  const { ruleset, status } = given(args.ruleset, "ruleset");
  return cachedPlanForTable(ruleset, status.fingerprint, args.params.input, args.table);
}

/** Bytes of label per row, estimated from the first rows (with a margin): labels of one ruleset are alike in length. */
export function labelBytes(plan: Plan, sample = 64): number {
  let count = 0;
  let total = 0;
  for (const ref of enumerateRows(plan)) {
    total += rowLabel(plan, ref).length + 3;
    if (++count >= sample) break;
  }
  return count === 0 ? 0 : Math.ceil((total / count) * 1.25);
}

export function failWith(problem: Problem): Result<never> {
  return { ok: false, problems: [problem] };
}
