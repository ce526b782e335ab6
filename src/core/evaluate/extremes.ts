/**
 * The largest and smallest value over every concrete row, for one vector of
 * case values, without listing the rows: within a branch the terms choose
 * independently, so the best option of each term gives the best row
 * (docs/design.md, "Exactness"). The property tests hold this to brute-force
 * enumeration.
 *
 * Evaluated on the compiled plan: each distinct option valued once, each
 * distinct term's best and worst option found once, then per branch the sum of
 * its terms' best (and worst) values. Ties go to the first combination, branch
 * and option, as in docs/design.md. Nothing is allocated per result row.
 */
import { compiledPlanOf, rowRefOf, type CompiledPlan } from "../plan/compiledPlan.js";
import type { Plan, RowRef } from "../plan/types.js";

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
  const evaluator = sharedEvaluator(compiledPlanOf(plan));
  const found = evaluator.evaluate(x);
  if (!found) return null;
  const { compiled } = evaluator;
  return {
    max: { value: found.maxValue, row: rowRefOf(compiled, found.maxBranch, found.maxChoices) },
    min: { value: found.minValue, row: rowRefOf(compiled, found.minBranch, found.minChoices) },
  };
}

/** What one evaluation found: the values, and each row as a flat branch with one option per term. Overwritten by the next evaluation. */
export interface RowExtremes {
  maxValue: number;
  maxBranch: number;
  maxChoices: Int32Array;
  minValue: number;
  minBranch: number;
  minChoices: Int32Array;
}

export interface ExtremesEvaluator {
  compiled: CompiledPlan;
  /** The extremes for case values x (one per case, in the plan's case order), or null when the plan has no rows. */
  evaluate(x: ArrayLike<number>): RowExtremes | null;
  /** The same for the case values x[offset] … x[offset + cases − 1] (one row of a block of rows). */
  evaluateAt(x: ArrayLike<number>, offset: number): RowExtremes | null;
}

const shared = new WeakMap<CompiledPlan, ExtremesEvaluator>();

/** One evaluator per plan for callers that read its result before evaluating again (evaluation is synchronous). */
export function sharedEvaluator(compiled: CompiledPlan): ExtremesEvaluator {
  let e = shared.get(compiled);
  if (!e) shared.set(compiled, (e = extremesEvaluator(compiled)));
  return e;
}

/** An evaluator with its own scratch space, for evaluating one result row after another. */
export function extremesEvaluator(compiled: CompiledPlan): ExtremesEvaluator {
  const { optionCount, optionStart, optionCase, optionFactor, termCount, termStart, termOptions, branchCount, branchStart, branchTerms } = compiled;
  const optionValue = new Float64Array(optionCount);
  const termHigh = new Float64Array(termCount);
  const termLow = new Float64Array(termCount);
  const termHighChoice = new Int32Array(termCount);
  const termLowChoice = new Int32Array(termCount);
  // A term with no options makes its branch give no rows.
  const termEmpty = new Uint8Array(termCount);
  for (let t = 0; t < termCount; t++) termEmpty[t] = termStart[t + 1] === termStart[t] ? 1 : 0;
  const out: RowExtremes = {
    maxValue: 0,
    maxBranch: -1,
    maxChoices: new Int32Array(compiled.maxTerms),
    minValue: 0,
    minBranch: -1,
    minChoices: new Int32Array(compiled.maxTerms),
  };

  function evaluateAt(x: ArrayLike<number>, offset: number): RowExtremes | null {
    for (let o = 0; o < optionCount; o++) {
      let v = 0;
      for (let k = optionStart[o], end = optionStart[o + 1]; k < end; k++) v += optionFactor[k] * x[offset + optionCase[k]];
      optionValue[o] = v;
    }
    for (let t = 0; t < termCount; t++) {
      let hi = -Infinity;
      let lo = Infinity;
      let hiAt = 0;
      let loAt = 0;
      const first = termStart[t];
      for (let k = first, end = termStart[t + 1]; k < end; k++) {
        const v = optionValue[termOptions[k]];
        if (v > hi) {
          hi = v;
          hiAt = k - first;
        }
        if (v < lo) {
          lo = v;
          loAt = k - first;
        }
      }
      termHigh[t] = hi;
      termLow[t] = lo;
      termHighChoice[t] = hiAt;
      termLowChoice[t] = loAt;
    }
    let maxBranch = -1;
    let minBranch = -1;
    let maxValue = 0;
    let minValue = 0;
    for (let b = 0; b < branchCount; b++) {
      let high = 0;
      let low = 0;
      let empty = false;
      for (let k = branchStart[b], end = branchStart[b + 1]; k < end; k++) {
        const t = branchTerms[k];
        if (termEmpty[t]) {
          empty = true;
          break;
        }
        high += termHigh[t];
        low += termLow[t];
      }
      if (empty) continue;
      if (maxBranch < 0 || high > maxValue) {
        maxValue = high;
        maxBranch = b;
      }
      if (minBranch < 0 || low < minValue) {
        minValue = low;
        minBranch = b;
      }
    }
    if (maxBranch < 0 || minBranch < 0) return null;
    out.maxValue = maxValue;
    out.maxBranch = maxBranch;
    out.minValue = minValue;
    out.minBranch = minBranch;
    for (let k = branchStart[maxBranch], t = 0; k < branchStart[maxBranch + 1]; k++, t++) out.maxChoices[t] = termHighChoice[branchTerms[k]];
    for (let k = branchStart[minBranch], t = 0; k < branchStart[minBranch + 1]; k++, t++) out.minChoices[t] = termLowChoice[branchTerms[k]];
    return out;
  }

  return { compiled, evaluateAt, evaluate: (x) => evaluateAt(x, 0) };
}
