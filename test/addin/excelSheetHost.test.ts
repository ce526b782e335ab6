/**
 * How the Excel sheet host turns a list of cells into ranges to write: few
 * rectangles, every listed cell exactly once at its address, and no cell that
 * is not listed (a "" written into a spill's way would be a cell of its own).
 * The host at work inside the pane is tested in test/taskpane/sheetView.test.ts.
 */
import { describe, expect, test } from "vitest";
import { columnLetters, loadRuleset, planForTable, readCaseTable } from "../../src/core/index.js";
import { writeBlocks, writtenForm } from "../../src/addin/excelSheetHost.js";
import { reviewerSheet } from "../../src/sheet/reviewerSheet.js";
import { STRENGTH_FIXTURE } from "../functions/fixtures.js";

function reviewerCells() {
  const ruleset = loadRuleset(STRENGTH_FIXTURE);
  if (!ruleset.ok) throw new Error("does not load");
  // The column of the steel design examples (PD = 140, PL = 420 [confirmed]) with an invented wind case.
  const table = readCaseTable([["", "P"], ["D", 140], ["L", 420], ["W", -50]], ruleset.value);
  if (!table.ok) throw new Error("does not read");
  const plan = planForTable(ruleset.value, {}, table.value);
  if (!plan.ok) throw new Error("no plan");
  const sheet = reviewerSheet(plan.value, table.value, { stamp: ["stamp"], cautions: ["caution"] });
  if (!sheet.ok) throw new Error("no sheet");
  return sheet.value.cells;
}

describe("writeBlocks", () => {
  test("writes every cell once, at its address, and nothing else", () => {
    const cells = reviewerCells();
    const written = new Map<string, string | number>();
    for (const block of writeBlocks(cells)) {
      block.rows.forEach((row, r) => {
        expect(row).toHaveLength(block.rows[0].length);
        row.forEach((value, c) => {
          const address = `${columnLetters(block.left + c)}${block.top + r + 1}`;
          expect(written.has(address), address).toBe(false);
          written.set(address, value);
        });
      });
    }
    expect(new Map(cells.map((c) => [c.address, writtenForm(c)]))).toEqual(written);
  });

  test("writes the factor table's rows as rectangles, not one range a row", () => {
    const cells = reviewerCells();
    const rows = new Set(cells.map((c) => c.row)).size;
    expect(writeBlocks(cells).length).toBeLessThan(rows);
  });

  test("keeps text text behind Excel's apostrophe, and gives a formula its '='", () => {
    expect(writtenForm({ address: "A1", row: 1, column: 0, kind: "text", value: "-W:E" })).toBe("'-W:E");
    expect(writtenForm({ address: "A1", row: 1, column: 0, kind: "number", value: 1.6 })).toBe(1.6);
    expect(writtenForm({ address: "A1", row: 1, column: 0, kind: "formula", formula: "MAX(B2:B9)" })).toBe("=MAX(B2:B9)");
  });
});
