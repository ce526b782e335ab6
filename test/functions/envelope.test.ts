import { beforeEach, describe, expect, test } from "vitest";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { COLUMN_TABLE, SEISMIC_FIXTURE, STRENGTH_FIXTURE, STRENGTH_ROWS } from "./fixtures.js";
import { body, expectExcelShaped, message, rowOf, testWorkbook, type TestWorkbook, value } from "./outcome.js";

const transpose = <T>(m: T[][]): T[][] => m[0].map((_, c) => m.map((r) => r[c]));

let workbook: TestWorkbook = testWorkbook();
/** The formulas and the store of this test's own workbook. */
const evaluateFormula: TestWorkbook["evaluateFormula"] = (...a) => workbook.evaluateFormula(...a);
beforeEach(async () => {
  workbook = testWorkbook();
  const store = workbook.store;
  expect((await store.save(STRENGTH_FIXTURE)).ok).toBe(true);
  expect((await store.save(SEISMIC_FIXTURE)).ok).toBe(true);
});

describe("LW.ENVELOPE", () => {
  test("gives the max and min of every component with the row that gives each", () => {
    const table = value(evaluateFormula(ENVELOPE, [COLUMN_TABLE, STRENGTH_ROWS, null, null]));
    expectExcelShaped(table);
    expect(table[1]).toEqual(["component", "max", "row giving max", "min", "row giving min"]);
    const [, maxP, maxPRow, minP, minPRow] = rowOf(table, "P");
    // [confirmed, steel design examples] 1.2 × 140 + 1.6 × 420 = 840 kips governs the maximum.
    expect(maxP).toBeCloseTo(840, 9);
    expect(maxPRow).toBe("2: 1.2D + 1.6L");
    // By hand: the minimum under 0.9D − 1.0W is 0.9·D − |W| = 126 − 50 = 76 (ASCE/SEI 7-16 §2.3.1 (5); ASCE/SEI 7-10 §2.3.2, public copy https://www.scribd.com/document/611469328, combination 6).
    expect(minP).toBeCloseTo(76, 9);
    expect(minPRow).toBe("5: 0.9D + W");
    const [, maxV, maxVRow, minV, minVRow] = rowOf(table, "V");
    // §2.3.1 (4): 1.2 × 2 + 10 + 5 = 17.4; §2.3.1 (5): 0.9 × 2 − 10 = −8.2 (V values invented for the test).
    expect(maxV).toBeCloseTo(17.4, 9);
    expect(maxVRow).toBe("4: 1.2D + L + W");
    expect(minV).toBeCloseTo(-8.2, 9);
    expect(minVRow).toBe("5: 0.9D - W");
  });

  test("reads a table with cases across the first row the same as one with cases down the first column", () => {
    const down = value(evaluateFormula(ENVELOPE, [COLUMN_TABLE, STRENGTH_ROWS, null, null]));
    const across = value(evaluateFormula(ENVELOPE, [transpose(COLUMN_TABLE), STRENGTH_ROWS, null, null]));
    expect(across[1][0]).toBe("result");
    expect(body(across)).toEqual(body(down));
  });

  test.each([
    ["null", null],
    ["an empty string", ""],
    ["0", 0],
  ])("reads a blank value cell sent as %s as zero", (_, blank) => {
    const table = [["", "P", "V"], ["D", 140, 2], ["L", 420, blank], ["W", -50, 10]];
    const result = value(evaluateFormula(ENVELOPE, [table, STRENGTH_ROWS, null, null]));
    // With V of L blank (zero): max V under §2.3.1 (4) is 1.2 × 2 + 10 = 12.4; min under (5) is 0.9 × 2 − 10 = −8.2.
    expect(rowOf(result, "V")[1]).toBeCloseTo(12.4, 9);
    expect(rowOf(result, "V")[3]).toBeCloseTo(-8.2, 9);
    expect(rowOf(result, "P")[1]).toBeCloseTo(840, 9);
  });

  test("ignores trailing rows and columns of blanks and zeros, as an older Excel build sends an oversized selection", () => {
    const padded = [...COLUMN_TABLE.map((r) => [...r, 0, null]), [0, 0, 0, 0, 0], [null, "", null, 0, null]];
    const plain = value(evaluateFormula(ENVELOPE, [COLUMN_TABLE, STRENGTH_ROWS, null, null]));
    expect(value(evaluateFormula(ENVELOPE, [padded, STRENGTH_ROWS, null, null]))).toEqual(plain);
  });

  test("takes a ruleset by id from the workbook's store and stamps it as checked when its sources are confirmed", () => {
    const table = value(evaluateFormula(ENVELOPE, [COLUMN_TABLE, [["test-strength"]], null, null]));
    expect(String(table[0][0])).toMatch(/^Checked · not approved · test-strength 0\.0\.1-test \(ASCE\/SEI 7 2016\), stored in this workbook · fingerprint [0-9a-f]{12}/);
    expect(rowOf(table, "P")[1]).toBeCloseTo(840, 9);
  });

  test("shows UNVERIFIED first when a ruleset rests on values from memory", () => {
    const table = [["", "P"], ["D", 100], ["L", 40], ["E", 30]];
    const result = value(evaluateFormula(ENVELOPE, [table, [["test-seismic"]], [["SDS", 1.1], ["rho", 1.3]], null]));
    expect(String(result[0][0])).toMatch(/^UNVERIFIED · /);
    // [confirmed, ICC example, SDS = 1.10, ρ = 1.3]: 1.42D + 1.3QE + L → 142 + 39 + 40 = 221 (values invented for the test).
    expect(rowOf(result, "P")[1]).toBeCloseTo(221, 9);
    // [confirmed, same example]: 0.68D − 1.3QE → 68 − 39 = 29.
    expect(rowOf(result, "P")[3]).toBeCloseTo(29, 9);
  });

  test("finds the exact extremes of a table whose full listing would be too large for Excel", () => {
    // 1,000 wind cases W:k = k; 1.2D + W + L + S: max = 120 + 1000 + 50 + 20 = 1190, min = 120 − 1000 = −880
    // (the largest wind case reversed, L and S left out). Hand arithmetic; values invented for the test.
    const cases = [["D", 100], ["L", 50], ["S", 20], ...Array.from({ length: 1000 }, (_, k) => [`W:${k + 1}`, k + 1])];
    const table = [["", "c1", "c2"], ...cases.map(([h, v]) => [h, v, v])];
    const result = value(evaluateFormula(ENVELOPE, [table, [["A", "1.2D + W + L + S"]], null, null]));
    const [, max, maxRow, min, minRow] = rowOf(result, "c1");
    expect(max).toBeCloseTo(1190, 9);
    expect(min).toBeCloseTo(-880, 9);
    expect(maxRow).toBe("A: 1.2D + L + S + W:1000");
    expect(minRow).toBe("A: 1.2D - W:1000 [absent: L, S]");
  });

  test("follows the orientation and case map given in options, as a range or as text", () => {
    // Headers written another way, assigned to symbols by the case map.
    const table = [["result", "dead", "live", "wind N"], ["C1", 140, 420, -50]];
    const asRange = [["orientation", "columns"], ["dead", "D"], ["live", "L"], ["wind N", "W"]];
    const asText = [["orientation=columns; dead=D; live=L; wind N=W"]];
    for (const options of [asRange, asText]) {
      const result = value(evaluateFormula(ENVELOPE, [table, STRENGTH_ROWS, null, options]));
      expect(result[1][0]).toBe("result");
      // Same hand values as the column above: 840 and 76.
      expect(rowOf(result, "C1")[1]).toBeCloseTo(840, 9);
      expect(rowOf(result, "C1")[3]).toBeCloseTo(76, 9);
    }
  });

  test("refuses an orientation it does not know, naming the options cell", () => {
    const text = message(evaluateFormula(ENVELOPE, [COLUMN_TABLE, STRENGTH_ROWS, null, [["orientation", "sideways"]]], ["Calc!A1:C4", "Calc!F1:H6", "", "Calc!K1:L1"]));
    expect(text).toBe('options, Calc!K1: orientation must be "rows" (cases down the first column) or "columns" (cases across the first row), not "sideways"');
  });

  test("refuses a case map row that names no load symbol, naming its cell", () => {
    const text = message(evaluateFormula(ENVELOPE, [COLUMN_TABLE, STRENGTH_ROWS, null, [["orientation", "rows"], ["wind N", "Wx"]]], ["Calc!A1:C4", "Calc!F1:H6", "", "Calc!K1:L2"]));
    expect(text).toMatch(/^options, Calc!L2: "Wx" is neither a load symbol/);
  });
});
