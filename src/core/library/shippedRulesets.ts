/**
 * The rulesets shipped in rulesets/*.json, loaded and validated once. A shipped
 * file that fails validation is a build defect (the tests load every one), so
 * it throws rather than returning problems.
 */
import { describeProblem } from "../problems.js";
import { loadRuleset } from "../ruleset/loadRuleset.js";
import type { Ruleset } from "../ruleset/model.js";
import { rulesetStatus, type RulesetStatus } from "../ruleset/status.js";
import { SHIPPED_RULESET_FILES } from "./shippedFiles.js";

export interface ShippedRuleset {
  id: string;
  ruleset: Ruleset;
  status: RulesetStatus;
}

let cache: ShippedRuleset[] | null = null;

export function shippedRulesets(): ShippedRuleset[] {
  if (cache) return cache;
  cache = SHIPPED_RULESET_FILES.map((file) => {
    const loaded = loadRuleset(file);
    if (!loaded.ok) {
      const id = (file as { id?: unknown }).id;
      throw new Error(`shipped ruleset ${String(id)} is invalid: ${loaded.problems.map((p) => describeProblem(p)).join("; ")}`);
    }
    return { id: loaded.value.file.id, ruleset: loaded.value, status: rulesetStatus(loaded.value) };
  });
  return cache;
}

export function findShippedRuleset(id: string): ShippedRuleset | undefined {
  return shippedRulesets().find((r) => r.id === id.trim());
}
