import { createHash } from "node:crypto";
import { describe, expect, test } from "vitest";
import { fingerprintOf, loadRuleset, rulesetFromRows, rulesetStatus, RULESET_FORMAT, type RulesetFile } from "../../../src/core/index.js";

function tiny(): RulesetFile {
  return {
    format: RULESET_FORMAT,
    id: "fp",
    title: "T",
    standard: { name: "N", edition: "1" },
    version: "1",
    symbols: { D: { description: "d", permanence: "permanent" } },
    parameters: { fL: { type: "number", description: "f", default: 1.0 } },
    combinations: [{ id: "1", expression: "1.4D", clause: "c" }],
    provenance: [{ source: "s", status: "confirmed", covers: "all" }],
    approval: { approvedBy: null, date: null, fingerprint: null },
  };
}

function loaded(file: RulesetFile) {
  const r = loadRuleset(file);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

describe("fingerprintOf", () => {
  test("is the SHA-256 of the RFC 8785 canonical JSON without the approval block", () => {
    // Canonical form typed by hand per RFC 8785 §3.2: members sorted by key (UTF-16 code units),
    // no white space, 1.0 written as 1. Hash by Node's crypto module as the reference implementation.
    const canonical =
      '{"combinations":[{"clause":"c","expression":"1.4D","id":"1"}],"format":"loadwright-ruleset/1","id":"fp",' +
      '"parameters":{"fL":{"default":1,"description":"f","type":"number"}},"provenance":[{"covers":"all","source":"s","status":"confirmed"}],' +
      '"standard":{"edition":"1","name":"N"},"symbols":{"D":{"description":"d","permanence":"permanent"}},"title":"T","version":"1"}';
    const expected = createHash("sha256").update(canonical, "utf8").digest("hex");
    expect(fingerprintOf(tiny())).toBe(expected);
  });

  test("does not depend on the order of fields or on the approval", () => {
    const a = tiny();
    const b = JSON.parse(JSON.stringify(a)) as RulesetFile;
    const reordered = Object.fromEntries(Object.entries(b).reverse()) as RulesetFile;
    reordered.approval = { approvedBy: "A. Checker", date: "2026-11-30", fingerprint: "x" };
    expect(fingerprintOf(reordered)).toBe(fingerprintOf(a));
  });

  test("changes with any change of content", () => {
    const changed = tiny();
    changed.combinations[0].expression = "1.40D";
    expect(fingerprintOf(changed)).not.toBe(fingerprintOf(tiny()));
  });
});

describe("rulesetStatus", () => {
  test("marks a ruleset with a from-memory source as unverified, and says so", () => {
    const file = tiny();
    file.provenance.push({ source: "recalled list", status: "from-memory", covers: "combination 1" });
    const status = rulesetStatus(loaded(file));
    expect(status.verification).toBe("unverified");
    expect(status.summary).toContain("UNVERIFIED");
    expect(status.fromMemory).toEqual(["recalled list (combination 1)"]);
  });

  test("shows an approval as holding only while the fingerprint matches", () => {
    const file = tiny();
    const print = fingerprintOf(file);
    file.approval = { approvedBy: "A. Checker", date: "2026-11-30", fingerprint: print };
    const approved = rulesetStatus(loaded(file));
    expect([approved.verification, approved.approval]).toEqual(["checked", "approved"]);
    expect(approved.summary).toContain("approved by A. Checker on 2026-11-30");

    file.combinations[0].expression = "1.2D";
    const changed = rulesetStatus(loaded(file));
    expect(changed.approval).toBe("changed-since-approval");
    expect(changed.summary).toContain("APPROVAL VOID: CHANGED since approval by A. Checker");
  });

  test("shows a list typed in cells as the user's own, not checked", () => {
    const typed = rulesetFromRows([["1", "1.4D", "c"]]);
    if (!typed.ok) throw new Error("refused");
    expect(rulesetStatus(typed.value).verification).toBe("user");
  });

  test("counts a combination as confirmed only where a confirmed source lists it and no from-memory one does", () => {
    const file = tiny();
    file.combinations.push({ id: "2", expression: "1.2D", clause: "c" }, { id: "3", expression: "0.9D", clause: "c" });
    file.provenance = [
      { source: "public text", locator: "a title, a body, an address, a clause", status: "confirmed", covers: "1 and 2", combinations: ["1", "2"] },
      { source: "recalled", status: "from-memory", covers: "the numbering of 2", combinations: ["2"] },
    ];
    // 1: confirmed only; 2: confirmed but left open by a from-memory entry; 3: named by no source.
    expect(rulesetStatus(loaded(file)).combinations).toEqual({ total: 3, confirmed: 1, unconfirmed: ["2", "3"] });
  });

  test("refuses a provenance entry that names a combination the ruleset does not have", () => {
    const file = tiny();
    file.provenance[0].combinations = ["1", "9"];
    const result = loadRuleset(file);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map((p) => [p.place.path, p.message])).toEqual([
      [["provenance", 0, "combinations", 1], 'names combination "9", which this ruleset does not have (combinations: 1)'],
    ]);
  });

  test("gives a 12-digit short fingerprint for a calculation stamp", () => {
    const status = rulesetStatus(loaded(tiny()));
    expect(status.shortFingerprint).toBe(status.fingerprint.slice(0, 12));
    expect(status.fingerprint).toMatch(/^[0-9a-f]{64}$/);
  });
});
