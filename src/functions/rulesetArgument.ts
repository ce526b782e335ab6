/**
 * The ruleset argument: the id of a ruleset stored in the workbook or shipped
 * with Loadwright, or a range of [id, expression, clause] rows typed in cells.
 */
import { didYouMean, nearest, problem, RULESET_ID_PATTERN, typedRuleset, type Cell, type Place, type ProblemKind, type Result } from "../core/index.js";
import type { RulesetLibrary } from "../workbook/rulesetLibrary.js";
import { asMatrix, blankZeroRows, isEmptyArgument } from "./excelCells.js";
import type { ResolvedRuleset } from "./formula.js";

/** The ruleset argument is one cell, or a range whose place the message names. */
const AT_ARGUMENT: Place = { row: 0, column: 0 };

const refuse = (kind: ProblemKind, message: string, place: Place = {}): Result<never> => ({ ok: false, problems: [problem(kind, message, place)] });

export function readRulesetArgument(raw: unknown, library: RulesetLibrary): Result<ResolvedRuleset> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) {
    return refuse("ruleset-unknown", "no ruleset given: write a ruleset id in quotes (e.g. a shipped id that LW.RULESET accepts) or select a range of [id, expression, clause] rows", AT_ARGUMENT);
  }
  const only = m.length === 1 && m[0].length === 1 ? m[0][0] : null;
  if (typeof only === "string" && RULESET_ID_PATTERN.test(only.trim())) return byId(only.trim(), library);
  return typed(blankZeroRows(m));
}

function byId(id: string, library: RulesetLibrary): Result<ResolvedRuleset> {
  const { entries, storeProblem } = library.list();
  const found = entries.find((e) => e.id === id);
  if (!found) {
    const shipped = entries.filter((e) => e.source === "shipped").map((e) => e.id);
    const stored = entries.filter((e) => e.source === "stored").map((e) => e.id);
    return refuse(
      "ruleset-unknown",
      `no ruleset "${id}" is shipped or stored in ${library.where}` +
        didYouMean(nearest(id, entries.map((e) => e.id))) +
        ` (shipped: ${shipped.join(", ") || "none"}; stored: ${stored.join(", ") || "none"})` +
        (storeProblem ? `; ${storeProblem}` : ""),
      AT_ARGUMENT,
    );
  }
  if (!found.ruleset || !found.status) {
    return refuse("ruleset-store", `the ruleset "${id}" stored in ${library.where} no longer loads: ${found.problem ?? "unknown problem"}`, AT_ARGUMENT);
  }
  return {
    ok: true,
    value: {
      ruleset: found.ruleset,
      status: found.status,
      source: found.source,
      shippedFingerprint: found.shippedFingerprint,
      entryRows: new Map(),
      expressionColumn: 0,
    },
  };
}

function typed(rows: Cell[][]): Result<ResolvedRuleset> {
  const loaded = typedRuleset(rows);
  if (!loaded.ok) return loaded;
  const { ruleset, status } = loaded.value;
  const width = rows.reduce((w, r) => Math.max(w, r.length), 0);
  return {
    ok: true,
    value: {
      ruleset,
      status,
      source: "cells",
      shippedFingerprint: null,
      entryRows: new Map(ruleset.combinations.map((c) => [c.id, c.sourceRow ?? 0])),
      expressionColumn: width === 1 ? 0 : 1,
    },
  };
}
