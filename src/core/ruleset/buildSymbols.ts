/**
 * A ruleset's load symbols with the format's defaults applied (SYMBOL_DEFAULTS,
 * DEFAULT_ORTHOGONAL_SHARE), their attributes claimed as names, and every value
 * name they read checked against the parameters.
 */
import { problem, type Problem } from "../problems.js";
import type { LoadSymbol } from "./model.js";
import { collect, type NameRegistry } from "./nameRegistry.js";
import { DEFAULT_ORTHOGONAL_SHARE, SYMBOL_DEFAULTS, type RulesetFile } from "./schema.js";

/** Load symbol names are claimed first, so that a parameter of the same name is the one refused. */
export function claimSymbolNames(file: RulesetFile, names: NameRegistry, problems: Problem[]): void {
  for (const name of Object.keys(file.symbols)) collect(problems, names.claim(name, `the load symbol ${name}`, ["symbols", name]));
}

/** After the parameters: attributes and orthogonal shares may name their values. */
export function buildSymbols(file: RulesetFile, names: NameRegistry, problems: Problem[]): LoadSymbol[] {
  return Object.entries(file.symbols).map(([name, s]) => {
    const path = ["symbols", name];
    const defaults = SYMBOL_DEFAULTS[s.permanence];
    const attributes = new Map<string, number | string>();
    for (const [attr, v] of Object.entries(s.attributes ?? {})) {
      collect(problems, names.claim(attr, `the symbol attribute ${attr}`, [...path, "attributes", attr]));
      if (!names.values.has(attr)) names.values.set(attr, "attribute");
      if (typeof v === "string" && !names.isParameterValue(v)) problems.push(notAValue(v, [...path, "attributes", attr]));
      attributes.set(attr, v);
    }
    const share = s.orthogonalShare ?? DEFAULT_ORTHOGONAL_SHARE;
    if (typeof share === "string" && !names.isParameterValue(share)) problems.push(notAValue(share, [...path, "orthogonalShare"]));
    if (typeof share === "number" && !(share >= 0 && share <= 1)) {
      problems.push(problem("parameter-out-of-range", `must be between 0 and 1, not ${share}`, { path: [...path, "orthogonalShare"] }));
    }
    if (s.orthogonalShare !== undefined && s.cases !== "orthogonal") {
      problems.push(problem("ruleset-field", 'only applies with "cases": "orthogonal"', { path: [...path, "orthogonalShare"] }));
    }
    return {
      name,
      description: s.description,
      permanent: s.permanence === "permanent",
      reversible: s.reversible ?? defaults.reversible,
      cases: s.cases ?? defaults.cases,
      orthogonalShare: share,
      canBeAbsent: s.canBeAbsent ?? defaults.canBeAbsent,
      attributes,
    };
  });
}

function notAValue(name: string, path: (string | number)[]): Problem {
  return problem("expression-unknown-name", `"${name}" is not a parameter or a value set by a choice parameter`, { path });
}
