/**
 * Concrete rows: naming them, valuing them, listing them. A row's label is the
 * combination id and the factor on every case it loads, with the leading action
 * and the terms left out, so that a checker can re-derive any value by hand:
 *
 *   4: 1.2D + W:N + L + 0.5S
 *   2: 1.2D + 1.6L [absent: 0.5(Lr or S or R)]
 *   6.10: 1.35G + 1.5Q + 0.75S [Q leading; absent: W]
 */
import { rulesetName } from "../ruleset/model.js";
import type { CaseTable } from "../cases/readCaseTable.js";
import { fail, ok, problem, type Result } from "../problems.js";
import { compiledPlanOf, flatBranch, LABEL_CACHE_LIMIT, rowKey, rowRefOf, type CompiledPlan } from "../plan/compiledPlan.js";
import { formatNumber } from "../plan/factor.js";
import type { Contribution, Plan, RowRef, TermOption } from "../plan/types.js";

/** The value of one option for one vector of case values. Fast and exhaustive paths both sum this way. */
export function optionValue(option: TermOption, x: ArrayLike<number>): number {
  let v = 0;
  for (const c of option.contributions) v += c.factor * x[c.caseIndex];
  return v;
}

export function rowValue(plan: Plan, ref: RowRef, x: ArrayLike<number>): number {
  const branch = plan.combinations[ref.combination].branches[ref.branch];
  let v = 0;
  for (let t = 0; t < branch.terms.length; t++) v += optionValue(branch.terms[t].options[ref.choices[t]], x);
  return v;
}

/** Every factor the row puts on a case, in case order; factors on one case from several terms are added. */
export function rowContributions(plan: Plan, ref: RowRef): Contribution[] {
  const branch = plan.combinations[ref.combination].branches[ref.branch];
  const byCase = new Map<number, Contribution>();
  branch.terms.forEach((term, t) => {
    for (const c of term.options[ref.choices[t]].contributions) {
      const before = byCase.get(c.caseIndex);
      byCase.set(c.caseIndex, before ? { caseIndex: c.caseIndex, factor: before.factor + c.factor, why: `${before.why} + ${c.why}` } : c);
    }
  });
  return [...byCase.values()].filter((c) => c.factor !== 0).sort((a, b) => a.caseIndex - b.caseIndex);
}

/** Scratch for rowFactorText: the factor on each case and whether a term loads it (cleared after each use). */
let caseFactors = new Float64Array(64);
let caseSeen = new Uint8Array(64);

/** The row's factors in the ruleset's symbol order, with the cases of a summed symbol shown as the symbol. */
export function rowFactorText(plan: Plan, ref: RowRef): string {
  // The factor on each case, added in rowContributions' order; a case is loaded where its sum is not 0.
  const branch = plan.combinations[ref.combination].branches[ref.branch];
  if (caseSeen.length < plan.cases.length) {
    caseFactors = new Float64Array(plan.cases.length);
    caseSeen = new Uint8Array(plan.cases.length);
  }
  const factors = caseFactors;
  const seen = caseSeen;
  for (let t = 0; t < branch.terms.length; t++) {
    for (const c of branch.terms[t].options[ref.choices[t]].contributions) {
      const i = c.caseIndex;
      if (seen[i] === 0) {
        seen[i] = 1;
        factors[i] = c.factor;
      } else factors[i] += c.factor;
    }
  }
  let text = "";
  for (const symbol of plan.ruleset.symbols) {
    const all = plan.casesOf.get(symbol.name);
    if (all === undefined) continue;
    let count = 0;
    let alike = true;
    let first = 0;
    for (const i of all) {
      if (seen[i] === 0 || factors[i] === 0) continue;
      if (count === 0) first = factors[i];
      else if (factors[i] !== first) alike = false;
      count++;
    }
    if (count === 0) continue;
    if (count === all.length && count > 1 && alike) {
      text = withFactor(text, first, symbol.name);
      continue;
    }
    for (const i of all) if (seen[i] === 1 && factors[i] !== 0) text = withFactor(text, factors[i], plan.cases[i].header);
  }
  for (let t = 0; t < branch.terms.length; t++) for (const c of branch.terms[t].options[ref.choices[t]].contributions) seen[c.caseIndex] = 0;
  return text === "" ? "(no load)" : text;
}

/** The text so far and one more factor on a case or symbol: "1.2D", " + 1.6L", " - W:N". */
function withFactor(text: string, factor: number, name: string): string {
  const size = Math.abs(factor);
  const coefficient = size === 1 ? "" : formatNumber(size);
  const first = text === "";
  const sign = factor < 0 ? (first ? "-" : " - ") : first ? "" : " + ";
  return `${text}${sign}${coefficient}${name}`;
}

/** A row's label, written once per plan and row (a long export names the same few rows again and again). */
export function rowLabel(plan: Plan, ref: RowRef): string {
  const compiled = compiledPlanOf(plan);
  return labelOf(compiled, flatBranch(compiled, ref), ref.choices);
}

/** The label of flat branch `branch` with one option per term (choices[from] on), from the plan's label cache. */
export function labelOf(compiled: CompiledPlan, branch: number, choices: Int32Array | readonly number[], from = 0): string {
  const key = rowKey(compiled, branch, choices, from);
  let label = compiled.labels.get(key);
  if (label === undefined) {
    if (compiled.labels.size >= LABEL_CACHE_LIMIT) compiled.labels.clear();
    label = composeLabel(compiled.plan, rowRefOf(compiled, branch, from === 0 ? choices : choices.slice(from)));
    compiled.labels.set(key, label);
  }
  return label;
}

function composeLabel(plan: Plan, ref: RowRef): string {
  const planned = plan.combinations[ref.combination];
  const branch = planned.branches[ref.branch];
  const absent = branch.terms.filter((term, t) => term.options[ref.choices[t]].absent).map((t) => t.text);
  const leaderAbsent = branch.leader !== undefined && branch.terms[branch.leader.term].options[ref.choices[branch.leader.term]].absent;
  const notes: string[] = [];
  if (branch.note && !leaderAbsent) notes.push(branch.note);
  if (absent.length > 0) notes.push(`absent: ${absent.join(", ")}`);
  return `${planned.combination.id}: ${rowFactorText(plan, ref)}${notes.length > 0 ? ` [${notes.join("; ")}]` : ""}`;
}

/** All rows in order: combinations, then branches, then options with the first term outermost. */
export function* enumerateRows(plan: Plan): Generator<RowRef> {
  for (let c = 0; c < plan.combinations.length; c++) {
    const branches = plan.combinations[c].branches;
    for (let b = 0; b < branches.length; b++) {
      const sizes = branches[b].terms.map((t) => t.options.length);
      if (sizes.some((n) => n === 0)) continue;
      const choices = sizes.map(() => 0);
      for (;;) {
        yield { combination: c, branch: b, choices: [...choices] };
        let t = sizes.length - 1;
        while (t >= 0 && ++choices[t] === sizes[t]) choices[t--] = 0;
        if (t < 0) break;
      }
    }
  }
}

/** Default cap on listing rows one by one; the envelope never lists and has no such cap. */
export const DEFAULT_ROW_LIMIT = 200_000;

/** Every row, or a problem that says how many there would be. */
export function listRows(plan: Plan, limit = DEFAULT_ROW_LIMIT): Result<RowRef[]> {
  if (plan.rowCount > limit) return fail(tooManyRows(plan.rowCount, limit));
  return ok([...enumerateRows(plan)]);
}

export function tooManyRows(count: number, limit: number) {
  return problem(
    "too-many-rows",
    `the ruleset expands to ${count.toLocaleString("en-US")} concrete rows for this case table, more than the limit of ${limit.toLocaleString("en-US")}; use the envelope or governing rows by max/min (exact without listing every row), or the command line`,
  );
}

/** Labels compare with typographic minus signs and extra spaces forgiven. */
export function sameLabel(a: string, b: string): boolean {
  const norm = (s: string) => s.replace(/[\u2212\u2013]/g, "-").replace(/\s+/g, " ").trim();
  return norm(a) === norm(b);
}

/** Each component's value in one row. */
export function rowValues(plan: Plan, table: CaseTable, ref: RowRef): number[] {
  return table.values.map((x) => rowValue(plan, ref, x));
}

export function noRows(plan: Plan) {
  const skipped = plan.combinations.filter((c) => c.skipped).map((c) => `${c.combination.id} (${c.skipped})`);
  return problem(
    "unknown-row",
    `no combination of ${rulesetName(plan.ruleset)} applies to this case table${skipped.length ? `: ${skipped.join("; ")}` : ""}`,
  );
}
