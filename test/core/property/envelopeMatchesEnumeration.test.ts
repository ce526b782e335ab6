/**
 * The engine's exactness claim (docs/design.md, "Exactness"): envelopes
 * and governing rows found term by term equal brute-force enumeration of every
 * concrete row. The brute force here is referenceRows.ts, an independent
 * reading of the documented semantics; the engine's own row listing is held to
 * it as well. Several thousand random rulesets and case tables per run.
 */
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  enumerateRows,
  envelope,
  governing,
  loadRuleset,
  parseCriterion,
  planForTable,
  readCaseTable,
  rowValue,
  extremes,
  type CaseTable,
  type Plan,
  type RowRef,
  type Ruleset,
} from "../../../src/core/index.js";
import { compilePlan, rowKey, rowRefOf, type CompiledPlan } from "../../../src/core/plan/compiledPlan.js";
import { extremesEvaluator } from "../../../src/core/evaluate/extremes.js";
import { rowContributions } from "../../../src/core/evaluate/rows.js";
import { dot, referenceRows, vectorKey, type Vector } from "./referenceRows.js";
import { caseHeaders, caseTable, rulesetFile } from "./randomRulesets.js";

const NUMBERS = new Map([
  ["a", 1.3],
  ["b", 0.4],
  ["q", 0.3],
  ["pS", 0.5],
]);

/** Rows beyond this are skipped (fc.pre) to keep the brute force quick. */
const MAX_ROWS = 3000;

interface Case {
  ruleset: Ruleset;
  table: CaseTable;
  plan: Plan;
  reference: Vector[];
}

/** Generated as plain data (expressions and a table), so a counterexample prints readably. */
const scenario = fc
  .tuple(rulesetFile, caseHeaders)
  .chain(([file, headers]) => caseTable(headers).map((matrix) => ({ expressions: file.combinations.map((c) => c.expression), matrix, file })))
  .map(({ expressions, matrix, file }) => ({ file, matrix, [fc.toStringMethod]: () => JSON.stringify({ expressions, matrix }) }));

function build(s: { file: Parameters<typeof loadRuleset>[0]; matrix: (string | number | null)[][] }): Case | null {
  const ruleset = loadRuleset(s.file);
  if (!ruleset.ok) throw new Error(`generated ruleset refused: ${JSON.stringify(ruleset.problems)}`);
  const table = readCaseTable(s.matrix, ruleset.value, { orientation: "rows" });
  if (!table.ok) throw new Error(`generated table refused: ${JSON.stringify(table.problems)}`);
  const plan = planForTable(ruleset.value, {}, table.value);
  if (!plan.ok) throw new Error(`plan refused: ${JSON.stringify(plan.problems)}`);
  if (plan.value.rowCount > MAX_ROWS) return null;
  const reference = referenceRows(ruleset.value, NUMBERS, table.value.cases.map((c) => c.symbol));
  return { ruleset: ruleset.value, table: table.value, plan: plan.value, reference };
}

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

describe("the fast envelope", () => {
  test("equals the max and min of brute-force enumeration for every component", () => {
    let checked = 0;
    fc.assert(
      fc.property(scenario, (generated) => {
        const c = build(generated);
        fc.pre(c !== null);
        const { plan, table, reference } = c as Case;
        if (reference.length === 0) {
          expect(plan.rowCount).toBe(0);
          return;
        }
        const result = envelope(plan, table);
        expect(result.ok).toBe(true);
        if (!result.ok) return;
        table.values.forEach((x, k) => {
          const values = reference.map((v) => dot(v, x));
          const max = Math.max(...values);
          const min = Math.min(...values);
          const entry = result.value[k];
          expect(close(entry.max.value, max), `max ${entry.max.value} vs ${max} (${entry.max.label})`).toBe(true);
          expect(close(entry.min.value, min), `min ${entry.min.value} vs ${min} (${entry.min.label})`).toBe(true);
          // The row named is a real row and gives that value.
          expect(close(rowValue(plan, entry.max.row, x), max)).toBe(true);
          expect(close(rowValue(plan, entry.min.row, x), min)).toBe(true);
        });
        checked++;
      }),
      { numRuns: 2500, seed: 20261202 },
    );
    expect(checked).toBeGreaterThan(1500);
  });
});

describe("the engine's row listing", () => {
  test("holds exactly the concrete rows of brute-force enumeration", () => {
    fc.assert(
      fc.property(scenario, (generated) => {
        const c = build(generated);
        fc.pre(c !== null);
        const { plan, reference } = c as Case;
        const engine = new Set<string>();
        for (const ref of enumerateRows(plan)) engine.add(vectorKey(new Map(rowContributions(plan, ref).map((x) => [x.caseIndex, x.factor]))));
        const expected = new Set(reference.map(vectorKey));
        expect([...engine].sort()).toEqual([...expected].sort());
      }),
      { numRuns: 800, seed: 7 },
    );
  });
});

describe("governing rows", () => {
  const criteria = ["max V1 - 2*V2", "min 0.5*V1 + V3", "max |V1 + V2|", "max V1*V2", "min |V1| + |V2|"];

  test("match brute force for linear, absolute-value and non-linear criteria", () => {
    fc.assert(
      fc.property(scenario, (generated) => {
        const c = build(generated);
        fc.pre(c !== null && c.table.components.length === 3);
        const { plan, table, reference } = c as Case;
        fc.pre(reference.length > 0);
        const parsed = criteria.map((t) => parseCriterion(t, table.components));
        const list = parsed.map((p) => (p.ok ? p.value : null)).filter((p) => p !== null);
        expect(list).toHaveLength(criteria.length);
        const result = governing(plan, table, list);
        expect(result.ok).toBe(true);
        if (!result.ok) return;
        // Brute force: every reference row's component values, then each criterion by hand.
        const rows = reference.map((v) => table.values.map((x) => dot(v, x)));
        const f: ((r: number[]) => number)[] = [
          (r) => r[0] - 2 * r[1],
          (r) => 0.5 * r[0] + r[2],
          (r) => Math.abs(r[0] + r[1]),
          (r) => r[0] * r[1],
          (r) => Math.abs(r[0]) + Math.abs(r[1]),
        ];
        const senses = ["max", "min", "max", "max", "min"];
        criteria.forEach((text, k) => {
          const values = rows.map(f[k]);
          const best = senses[k] === "max" ? Math.max(...values) : Math.min(...values);
          const row = result.value.find((g) => g.criteria.includes(text));
          expect(row, text).toBeDefined();
          const value = (row as (typeof result.value)[number]).criterionValues[(row as (typeof result.value)[number]).criteria.indexOf(text)];
          expect(close(value, best), `${text}: ${value} vs ${best}`).toBe(true);
          // Concurrent values are that row's own values.
          expect(close(f[k]((row as (typeof result.value)[number]).values), value)).toBe(true);
        });
      }),
      { numRuns: 600, seed: 99 },
    );
  });
});

/**
 * The compiled plan (typed arrays, each distinct option and term once) is what
 * the envelope and governing rows evaluate. It is held here to the plan it was
 * made from: every concrete row it can name loads the cases the brute force
 * says, and the row it names for each extreme is the one the documented
 * tie-breaking gives (docs/design.md, "Exactness": first combination, branch,
 * option), found by the plainest reading of that rule over the plan's objects.
 */
describe("the compiled plan", () => {
  test("names exactly the concrete rows of brute-force enumeration", () => {
    fc.assert(
      fc.property(scenario, (generated) => {
        const c = build(generated);
        fc.pre(c !== null);
        const { plan, reference } = c as Case;
        const compiled = compilePlan(plan);
        const rows = new Set<string>();
        let count = 0;
        for (let b = 0; b < compiled.branchCount; b++) {
          for (const choices of allChoices(compiled, b)) {
            rows.add(vectorKey(compiledRowVector(compiled, b, choices)));
            // Row numbers count rows in the order enumerateRows lists them.
            expect(rowKey(compiled, b, choices)).toBe(count++);
          }
        }
        expect(count).toBe(plan.rowCount);
        expect([...rows].sort()).toEqual([...new Set(reference.map(vectorKey))].sort());
      }),
      { numRuns: 800, seed: 11 },
    );
  });

  test("gives the same extremes, bit for bit, and the same rows as the tie-breaking rule read plainly", () => {
    fc.assert(
      fc.property(scenario, (generated) => {
        const c = build(generated);
        fc.pre(c !== null);
        const { plan, table } = c as Case;
        const evaluator = extremesEvaluator(compilePlan(plan));
        // The table's values, and all zeros: where every row ties, the very first row is named.
        for (const x of [...table.values, new Float64Array(table.cases.length)]) {
          const plain = plainExtremes(plan, x);
          const found = evaluator.evaluate(x);
          if (plain === null) {
            expect(found).toBeNull();
            continue;
          }
          expect(found).not.toBeNull();
          if (!found) return;
          expect(Object.is(found.maxValue, plain.max.value)).toBe(true);
          expect(Object.is(found.minValue, plain.min.value)).toBe(true);
          expect(rowRefOf(evaluator.compiled, found.maxBranch, found.maxChoices)).toEqual(plain.max.row);
          expect(rowRefOf(evaluator.compiled, found.minBranch, found.minChoices)).toEqual(plain.min.row);
          expect(extremes(plan, x)).toEqual(plain);
        }
        const zero = evaluator.evaluate(new Float64Array(table.cases.length));
        if (zero) {
          const first = enumerateRows(plan).next().value;
          expect(rowRefOf(evaluator.compiled, zero.maxBranch, zero.maxChoices)).toEqual(first);
          expect(rowRefOf(evaluator.compiled, zero.minBranch, zero.minChoices)).toEqual(first);
        }
      }),
      { numRuns: 1500, seed: 20261203 },
    );
  });
});

/** Every choices vector of flat branch b, first term outermost. */
function* allChoices(compiled: CompiledPlan, b: number): Generator<number[]> {
  const terms = Array.from(compiled.branchTerms.subarray(compiled.branchStart[b], compiled.branchStart[b + 1]));
  const sizes = terms.map((t) => compiled.termStart[t + 1] - compiled.termStart[t]);
  if (sizes.some((n) => n === 0)) return;
  const choices = sizes.map(() => 0);
  for (;;) {
    yield [...choices];
    let t = sizes.length - 1;
    while (t >= 0 && ++choices[t] === sizes[t]) choices[t--] = 0;
    if (t < 0) return;
  }
}

/** The factors a row puts on cases, read from the compiled arrays alone. */
function compiledRowVector(compiled: CompiledPlan, b: number, choices: number[]): Vector {
  const v: Vector = new Map();
  choices.forEach((choice, t) => {
    const term = compiled.branchTerms[compiled.branchStart[b] + t];
    const option = compiled.termOptions[compiled.termStart[term] + choice];
    for (let k = compiled.optionStart[option]; k < compiled.optionStart[option + 1]; k++) {
      v.set(compiled.optionCase[k], (v.get(compiled.optionCase[k]) ?? 0) + compiled.optionFactor[k]);
    }
  });
  return v;
}

/**
 * The rule as written, over the plan's objects: in each branch every term takes
 * its first option of largest (smallest) value, the branch's value is the sum
 * in term order, and the first combination and branch of largest (smallest)
 * value is named.
 */
function plainExtremes(plan: Plan, x: ArrayLike<number>): { max: { value: number; row: RowRef }; min: { value: number; row: RowRef } } | null {
  let max: { value: number; row: RowRef } | null = null as { value: number; row: RowRef } | null;
  let min: { value: number; row: RowRef } | null = null as { value: number; row: RowRef } | null;
  plan.combinations.forEach((planned, c) =>
    planned.branches.forEach((branch, b) => {
      if (branch.terms.some((t) => t.options.length === 0)) return;
      const values = branch.terms.map((t) => t.options.map((o) => o.contributions.reduce((s, k) => s + k.factor * x[k.caseIndex], 0)));
      const high = values.map((v) => v.indexOf(Math.max(...v)));
      const low = values.map((v) => v.indexOf(Math.min(...v)));
      const highValue = values.reduce((s, v, t) => s + v[high[t]], 0);
      const lowValue = values.reduce((s, v, t) => s + v[low[t]], 0);
      if (max === null || highValue > max.value) max = { value: highValue, row: { combination: c, branch: b, choices: high } };
      if (min === null || lowValue < min.value) min = { value: lowValue, row: { combination: c, branch: b, choices: low } };
    }),
  );
  return max && min ? { max, min } : null;
}

/**
 * Case values near the largest double (about 1.8 × 10^308, IEEE 754 binary64):
 * a factored sum may pass it (±Infinity), and +Infinity and −Infinity in one
 * row give NaN, which no comparison picks — a max or min that skipped it would
 * be a silent wrong number. The fast evaluation must say "not finite" exactly
 * when some concrete row's value (summed row by row over the plan, in the
 * plan's order, as rowValue does) is not finite, and name such a row.
 */
describe("rows without a finite value", () => {
  /** Magnitudes that overflow under factors above 1, cancel to NaN, or stay finite. */
  const HOSTILE = [1.7e308, -1.7e308, 1e308, -1e308, 9e307, 1, -1, 0, 5e-324];
  const hostileScenario = scenario.chain((s) =>
    fc.array(fc.nat(HOSTILE.length - 1), { minLength: 64, maxLength: 64 }).map((picks) => {
      let k = 0;
      const matrix = s.matrix.map((row, r) => (r === 0 ? row : row.map((cell, c) => (c === 0 || cell === null ? cell : HOSTILE[picks[k++ % picks.length]]))));
      return { file: s.file, matrix, [fc.toStringMethod]: () => JSON.stringify({ expressions: s.file.combinations.map((c) => c.expression), matrix }) };
    }),
  );

  test("are found exactly when the row-by-row values hold one, and the row named is one of them", () => {
    let faults = 0;
    let finite = 0;
    fc.assert(
      fc.property(hostileScenario, (generated) => {
        const c = build(generated);
        fc.pre(c !== null);
        const { plan, table } = c as Case;
        const evaluator = extremesEvaluator(compilePlan(plan));
        for (const x of table.values) {
          const found = evaluator.evaluate(x);
          const rows = [...enumerateRows(plan)];
          if (found === null) {
            expect(rows).toEqual([]);
            continue;
          }
          const anyNotFinite = rows.some((ref) => !Number.isFinite(rowValue(plan, ref, x)));
          expect(found.finite, "finite").toBe(!anyNotFinite);
          if (found.finite) {
            finite++;
            continue;
          }
          faults++;
          const named = rowRefOf(evaluator.compiled, found.faultBranch, found.faultChoices);
          expect(Number.isFinite(rowValue(plan, named, x))).toBe(false);
          // The whole-table envelope refuses it, naming the component and that row.
          const e = extremes(plan, x);
          expect(e?.notFinite).toEqual(named);
        }
      }),
      { numRuns: 400, seed: 308 },
    );
    // Both kinds were met, so the check is not empty.
    expect(faults).toBeGreaterThan(50);
    expect(finite).toBeGreaterThan(50);
  });
});
