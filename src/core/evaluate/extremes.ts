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
 *
 * A row whose factored sum has no finite value (case values near the largest
 * double, so that a factor or a sum passes it; +∞ and −∞ in one row give NaN,
 * which no comparison would pick) must not be skipped silently: the evaluation
 * says it is not finite and names such a row. Any such row either loads an
 * option that is not finite or, its options all finite, sums to ±∞ and so is
 * the largest or the smallest row (rounding is monotone).
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
  /** Present only where some row has no finite value: such a row (max and min are then not to be used). */
  notFinite?: RowRef;
}

/** Max and min over all rows for case values x; null when the plan has no rows. */
export function extremes(plan: Plan, x: ArrayLike<number>): Extremes | null {
  const evaluator = sharedEvaluator(compiledPlanOf(plan));
  const found = evaluator.evaluate(x);
  if (!found) return null;
  const { compiled } = evaluator;
  const out: Extremes = {
    max: { value: found.maxValue, row: rowRefOf(compiled, found.maxBranch, found.maxChoices) },
    min: { value: found.minValue, row: rowRefOf(compiled, found.minBranch, found.minChoices) },
  };
  if (!found.finite) out.notFinite = rowRefOf(compiled, found.faultBranch, found.faultChoices);
  return out;
}

/** What one evaluation found: the values, and each row as a flat branch with one option per term. Overwritten by the next evaluation. */
export interface RowExtremes {
  maxValue: number;
  maxBranch: number;
  maxChoices: Int32Array;
  minValue: number;
  minBranch: number;
  minChoices: Int32Array;
  /** False where some concrete row has no finite value; the max and min are then not to be used, and fault… names such a row. */
  finite: boolean;
  faultBranch: number;
  faultChoices: Int32Array;
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
    finite: true,
    faultBranch: -1,
    faultChoices: new Int32Array(compiled.maxTerms),
  };

  /** The first row (flat branch and choices) that loads an option without a finite value, or false if no row does. */
  function rowWithOptionNotFinite(): boolean {
    for (let b = 0; b < branchCount; b++) {
      let found = -1;
      let empty = false;
      for (let k = branchStart[b], t = 0; k < branchStart[b + 1]; k++, t++) {
        const term = branchTerms[k];
        if (termEmpty[term]) {
          empty = true;
          break;
        }
        // Any option of each term; the first one that is not finite where a term has one.
        out.faultChoices[t] = 0;
        for (let j = termStart[term]; j < termStart[term + 1]; j++) {
          const v = optionValue[termOptions[j]];
          if (v - v !== 0) {
            out.faultChoices[t] = j - termStart[term];
            found = t;
            break;
          }
        }
      }
      if (!empty && found >= 0) {
        out.faultBranch = b;
        return true;
      }
    }
    return false;
  }

  function evaluateAt(x: ArrayLike<number>, offset: number): RowExtremes | null {
    // v × 0 is 0 for a finite v and NaN otherwise: one sum tells whether every option value is finite.
    let check = 0;
    for (let o = 0; o < optionCount; o++) {
      let v = 0;
      for (let k = optionStart[o], end = optionStart[o + 1]; k < end; k++) v += optionFactor[k] * x[offset + optionCase[k]];
      optionValue[o] = v;
      check += v * 0;
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
    out.finite = true;
    if (check !== 0 && rowWithOptionNotFinite()) out.finite = false;
    else if (maxValue - maxValue !== 0) notFiniteAt(maxBranch, out.maxChoices);
    else if (minValue - minValue !== 0) notFiniteAt(minBranch, out.minChoices);
    return out;
  }

  function notFiniteAt(branch: number, choices: Int32Array): void {
    out.finite = false;
    out.faultBranch = branch;
    out.faultChoices.set(choices);
  }

  return { compiled, evaluateAt, evaluate: (x) => evaluateAt(x, 0) };
}
