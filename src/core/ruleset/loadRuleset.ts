/**
 * Reads a ruleset file (JSON text or an already-parsed object): the stated
 * limits (size, nesting, members) and forbidden field names first, then JSON
 * syntax, the schema (unknown fields refused), then the checks of buildRuleset.
 * A ruleset is hostile input until these pass: nothing here recurses deeper
 * than the nesting limit or copies a field named __proto__.
 */
import { LIMITS } from "../limits.js";
import { fail, type Result } from "../problems.js";
import { buildRuleset } from "./buildRuleset.js";
import type { Ruleset } from "./model.js";
import { rulesetSchema } from "./schema.js";
import { schemaProblems } from "./schemaProblems.js";
import { jsonValueProblems, parseJsonText } from "./jsonLimits.js";

export function loadRuleset(input: unknown): Result<Ruleset> {
  let data: unknown = input;
  if (typeof input === "string") {
    const read = parseJsonText(input, { what: "ruleset file", characters: LIMITS.rulesetCharacters });
    if (!read.ok) return read;
    data = read.value;
  }
  const unsafe = jsonValueProblems(data, { members: LIMITS.rulesetMembers });
  if (unsafe.length > 0) return fail(...unsafe);
  const parsed = rulesetSchema.safeParse(data);
  if (!parsed.success) return fail(...schemaProblems(parsed.error.issues, rulesetSchema, data));
  return buildRuleset(parsed.data, "file");
}
