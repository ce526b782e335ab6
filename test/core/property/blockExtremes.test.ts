/**
 * The block evaluator (evaluate/blockExtremes.ts, on plan/blockPlan.ts) is
 * held to the compiled plan's evaluator (evaluate/extremes.ts), which
 * envelopeMatchesEnumeration.test.ts holds to brute force: for every result
 * row, the same largest and smallest values bit for bit (Object.is), the same
 * branches, the same option in every term and the same row numbers.
 *
 * Two sources of plans: random rulesets as the planner makes them, and plans
 * written here option by option to reach what the block layout reads in its
 * own way — three or more single-case options with one factor (a scan of case
 * values), options paired with their exact negation, terms with one thing to
 * choose, terms with none — over case values chosen to tie, overflow, and
 * not be numbers (NaN, ±Infinity, −0, the smallest subnormal).
 */
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import type { Plan } from "../../../src/core/index.js";
import { compilePlan, rowKey, type CompiledPlan } from "../../../src/core/plan/compiledPlan.js";
import { makeBlockPlan } from "../../../src/core/plan/blockPlan.js";
import { blockExtremesEvaluator, extremesBlock } from "../../../src/core/evaluate/blockExtremes.js";
import { extremesEvaluator } from "../../../src/core/evaluate/extremes.js";
import type { Contribution, PlannedTerm, TermOption } from "../../../src/core/plan/types.js";
import { plannedTable } from "./randomRulesets.js";

/** Block and row-by-row evaluation of `rows` (caseCount values each) agree in everything they report. */
function expectSameAsGeneral(compiled: CompiledPlan, values: Float64Array, rows: number): void {
  const general = extremesEvaluator(compiled);
  const block = blockExtremesEvaluator(compiled);
  const out = extremesBlock(compiled, rows);
  const width = compiled.maxTerms;
  const done = block.evaluate(values, rows, out, true);
  for (let n = 0; n < rows; n++) {
    const e = general.evaluateAt(values, n * compiled.caseCount);
    if (!e) {
      expect(done).toBe(-1);
      return;
    }
    const where = `row ${n}: ${Array.from(values.subarray(n * compiled.caseCount, (n + 1) * compiled.caseCount)).join(", ")}`;
    if (!e.finite) {
      // The block stops at the first result row with a concrete row that is not finite, and names the same one.
      expect(done, where).toBe(n);
      expect(out.faultBranch, where).toBe(e.faultBranch);
      const terms = compiled.branchStart[e.faultBranch + 1] - compiled.branchStart[e.faultBranch];
      expect(Array.from(out.faultChoices.subarray(0, terms)), where).toEqual(Array.from(e.faultChoices.subarray(0, terms)));
      break;
    }
    expect(done, where).toBeGreaterThan(n);
    expect(Object.is(out.maxValue[n], e.maxValue), `${where}: max ${out.maxValue[n]} vs ${e.maxValue}`).toBe(true);
    expect(Object.is(out.minValue[n], e.minValue), `${where}: min ${out.minValue[n]} vs ${e.minValue}`).toBe(true);
    expect(out.maxBranch[n], where).toBe(e.maxBranch);
    expect(out.minBranch[n], where).toBe(e.minBranch);
    const terms = (b: number) => compiled.branchStart[b + 1] - compiled.branchStart[b];
    expect(Array.from(out.maxChoices.subarray(n * width, n * width + terms(e.maxBranch))), where).toEqual(Array.from(e.maxChoices.subarray(0, terms(e.maxBranch))));
    expect(Array.from(out.minChoices.subarray(n * width, n * width + terms(e.minBranch))), where).toEqual(Array.from(e.minChoices.subarray(0, terms(e.minBranch))));
    expect(out.maxRow[n]).toBe(rowKey(compiled, e.maxBranch, e.maxChoices));
    expect(out.minRow[n]).toBe(rowKey(compiled, e.minBranch, e.minChoices));
  }
  // Without rows, the same values and branches.
  const bare = extremesBlock(compiled, rows);
  expect(block.evaluate(values, rows, bare, false)).toBe(done);
  for (let n = 0; n < done; n++) {
    expect(Object.is(bare.maxValue[n], out.maxValue[n])).toBe(true);
    expect(Object.is(bare.minValue[n], out.minValue[n])).toBe(true);
    expect(bare.maxBranch[n]).toBe(out.maxBranch[n]);
    expect(bare.minBranch[n]).toBe(out.minBranch[n]);
  }
}

describe("the block evaluator", () => {
  test("gives what the compiled plan's evaluator gives on random rulesets and tables", () => {
    fc.assert(
      fc.property(plannedTable, ({ table, plan }) => {
        const compiled = compilePlan(plan);
        const cases = table.cases.length;
        // The table's components, and all zeros (every row ties).
        const rows = table.values.length + 1;
        const values = new Float64Array(rows * cases);
        table.values.forEach((x, n) => values.set(x, n * cases));
        expectSameAsGeneral(compiled, values, rows);
      }),
      { numRuns: 1000, seed: 20261204 },
    );
  });

  test("gives what the compiled plan's evaluator gives on plans made to reach every shortcut, with values that tie, overflow or are not numbers", () => {
    fc.assert(
      fc.property(writtenPlan, ({ plan, values, rows }) => {
        const compiled = compilePlan(plan);
        expectSameAsGeneral(compiled, Float64Array.from(values), rows);
      }),
      { numRuns: 3000, seed: 7 },
    );
  });

  test("reads an ASCE-like list through its shortcuts: a scan of eight directions shared by two terms, an orthogonal term as magnitudes", () => {
    // 16 cases: D, D2, L, Lr, S, R, W1–W8, Ex, Ey; factors invented, shaped like a strength list with wind one way.
    const single = (c: number, f: number): TermOption => option([c, f]);
    const none = option();
    const wind = (f: number) => [6, 7, 8, 9, 10, 11, 12, 13].map((c) => single(c, f));
    const orthogonal = [1, -1].flatMap((sx) => [1, -1].map((sy) => option([14, sx * 1.3], [15, sy * 0.39])));
    const orthogonalOther = [1, -1].flatMap((sx) => [1, -1].map((sy) => option([14, sx * 0.39], [15, sy * 1.3])));
    const plan = planOf(16, [
      [[[option([0, 1.2], [1, 1.2])], [single(3, 0.5), single(4, 0.5), single(5, 0.5), none], [single(2, 1), ...wind(0.5), none]]],
      [[[option([0, 1.2], [1, 1.2])], wind(1), [single(2, 1), none]]],
      [[[option([0, 0.9], [1, 0.9])], [...orthogonal, ...orthogonalOther]]],
    ]);
    const compiled = compilePlan(plan);
    const block = makeBlockPlan(compiled);
    expect(block.groupCount).toBe(2); // the eight directions, and Lr, S, R
    expect(block.scaledFactor.length).toBe(3); // wind at 0.5 and at 1, Lr/S/R at 0.5
    expect(block.signedOut.length).toBe(1); // the orthogonal term
    expect(Array.from(block.runScaled).filter((s) => s >= 0).length).toBe(3); // each wind term's directions, and Lr, S, R, in case order
    const values = Array.from({ length: 64 * 16 }, (_, k) => ((k * 7919) % 41) - 20);
    expectSameAsGeneral(compiled, Float64Array.from(values), 64);
  });
});

test("names rows of a term of directions each followed by its negation (W both ways) as the term-by-term reading does", () => {
  // 10 cases: G, Q, W1–W8; factors invented, shaped like a list with wind taken both ways.
  const both = (f: number) => [2, 3, 4, 5, 6, 7, 8, 9].flatMap((c) => [option([c, f]), option([c, -f])]);
  const plan = planOf(10, [
    [[[option([0, 1.35])], [option([1, 1.5]), option()], [...both(0.9), option()]]],
    [[[option([0, 1])], [...both(1.5), option()], [option([1, 1.05]), option()]]],
  ]);
  const compiled = compilePlan(plan);
  const block = makeBlockPlan(compiled);
  expect(block.signedOut.length).toBe(2);
  // Directions that tie in size with either sign, and rows of zeros.
  const values = Array.from({ length: 80 * 10 }, (_, k) => (k % 170 < 10 ? 0 : (((k * 7919) % 9) - 4) * (k % 3 === 0 ? -1 : 1)));
  expectSameAsGeneral(compiled, Float64Array.from(values), 80);
});

function option(...factors: [number, number][]): TermOption {
  const contributions: Contribution[] = factors.map(([caseIndex, factor]) => ({ caseIndex, factor, why: "invented" }));
  return { contributions, absent: contributions.length === 0 };
}

/**
 * A plan as the planner's types describe it, written directly: combinations of
 * branches of terms of options. Only what the compiled plan reads is filled
 * in; the ruleset behind it does not exist.
 */
function planOf(caseCount: number, combinations: TermOption[][][][]): Plan {
  const cases = Array.from({ length: caseCount }, (_, k) => ({ header: `C${k}`, symbol: "C" }));
  return {
    cases,
    combinations: combinations.map((branches) => ({
      branches: branches.map((terms) => ({ note: "", terms: terms.map((options, t): PlannedTerm => ({ text: `t${t}`, options })) })),
    })),
  } as unknown as Plan;
}

/** Factors and values chosen to collide: equal products, exact negations, zeros of both signs, overflow, NaN. */
const FACTORS = [1, -1, 0.5, -0.5, 1.6, 0.3, 0.1, 0, -0, 1e308, 2, 3];
const TYING = [0, -0, 1, -1, 2, 0.1, 0.2, 0.3, -0.3, 3];
const EXTREME = [1e308, -1e308, Infinity, -Infinity, NaN, 5e-324, 2 ** -1000, -(2 ** -1001), 2 ** -1022];
const value = fc.oneof({ weight: 12, arbitrary: fc.constantFrom(...TYING) }, { weight: 1, arbitrary: fc.constantFrom(...EXTREME) });

const writtenPlan = fc.integer({ min: 1, max: 6 }).chain((caseCount) => {
  const contribution = fc.tuple(fc.integer({ min: 0, max: caseCount - 1 }), fc.constantFrom(...FACTORS));
  const plain = fc.array(contribution, { minLength: 0, maxLength: 3 });
  // A term: options drawn from plain ones, each possibly with its exact negation beside it, or a run of one factor over many cases.
  const term = fc.oneof(
    fc.array(fc.tuple(plain, fc.boolean()), { minLength: 0, maxLength: 5 }).map((list) => list.flatMap(([c, withNegation]) => (withNegation ? [c, c.map(([k, f]): [number, number] => [k, -f])] : [c]))),
    fc
      .tuple(
        fc.array(
          fc.tuple(
            fc.constantFrom(...FACTORS),
            // In case order (as a run the block layout names in one step) or in any order.
            fc.oneof(fc.subarray(Array.from({ length: caseCount }, (_, k) => k), { minLength: 1 }), fc.shuffledSubarray(Array.from({ length: caseCount }, (_, k) => k), { minLength: 1 })),
          ),
          { minLength: 1, maxLength: 2 },
        ),
        fc.array(plain, { maxLength: 2 }),
        fc.boolean(),
      )
      .map(([runs, extra, withNone]) => [...extra, ...runs.flatMap(([f, cases]) => cases.map((k): [number, number][] => [[k, f]])), ...(withNone ? [[]] : [])]),
  );
  const branch = fc.array(term, { minLength: 1, maxLength: 4 });
  const combination = fc.array(branch, { minLength: 1, maxLength: 3 });
  return fc.record({
    combinations: fc.array(combination, { minLength: 1, maxLength: 3 }),
    rows: fc.integer({ min: 1, max: 6 }),
    pool: fc.array(value, { minLength: 30, maxLength: 30 }),
  }).map(({ combinations, rows, pool }) => ({
    plan: planOf(
      caseCount,
      combinations.map((branches) => branches.map((terms) => terms.map((options) => options.map((factors) => option(...factors))))),
    ),
    rows,
    values: Array.from({ length: rows * caseCount }, (_, k) => pool[k % pool.length]),
    [fc.toStringMethod]: () => JSON.stringify({ caseCount, combinations, values: pool }),
  }));
});
