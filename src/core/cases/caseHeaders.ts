/**
 * Case headers: "D", "W:N", "E:x" — a load symbol of the ruleset, optionally
 * followed by ":" and the case's own name. A map can assign any other header to
 * a symbol, and change how a symbol's several cases combine.
 */
import { cellText, isBlank, type Cell } from "../cells.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import { type CaseMode, type Ruleset, rulesetName } from "../ruleset/model.js";
import { caseModeSchema } from "../ruleset/schema.js";
import { nearest } from "../text/nearest.js";

export interface LoadCase {
  /** The header as written. */
  header: string;
  symbol: string;
}

export interface CaseMap {
  /** Header → symbol, for headers that are not written SYMBOL or SYMBOL:name. */
  symbolOf: ReadonlyMap<string, string>;
  /** Symbol → how its cases combine, overriding the ruleset. */
  modes: ReadonlyMap<string, CaseMode>;
  /** Symbol → whether its cases are also taken reversed ("both-ways") or not ("one-way"), overriding the ruleset. */
  reversible: ReadonlyMap<string, boolean>;
}

export const EMPTY_CASE_MAP: CaseMap = { symbolOf: new Map(), modes: new Map(), reversible: new Map() };

const MODES: readonly CaseMode[] = caseModeSchema.options;
const DIRECTIONS = ["one-way", "both-ways"];

/** Whether a header names a load symbol (as symbolOfHeader reads it), without wording why not: for deciding a table's orientation. */
export function namesLoadSymbol(header: string, ruleset: Ruleset, map: CaseMap = EMPTY_CASE_MAP): boolean {
  if (map.symbolOf.has(header)) return true;
  const colon = header.indexOf(":");
  if (colon >= 0 && header.slice(colon + 1).trim() === "") return false;
  return ruleset.symbolByName.has((colon < 0 ? header : header.slice(0, colon)).trim());
}

/** The symbol a header names, or a problem naming the header and the symbols there are. */
export function symbolOfHeader(header: string, ruleset: Ruleset, map: CaseMap = EMPTY_CASE_MAP): { symbol: string } | { error: string } {
  const mapped = map.symbolOf.get(header);
  if (mapped !== undefined) return { symbol: mapped };
  const colon = header.indexOf(":");
  const symbol = (colon < 0 ? header : header.slice(0, colon)).trim();
  if (colon >= 0 && header.slice(colon + 1).trim() === "") {
    return { error: `case header "${header}" has nothing after ":"; write ${symbol}:name, e.g. ${symbol}:1` };
  }
  if (ruleset.symbolByName.has(symbol)) return { symbol };
  const known = ruleset.symbols.map((s) => s.name);
  // "Wn", "E1": a symbol and a short case name run together; otherwise the nearest symbol's spelling.
  const prefix = colon < 0 ? [...known].sort((a, b) => b.length - a.length).find((k) => symbol.startsWith(k) && /^([A-Za-z]{1,2}|\d+)$/.test(symbol.slice(k.length))) : undefined;
  const sameLetters = known.find((k) => k.toLowerCase() === symbol.toLowerCase());
  const guess = sameLetters ?? (prefix ? `${prefix}:${symbol.slice(prefix.length)}` : nearest(symbol, known));
  return {
    error:
      `case header "${header}" names no load symbol of ${rulesetName(ruleset)}` +
      (guess ? `; did you mean "${guess}"?` : "") +
      ` (symbols: ${known.join(", ")}; write SYMBOL or SYMBOL:name, or assign the header in a case map)`,
  };
}

/** Headers in order; `at(i)` says where header i is, for the problem's place. */
export function readCaseHeaders(
  headers: Cell[],
  ruleset: Ruleset,
  map: CaseMap,
  at: (i: number) => { row: number; column: number },
): Result<LoadCase[]> {
  const problems: Problem[] = [];
  const cases: LoadCase[] = [];
  const firstSeen = new Map<string, number>();
  headers.forEach((cell, i) => {
    const header = cellText(cell);
    const place = at(i);
    if (header === "") {
      problems.push(problem("cases-header", "the case header is empty", place));
      return;
    }
    const before = firstSeen.get(header);
    if (before !== undefined) {
      problems.push(problem("cases-duplicate-header", `case header "${header}" appears twice`, { ...place, header, also: at(before) }));
      return;
    }
    firstSeen.set(header, i);
    const resolved = symbolOfHeader(header, ruleset, map);
    if ("error" in resolved) {
      problems.push(problem("cases-unknown-symbol", resolved.error, { ...place, header }));
      return;
    }
    cases.push({ header, symbol: resolved.symbol });
  });
  return problems.length > 0 ? fail(...problems) : ok(cases);
}

/**
 * A case map range: rows of [header, symbol] to assign a header to a symbol,
 * [symbol, sum|each|orthogonal|independent] to change how that symbol's cases combine, or
 * [symbol, one-way|both-ways] to say whether its cases are also taken reversed
 * (one-way where the table already holds every direction).
 */
export function readCaseMap(rows: Cell[][], ruleset: Ruleset): Result<CaseMap> {
  const symbolOf = new Map<string, string>();
  const modes = new Map<string, CaseMode>();
  const reversible = new Map<string, boolean>();
  const problems: Problem[] = [];
  rows.forEach((row, r) => {
    if (row.every(isBlank)) return;
    const first = cellText(row[0]);
    const second = cellText(row[1]);
    if (first === "" || second === "") {
      problems.push(problem("cases-map", "a case map row needs two cells: [header, symbol], [symbol, sum|each|orthogonal|independent] or [symbol, one-way|both-ways]", { row: r, column: first === "" ? 0 : 1 }));
      return;
    }
    const word = second.toLowerCase();
    if ((MODES as readonly string[]).includes(word) || DIRECTIONS.includes(word)) {
      if (!ruleset.symbolByName.has(first)) {
        problems.push(problem("cases-map", `"${first}" is not a load symbol of ${rulesetName(ruleset)} (symbols: ${ruleset.symbols.map((s) => s.name).join(", ")})`, { row: r, column: 0 }));
        return;
      }
      if (DIRECTIONS.includes(word)) reversible.set(first, word === "both-ways");
      else modes.set(first, word as CaseMode);
      return;
    }
    if (!ruleset.symbolByName.has(second)) {
      problems.push(
        problem("cases-map", `"${second}" is neither a load symbol of ${rulesetName(ruleset)} nor sum, each, orthogonal, independent, one-way or both-ways`, { row: r, column: 1 }),
      );
      return;
    }
    if (symbolOf.has(first)) {
      problems.push(problem("cases-map", `header "${first}" is assigned twice`, { row: r, column: 0 }));
      return;
    }
    symbolOf.set(first, second);
  });
  return problems.length > 0 ? fail(...problems) : ok({ symbolOf, modes, reversible });
}
