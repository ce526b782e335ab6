/** LW.FACTORED: every concrete combination row, with its label and the value of every component. */
import { factored } from "../../core/index.js";
import { labelBytes, tableFormula } from "./planning.js";

export const FACTORED = tableFormula(
  "LW.FACTORED",
  [],
  (plan, table) => ({ rows: plan.rowCount, numberColumns: table.components.length, textBytesPerRow: labelBytes(plan) }),
  (plan, table) => {
    const rows = factored(plan, table);
    if (!rows.ok) return rows;
    return { ok: true, value: { header: ["combination row", ...table.components], body: rows.value.map((r) => [r.label, ...r.values]) } };
  },
);
