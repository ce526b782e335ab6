/**
 * What a plan leaves out, which a checker must know beside the numbers:
 * combinations that give no rows (a "!" term's symbols absent from the case
 * table) and load symbols the table has no case of. Given as data, so that a
 * surface shows it in its own way, and worded once.
 */
import type { Plan } from "../plan/types.js";

export interface SkippedCombination {
  combination: string;
  clause: string;
  /** Why it gives no rows. */
  reason: string;
}

export interface PlanOmissions {
  skipped: SkippedCombination[];
  /** Load symbols used by the combinations that give rows, with no case in the table: their terms contribute nothing. */
  notSupplied: string[];
}

export function planOmissions(plan: Plan): PlanOmissions {
  const skipped: SkippedCombination[] = [];
  const notSupplied = new Set<string>();
  for (const c of plan.combinations) {
    if (c.skipped !== null) skipped.push({ combination: c.combination.id, clause: c.combination.clause, reason: c.skipped });
    else for (const s of c.notSupplied) notSupplied.add(s);
  }
  return { skipped, notSupplied: [...notSupplied] };
}

/** One sentence per omission: "combination 6 (§2.3.6 (6)) gives no rows: …", "no case of Lr, S in the case table; …". */
export function omissionTexts(omissions: PlanOmissions): string[] {
  const out = omissions.skipped.map((s) => `combination ${s.combination} (${s.clause}) gives no rows: ${s.reason}`);
  if (omissions.notSupplied.length > 0) out.push(`no case of ${omissions.notSupplied.join(", ")} in the case table; their terms contribute nothing`);
  return out;
}
