/**
 * The shipped NBCC 2020 ruleset. Its sources, cited by short name beside each check:
 *
 * [OBC] Ontario Building Code (O. Reg. 332/12 as amended), Division B, Article 4.1.3.2., Sentences (3)–(7), in
 *   the wording aligned with NBC 2015 — a provincial code that adopts the NBC's Part 4:
 *   https://codeindex.ca/article/4.1.8.13 (the page shows Article 4.1.3.2.). No public text of NBC 2020's own
 *   Article 4.1.3.2. or Table 4.1.3.2.-A was found: that 2020 keeps these rules is [memory].
 * [memory] The load factors of Table 4.1.3.2.-A, recalled; the ruleset is shipped UNVERIFIED for them.
 */
import { describe, expect, test } from "vitest";
import { allRows, expectPrintedRows, mayBeAbsent, rowText, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const CASES = ["D", "L", "S", "W", "E"];

describe("nbcc2020-uls", () => {
  const ruleset = shipped("nbcc2020-uls");

  test("expands to load cases 1 to 5 with 1.25D or 0.9D and one companion at a time", () => {
    // Table 4.1.3.2.-A [memory for the factors]; 0.9D in cases 2, 3, 4 and 1.0D in case 5 where dead load resists [OBC (5)].
    // cL = 0.5: not a storage or equipment area, so no companion live-load factor is raised [OBC (7)].
    const rows: FactorRow[] = [
      row("1", { D: 1.4 }), // case 1: 1.4D
      row("2", { D: 1.25, L: 1.5, S: 1.0 }), // case 2: (1.25D or 0.9D) + 1.5L, companion 1.0S or 0.4W
      row("2", { D: 1.25, L: 1.5, W: 0.4 }),
      row("2", { D: 0.9, L: 1.5, S: 1.0 }),
      row("2", { D: 0.9, L: 1.5, W: 0.4 }),
      row("3", { D: 1.25, S: 1.5, L: 1.0 }), // case 3: (1.25D or 0.9D) + 1.5S, companion 1.0L or 0.4W
      row("3", { D: 1.25, S: 1.5, W: 0.4 }),
      row("3", { D: 0.9, S: 1.5, L: 1.0 }),
      row("3", { D: 0.9, S: 1.5, W: 0.4 }),
      row("4", { D: 1.25, W: 1.4, L: 0.5 }), // case 4: (1.25D or 0.9D) + 1.4W, companion 0.5L or 0.5S
      row("4", { D: 1.25, W: 1.4, S: 0.5 }),
      row("4", { D: 0.9, W: 1.4, L: 0.5 }),
      row("4", { D: 0.9, W: 1.4, S: 0.5 }),
      row("5", { D: 1.0, E: 1.0, L: 0.5, S: 0.25 }), // case 5: 1.0D + 1.0E, companions 0.5L + 0.25S
    ];
    expectPrintedRows(planWith(ruleset, { cL: 0.5 }, CASES), rows);
  });

  test("also checks each principal load with its companion loads at zero", () => {
    // [OBC (3)]: "the principal loads acting with the companion loads taken as zero".
    const labels = allRows(planWith(ruleset, { cL: 0.5 }, CASES)).map(rowText);
    expect(labels).toContain("2: D 1.25, L 1.5");
    expect(labels).toContain("2: D 0.9, L 1.5");
    expect(labels).toContain("3: D 0.9, S 1.5");
    expect(labels).toContain("4: D 1.25, W 1.4");
    expect(labels).toContain("5: D 1, E 1");
  });

  test("keeps 1.0D in load case 5, also where the dead load resists", () => {
    // [OBC (5)]: the counteracting factored dead load is 1.0D in load combination case 5.
    const dead = allRows(planWith(ruleset, { cL: 0.5 }, CASES)).filter((r) => r.id === "5").map((r) => r.factors.D);
    expect(new Set(dead)).toEqual(new Set([1.0]));
  });

  test("raises every companion live-load factor by 0.5 for storage and equipment areas", () => {
    // [OBC (7)]: "The companion-load factor for live loads, L ... shall be increased by 0.5 for storage areas and for
    // equipment areas and service rooms". By hand: case 3 1.0 + 0.5 = 1.5L; cases 4 and 5 0.5 + 0.5 = 1.0L.
    const rows = printedRows(planWith(ruleset, { cL: 1.0 }, CASES));
    expect(rows.filter((r) => r.id === "3" && r.factors.L !== undefined).map((r) => r.factors.L)).toEqual([1.5, 1.5]);
    expect(rows.filter((r) => r.id === "4" && r.factors.L !== undefined).map((r) => r.factors.L)).toEqual([1.0, 1.0]);
    expect(rows.filter((r) => r.id === "5").map((r) => r.factors.L)).toEqual([1.0]);
  });

  test("defaults to the storage-area companion factors, which never understate", () => {
    // cL's default 1.0 is the larger of its two allowed values (docs/shipped-rulesets.md: defaults never understate).
    const byDefault = printedRows(planWith(ruleset, {}, CASES)).map(rowText).sort();
    expect(byDefault).toEqual(printedRows(planWith(ruleset, { cL: 1.0 }, CASES)).map(rowText).sort());
  });

  test("lists which terms may be absent in each load case", () => {
    // [OBC (3)] and the ruleset's notes: principal L and S and every companion may be absent; W and E define their cases.
    expect(mayBeAbsent(planWith(ruleset, {}, CASES))).toEqual({
      "1": [],
      "2": ["1.5L", "(1.0S or 0.4W)"],
      "3": ["1.5S", "((cL + 0.5)*L or 0.4W)"],
      "4": ["(cL*L or 0.5S)"],
      "5": ["cL*L", "0.25S"],
    });
  });
});
