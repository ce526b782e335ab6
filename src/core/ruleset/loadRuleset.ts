/**
 * Reads a ruleset file (JSON text or an already-parsed object): JSON syntax,
 * then the schema (unknown fields refused), then the checks of buildRuleset.
 */
import { fail, problem, type Result } from "../problems.js";
import { buildRuleset } from "./buildRuleset.js";
import type { Ruleset } from "./model.js";
import { rulesetSchema } from "./schema.js";
import { schemaProblems } from "./schemaProblems.js";
import { duplicateKeys, jsonSyntaxError } from "./jsonSyntax.js";

export function loadRuleset(input: string | unknown): Result<Ruleset> {
  let data: unknown = input;
  if (typeof input === "string") {
    try {
      data = JSON.parse(input);
    } catch (e) {
      return fail(problem("ruleset-json", `not valid JSON: ${jsonSyntaxError(input, e instanceof Error ? e.message : String(e))}`));
    }
    const twice = duplicateKeys(input);
    if (twice.length > 0) {
      return fail(...twice.map((d) => problem("ruleset-json", `field "${d.key}" is written twice in one object (line ${d.line}, column ${d.column}); JSON keeps only the last, so say which is meant`, { path: d.path })));
    }
  }
  const parsed = rulesetSchema.safeParse(data);
  if (!parsed.success) return fail(...schemaProblems(parsed.error.issues, rulesetSchema, data));
  return buildRuleset(parsed.data, "file");
}
