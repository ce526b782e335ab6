/**
 * A draft nested beyond the engine's JSON limit (pasted or typed into the text
 * view) is refused with its line and column, as every other problem is, and
 * the pane's own locating of problems in the text does not recurse into it.
 */
import { describe, expect, test } from "vitest";
import { checkDraft, EMPTY_APPROVAL } from "../../src/taskpane/draftCheck.js";
import { syntaxErrorSpot } from "../../src/taskpane/jsonLocate.js";

describe("a draft nested 100,000 deep", () => {
  // "{" is level 1; the 64th "[" (offset 10 + 63, column 74) is level 65, one beyond the limit of 64.
  const refusal = ["objects and lists are nested more than 64 deep at line 1, column 74"];

  test("is refused with its place when it is JSON", () => {
    const deep = `{"notes": ${"[".repeat(100_000)}${"]".repeat(100_000)}}`;
    const check = checkDraft(deep, EMPTY_APPROVAL);
    expect(check.ruleset).toBeNull();
    expect(check.problems.map((p) => p.full)).toEqual(refusal);
  });

  test("is refused with its place when it is not yet JSON", () => {
    const open = `{"notes": ${"[".repeat(100_000)}`;
    expect(checkDraft(open, EMPTY_APPROVAL).problems.map((p) => p.full)).toEqual(refusal);
    expect(syntaxErrorSpot(open)).toBeNull();
  });
});
