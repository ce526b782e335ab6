/**
 * Reading a shipped ruleset's expansion as a factor table, so that tests can hold
 * it against a table typed from the standard's text. Only the reading is here;
 * every expected value lives in the tests, beside its source.
 */
import { expect } from "vitest";
import {
  comboRows,
  describeProblem,
  findShippedRuleset,
  planCombinations,
  resolveParameters,
  type ParameterInput,
  type Plan,
  type Ruleset,
} from "../../src/core/index.js";

export function shipped(id: string): Ruleset {
  const found = findShippedRuleset(id);
  if (!found) throw new Error(`no shipped ruleset "${id}"`);
  return found.ruleset;
}

/** A plan for these case headers ("D", "W:N"): the symbol is what stands before any ":". */
export function planWith(ruleset: Ruleset, parameters: ParameterInput, headers: string[]): Plan {
  const resolved = resolveParameters(ruleset, parameters);
  if (!resolved.ok) throw new Error(resolved.problems.map((p) => describeProblem(p)).join("; "));
  const plan = planCombinations(ruleset, resolved.value, { cases: headers.map((h) => ({ header: h, symbol: h.split(":")[0] })) });
  if (!plan.ok) throw new Error(plan.problems.map((p) => describeProblem(p)).join("; "));
  return plan.value;
}

/** One concrete row: its combination id and the factor on each case header it loads. */
export interface FactorRow {
  id: string;
  factors: Record<string, number>;
}

export const row = (id: string, factors: Record<string, number>): FactorRow => ({ id, factors });

/** Every concrete row, terms left out and loads reversed included. */
export function allRows(plan: Plan): FactorRow[] {
  const listed = comboRows(plan);
  if (!listed.ok) throw new Error(listed.problems.map((p) => describeProblem(p)).join("; "));
  return listed.value.map((r) => ({ id: r.combination, factors: factorsByHeader(plan, r.factors) }));
}

function factorsByHeader(plan: Plan, factors: number[]): Record<string, number> {
  const out: Record<string, number> = {};
  factors.forEach((f, i) => {
    if (f !== 0) out[plan.cases[i].header] = f;
  });
  return out;
}

/**
 * The rows in which every term that can act does act, and every reversible load
 * acts in its positive direction: the rows a standard prints. (The engine also
 * lists each term left out and each reversed direction; the full counts are
 * checked in rowCounts.test.ts.) A term that has no way to act — its loads are
 * not in the table, or its factor is zero — counts as acting.
 */
export function printedRows(plan: Plan): FactorRow[] {
  const listed = comboRows(plan);
  if (!listed.ok) throw new Error(listed.problems.map((p) => describeProblem(p)).join("; "));
  const reversible = new Set(plan.ruleset.symbols.filter((s) => s.reversible).map((s) => s.name));
  const out: FactorRow[] = [];
  for (const r of listed.value) {
    const branch = plan.combinations[r.row.combination].branches[r.row.branch];
    const everyTermActs = branch.terms.every((term, t) => !term.options[r.row.choices[t]].absent || term.options.every((o) => o.absent));
    if (!everyTermActs) continue;
    const positive = r.factors.every((f, i) => !reversible.has(plan.cases[i].symbol) || f >= 0);
    if (!positive) continue;
    out.push({ id: r.combination, factors: factorsByHeader(plan, r.factors) });
  }
  return out;
}

/** "2: D 1.2, L 1.6, Lr 0.5" with factors to ten significant digits and headers in a fixed order. */
export function rowText(r: FactorRow): string {
  const parts = Object.entries(r.factors)
    .filter(([, f]) => f !== 0)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))
    .map(([h, f]) => `${h} ${Number(f.toPrecision(10))}`);
  return `${r.id}: ${parts.join(", ")}`;
}

/** The printed rows equal the expected ones, as multisets (order of listing aside). */
export function expectPrintedRows(plan: Plan, expected: FactorRow[]): void {
  expect(printedRows(plan).map(rowText).sort()).toEqual(expected.map(rowText).sort());
}

/** Each combination's terms that may be left out, as written. */
export function mayBeAbsent(plan: Plan): Record<string, string[]> {
  return Object.fromEntries(plan.combinations.map((c) => [c.combination.id, c.mayBeAbsent]));
}
