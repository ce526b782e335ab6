/**
 * What the table formulas share: the plan for the arguments read, the size of
 * row labels for the payload guard, and one course from plan to result — refuse
 * a result too large for Excel, evaluate, lay the rows out under the stamp with
 * what the plan leaves out.
 */
import { cachedPlanForTable, enumerateRows, planOmissions, rowLabel, type CaseTable, type Plan, type Problem, type Result } from "../../core/index.js";
import { given, type ArgumentSpec, type Formula, type FormulaArguments, type OutputCell } from "../formula.js";
import { outputTable } from "../outputTable.js";
import { payloadProblem, type PayloadShape } from "../payloadGuard.js";

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

export interface TableBody {
  header: OutputCell[];
  body: OutputCell[][];
}

/** Plan → size check → rows → the result Excel shows, stamp first and the plan's omissions last. */
export function tableResult(
  formula: string,
  args: FormulaArguments,
  plan: Result<Plan>,
  shape: (plan: Plan) => PayloadShape,
  rows: (plan: Plan) => Result<TableBody>,
): Result<OutputCell[][]> {
  if (!plan.ok) return plan;
  const tooBig = payloadProblem(formula, shape(plan.value));
  if (tooBig) return failWith(tooBig);
  const laid = rows(plan.value);
  if (!laid.ok) return laid;
  return outputTable(given(args.ruleset, "ruleset"), laid.value.header, laid.value.body, planOmissions(plan.value));
}

/**
 * A formula over a case table: its arguments are the cases and the ruleset,
 * its own (`own`), then the optional params and options; its result is laid
 * out by tableResult from the plan for that table.
 */
export function tableFormula(
  name: string,
  own: readonly ArgumentSpec[],
  shape: (plan: Plan, table: CaseTable, args: FormulaArguments) => PayloadShape,
  rows: (plan: Plan, table: CaseTable, args: FormulaArguments) => Result<TableBody>,
): Formula {
  return {
    name,
    parameters: [
      { name: "cases", kind: "cases" },
      { name: "ruleset", kind: "ruleset" },
      ...own,
      { name: "params", kind: "params", optional: true },
      { name: "options", kind: "options", optional: true },
    ],
    evaluate(args) {
      const table = given(args.table, "cases");
      return tableResult(
        name,
        args,
        planOf(args),
        (p) => shape(p, table, args),
        (p) => rows(p, table, args),
      );
    },
  };
}
