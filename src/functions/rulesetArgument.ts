/**
 * The ruleset argument: the id of a ruleset stored in the workbook or shipped
 * with Loadwright, or a range of [id, expression, clause] rows typed in cells.
 */
import { closest } from "fastest-levenshtein";
import { RULESET_ID_PATTERN, typedRuleset, type Cell, type Problem, type Result } from "../core/index.js";
import { findInLibrary, library, storeLocation } from "../addin/rulesetLibrary.js";
import { asMatrix, blankZeroRows, isEmptyArgument } from "./excelCells.js";
import type { ResolvedRuleset } from "./formula.js";


const fail = (message: string, place: Problem["place"] = {}): Result<never> => ({
  ok: false,
  problems: [{ kind: "ruleset-field", message, place }],
});

export function readRulesetArgument(raw: unknown): Result<ResolvedRuleset> {
  const m = asMatrix(raw);
  if (m === null || isEmptyArgument(m)) {
    return fail("no ruleset given: write a ruleset id in quotes (e.g. a shipped id that LW.RULESET accepts) or select a range of [id, expression, clause] rows", { row: 0, column: 0 });
  }
  const only = m.length === 1 && m[0].length === 1 ? m[0][0] : null;
  if (typeof only === "string" && RULESET_ID_PATTERN.test(only.trim())) return byId(only.trim());
  return typed(blankZeroRows(m));
}

function byId(id: string): Result<ResolvedRuleset> {
  const found = findInLibrary(id);
  if (!found) {
    const { entries, storeProblem } = library();
    const ids = entries.map((e) => e.id);
    const guess = ids.length > 0 ? closest(id, ids) : undefined;
    const shipped = entries.filter((e) => e.source === "shipped").map((e) => e.id);
    const stored = entries.filter((e) => e.source === "stored").map((e) => e.id);
    return fail(
      `no ruleset "${id}" is shipped or stored in ${storeLocation()}` +
        (guess && guess !== id ? `; did you mean "${guess}"?` : "") +
        ` (shipped: ${shipped.join(", ") || "none"}; stored: ${stored.join(", ") || "none"})` +
        (storeProblem ? `; ${storeProblem}` : ""),
      { row: 0, column: 0 },
    );
  }
  if (!found.ruleset || !found.status) {
    return fail(`the ruleset "${id}" stored in ${storeLocation()} no longer loads: ${found.problem ?? "unknown problem"}`, { row: 0, column: 0 });
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
  const width = Math.max(0, ...rows.map((r) => r.length));
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
