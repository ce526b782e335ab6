/**
 * How many rows and columns each formula's result spills for one plan and
 * case table, so that a sheet can leave room for every spill before anything
 * is written (docs/formulas.md: the stamp row, a header row, one row per
 * result, then a note row per thing the plan leaves out; rows padded to the
 * widest). A result refused for its size is one cell, which fits any room.
 */
import type { CaseTable } from "../cases/readCaseTable.js";
import type { Plan } from "../plan/types.js";
import { omissionTexts, planOmissions } from "../text/omissions.js";

export interface ResultSize {
  rows: number;
  columns: number;
}

export interface ResultSizes {
  /** LW.RULESET: the stamp, a header and one row per field. */
  ruleset: ResultSize;
  envelope: ResultSize;
  governing: ResultSize;
  factored: ResultSize;
  /** LW.COMBOS with the case table as its cases: one factor column per case. */
  combos: ResultSize;
}

/** LW.RULESET's fields: verification, approval, id, title, standard, basis, version, fingerprint, source, combinations, combinations confirmed, parameters, from memory, caution. */
export const RULESET_FIELDS = 14;

/** Stamp and header rows above the numbers of every table formula. */
const HEAD_ROWS = 2;

/**
 * `criteria`: how many criteria LW.GOVERNING is given; null for none given
 * (then the max and min of every component, two a component).
 */
export function resultSizes(plan: Plan, table: CaseTable, criteria: number | null): ResultSizes {
  const notes = omissionTexts(planOmissions(plan)).length;
  const C = table.components.length;
  const K = plan.cases.length;
  const G = criteria ?? 2 * C;
  const spill = (body: number, columns: number): ResultSize => ({ rows: HEAD_ROWS + body + notes, columns });
  return {
    ruleset: { rows: HEAD_ROWS + RULESET_FIELDS, columns: 2 },
    envelope: spill(C, 5),
    governing: spill(G, 3 + C),
    factored: spill(plan.rowCount, 1 + C),
    combos: spill(plan.rowCount, 2 + K),
  };
}
