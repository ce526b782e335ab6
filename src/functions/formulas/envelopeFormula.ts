/**
 * LW.ENVELOPE: per component (or per result row of a cases-as-columns table) the
 * largest and smallest value over every concrete row, each with the label of
 * the row that gives it. Exact without listing the rows, so it has no row limit.
 */
import { envelope } from "../../core/index.js";
import { given, type Formula } from "../formula.js";
import { labelBytes, planOf, tableResult } from "./planning.js";

export const ENVELOPE: Formula = {
  name: "LW.ENVELOPE",
  parameters: [
    { name: "cases", kind: "cases" },
    { name: "ruleset", kind: "ruleset" },
    { name: "params", kind: "params", optional: true },
    { name: "options", kind: "options", optional: true },
  ],
  evaluate(args) {
    const table = given(args.table, "cases");
    return tableResult(
      "LW.ENVELOPE",
      args,
      planOf(args),
      (p) => ({ rows: table.components.length, numberColumns: 2, textBytesPerRow: 2 * labelBytes(p) + 40 }),
      (p) => {
        const entries = envelope(p, table);
        if (!entries.ok) return entries;
        return {
          ok: true,
          value: {
            header: [table.orientation === "rows" ? "component" : "result", "max", "row giving max", "min", "row giving min"],
            body: entries.value.map((e) => [e.result, e.max.value, e.max.label, e.min.value, e.min.label]),
          },
        };
      },
    );
  },
};
