/**
 * A ruleset typed into cells: rows of [id, expression, clause] (or
 * [id, expression], or [expression] alone), an optional header row, blank rows
 * skipped. Load symbols come from the trade's catalogue; any other name in a
 * factor is a parameter the user gives with the formula's params.
 */
import { isBlank, cellText, type Cell } from "../cells.js";
import { KEYWORDS } from "../expression/parser.js";
import { lex } from "../expression/lexer.js";
import { FORBIDDEN_KEYS } from "../limits.js";
import { fail, problem, type Problem, type Result } from "../problems.js";
import { buildRuleset } from "./buildRuleset.js";
import { SYMBOL_CATALOGUE } from "./catalogue.js";
import type { Ruleset } from "./model.js";
import { RULESET_FORMAT, type RulesetFile } from "./schema.js";

const HEADER_WORDS = ["id", "expression", "clause"];

export function rulesetFromRows(rows: Cell[][]): Result<Ruleset> {
  const problems: Problem[] = [];
  const width = rows.reduce((w, r) => Math.max(w, r.length), 0);
  if (width === 0 || width > 3) {
    return fail(
      problem("ruleset-field", `a ruleset range has 1 to 3 columns ([id, expression, clause]); this one has ${width}`),
    );
  }
  const combinations: RulesetFile["combinations"] = [];
  const sheetRowOf: number[] = []; // combinations[i] was typed on sheet row sheetRowOf[i]
  const used = new Set<string>();
  const parameterNames = new Set<string>();
  const catalogue = Object.keys(SYMBOL_CATALOGUE);
  const expressionColumn = width === 1 ? 0 : 1;
  rows.forEach((row, r) => {
    if (row.every(isBlank)) return;
    const cells: Cell[] = [...row, ...new Array<Cell>(width - row.length).fill(null)];
    if (r === 0 && cells.every((c, i) => cellText(c).toLowerCase() === HEADER_WORDS[width === 1 ? 1 : i])) return;
    const id = width === 1 ? String(combinations.length + 1) : cellText(cells[0]);
    const expression = cellText(cells[expressionColumn]);
    const clause = width === 3 ? cellText(cells[2]) : "";
    if (id === "") problems.push(problem("ruleset-field", "the combination id is empty", { row: r, column: 0 }));
    if (expression === "") {
      problems.push(problem("expression-syntax", "the expression is empty", { row: r, column: expressionColumn }));
      return;
    }
    const tokens = lex(expression);
    if (!tokens.ok) {
      problems.push(problem("expression-syntax", tokens.message, { row: r, column: expressionColumn, entry: id, position: tokens.position }));
      return;
    }
    for (const t of tokens.tokens) {
      if (t.kind !== "name" || (KEYWORDS as readonly string[]).includes(t.text)) continue;
      if (FORBIDDEN_KEYS.includes(t.text)) {
        // A name becomes a field of the ruleset built here: never one that reaches a prototype.
        problems.push(problem("input-forbidden-key", `"${t.text}" cannot name a load symbol or a parameter`, { row: r, column: expressionColumn, entry: id, position: t.position }));
        continue;
      }
      if (Object.hasOwn(SYMBOL_CATALOGUE, t.text)) used.add(t.text);
      else parameterNames.add(t.text);
    }
    combinations.push({ id, expression, clause: clause === "" ? "(no clause given)" : clause });
    sheetRowOf.push(r);
  });
  if (problems.length > 0) return fail(...problems);
  if (combinations.length === 0) return fail(problem("ruleset-field", "the ruleset range holds no combinations"));

  const file: RulesetFile = {
    format: RULESET_FORMAT,
    id: "cells",
    title: "Combinations typed in the workbook",
    standard: { name: "the user's own list", edition: "-" },
    version: "-",
    symbols: Object.fromEntries(catalogue.filter((s) => used.has(s)).map((s) => [s, SYMBOL_CATALOGUE[s]])),
    parameters: Object.fromEntries(
      [...parameterNames].map((p) => [p, { type: "number" as const, description: "a value used in a typed combination; give it in params" }]),
    ),
    combinations,
    provenance: [{ source: "typed in the workbook by its user", status: "confirmed", covers: "all combinations" }],
    approval: { approvedBy: null, date: null, fingerprint: null },
  };
  const built = buildRuleset(file, "cells", catalogue);
  if (!built.ok) {
    // Point each problem back at its sheet row instead of a JSON path.
    return fail(
      ...built.problems.map((p) => {
        const index = p.place.path?.[0] === "combinations" ? Number(p.place.path[1]) : NaN;
        const { path: _path, ...rest } = p.place;
        return Number.isInteger(index) ? { ...p, place: { ...rest, row: sheetRowOf[index] ?? 0, column: expressionColumn } } : p;
      }),
    );
  }
  built.value.combinations.forEach((c, i) => (c.sourceRow = sheetRowOf[i]));
  return built;
}
