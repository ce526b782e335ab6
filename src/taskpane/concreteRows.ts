/**
 * What a comparison needs to show what the numbers will do: each combination's
 * concrete rows as factors on the load symbols ("D 1.2, L 1.6, S 0.5"), for the
 * parameter values the checker gives. compareRulesets forms these rows only
 * with every parameter's default, so a ruleset with a parameter that has no
 * default (SDS in the ASCE/SEI 7 rulesets) gets none; here the checker can give it.
 */
import {
  comboRows,
  compareRulesets,
  describeProblem,
  formatNumber,
  parseParameterText,
  planCombinations,
  resolveParameters,
  type EntryDifference,
  type ParameterInput,
  type Problem,
  type Result,
  type Ruleset,
  type RulesetComparison,
} from "../core/index.js";

/** Concrete rows per combination id, each as its factors on the symbols, in the ruleset's order. */
export function rowsByCombination(ruleset: Ruleset, input: ParameterInput): Result<Map<string, string[]>> {
  const params = resolveParameters(ruleset, input);
  if (!params.ok) return params;
  const plan = planCombinations(ruleset, params.value, { cases: null });
  if (!plan.ok) return plan;
  const rows = comboRows(plan.value);
  if (!rows.ok) return rows;
  const out = new Map<string, string[]>();
  for (const row of rows.value) {
    const factors = row.factors
      .map((f, i) => (f === 0 ? "" : `${plan.value.cases[i].header} ${formatNumber(f)}`))
      .filter((t) => t !== "")
      .join(", ");
    const list = out.get(row.combination) ?? [];
    if (!list.includes(factors)) list.push(factors);
    out.set(row.combination, list);
  }
  return { ok: true, value: out };
}

export interface CombinationChange extends EntryDifference {
  /** Null where the rows could not be formed (see `rowProblems`). */
  rowsOnlyBefore: string[] | null;
  rowsOnlyAfter: string[] | null;
}

export interface PaneComparison {
  comparison: RulesetComparison;
  combinations: CombinationChange[];
  /** Why one side's rows could not be formed (a parameter without default not given, say). */
  rowProblems: { before: string[]; after: string[] };
  /** Parameters given that one side does not declare (used only for the other). */
  notUsed: { before: string[]; after: string[] };
}

/** One line per distinct message, naming every combination it was found in: "… (combinations 6, 7)". */
function grouped(problems: readonly Problem[]): string[] {
  const byMessage = new Map<string, string[]>();
  const other: string[] = [];
  for (const p of problems) {
    if (p.place.entry === undefined) {
      other.push(describeProblem(p));
      continue;
    }
    const list = byMessage.get(p.message) ?? [];
    list.push(p.place.entry);
    byMessage.set(p.message, list);
  }
  return [...[...byMessage].map(([message, entries]) => `${message} (${entries.length === 1 ? "combination" : "combinations"} ${entries.join(", ")})`), ...other];
}

/** compareRulesets, with the concrete rows formed for the parameters in `paramsText` ("SDS=1.0; rho=1.3"). */
export function compareForPane(before: Ruleset, after: Ruleset, paramsText: string): Result<PaneComparison> {
  const given = parseParameterText(paramsText);
  if (!given.ok) return given;
  const declared = (r: Ruleset) => new Set(r.parameters.map((p) => p.name));
  const inBefore = declared(before);
  const inAfter = declared(after);
  const unknown = Object.keys(given.value).filter((n) => !inBefore.has(n) && !inAfter.has(n));
  if (unknown.length > 0) {
    return {
      ok: false,
      problems: unknown.map((n) => ({
        kind: "parameter-unknown" as const,
        message: `${n} is not a parameter of either ruleset (before: ${[...inBefore].join(", ") || "none"}; after: ${[...inAfter].join(", ") || "none"})`,
        place: { header: n, position: paramsText.indexOf(n) + 1 },
      })),
    };
  }
  const pick = (names: Set<string>) => Object.fromEntries(Object.entries(given.value).filter(([n]) => names.has(n)));
  const rowsBefore = rowsByCombination(before, pick(inBefore));
  const rowsAfter = rowsByCombination(after, pick(inAfter));
  const comparison = compareRulesets(before, after);

  const changes = new Map<string, CombinationChange>();
  for (const c of comparison.combinations) changes.set(c.name, { name: c.name, change: c.change, details: c.details.filter((d) => d !== "the concrete rows are the same"), rowsOnlyBefore: null, rowsOnlyAfter: null });
  const ids = [...before.combinations.map((c) => c.id), ...after.combinations.map((c) => c.id).filter((id) => !before.combinations.some((c) => c.id === id))];
  const combinations: CombinationChange[] = [];
  for (const id of ids) {
    let change = changes.get(id);
    if (rowsBefore.ok && rowsAfter.ok) {
      const a = rowsBefore.value.get(id) ?? [];
      const b = rowsAfter.value.get(id) ?? [];
      const onlyBefore = a.filter((r) => !b.includes(r));
      const onlyAfter = b.filter((r) => !a.includes(r));
      if (!change && onlyBefore.length + onlyAfter.length > 0) {
        change = { name: id, change: "changed", details: ["the text is the same; the concrete rows differ (a symbol or a parameter changed)"], rowsOnlyBefore: null, rowsOnlyAfter: null };
      }
      if (change) {
        change.rowsOnlyBefore = onlyBefore;
        change.rowsOnlyAfter = onlyAfter;
      }
    }
    if (change) combinations.push(change);
  }
  const problemsOf = (r: Result<unknown>) => (r.ok ? [] : grouped(r.problems));
  return {
    ok: true,
    value: {
      comparison,
      combinations,
      rowProblems: { before: problemsOf(rowsBefore), after: problemsOf(rowsAfter) },
      notUsed: {
        before: Object.keys(given.value).filter((n) => !inBefore.has(n)),
        after: Object.keys(given.value).filter((n) => !inAfter.has(n)),
      },
    },
  };
}
