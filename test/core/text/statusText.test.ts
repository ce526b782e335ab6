/**
 * The catalogue's words for a ruleset's standing, as docs/design.md ("One
 * vocabulary") and docs/rulesets.md ("Rulesets") state them: the verification
 * word first (UNVERIFIED in capitals), the approval with who and when, and the
 * void approval in the three lengths the surfaces show.
 */
import { describe, expect, test } from "vitest";
import { approvalWords, statusText, VERIFICATION_WORDS, type Approval, type Verification } from "../../../src/core/index.js";

const RECORD = { approvedBy: "A. Checker (invented)", date: "2026-11-30" };

describe("statusText", () => {
  test.each([
    // docs/design.md, "One vocabulary": the word a narrow cell shows first, and whether it must stand out.
    ["checked", "Checked", false],
    ["unverified", "UNVERIFIED", true],
    ["user", "NOT CHECKED", true],
  ] as [Verification, string, boolean][])("words %s as %s", (verification, word, alarm) => {
    const text = statusText({ verification, approval: "not-approved" }, RECORD);
    expect(text.word).toBe(word);
    expect(text.alarm).toBe(alarm);
    expect(text.badge).toBe(alarm ? `⚠ ${word}` : word);
    // The sentence says the state in full and contains the advice that closes a stamp.
    expect(text.sentence).toContain(text.advice);
  });

  test("says UNVERIFIED in every form an unverified ruleset is shown in", () => {
    const text = statusText({ verification: "unverified", approval: "approved" }, RECORD);
    for (const form of [text.word, text.sentence, text.badge, text.listMark, text.banner ?? "", text.summary]) expect(form).toContain("UNVERIFIED");
  });

  test("gives a banner and a list mark only to an unverified ruleset", () => {
    for (const verification of ["checked", "user"] as Verification[]) {
      const text = statusText({ verification, approval: "not-approved" }, RECORD);
      expect(text.banner).toBeNull();
      expect(text.listMark).toBe("");
    }
  });

  test.each(["approved", "changed-since-approval", "not-approved"] as Approval[])("puts the verification before the approval (%s) in the summary", (approval) => {
    const text = statusText({ verification: "checked", approval }, RECORD);
    expect(text.summary).toBe(`${VERIFICATION_WORDS.checked.sentence}; ${text.approval.sentence}`);
  });
});

describe("approvalWords", () => {
  test("names who approved and when, in every length", () => {
    const words = approvalWords("approved", RECORD);
    for (const form of Object.values(words)) expect(form).toBe("approved by A. Checker (invented) on 2026-11-30");
  });

  test("says a changed content's approval is void in every length, naming the approval it voids", () => {
    const words = approvalWords("changed-since-approval", RECORD);
    for (const form of Object.values(words)) expect(form).toBe("APPROVAL VOID: CHANGED since approval by A. Checker (invented) on 2026-11-30");
  });

  test("says what an approval record lacks instead of leaving a gap", () => {
    expect(approvalWords("approved", { approvedBy: null, date: null }).cell).toBe("approved by (no name) on (no date)");
  });
});
