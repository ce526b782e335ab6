/**
 * Plans kept between formula calls. A worksheet recalculates many formulas
 * over the same ruleset, parameters and case headers; planning (about a
 * millisecond for the larger shipped rulesets) would otherwise be repeated for
 * every cell, where evaluating one component takes a hundredth of that.
 *
 * A plan depends on the ruleset's content (its fingerprint, and whether it was
 * typed in cells, which changes how messages name it), the parameters given,
 * the case headers with the symbol each names, and the case map's modes and
 * directions — and on nothing else, so those make the key. The cache holds at
 * most PLAN_CACHE_LIMIT plans, forgetting the least recently used.
 */
import { BoundedCache } from "../boundedCache.js";
import type { CaseTable } from "../cases/readCaseTable.js";
import type { ParameterInput } from "../params/parameterInput.js";
import { planForTable } from "../planForTable.js";
import type { Result } from "../problems.js";
import type { Ruleset } from "../ruleset/model.js";
import type { Plan } from "./types.js";

export const PLAN_CACHE_LIMIT = 64;

const plans = new BoundedCache<Result<Plan>>(PLAN_CACHE_LIMIT);

/** planForTable, made once per distinct key and then reused. `fingerprint` is the ruleset's (rulesetStatus). */
export function cachedPlanForTable(ruleset: Ruleset, fingerprint: string, parameters: ParameterInput, table: CaseTable | null): Result<Plan> {
  return plans.getOrMake(planKey(ruleset, fingerprint, parameters, table), () => planForTable(ruleset, parameters, table));
}

/** How many plans are kept now (never more than PLAN_CACHE_LIMIT). */
export function cachedPlanCount(): number {
  return plans.size;
}

export function clearPlanCache(): void {
  plans.clear();
}

export function planKey(ruleset: Ruleset, fingerprint: string, parameters: ParameterInput, table: CaseTable | null): string {
  const given = Object.keys(parameters)
    .sort()
    .map((name) => [name, typeof parameters[name], parameters[name]]);
  const shape = table && {
    cases: table.cases.map((c) => [c.header, c.symbol]),
    modes: [...table.map.modes].sort(),
    reversible: [...table.map.reversible].sort(),
  };
  return JSON.stringify([fingerprint, ruleset.origin, given, shape]);
}
