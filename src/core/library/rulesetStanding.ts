/**
 * How a ruleset kept in a workbook stands against the firm library, judged by
 * its id and its fingerprint (the content, approval block aside):
 *
 * - `same`: the content of the library's current version of that id;
 * - `library-newer`: the content of a version the library lists as superseded
 *   (the library approved a later version of that id since);
 * - `changed-locally`: the library has that id, but no version with this content;
 * - `not-in-library`: the library has no ruleset with that id.
 *
 * The copy's own approval block plays no part: an unapproved copy with the
 * current content is `same`, and an approval given in a workbook to content
 * the library does not hold does not make it so.
 */
import type { FirmLibrary, FirmLibraryEntry } from "./loadFirmLibrary.js";

export const STANDINGS = ["same", "library-newer", "changed-locally", "not-in-library"] as const;
export type Standing = (typeof STANDINGS)[number];

interface Judged {
  id: string;
  fingerprint: string;
}

/**
 * `current` is the library's current version of the id; `matched` the library
 * version whose content this is (the current one for `same`, a superseded one
 * for `library-newer`).
 */
export type RulesetStanding =
  | (Judged & { standing: "same" | "library-newer"; current: FirmLibraryEntry; matched: FirmLibraryEntry })
  | (Judged & { standing: "changed-locally"; current: FirmLibraryEntry; matched: null })
  | (Judged & { standing: "not-in-library"; current: null; matched: null });

/** The library's current version of an id: the one approved last. */
export function currentVersion(library: FirmLibrary, id: string): FirmLibraryEntry | null {
  return library.entries.find((e) => e.current && e.ruleset.file.id === id) ?? null;
}

export function standingOf(library: FirmLibrary, id: string, fingerprint: string): RulesetStanding {
  const current = currentVersion(library, id);
  if (!current) return { standing: "not-in-library", id, fingerprint, current: null, matched: null };
  const matched = library.entries.find((e) => e.ruleset.file.id === id && e.fingerprint === fingerprint);
  if (!matched) return { standing: "changed-locally", id, fingerprint, current, matched: null };
  return { standing: matched.current ? "same" : "library-newer", id, fingerprint, current, matched };
}

/** Only the library's current version passes a check before issue. */
export function isLibraryApproved(standing: RulesetStanding): boolean {
  return standing.standing === "same";
}
