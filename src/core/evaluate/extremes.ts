/**
 * The largest and smallest value over every concrete row, for one vector of
 * case values, without listing the rows: within a branch the terms choose
 * independently, so the best option of each term gives the best row (DESIGN.md,
 * "Exactness and speed"). The property tests hold this to brute-force
 * enumeration.
 */
import type { Plan, RowRef } from "../plan/types.js";
import { optionValue } from "./rows.js";

export interface Extreme {
  value: number;
  row: RowRef;
}

export interface Extremes {
  max: Extreme;
  min: Extreme;
}

/** Max and min over all rows for case values x; null when the plan has no rows. */
export function extremes(plan: Plan, x: ArrayLike<number>): Extremes | null {
  let max: Extreme | null = null;
  let min: Extreme | null = null;
  for (let c = 0; c < plan.combinations.length; c++) {
    const branches = plan.combinations[c].branches;
    for (let b = 0; b < branches.length; b++) {
      const terms = branches[b].terms;
      let high = 0;
      let low = 0;
      const highChoices = new Array<number>(terms.length);
      const lowChoices = new Array<number>(terms.length);
      let empty = false;
      for (let t = 0; t < terms.length; t++) {
        const options = terms[t].options;
        if (options.length === 0) {
          empty = true;
          break;
        }
        let hi = -Infinity;
        let lo = Infinity;
        for (let o = 0; o < options.length; o++) {
          const v = optionValue(options[o], x);
          if (v > hi) {
            hi = v;
            highChoices[t] = o;
          }
          if (v < lo) {
            lo = v;
            lowChoices[t] = o;
          }
        }
        high += hi;
        low += lo;
      }
      if (empty) continue;
      if (max === null || high > max.value) max = { value: high, row: { combination: c, branch: b, choices: highChoices } };
      if (min === null || low < min.value) min = { value: low, row: { combination: c, branch: b, choices: lowChoices } };
    }
  }
  return max && min ? { max, min } : null;
}
