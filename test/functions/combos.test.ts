import { beforeEach, describe, expect, test } from "vitest";
import { COMBOS } from "../../src/functions/formulas/combosFormula.js";
import type { OutputCell } from "../../src/functions/formula.js";
import { SEISMIC_FIXTURE } from "./fixtures.js";
import { body, expectExcelShaped, message, testWorkbook, type TestWorkbook, value } from "./outcome.js";

let workbook: TestWorkbook = testWorkbook();
/** The formulas and the store of this test's own workbook. */
const evaluateFormula: TestWorkbook["evaluateFormula"] = (...a) => workbook.evaluateFormula(...a);
const rulesetStore = () => workbook.store;
beforeEach(async () => {
  workbook = testWorkbook();
  expect((await rulesetStore().save(SEISMIC_FIXTURE)).ok).toBe(true);
});

/** Factor on a column, by header, in the row with this label. */
function factor(table: OutputCell[][], label: string, column: string): OutputCell {
  const c = table[1].indexOf(column);
  const row = table.find((r) => r[0] === label);
  if (c < 0 || !row) throw new Error(`no ${column} / ${label} in ${JSON.stringify(table)}`);
  return row[c];
}

describe("LW.COMBOS", () => {
  test.each([
    ["a range of name/value pairs", [["SDS", 1.1], ["rho", 1.3]]],
    ["text in one cell", [["SDS=1.10; rho=1.3"]]],
    ["text, one pair per cell of a column", [["SDS = 1.10"], ["rho=1.3"]]],
  ])("puts (1.2 + 0.2·SDS) = 1.42 on D and 0.68 on D in the other seismic combination, params as %s", (_, params) => {
    const table = value(evaluateFormula(COMBOS, [[["test-seismic"]], params, null]));
    expectExcelShaped(table);
    expect(table[1]).toEqual(["combination row", "clause", "D", "L", "S", "E"]);
    // [confirmed, ICC example quoted on a public forum, ρ = 1.3, SDS = 1.10]: 1.2 + 0.2 × 1.10 = 1.42; 0.9 − 0.2 × 1.10 = 0.68.
    expect(factor(table, "6: 1.42D + L + 0.2S + 1.3E", "D")).toBeCloseTo(1.42, 12);
    expect(factor(table, "6: 1.42D + L + 0.2S + 1.3E", "E")).toBeCloseTo(1.3, 12);
    expect(factor(table, "6: 1.42D + L + 0.2S + 1.3E", "clause")).toBe("§2.3.6 (6)");
    expect(factor(table, "7: 0.68D - 1.3E", "D")).toBeCloseTo(0.68, 12);
    expect(factor(table, "7: 0.68D - 1.3E", "E")).toBeCloseTo(-1.3, 12);
    // Combination 6: L and 0.2S may each be left out, E acts both ways: 2 × 2 × 2 = 8 rows; combination 7: 2 rows.
    expect(body(table)).toHaveLength(10);
  });

  test("gives factors per case when a row of case headers is given", () => {
    const table = value(evaluateFormula(COMBOS, [[["test-seismic"]], [["SDS=1.1; rho=1.0"]], [["", "D", "E:x", "E:y"]]]));
    expect(table[1]).toEqual(["combination row", "clause", "D", "E:x", "E:y"]);
    // Transient cases act one at a time (docs/case-tables.md): each E direction in turn, both ways.
    expect(factor(table, "7: 0.68D + E:y", "E:y")).toBe(1);
    expect(factor(table, "7: 0.68D + E:y", "E:x")).toBe(0);
    // Combination 7: E:x or E:y, each both ways: 4 rows.
    expect(body(table).filter((r) => String(r[0]).startsWith("7:"))).toHaveLength(4);
  });

  test("names the params cell of a parameter it does not know, with the likely one", () => {
    const text = message(evaluateFormula(COMBOS, [[["test-seismic"]], [["SDS", 1.1], ["rh0", 1.3]], null], ["Calc!B2", "Calc!D2:E3"]));
    expect(text).toMatch(/^params, Calc!E3: unknown parameter "rh0"; did you mean "rho"\?/);
  });

  test("names the params cell of a value outside the allowed ones", () => {
    const text = message(evaluateFormula(COMBOS, [[["test-seismic"]], [["SDS", 1.1], ["rho", 1.2]], null], ["Calc!B2", "Calc!D2:E3"]));
    // ASCE/SEI 7-16 §12.3.4 [memory]: ρ is 1.0 or 1.3.
    expect(text).toBe("params, Calc!E3: parameter rho = 1.2 is not one of the allowed values 1, 1.3");
  });

  test("names the character of a bad value in parameter text", () => {
    const text = message(evaluateFormula(COMBOS, [[["test-seismic"]], [["SDS=-1; rho=1.3"]], null], ["Calc!B2", "Calc!D2"]));
    expect(text).toMatch(/^params, Calc!D2, character 1: parameter SDS = -1 is outside its allowed range 0 … /);
  });

  test("says which parameter is missing when it has no default", () => {
    const text = message(evaluateFormula(COMBOS, [[["test-seismic"]], [["rho=1.3"]], null]));
    expect(text).toMatch(/^params, combination "6", character \d+: parameter SDS has no default; give its value/);
  });

  test("names the row and character of a typed combination that does not parse", () => {
    const rows = [["1", "1.4D", "§2.3.1 (1)"], ["2", "1.2D + * 1.6L", "§2.3.1 (2)"]];
    const text = message(evaluateFormula(COMBOS, [rows, null, null], ["Rules!A3:C4"]));
    // "1.2D + * 1.6L": the "*" is character 8.
    expect(text).toMatch(/^ruleset, Rules!B4, combination "2", character 8: /);
  });
});
