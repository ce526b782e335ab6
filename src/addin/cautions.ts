/** The cautions every surface shows (DESIGN.md, "Cautions"). One wording, shared by the pane and the formulas. */
export const CAUTIONS: readonly string[] = [
  "Load combinations decide whether a structure stands. Every result must be reviewed by a qualified, licensed engineer before it is used in a design.",
  "The adopted code edition and its local amendments govern; Loadwright's rulesets do not replace them.",
  "Shipped rulesets must be checked against the standard before use. A ruleset whose factors are known only from memory is marked UNVERIFIED wherever it is shown or used.",
];

/** One line for a formula's ruleset identity (LW.RULESET). */
export const CAUTION_LINE =
  "Results must be reviewed by a qualified, licensed engineer; the adopted code edition and local amendments govern; verify shipped rulesets against the standard.";
