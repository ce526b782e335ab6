/**
 * A ruleset's combination list as a checker reads it: every concrete row with
 * its clause and the factor on every load symbol, then what the plan leaves
 * out. Formed by the engine, for a shipped or stored ruleset (headed by the
 * same stamp a formula's result carries) or for a draft before it is stored.
 */
import {
  comboRows,
  describeProblem,
  omissionTexts,
  parseParameterText,
  planCombinations,
  planOmissions,
  resolveParameters,
  type Problem,
  type Ruleset,
} from "../core/index.js";
import { el } from "./dom.js";

/** Rows of a combination list shown at most; LW.COMBOS gives all of them. */
export const MAX_PANE_ROWS = 1000;

export interface ComboListOptions {
  /** The id of the table element. */
  tableId: string;
  /** The ruleset stamp above the list (core/text/stamp.ts), or null for a draft. */
  stamp: string | null;
}

/** The list for the parameters typed as "SDS=1.2; rho=1.3" (empty: the defaults), or the problems that keep it from being formed. */
export function comboList(doc: Document, ruleset: Ruleset, paramsText: string, options: ComboListOptions): HTMLElement[] {
  const given = parseParameterText(paramsText);
  const values = given.ok ? resolveParameters(ruleset, given.value) : given;
  const plan = values.ok ? planCombinations(ruleset, values.value, { cases: null }) : values;
  if (!plan.ok) return [problemBox(doc, plan.problems, paramsText)];
  const rows = comboRows(plan.value);
  if (!rows.ok) return [problemBox(doc, rows.problems, paramsText)];
  const header = ["combination row", "clause", ...plan.value.cases.map((c) => c.header)];
  return [
    ...(options.stamp === null ? [] : [el(doc, "p", { class: "stamp", id: "lw-stamp" }, options.stamp)]),
    ...rowsTable(doc, options.tableId, header, rows.value.map((r) => [r.label, r.clause, ...r.factors])),
    ...omissionTexts(planOmissions(plan.value)).map((n) => el(doc, "p", { class: "note" }, n)),
  ];
}

/** A parameter problem names where in the typed text it is ("params, character 1: …"); others their place in the ruleset. */
function problemBox(doc: Document, problems: readonly Problem[], paramsText: string): HTMLElement {
  const lines = problems.map((p) => {
    if (!p.kind.startsWith("parameter-")) return describeProblem(p);
    const position = p.place.position ?? positionOf(paramsText, p.place.header);
    return `params${position === null ? "" : `, character ${position}`}: ${p.message}`;
  });
  return el(doc, "p", { class: "problem", role: "alert" }, lines.join("\n"));
}

/** 1-based character position of "name =" in the typed parameters. */
function positionOf(text: string, name: string | undefined): number | null {
  if (name === undefined) return null;
  const escaped = name.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const m = new RegExp(`(^|[;\\n])\\s*(${escaped})\\s*=`, "u").exec(text);
  return m ? m.index + m[0].indexOf(m[2]) + 1 : null;
}

function rowsTable(doc: Document, id: string, header: string[], body: (string | number)[][]): HTMLElement[] {
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

function cell(doc: Document, value: string | number): HTMLElement {
  return typeof value === "number" ? el(doc, "td", { class: "num" }, value === 0 ? "" : String(value)) : el(doc, "td", {}, value);
}
