/** LW.EXPLAIN: one value's derivation as text — the row, its clause, factors × case values, the sum, the parameters. */
import { explain } from "../../core/index.js";
import { given, type Formula } from "../formula.js";
import { outputTable } from "../outputTable.js";
import { planOf } from "./planning.js";

export const EXPLAIN: Formula = {
  name: "LW.EXPLAIN",
  parameters: [
    { name: "cases", kind: "cases" },
    { name: "ruleset", kind: "ruleset" },
    { name: "row", kind: "row" },
    { name: "component", kind: "component" },
    { name: "params", kind: "params", optional: true },
  ],
  evaluate(args) {
    const plan = planOf(args);
    if (!plan.ok) return plan;
    const explanation = explain(plan.value, given(args.table, "cases"), given(args.row, "row"), given(args.component, "component"));
    if (!explanation.ok) return explanation;
    return outputTable(given(args.ruleset, "ruleset"), null, explanation.value.text.map((line) => [line]));
  },
};
