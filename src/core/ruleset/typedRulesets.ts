/**
 * Rulesets typed in worksheet cells, read and fingerprinted once per distinct
 * content: every formula that names the same range would otherwise parse every
 * expression and hash the whole ruleset again on each recalculation. At most
 * TYPED_RULESET_LIMIT contents are kept, the least recently used forgotten.
 */
import { BoundedCache } from "../boundedCache.js";
import type { Cell } from "../cells.js";
import type { Result } from "../problems.js";
import type { Ruleset } from "./model.js";
import { rulesetFromRows } from "./rulesetFromRows.js";
import { rulesetStatus, type RulesetStatus } from "./status.js";

export const TYPED_RULESET_LIMIT = 32;

export interface TypedRuleset {
  ruleset: Ruleset;
  status: RulesetStatus;
}

const typed = new BoundedCache<Result<TypedRuleset>>(TYPED_RULESET_LIMIT);

/** rulesetFromRows and rulesetStatus for these rows, made once per distinct content. */
export function typedRuleset(rows: Cell[][]): Result<TypedRuleset> {
  // Cells are text, numbers, booleans or blank; undefined is written as null, as Excel also sends a blank.
  const key = JSON.stringify(rows, (_k, v: unknown) => (v === undefined ? null : v));
  return typed.getOrMake(key, () => {
    const loaded = rulesetFromRows(rows);
    return loaded.ok ? { ok: true, value: { ruleset: loaded.value, status: rulesetStatus(loaded.value) } } : loaded;
  });
}

export function clearTypedRulesets(): void {
  typed.clear();
}
