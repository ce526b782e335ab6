/**
 * A ruleset for trying the task pane in a plain browser. Its combinations are
 * invented for the demo and say so; it is marked from memory so that it shows
 * as UNVERIFIED, as any list not checked against a standard must.
 */
import type { RulesetFile } from "../core/index.js";
import type { RulesetStore } from "../workbook/rulesetStore.js";

export const DEMO_RULESET: RulesetFile = {
  format: "loadwright-ruleset/1",
  id: "demo-invented",
  title: "Demo only: invented combinations (not a code list)",
  standard: { name: "none (invented for the Loadwright demo)", edition: "-" },
  basis: "demo",
  version: "0.1.0",
  symbols: {
    D: { description: "dead load", permanence: "permanent" },
    L: { description: "live load", permanence: "transient" },
    S: { description: "snow load", permanence: "transient" },
    W: { description: "wind load", permanence: "transient", reversible: true },
  },
  parameters: {
    kL: { type: "number", description: "invented live load factor for the demo", default: 1.5, min: 1, max: 2 },
  },
  combinations: [
    { id: "A", expression: "1.3D", clause: "demo A (invented)" },
    { id: "B", expression: "1.2D + kL*L + 0.5(S or W)", clause: "demo B (invented)" },
    { id: "C", expression: "0.9D + 1.0W!", clause: "demo C (invented)" },
  ],
  notes: ["Invented for trying Loadwright; not taken from any standard. Do not use for design."],
  provenance: [{ source: "invented for the Loadwright demo", status: "from-memory", covers: "all combinations (invented, not from any standard)" }],
  approval: { approvedBy: null, date: null, fingerprint: null },
};

/** Puts the demo ruleset in an empty store; never touches a store that holds anything. */
export async function seedDemoRuleset(store: RulesetStore): Promise<void> {
  const current = store.entries();
  if (!current.ok || current.value.length > 0) return;
  await store.save(DEMO_RULESET);
}
