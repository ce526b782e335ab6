/**
 * The hand checks any combination engine must pass (each with its source below),
 * run through the whole engine: typed ruleset rows, case table, plan,
 * envelope.
 */
import { describe, expect, test } from "vitest";
import { envelope, planForTable, readCaseTable, rulesetFromRows, type Cell } from "../../src/core/index.js";

function envelopeOf(rows: Cell[][], table: Cell[][], params = {}) {
  const ruleset = rulesetFromRows(rows);
  if (!ruleset.ok) throw new Error(JSON.stringify(ruleset.problems));
  const cases = readCaseTable(table, ruleset.value);
  if (!cases.ok) throw new Error(JSON.stringify(cases.problems));
  const plan = planForTable(ruleset.value, params, cases.value);
  if (!plan.ok) throw new Error(JSON.stringify(plan.problems));
  const result = envelope(plan.value, cases.value);
  if (!result.ok) throw new Error(JSON.stringify(result.problems));
  return result.value;
}

describe("hand checks", () => {
  test("a column with PD = 140 kips and PL = 420 kips gives 840 kips under 1.2D + 1.6L and 560 under D + L", () => {
    // AISC Design Examples (companion to the AISC Steel Construction Manual, American Institute of Steel Construction), Example E.1A.
    const strength = envelopeOf([["2", "1.2D + 1.6L!", "ASCE/SEI 7-16 §2.3.1 (2)"]], [["", "P"], ["D", 140], ["L", 420]]);
    expect(strength[0].max.value).toBeCloseTo(840, 9);
    const service = envelopeOf([["2", "D + L!", "ASCE/SEI 7-16 §2.4.1 (2)"]], [["", "P"], ["D", 140], ["L", 420]]);
    expect(service[0].max.value).toBeCloseTo(560, 9);
  });

  test("1.4D exceeds 1.2D + 1.6L only where L < D/8", () => {
    // Derived from ASCE/SEI 7-16 §2.3.1 (1) and (2) [confirmed]: 1.4D > 1.2D + 1.6L ⇔ L < D/8.
    const rows = [["1", "1.4D", "§2.3.1 (1)"], ["2", "1.2D + 1.6L!", "§2.3.1 (2)"]];
    const below = envelopeOf(rows, [["", "P"], ["D", 80], ["L", 9.9]]); // L < 80/8 = 10
    expect(below[0].max.label).toBe("1: 1.4D");
    const above = envelopeOf(rows, [["", "P"], ["D", 80], ["L", 10.1]]);
    expect(above[0].max.label).toBe("2: 1.2D + 1.6L");
  });

  test("the minimum under 0.9D − 1.0W is 0.9·D − |W| for a single reversible wind case", () => {
    // Reversible loads: W acts both ways (common practice (no source)).
    for (const w of [35, -35]) {
      const result = envelopeOf([["5", "0.9D - 1.0W!", "§2.3.1 (5)"]], [["", "P"], ["D", 100], ["W", w]]);
      expect(result[0].min.value).toBeCloseTo(0.9 * 100 - 35, 9);
      expect(result[0].max.value).toBeCloseTo(0.9 * 100 + 35, 9);
    }
  });
});
