/**
 * Checks a schema-valid ruleset file for what a schema cannot see (names used
 * twice, defaults outside their ranges, expressions that do not parse or use a
 * value a symbol lacks) and builds the model the planner works from. Every
 * problem is collected, each with its JSON path and, in expressions, the
 * character position. Parameters, symbols and combinations are built in that
 * order, sharing one registry of names.
 */
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import { buildCombinations } from "./buildCombinations.js";
import { buildParameters } from "./buildParameters.js";
import { buildSymbols, claimSymbolNames } from "./buildSymbols.js";
import type { Ruleset } from "./model.js";
import { NameRegistry } from "./nameRegistry.js";
import type { RulesetFile } from "./schema.js";

/**
 * `listedSymbols`: the symbols an "unknown name" message offers; by default the
 * ruleset's own (a list typed in cells offers the whole catalogue instead).
 */
export function buildRuleset(file: RulesetFile, origin: Ruleset["origin"] = "file", listedSymbols?: readonly string[]): Result<Ruleset> {
  const problems: Problem[] = [];
  const names = new NameRegistry();
  claimSymbolNames(file, names, problems);
  const parameters = buildParameters(file, names, problems);
  const symbols = buildSymbols(file, names, problems);
  const symbolByName = new Map(symbols.map((s) => [s.name, s]));
  const { combinations, ids } = buildCombinations(
    file,
    { names, symbolByName, parameters, listedSymbols: listedSymbols ?? symbols.map((s) => s.name) },
    problems,
  );
  file.provenance.forEach((entry, index) => {
    entry.combinations?.forEach((id, k) => {
      if (!ids.has(id)) {
        const known = [...ids.keys()].join(", ");
        problems.push(problem("ruleset-field", `names combination "${id}", which this ruleset does not have (combinations: ${known})`, { path: ["provenance", index, "combinations", k] }));
      }
    });
  });

  if (problems.length > 0) return fail(...problems);
  return ok({
    file,
    origin,
    symbols,
    symbolByName,
    parameters,
    parameterByName: new Map(parameters.map((p) => [p.name, p])),
    values: names.values,
    combinations,
  });
}
