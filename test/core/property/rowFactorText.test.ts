/**
 * A row's factor text (evaluate/rows.ts, rowFactorText) sums the factors on
 * each case in scratch arrays; it is held here to the general reading of a
 * row — rowContributions, the factors merged per case as the explanation
 * lists them — written out as a label the plain way: every case the row
 * loads, in the ruleset's symbol order, a symbol's cases shown as the symbol
 * where the row puts one factor on all of them. Random rulesets and tables, as
 * the block evaluator's property test uses; every row of every plan.
 */
import fc from "fast-check";
import { expect, test } from "vitest";
import { enumerateRows, formatNumber, type Plan } from "../../../src/core/index.js";
import { rowContributions, rowFactorText } from "../../../src/core/evaluate/rows.js";
import type { RowRef } from "../../../src/core/plan/types.js";
import { plannedTable } from "./randomRulesets.js";

/** The factor text from rowContributions, the plain way. */
function generalText(plan: Plan, ref: RowRef): string {
  const factors = new Map(rowContributions(plan, ref).map((c) => [c.caseIndex, c.factor]));
  const parts: { factor: number; name: string }[] = [];
  for (const symbol of plan.ruleset.symbols) {
    const all = plan.casesOf.get(symbol.name) ?? [];
    const indices = all.filter((i) => factors.has(i));
    if (indices.length === 0) continue;
    const first = factors.get(indices[0]) as number;
    if (indices.length === all.length && indices.length > 1 && indices.every((i) => factors.get(i) === first)) parts.push({ factor: first, name: symbol.name });
    else for (const i of indices) parts.push({ factor: factors.get(i) as number, name: plan.cases[i].header });
  }
  if (parts.length === 0) return "(no load)";
  return parts.map((p, k) => `${p.factor < 0 ? (k === 0 ? "-" : " - ") : k === 0 ? "" : " + "}${Math.abs(p.factor) === 1 ? "" : formatNumber(Math.abs(p.factor))}${p.name}`).join("");
}

test("a row's factor text is the general reading's, on every row of random rulesets and tables", () => {
  fc.assert(
    fc.property(plannedTable, ({ plan }) => {
      let n = 0;
      for (const ref of enumerateRows(plan)) {
        expect(rowFactorText(plan, ref)).toBe(generalText(plan, ref));
        if (++n >= 2000) break;
      }
    }),
    { numRuns: 500, seed: 20261205 },
  );
});
