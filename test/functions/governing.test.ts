import { describe, expect, test } from "vitest";
import { GOVERNING } from "../../src/functions/formulas/governingFormula.js";
import { COLUMN_TABLE, STRENGTH_ROWS } from "./fixtures.js";
import { body, evaluateFormula, expectExcelShaped, message, value } from "./outcome.js";

// Hand values for COLUMN_TABLE (D: P 140, V 2; L: P 420, V 5; W: P −50, V 10) under
// ASCE/SEI 7-16 §2.3.1 (1)–(5) [confirmed for the 7-10 list]; V and W values invented for the test.
//   max P: (2) 1.2D + 1.6L      P = 168 + 672 = 840,  V = 2.4 + 8 = 10.4
//   min P: (5) 0.9D + W          P = 126 − 50 = 76,    V = 1.8 + 10 = 11.8
//   max V: (4) 1.2D + L + W      P = 168 + 420 − 50 = 538, V = 2.4 + 5 + 10 = 17.4
//   min V: (5) 0.9D − W          P = 126 + 50 = 176,   V = 1.8 − 10 = −8.2
describe("LW.GOVERNING", () => {
  test("gives the max and min of every component with the concurrent values of the same row", () => {
    const table = value(evaluateFormula(GOVERNING, [COLUMN_TABLE, STRENGTH_ROWS, null, null, null]));
    expectExcelShaped(table);
    expect(table[1]).toEqual(["criterion", "value", "combination row", "P", "V"]);
    const rows = body(table);
    expect(rows.map((r) => [r[0], r[2]])).toEqual([
      ["max P", "2: 1.2D + 1.6L"],
      ["min P", "5: 0.9D + W"],
      ["max V", "4: 1.2D + L + W"],
      ["min V", "5: 0.9D - W"],
    ]);
    const expected = [
      [840, 840, 10.4],
      [76, 76, 11.8],
      [17.4, 538, 17.4],
      [-8.2, 176, -8.2],
    ];
    rows.forEach((r, k) => [r[1], r[3], r[4]].forEach((v, j) => expect(v).toBeCloseTo(expected[k][j], 9)));
  });

  test("takes criteria from text cells in any shape, skipping blanks, in the order given", () => {
    const criteria = [["max V", null], ["", "max |P - 600|"]];
    const rows = body(value(evaluateFormula(GOVERNING, [COLUMN_TABLE, STRENGTH_ROWS, criteria, null, null])));
    expect(rows.map((r) => r[0])).toEqual(["max V", "max |P - 600|"]);
    // |P − 600| is largest at the smallest P: |76 − 600| = 524 (row (5) 0.9D + W), against |840 − 600| = 240.
    expect(rows[1][1]).toBeCloseTo(524, 9);
    expect(rows[1][2]).toBe("5: 0.9D + W");
  });

  test("names the criteria cell and the character where a criterion goes wrong", () => {
    const text = message(evaluateFormula(GOVERNING, [COLUMN_TABLE, STRENGTH_ROWS, [["max V"], ["max Q"]], null, null], ["Col!A1:C4", "Col!F1:H6", "Col!J1:J2"]));
    // "max Q": Q is not a component; it starts at character 5.
    expect(text).toMatch(/^criteria, Col!J2, character 5 \(max Q\): "Q" is not a component of the case table/);
  });

  test("refuses a number where a criterion is expected", () => {
    const text = message(evaluateFormula(GOVERNING, [COLUMN_TABLE, STRENGTH_ROWS, [[12]], null, null], ["Col!A1:C4", "Col!F1:H6", "Col!J1"]));
    expect(text).toBe('criteria, Col!J1: 12 is not a criterion; write text such as "max V" or "min N"');
  });
});
