/**
 * The project's values for a ruleset's parameters: given values checked against
 * their allowed ranges, defaults for the rest, and the values each choice sets.
 */
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import { type Ruleset, rulesetName } from "../ruleset/model.js";
import { nearest } from "../text/nearest.js";
import type { ParameterInput } from "./parameterInput.js";

export interface ParameterValues {
  /** Parameter and choice-set value names → number: what factors read. */
  numbers: ReadonlyMap<string, number>;
  /** Choice parameter → the choice in force. */
  choices: ReadonlyMap<string, string>;
  /** Which parameters were given by the user (the rest took their defaults). */
  given: ReadonlySet<string>;
  /**
   * Parameters without default that were not given: name → description. Only a
   * combination that reads one is refused, when it is planned — so a gravity-only
   * table need not give the seismic SDS.
   */
  missing: ReadonlyMap<string, string>;
}

export function resolveParameters(ruleset: Ruleset, input: ParameterInput = {}): Result<ParameterValues> {
  const problems: Problem[] = [];
  const numbers = new Map<string, number>();
  const choices = new Map<string, string>();
  const missing = new Map<string, string>();
  const known = ruleset.parameters.map((p) => p.name);
  for (const name of Object.keys(input)) {
    if (!ruleset.parameterByName.has(name)) {
      const guess = nearest(name, known);
      const list = known.length > 0 ? `parameters of ${rulesetName(ruleset)}: ${known.join(", ")}` : `${rulesetName(ruleset)} has no parameters`;
      problems.push(problem("parameter-unknown", `unknown parameter "${name}"${guess ? `; did you mean "${guess}"?` : ""} (${list})`, { header: name }));
    }
  }
  for (const p of ruleset.parameters) {
    const given = input[p.name];
    const place = { header: p.name };
    if (p.kind === "number") {
      let value: number;
      if (given === undefined) {
        if (p.default === undefined) {
          missing.set(p.name, p.description);
          continue;
        }
        value = p.default;
      } else if (typeof given !== "number" || !Number.isFinite(given)) {
        problems.push(problem("parameter-not-number", `parameter ${p.name} must be a number, not "${given}"`, place));
        continue;
      } else {
        value = given;
      }
      if ((p.min !== undefined && value < p.min) || (p.max !== undefined && value > p.max)) {
        problems.push(
          problem("parameter-out-of-range", `parameter ${p.name} = ${value} is outside its allowed range ${p.min ?? "−∞"} … ${p.max ?? "∞"}`, place),
        );
        continue;
      }
      if (p.allowed && !p.allowed.includes(value)) {
        problems.push(problem("parameter-not-allowed", `parameter ${p.name} = ${value} is not one of the allowed values ${p.allowed.join(", ")}`, place));
        continue;
      }
      numbers.set(p.name, value);
    } else {
      const choice = given === undefined ? p.default : String(given);
      const set = p.choices.get(choice);
      if (!set) {
        problems.push(problem("parameter-not-allowed", `parameter ${p.name} = "${choice}" is not one of its choices: ${[...p.choices.keys()].join(", ")}`, place));
        continue;
      }
      choices.set(p.name, choice);
      for (const [n, v] of set) numbers.set(n, v);
    }
  }
  if (problems.length > 0) return fail(...problems);
  return ok({ numbers, choices, given: new Set(Object.keys(input)), missing });
}
