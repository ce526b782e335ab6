/**
 * The compiled plan laid out for finding extremes a block of result rows at a
 * time (evaluate/blockExtremes.ts). It changes how the largest and smallest
 * values are reached, never what they are: every shortcut below gives, bit for
 * bit, the value the compiled plan's term-by-term reading gives, and the rows
 * are named afterwards by that reading's rule (the first option of each term
 * that gives the term's value). The property tests hold the two to each other.
 *
 * - Options that only choose between cases are not valued one by one: where a
 *   term offers the same factor f on three or more single cases ("W, each
 *   direction"), the term's best of them is f times the largest (f > 0) or the
 *   smallest (f < 0) of those case values. Rounding is monotone, so
 *   0 + f·max x is exactly the largest of the 0 + f·x. Two terms over the same
 *   cases (0.5W and 1.0W) share the one scan of the case values.
 * - A term whose options come in pairs that are each other's negation (every
 *   factor negated, same cases in the same order: "±", the orthogonal rule)
 *   takes the largest magnitude of one option of each pair as its largest
 *   value, and its negation as its smallest: 0 + Σ(−f)·x is exactly 0 − (0 + Σ f·x).
 * - A term with one thing to choose from reads it where it is; branches with a
 *   term that has no option (which give no rows) are left out.
 * - Naming a row's options takes shortcuts of the same kind: in a sign-closed
 *   term, the option (or its negation) of the largest magnitude; in a run of a
 *   scaled group's options in case order with a factor that is a power of two
 *   (0.5W, 1.0W), the first case whose value is the group's extreme — the
 *   product is then exact, so no other case value gives the same product
 *   (checked only for values of at least 2^−1000, far from the numbers that
 *   lose digits); a run whose extreme is not the term's value is passed over.
 *
 * What none of this covers — a value that is not a number along the way — is
 * left to the compiled plan's own evaluator, row by row.
 */
import type { CompiledPlan } from "./compiledPlan.js";

export interface BlockPlan {
  compiled: CompiledPlan;
  caseCount: number;

  /** Options valued per row, by size: one case, two cases, more (CSR over the compiled plan's arrays). Values go to slot = option index. */
  singleOption: Int32Array;
  singleCase: Int32Array;
  singleFactor: Float64Array;
  pairOption: Int32Array;
  /** Cases and factors of pair p at 2p and 2p + 1. */
  pairCase: Int32Array;
  pairFactor: Float64Array;
  wideOption: Int32Array;

  /** Case groups: group g scans cases groupCase[k], k in groupStart[g] … groupStart[g+1]. */
  groupCount: number;
  groupStart: Int32Array;
  groupCase: Int32Array;
  /** Scaled groups: f × the group's extremes, largest to slot scaledSlot[s], smallest to scaledSlot[s] + 1. */
  scaledGroup: Int32Array;
  scaledFactor: Float64Array;
  scaledSlot: Int32Array;

  /** Terms choosing among several values: largest of slots choiceHigh[k] (smallest of choiceLow[k]), k in choiceStart[i] … choiceStart[i+1], to choiceSlot[i] and choiceSlot[i] + 1. */
  choiceStart: Int32Array;
  choiceHigh: Int32Array;
  choiceLow: Int32Array;
  choiceSlot: Int32Array;
  /** Sign-closed terms: largest magnitude of slots signedSlot[k], k in signedStart[i] … signedStart[i+1], to signedOut[i]; its negation to signedOut[i] + 1. */
  signedStart: Int32Array;
  signedSlot: Int32Array;
  signedOut: Int32Array;

  /** Branches that give rows, in plan order: live branch i sums slots branchHigh[k] (branchLow[k]), k in liveStart[i] … liveStart[i+1]. */
  liveBranch: Int32Array;
  liveStart: Int32Array;
  branchHigh: Int32Array;
  branchLow: Int32Array;
  /**
   * The terms of live branch i with more than one option (the only ones whose option must be found when
   * rows are named), k in namedStart[i] … namedStart[i+1]: the term namedTerm[k], at place namedAt[k]
   * in the branch, its values in slots namedHigh[k] and namedLow[k], one option further a step of
   * namedStride[k] rows.
   */
  namedStart: Int32Array;
  namedTerm: Int32Array;
  namedAt: Int32Array;
  namedHigh: Int32Array;
  namedLow: Int32Array;
  namedStride: Float64Array;

  /** Length of the slot array: option values, scaled groups, term values. */
  slotCount: number;

  /**
   * How each entry of the compiled plan's termOptions is valued again when
   * rows are named: SOURCE_SLOT reads slot sourceIndex; SOURCE_CASE is
   * 0 + sourceFactor × x[sourceIndex]; SOURCE_NEGATED is 0 − slot sourceIndex.
   */
  sourceKind: Uint8Array;
  sourceIndex: Int32Array;
  sourceFactor: Float64Array;
  /**
   * Where term option k begins a run of the members of scaled group runScaled[k] (else −1), in the
   * group's case order and with a factor that is a power of two: the run is runLength[k] options
   * long, and its first option giving a value v with |v| ≥ EXACT_FROM is the first whose case value is
   * the group's extreme (multiplying by a power of two is exact there, so only that case value gives v).
   */
  runScaled: Int32Array;
  runLength: Int32Array;
  /** Per entry k of signedSlot: the first place in its term of that option (signedAt) and of its negation (signedNegatedAt). */
  signedAt: Int32Array;
  signedNegatedAt: Int32Array;
  /** Per entry of named…: the sign-closed term it is (an index into signed…), else −1. */
  namedSigned: Int32Array;
}

/** The smallest size of a value named through a run (far from the numbers below 2^−1022, which lose digits). */
export const EXACT_FROM = 2 ** -1000;

export const SOURCE_SLOT = 0;
export const SOURCE_CASE = 1;
export const SOURCE_NEGATED = 2;

/** Fewer single-case options than this are valued one by one: a scan would save nothing. */
const GROUP_FROM = 3;

const blockPlans = new WeakMap<CompiledPlan, BlockPlan>();

/** The compiled plan's block layout, made once per compiled plan. */
export function blockPlanOf(compiled: CompiledPlan): BlockPlan {
  let b = blockPlans.get(compiled);
  if (!b) blockPlans.set(compiled, (b = makeBlockPlan(compiled)));
  return b;
}

export function makeBlockPlan(compiled: CompiledPlan): BlockPlan {
  const { optionCount, optionStart, optionCase, optionFactor, termCount, termStart, termOptions, branchCount, branchStart, branchTerms } = compiled;
  const size = (o: number) => optionStart[o + 1] - optionStart[o];
  const usable = (f: number) => f !== 0 && Number.isFinite(f);

  // Each option's exact negation among the distinct options, if there is one (the option itself where it loads nothing).
  const optionKey = (o: number, sign: number) => {
    let key = "";
    for (let k = optionStart[o]; k < optionStart[o + 1]; k++) key += `${optionCase[k]}:${sign * optionFactor[k]},`;
    return key;
  };
  const byKey = new Map<string, number>();
  for (let o = 0; o < optionCount; o++) byKey.set(optionKey(o, 1), o);
  const negation = new Int32Array(optionCount).fill(-1);
  for (let o = 0; o < optionCount; o++) {
    if (size(o) === 0) negation[o] = o;
    else {
      let all = true;
      for (let k = optionStart[o]; k < optionStart[o + 1]; k++) all &&= usable(optionFactor[k]);
      if (all) negation[o] = byKey.get(optionKey(o, -1)) ?? -1;
    }
  }

  const valued = new Uint8Array(optionCount);
  const groups: number[][] = [];
  const groupIds = new Map<string, number>();
  const scaled: { group: number; factor: number }[] = [];
  const scaledIds = new Map<string, number>();
  const scaledSlot = (s: number) => optionCount + 2 * s;
  // The scaled group each single-case option of a term was put in, by "term/option".
  const memberOf = new Map<string, number>();

  // Per term: the slots of its largest and smallest value, once known.
  const termHigh = new Int32Array(termCount).fill(-1);
  const termLow = new Int32Array(termCount).fill(-1);
  const choiceTerms: { term: number; high: number[]; low: number[] }[] = [];
  const signedTerms: { term: number; slots: number[] }[] = [];
  const signed = new Uint8Array(termCount);

  for (let t = 0; t < termCount; t++) {
    const options = Array.from(termOptions.subarray(termStart[t], termStart[t + 1]));
    if (options.length === 0) continue;
    const present = new Set(options);
    if (options.length > 1 && options.every((o) => negation[o] >= 0 && present.has(negation[o]))) {
      const slots: number[] = [];
      const taken = new Set<number>();
      for (const o of options) {
        if (taken.has(o)) continue;
        taken.add(o).add(negation[o]);
        if (size(o) > 0) slots.push(o);
      }
      if (slots.length > 0) {
        for (const o of slots) valued[o] = 1;
        signedTerms.push({ term: t, slots });
        signed[t] = 1;
        continue;
      }
    }
    // Single-case options by factor; three or more with one factor become one scaled group.
    const byFactor = new Map<number, Set<number>>();
    for (const o of present) {
      if (size(o) !== 1 || !usable(optionFactor[optionStart[o]])) continue;
      const f = optionFactor[optionStart[o]];
      let same = byFactor.get(f);
      if (!same) byFactor.set(f, (same = new Set()));
      same.add(o);
    }
    const high: number[] = [];
    const low: number[] = [];
    const grouped = new Set<number>();
    for (const [factor, same] of byFactor) {
      if (same.size < GROUP_FROM) continue;
      const cases = [...same].map((o) => optionCase[optionStart[o]]).sort((a, b) => a - b);
      const groupKey = cases.join(",");
      let group = groupIds.get(groupKey);
      if (group === undefined) {
        groupIds.set(groupKey, (group = groups.length));
        groups.push(cases);
      }
      const scaledKey = `${group}/${factor}`;
      let s = scaledIds.get(scaledKey);
      if (s === undefined) {
        scaledIds.set(scaledKey, (s = scaled.length));
        scaled.push({ group, factor });
      }
      for (const o of same) {
        grouped.add(o);
        memberOf.set(`${t}/${o}`, s);
      }
      high.push(scaledSlot(s));
      low.push(scaledSlot(s) + 1);
    }
    for (const o of present) {
      if (grouped.has(o)) continue;
      valued[o] = 1;
      high.push(o);
      low.push(o);
    }
    if (high.length === 1) {
      termHigh[t] = high[0];
      termLow[t] = low[0];
    } else choiceTerms.push({ term: t, high, low });
  }

  // Term values after the option values and scaled groups.
  let slotCount = optionCount + 2 * scaled.length;
  const choiceSlot = choiceTerms.map(({ term }) => {
    termHigh[term] = slotCount;
    termLow[term] = slotCount + 1;
    slotCount += 2;
    return termHigh[term];
  });
  const signedOut = signedTerms.map(({ term }) => {
    termHigh[term] = slotCount;
    termLow[term] = slotCount + 1;
    slotCount += 2;
    return termHigh[term];
  });

  // Where every term option's value is found again when rows are named.
  const sourceKind = new Uint8Array(termOptions.length);
  const sourceIndex = new Int32Array(termOptions.length);
  const sourceFactor = new Float64Array(termOptions.length);
  for (let t = 0; t < termCount; t++) {
    for (let k = termStart[t]; k < termStart[t + 1]; k++) {
      const o = termOptions[k];
      if (valued[o] || size(o) === 0) {
        sourceKind[k] = SOURCE_SLOT;
        sourceIndex[k] = o;
      } else if (signed[t]) {
        sourceKind[k] = SOURCE_NEGATED;
        sourceIndex[k] = negation[o];
      } else {
        // A member of a scaled group: one case.
        sourceKind[k] = SOURCE_CASE;
        sourceIndex[k] = optionCase[optionStart[o]];
        sourceFactor[k] = optionFactor[optionStart[o]];
      }
    }
  }

  // Runs of a scaled group's members in its case order, with a factor that is a power of two.
  const runScaled = new Int32Array(termOptions.length).fill(-1);
  const runLength = new Int32Array(termOptions.length);
  const powerOfTwo = (f: number) => {
    const e = Math.round(Math.log2(Math.abs(f)));
    return Math.abs(e) <= 8 && Math.abs(f) === 2 ** e;
  };
  for (let t = 0; t < termCount; t++) {
    for (let k = termStart[t]; k < termStart[t + 1]; k++) {
      const s = memberOf.get(`${t}/${termOptions[k]}`);
      if (s === undefined || !powerOfTwo(scaled[s].factor)) continue;
      const cases = groups[scaled[s].group];
      if (k + cases.length > termStart[t + 1]) continue;
      let run = true;
      for (let j = 0; j < cases.length && run; j++) {
        const o = termOptions[k + j];
        run = memberOf.get(`${t}/${o}`) === s && optionCase[optionStart[o]] === cases[j];
      }
      if (!run) continue;
      runScaled[k] = s;
      runLength[k] = cases.length;
      k += cases.length - 1;
    }
  }
  const placeIn = (term: number, o: number) => Array.prototype.indexOf.call(termOptions.subarray(termStart[term], termStart[term + 1]), o);
  const signedAt = Int32Array.from(signedTerms.flatMap(({ term, slots }) => slots.map((o) => placeIn(term, o))));
  const signedNegatedAt = Int32Array.from(signedTerms.flatMap(({ term, slots }) => slots.map((o) => placeIn(term, negation[o]))));
  const signedOf = new Map(signedTerms.map(({ term }, i) => [term, i]));

  const singles: number[] = [];
  const pairs: number[] = [];
  const wide: number[] = [];
  for (let o = 0; o < optionCount; o++) {
    if (!valued[o]) continue;
    const n = size(o);
    if (n === 1) singles.push(o);
    else if (n === 2) pairs.push(o);
    else if (n > 2) wide.push(o);
  }

  const live: number[] = [];
  const named: { term: number; at: number; high: number; low: number; stride: number }[] = [];
  const namedStart = [0];
  const liveStart = [0];
  const branchHigh: number[] = [];
  const branchLow: number[] = [];
  for (let b = 0; b < branchCount; b++) {
    const terms = Array.from(branchTerms.subarray(branchStart[b], branchStart[b + 1]));
    if (terms.some((t) => termStart[t + 1] === termStart[t])) continue;
    live.push(b);
    for (const t of terms) {
      branchHigh.push(termHigh[t]);
      branchLow.push(termLow[t]);
    }
    liveStart.push(branchHigh.length);
    terms.forEach((t, at) => {
      if (termStart[t + 1] - termStart[t] < 2) return;
      named.push({ term: t, at, high: termHigh[t], low: termLow[t], stride: compiled.termStride[branchStart[b] + at] });
    });
    namedStart.push(named.length);
  }

  return {
    compiled,
    caseCount: compiled.caseCount,
    singleOption: Int32Array.from(singles),
    singleCase: Int32Array.from(singles, (o) => optionCase[optionStart[o]]),
    singleFactor: Float64Array.from(singles, (o) => optionFactor[optionStart[o]]),
    pairOption: Int32Array.from(pairs),
    pairCase: Int32Array.from(pairs.flatMap((o) => [optionCase[optionStart[o]], optionCase[optionStart[o] + 1]])),
    pairFactor: Float64Array.from(pairs.flatMap((o) => [optionFactor[optionStart[o]], optionFactor[optionStart[o] + 1]])),
    wideOption: Int32Array.from(wide),
    groupCount: groups.length,
    groupStart: starts(groups),
    groupCase: Int32Array.from(groups.flat()),
    scaledGroup: Int32Array.from(scaled, (s) => s.group),
    scaledFactor: Float64Array.from(scaled, (s) => s.factor),
    scaledSlot: Int32Array.from(scaled, (_, s) => scaledSlot(s)),
    choiceStart: starts(choiceTerms.map((c) => c.high)),
    choiceHigh: Int32Array.from(choiceTerms.flatMap((c) => c.high)),
    choiceLow: Int32Array.from(choiceTerms.flatMap((c) => c.low)),
    choiceSlot: Int32Array.from(choiceSlot),
    signedStart: starts(signedTerms.map((s) => s.slots)),
    signedSlot: Int32Array.from(signedTerms.flatMap((s) => s.slots)),
    signedOut: Int32Array.from(signedOut),
    liveBranch: Int32Array.from(live),
    liveStart: Int32Array.from(liveStart),
    branchHigh: Int32Array.from(branchHigh),
    branchLow: Int32Array.from(branchLow),
    namedStart: Int32Array.from(namedStart),
    namedTerm: Int32Array.from(named, (x) => x.term),
    namedAt: Int32Array.from(named, (x) => x.at),
    namedHigh: Int32Array.from(named, (x) => x.high),
    namedLow: Int32Array.from(named, (x) => x.low),
    namedStride: Float64Array.from(named, (x) => x.stride),
    namedSigned: Int32Array.from(named, (x) => signedOf.get(x.term) ?? -1),
    slotCount,
    sourceKind,
    sourceIndex,
    sourceFactor,
    runScaled,
    runLength,
    signedAt,
    signedNegatedAt,
  };
}

/** CSR starts of a list of lists. */
function starts(lists: readonly (readonly number[])[]): Int32Array {
  const out = new Int32Array(lists.length + 1);
  lists.forEach((l, i) => (out[i + 1] = out[i] + l.length));
  return out;
}
