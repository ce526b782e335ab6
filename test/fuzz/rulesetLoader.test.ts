/**
 * Fuzz target: the ruleset loader (loadRuleset), on JSON text and on the value
 * it parses to (as the add-in's store and the task pane give it). Every
 * problem must name where it is: a JSON path, or, for the text as a whole, its
 * line and column or its size.
 */
import { describe } from "vitest";
import { loadRuleset, type Problem, type Result, type Ruleset } from "../../src/core/index.js";
import { fuzzClass } from "./fuzzClass.js";
import { changedRuleset, deepRuleset, editedRulesetText, hugeRuleset, randomRuleset, withValue, type RulesetInput } from "./generators.js";
import type { Verdict } from "./robustness.js";

const TEXT_WIDE = new Set(["ruleset-json", "input-limit"]);

function locatedInFile(p: Problem): boolean {
  if (p.message === "") return false;
  if (p.place.path !== undefined) return true;
  // The text as a whole: a syntax error or a limit names line and column, or the file's size.
  return TEXT_WIDE.has(p.kind) && (/line \d+, column \d+/.test(p.message) || /characters|empty|JSON/.test(p.message));
}

function located(loaded: Result<Ruleset>): boolean {
  return loaded.ok || loaded.problems.every(locatedInFile);
}

export function rulesetTarget(input: RulesetInput): Verdict {
  return { located: located(loadRuleset(input.text)) && (input.value === undefined || located(loadRuleset(input.value))) };
}

const text = (input: RulesetInput) => input.text;

describe("ruleset loader", () => {
  fuzzClass("ruleset loader: structural changes to shipped rulesets", 0.2, withValue(changedRuleset), rulesetTarget, text);
  fuzzClass("ruleset loader: edited ruleset text", 0.12, withValue(editedRulesetText), rulesetTarget, text);
  fuzzClass("ruleset loader: deep JSON", 0.025, withValue(deepRuleset), rulesetTarget, text);
  fuzzClass("ruleset loader: files around the size limit", 0.005, withValue(hugeRuleset), rulesetTarget, text);
  fuzzClass("ruleset loader: random JSON and bytes", 0.05, withValue(randomRuleset), rulesetTarget, text);
});
