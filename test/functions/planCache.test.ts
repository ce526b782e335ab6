/**
 * Formulas keep plans (and rulesets typed in cells) between calls. Excel
 * recalculates many formulas at once, interleaving their calls; whatever the
 * order, each must give what it gives alone with nothing kept, and the cache
 * must stay within its bound. The expected tables here are the formulas' own
 * results computed one by one with every cache cleared first (a consistency
 * check of the cache, not of the numbers); one hand value anchors them: max P
 * = 1.2 × 140 + 1.6 × 420 = 840 under §2.3.1 (2) [confirmed, steel design
 * examples, as in envelope.test.ts].
 */
import { describe, expect, test } from "vitest";
import { cachedPlanCount, clearPlanCache, clearTypedRulesets, PLAN_CACHE_LIMIT } from "../../src/core/index.js";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { EXPLAIN } from "../../src/functions/formulas/explainFormula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { GOVERNING } from "../../src/functions/formulas/governingFormula.js";
import type { Formula } from "../../src/functions/formula.js";
import type { Outcome } from "../../src/functions/runFormula.js";
import { COLUMN_TABLE, STRENGTH_ROWS } from "./fixtures.js";
import { evaluateFormula, rowOf, value } from "./outcome.js";

const transpose = <T>(m: T[][]): T[][] => m[0].map((_, c) => m.map((r) => r[c]));

/** Column-table values invented for the test; ASCE 7-16 strength with seismic cases E:x, E:y. */
const EXPORT = [
  ["result", "D", "L", "W:N", "W:E", "E:x", "E:y"],
  ["C1 top", 140, 420, -50, 20, 30, -12],
  ["C1 bottom", 152, 420, -61, 26, 44, 9],
  ["B2 mid", 12, 30, 8, -8, 2, 1],
];

const CALLS: { formula: Formula; args: unknown[] }[] = [
  { formula: ENVELOPE, args: [COLUMN_TABLE, STRENGTH_ROWS, null, null] },
  { formula: ENVELOPE, args: [transpose(COLUMN_TABLE), STRENGTH_ROWS, null, null] },
  { formula: GOVERNING, args: [COLUMN_TABLE, STRENGTH_ROWS, [["max P"], ["min V"]], null, null] },
  { formula: FACTORED, args: [COLUMN_TABLE, STRENGTH_ROWS, null, null] },
  { formula: EXPLAIN, args: [COLUMN_TABLE, STRENGTH_ROWS, "2: 1.2D + 1.6L", "P", null] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=1.0", null] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=0.5; rho=1.0", null] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=1.0", [["E", "orthogonal"]]] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=1.0", [["W", "one-way"]]] },
  { formula: GOVERNING, args: [EXPORT, [["asce7-16-strength"]], [["max [C1 top]"], ["min [B2 mid]"]], "SDS=1.0", null] },
  // A parameter refused, and a typed ruleset with a mistake: problems are kept and given alike.
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=-1", null] },
  { formula: ENVELOPE, args: [COLUMN_TABLE, [...STRENGTH_ROWS, ["6", "1.2D + * L", "typed"]], null, null] },
];

function alone(call: (typeof CALLS)[number]): Outcome {
  clearPlanCache();
  clearTypedRulesets();
  return evaluateFormula(call.formula, call.args);
}

/** A pause of a few turns of the event loop, as between Excel's calls. */
async function pause(turns: number): Promise<void> {
  for (let k = 0; k < turns; k++) await new Promise((resolve) => setTimeout(resolve, 0));
}

describe("formulas with plans kept between calls", () => {
  test("give, called many at a time in any order, what each gives alone", async () => {
    const expected = CALLS.map(alone);
    expect(rowOf(value(expected[0]), "P")[1]).toBeCloseTo(840, 9);
    expect(expected.map((o) => o.ok)).toEqual([...CALLS.slice(0, -2).map(() => true), false, false]);
    clearPlanCache();
    clearTypedRulesets();
    // Five rounds of every call, started together, each after its own pause: calls of different
    // formulas and arguments interleave, and later rounds meet what earlier ones kept.
    const started: Promise<{ k: number; outcome: Outcome }>[] = [];
    for (let round = 0; round < 5; round++) {
      CALLS.forEach((call, k) => {
        started.push(
          (async () => {
            await pause((k * 7 + round * 3) % 5);
            return { k, outcome: evaluateFormula(call.formula, call.args) };
          })(),
        );
      });
    }
    for (const { k, outcome } of await Promise.all(started)) expect(outcome, `call ${k}`).toEqual(expected[k]);
  });

  test("keep at most the bounded number of plans, and still give the right table for a plan forgotten", () => {
    clearPlanCache();
    const first = evaluateFormula(ENVELOPE, [EXPORT, [["asce7-16-strength"]], "SDS=0.01", null]);
    for (let k = 2; k <= PLAN_CACHE_LIMIT + 20; k++) {
      evaluateFormula(ENVELOPE, [EXPORT, [["asce7-16-strength"]], `SDS=${k / 100}`, null]);
      expect(cachedPlanCount()).toBeLessThanOrEqual(PLAN_CACHE_LIMIT);
    }
    expect(cachedPlanCount()).toBe(PLAN_CACHE_LIMIT);
    expect(evaluateFormula(ENVELOPE, [EXPORT, [["asce7-16-strength"]], "SDS=0.01", null])).toEqual(first);
  });
});
