import { describe, expect, test } from "vitest";
import { describeProblem, rulesetFromRows, type Cell } from "../../../src/core/index.js";

function problemsOf(rows: Cell[][]): string[] {
  const r = rulesetFromRows(rows);
  if (r.ok) throw new Error("accepted");
  return r.problems.map((p) => describeProblem(p));
}

describe("rulesetFromRows", () => {
  test("reads [id, expression, clause] rows, skipping a header row and blank rows", () => {
    const r = rulesetFromRows([
      ["id", "expression", "clause"],
      ["1", "1.4D", "ASCE/SEI 7-16 §2.3.1 (1)"],
      [null, null, null],
      ["2", "1.2D + 1.6L + 0.5(Lr or S or R)", "ASCE/SEI 7-16 §2.3.1 (2)"],
    ]);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.combinations.map((c) => [c.id, c.clause])).toEqual([
      ["1", "ASCE/SEI 7-16 §2.3.1 (1)"],
      ["2", "ASCE/SEI 7-16 §2.3.1 (2)"],
    ]);
    // Only the symbols the rows use, in the catalogue's order.
    expect(r.value.symbols.map((s) => s.name)).toEqual(["D", "L", "Lr", "S", "R"]);
    expect(r.value.origin).toBe("cells");
  });

  test("takes expressions alone, numbering them, and [id, expression] pairs", () => {
    const alone = rulesetFromRows([["1.4D"], ["1.2D + 1.6L"]]);
    const pairs = rulesetFromRows([["LC1", "1.4D"], ["LC2", "1.2D + 1.6L"]]);
    expect(alone.ok && alone.value.combinations.map((c) => c.id)).toEqual(["1", "2"]);
    expect(pairs.ok && pairs.value.combinations.map((c) => c.id)).toEqual(["LC1", "LC2"]);
    expect(pairs.ok && pairs.value.combinations[0].clause).toBe("(no clause given)");
  });

  test("treats other names in factors as parameters the user must give", () => {
    const r = rulesetFromRows([["6", "(1.2 + 0.2*SDS)D + rho*E! + L + 0.2S", "§2.3.6 (6)"]]);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.parameters.map((p) => p.name)).toEqual(["SDS", "rho"]);
    expect(r.value.parameters.every((p) => p.kind === "number" && p.default === undefined)).toBe(true);
    // E acts both ways in the catalogue (common practice (no source)).
    expect(r.value.symbolByName.get("E")?.reversible).toBe(true);
  });

  test("names the cell, combination and character of a bad expression", () => {
    expect(problemsOf([["1", "1.4D", "c"], ["2", "1.2D + 1.6Lx", "c"]])).toEqual([
      'combination "2", character 11, cell B2: "Lx" is not a load symbol of this ruleset, so nothing follows the factor (symbols: D, G, F, H, P, L, Lr, Q, S, R, T, W, Wt, Wi, Di, Fa, E, Ad, AEd)',
    ]);
  });

  test("names an empty id and a duplicate id by their cells", () => {
    expect(problemsOf([["", "1.4D", "c"]])).toEqual(["cell A1: the combination id is empty"]);
    expect(problemsOf([["1", "1.4D", "c"], ["1", "1.2D", "c"]])).toEqual(['combination "1", cell B2: combination id "1" is already used by combinations[0]']);
  });

  test("refuses a range of more than three columns", () => {
    expect(problemsOf([["1", "1.4D", "c", "x"]])).toEqual(["a ruleset range has 1 to 3 columns ([id, expression, clause]); this one has 4"]);
  });
});
