/**
 * How much of a ruleset its sources vouch for: how many combinations a
 * confirmed source lists, and what each from-memory source leaves to be
 * verified. The task pane, LW.RULESET and `loadwright rulesets` word it here.
 */
import type { ProvenanceFile, RulesetFile } from "../ruleset/schema.js";
import type { CombinationCoverage } from "../ruleset/status.js";

/** "5 of 7 combinations confirmed; not confirmed: 3, 4". */
export function coverageText(coverage: CombinationCoverage): string {
  const head = `${coverage.confirmed} of ${coverage.total} ${coverage.total === 1 ? "combination" : "combinations"} confirmed`;
  return coverage.unconfirmed.length === 0 ? head : `${head}; not confirmed: ${coverage.unconfirmed.join(", ")}`;
}

/** Introduces the list of what is from memory, wherever it is shown. */
export const FROM_MEMORY_LEAD = "UNVERIFIED: its provenance marks these sources as from memory — verify them against the standard before use:";

/** One from-memory source: "ASCE/SEI 7-16 §2.3.6 (numbering, Eh = rho*QE)", with the combinations it leaves open. */
export function fromMemoryText(entry: ProvenanceFile): string {
  const combinations = entry.combinations && entry.combinations.length > 0 ? `; combinations ${entry.combinations.join(", ")}` : "";
  return `${entry.source} (${entry.covers}${combinations})`;
}

/** What remains from memory, one text per from-memory source, in provenance order. */
export function fromMemoryTexts(file: RulesetFile): string[] {
  return file.provenance.filter((p) => p.status === "from-memory").map(fromMemoryText);
}
