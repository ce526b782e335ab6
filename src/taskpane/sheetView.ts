/**
 * Sheet: the pane at work on the workbook (in a plain browser, on the
 * invented demo table). For the selected (or named) case table and a chosen
 * ruleset it previews the envelope — for a draft too, before it is stored —
 * inserts the starter formulas (stamp, parameters, envelope, criteria and
 * governing rows, combination rows) at a chosen cell after reading the block
 * and asking before writing over anything, and writes the reviewer's copy as
 * a new worksheet. Everything on the sheet goes through the sheet host
 * (src/sheet/sheetHost.ts), never Office.js directly.
 */
import { formatNumber, omissionTexts, planOmissions, stampLine, statusText, type EnvelopeEntry, envelope } from "../core/index.js";
import { entryOrigin } from "../workbook/rulesetLibrary.js";
import { areaName, cellInArea } from "../sheet/sheetArea.js";
import type { SheetHost } from "../sheet/sheetHost.js";
import { button, el, type Child } from "./dom.js";
import type { PaneContext } from "./paneContext.js";
import { reviewerCopy, writeReviewerCopy } from "./reviewerCopy.js";
import { connectedSheet } from "./sheetConnection.js";
import { defaultChoice, sheetChoices, type SheetChoice } from "./sheetChoices.js";
import { placedText, tableName, tableOnSheet, type TableOnSheet } from "./sheetTable.js";
import { criteriaTexts, prepareInsert, writeInsert, type PreparedInsert } from "./starterInsert.js";

/** What the user typed, kept while the pane is open so that coming back to the view finds it so. */
interface SheetFields {
  cases: string;
  choice: string | null;
  params: string;
  criteria: string;
  at: string;
}

const fieldsOf = new WeakMap<PaneContext, SheetFields>();

function fields(ctx: PaneContext): SheetFields {
  let f = fieldsOf.get(ctx);
  if (!f) {
    f = { cases: "", choice: null, params: "", criteria: "", at: "" };
    fieldsOf.set(ctx, f);
  }
  return f;
}

export function sheetView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const host = connectedSheet();
  const root = el(doc, "section", { id: "lw-sheet", "aria-labelledby": "lw-sheet-title" }, el(doc, "h2", { id: "lw-sheet-title" }, "Sheet"));
  if (!host) {
    root.append(el(doc, "p", { class: "problem" }, "No sheet is connected to the pane, so it cannot read or write cells here."));
    return root;
  }
  const state = fields(ctx);
  const choices = sheetChoices(ctx);
  if (state.choice === null || !choices.some((c) => c.value === state.choice)) state.choice = defaultChoice(ctx, choices);

  const casesInput = textInput(doc, "lw-sheet-cases", state.cases, "lw-sheet-cases-hint");
  const rulesetSelect = el(
    doc,
    "select",
    { id: "lw-sheet-ruleset" },
    ...(["Drafts", "Stored", "Shipped"] as const).map((g) => {
      const members = choices.filter((c) => c.group === g);
      return members.length === 0 ? null : el(doc, "optgroup", { label: g === "Stored" ? `Stored in ${ctx.storedWhere}` : g }, ...members.map((c) => el(doc, "option", { value: c.value }, c.label)));
    }),
  );
  rulesetSelect.value = state.choice;
  const paramsInput = textInput(doc, "lw-sheet-params", state.params, "lw-sheet-params-hint");
  const criteriaInput = el(doc, "textarea", { id: "lw-sheet-criteria", rows: "4", spellcheck: "false", "aria-describedby": "lw-sheet-criteria-hint" });
  criteriaInput.value = state.criteria;
  const atInput = textInput(doc, "lw-sheet-at", state.at, "lw-sheet-at-hint");
  const keep = () => {
    Object.assign(state, { cases: casesInput.value, choice: rulesetSelect.value, params: paramsInput.value, criteria: criteriaInput.value, at: atInput.value });
  };
  for (const input of [casesInput, rulesetSelect, paramsInput, criteriaInput, atInput]) input.addEventListener("change", keep);

  const previewOut = outlet(doc, "lw-sheet-preview-result");
  // A preview shown for other inputs would mislead: it goes when they change.
  for (const input of [casesInput, rulesetSelect, paramsInput]) input.addEventListener("change", () => show(previewOut, "stale"));
  const insertOut = outlet(doc, "lw-sheet-insert-result");
  const copyOut = outlet(doc, "lw-sheet-copy-result");
  const chosen = (): SheetChoice | undefined => choices.find((c) => c.value === rulesetSelect.value);
  /** Reads the case table and plans it for the ruleset and parameters typed; shows why not in `out`. */
  const table = async (out: HTMLElement): Promise<TableOnSheet | null> => {
    keep();
    const t = await tableOnSheet(host, casesInput.value, chosen(), paramsInput.value);
    if (t.ok) return t.value;
    show(out, "problem", el(doc, "ul", { class: "problem-list" }, ...t.lines.map((l) => el(doc, "li", { class: "problem" }, l))));
    return null;
  };
  const busy = (b: HTMLButtonElement, out: HTMLElement, work: () => Promise<void>) => {
    b.disabled = true;
    show(out, "working", el(doc, "p", { class: "muted" }, "Working…"));
    void guarded(out, work).finally(() => {
      b.disabled = false;
    });
  };

  const preview: HTMLButtonElement = button(doc, "Preview the envelope", () =>
    busy(preview, previewOut, async () => {
      const t = await table(previewOut);
      if (t) show(previewOut, "done", ...previewOf(ctx, t));
    }),
  { id: "lw-sheet-preview" });
  const useSelection: HTMLButtonElement = button(doc, "Use the selection", () =>
    busy(useSelection, previewOut, async () => {
      const read = await host.selection();
      if (!read.ok) {
        show(previewOut, "problem", ...read.problems.map((p) => el(doc, "p", { class: "problem" }, p.message)));
        return;
      }
      casesInput.value = read.value.name ?? areaName(read.value.area);
      const t = await table(previewOut);
      if (t) show(previewOut, "done", ...previewOf(ctx, t));
    }),
  { id: "lw-sheet-use-selection" });

  const insert: HTMLButtonElement = button(doc, "Insert formulas", () =>
    busy(insert, insertOut, async () => {
      const t = await table(insertOut);
      if (!t) return;
      const prepared = await prepareInsert(host, t, criteriaInput.value, atInput.value);
      if (!prepared.ok) {
        show(insertOut, "problem", el(doc, "ul", { class: "problem-list" }, ...prepared.lines.map((l) => el(doc, "li", { class: "problem" }, l))));
        return;
      }
      if (prepared.value.filled.length === 0) await commitInsert(ctx, host, t, prepared.value, insertOut);
      else confirmOverwrite(ctx, host, t, prepared.value, insertOut);
    }),
  { id: "lw-sheet-insert", class: "primary" });

  const copy: HTMLButtonElement = button(doc, "Write the reviewer's copy as a new sheet", () =>
    busy(copy, copyOut, async () => {
      const t = await table(copyOut);
      if (!t || !t.choice.entry) {
        if (t) show(copyOut, "problem", el(doc, "p", { class: "problem" }, "The reviewer's copy names a stored or shipped ruleset, not a draft: store the draft first, or choose a stored or shipped ruleset."));
        return;
      }
      const typed = criteriaInput.value.trim() === "" ? null : criteriaTexts(t, criteriaInput.value);
      if (typed && !typed.ok) {
        show(copyOut, "problem", el(doc, "ul", { class: "problem-list" }, ...typed.lines.map((l) => el(doc, "li", { class: "problem" }, l))));
        return;
      }
      const sheet = reviewerCopy(t, typed ? typed.value : null, entryOrigin(t.choice.entry, ctx.storedWhere));
      if (!sheet.ok) {
        show(copyOut, "problem", ...sheet.lines.map((l) => el(doc, "p", { class: "problem" }, l)));
        return;
      }
      const written = await writeReviewerCopy(host, sheet.value);
      if (!written.ok) {
        show(copyOut, "problem", ...written.lines.map((l) => el(doc, "p", { class: "problem" }, l)));
        return;
      }
      const { rowCount } = sheet.value.layout;
      const text = `Wrote the reviewer's copy of ${tableName(t.read)} (${t.ruleset.file.id}) to the new worksheet "${written.value}": ${rowCount.toLocaleString("en-US")} combination rows × ${t.table.components.length} results, ${t.plan.cases.length} cases; plain formulas, recomputable without the add-in.`;
      show(copyOut, "done", el(doc, "p", {}, text));
      ctx.notice(text, "done");
    }),
  { id: "lw-sheet-copy" });

  root.append(
    ...[
    el(
      doc,
      "p",
      { class: "hint", id: "lw-sheet-where" },
      ctx.inExcel
        ? "Works on the open workbook. Select a case table (its header row and header column included), then preview its envelope, insert formulas over it, or write its reviewer's copy."
        : `Demo: works on ${host.where}: an invented case table at Demo!A1:D6, selected. Formulas written here are kept as text; only Excel computes them.`,
    ),
    el(
      doc,
      "section",
      { "aria-labelledby": "lw-sheet-input-title" },
      el(doc, "h3", { id: "lw-sheet-input-title" }, "Case table and ruleset"),
      field(doc, "lw-sheet-cases", "Case table: a range or a defined name", casesInput, "lw-sheet-cases-hint", "e.g. Loads!A1:D5. Empty: the selection."),
      el(doc, "div", { class: "actions" }, useSelection),
      field(doc, "lw-sheet-ruleset", "Ruleset", rulesetSelect, null, null),
      field(doc, "lw-sheet-params", "Parameters", paramsInput, "lw-sheet-params-hint", "e.g. SDS=1.0; rho=1.3. Empty: the defaults. The formulas get these values in their parameter block."),
    ),
    el(doc, "section", { "aria-labelledby": "lw-sheet-preview-title" }, el(doc, "h3", { id: "lw-sheet-preview-title" }, "Envelope preview"), el(doc, "div", { class: "actions" }, preview), previewOut),
    el(
      doc,
      "section",
      { "aria-labelledby": "lw-sheet-insert-title" },
      el(doc, "h3", { id: "lw-sheet-insert-title" }, "Insert formulas"),
      el(
        doc,
        "p",
        { class: "hint" },
        "Writes the ruleset id, a parameter block (the ruleset's parameters with their defaults) and a criteria block as cells, and LW.RULESET, LW.ENVELOPE, LW.GOVERNING and LW.COMBOS over them and the case table, each with room for all it spills. Anything already there is written over only after you confirm.",
      ),
      field(doc, "lw-sheet-criteria", "Criteria for the governing rows, one a line", criteriaInput, "lw-sheet-criteria-hint", "e.g. max P, min P, max |M|. Empty: the max and min of every component."),
      field(doc, "lw-sheet-at", "Write at (a cell)", atInput, "lw-sheet-at-hint", "e.g. F1 or Calc!B2. Empty: one column right of the case table."),
      el(doc, "div", { class: "actions" }, insert),
      insertOut,
    ),
    el(
      doc,
      "section",
      { "aria-labelledby": "lw-sheet-copy-title" },
      el(doc, "h3", { id: "lw-sheet-copy-title" }, "Reviewer's copy"),
      el(doc, "p", { class: "hint" }, "A new worksheet of plain formulas (SUMPRODUCT, MAX, MIN, INDEX, MATCH) that a checker recomputes without the add-in, under the ruleset's stamp and the cautions."),
      el(doc, "div", { class: "actions" }, copy),
      copyOut,
    ),
    ctx.inExcel ? el(doc, "p", { class: "hint" }, "After a ruleset is stored, approved, imported or removed, the pane asks Excel to recalculate the workbook, so the formulas use what is stored.") : null,
    ].filter((c) => c !== null),
  );
  return root;
}

/** Runs the work; Excel's refusals and bad input are problems already, so anything thrown here is a defect, and said so. */
async function guarded(out: HTMLElement, work: () => Promise<void>): Promise<void> {
  try {
    await work();
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e);
    const doc = out.ownerDocument;
    show(out, "problem", el(doc, "p", { class: "problem" }, `The pane stopped on an unexpected error (${reason}); this is a defect in Loadwright, please report it with the case table.`));
  }
}

function textInput(doc: Document, id: string, value: string, hint: string): HTMLInputElement {
  const input = el(doc, "input", { id, type: "text", autocomplete: "off", spellcheck: "false", "aria-describedby": hint });
  input.value = value;
  return input;
}

function field(doc: Document, id: string, label: string, control: HTMLElement, hintId: string | null, hint: string | null): HTMLElement {
  return el(doc, "div", { class: "field" }, el(doc, "label", { for: id }, label), control, hintId && hint ? el(doc, "p", { class: "hint", id: hintId }, hint) : null);
}

function outlet(doc: Document, id: string): HTMLElement {
  return el(doc, "div", { id, "aria-live": "polite" });
}

function show(out: HTMLElement, state: "working" | "done" | "problem" | "confirm" | "declined" | "stale", ...children: Child[]): void {
  out.setAttribute("data-state", state);
  out.replaceChildren(...children.filter((c): c is string | Node => c !== null && c !== undefined && c !== false));
}

/** The stamp, the table read, the envelope per component with the row giving each extreme, and what the plan leaves out. */
function previewOf(ctx: PaneContext, t: TableOnSheet): HTMLElement[] {
  const { doc } = ctx;
  const entries = envelope(t.plan, t.table);
  const status = t.choice.status;
  const file = t.ruleset.file;
  const stamp =
    t.choice.entry && status
      ? stampLine(file, status, entryOrigin(t.choice.entry, ctx.storedWhere))
      : status
        ? `${statusText(status, file.approval).word} · draft ${file.id} ${file.version}, not stored: formulas cannot name it until it is stored · fingerprint ${status.shortFingerprint}`
        : file.id;
  const cases = t.table.cases.map((c) => c.header).join(", ");
  const out: HTMLElement[] = [
    el(doc, "p", { class: "stamp", id: "lw-sheet-stamp" }, stamp),
    el(doc, "p", { id: "lw-sheet-read" }, `${tableName(t.read)}: cases as ${t.table.orientation} (${cases}); ${counted(t.table.components.length, t.table.orientation === "rows" ? "component" : "result")}; ${counted(t.plan.rowCount, "combination row")}.`),
  ];
  if (!entries.ok) {
    // A sum past the largest number names its result's cell on the sheet, as a value that is not a number does.
    out.push(...entries.problems.map((p) => el(doc, "p", { class: "problem" }, `${tableName(t.read)}: ${placedText(p, t.read.area)}`)));
    return out;
  }
  out.push(envelopeTable(doc, t.table.orientation === "rows" ? "component" : "result", entries.value));
  out.push(...omissionTexts(planOmissions(t.plan)).map((n) => el(doc, "p", { class: "note" }, n)));
  return out;
}

/** "1 component", "737 combination rows". */
function counted(n: number, noun: string): string {
  return `${n.toLocaleString("en-US")} ${noun}${n === 1 ? "" : "s"}`;
}

function envelopeTable(doc: Document, first: string, entries: readonly EnvelopeEntry[]): HTMLElement {
  const head = [first, "max", "row giving max", "min", "row giving min"];
  return el(
    doc,
    "div",
    { class: "scroll", tabindex: "0", role: "region", "aria-label": "envelope" },
    el(
      doc,
      "table",
      { id: "lw-sheet-envelope" },
      el(doc, "thead", {}, el(doc, "tr", {}, ...head.map((h) => el(doc, "th", { scope: "col" }, h)))),
      el(
        doc,
        "tbody",
        {},
        ...entries.map((e) =>
          el(
            doc,
            "tr",
            { "data-component": e.result },
            el(doc, "th", { scope: "row" }, e.result),
            el(doc, "td", { class: "num", "data-max": String(e.max.value) }, formatNumber(e.max.value)),
            el(doc, "td", {}, e.max.label),
            el(doc, "td", { class: "num", "data-min": String(e.min.value) }, formatNumber(e.min.value)),
            el(doc, "td", {}, e.min.label),
          ),
        ),
      ),
    ),
  );
}

function confirmOverwrite(ctx: PaneContext, host: SheetHost, t: TableOnSheet, prepared: PreparedInsert, out: HTMLElement): void {
  const { doc } = ctx;
  const range = areaName(prepared.block.area);
  const shown = prepared.filled.slice(0, 8).join(", ") + (prepared.filled.length > 8 ? `, and ${prepared.filled.length - 8} more` : "");
  const count = prepared.filled.length;
  const write: HTMLButtonElement = button(
    doc,
    `Write over ${range}`,
    () => {
      write.disabled = true;
      void guarded(out, () => commitInsert(ctx, host, t, prepared, out));
    },
    { id: "lw-sheet-confirm-write", class: "danger" },
  );
  const cancel = button(doc, "Cancel", () => show(out, "declined", el(doc, "p", {}, `Nothing was written; ${range} is as it was.`)), { id: "lw-sheet-confirm-cancel" });
  show(
    out,
    "confirm",
    el(
      doc,
      "div",
      { class: "alarm-box", id: "lw-sheet-confirm", role: "alertdialog", "aria-labelledby": "lw-sheet-confirm-text" },
      el(doc, "p", { id: "lw-sheet-confirm-text" }, `${range} is not empty: ${count} ${count === 1 ? "cell holds" : "cells hold"} something (${shown}). Writing the formulas clears all of ${range} first.`),
      el(doc, "div", { class: "actions" }, write, cancel),
    ),
  );
  write.focus();
}

async function commitInsert(ctx: PaneContext, host: SheetHost, t: TableOnSheet, prepared: PreparedInsert, out: HTMLElement): Promise<void> {
  const { doc } = ctx;
  const written = await writeInsert(host, prepared);
  if (!written.ok) {
    show(out, "problem", ...written.lines.map((l) => el(doc, "p", { class: "problem" }, l)));
    return;
  }
  const { block } = prepared;
  const sheet = block.area.sheet;
  const rows: [string, string][] = [
    [cellInArea(block.area, 1, 1).replace(/^.*!/, ""), `ruleset id ${t.choice.entry?.id ?? ""}`],
    [areaName(block.params).replace(/^.*!/, ""), `parameters: name, value${block.notGiven.length > 0 ? ` (not given: ${block.notGiven.join(", ")})` : ""}`],
    [areaName(block.criteria).replace(/^.*!/, ""), "criteria"],
    ...block.formulas.map((f): [string, string] => [f.address, `=${f.formula} (spills over ${areaName(f.spill).replace(/^.*!/, "")})`]),
  ];
  const range = areaName(block.area);
  show(
    out,
    "done",
    el(doc, "p", {}, `Wrote the formulas at ${range} (worksheet ${sheet}):`),
    el(
      doc,
      "div",
      { class: "scroll", tabindex: "0", role: "region", "aria-label": "cells written" },
      el(
        doc,
        "table",
        { id: "lw-sheet-written" },
        el(doc, "thead", {}, el(doc, "tr", {}, el(doc, "th", { scope: "col" }, "cells"), el(doc, "th", { scope: "col" }, "holds"))),
        el(doc, "tbody", {}, ...rows.map(([a, what]) => el(doc, "tr", {}, el(doc, "td", { class: "mono" }, a), el(doc, "td", { class: "mono" }, what)))),
      ),
    ),
  );
  ctx.notice(`Inserted LW.RULESET, LW.ENVELOPE, LW.GOVERNING and LW.COMBOS over ${tableName(t.read)} at ${range}.`, "done");
}
