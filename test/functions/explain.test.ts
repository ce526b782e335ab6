import { describe, expect, test } from "vitest";
import { EXPLAIN } from "../../src/functions/formulas/explainFormula.js";
import { COLUMN_TABLE, STRENGTH_ROWS } from "./fixtures.js";
import { evaluateFormula, message, value } from "./outcome.js";

describe("LW.EXPLAIN", () => {
  test("writes out 1.2 × 140 + 1.6 × 420 = 168 + 672 = 840 for the column under 1.2D + 1.6L", () => {
    const lines = value(evaluateFormula(EXPLAIN, [COLUMN_TABLE, STRENGTH_ROWS, "2: 1.2D + 1.6L", "P", null])).map((r) => String(r[0]));
    expect(lines[0]).toMatch(/^NOT CHECKED · /);
    // [confirmed, steel design examples]: PD = 140, PL = 420 kips; ASCE/SEI 7-16 §2.3.1 (2).
    expect(lines).toContain("combination 2 (§2.3.1 (2)): 1.2D + 1.6L + 0.5(Lr or S or R)");
    expect(lines).toContain("P = 1.2 × 140 [D] + 1.6 × 420 [L]");
    expect(lines).toContain("  = 168 + 672");
    expect(lines).toContain("  = 840");
  });

  test("takes a row by its number in LW.FACTORED's listing", () => {
    // Row 1 of the listing is combination (1), 1.4D: 1.4 × 140 = 196.
    const lines = value(evaluateFormula(EXPLAIN, [COLUMN_TABLE, STRENGTH_ROWS, 1, "P", null])).map((r) => String(r[0]));
    expect(lines[1]).toBe("1: 1.4D");
    expect(lines).toContain("  = 196");
  });

  test("refuses a row label that matches no row, as belonging to the row argument", () => {
    const text = message(evaluateFormula(EXPLAIN, [COLUMN_TABLE, STRENGTH_ROWS, "9: 1.2D", "P", null]));
    expect(text).toMatch(/^row: no row is labelled "9: 1\.2D"; a label starts with the combination id \(1, 2, 3, 4, 5\)/);
  });

  test("refuses a component the table does not have, with the likely one", () => {
    const text = message(evaluateFormula(EXPLAIN, [COLUMN_TABLE, STRENGTH_ROWS, 1, "p", null]));
    expect(text).toMatch(/^component: "p" is not a component of the case table; did you mean "P"\?/);
  });

  test.each([
    ["empty", null, /^row: the row is empty/],
    ["TRUE", true, /^row: the row is TRUE/],
  ])("refuses a row that is %s", (_, row, expected) => {
    expect(message(evaluateFormula(EXPLAIN, [COLUMN_TABLE, STRENGTH_ROWS, row, "P", null]))).toMatch(expected);
  });
});
