/**
 * The cautions every surface carries (docs/design.md, "Cautions"): in full
 * where there is room (the task pane, the README), in a short form where a
 * line or a cell must hold them (the command line, LW.RULESET), and in a
 * compact form of a few words each, joined into the one line the task pane
 * keeps in view above every view (it opens the full text).
 */

export interface Caution {
  full: string;
  short: string;
  compact: string;
}

export const CAUTIONS: readonly Caution[] = [
  {
    full: "Load combinations decide whether a structure stands. Every result must be reviewed by a qualified, licensed engineer before it is used in a design.",
    short: "Results must be reviewed by a qualified, licensed engineer before they are used in a design.",
    compact: "Review by a licensed engineer",
  },
  {
    full: "The adopted code edition and its local amendments govern; Loadwright's rulesets do not replace them.",
    short: "The adopted code edition and its local amendments govern; a ruleset does not replace them.",
    compact: "adopted code governs",
  },
  {
    full: "Shipped rulesets must be checked against the standard before use. A ruleset whose factors are known only from memory is marked UNVERIFIED wherever it is shown or used, with what exactly is from memory.",
    short: "Shipped rulesets must be verified against the standard before use; an UNVERIFIED ruleset has factors from memory.",
    compact: "verify rulesets",
  },
];

/** The cautions in full, one a paragraph. */
export function fullCautions(): string[] {
  return CAUTIONS.map((c) => c.full);
}

/** The cautions in their short form, one a line. */
export function shortCautions(): string[] {
  return CAUTIONS.map((c) => c.short);
}

/** Every caution in one line, for a single cell. */
export function cautionLine(): string {
  return shortCautions().join(" ");
}

/** Every caution in a few words, one line: "Review by a licensed engineer; adopted code governs; verify rulesets". */
export function compactCautionLine(): string {
  return CAUTIONS.map((c) => c.compact).join("; ");
}
