/**
 * LW.GOVERNING: the row each criterion selects, with the criterion's value and
 * every component's concurrent value in that same row. One line per criterion,
 * in the order given; without criteria, the max and min of every component.
 */
import { defaultCriteria, governing } from "../../core/index.js";
import type { OutputCell } from "../formula.js";
import { labelBytes, tableFormula } from "./planning.js";

export const GOVERNING = tableFormula(
  "LW.GOVERNING",
  [{ name: "criteria", kind: "criteria", optional: true }],
  (plan, table, args) => ({ rows: (args.criteria ?? defaultCriteria(table)).length, numberColumns: table.components.length + 1, textBytesPerRow: labelBytes(plan) + 40 }),
  (plan, table, args) => {
    const criteria = args.criteria ?? defaultCriteria(table);
    const rows = governing(plan, table, criteria);
    if (!rows.ok) return rows;
    // The core lists a row that governs several criteria once; a checker reads one line per criterion.
    const lines: { order: number; cells: OutputCell[] }[] = [];
    for (const g of rows.value) {
      g.criteria.forEach((text, k) => {
        lines.push({ order: criteria.findIndex((c) => c.text === text), cells: [text, g.criterionValues[k], g.label, ...g.values] });
      });
    }
    lines.sort((a, b) => a.order - b.order);
    return { ok: true, value: { header: ["criterion", "value", "combination row", ...table.components], body: lines.map((l) => l.cells) } };
  },
);
