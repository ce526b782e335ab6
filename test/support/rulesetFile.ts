/**
 * One builder for the ruleset files tests write by hand: the format's
 * boilerplate (format, id, title, standard, version, provenance, an empty
 * approval) filled in, and what the test is about given as overrides. Sources
 * for the factors stay beside each test's own symbols and combinations.
 */
import { RULESET_FORMAT, type RulesetFile } from "../../src/core/index.js";

export type RulesetFileOverrides = Partial<RulesetFile> & Pick<RulesetFile, "symbols" | "combinations">;

export function rulesetFile(overrides: RulesetFileOverrides): RulesetFile {
  return {
    format: RULESET_FORMAT,
    id: "test-ruleset",
    title: "Ruleset written for a test",
    standard: { name: "test", edition: "-" },
    version: "1",
    provenance: [{ source: "written for the test", status: "confirmed", covers: "all combinations" }],
    approval: { approvedBy: null, date: null, fingerprint: null },
    ...overrides,
  };
}
