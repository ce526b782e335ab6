/**
 * The starter block as cells: the inputs a checker edits, the four formulas
 * over them, and room for every spill, laid out from the core's result sizes.
 * The formulas are run against a recorded sheet in test/taskpane/sheetView.test.ts.
 */
import { describe, expect, test } from "vitest";
import type { ResultSizes } from "../../src/core/index.js";
import type { SheetCell } from "../../src/sheet/reviewerSheet.js";
import { starterBlock, type StarterBlock, type StarterBlockInput } from "../../src/sheet/starterBlock.js";

/** Sizes as the core would give them for some table; invented for the layout. */
const SIZES: ResultSizes = {
  ruleset: { rows: 16, columns: 2 },
  envelope: { rows: 5, columns: 5 },
  governing: { rows: 7, columns: 6 },
  factored: { rows: 40, columns: 4 },
  combos: { rows: 40, columns: 6 },
};

const INPUT: StarterBlockInput = {
  anchor: { sheet: "Calc", top: 2, left: 1 },
  cases: { area: { sheet: "Loads", top: 0, left: 0, rows: 5, columns: 4 }, name: null },
  rulesetId: "asce7-16-strength",
  parameters: [
    { name: "SDS", value: null },
    { name: "rho", value: 1.3 },
    { name: "site", value: "soft" },
  ],
  criteria: ["max P", "min P", "max |M|"],
  sizes: SIZES,
};

function block(input: StarterBlockInput = INPUT): StarterBlock {
  const made = starterBlock(input);
  if (!made.ok) throw new Error(made.problems[0].message);
  return made.value;
}

const at = (cells: SheetCell[], address: string) => cells.find((c) => c.address === address);

describe("starterBlock", () => {
  test("writes the ruleset id, the parameters with their values and the criteria as cells below the anchor", () => {
    const { cells, rulesetCell, params, criteria, notGiven } = block();
    expect(rulesetCell).toBe("C4");
    expect(at(cells, "C4")).toMatchObject({ kind: "text", value: "asce7-16-strength" });
    expect(at(cells, "B6")).toMatchObject({ kind: "text", value: "parameter" });
    // A parameter with neither a value nor a default is left out: its row would be an error ("SDS has no value").
    expect([at(cells, "B7"), at(cells, "C7"), at(cells, "B8"), at(cells, "C8")]).toMatchObject([
      { kind: "text", value: "rho" },
      { kind: "number", value: 1.3 },
      { kind: "text", value: "site" },
      { kind: "text", value: "soft" },
    ]);
    expect(notGiven).toEqual(["SDS"]);
    // The parameter range keeps one blank row, where SDS can be typed without touching a formula.
    expect(params).toEqual({ sheet: "Calc", top: 6, left: 1, rows: 3, columns: 2 });
    expect(at(cells, "B9")).toBeUndefined();
    expect(String((at(cells, "B10") as { value: string }).value)).toMatch(/^No default and not given: SDS\./);
    expect(criteria).toEqual({ sheet: "Calc", top: 12, left: 1, rows: 3, columns: 1 });
    expect([12, 13, 14].map((r) => (at(cells, `B${r + 1}`) as { value: string }).value)).toEqual(["max P", "min P", "max |M|"]);
  });

  test("gives each formula the case table, the ruleset cell, the parameter and criteria ranges", () => {
    const { formulas } = block();
    expect(formulas.map((f) => [f.name, f.address, f.formula])).toEqual([
      ["LW.RULESET", "E4", "LW.RULESET($C$4)"],
      ["LW.ENVELOPE", "H4", "LW.ENVELOPE(Loads!$A$1:$D$5,$C$4,$B$7:$C$9)"],
      ["LW.GOVERNING", "N4", "LW.GOVERNING(Loads!$A$1:$D$5,$C$4,$B$13:$B$15,$B$7:$C$9)"],
      ["LW.COMBOS", "U4", "LW.COMBOS($C$4,$B$7:$C$9,Loads!$A$1:$D$5)"],
    ]);
  });

  test("names a named case table by its name, and one on the same sheet without the sheet", () => {
    expect(block({ ...INPUT, cases: { ...INPUT.cases, name: "Reactions" } }).formulas[1].formula).toBe("LW.ENVELOPE(Reactions,$C$4,$B$7:$C$9)");
    expect(block({ ...INPUT, anchor: { ...INPUT.anchor, sheet: "Loads", left: 5 } }).formulas[1].formula).toMatch(/^LW\.ENVELOPE\(\$A\$1:\$D\$5,/);
  });

  test("gives each result a band as wide as it spills, an empty column between bands, and rows for the longest", () => {
    const { formulas, area, cells } = block();
    // Bands: RULESET 2 columns (E:F), gap G, ENVELOPE 5 (H:L), gap M, GOVERNING 6 (N:S), gap T, COMBOS 6 (U:Z).
    expect(formulas.map((f) => [f.spill.left, f.spill.columns, f.spill.rows])).toEqual([
      [4, 2, 16],
      [7, 5, 5],
      [13, 6, 7],
      [20, 6, 40],
    ]);
    expect(area).toEqual({ sheet: "Calc", top: 2, left: 1, rows: 41, columns: 25 });
    for (const f of formulas) {
      const inside = cells.filter((c) => c.row - 1 >= f.spill.top && c.row - 1 < f.spill.top + f.spill.rows && c.column >= f.spill.left && c.column < f.spill.left + f.spill.columns);
      expect(inside.map((c) => c.address)).toEqual([f.address]);
    }
  });

  test("refuses a block that would run past the worksheet's last column", () => {
    const made = starterBlock({ ...INPUT, anchor: { sheet: "Calc", top: 0, left: 16_370 } });
    expect(made.ok).toBe(false);
    expect(!made.ok && made.problems[0].message).toMatch(/beyond the worksheet's last row or column; choose a cell further up or to the left$/);
  });
});
