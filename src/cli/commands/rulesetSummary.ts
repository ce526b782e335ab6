/** What `loadwright rulesets` says of each shipped ruleset beyond its identity: the counts and what is from memory. */
import type { ShippedRuleset } from "../../core/index.js";
import { rulesetJson } from "../output/preamble.js";

/** "5 of 7 confirmed": the combinations a public source confirms and no recalled entry leaves open. */
export function confirmedText(s: ShippedRuleset): string {
  const { confirmed, total } = s.status.combinations;
  return `${confirmed} of ${total} confirmed`;
}

export function fromMemoryEntries(s: ShippedRuleset) {
  return s.ruleset.file.provenance.filter((p) => p.status === "from-memory");
}

/** A `rulesets` entry of the JSON: the `ruleset` object, which carries the counts and what is from memory. */
export function listingJson(s: ShippedRuleset) {
  return rulesetJson({ ruleset: s.ruleset, status: s.status, source: "shipped" });
}
