/**
 * Reads a ruleset file (JSON text or an already-parsed object): JSON syntax,
 * then the schema (unknown fields refused), then the checks of buildRuleset.
 */
import { fail, problem, type Result } from "../problems.js";
import { buildRuleset } from "./buildRuleset.js";
import type { Ruleset } from "./model.js";
import { rulesetSchema } from "./schema.js";
import { schemaProblems } from "./schemaProblems.js";

export function loadRuleset(input: string | unknown): Result<Ruleset> {
  let data: unknown = input;
  if (typeof input === "string") {
    try {
      data = JSON.parse(input);
    } catch (e) {
      return fail(problem("ruleset-json", `not valid JSON: ${jsonErrorText(input, e)}`));
    }
  }
  const parsed = rulesetSchema.safeParse(data);
  if (!parsed.success) return fail(...schemaProblems(parsed.error.issues, rulesetSchema, data));
  return buildRuleset(parsed.data, "file");
}

/** The parser's message with the line and column it points at, where it names a position. */
function jsonErrorText(text: string, error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  const match = /at position (\d+)/.exec(message);
  const base = message.replace(/\s*\(line \d+ column \d+\)/, "").replace(/ in JSON at position \d+/, "");
  if (!match) return base;
  const offset = Number(match[1]);
  const before = text.slice(0, offset);
  const line = before.split("\n").length;
  const column = offset - before.lastIndexOf("\n");
  return `${base} at line ${line}, column ${column}`;
}
