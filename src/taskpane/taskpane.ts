/**
 * The task pane's first page: the cautions, every ruleset a formula can name
 * (shipped and stored) with its verification and approval status and
 * fingerprint, and the combination list of the one selected — exactly what
 * LW.COMBOS returns for it. Later pages (edit, compare, approve) build on the
 * same pieces: the library, the store and the formulas' evaluation.
 */
import { CAUTIONS } from "../addin/cautions.js";
import { library, storeLocation, type LibraryEntry } from "../addin/rulesetLibrary.js";
import { COMBOS } from "../functions/formulas/combosFormula.js";
import type { OutputCell } from "../functions/formula.js";
import { evaluateFormula } from "../functions/runFormula.js";
import { approvalWord, verificationWord } from "../functions/stamp.js";

export interface PaneOptions {
  inExcel: boolean;
}

/** Rows of a combination list shown at most; the formula gives all of them. */
export const MAX_PANE_ROWS = 1000;

export function startTaskPane(doc: Document, options: PaneOptions): void {
  const $ = (id: string) => doc.getElementById(id) as HTMLElement;
  $("lw-mode").textContent = options.inExcel
    ? `In Excel: formulas LW.* are available; stored rulesets live in ${storeLocation()}.`
    : `In a browser (demo, no Excel): stored rulesets live in ${storeLocation()}.`;
  $("lw-cautions").replaceChildren(...CAUTIONS.map((text) => el(doc, "p", {}, text)));

  let selected: string | null = null;
  const params = $("lw-params") as HTMLInputElement;

  const render = () => {
    const { entries, storeProblem } = library();
    const problem = $("lw-store-problem");
    problem.hidden = storeProblem === null;
    problem.textContent = storeProblem ?? "";
    if (selected === null || !entries.some((e) => e.id === selected)) selected = entries[0]?.id ?? null;
    $("lw-rulesets").replaceChildren(rulesetTable(doc, entries, selected, (id) => {
      selected = id;
      render();
    }));
    $("lw-combos").replaceChildren(...(selected ? comboList(doc, selected, params.value) : [el(doc, "p", {}, "No ruleset is shipped or stored yet.")]));
  };
  params.addEventListener("change", render);
  render();
}

function rulesetTable(doc: Document, entries: LibraryEntry[], selected: string | null, select: (id: string) => void): HTMLElement {
  const head = el(doc, "tr", {}, ...["status", "approval", "id", "title", "standard", "source", "fingerprint"].map((h) => el(doc, "th", {}, h)));
  const rows = entries.map((e) => {
    const button = el(doc, "button", { class: "ruleset", type: "button" }, e.id);
    button.addEventListener("click", () => select(e.id));
    const f = e.ruleset?.file;
    const status = e.status;
    return el(
      doc,
      "tr",
      { "data-ruleset-id": e.id, "data-status": status?.verification ?? "invalid", class: e.id === selected ? "selected" : "" },
      el(doc, "td", { class: `status-${status?.verification ?? "user"}`, title: status?.summary ?? e.problem ?? "" }, status ? verificationWord(status) : "DOES NOT LOAD"),
      el(doc, "td", { class: `approval-${status?.approval ?? "not-approved"}` }, status ? approvalWord(status) : ""),
      el(doc, "td", {}, button),
      el(doc, "td", {}, f?.title ?? e.problem ?? ""),
      el(doc, "td", {}, f ? `${f.standard.name} ${f.standard.edition}` : ""),
      el(doc, "td", {}, e.source === "stored" ? "stored" : "shipped"),
      el(doc, "td", { class: "fingerprint", title: status?.fingerprint ?? "" }, status?.shortFingerprint ?? ""),
    );
  });
  return el(doc, "tbody", {}, head, ...rows);
}

/** The selected ruleset's combination list, as LW.COMBOS gives it: stamp, header, rows, notes. */
function comboList(doc: Document, id: string, paramsText: string): HTMLElement[] {
  const outcome = evaluateFormula(COMBOS, [[[id]], paramsText.trim() === "" ? null : [[paramsText]]]);
  if (!outcome.ok) return [el(doc, "p", { class: "problem" }, outcome.message)];
  const [stamp, header, ...rest] = outcome.value;
  const notes = rest.filter((r) => typeof r[0] === "string" && r[0].startsWith("note:"));
  const body = rest.filter((r) => !notes.includes(r));
  const shown = body.slice(0, MAX_PANE_ROWS);
  const table = el(
    doc,
    "table",
    { id: "lw-combo-table" },
    el(doc, "tr", {}, ...header.map((h) => el(doc, "th", {}, String(h)))),
    ...shown.map((r) => el(doc, "tr", {}, ...r.map((c) => cell(doc, c)))),
  );
  return [
    el(doc, "p", { class: "stamp", id: "lw-stamp" }, String(stamp[0])),
    el(doc, "div", { class: "scroll" }, table),
    ...(body.length > shown.length ? [el(doc, "p", {}, `Showing ${shown.length} of ${body.length} rows; LW.COMBOS lists all of them.`)] : []),
    ...notes.map((n) => el(doc, "p", {}, String(n[0]))),
  ];
}

function cell(doc: Document, value: OutputCell): HTMLElement {
  return typeof value === "number" ? el(doc, "td", { class: "num" }, value === 0 ? "" : String(value)) : el(doc, "td", {}, value);
}

function el(doc: Document, tag: string, attributes: Record<string, string>, ...children: (string | Node)[]): HTMLElement {
  const node = doc.createElement(tag);
  for (const [k, v] of Object.entries(attributes)) if (v !== "") node.setAttribute(k, v);
  node.append(...children);
  return node;
}
