/**
 * A plan flattened into typed arrays for evaluation row after row: every
 * distinct option once (its factors on cases as a sparse CSR matrix), every
 * distinct term once (its options, in order), and every branch of every
 * combination as a list of terms. An option such as 1.2D or a term such as
 * "W, each direction both ways" recurs across combinations and branches; here
 * it is valued once per result row.
 *
 * Nothing changes in what the plan means: the options of a term keep their
 * order, so "first option wins" still names the same row, and each option's
 * factors keep the plan's order, so every value is summed exactly as before.
 */
import type { Plan, RowRef, TermOption } from "./types.js";

export interface CompiledPlan {
  plan: Plan;
  caseCount: number;

  /** Distinct options: option o loads case optionCase[k] with optionFactor[k] for k in optionStart[o] … optionStart[o+1]. */
  optionCount: number;
  optionStart: Int32Array;
  optionCase: Int32Array;
  optionFactor: Float64Array;

  /** Distinct terms: term t takes option termOptions[k] for k in termStart[t] … termStart[t+1], in the plan's order. */
  termCount: number;
  termStart: Int32Array;
  termOptions: Int32Array;

  /** Branches in plan order (combination, then branch): branch b adds terms branchTerms[k] for k in branchStart[b] … branchStart[b+1]. */
  branchCount: number;
  branchStart: Int32Array;
  branchTerms: Int32Array;
  /** Combination and branch (within its combination) of each flat branch. */
  branchCombination: Int32Array;
  branchWithin: Int32Array;
  /** Flat index of each combination's first branch. */
  combinationBranch: Int32Array;
  /** The most terms in any branch: the length of a choices array. */
  maxTerms: number;

  /**
   * Row numbers (0-based, in the order enumerateRows lists them): row number of
   * a branch's first row, and per branch term the step one option further
   * takes (the first term outermost). Exact while the plan has at most 2^53 rows.
   */
  branchFirstRow: Float64Array;
  termStride: Float64Array;
  rowNumbersExact: boolean;

  /** Labels already written, by row number (or branch and choices where row numbers are not exact). */
  labels: Map<number | string, string>;
}

/** Labels kept per plan before the oldest are dropped: a long export names the same few rows again and again. */
export const LABEL_CACHE_LIMIT = 50_000;

const compiled = new WeakMap<Plan, CompiledPlan>();

/** The plan's compiled form, made once per plan. */
export function compiledPlanOf(plan: Plan): CompiledPlan {
  let c = compiled.get(plan);
  if (!c) compiled.set(plan, (c = compilePlan(plan)));
  return c;
}

/** A double's two 32-bit halves, for hashing a factor (0 and −0, which are the same factor, hashed alike). */
const factorBits = new Float64Array(1);
const factorHalves = new Int32Array(factorBits.buffer);

function mix(h: number, x: number): number {
  return Math.imul(h ^ x, 0x01000193);
}

export function compilePlan(plan: Plan): CompiledPlan {
  // Options and terms found again by a hash of their content, confirmed by comparing it: no key text per option.
  const optionIds = new Map<number, number[]>();
  let optionCount = 0;
  const optionStart: number[] = [0];
  const optionCase: number[] = [];
  const optionFactor: number[] = [];
  const termIds = new Map<number, number[]>();
  let termCount = 0;
  const termStart: number[] = [0];
  const termOptions: number[] = [];
  const branchStart: number[] = [0];
  const branchTerms: number[] = [];
  const branchCombination: number[] = [];
  const branchWithin: number[] = [];
  const combinationBranch: number[] = [];
  const branchFirstRow: number[] = [];
  const termStride: number[] = [];
  let maxTerms = 0;
  let rows = 0;

  const optionId = (option: TermOption): number => {
    const cs = option.contributions;
    let h = 0x811c9dc5 | 0;
    for (const x of cs) {
      factorBits[0] = x.factor === 0 ? 0 : x.factor;
      h = mix(mix(mix(h, x.caseIndex), factorHalves[0]), factorHalves[1]);
    }
    let bucket = optionIds.get(h);
    if (bucket === undefined) optionIds.set(h, (bucket = []));
    else {
      // The same option: the same cases with the same factors, in the same order.
      for (const id of bucket) {
        const first = optionStart[id];
        if (optionStart[id + 1] - first !== cs.length) continue;
        let k = 0;
        while (k < cs.length && optionCase[first + k] === cs[k].caseIndex && optionFactor[first + k] === cs[k].factor) k++;
        if (k === cs.length) return id;
      }
    }
    const id = optionCount++;
    bucket.push(id);
    for (const x of cs) {
      optionCase.push(x.caseIndex);
      optionFactor.push(x.factor);
    }
    optionStart.push(optionCase.length);
    return id;
  };

  const termId = (options: number[]): number => {
    let h = 0x811c9dc5 | 0;
    for (const o of options) h = mix(h, o);
    let bucket = termIds.get(h);
    if (bucket === undefined) termIds.set(h, (bucket = []));
    else {
      for (const id of bucket) {
        const first = termStart[id];
        if (termStart[id + 1] - first !== options.length) continue;
        let k = 0;
        while (k < options.length && termOptions[first + k] === options[k]) k++;
        if (k === options.length) return id;
      }
    }
    const id = termCount++;
    bucket.push(id);
    // A loop, not a spread: a term may have 200,000 options (100,000 cases of a reversible symbol).
    for (const o of options) termOptions.push(o);
    termStart.push(termOptions.length);
    return id;
  };

  plan.combinations.forEach((planned, c) => {
    combinationBranch.push(branchCombination.length);
    planned.branches.forEach((branch, b) => {
      const ids = branch.terms.map((term) => termId(term.options.map(optionId)));
      for (const t of ids) branchTerms.push(t);
      branchStart.push(branchTerms.length);
      branchCombination.push(c);
      branchWithin.push(b);
      maxTerms = Math.max(maxTerms, ids.length);
      // Strides: the last term innermost, as enumerateRows counts.
      const sizes = branch.terms.map((t) => t.options.length);
      const strides = new Array<number>(sizes.length);
      let step = 1;
      for (let t = sizes.length - 1; t >= 0; t--) {
        strides[t] = step;
        step *= sizes[t];
      }
      for (const stride of strides) termStride.push(stride);
      branchFirstRow.push(rows);
      // A branch with a term of no options has no rows (enumerateRows skips it).
      if (!sizes.includes(0)) rows += step;
    });
  });

  return {
    plan,
    caseCount: plan.cases.length,
    optionCount,
    optionStart: Int32Array.from(optionStart),
    optionCase: Int32Array.from(optionCase),
    optionFactor: Float64Array.from(optionFactor),
    termCount,
    termStart: Int32Array.from(termStart),
    termOptions: Int32Array.from(termOptions),
    branchCount: branchCombination.length,
    branchStart: Int32Array.from(branchStart),
    branchTerms: Int32Array.from(branchTerms),
    branchCombination: Int32Array.from(branchCombination),
    branchWithin: Int32Array.from(branchWithin),
    combinationBranch: Int32Array.from(combinationBranch),
    maxTerms,
    branchFirstRow: Float64Array.from(branchFirstRow),
    termStride: Float64Array.from(termStride),
    rowNumbersExact: rows <= Number.MAX_SAFE_INTEGER,
    labels: new Map(),
  };
}

/** The plan's own reference to a row: flat branch b and one option per term. */
export function rowRefOf(c: CompiledPlan, branch: number, choices: ArrayLike<number>): RowRef {
  const terms = c.branchStart[branch + 1] - c.branchStart[branch];
  const copy = new Array<number>(terms);
  for (let t = 0; t < terms; t++) copy[t] = choices[t];
  return { combination: c.branchCombination[branch], branch: c.branchWithin[branch], choices: copy };
}

/** The flat branch of a row reference. */
export function flatBranch(c: CompiledPlan, ref: RowRef): number {
  return c.combinationBranch[ref.combination] + ref.branch;
}

/** A key naming one row: its row number where exact, else the branch and choices written out. Choices from `from` on. */
export function rowKey(c: CompiledPlan, branch: number, choices: ArrayLike<number>, from = 0): number | string {
  const first = c.branchStart[branch];
  const terms = c.branchStart[branch + 1] - first;
  if (c.rowNumbersExact) {
    let row = c.branchFirstRow[branch];
    for (let t = 0; t < terms; t++) row += choices[from + t] * c.termStride[first + t];
    return row;
  }
  let key = `${branch}/`;
  for (let t = 0; t < terms; t++) key += `${t > 0 ? "," : ""}${choices[from + t]}`;
  return key;
}
