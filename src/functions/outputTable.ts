/**
 * A formula's result as Excel wants it: rectangular, text labels, numbers as
 * numbers, "" where a row is shorter (never null, which Excel would show as 0).
 * Row 1 is the ruleset stamp, row 2 the header, then the body, then a note for
 * each thing the plan leaves out that the checker needs to know (combinations
 * that gave no rows, symbols the table lacks), in the catalogue's words.
 * A number that is not finite is refused rather than shown.
 */
import { omissionTexts, problem, type PlanOmissions, type Result } from "../core/index.js";
import type { OutputCell, ResolvedRuleset } from "./formula.js";
import { stampOf } from "./stamp.js";

/** Marks a note row below the numbers, so that no note is read as a row of results. */
export const NOTE_PREFIX = "note: ";

export function outputTable(ruleset: ResolvedRuleset, header: OutputCell[] | null, body: OutputCell[][], omissions: PlanOmissions | null = null): Result<OutputCell[][]> {
  const notes = omissions ? omissionTexts(omissions).map((n) => [`${NOTE_PREFIX}${n}`]) : [];
  const rows: OutputCell[][] = [[stampOf(ruleset)], ...(header ? [header] : []), ...body, ...notes];
  const width = Math.max(1, ...rows.map((r) => r.length));
  for (let r = 0; r < rows.length; r++) {
    for (const cell of rows[r]) {
      if (typeof cell === "number" && !Number.isFinite(cell)) {
        return {
          ok: false,
          problems: [problem("result-not-finite", `row ${r + 1} of the result would hold ${cell}; Loadwright shows no such value — check the factors and parameters`)],
        };
      }
    }
  }
  return { ok: true, value: rows.map((r) => (r.length === width ? r : [...r, ...new Array<OutputCell>(width - r.length).fill("")])) };
}
