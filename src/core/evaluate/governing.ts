/**
 * Governing rows: the rows chosen by criteria, each with the concurrent values
 * of every component in that same row. Without criteria: the max and the min of
 * every component, a row that governs several criteria listed once.
 */
import type { CaseTable } from "../cases/readCaseTable.js";
import { fail, ok, type Result } from "../problems.js";
import type { Plan, RowRef } from "../plan/types.js";
import { criterionFault, evaluateCriterion, parseCriterion, type Affine, type Criterion } from "./criteria.js";
import { extremes } from "./extremes.js";
import { notFiniteProblem } from "./notFinite.js";
import { DEFAULT_ROW_LIMIT, enumerateRows, noRows, rowLabel, rowValues, tooManyRows } from "./rows.js";

export interface GoverningRow {
  /** The criteria this row governs, as written. */
  criteria: string[];
  /** The criterion values, in the order of `criteria`. */
  criterionValues: number[];
  row: RowRef;
  label: string;
  /** Every component's value in this row, in table order. */
  values: number[];
}

export interface GoverningOptions {
  /** Cap on rows evaluated one by one for criteria that are not linear. */
  rowLimit?: number;
}

/** "max X" and "min X" for every component. */
export function defaultCriteria(table: CaseTable): Criterion[] {
  const out: Criterion[] = [];
  for (const name of table.components) {
    const quoted = /^[\p{L}_][\p{L}\p{N}_]*$/u.test(name) ? name : `[${name}]`;
    for (const sense of ["max", "min"]) {
      const parsed = parseCriterion(`${sense} ${quoted}`, table.components);
      if (parsed.ok) out.push(parsed.value);
    }
  }
  return out;
}

export function governing(plan: Plan, table: CaseTable, criteria: Criterion[], options: GoverningOptions = {}): Result<GoverningRow[]> {
  if (plan.rowCount === 0) return fail(noRows(plan));
  const chosen: { criterion: Criterion; row: RowRef }[] = [];
  const exhaustive: Criterion[] = [];
  for (const criterion of criteria) {
    if (criterion.linear) {
      const x = project(table, criterion.linear);
      const e = extremes(plan, x);
      if (!e) return fail(noRows(plan));
      if (e.notFinite) return fail(notFiniteProblem(`criterion "${criterion.text}"`, rowLabel(plan, e.notFinite)));
      chosen.push({ criterion, row: criterion.sense === "max" ? e.max.row : e.min.row });
    } else if (criterion.absLinear) {
      const x = project(table, criterion.absLinear);
      const e = extremes(plan, x);
      if (!e) return fail(noRows(plan));
      if (e.notFinite) return fail(notFiniteProblem(`criterion "${criterion.text}"`, rowLabel(plan, e.notFinite)));
      const c = criterion.absLinear.constant;
      chosen.push({ criterion, row: Math.abs(e.max.value + c) >= Math.abs(e.min.value + c) ? e.max.row : e.min.row });
    } else {
      exhaustive.push(criterion);
    }
  }
  if (exhaustive.length > 0) {
    const limit = options.rowLimit ?? DEFAULT_ROW_LIMIT;
    if (plan.rowCount > limit) {
      const p = tooManyRows(plan.rowCount, limit);
      return fail({ ...p, message: `criterion "${exhaustive[0].text}" is not linear in the components, so every row must be evaluated: ${p.message}` });
    }
    const best = exhaustive.map(() => ({ value: NaN, row: null as RowRef | null }));
    for (const ref of enumerateRows(plan)) {
      const values = rowValues(plan, table, ref);
      for (let k = 0; k < exhaustive.length; k++) {
        const v = evaluateCriterion(exhaustive[k].expr, values);
        if (!Number.isFinite(v)) return fail(criterionFault(exhaustive[k], values, rowLabel(plan, ref)));
        const better = exhaustive[k].sense === "max" ? v > best[k].value : v < best[k].value;
        if (best[k].row === null || better) best[k] = { value: v, row: ref };
      }
    }
    exhaustive.forEach((criterion, k) => chosen.push({ criterion, row: best[k].row as RowRef }));
  }
  // Keep the criteria's order; merge rows chosen by several criteria.
  const order = new Map(criteria.map((c, i) => [c, i]));
  chosen.sort((a, b) => (order.get(a.criterion) ?? 0) - (order.get(b.criterion) ?? 0));
  const rows: GoverningRow[] = [];
  const byKey = new Map<string, GoverningRow>();
  for (const { criterion, row } of chosen) {
    const values = rowValues(plan, table, row);
    // Every concurrent value is shown: one past the largest double is refused with its component, as the criterion's own value is.
    const c = values.findIndex((v) => !Number.isFinite(v));
    if (c >= 0) return fail(notFiniteProblem(JSON.stringify(table.components[c]), rowLabel(plan, row), table.componentPlaces?.[c]));
    const value = evaluateCriterion(criterion.expr, values);
    if (!Number.isFinite(value)) return fail(criterionFault(criterion, values, rowLabel(plan, row)));
    const key = `${row.combination}/${row.branch}/${row.choices.join(",")}`;
    const existing = byKey.get(key);
    if (existing) {
      existing.criteria.push(criterion.text);
      existing.criterionValues.push(value);
      continue;
    }
    const g: GoverningRow = { criteria: [criterion.text], criterionValues: [value], row, label: rowLabel(plan, row), values };
    byKey.set(key, g);
    rows.push(g);
  }
  return ok(rows);
}

/** Case values projected on a criterion's weights: x[case] = Σ weight · value[component][case]. */
function project(table: CaseTable, a: Affine): Float64Array {
  const x = new Float64Array(table.cases.length);
  for (const [component, weight] of a.weights) {
    const v = table.values[component];
    for (let k = 0; k < x.length; k++) x[k] += weight * v[k];
  }
  return x;
}
