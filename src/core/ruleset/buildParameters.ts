/**
 * A ruleset's parameters, checked beyond the schema: defaults inside their
 * ranges and allowed values, every choice setting the same values, and each
 * name (parameters and the values choices set) claimed in the registry.
 */
import { problem, type Problem } from "../problems.js";
import type { Parameter } from "./model.js";
import { collect, type NameRegistry } from "./nameRegistry.js";
import type { RulesetFile } from "./schema.js";

type ParameterFile = NonNullable<RulesetFile["parameters"]>[string];
type NumberParameterFile = Extract<ParameterFile, { type: "number" }>;
type ChoiceParameterFile = Extract<ParameterFile, { type: "choice" }>;

export function buildParameters(file: RulesetFile, names: NameRegistry, problems: Problem[]): Parameter[] {
  const parameters: Parameter[] = [];
  for (const [name, p] of Object.entries(file.parameters ?? {})) {
    const path = ["parameters", name];
    collect(problems, names.claim(name, `the parameter ${name}`, path));
    const built = p.type === "number" ? numberParameter(name, p, path, names, problems) : choiceParameter(name, p, path, names, problems);
    if (built) parameters.push(built);
  }
  return parameters;
}

function numberParameter(name: string, p: NumberParameterFile, path: (string | number)[], names: NameRegistry, problems: Problem[]): Parameter {
  names.values.set(name, "parameter");
  problems.push(...numberParameterProblems(name, p, path));
  const param: Parameter = { kind: "number", name, description: p.description };
  if (p.unit !== undefined) param.unit = p.unit;
  if (p.default !== undefined) param.default = p.default;
  if (p.min !== undefined) param.min = p.min;
  if (p.max !== undefined) param.max = p.max;
  if (p.allowed !== undefined) param.allowed = p.allowed;
  return param;
}

function choiceParameter(name: string, p: ChoiceParameterFile, path: (string | number)[], names: NameRegistry, problems: Problem[]): Parameter | null {
  const entries = Object.entries(p.choices);
  if (entries.length === 0) {
    problems.push(problem("ruleset-field", "must offer at least one choice", { path: [...path, "choices"] }));
    return null;
  }
  const [firstChoice, firstSet] = entries[0];
  const valueNames = Object.keys(firstSet);
  for (const [choice, set] of entries) {
    const written = Object.keys(set);
    const missing = valueNames.filter((v) => !written.includes(v));
    const extra = written.filter((v) => !valueNames.includes(v));
    if (missing.length > 0 || extra.length > 0) {
      problems.push(
        problem(
          "ruleset-field",
          `every choice must set the same values as "${firstChoice}" (${valueNames.join(", ")})` +
            (missing.length ? `; missing ${missing.join(", ")}` : "") +
            (extra.length ? `; extra ${extra.join(", ")}` : ""),
          { path: [...path, "choices", choice] },
        ),
      );
    }
  }
  if (!Object.hasOwn(p.choices, p.default)) {
    problems.push(
      problem("parameter-not-allowed", `default "${p.default}" is not one of the choices (${entries.map(([c]) => c).join(", ")})`, {
        path: [...path, "default"],
      }),
    );
  }
  for (const v of valueNames) {
    collect(problems, names.claim(v, `a value set by the choice parameter ${name}`, [...path, "choices", firstChoice, v]));
    names.values.set(v, "choice-value");
  }
  return {
    kind: "choice",
    name,
    description: p.description,
    default: p.default,
    choices: new Map(entries.map(([c, set]) => [c, new Map(Object.entries(set))])),
    valueNames,
  };
}

function numberParameterProblems(name: string, p: NumberParameterFile, path: (string | number)[]): Problem[] {
  const out: Problem[] = [];
  if (p.min !== undefined && p.max !== undefined && p.min > p.max) {
    out.push(problem("ruleset-field", `min (${p.min}) is above max (${p.max})`, { path }));
  }
  const inRange = (v: number) => (p.min === undefined || v >= p.min) && (p.max === undefined || v <= p.max);
  for (const v of p.allowed ?? []) {
    if (!inRange(v)) out.push(problem("parameter-out-of-range", `allowed value ${v} is outside min/max`, { path: [...path, "allowed"] }));
  }
  if (p.default !== undefined) {
    if (!inRange(p.default)) {
      out.push(problem("parameter-out-of-range", `default ${p.default} of ${name} is outside ${p.min ?? "−∞"} … ${p.max ?? "∞"}`, { path: [...path, "default"] }));
    }
    if (p.allowed && !p.allowed.includes(p.default)) {
      out.push(problem("parameter-not-allowed", `default ${p.default} of ${name} is not one of ${p.allowed.join(", ")}`, { path: [...path, "default"] }));
    }
  }
  return out;
}
