import { describe, expect, test } from "vitest";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { COLUMN_TABLE, STRENGTH_ROWS } from "./fixtures.js";
import { body, evaluateFormula, expectExcelShaped, message, rowOf, value } from "./outcome.js";

const P_ONLY = [["", "P"], ["D", 140], ["L", 420]];

describe("LW.FACTORED", () => {
  test("gives 840 kips under 1.2D + 1.6L and 168 kips with L left out, for PD = 140 and PL = 420", () => {
    const table = value(evaluateFormula(FACTORED, [P_ONLY, [["2", "1.2D + 1.6L", "ASCE/SEI 7-16 §2.3.1 (2)"]], null, null]));
    expect(table[1]).toEqual(["combination row", "P"]);
    // [confirmed, steel design examples] 1.2 × 140 + 1.6 × 420 = 168 + 672 = 840 kips.
    expect(rowOf(table, "2: 1.2D + 1.6L")[1]).toBeCloseTo(840, 9);
    // ASCE/SEI 7-16 §2.3 [confirmed]: effects of loads not acting must be investigated: 1.2 × 140 = 168.
    expect(rowOf(table, "2: 1.2D [absent: 1.6L]")[1]).toBeCloseTo(168, 9);
    expect(body(table)).toHaveLength(2);
  });

  test("gives 560 kips under D + L", () => {
    // ASCE/SEI 7-16 §2.4.1 (2) [confirmed for the 7-10 list]; 140 + 420 = 560 kips [confirmed, steel design examples].
    const table = value(evaluateFormula(FACTORED, [P_ONLY, [["2", "D + L!", "§2.4.1 (2)"]], null, null]));
    expect(body(table)).toEqual([["2: D + L", 560]]);
  });

  test("lists every combination row of a typed strength list with the value of every component", () => {
    const table = value(evaluateFormula(FACTORED, [COLUMN_TABLE, STRENGTH_ROWS, null, null]));
    expectExcelShaped(table);
    expect(table[1]).toEqual(["combination row", "P", "V"]);
    // ASCE/SEI 7-16 §2.3.1 (1) [confirmed]: 1.4 × 140 = 196, 1.4 × 2 = 2.8.
    const one = rowOf(table, "1: 1.4D");
    expect(one[1]).toBeCloseTo(196, 9);
    expect(one[2]).toBeCloseTo(2.8, 9);
    // §2.3.1 (4) [confirmed]: 1.2D + W + L with W = −50, 10 (values invented for the test):
    // P = 168 − 50 + 420 = 538, V = 2.4 + 10 + 5 = 17.4.
    const four = rowOf(table, "4: 1.2D + L + W");
    expect(four[1]).toBeCloseTo(538, 9);
    expect(four[2]).toBeCloseTo(17.4, 9);
    // Wind acts both ways (common practice (no source)): 1.2D + L − W gives P = 168 + 50 + 420 = 638.
    expect(rowOf(table, "4: 1.2D + L - W")[1]).toBeCloseTo(638, 9);
  });

  test("says which symbols the case table does not supply", () => {
    const table = value(evaluateFormula(FACTORED, [COLUMN_TABLE, STRENGTH_ROWS, null, null]));
    expect(table.at(-1)?.[0]).toBe("note: no case of Lr, S, R in the case table; their terms contribute nothing");
  });

  test("starts with the ruleset stamp, which says a typed list is not checked", () => {
    const table = value(evaluateFormula(FACTORED, [P_ONLY, [["2", "1.2D + 1.6L"]], null, null]));
    expect(String(table[0][0])).toMatch(/^NOT CHECKED · not approved · ruleset typed in cells · fingerprint [0-9a-f]{12} · /);
  });

  test("refuses a result larger than Excel accepts, saying how large and what to use instead", () => {
    // 1,000 wind cases, 100 components: 1.2D + W + L + S gives (2 × 1000 + 1) × 2 × 2 = 8,004 rows
    // (each wind case both ways or left out; L and S present or left out), 8,004 × 101 cells ≈ 19 MB of numbers alone.
    const components = Array.from({ length: 100 }, (_, j) => `c${j + 1}`);
    const cases = [["D", 100], ["L", 50], ["S", 20], ...Array.from({ length: 1000 }, (_, k) => [`W:${k + 1}`, k + 1])];
    const table = [["", ...components], ...cases.map(([h, v]) => [h, ...components.map(() => v)])];
    const text = message(evaluateFormula(FACTORED, [table, [["A", "1.2D + W + L + S"]], null, null]));
    expect(text).toMatch(/^LW\.FACTORED would return about \d+\.\d MB \(8,004 rows × 101 columns\), more than the about 5 MB Excel accepts from one formula; use LW\.ENVELOPE or LW\.GOVERNING/);
  });

  test("does not change the ranges it is given", () => {
    const table = structuredClone(COLUMN_TABLE);
    const rows = structuredClone(STRENGTH_ROWS);
    value(evaluateFormula(FACTORED, [table, rows, null, null]));
    expect(table).toEqual(COLUMN_TABLE);
    expect(rows).toEqual(STRENGTH_ROWS);
  });
});
