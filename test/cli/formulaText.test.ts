/**
 * Reading formulas as a saved workbook stores them: the Loadwright calls and
 * their arguments, references, and a shared formula moved to another cell.
 */
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { loadwrightCalls, parseReference, slideFormula } from "../../src/cli/input/formulaText.js";
import { RULESET_ARGUMENT } from "../../src/cli/input/formulaRuleset.js";
import { ROOT } from "./harness.js";

describe("loadwrightCalls", () => {
  test("finds the stored add-in form and the typed form, in any case, with their arguments", () => {
    // docs/demo.md: Excel stores LW.ENVELOPE as _xldudf_LW_ENVELOPE; LibreOffice Calc writes it in lower case (seen in audit.test.ts).
    expect(loadwrightCalls("_xldudf_LW_ENVELOPE(Cases!$A$7:$K$25,Cases!$N$7,Cases!$M$9:$N$10)")).toEqual([
      { name: "LW.ENVELOPE", stored: "_xldudf_LW_ENVELOPE", args: ["Cases!$A$7:$K$25", "Cases!$N$7", "Cases!$M$9:$N$10"], closed: true },
    ]);
    expect(loadwrightCalls("_xldudf_lw_ruleset(Cases!$N$7)")[0].name).toBe("LW.RULESET");
    // Excel's prefix for functions newer than the file format (ISO/IEC 29500-1 future functions [memory]).
    expect(loadwrightCalls('_xlfn._xldudf_LW_RULESET("x")')[0]).toMatchObject({ name: "LW.RULESET", stored: "_xlfn._xldudf_LW_RULESET", args: ['"x"'] });
    expect(loadwrightCalls('LW.COMBOS("en1990-equ", , {"D",1})')[0].args).toEqual(['"en1990-equ"', "", '{"D",1}']);
  });

  test("finds calls nested in other functions and skips text in quotes, quoted sheet names and table references", () => {
    const calls = loadwrightCalls(`IF(A1,_xlfn.SINGLE(_xldudf_LW_RULESET('LW.RULESET(x)'!A1)),CONCAT("LW.RULESET(""y"")",Table1[[#This Row],[LW.RULESET(]]))`);
    expect(calls.map((c) => [c.name, c.args])).toEqual([["LW.RULESET", ["'LW.RULESET(x)'!A1"]]]);
    expect(loadwrightCalls("MYLW.RULESET(1)+XLW.ENVELOPE(2)")).toEqual([]);
  });

  test("says when a formula ends before the call is closed", () => {
    expect(loadwrightCalls("LW.RULESET(A1")).toEqual([{ name: "LW.RULESET", stored: "LW.RULESET", args: ["A1"], closed: false }]);
  });

  test("knows the ruleset argument of every formula declared in src/functions/functions.ts", () => {
    const source = readFileSync(join(ROOT, "src/functions/functions.ts"), "utf8");
    const declared = [...source.matchAll(/@customfunction (\w+)[\s\S]*?\n(?:export )?function \w+\(([^)]*)\)/g)].map(([, id, params]) => [
      `LW.${id}`,
      params.split(",").map((p) => p.trim().split(/[?:]/)[0]).indexOf("ruleset"),
    ]);
    expect(declared.length).toBe(6);
    expect(Object.fromEntries(declared)).toEqual(RULESET_ARGUMENT);
  });
});

describe("parseReference", () => {
  test("reads a cell, a range, a quoted sheet name and another workbook", () => {
    expect(parseReference("Cases!$N$7")).toEqual({ sheet: "Cases", first: { row: 7, column: 14 }, last: { row: 7, column: 14 }, external: false });
    expect(parseReference("'Load cases'!B2:A1")).toMatchObject({ sheet: "Load cases", first: { row: 1, column: 1 }, last: { row: 2, column: 2 } });
    expect(parseReference("'It''s'!A1")?.sheet).toBe("It's");
    expect(parseReference("[1]Sheet1!A1")?.external).toBe(true);
    // The grid ends at column XFD and row 1,048,576 (Microsoft Support, "Excel specifications and limits").
    expect(parseReference("XFE1")).toBeNull();
    expect(parseReference("A1048577")).toBeNull();
    expect(parseReference('IF(A1,"x")')).toBeNull();
  });
});

describe("slideFormula", () => {
  // Microsoft Support, "Switch between relative, absolute, and mixed references"
  // (https://support.microsoft.com/office/switch-between-relative-absolute-and-mixed-references):
  // =B4*C4 copied from D4 to D5 becomes =B5*C5; =$B$4*$C$4 stays the same; $B4 and C$4 fix one part.
  test("moves relative references and keeps absolute ones, as copying a formula does", () => {
    expect(slideFormula("B4*C4", { row: 4, column: 4 }, { row: 5, column: 4 })).toBe("B5*C5");
    expect(slideFormula("$B$4*$C$4", { row: 4, column: 4 }, { row: 5, column: 4 })).toBe("$B$4*$C$4");
    expect(slideFormula("$B4*C$4", { row: 4, column: 4 }, { row: 6, column: 6 })).toBe("$B6*E$4");
    expect(slideFormula("SUM(A:A,1:2)", { row: 1, column: 1 }, { row: 2, column: 2 })).toBe("SUM(B:B,2:3)");
  });

  test("never moves text in quotes, function names or quoted sheet names that look like references", () => {
    expect(slideFormula(`_xldudf_LW_RULESET("en1990-equ")&LOG10(A1)&'AB1'!A1`, { row: 1, column: 1 }, { row: 3, column: 2 })).toBe(`_xldudf_LW_RULESET("en1990-equ")&LOG10(B3)&'AB1'!B3`);
  });
});
