/**
 * Every file in rulesets/, imported as data (`with { type: "json" }`) so that the
 * add-in bundle, the command line and the tests all carry the same rulesets.
 * Add a new file here when you add it to rulesets/.
 */
export const SHIPPED_RULESET_FILES: readonly unknown[] = [];
