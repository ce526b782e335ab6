/** LW.FACTORED: every concrete combination row, with its label and the value of every component. */
import { factored } from "../../core/index.js";
import { given, type Formula } from "../formula.js";
import { outputTable, planNotes } from "../outputTable.js";
import { payloadProblem } from "../payloadGuard.js";
import { failWith, labelBytes, planOf } from "./planning.js";

export const FACTORED: Formula = {
  name: "LW.FACTORED",
  parameters: [
    { name: "cases", kind: "cases" },
    { name: "ruleset", kind: "ruleset" },
    { name: "params", kind: "params", optional: true },
    { name: "options", kind: "options", optional: true },
  ],
  evaluate(args) {
    const table = given(args.table, "cases");
    const plan = planOf(args);
    if (!plan.ok) return plan;
    const tooBig = payloadProblem("LW.FACTORED", {
      rows: plan.value.rowCount,
      numberColumns: table.components.length,
      textBytesPerRow: labelBytes(plan.value),
    });
    if (tooBig) return failWith(tooBig);
    const rows = factored(plan.value, table);
    if (!rows.ok) return rows;
    return outputTable(
      given(args.ruleset, "ruleset"),
      ["combination row", ...table.components],
      rows.value.map((r) => [r.label, ...r.values]),
      planNotes(plan.value),
    );
  },
};
