/**
 * `--ruleset ID|FILE`: a shipped ruleset by id, or a ruleset file of the
 * loadwright-ruleset/1 format. A file's problems are located by line and
 * column as well as by JSON path and combination.
 */
import { existsSync } from "node:fs";
import { describeProblem, didYouMean, findShippedRuleset, nearest, loadRuleset, rulesetStatus, shippedRulesets, type Problem, type Ruleset, type RulesetStatus } from "../../core/index.js";
import { cliErrorOf, CliError } from "../cliError.js";
import { readText } from "./fileAccess.js";
import { offsetOfPath, positionOf, syntaxErrorOffset } from "./jsonLocation.js";

export interface ChosenRuleset {
  ruleset: Ruleset;
  status: RulesetStatus;
  /** "shipped" or the file it was read from. */
  source: string;
}

export function chooseRuleset(spec: string): ChosenRuleset {
  const shipped = findShippedRuleset(spec);
  if (shipped) return { ruleset: shipped.ruleset, status: shipped.status, source: "shipped" };
  if (existsSync(spec) || /[\\/]|\.json$/i.test(spec)) return rulesetFromFile(spec);
  const ids = shippedRulesets().map((r) => r.id);
  throw new CliError(
    `--ruleset: unknown ruleset "${spec}": no shipped ruleset has this id and there is no file of that name` +
      (ids.length > 0 ? ` (shipped: ${ids.join(", ")}${didYouMean(nearest(spec, ids))})` : " (no rulesets are shipped yet; give a ruleset file)") +
      "; `loadwright rulesets` lists them",
  );
}

function rulesetFromFile(file: string): ChosenRuleset {
  const text = readText(file, "ruleset file");
  const loaded = loadRuleset(text);
  if (!loaded.ok) throw cliErrorOf(loaded.problems.map((p) => describeRulesetProblem(file, text, p)));
  return { ruleset: loaded.value, status: rulesetStatus(loaded.value), source: file };
}

/** `rules.json line 12, column 31 (combinations[2].expression, combination "3", character 14): message` */
export function describeRulesetProblem(file: string, text: string, p: Problem): string {
  if (p.kind === "input-limit" && p.place.path === undefined) {
    // Beyond the size or nesting limit: the place is in the message, found without reading the text as a tree.
    const at = / at line (\d+), column (\d+)$/.exec(p.message);
    return at ? `${file} line ${at[1]}, column ${at[2]}: ${p.message.slice(0, at.index)}` : `${file}: ${p.message}`;
  }
  if (p.kind === "ruleset-json") {
    const at = syntaxErrorOffset(text);
    if (at === null) return `${file}: ${p.message}`;
    const { line, column } = positionOf(text, at);
    return `${file} line ${line}, column ${column}: ${p.message.replace(/ at line \d+, column \d+$/, "")}`;
  }
  const path = p.place.path ?? [];
  const offset = offsetOfPath(text, path, p.place.position);
  const { line, column } = positionOf(text, offset);
  const where = describeProblem({ ...p, message: "" }).replace(/: $/, "");
  return `${file} line ${line}, column ${column}${where ? ` (${where})` : ""}: ${p.message}`;
}
