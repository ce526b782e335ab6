/** LW.FACTORED: every concrete combination row, with its label and the value of every component. */
import { factored } from "../../core/index.js";
import { given, type Formula } from "../formula.js";
import { labelBytes, planOf, tableResult } from "./planning.js";

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
    return tableResult(
      "LW.FACTORED",
      args,
      planOf(args),
      (p) => ({ rows: p.rowCount, numberColumns: table.components.length, textBytesPerRow: labelBytes(p) }),
      (p) => {
        const rows = factored(p, table);
        if (!rows.ok) return rows;
        return { ok: true, value: { header: ["combination row", ...table.components], body: rows.value.map((r) => [r.label, ...r.values]) } };
      },
    );
  },
};
