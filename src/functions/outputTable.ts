/**
 * A formula's result as Excel wants it: rectangular, text labels, numbers as
 * numbers, "" where a row is shorter (never null, which Excel would show as 0).
 * Row 1 is the ruleset stamp, row 2 the header, then the body, then notes the
 * checker needs (combinations that gave no rows, symbols the table lacks).
 * A number that is not finite is refused rather than shown.
 */
import type { Plan, Result } from "../core/index.js";
import type { OutputCell, ResolvedRuleset } from "./formula.js";
import { stampLine } from "./stamp.js";

export function outputTable(ruleset: ResolvedRuleset, header: OutputCell[] | null, body: OutputCell[][], notes: string[] = []): Result<OutputCell[][]> {
  const rows: OutputCell[][] = [[stampLine(ruleset)], ...(header ? [header] : []), ...body, ...notes.map((n) => [n])];
  const width = Math.max(1, ...rows.map((r) => r.length));
  for (let r = 0; r < rows.length; r++) {
    for (const cell of rows[r]) {
      if (typeof cell === "number" && !Number.isFinite(cell)) {
        return {
          ok: false,
          problems: [{ kind: "expression-not-finite", message: `row ${r + 1} of the result would hold ${cell}; Loadwright shows no such value — check the factors and parameters`, place: {} }],
        };
      }
    }
  }
  return { ok: true, value: rows.map((r) => (r.length === width ? r : [...r, ...new Array<OutputCell>(width - r.length).fill("")])) };
}

/** What a checker must know about rows that are not there. */
export function planNotes(plan: Plan): string[] {
  const notes: string[] = [];
  for (const c of plan.combinations) {
    if (c.skipped) notes.push(`note: combination ${c.combination.id} (${c.combination.clause}) gives no rows: ${c.skipped}`);
  }
  const missing = [...new Set(plan.combinations.filter((c) => !c.skipped).flatMap((c) => c.notSupplied))];
  if (missing.length > 0) notes.push(`note: no case of ${missing.join(", ")} in the case table; their terms contribute nothing`);
  return notes;
}
