/**
 * A stored ruleset's standing against the firm library, as docs/firm-library.md
 * ("Standing") defines it: by id and fingerprint, the copy's own approval block
 * aside. Libraries hand-made from shipped rulesets with invented approvals.
 */
import { describe, expect, test } from "vitest";
import { fingerprintOf, isLibraryApproved, loadFirmLibrary, STANDING_WORDS, STANDINGS, standingOf, standingSentence, type FirmLibrary, type RulesetFile } from "../../../src/core/index.js";
import { approved, libraryOf, revised, shipped } from "./libraryFiles.js";

const v1 = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2025-06-30");
const v2 = approved(revised(v1, "1.0.1"), "B. Approver (invented)", "2026-02-27");
const equ = approved(shipped("en1990-equ"), "A. Approver (invented)", "2026-01-05");

function library(): FirmLibrary {
  const result = loadFirmLibrary(libraryOf([v1, v2, equ]));
  if (!result.ok) throw new Error(JSON.stringify(result.problems));
  return result.value;
}

const judge = (file: RulesetFile) => standingOf(library(), file.id, fingerprintOf(file));

describe("standingOf", () => {
  test("the library's current version is 'same', with or without the copy's own approval", () => {
    for (const copy of [v2, { ...v2, approval: { approvedBy: null, date: null, fingerprint: null } }]) {
      const s = judge(copy);
      expect(s.standing).toBe("same");
      expect(s.matched?.date).toBe("2026-02-27");
      expect(isLibraryApproved(s)).toBe(true);
    }
  });

  test("a version the library has superseded is 'library-newer', naming both versions", () => {
    const s = judge(v1);
    expect(s.standing).toBe("library-newer");
    expect([s.matched?.date, s.current?.date]).toEqual(["2025-06-30", "2026-02-27"]);
    expect(isLibraryApproved(s)).toBe(false);
    expect(standingSentence(s)).toBe(
      `LIBRARY HAS NEWER: this is the superseded version ${v1.version} approved by A. Approver (invented) on 2025-06-30 (fingerprint ${fingerprintOf(v1).slice(0, 12)}); ` +
        `the library's current one is version 1.0.1 approved by B. Approver (invented) on 2026-02-27 (fingerprint ${fingerprintOf(v2).slice(0, 12)})`,
    );
  });

  test("content the library never held is 'changed-locally', even with an approval of its own dated after the library's", () => {
    const edited = approved(revised(v2, "1.0.2-local"), "D. Someone (invented)", "2026-05-01");
    const s = judge(edited);
    expect(s.standing).toBe("changed-locally");
    expect(s.matched).toBeNull();
    expect(isLibraryApproved(s)).toBe(false);
    expect(standingSentence(s)).toMatch(/^CHANGED LOCALLY: fingerprint [0-9a-f]{12} matches no version of "asce7-16-strength" in the library; its current one is version 1\.0\.1 /);
  });

  test("an id the library does not hold is 'not-in-library'", () => {
    const s = judge(shipped("nbcc2020-uls"));
    expect(s.standing).toBe("not-in-library");
    expect(isLibraryApproved(s)).toBe(false);
    expect(standingSentence(s)).toBe('not in library: the library holds no ruleset "nbcc2020-uls"');
  });

  test("a shipped ruleset's own content is 'same' where the library approved it unchanged", () => {
    const s = judge(shipped("en1990-equ"));
    expect(s.standing).toBe("same");
  });

  test("has a short and a long word for every standing, the ones needing action in capitals", () => {
    expect(Object.keys(STANDING_WORDS).sort()).toEqual([...STANDINGS].sort());
    for (const standing of STANDINGS) expect(STANDING_WORDS[standing].long.length).toBeGreaterThan(STANDING_WORDS[standing].short.length);
    expect(STANDING_WORDS["library-newer"].short).toBe("LIBRARY HAS NEWER");
    expect(STANDING_WORDS["changed-locally"].short).toBe("CHANGED LOCALLY");
  });
});
