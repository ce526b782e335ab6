/**
 * A ruleset's combination list as a checker reads it: every concrete row with
 * its clause and the factor on every load symbol. For a shipped or stored
 * ruleset it is exactly what LW.COMBOS gives (stamp first); for a draft it is
 * formed by the engine from the draft itself, before anything is stored.
 */
import { comboRows, describeProblem, parseParameterText, planCombinations, resolveParameters, type Ruleset } from "../core/index.js";
import type { OutputCell } from "../functions/formula.js";
import { COMBOS } from "../functions/formulas/combosFormula.js";
import { evaluateFormula } from "../functions/runFormula.js";
import { el } from "./dom.js";

/** Rows of a combination list shown at most; the formula gives all of them. */
export const MAX_PANE_ROWS = 1000;

/** LW.COMBOS for a shipped or stored id: stamp, header, rows, notes. */
export function comboListOf(doc: Document, id: string, paramsText: string): HTMLElement[] {
  const outcome = evaluateFormula(COMBOS, [[[id]], paramsText.trim() === "" ? null : [[paramsText]]]);
  if (!outcome.ok) return [el(doc, "p", { class: "problem" }, outcome.message)];
  const [stamp, header, ...rest] = outcome.value;
  const notes = rest.filter((r) => typeof r[0] === "string" && r[0].startsWith("note:"));
  const body = rest.filter((r) => !notes.includes(r));
  return [
    el(doc, "p", { class: "stamp", id: "lw-stamp" }, String(stamp[0])),
    ...rowsTable(doc, "lw-combo-table", header.map(String), body),
    ...notes.map((n) => el(doc, "p", {}, String(n[0]))),
  ];
}

/** The same list for a draft that loads, formed by the engine from the draft. */
export function comboListOfDraft(doc: Document, ruleset: Ruleset, paramsText: string): HTMLElement[] {
  const given = parseParameterText(paramsText);
  if (!given.ok) return [problemText(doc, given.problems.map((p) => `parameters, ${describeProblem(p)}`))];
  const values = resolveParameters(ruleset, given.value);
  const plan = values.ok ? planCombinations(ruleset, values.value, { cases: null }) : values;
  const rows = plan.ok ? comboRows(plan.value) : plan;
  if (!plan.ok) return [problemText(doc, plan.problems.map((p) => describeProblem(p)))];
  if (!rows.ok) return [problemText(doc, rows.problems.map((p) => describeProblem(p)))];
  const header = ["combination row", "clause", ...plan.value.cases.map((c) => c.header)];
  return rowsTable(doc, "lw-draft-combo-table", header, rows.value.map((r) => [r.label, r.clause, ...r.factors]));
}

function problemText(doc: Document, lines: string[]): HTMLElement {
  return el(doc, "p", { class: "problem" }, lines.join("\n"));
}

function rowsTable(doc: Document, id: string, header: string[], body: OutputCell[][]): HTMLElement[] {
  const shown = body.slice(0, MAX_PANE_ROWS);
  const table = el(
    doc,
    "table",
    { id, class: "combo-table" },
    el(doc, "thead", {}, el(doc, "tr", {}, ...header.map((h) => el(doc, "th", { scope: "col" }, h)))),
    el(doc, "tbody", {}, ...shown.map((r) => el(doc, "tr", {}, ...r.map((c) => cell(doc, c))))),
  );
  return [
    el(doc, "div", { class: "scroll", tabindex: "0", role: "region", "aria-label": "combination rows" }, table),
    body.length > shown.length ? el(doc, "p", {}, `Showing ${shown.length} of ${body.length} rows; LW.COMBOS lists all of them.`) : el(doc, "p", { class: "muted" }, `${body.length} concrete rows.`),
  ];
}

function cell(doc: Document, value: OutputCell): HTMLElement {
  return typeof value === "number" ? el(doc, "td", { class: "num" }, value === 0 ? "" : String(value)) : el(doc, "td", {}, value);
}
