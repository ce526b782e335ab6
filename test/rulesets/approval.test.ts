/**
 * A firm's approval of its copy of a shipped ruleset: who, when, and the fingerprint
 * of what they approved. The fingerprint is checked against an independent reading
 * of its definition (docs/rulesets.md, "Rulesets"): SHA-256, by Node's crypto module, of the
 * RFC 8785 canonical JSON without the approval block, written out here by hand.
 */
import { createHash } from "node:crypto";
import { describe, expect, test } from "vitest";
import { approveRuleset, fingerprintOf, findShippedRuleset, loadRuleset, rulesetStatus, type RulesetFile } from "../../src/core/index.js";

/**
 * RFC 8785 for the values a ruleset holds: object members sorted by their keys' UTF-16 code units,
 * no white space, strings and numbers as ECMAScript's JSON.stringify writes them (RFC 8785 §3.2.2).
 */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value !== null && typeof value === "object") {
    const keys = Object.keys(value).sort();
    return `{${keys.map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(",")}}`;
  }
  return JSON.stringify(value);
}

function independentFingerprint(file: RulesetFile): string {
  const { approval: _approval, ...content } = file;
  return createHash("sha256").update(canonical(content), "utf8").digest("hex");
}

function copyOf(id: string): RulesetFile {
  const file = findShippedRuleset(id)?.ruleset.file;
  if (!file) throw new Error(id);
  return structuredClone(file) as RulesetFile;
}

function statusOf(file: RulesetFile) {
  const loaded = loadRuleset(file);
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.problems));
  return rulesetStatus(loaded.value);
}

describe("approving a shipped ruleset", () => {
  test.each(["asce7-16-strength", "en1990-str-6.10", "nbcc2020-uls"])("%s has the fingerprint its definition gives", (id) => {
    const file = copyOf(id);
    expect(fingerprintOf(file)).toBe(independentFingerprint(file));
    expect(findShippedRuleset(id)?.status.fingerprint).toBe(independentFingerprint(file));
  });

  test("marks the firm's copy approved, and still UNVERIFIED where its sources are recalled", () => {
    const approved = approveRuleset(copyOf("asce7-16-strength"), "A. Checker (invented)", "2026-11-30");
    if (!approved.ok) throw new Error(JSON.stringify(approved.problems));
    expect(approved.value.approval.fingerprint).toBe(independentFingerprint(approved.value));
    const status = statusOf(approved.value);
    expect(status.approval).toBe("approved");
    expect(status.verification).toBe("unverified");
    expect(status.summary).toBe(
      "UNVERIFIED: some factors are from memory; verify against the standard before use; approved by A. Checker (invented) on 2026-11-30",
    );
  });

  test("shows an approved copy whose factors were changed afterwards as no longer approved", () => {
    const approved = approveRuleset(copyOf("en1990-str-6.10"), "A. Checker (invented)", "2026-11-30");
    if (!approved.ok) throw new Error(JSON.stringify(approved.problems));
    const edited = structuredClone(approved.value);
    edited.combinations[0].expression = edited.combinations[0].expression.replace("1.35", "1.30");
    const status = statusOf(edited);
    expect(status.approval).toBe("changed-since-approval");
    expect(status.summary).toMatch(/APPROVAL VOID: CHANGED since approval by A\. Checker \(invented\) on 2026-11-30/);
  });
});
