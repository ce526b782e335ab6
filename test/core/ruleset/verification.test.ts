/**
 * verificationOf: per combination, the sources that confirm it and what is left
 * open from memory, by the rule of docs/rulesets.md ("a combination counts as
 * confirmed where a confirmed source lists it and no from-memory one does").
 * The rulesets are invented for the test.
 */
import { describe, expect, test } from "vitest";
import { combinationCoverage, loadRuleset, rulesetFromRows, RULESET_FORMAT, shippedRulesets, verificationOf, type RulesetFile } from "../../../src/core/index.js";

function invented(): RulesetFile {
  return {
    format: RULESET_FORMAT,
    id: "invented",
    title: "Invented for the test",
    standard: { name: "N", edition: "1" },
    version: "1",
    symbols: { D: { description: "d", permanence: "permanent" } },
    combinations: [
      { id: "1", expression: "1.4D", clause: "c1" },
      { id: "2", expression: "1.2D", clause: "c2" },
      { id: "3", expression: "0.9D", clause: "c3" },
    ],
    provenance: [
      { source: "A", locator: "a public text, https://example.org/a", status: "confirmed", covers: "1 and 2", combinations: ["1", "2"] },
      { source: "B", status: "from-memory", covers: "the numbering of 2", combinations: ["2"] },
      { source: "C", locator: "another, https://example.org/c", status: "confirmed", covers: "2 again", combinations: ["2"] },
      { source: "D", status: "confirmed", covers: "a rule that names no combination" },
    ],
    approval: { approvedBy: null, date: null, fingerprint: null },
  };
}

function loaded(file: RulesetFile) {
  const r = loadRuleset(file);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

describe("verificationOf", () => {
  test("names, per combination, the sources confirming it and the ones leaving it open", () => {
    const v = verificationOf(loaded(invented()));
    const brief = v.combinations.map((c) => ({
      id: c.id,
      clause: c.clause,
      confirmedBy: c.confirmedBy.map((s) => s.entry.source),
      openBy: c.openBy.map((s) => s.entry.source),
      confirmed: c.confirmed,
    }));
    expect(brief).toEqual([
      { id: "1", clause: "c1", confirmedBy: ["A"], openBy: [], confirmed: true },
      { id: "2", clause: "c2", confirmedBy: ["A", "C"], openBy: ["B"], confirmed: false },
      { id: "3", clause: "c3", confirmedBy: [], openBy: [], confirmed: false },
    ]);
  });

  test("keeps each source's place in the provenance list, confirmed and from memory apart", () => {
    const v = verificationOf(loaded(invented()));
    expect(v.sources.map((s) => [s.index, s.entry.source])).toEqual([
      [0, "A"],
      [2, "C"],
      [3, "D"],
    ]);
    expect(v.fromMemory.map((s) => [s.index, s.entry.source])).toEqual([[1, "B"]]);
  });

  test("confirms nothing in a list typed in cells", () => {
    const typed = rulesetFromRows([["1", "1.4D", "c"]]);
    if (!typed.ok) throw new Error("refused");
    expect(verificationOf(typed.value).combinations.map((c) => c.confirmed)).toEqual([false]);
  });

  test.each(shippedRulesets().map((s) => [s.id, s.ruleset] as const))("agrees with the coverage count for %s", (_id, ruleset) => {
    const v = verificationOf(ruleset);
    const coverage = combinationCoverage(ruleset);
    expect(v.combinations.filter((c) => c.confirmed).length).toBe(coverage.confirmed);
    expect(v.combinations.filter((c) => !c.confirmed).map((c) => c.id)).toEqual(coverage.unconfirmed);
  });
});
