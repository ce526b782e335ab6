/**
 * The extremes of a block of result rows at once, on the plan's block layout
 * (plan/blockPlan.ts): for each row, its largest and smallest value over every
 * concrete row, the branches that give them and, when asked, the option each
 * term takes there. The same values, bit for bit, and the same rows as the
 * compiled plan's evaluator (extremes.ts), which the property tests hold it to;
 * a row on which a value is not a number along the way is handed to that
 * evaluator whole, so its reading of such rows is kept too.
 *
 * Why it is shaped as it is: on an export the extremes move from row to row
 * at random, so a comparison that decides a jump is mispredicted about half the
 * time. The largest of two values is taken here by an index instead
 * (`pick[0] = a; pick[1] = b; a = pick[+(b > a)]`), which keeps the rule
 * "a later value wins only when larger" without a jump. The options of each
 * term are looked at again only for the two rows named, and only when rows
 * are asked for.
 */
import { rowKey, type CompiledPlan } from "../plan/compiledPlan.js";
import { blockPlanOf, EXACT_FROM, SOURCE_CASE, SOURCE_SLOT } from "../plan/blockPlan.js";
import { extremesEvaluator, type ExtremesEvaluator } from "./extremes.js";

/** What a block's evaluation found, row n at index n (choices at n × maxTerms). Overwritten by the next block. */
export interface ExtremesBlock {
  capacity: number;
  maxValue: Float64Array;
  minValue: Float64Array;
  /** Flat branch of each row's largest (smallest) value. */
  maxBranch: Int32Array;
  minBranch: Int32Array;
  /** With rows: the option each term of that branch takes, maxTerms to a row. */
  maxChoices: Int32Array;
  minChoices: Int32Array;
  /** With rows, where the plan's row numbers are exact: the row's number as enumerateRows counts (else −1). */
  maxRow: Float64Array;
  minRow: Float64Array;
  /** Where an evaluation stopped at a row with a concrete row that has no finite value: such a row (a flat branch and its options). */
  faultBranch: number;
  faultChoices: Int32Array;
}

export function extremesBlock(compiled: CompiledPlan, capacity: number): ExtremesBlock {
  return {
    capacity,
    maxValue: new Float64Array(capacity),
    minValue: new Float64Array(capacity),
    maxBranch: new Int32Array(capacity),
    minBranch: new Int32Array(capacity),
    maxChoices: new Int32Array(capacity * compiled.maxTerms),
    minChoices: new Int32Array(capacity * compiled.maxTerms),
    maxRow: new Float64Array(capacity),
    minRow: new Float64Array(capacity),
    faultBranch: -1,
    faultChoices: new Int32Array(compiled.maxTerms),
  };
}

export interface BlockExtremesEvaluator {
  compiled: CompiledPlan;
  /**
   * Rows 0 … count − 1 of x (caseCount values to a row, in the plan's case
   * order) into `out`; with `rows`, the options and row numbers too. Gives
   * the number of rows evaluated: `count`, or the index of the first result
   * row on which some concrete row has no finite value (its values are not
   * written; out.faultBranch and out.faultChoices name such a concrete row),
   * or −1 when the plan has no rows (nothing is written).
   */
  evaluate(x: Float64Array, count: number, out: ExtremesBlock, rows: boolean): number;
}

/** An evaluator with its own scratch space. */
export function blockExtremesEvaluator(compiled: CompiledPlan): BlockExtremesEvaluator {
  const plan = blockPlanOf(compiled);
  const slots = new Float64Array(plan.slotCount);
  const groupExtremes = new Float64Array(2 * plan.groupCount);
  // Made on the first row that needs it: most exports never do.
  let general: ExtremesEvaluator | null = null;
  // The two places a pick is made from: values, and branch numbers beside them.
  const pickHigh = new Float64Array(2);
  const pickLow = new Float64Array(2);
  const pickHighAt = new Int32Array(2);
  const pickLowAt = new Int32Array(2);

  function evaluate(x: Float64Array, count: number, out: ExtremesBlock, rows: boolean): number {
    const liveCount = plan.liveBranch.length;
    if (liveCount === 0) return -1;
    if (count > out.capacity) throw new Error(`a block of ${count} rows given to an output of ${out.capacity}`);
    const { caseCount, singleOption, singleCase, singleFactor, pairOption, pairCase, pairFactor, wideOption, groupCount, groupStart, groupCase } = plan;
    const { scaledGroup, scaledFactor, scaledSlot, choiceStart, choiceHigh, choiceLow, choiceSlot, signedStart, signedSlot, signedOut } = plan;
    const { liveBranch, liveStart, branchHigh, branchLow } = plan;
    const { optionStart, optionCase, optionFactor } = compiled;
    const v = slots;
    const g = groupExtremes;
    const ph = pickHigh;
    const pl = pickLow;
    const pa = pickHighAt;
    const pb = pickLowAt;
    const singles = singleOption.length;
    const pairs = pairOption.length;
    const wide = wideOption.length;
    const scaled = scaledGroup.length;
    const choices = choiceSlot.length;
    const signed = signedOut.length;
    const { maxValue, minValue, maxBranch, minBranch, maxChoices, minChoices, maxRow, minRow } = out;
    const width = compiled.maxTerms;

    for (let n = 0, at = 0; n < count; n++, at += caseCount) {
      for (let i = 0; i < singles; i++) v[singleOption[i]] = 0 + singleFactor[i] * x[at + singleCase[i]];
      for (let i = 0, j = 0; i < pairs; i++, j += 2) v[pairOption[i]] = 0 + pairFactor[j] * x[at + pairCase[j]] + pairFactor[j + 1] * x[at + pairCase[j + 1]];
      for (let i = 0; i < wide; i++) {
        const o = wideOption[i];
        let sum = 0;
        for (let k = optionStart[o], end = optionStart[o + 1]; k < end; k++) sum += optionFactor[k] * x[at + optionCase[k]];
        v[o] = sum;
      }
      // Math.max and Math.min where only the value matters: on finite values they give the first largest
      // (smallest) but for the sign of a zero, and every value they give is added to 0 before it is used.
      for (let q = 0; q < groupCount; q++) {
        let k = groupStart[q];
        const end = groupStart[q + 1];
        let high = x[at + groupCase[k]];
        let low = high;
        for (k++; k < end; k++) {
          const y = x[at + groupCase[k]];
          high = Math.max(high, y);
          low = Math.min(low, y);
        }
        g[2 * q] = high;
        g[2 * q + 1] = low;
      }
      for (let s = 0; s < scaled; s++) {
        const f = scaledFactor[s];
        const q = 2 * scaledGroup[s];
        const slot = scaledSlot[s];
        const ofHigh = 0 + f * g[q];
        const ofLow = 0 + f * g[q + 1];
        v[slot] = f > 0 ? ofHigh : ofLow;
        v[slot + 1] = f > 0 ? ofLow : ofHigh;
      }
      for (let i = 0; i < choices; i++) {
        let k = choiceStart[i];
        const end = choiceStart[i + 1];
        let high = v[choiceHigh[k]];
        let low = v[choiceLow[k]];
        for (k++; k < end; k++) {
          high = Math.max(high, v[choiceHigh[k]]);
          low = Math.min(low, v[choiceLow[k]]);
        }
        const slot = choiceSlot[i];
        v[slot] = high;
        v[slot + 1] = low;
      }
      for (let i = 0; i < signed; i++) {
        let k = signedStart[i];
        const end = signedStart[i + 1];
        let high = Math.abs(v[signedSlot[k]]);
        for (k++; k < end; k++) high = Math.max(high, Math.abs(v[signedSlot[k]]));
        const slot = signedOut[i];
        v[slot] = high;
        v[slot + 1] = 0 - high;
      }
      // Branches: the sum of their terms' values in term order; the first largest (smallest) wins.
      // Every branch's sums are added to `guard` too: an option value that is not finite in a live branch
      // reaches them (+∞ through the largest values, −∞ through the smallest, NaN through both: Math.max
      // and Math.min give NaN for NaN, and a case value that is not finite makes its group's scan not finite),
      // as does a sum past the largest number. A guard that is not finite sends the row to the general
      // evaluator, which finds whether some concrete row is not finite; an option used by no live branch
      // is no concern of it either.
      let high = 0;
      let low = 0;
      for (let k = liveStart[0], end = liveStart[1]; k < end; k++) {
        high += v[branchHigh[k]];
        low += v[branchLow[k]];
      }
      let top = high;
      let bottom = low;
      let topAt = 0;
      let bottomAt = 0;
      let guard = high + low;
      for (let i = 1; i < liveCount; i++) {
        high = 0;
        low = 0;
        for (let k = liveStart[i], end = liveStart[i + 1]; k < end; k++) {
          high += v[branchHigh[k]];
          low += v[branchLow[k]];
        }
        guard += high + low;
        const up = +(high > top);
        const down = +(low < bottom);
        ph[0] = top;
        ph[1] = high;
        top = ph[up];
        pa[0] = topAt;
        pa[1] = i;
        topAt = pa[up];
        pl[0] = bottom;
        pl[1] = low;
        bottom = pl[down];
        pb[0] = bottomAt;
        pb[1] = i;
        bottomAt = pb[down];
      }
      if (guard - guard !== 0) {
        if (!generalRow(x, at, n, out, rows)) return n;
        continue;
      }
      maxValue[n] = top;
      minValue[n] = bottom;
      maxBranch[n] = liveBranch[topAt];
      minBranch[n] = liveBranch[bottomAt];
      if (!rows) continue;
      // The rows named: in each term of the branch, the first option (in the plan's order) whose value is the term's.
      maxRow[n] = nameRow(x, at, topAt, 0, maxChoices, n * width);
      minRow[n] = nameRow(x, at, bottomAt, 1, minChoices, n * width);
    }
    return count;
  }

  // What naming a row reads, taken out of the plans once.
  const { liveBranch, namedStart, namedTerm, namedAt, namedStride, namedSigned, namedHigh, namedLow, sourceKind, sourceIndex, sourceFactor, runScaled, runLength } = plan;
  const { scaledGroup, scaledFactor, scaledSlot, groupStart, groupCase, signedStart, signedSlot, signedAt, signedNegatedAt } = plan;
  const { branchStart, termStart, branchFirstRow, rowNumbersExact } = compiled;

  /**
   * The options of the row of live branch i that gives the largest (side 0) or smallest (side 1)
   * value, written from chosen[from] on; its row number where row numbers are exact, else −1.
   */
  function nameRow(x: Float64Array, at: number, i: number, side: 0 | 1, chosen: Int32Array, from: number): number {
    const termSlots = side === 0 ? namedHigh : namedLow;
    const v = slots;
    const branch = liveBranch[i];
    for (let j = from, end = from + branchStart[branch + 1] - branchStart[branch]; j < end; j++) chosen[j] = 0;
    let row = branchFirstRow[branch];
    for (let k = namedStart[i], end = namedStart[i + 1]; k < end; k++) {
      const t = namedTerm[k];
      const first = termStart[t];
      const last = termStart[t + 1] - 1;
      const value = v[termSlots[k]];
      let q = first;
      const si = namedSigned[k];
      if (si >= 0) {
        // A sign-closed term: of each slot of the largest magnitude, the option or its negation, whichever has the
        // sign asked for; the first of those in the term. (Where the magnitude is 0 every option is 0: the first.)
        if (value !== 0) {
          const size = side === 0 ? value : 0 - value;
          let place = last - first + 1;
          for (let p = signedStart[si], end = signedStart[si + 1]; p < end; p++) {
            const y = v[signedSlot[p]];
            if (Math.abs(y) !== size) continue;
            const here = y > 0 === (side === 0) ? signedAt[p] : signedNegatedAt[p];
            if (here < place) place = here;
          }
          q = first + place;
        }
      } else {
        for (; q < last; q++) {
          const s = runScaled[q];
          if (s >= 0) {
            // A run of a scaled group: none of it gives the value unless the group's extreme does.
            const f = scaledFactor[s];
            if (v[scaledSlot[s] + side] !== value) {
              q = Math.min(q + runLength[q], last) - 1;
              continue;
            }
            if (Math.abs(value) >= EXACT_FROM) {
              const g = scaledGroup[s];
              const extreme = g * 2 + ((side === 0) === f > 0 ? 0 : 1);
              let c = groupStart[g];
              while (x[at + groupCase[c]] !== groupExtremes[extreme]) c++;
              q += c - groupStart[g];
              break;
            }
          }
          const kind = sourceKind[q];
          const y = kind === SOURCE_SLOT ? v[sourceIndex[q]] : kind === SOURCE_CASE ? 0 + sourceFactor[q] * x[at + sourceIndex[q]] : 0 - v[sourceIndex[q]];
          if (y === value) break;
        }
      }
      chosen[from + namedAt[k]] = q - first;
      row += (q - first) * namedStride[k];
    }
    return rowNumbersExact ? row : -1;
  }

  /** Row n read by the compiled plan's own evaluator; false (and the fault named in `out`) where some concrete row is not finite. */
  function generalRow(x: Float64Array, at: number, n: number, out: ExtremesBlock, rows: boolean): boolean {
    general ??= extremesEvaluator(compiled);
    const e = general.evaluateAt(x, at);
    if (!e) throw new Error("the general evaluator found no rows where the block plan has live branches");
    if (!e.finite) {
      out.faultBranch = e.faultBranch;
      out.faultChoices.set(e.faultChoices);
      return false;
    }
    out.maxValue[n] = e.maxValue;
    out.minValue[n] = e.minValue;
    out.maxBranch[n] = e.maxBranch;
    out.minBranch[n] = e.minBranch;
    if (!rows) return true;
    const width = compiled.maxTerms;
    out.maxChoices.set(e.maxChoices, n * width);
    out.minChoices.set(e.minChoices, n * width);
    out.maxRow[n] = rowNumber(compiled, e.maxBranch, out.maxChoices, n * width);
    out.minRow[n] = rowNumber(compiled, e.minBranch, out.minChoices, n * width);
    return true;
  }

  return { compiled, evaluate };
}

/** The row's number as enumerateRows counts, from its branch and the choices at `from`; −1 where row numbers are not exact. */
function rowNumber(compiled: CompiledPlan, branch: number, choices: Int32Array, from: number): number {
  const key = rowKey(compiled, branch, choices, from);
  return typeof key === "number" ? key : -1;
}
