/**
 * LW.ENVELOPE: per component (or per result row of a cases-as-columns table) the
 * largest and smallest value over every concrete row, each with the label of
 * the row that gives it. Exact without listing the rows, so it has no row limit.
 */
import { envelope } from "../../core/index.js";
import { labelBytes, tableFormula } from "./planning.js";

export const ENVELOPE = tableFormula(
  "LW.ENVELOPE",
  [],
  (plan, table) => ({ rows: table.components.length, numberColumns: 2, textBytesPerRow: 2 * labelBytes(plan) + 40 }),
  (plan, table) => {
    const entries = envelope(plan, table);
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
