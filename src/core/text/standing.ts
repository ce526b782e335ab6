/**
 * The words for a ruleset's standing against the firm library, in one place
 * for the command line and the task pane: a short word for a column or a
 * badge, a long one for a tooltip or a legend, and a sentence with the
 * library's own versions and approvals for the one ruleset at hand.
 */
import type { FirmLibraryEntry } from "../library/loadFirmLibrary.js";
import type { RulesetStanding, Standing } from "../library/rulesetStanding.js";
import { shortFingerprint } from "../ruleset/fingerprint.js";

export interface StandingWords {
  /** A few words; capitals where the standing needs action. */
  short: string;
  /** One sentence saying what it means. */
  long: string;
}

export const STANDING_WORDS: Record<Standing, StandingWords> = {
  same: {
    short: "same as library",
    long: "the firm library's current approved version: the same content (fingerprint)",
  },
  "library-newer": {
    short: "LIBRARY HAS NEWER",
    long: "a version the firm library has superseded: the library approved a later version of this ruleset since; take the library's version",
  },
  "changed-locally": {
    short: "CHANGED LOCALLY",
    long: "content the firm library does not hold: it matches no version of this ruleset in the library, so no approval of the library covers it",
  },
  "not-in-library": {
    short: "not in library",
    long: "the firm library holds no ruleset with this id, so no approval of the library covers it",
  },
};

function version(entry: FirmLibraryEntry): string {
  return `version ${entry.ruleset.file.version} approved by ${entry.approvedBy} on ${entry.date} (fingerprint ${shortFingerprint(entry.fingerprint)})`;
}

/** The standing of one ruleset in a sentence, naming the library versions it is judged against. */
export function standingSentence(s: RulesetStanding): string {
  const words = STANDING_WORDS[s.standing].short;
  switch (s.standing) {
    case "same":
      return `${words}: the library's current ${version(s.current)}`;
    case "library-newer":
      return `${words}: this is the superseded ${version(s.matched)}; the library's current one is ${version(s.current)}`;
    case "changed-locally":
      return `${words}: fingerprint ${shortFingerprint(s.fingerprint)} matches no version of "${s.id}" in the library; its current one is ${version(s.current)}`;
    case "not-in-library":
      return `${words}: the library holds no ruleset "${s.id}"`;
  }
}
