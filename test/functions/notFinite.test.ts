/**
 * The formulas on case values that are wrong or too large: each refuses with a
 * #VALUE! message naming the cell and what is wrong, and no result ever holds
 * NaN or Infinity. Values are invented; the arithmetic is by hand: 1.4 × 1.5e308
 * = 2.1e308 is past the largest double, about 1.7976931348623157 × 10^308
 * (IEEE 754 binary64; ECMA-262 Number.MAX_VALUE).
 */
import { describe, expect, test } from "vitest";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { EXPLAIN } from "../../src/functions/formulas/explainFormula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { GOVERNING } from "../../src/functions/formulas/governingFormula.js";
import { addresses } from "./fixtures.js";
import { evaluateFormula, expectExcelShaped, message, value } from "./outcome.js";

/** Two combinations typed in cells: 1.4D, and 1.2D + 1.6L. */
const ROWS = [
  ["1", "1.4D", "typed"],
  ["2", "1.2D + 1.6L", "typed"],
];
const WHERE = addresses("Loads!A1:C3", "Loads!E1:G2");
const PASSES = "the factored sum passes the largest number Loadwright can hold (about ±1.8 × 10^308); check the case values";

describe("formulas on case values too large to combine", () => {
  // Cases as columns: result "C2" on row 3 has D = 1.5e308; "C1" is ordinary.
  const table = [
    ["result", "D", "L"],
    ["C1", 140, 420],
    ["C2", 1.5e308, 0],
  ];

  test("LW.ENVELOPE names the result's cell, the result and the row", () => {
    expect(message(evaluateFormula(ENVELOPE, [table, ROWS, null, null], WHERE))).toBe(`cases, Loads!A3: "C2" has no finite value in row "1: 1.4D": ${PASSES}`);
  });

  test("LW.FACTORED, LW.GOVERNING and LW.EXPLAIN say the same", () => {
    expect(message(evaluateFormula(FACTORED, [table, ROWS, null, null], WHERE))).toBe(`cases, Loads!A3: "C2" has no finite value in row "1: 1.4D": ${PASSES}`);
    expect(message(evaluateFormula(GOVERNING, [table, ROWS, [["max C2"]], null, null], WHERE))).toBe(`cases: criterion "max C2" has no finite value in row "1: 1.4D": ${PASSES}`);
    expect(message(evaluateFormula(EXPLAIN, [table, ROWS, "1: 1.4D", "C2", null], WHERE))).toBe(`cases, Loads!A3: "C2" has no finite value in row "1: 1.4D": ${PASSES}`);
  });

  test("the ordinary result alone still gives its numbers: 1.2 × 140 + 1.6 × 420 = 840", () => {
    const alone = value(evaluateFormula(ENVELOPE, [table.slice(0, 2), ROWS, null, null], WHERE));
    expectExcelShaped(alone);
    expect(alone[2][1]).toBeCloseTo(840, 9);
  });
});

describe("formulas on value cells that are not numbers", () => {
  const cell = (v: unknown) => [
    ["result", "D", "L"],
    ["C1", 140, v],
  ];
  test.each<[unknown, string]>([
    [Infinity, "Infinity is not a finite number"],
    [NaN, "NaN is not a finite number"],
    ["1e400", '"1e400" is not a number'],
    [true, "TRUE is not a number"],
    ["#N/A", "#N/A is an error value, not a number (the formula that should have given it failed)"],
    // An error in a cell as the custom-function runtime may hand it over: an object with its code.
    [{ code: "#DIV/0!", message: "" }, "#DIV/0! is an error value, not a number (the formula that should have given it failed)"],
  ])("refuses %s at its cell", (v, words) => {
    expect(message(evaluateFormula(ENVELOPE, [cell(v), ROWS, null, null], WHERE))).toBe(`cases, Loads!C2 (L): ${words}`);
  });

  test("reads −0, subnormal and the largest double as numbers", () => {
    const t = value(evaluateFormula(ENVELOPE, [[["result", "D", "L"], ["zero", -0, -0], ["tiny", 5e-324, 0], ["edge", 0, 1e308]], ROWS, null, null], WHERE));
    expectExcelShaped(t);
    // Every max is the larger of 1.4D and 1.2D + 1.6L: 0; 1.4 × 5e-324; 1.6 × 1e308 — each product as IEEE 754 rounds it
    // (computed here by the language, not by the engine).
    expect(Object.is(t[2][1], 0)).toBe(true);
    expect(t[3][1]).toBe(Math.max(1.4 * 5e-324, 1.2 * 5e-324));
    expect(t[4][1]).toBe(1.6 * 1e308);
  });
});
