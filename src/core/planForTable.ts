/** The usual path in one call: parameters resolved, then a plan for the table's cases and case map. */
import type { CaseTable } from "./cases/readCaseTable.js";
import type { ParameterInput } from "./params/parameterInput.js";
import { resolveParameters } from "./params/resolveParameters.js";
import { planCombinations } from "./plan/planCombinations.js";
import type { Plan } from "./plan/types.js";
import type { Result } from "./problems.js";
import type { Ruleset } from "./ruleset/model.js";

export function planForTable(ruleset: Ruleset, parameters: ParameterInput, table: CaseTable | null): Result<Plan> {
  const resolved = resolveParameters(ruleset, parameters);
  if (!resolved.ok) return resolved;
  return planCombinations(ruleset, resolved.value, {
    cases: table ? table.cases : null,
    modes: table ? table.map.modes : new Map(),
    reversible: table ? table.map.reversible : new Map(),
  });
}
