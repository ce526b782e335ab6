/**
 * LW.COMBOS: the concrete combination rows a checker reads — label, clause and
 * the factor on every load symbol, or on every case when a case table or its
 * header row is given.
 */
import { comboRows, planCombinations, resolveParameters } from "../../core/index.js";
import { given, type Formula } from "../formula.js";
import { outputTable, planNotes } from "../outputTable.js";
import { payloadProblem } from "../payloadGuard.js";
import { failWith, labelBytes } from "./planning.js";

export const COMBOS: Formula = {
  name: "LW.COMBOS",
  parameters: [
    { name: "ruleset", kind: "ruleset" },
    { name: "params", kind: "params", optional: true },
    { name: "cases", kind: "caseHeaders", optional: true },
  ],
  evaluate(args) {
    const resolved = given(args.ruleset, "ruleset");
    const values = resolveParameters(resolved.ruleset, args.params.input);
    if (!values.ok) return values;
    const plan = planCombinations(resolved.ruleset, values.value, { cases: args.cases });
    if (!plan.ok) return plan;
    const tooBig = payloadProblem("LW.COMBOS", {
      rows: plan.value.rowCount,
      numberColumns: plan.value.cases.length,
      textBytesPerRow: labelBytes(plan.value) + 24,
    });
    if (tooBig) return failWith(tooBig);
    const rows = comboRows(plan.value);
    if (!rows.ok) return rows;
    return outputTable(
      resolved,
      ["combination row", "clause", ...plan.value.cases.map((c) => c.header)],
      rows.value.map((r) => [r.label, r.clause, ...r.factors]),
      planNotes(plan.value),
    );
  },
};
