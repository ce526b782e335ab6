import { describe, expect, test } from "vitest";
import { findShippedRuleset, loadRuleset, rulesetStatus, type Ruleset } from "../../src/core/index.js";
import type { Library, LibraryEntry } from "../../src/workbook/rulesetLibrary.js";
import { DEMO_RULESET } from "../../src/addin/demoRuleset.js";
import { checkDraft } from "../../src/taskpane/draftCheck.js";
import { draftOfCopy, draftOfNew, draftOfStored, newIdProblem } from "../../src/taskpane/openDraft.js";
import { storeConflicts } from "../../src/taskpane/storeConflicts.js";
import { independentFingerprint } from "./fingerprint.js";

const shippedEntry = (id: string): LibraryEntry => {
  const s = findShippedRuleset(id)!;
  return { id, source: "shipped", ruleset: s.ruleset, status: s.status, problem: null, shippedFingerprint: null };
};

const loaded = (file: unknown): Ruleset => {
  const r = loadRuleset(file);
  if (!r.ok) throw new Error("does not load");
  return r.value;
};

const storedEntry = (ruleset: Ruleset, shippedFingerprint: string | null = null): LibraryEntry => ({
  id: ruleset.file.id,
  source: "stored",
  ruleset,
  status: rulesetStatus(ruleset),
  problem: null,
  shippedFingerprint,
});

const APPROVED_DEMO = { ...DEMO_RULESET, approval: { approvedBy: "A. Checker", date: "2026-01-15", fingerprint: independentFingerprint(DEMO_RULESET) } };

describe("draftOfCopy", () => {
  test("gives the copy the new id, no approval, and a note naming what it was copied from, leaving the original as it was", () => {
    const entry = shippedEntry("asce7-16-strength");
    const before = JSON.stringify(entry.ruleset!.file);
    const draft = draftOfCopy(entry, "firm-asce", new Date("2026-05-04T10:00:00Z"));
    const file = JSON.parse(draft.text) as { id: string; approval: unknown; notes: string[] };
    expect(file.id).toBe("firm-asce");
    expect(file.approval).toEqual({ approvedBy: null, date: null, fingerprint: null });
    expect(file.notes.at(-1)).toBe(`Copy of asce7-16-strength 1.0.0 (shipped with Loadwright, fingerprint ${independentFingerprint(entry.ruleset!.file).slice(0, 12)}) made on 2026-05-04.`);
    expect(draft.base).toMatchObject({ kind: "shipped", id: "asce7-16-strength", fingerprint: independentFingerprint(entry.ruleset!.file) });
    expect(JSON.stringify(entry.ruleset!.file)).toBe(before);
    expect(checkDraft(draft.text, draft.base.approval).problems).toEqual([]);
  });
});

describe("draftOfStored", () => {
  test("opens the stored file unchanged, its approval kept, so its fingerprint and approval still hold", () => {
    const entry = storedEntry(loaded(APPROVED_DEMO));
    const draft = draftOfStored(entry);
    const check = checkDraft(draft.text, draft.base.approval);
    expect(check.status?.fingerprint).toBe(independentFingerprint(DEMO_RULESET));
    expect(check.status?.approval).toBe("approved");
  });
});

describe("newIdProblem", () => {
  const taken = new Set(["asce7-16-strength", "demo-invented"]);
  test.each([
    ["", "give the copy an id of its own"],
    ["Firm Copy", '"Firm Copy" is not a ruleset id: lower-case letters, digits, \'.\', \'_\' or \'-\', starting with a letter or digit'],
    ["asce7-16-strength", '"asce7-16-strength" already names a shipped or stored ruleset or an open draft; choose another id'],
    ["firm-asce7-16", null],
  ])("%j → %j", (id, expected) => {
    expect(newIdProblem(id, taken)).toBe(expected);
  });
});

describe("draftOfNew", () => {
  test("starts a ruleset that loads and is UNVERIFIED until its source is confirmed", () => {
    const draft = draftOfNew("firm-new");
    const check = checkDraft(draft.text, draft.base.approval);
    expect(check.problems).toEqual([]);
    expect(check.status?.verification).toBe("unverified");
  });
});

describe("storeConflicts", () => {
  const demo = loaded(DEMO_RULESET);
  const lib = (entries: LibraryEntry[]): Library => ({ entries, storeProblem: null });

  test("asks before replacing a different stored ruleset of the same id", () => {
    const draft = draftOfNew("demo-invented");
    const conflicts = storeConflicts(draft.base, demo, lib([storedEntry(demo)]), "this browser");
    expect(conflicts.confirm).toHaveLength(1);
    expect(conflicts.confirm[0]).toMatch(/^A different ruleset "demo-invented" is stored in this browser/);
  });

  test("asks before replacing a stored copy that changed after the draft was opened", () => {
    const draft = draftOfStored(storedEntry(demo));
    const newer = loaded({ ...DEMO_RULESET, version: "0.1.1" });
    const conflicts = storeConflicts(draft.base, demo, lib([storedEntry(newer)]), "this browser");
    expect(conflicts.confirm).toEqual([expect.stringMatching(/^The stored "demo-invented" changed after this draft was opened/)]);
  });

  test("needs no confirmation to store an edit of the stored ruleset it was opened from", () => {
    const draft = draftOfStored(storedEntry(demo));
    expect(storeConflicts(draft.base, loaded({ ...DEMO_RULESET, version: "0.2.0" }), lib([storedEntry(demo)]), "this browser")).toEqual({ confirm: [], info: [] });
  });

  test("asks before a stored ruleset stands in for a shipped one of the same id", () => {
    const shipped = findShippedRuleset("asce7-16-asd")!.ruleset;
    const draft = draftOfNew("x");
    expect(storeConflicts(draft.base, shipped, lib([]), "this workbook").confirm).toEqual([
      '"asce7-16-asd" is the id of a shipped ruleset; once stored, formulas naming "asce7-16-asd" in this workbook use this copy instead of the shipped one.',
    ]);
  });
});
