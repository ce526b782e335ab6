/**
 * One value's derivation, as a checker would write it out by hand: which
 * combination and clause, the factor on every case and where it comes from, the
 * case values, the products and their sum, and the parameters in force.
 */
import type { CaseTable } from "../cases/readCaseTable.js";
import { fail, ok, problem, type Result } from "../problems.js";
import { formatNumber } from "../plan/factor.js";
import type { Plan, RowRef } from "../plan/types.js";
import { nearest } from "../text/nearest.js";
import type { Sum } from "../expression/ast.js";
import { valueNames } from "../expression/valueNames.js";
import type { Parameter } from "../ruleset/model.js";
import { notFiniteProblem } from "./notFinite.js";
import { enumerateRows, rowContributions, rowLabel, rowValue, sameLabel } from "./rows.js";

export interface ExplanationLine {
  case: string;
  factor: number;
  /** How the factor came about: "(1.2 + 0.2 × SDS)", "rho × 0.3 (orthogonal share)". */
  why: string;
  caseValue: number;
  product: number;
}

export interface Explanation {
  label: string;
  combination: string;
  clause: string;
  expression: string;
  component: string;
  lines: ExplanationLine[];
  total: number;
  parameters: { name: string; value: number | string; given: boolean }[];
  /** The derivation as lines of text, for a cell range or a terminal. */
  text: string[];
}

/** Row by its label, or by its 1-based number in the listing of all rows. */
export function findRow(plan: Plan, row: string | number): Result<RowRef> {
  if (typeof row === "number") {
    if (!Number.isInteger(row) || row < 1 || row > plan.rowCount) {
      return fail(problem("unknown-row", `row number ${row} is outside 1 … ${plan.rowCount}`));
    }
    let n = 0;
    for (const ref of enumerateRows(plan)) if (++n === row) return ok(ref);
  } else {
    const label = row.trim();
    for (let c = 0; c < plan.combinations.length; c++) {
      if (!label.startsWith(`${plan.combinations[c].combination.id}:`)) continue;
      for (const ref of enumerateRows({ ...plan, combinations: plan.combinations.slice(0, c + 1) })) {
        if (ref.combination === c && sameLabel(rowLabel(plan, ref), label)) return ok(ref);
      }
    }
    const ids = plan.combinations.map((c) => c.combination.id).join(", ");
    return fail(problem("unknown-row", `no row is labelled "${label}"; a label starts with the combination id (${ids}) and is written as the factored and listed outputs show it`));
  }
  return fail(problem("unknown-row", `row ${row} not found`));
}

export function explain(plan: Plan, table: CaseTable, row: string | number, component: string): Result<Explanation> {
  const componentIndex = table.components.indexOf(component.trim());
  if (componentIndex < 0) {
    const guess = nearest(component.trim(), table.components);
    return fail(
      problem("unknown-component", `"${component}" is not a component of the case table${guess ? `; did you mean "${guess}"?` : ""} (components: ${table.components.join(", ")})`),
    );
  }
  const found = findRow(plan, row);
  if (!found.ok) return found;
  const ref = found.value;
  const x = table.values[componentIndex];
  const lines: ExplanationLine[] = rowContributions(plan, ref).map((c) => ({
    case: plan.cases[c.caseIndex].header,
    factor: c.factor,
    why: c.why,
    caseValue: x[c.caseIndex],
    product: c.factor * x[c.caseIndex],
  }));
  const total = rowValue(plan, ref, x);
  const { combination } = plan.combinations[ref.combination];
  const label = rowLabel(plan, ref);
  if (!Number.isFinite(total) || lines.some((l) => !Number.isFinite(l.product))) {
    return fail(notFiniteProblem(JSON.stringify(table.components[componentIndex]), label, table.componentPlaces?.[componentIndex]));
  }
  const parameters = parametersRead(plan, combination.sum).map((p) => {
    const value = p.kind === "choice" ? (plan.parameters.choices.get(p.name) ?? p.default) : (plan.parameters.numbers.get(p.name) ?? 0);
    return { name: p.name, value, given: plan.parameters.given.has(p.name) };
  });
  const name = table.components[componentIndex];
  const f = formatNumber;
  const text = [
    `${label}`,
    `combination ${combination.id} (${combination.clause}): ${combination.expression}`,
    lines.length === 0
      ? `${name} = 0 (no case is loaded in this row)`
      : `${name} = ${signedSum(lines.map((l) => ({ value: l.factor, text: `${f(Math.abs(l.factor))} × ${l.caseValue < 0 ? `(${f(l.caseValue)})` : f(l.caseValue)} [${l.case}]` })))}`,
    ...(lines.length > 0 ? [`  = ${signedSum(lines.map((l) => ({ value: l.product, text: f(Math.abs(l.product)) })))}`, `  = ${f(total)}`] : []),
    ...lines.map((l) => `factor ${f(l.factor)} on ${l.case} = ${l.why}`),
    ...(parameters.length > 0
      ? [`parameters: ${parameters.map((p) => `${p.name} = ${typeof p.value === "number" ? f(p.value) : p.value} (${p.given ? "given" : "default"})`).join(", ")}`]
      : []),
  ];
  return ok({ label, combination: combination.id, clause: combination.clause, expression: combination.expression, component: name, lines, total, parameters, text });
}

/** The parameters a combination's factors read: directly, through symbol attributes, or as an orthogonal share. */
function parametersRead(plan: Plan, sum: Sum): Parameter[] {
  const names = valueNames(sum);
  for (const symbol of plan.ruleset.symbols) {
    for (const [attribute, value] of symbol.attributes) if (names.has(attribute) && typeof value === "string") names.add(value);
    if (typeof symbol.orthogonalShare === "string") names.add(symbol.orthogonalShare);
  }
  return plan.ruleset.parameters.filter((p) => names.has(p.name) || (p.kind === "choice" && p.valueNames.some((v) => names.has(v))));
}

/** Terms joined as a checker writes them: "23.4 - 28", not "23.4 + -28"; a leading minus kept. */
function signedSum(terms: { value: number; text: string }[]): string {
  return terms.map((t, k) => (k === 0 ? (t.value < 0 ? `-${t.text}` : t.text) : `${t.value < 0 ? " - " : " + "}${t.text}`)).join("");
}
