import { describe, expect, test } from "vitest";
import { rulesetFile } from "../../support/rulesetFile.js";
import { approveRuleset, compareRulesets, describeProblem, loadRuleset, rulesetStatus, withoutApproval, type RulesetFile } from "../../../src/core/index.js";

/** ASCE/SEI 7-16 §2.3.1 (2) and (3) [list confirmed for the 7-10 text]. */
function base(): RulesetFile {
  return rulesetFile({
    id: "firm-strength",
    title: "Firm strength list",
    standard: { name: "ASCE/SEI 7", edition: "2016" },
    version: "1",
    symbols: {
      D: { description: "dead load", permanence: "permanent" },
      L: { description: "live load", permanence: "transient" },
      S: { description: "snow load", permanence: "transient" },
      W: { description: "wind load", permanence: "transient", reversible: true },
    },
    parameters: { fL: { type: "number", description: "factor on L", default: 1, allowed: [0.5, 1] } },
    combinations: [
      { id: "2", expression: "1.2D + 1.6L! + 0.5S!", clause: "§2.3.1 (2)" },
      { id: "3", expression: "1.2D + 1.6S! + (fL*L or 0.5W)!", clause: "§2.3.1 (3)" },
    ],
    provenance: [{ source: "ASCE/SEI 7-16 §2.3.1", status: "confirmed", covers: "all" }],
  });

}

function load(file: RulesetFile) {
  const r = loadRuleset(file);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

describe("compareRulesets", () => {
  test("finds nothing between a ruleset and itself", () => {
    const c = compareRulesets(load(base()), load(base()));
    expect(c.same).toBe(true);
    expect([c.identity, c.symbols, c.parameters, c.combinations]).toEqual([[], [], [], []]);
  });

  test("names a changed factor and the concrete rows it changes", () => {
    const after = base();
    after.version = "2";
    after.combinations[0].expression = "1.2D + 1.6L! + 0.5S! + 0.5W!";
    const c = compareRulesets(load(base()), load(after));
    expect(c.same).toBe(false);
    expect(c.identity).toEqual([{ field: "version", before: '"1"', after: '"2"' }]);
    expect(c.combinations).toEqual([
      {
        name: "2",
        change: "changed",
        details: ['expression: "1.2D + 1.6L! + 0.5S!" → "1.2D + 1.6L! + 0.5S! + 0.5W!"'],
        rowsOnlyBefore: ["D 1.2, L 1.6, S 0.5"],
        rowsOnlyAfter: ["D 1.2, L 1.6, S 0.5, W 0.5", "D 1.2, L 1.6, S 0.5, W -0.5"],
      },
    ]);
  });

  test("says when a rewritten expression gives the same rows", () => {
    const after = base();
    after.combinations[0].expression = "1.2*D + 1.6*L! + 0.5*S!";
    const c = compareRulesets(load(base()), load(after));
    expect(c.combinations[0].details).toEqual(['expression: "1.2D + 1.6L! + 0.5S!" → "1.2*D + 1.6*L! + 0.5*S!"', "the concrete rows are the same"]);
  });

  test("finds a changed parameter default through the rows it changes", () => {
    const after = base();
    after.parameters = { fL: { type: "number", description: "factor on L", default: 0.5, allowed: [0.5, 1] } };
    const c = compareRulesets(load(base()), load(after));
    expect(c.parameters).toEqual([{ name: "fL", change: "changed", details: ["default: 1 → 0.5"] }]);
    expect(c.combinations.map((x) => [x.name, x.rowsOnlyBefore, x.rowsOnlyAfter])).toEqual([["3", ["D 1.2, L 1, S 1.6"], ["D 1.2, L 0.5, S 1.6"]]]);
  });

  test("forms rows for parameters given, and says why it cannot where a parameter without default is not", () => {
    const withSds = (sdsDefault?: number) => {
      const f = base();
      f.parameters = { SDS: sdsDefault === undefined ? { type: "number", description: "SDS" } : { type: "number", description: "SDS", default: sdsDefault } };
      f.symbols = { ...f.symbols, E: { description: "earthquake", permanence: "transient", reversible: true } };
      // ASCE/SEI 7-16 §2.3.6 (7) form [confirmed]: (0.9 − 0.2·SDS)D + ρQE, here with ρ = 1.
      f.combinations = [{ id: "7", expression: "(0.9 - 0.2*SDS)D + E!", clause: "§2.3.6 (7)" }];
      return load(f);
    };
    const unformed = compareRulesets(withSds(), withSds());
    expect(unformed.rowProblems.before.map((p) => p.message)).toEqual(["parameter SDS has no default; give its value (SDS)"]);
    expect(unformed.combinations).toEqual([]);
    // A default changed from 1.0 to 1.5, text unchanged: 0.9 − 0.2·1.0 = 0.7 on D before, 0.9 − 0.2·1.5 = 0.6 after.
    const changed = compareRulesets(withSds(1.0), withSds(1.5));
    expect(changed.combinations.map((x) => [x.name, x.details, x.rowsOnlyBefore, x.rowsOnlyAfter])).toEqual([
      ["7", ["the text is the same; the concrete rows differ (a symbol or a parameter changed)"], ["D 0.7, E 1", "D 0.7, E -1"], ["D 0.6, E 1", "D 0.6, E -1"]],
    ]);
    // A value given applies to each side that declares it: with SDS = 1.0 for both, the rows agree.
    expect(compareRulesets(withSds(), withSds(1.5), { parameters: { SDS: 1.0 } }).combinations).toEqual([]);
  });

  test("lists notes added and removed rather than the whole list", () => {
    const before = { ...base(), notes: ["kept", "old"] };
    const after = { ...base(), notes: ["kept", "new"] };
    expect(compareRulesets(load(before), load(after)).notes).toEqual([
      { field: "note removed", before: "old", after: "" },
      { field: "note added", before: "", after: "new" },
    ]);
  });

  test("lists added and removed combinations and symbols", () => {
    const after = base();
    after.combinations = [after.combinations[0], { id: "1", expression: "1.4D", clause: "§2.3.1 (1)" }];
    delete (after.symbols as Record<string, unknown>).W;
    after.combinations[0].expression = "1.2D + 1.6L! + 0.5S!";
    const c = compareRulesets(load(base()), load(after));
    expect(c.symbols.map((s) => [s.name, s.change])).toEqual([["W", "removed"]]);
    expect(c.combinations.map((x) => [x.name, x.change])).toEqual([
      ["3", "removed"],
      ["1", "added"],
    ]);
  });
});

describe("approveRuleset", () => {
  test("records who, when and the fingerprint of what was approved", () => {
    const approved = approveRuleset(base(), " A. Checker ", "2026-11-30");
    expect(approved.ok).toBe(true);
    if (!approved.ok) return;
    expect(approved.value.approval.approvedBy).toBe("A. Checker");
    expect(rulesetStatus(load(approved.value)).approval).toBe("approved");
    // An edit afterwards voids it; clearing the approval marks the copy as not approved.
    const edited = { ...approved.value, version: "1a" };
    expect(rulesetStatus(load(edited)).approval).toBe("changed-since-approval");
    expect(rulesetStatus(load(withoutApproval(edited))).approval).toBe("not-approved");
  });

  test("requires a name and a date written YYYY-MM-DD", () => {
    const r1 = approveRuleset(base(), "  ", "2026-11-30");
    const r2 = approveRuleset(base(), "A. Checker", "30/11/2026");
    const r3 = approveRuleset(base(), "A. Checker", "2026-02-30");
    expect([r1, r2, r3].map((r) => (r.ok ? "" : describeProblem(r.problems[0])))).toEqual([
      "approval.approvedBy: give the name of the person approving",
      'approval.date: "30/11/2026" is not a date written YYYY-MM-DD',
      'approval.date: "2026-02-30" is not a date written YYYY-MM-DD',
    ]);
  });

  test("does not change the file it approves", () => {
    const file = base();
    approveRuleset(file, "A. Checker", "2026-11-30");
    expect(file.approval.approvedBy).toBeNull();
  });
});
