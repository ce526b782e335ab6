/**
 * A case table read off the sheet for the pane's preview, placed on the sheet:
 * each problem names the cell a user clicks, as the formulas' messages do
 * (docs/formulas.md, "cases, Loads!D5 (L / V): …").
 */
import { describe, expect, test } from "vitest";
import { loadRuleset, problem } from "../../src/core/index.js";
import type { RangeRead } from "../../src/sheet/sheetHost.js";
import { placedText, readCaseRange } from "../../src/taskpane/sheetTable.js";
import { STRENGTH_FIXTURE } from "../functions/fixtures.js";

const loaded = loadRuleset(STRENGTH_FIXTURE);
if (!loaded.ok) throw new Error("the fixture does not load");
const ruleset = loaded.value;
const area = { sheet: "Column bases", top: 4, left: 2, rows: 4, columns: 3 };
const read = (values: RangeRead["values"], name: string | null = null): RangeRead => ({ area, name, values, formulas: values.map((r) => r.map(() => "")) });

describe("the pane's reading of a case range", () => {
  test("reads the steel column, with trailing blank and zero rows and columns outside the table, as LW.ENVELOPE does", () => {
    // PD = 140, PL = 420 [confirmed, steel design examples]; the generous selection around it is invented.
    const table = readCaseRange(read([[null, "P", null], ["D", 140, 0], ["L", 420, null], [null, 0, null]]), ruleset);
    expect(table.ok && table.value.components).toEqual(["P"]);
    expect(table.ok && table.value.cases.map((c) => c.header)).toEqual(["D", "L"]);
  });

  test("names the cell on the sheet, quoting the sheet, with the header where the sentence lacks it", () => {
    const lines = readCaseRange(read([[null, "P"], ["D", "abc"], ["L", 420]], "Reactions"), ruleset);
    expect(lines.ok).toBe(false);
    // Row 1, column 1 of a range whose top-left is C5: D6.
    expect(!lines.ok && lines.lines[0]).toMatch(/^Reactions is not a case table for test-strength: 'Column bases'!D6\b.*"abc"/);
  });

  test("says an empty range is empty", () => {
    const lines = readCaseRange(read([[null, null], [null, ""]]), ruleset);
    expect(!lines.ok && lines.lines).toEqual(["'Column bases'!C5:E8 is empty: select the case table with its header row and header column."]);
  });

  test("places a row, a column, a second place and a header", () => {
    expect(placedText(problem("cases-duplicate-header", 'case header "L" appears twice', { row: 3, column: 0, also: { row: 2, column: 0 } }), area)).toBe(
      `'Column bases'!C8: case header "L" appears twice (also at 'Column bases'!C7)`,
    );
    expect(placedText(problem("cases-ragged", "it has 2 cells where the header row has 3", { row: 1 }), area)).toBe("'Column bases'!row 6: it has 2 cells where the header row has 3");
    expect(placedText(problem("cases-header", "no load symbol", { column: 2, header: "Q" }), area)).toBe("'Column bases'!column E (Q): no load symbol");
  });
});
