import { describe, expect, test } from "vitest";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { STRENGTH_ROWS } from "./fixtures.js";
import { evaluateFormula, message } from "./outcome.js";

/** The case table sits at Loads!B3:D6 and the ruleset at Loads!G3:I8. */
const AT = ["Loads!B3:D6", "Loads!G3:I8"];

const withCell = (row: number, column: number, cell: unknown) => {
  const table: unknown[][] = [["", "P", "V"], ["D", 140, 2], ["L", 420, 5], ["W", -50, 10]];
  table[row][column] = cell;
  return table;
};

describe("case table argument", () => {
  test("names the cell and its headers when a value cell holds text", () => {
    expect(message(evaluateFormula(ENVELOPE, [withCell(2, 2, "abc"), STRENGTH_ROWS, null, null], AT))).toBe(
      'cases, Loads!D5 (L / V): "abc" is not a number',
    );
  });

  test("says a number stored as text may need converting", () => {
    expect(message(evaluateFormula(ENVELOPE, [withCell(1, 1, "12,5"), STRENGTH_ROWS, null, null], AT))).toMatch(
      /^cases, Loads!C4 \(D \/ P\): "12,5" is not a number \(a number stored as text\? convert it\)/,
    );
  });

  test("refuses TRUE in a value cell", () => {
    expect(message(evaluateFormula(ENVELOPE, [withCell(3, 1, true), STRENGTH_ROWS, null, null], AT))).toBe(
      "cases, Loads!C6 (W / P): TRUE is not a number",
    );
  });

  test("names the second cell of a duplicate case header, and where the first is on the sheet", () => {
    expect(message(evaluateFormula(ENVELOPE, [withCell(3, 0, "L"), STRENGTH_ROWS, null, null], AT))).toBe(
      'cases, Loads!B6: case header "L" appears twice (also at Loads!B5)',
    );
  });

  test("names a header that is no load symbol of the ruleset once the orientation is known", () => {
    const text = message(evaluateFormula(ENVELOPE, [withCell(3, 0, "Wn"), STRENGTH_ROWS, null, [["orientation=rows"]]], AT));
    expect(text).toMatch(/^cases, Loads!B6: case header "Wn" names no load symbol of the typed ruleset; did you mean "W:n"\?/);
  });

  test("names one wrong header where most headers read as cases, with no orientation given", () => {
    const text = message(evaluateFormula(ENVELOPE, [withCell(3, 0, "Wn"), STRENGTH_ROWS, null, null], AT));
    expect(text).toMatch(/^cases, Loads!B6: case header "Wn" names no load symbol of the typed ruleset/);
  });

  test("names the first cell of a duplicate header in a table with cases across", () => {
    const table = [["result", "D", "L", "D"], ["C1", 1, 2, 3]];
    expect(message(evaluateFormula(ENVELOPE, [table, STRENGTH_ROWS, null, null], AT))).toBe(
      'cases, Loads!E3: case header "D" appears twice (also at Loads!C3)',
    );
  });

  test("counts cells within the argument when Excel gives no address", () => {
    expect(message(evaluateFormula(ENVELOPE, [withCell(2, 2, "abc"), STRENGTH_ROWS, null, null]))).toBe(
      'cases, cell C3 (L / V): "abc" is not a number',
    );
  });

  test("lists up to three problems and counts the rest", () => {
    const table = [["", "P"], ["D", "a"], ["L", "b"], ["W", "c"], ["S", "d"], ["R", "e"]];
    const text = message(evaluateFormula(ENVELOPE, [table, STRENGTH_ROWS, null, null]));
    expect(text.split(" | ")).toHaveLength(4);
    expect(text).toMatch(/ \| \(and 2 more problems\)$/);
  });

  test("refuses an empty case table", () => {
    expect(message(evaluateFormula(ENVELOPE, [[[null, null], [null, null]], STRENGTH_ROWS, null, null], AT))).toBe(
      "cases: the case table is empty: select it with its header row and header column",
    );
  });
});
