/**
 * What differs between two rulesets, as a checker needs to know it before
 * approving a new copy: identity fields, symbols, parameters, combinations by
 * id — and, for combinations, whether the concrete rows (the factors actually
 * applied) differ, not only the text.
 */
import { comboRows } from "../evaluate/combos.js";
import { formatNumber } from "../plan/factor.js";
import { planCombinations } from "../plan/planCombinations.js";
import { resolveParameters } from "../params/resolveParameters.js";
import { ok, type Problem, type Result } from "../problems.js";
import type { ParameterInput } from "../params/parameterInput.js";
import { fingerprintOf } from "./fingerprint.js";
import type { Ruleset } from "./model.js";

export type Change = "added" | "removed" | "changed";

export interface FieldDifference {
  field: string;
  before: string;
  after: string;
}

export interface EntryDifference {
  /** Symbol, parameter or combination id. */
  name: string;
  change: Change;
  /** What changed, in words: `expression: "1.2D + 1.6L" → "1.2D + 1.6L + 0.5S"`. */
  details: string[];
}

export interface CombinationDifference extends EntryDifference {
  /** Concrete rows (factors per symbol, defaults for parameters) only in the first / second ruleset; null where they could not be formed. */
  rowsOnlyBefore: string[] | null;
  rowsOnlyAfter: string[] | null;
}

export interface CompareOptions {
  /**
   * Parameter values to form the concrete rows with (each side takes those it
   * declares); without them, defaults — and a combination reading a parameter
   * without default cannot be formed.
   */
  parameters?: ParameterInput;
}

export interface RulesetComparison {
  same: boolean;
  /** Why one side's concrete rows could not be formed (a parameter without default not given, say). */
  rowProblems: { before: Problem[]; after: Problem[] };
  fingerprints: { before: string; after: string };
  identity: FieldDifference[];
  symbols: EntryDifference[];
  parameters: EntryDifference[];
  combinations: CombinationDifference[];
  notes: FieldDifference[];
}

export function compareRulesets(before: Ruleset, after: Ruleset, options: CompareOptions = {}): RulesetComparison {
  const a = before.file;
  const b = after.file;
  const identity: FieldDifference[] = [];
  const field = (name: string, x: unknown, y: unknown) => {
    const sx = text(x);
    const sy = text(y);
    if (sx !== sy) identity.push({ field: name, before: sx, after: sy });
  };
  field("id", a.id, b.id);
  field("title", a.title, b.title);
  field("standard", a.standard, b.standard);
  field("basis", a.basis, b.basis);
  field("version", a.version, b.version);
  field("provenance", a.provenance, b.provenance);

  // Notes are free text: which notes one side has and the other lacks.
  const notes: FieldDifference[] = [];
  for (const n of a.notes ?? []) if (!(b.notes ?? []).includes(n)) notes.push({ field: "note removed", before: n, after: "" });
  for (const n of b.notes ?? []) if (!(a.notes ?? []).includes(n)) notes.push({ field: "note added", before: "", after: n });

  const symbols = entries(a.symbols, b.symbols);
  const parameters = entries(a.parameters ?? {}, b.parameters ?? {});

  const formedA = rowsById(before, options.parameters ?? {});
  const formedB = rowsById(after, options.parameters ?? {});
  const rowsA = formedA.ok ? formedA.value : null;
  const rowsB = formedB.ok ? formedB.value : null;
  const combinations: CombinationDifference[] = [];
  const byIdA = new Map(a.combinations.map((c) => [c.id, c]));
  const byIdB = new Map(b.combinations.map((c) => [c.id, c]));
  for (const id of union([...byIdA.keys()], [...byIdB.keys()])) {
    const x = byIdA.get(id);
    const y = byIdB.get(id);
    const ra = rowsA?.get(id) ?? (rowsA ? [] : null);
    const rb = rowsB?.get(id) ?? (rowsB ? [] : null);
    const onlyBefore = ra && rb ? ra.filter((r) => !rb.includes(r)) : null;
    const onlyAfter = ra && rb ? rb.filter((r) => !ra.includes(r)) : null;
    if (!x || !y) {
      combinations.push({ name: id, change: x ? "removed" : "added", details: [`${x ? "was" : "is"}: ${(x ?? y)?.expression} (${(x ?? y)?.clause})`], rowsOnlyBefore: onlyBefore, rowsOnlyAfter: onlyAfter });
      continue;
    }
    const details = objectDetails(x, y);
    const rowsDiffer = onlyBefore === null || onlyAfter === null ? false : onlyBefore.length + onlyAfter.length > 0;
    if (details.length === 0 && !rowsDiffer) continue;
    if (details.length > 0 && onlyBefore !== null && onlyAfter !== null && !rowsDiffer) details.push("the concrete rows are the same");
    if (details.length === 0) details.push("the text is the same; the concrete rows differ (a symbol or a parameter changed)");
    combinations.push({ name: id, change: "changed", details, rowsOnlyBefore: onlyBefore, rowsOnlyAfter: onlyAfter });
  }

  const fingerprints = { before: fingerprintOf(a), after: fingerprintOf(b) };
  return {
    same: fingerprints.before === fingerprints.after,
    rowProblems: { before: formedA.ok ? [] : formedA.problems, after: formedB.ok ? [] : formedB.problems },
    fingerprints,
    identity,
    symbols,
    parameters,
    combinations,
    notes,
  };
}

/** Each combination's concrete rows for one case per symbol, as "D 1.2, L 1.6" texts. */
export function rowsById(ruleset: Ruleset, given: ParameterInput = {}): Result<Map<string, string[]>> {
  const declared = Object.fromEntries(Object.entries(given).filter(([n]) => ruleset.parameterByName.has(n)));
  const params = resolveParameters(ruleset, declared);
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
  return ok(out);
}

function entries(a: Record<string, unknown>, b: Record<string, unknown>): EntryDifference[] {
  const out: EntryDifference[] = [];
  for (const name of union(Object.keys(a), Object.keys(b))) {
    const x = a[name];
    const y = b[name];
    if (x === undefined) out.push({ name, change: "added", details: [text(y)] });
    else if (y === undefined) out.push({ name, change: "removed", details: [text(x)] });
    else {
      const details = objectDetails(x as Record<string, unknown>, y as Record<string, unknown>);
      if (details.length > 0) out.push({ name, change: "changed", details });
    }
  }
  return out;
}

function objectDetails(x: object, y: object): string[] {
  const rx = x as Record<string, unknown>;
  const ry = y as Record<string, unknown>;
  const out: string[] = [];
  for (const key of union(Object.keys(rx), Object.keys(ry))) {
    const sx = text(rx[key]);
    const sy = text(ry[key]);
    if (sx !== sy) out.push(`${key}: ${sx} → ${sy}`);
  }
  return out;
}

function text(v: unknown): string {
  if (v === undefined) return "(none)";
  return typeof v === "string" ? JSON.stringify(v) : JSON.stringify(v, Object.keys(flatKeys(v)).sort());
}

/** Every key at any depth, so JSON.stringify's key list sorts nested objects too. */
function flatKeys(v: unknown, acc: Record<string, true> = {}): Record<string, true> {
  if (v && typeof v === "object") {
    for (const [k, x] of Object.entries(v)) {
      acc[k] = true;
      flatKeys(x, acc);
    }
  }
  return acc;
}

function union(a: string[], b: string[]): string[] {
  return [...a, ...b.filter((x) => !a.includes(x))];
}
