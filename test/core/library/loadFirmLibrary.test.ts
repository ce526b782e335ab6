/**
 * The firm library file (docs/firm-library.md, "The library file"): it loads
 * only whole — every ruleset loads, every one is approved for exactly its
 * content, no content is listed twice, one current version per id — and each
 * refusal names its place by JSON path (and line and column where the text
 * itself is wrong). The libraries are hand-made from shipped rulesets with
 * approvals by invented people on invented days.
 */
import { createHash } from "node:crypto";
import { describe, expect, test } from "vitest";
import { describeProblem, loadFirmLibrary, MAX_FIRM_LIBRARY_CHARACTERS, type RulesetFile } from "../../../src/core/index.js";
import { approved, libraryOf, revised, shipped } from "./libraryFiles.js";

function problemsOf(input: unknown): string[] {
  const result = loadFirmLibrary(input);
  if (result.ok) throw new Error("the library loaded");
  return result.problems.map((p) => describeProblem(p));
}

function loaded(input: unknown) {
  const result = loadFirmLibrary(input);
  if (!result.ok) throw new Error(result.problems.map((p) => describeProblem(p)).join("\n"));
  return result.value;
}

/**
 * RFC 8785 (JSON Canonicalization Scheme, IETF, https://www.rfc-editor.org/rfc/rfc8785, §3.2) for
 * the values a ruleset holds — members sorted by key, no white space, strings and numbers as
 * ECMAScript writes them — hashed with SHA-256 (FIPS 180-4) by Node's crypto module: the
 * fingerprint as docs/rulesets.md defines it, computed without the project's code.
 */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value !== null && typeof value === "object") {
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  }
  return JSON.stringify(value);
}

function independentFingerprint(file: RulesetFile): string {
  const { approval: _approval, ...content } = file;
  return createHash("sha256").update(canonical(content), "utf8").digest("hex");
}

describe("loadFirmLibrary", () => {
  test("loads a library of approved rulesets, from text and from an object alike", () => {
    const file = libraryOf([approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27"), approved(shipped("en1990-str-6.10"), "B. Approver (invented)", "2026-03-01")]);
    for (const input of [file, JSON.stringify(file, null, 2)]) {
      const library = loaded(input);
      expect([library.title, library.owner, library.date]).toEqual(["Invented Engineers: approved load combinations", "Invented Engineers, technical director", "2026-03-02"]);
      expect(library.entries.map((e) => [e.ruleset.file.id, e.approvedBy, e.date, e.current])).toEqual([
        ["asce7-16-strength", "A. Approver (invented)", "2026-02-27", true],
        ["en1990-str-6.10", "B. Approver (invented)", "2026-03-01", true],
      ]);
    }
  });

  test("accepts an approval written by hand with the fingerprint computed independently (RFC 8785, SHA-256)", () => {
    const file = shipped("nbcc2020-uls");
    file.approval = { approvedBy: "C. Approver (invented)", date: "2026-01-15", fingerprint: independentFingerprint(file) };
    expect(loaded(libraryOf([file])).entries[0].fingerprint).toBe(independentFingerprint(file));
  });

  test("takes the version approved last as current, wherever it stands in the file", () => {
    const v1 = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2025-06-30");
    const v2 = approved(revised(v1, "1.0.1"), "A. Approver (invented)", "2026-02-27");
    const library = loaded(libraryOf([v2, v1]));
    expect(library.entries.map((e) => [e.ruleset.file.version, e.current])).toEqual([
      ["1.0.1", true],
      [v1.version, false],
    ]);
  });

  test("names the line and column of a JSON syntax error", () => {
    expect(problemsOf('{\n  "format": "loadwright-library/1",\n  "title": oops\n}')).toEqual(["not valid JSON: unexpected text at line 3, column 12"]);
  });

  test("refuses a field written twice, which JSON.parse would silently keep the last of", () => {
    const text = '{"format": "loadwright-library/1",\n "owner": "a",\n "owner": "b"}';
    expect(problemsOf(text)).toEqual(['owner: field "owner" is written twice in one object (line 3, column 2); JSON keeps only the last, so say which is meant']);
  });

  test("refuses unknown fields, a wrong format, a missing owner and a date that is not a day of the calendar", () => {
    // 2026 is not a leap year: February has 28 days (Gregorian calendar; common practice (no source)).
    const file = { ...libraryOf([approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27")]), date: "2026-02-30", titel: "x" } as Record<string, unknown>;
    file.format = "loadwright-library/2";
    delete file.owner;
    expect(problemsOf(file).sort()).toEqual(
      [
        'format: must be "loadwright-library/1", not the text "loadwright-library/2"',
        "owner: is required (text)",
        "date: must be a date written YYYY-MM-DD (a day of the calendar)",
        'titel: unknown field "titel"; did you mean "title"?',
      ].sort(),
    );
  });

  test("refuses a ruleset that does not load, with the ruleset loader's path under rulesets[i]", () => {
    const broken = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27");
    broken.combinations = [{ ...broken.combinations[0], expression: "1.2D + 1.6Lx" }, ...broken.combinations.slice(1)];
    const [first] = problemsOf(libraryOf([broken]));
    expect(first).toMatch(/^rulesets\[0\]\.combinations\[0\]\.expression, combination "1", character \d+: unknown name "Lx"/);
  });

  test("refuses a ruleset that is not approved", () => {
    const file = libraryOf([approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27"), shipped("en1990-equ")]);
    expect(problemsOf(file)).toEqual([
      'rulesets[1].approval.fingerprint: ruleset "en1990-equ" is not approved; a library holds only approved rulesets (approve it first: the approval records its fingerprint)',
    ]);
  });

  test("refuses a ruleset changed after its approval, naming both fingerprints", () => {
    const file = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27");
    const changed = { ...file, combinations: [{ ...file.combinations[0], expression: "1.4D + 1.6L" }, ...file.combinations.slice(1)] };
    const [message] = problemsOf(libraryOf([changed]));
    expect(message).toBe(
      `rulesets[0].approval.fingerprint: the approval of "asce7-16-strength" was given to other content (fingerprint ${independentFingerprint(file).slice(0, 12)}…); ` +
        `this content's fingerprint is ${independentFingerprint(changed).slice(0, 12)}…, so it changed after approval: approve this content, or put back what was approved`,
    );
  });

  test("refuses an approval without a name or with a date that is not a day", () => {
    const file = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27");
    file.approval = { ...file.approval, approvedBy: " ", date: "2026-04-31" }; // April has 30 days (Gregorian calendar; common practice (no source))
    expect(problemsOf(libraryOf([file]))).toEqual([
      'rulesets[0].approval.approvedBy: the approval of "asce7-16-strength" names no one: give the name of the person who approved it',
      'rulesets[0].approval.date: the approval of "asce7-16-strength" must carry its date written YYYY-MM-DD (a day of the calendar), not "2026-04-31"',
    ]);
  });

  test("refuses an approval dated after the library itself", () => {
    const file = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-03-03");
    expect(problemsOf(libraryOf([file], "2026-03-02"))).toEqual([
      'rulesets[0].approval.date: "asce7-16-strength" is approved on 2026-03-03, after the library\'s own date 2026-03-02; a library cannot list an approval given after it was published',
    ]);
  });

  test("refuses the same content listed twice, even with different approvals", () => {
    const a = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27");
    const b = approved(shipped("asce7-16-strength"), "B. Approver (invented)", "2026-03-01");
    expect(problemsOf(libraryOf([a, b]))).toEqual([
      `rulesets[1]: the same content of "asce7-16-strength" (fingerprint ${independentFingerprint(a).slice(0, 12)}…) is listed twice (also at rulesets[0]); list each approved content once`,
    ]);
  });

  test("refuses two versions of one id approved on the same day: which one is current would hang on the file's order", () => {
    const v1 = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27");
    const v2 = approved(revised(v1, "1.0.1"), "A. Approver (invented)", "2026-02-27");
    expect(problemsOf(libraryOf([v1, v2]))).toEqual([
      'rulesets[1].approval.date: two versions of "asce7-16-strength" are approved on the same day 2026-02-27 (also at rulesets[0]), so the library cannot say which one is current; remove the superseded version, or approve the current one on a later day',
    ]);
  });

  test("refuses an empty list and a library larger than its stated limit", () => {
    expect(problemsOf(libraryOf([]))).toEqual(["rulesets: must list at least one approved ruleset"]);
    const big = JSON.stringify({ ...libraryOf([]), notes: ["x".repeat(MAX_FIRM_LIBRARY_CHARACTERS)] });
    expect(problemsOf(big)[0]).toMatch(/^the library holds 5,000,\d{3} characters, more than the 5,000,000 a library may hold/);
  });
});
