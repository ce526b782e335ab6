/**
 * The shipped NBCC 2020 ruleset held against Table 4.1.3.2.-A as shared/REFERENCES.md
 * recalls it: the load factors are [memory]; the rules on companion loads at zero,
 * 0.9D and the storage-area companion live load are [confirmed, a provincial code].
 */
import { describe, expect, test } from "vitest";
import { allRows, expectPrintedRows, mayBeAbsent, rowText, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const CASES = ["D", "L", "S", "W", "E"];

describe("nbcc2020-uls", () => {
  const ruleset = shipped("nbcc2020-uls");

  test("expands to load cases 1 to 5 with 1.25D or 0.9D and one companion at a time", () => {
    // NBCC 2020 Table 4.1.3.2.-A [memory for the factors]; 0.9D where dead load resists [confirmed].
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
    // NBCC 2020 Article 4.1.3.2. [confirmed, a provincial code]: principal loads with companion loads at zero.
    const labels = allRows(planWith(ruleset, { cL: 0.5 }, CASES)).map(rowText);
    expect(labels).toContain("2: D 1.25, L 1.5");
    expect(labels).toContain("2: D 0.9, L 1.5");
    expect(labels).toContain("3: D 0.9, S 1.5");
    expect(labels).toContain("4: D 1.25, W 1.4");
    expect(labels).toContain("5: D 1, E 1");
  });

  test("takes the companion live load at 1.0 for storage and equipment areas", () => {
    // NBCC 2020 Table 4.1.3.2.-A note [confirmed, a provincial code]: 0.5L becomes 1.0L.
    const rows = printedRows(planWith(ruleset, { cL: 1.0 }, CASES));
    expect(rows.filter((r) => r.id === "4" && r.factors.L !== undefined).map((r) => r.factors.L)).toEqual([1.0, 1.0]);
    expect(rows.filter((r) => r.id === "5").map((r) => r.factors.L)).toEqual([1.0]);
  });

  test("lists which terms may be absent in each load case", () => {
    expect(mayBeAbsent(planWith(ruleset, {}, CASES))).toEqual({
      "1": [],
      "2": ["1.5L", "(1.0S or 0.4W)"],
      "3": ["1.5S", "(1.0L or 0.4W)"],
      "4": ["(cL*L or 0.5S)"],
      "5": ["cL*L", "0.25S"],
    });
  });
});
