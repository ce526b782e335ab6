/**
 * The one "did you mean" policy (docs/design.md, "One vocabulary"): the same
 * letters in another case first, else the closest name within 0 edits for
 * names of one or two characters, 1 for three or four, 2 beyond. Edit distances
 * below are counted by hand (Levenshtein: insertions, deletions, substitutions).
 */
import { describe, expect, test } from "vitest";
import { didYouMean, nearest, NearestName, suggestionLimit } from "../../../src/core/index.js";

describe("nearest", () => {
  test("offers the same letters in another case before any closer spelling", () => {
    expect(nearest("sds", ["SD", "SDS"])).toBe("SDS");
  });

  test.each([
    // "rh0" → "rho": one substitution; three characters allow one edit.
    ["rh0", ["rho", "SDS"], "rho"],
    // "test-strenght" → "test-strength": two substitutions (h/g swapped); long names allow two.
    ["test-strenght", ["test-strength", "asce7-16-strength"], "test-strength"],
    // "Wx" → "W": one deletion, but two-character names allow none.
    ["Wx", ["W", "E"], undefined],
    // "psi9" → "psi0": one substitution within four characters.
    ["psi9", ["psi0", "psi1"], "psi0"],
    // "C1 botom" → "C1 bottom": one insertion.
    ["C1 botom", ["C1 top", "C1 bottom"], "C1 bottom"],
    // "column" → "C1 top": far more than two edits.
    ["column", ["C1 top", "C1 bottom"], undefined],
  ])("offers for %s among %j: %s", (typed, known, expected) => {
    expect(nearest(typed, known)).toBe(expected);
  });

  test("takes the first of equally close names", () => {
    // "psi2" is one substitution from both.
    expect(nearest("psi2", ["psi0", "psi1"])).toBe("psi0");
  });

  test("finds the same name one candidate at a time as from the whole list", () => {
    const known = ["C1 top", "C1 bottom", "c1 BOTTOM", "C2 top"];
    for (const typed of ["C1 botom", "c1 bottom", "C3 top", "x"]) {
      const finder = new NearestName(typed);
      for (const k of known) finder.consider(k);
      expect(finder.best, typed).toBe(nearest(typed, known));
    }
  });

  test("allows more edits for longer names", () => {
    expect([1, 2, 3, 4, 5, 12].map(suggestionLimit)).toEqual([0, 0, 1, 1, 2, 2]);
  });
});

describe("didYouMean", () => {
  test("words a suggestion, and says nothing without one", () => {
    expect(didYouMean("rho")).toBe('; did you mean "rho"?');
    expect(didYouMean(undefined)).toBe("");
  });
});
