/**
 * The reviewer's copy as cells: what each block holds and which formula each
 * value is, on a ruleset typed for the test. The numbers a spreadsheet program
 * computes from these formulas are checked in test/cli/sheet.test.ts
 * (LibreOffice Calc against the engine).
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { loadRuleset, parseCriterion, planForTable, readCaseTable, type Cell } from "../../src/core/index.js";
import { criterionFormula, reviewerSheet, type SheetCell } from "../../src/sheet/reviewerSheet.js";
import { STRENGTH_FIXTURE } from "../functions/fixtures.js";

// The column of the steel design examples: PD = 140 kips, PL = 420 kips [confirmed, see test/functions/fixtures.ts];
// V and the wind case are invented for the test.
const TABLE: Cell[][] = [
  ["", "P", "V"],
  ["D", 140, 2],
  ["L", 420, 5],
  ["W", -50, 10],
];

function sheetFor(criteria: string[] = []) {
  const ruleset = loadRuleset(JSON.stringify(STRENGTH_FIXTURE));
  if (!ruleset.ok) throw new Error("fixture does not load");
  const table = readCaseTable(TABLE, ruleset.value);
  if (!table.ok) throw new Error("table does not read");
  const plan = planForTable(ruleset.value, {}, table.value);
  if (!plan.ok) throw new Error("no plan");
  const parsed = criteria.map((c) => parseCriterion(c, table.value.components)).map((r) => (r.ok ? r.value : null)).filter((c) => c !== null);
  const sheet = reviewerSheet(plan.value, table.value, {
    stamp: ["Checked · not approved · test-strength"],
    cautions: ["Results must be reviewed by a qualified, licensed engineer."],
    ...(criteria.length > 0 ? { criteria: parsed } : {}),
  });
  if (!sheet.ok) throw new Error(sheet.problems[0].message);
  return sheet.value;
}

const at = (cells: SheetCell[], address: string) => cells.find((c) => c.address === address);

describe("reviewerSheet", () => {
  test("heads the sheet with the stamp and the cautions as text", () => {
    const { cells } = sheetFor();
    expect(at(cells, "A2")).toMatchObject({ kind: "text", value: "Checked · not approved · test-strength" });
    expect(at(cells, "A3")).toMatchObject({ kind: "text", value: "Caution: Results must be reviewed by a qualified, licensed engineer." });
  });

  test("writes the combination '2: 1.2D + 1.6L' as factors and a SUMPRODUCT over the case table", () => {
    const sheet = sheetFor();
    const { factorHeaderRow, caseHeaderRow, firstValueColumn } = sheet.layout;
    const row = sheet.cells.find((c) => c.kind === "text" && c.value === "2: 1.2D + 1.6L" && c.row > factorHeaderRow)?.row as number;
    const factors = ["D", "E", "F"].map((col) => at(sheet.cells, `${col}${row}`));
    // ASCE/SEI 7-16 §2.3.1 (2): 1.2 on D, 1.6 on L, nothing on W [confirmed, fixture].
    expect(factors.map((f) => (f?.kind === "number" ? f.value : null))).toEqual([1.2, 1.6, 0]);
    const p = sheet.cells.find((c) => c.row === row && c.column === firstValueColumn);
    expect(p).toMatchObject({ kind: "formula", formula: `SUMPRODUCT($D${row}:$F${row},$D$${caseHeaderRow + 1}:$F$${caseHeaderRow + 1})` });
  });

  test("finds the envelope with MAX, MIN, INDEX and MATCH over each result's column", () => {
    const sheet = sheetFor();
    const { envelopeHeaderRow, factorHeaderRow } = sheet.layout;
    const first = factorHeaderRow + 1;
    const last = factorHeaderRow + sheet.layout.rowCount;
    const r = envelopeHeaderRow + 1;
    expect(at(sheet.cells, `B${r}`)).toMatchObject({ kind: "formula", formula: `MAX($H$${first}:$H$${last})` });
    expect(at(sheet.cells, `C${r}`)).toMatchObject({ kind: "formula", formula: `INDEX($A$${first}:$A$${last},MATCH($B$${r},$H$${first}:$H$${last},0))` });
    expect(at(sheet.cells, `D${r}`)).toMatchObject({ kind: "formula", formula: `MIN($H$${first}:$H$${last})` });
  });

  test("never stores a computed number: below the case table every number is a factor or a formula", () => {
    const sheet = sheetFor(["max |V|"]);
    const { factorHeaderRow, firstValueColumn, caseHeaderRow } = sheet.layout;
    const numbers = sheet.cells.filter((c) => c.kind === "number");
    for (const n of numbers) {
      const inCaseTable = n.row > caseHeaderRow && n.row < sheet.layout.envelopeHeaderRow;
      const aFactor = n.row > factorHeaderRow && n.column < firstValueColumn;
      expect(inCaseTable || aFactor, n.address).toBe(true);
    }
  });

  test("writes criteria as formulas of one row's values", () => {
    const parsed = parseCriterion("max N/2000 + |M|/350", ["N", "M"]);
    if (!parsed.ok) throw new Error("criterion does not parse");
    expect(criterionFormula(parsed.value.expr, (c) => ["B7", "C7"][c])).toBe("((B7/2000)+(ABS(C7)/350))");
  });

  test("lists the default criteria of a cases-as-rows table (max and min of each component) as governing rows", () => {
    const sheet = sheetFor();
    const header = sheet.layout.governingHeaderRow as number;
    const criteria = sheet.cells.filter((c) => c.column === 0 && c.row > header && c.row <= header + 4).map((c) => (c.kind === "text" ? c.value : ""));
    expect(criteria).toEqual(["max P", "min P", "max V", "min V"]);
  });

  test("refuses a listing beyond the row limit", () => {
    const ruleset = loadRuleset(JSON.stringify(STRENGTH_FIXTURE));
    if (!ruleset.ok) throw new Error("fixture does not load");
    const table = readCaseTable(TABLE, ruleset.value);
    if (!table.ok) throw new Error("table does not read");
    const plan = planForTable(ruleset.value, {}, table.value);
    if (!plan.ok) throw new Error("no plan");
    const sheet = reviewerSheet(plan.value, table.value, { stamp: [], cautions: [], rowLimit: 3 });
    expect(sheet.ok).toBe(false);
    if (!sheet.ok) expect(sheet.problems[0].kind).toBe("too-many-rows");
  });

  test("imports only the engine's public API: no Node, Office or DOM", () => {
    const source = readFileSync(path.resolve(import.meta.dirname, "../../src/sheet/reviewerSheet.ts"), "utf8");
    const imports = [...source.matchAll(/^import .* from "([^"]+)";$/gm)].map((m) => m[1]);
    expect(imports).toEqual(["../core/index.js"]);
    expect(source).not.toMatch(/\b(window|document|Office|Excel|process)\./);
  });
});
