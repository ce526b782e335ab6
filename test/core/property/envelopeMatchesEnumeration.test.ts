/**
 * The engine's exactness claim (DESIGN.md, "Exactness and speed"): envelopes
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
  type CaseTable,
  type Plan,
  type Ruleset,
} from "../../../src/core/index.js";
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
