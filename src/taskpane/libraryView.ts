/**
 * Library: every ruleset a formula can name, stored first, then shipped, as a
 * dense list — each entry its verification (UNVERIFIED in words), id, version,
 * title, approval, source, fingerprint and, where a firm library is read, its
 * standing against it. The chosen one's details open in place under it: what
 * to do with it, and its combination list as LW.COMBOS gives it.
 */
import { stampLine, type Ruleset, type RulesetFile, type RulesetStatus } from "../core/index.js";
import { entryOrigin, type LibraryEntry } from "../workbook/rulesetLibrary.js";
import { withAfterWrite } from "./afterWrite.js";
import { comboList } from "./comboList.js";
import { button, el, uniqueId } from "./dom.js";
import { exportButtons } from "./exportRuleset.js";
import { firmLibraryLine, standingBadge } from "./firmStanding.js";
import { newIdField } from "./newIdField.js";
import type { Draft } from "./draftStore.js";
import { draftOfCopy, draftOfStored, draftOfUnloadable } from "./openDraft.js";
import type { PaneContext } from "./paneContext.js";
import { approvalBadge, coverageLine, fromMemoryBox, sourceLine, verificationBadge } from "./statusText.js";

export function libraryView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const { entries, storeProblem } = ctx.library();
  if (ctx.selected !== null && !entries.some((e) => e.id === ctx.selected)) ctx.selected = null;
  const root = el(doc, "div", { id: "lw-library" });
  if (storeProblem) root.append(el(doc, "p", { id: "lw-store-problem", class: "problem", role: "alert" }, storeProblem));
  root.append(firmLibraryLine(ctx));
  const drafts = ctx.drafts.list();
  if (drafts.length > 0) {
    root.append(
      el(
        doc,
        "p",
        { class: "drafts-line" },
        `${drafts.length === 1 ? "One draft is" : `${drafts.length} drafts are`} open and not stored: `,
        button(doc, "show in the editor", () => ctx.show("editor"), { class: "link" }),
      ),
    );
  }
  if (entries.length === 0) {
    root.append(el(doc, "p", {}, "No ruleset is shipped or stored yet."));
    return root;
  }
  const list = el(doc, "ul", { id: "lw-rulesets", class: "ruleset-list", "aria-label": "Rulesets" });
  for (const entry of entries) {
    list.append(entryItem(ctx, entry));
    if (entry.id === ctx.selected) list.append(el(doc, "li", { class: "entry-details" }, details(ctx, entry)));
  }
  root.append(list);
  if (ctx.selected === null) root.append(el(doc, "p", { class: "hint" }, "Choose a ruleset to see its details, its combination list and what can be done with it."));
  return root;
}

function entryItem(ctx: PaneContext, entry: LibraryEntry): HTMLElement {
  const { doc } = ctx;
  const f = entry.ruleset?.file;
  const selected = entry.id === ctx.selected;
  const pick = button(
    doc,
    entry.id,
    () => {
      ctx.selected = entry.id;
      ctx.show("library");
      doc.querySelector<HTMLElement>(`#lw-rulesets li[data-ruleset-id="${CSS.escape(entry.id)}"] button.ruleset`)?.focus();
    },
    { class: "ruleset truncate", title: entry.id, "aria-expanded": selected ? "true" : "false", "aria-controls": selected ? "lw-selected" : undefined },
  );
  return el(
    doc,
    "li",
    { "data-ruleset-id": entry.id, "data-source": entry.source, "data-status": entry.status?.verification ?? "invalid", class: selected ? "selected" : "" },
    el(doc, "div", { class: "entry-line" }, verificationBadge(doc, entry.status), pick, f ? el(doc, "span", { class: "entry-version truncate", title: f.version }, f.version) : null),
    el(doc, "div", { class: "entry-title truncate", title: f?.title ?? entry.problem ?? "" }, f?.title ?? entry.problem ?? ""),
    el(
      doc,
      "div",
      { class: "entry-meta" },
      f && entry.status ? approvalBadge(doc, f, entry.status) : null,
      standingBadge(ctx, entry),
      el(doc, "span", { class: "entry-source" }, sourceLine(entry, ctx.storedWhere)),
      entry.status ? el(doc, "span", { class: "fingerprint", title: entry.status.fingerprint }, entry.status.shortFingerprint) : null,
    ),
  );
}

function details(ctx: PaneContext, entry: LibraryEntry): HTMLElement {
  const { doc } = ctx;
  const close = button(
    doc,
    "Close",
    () => {
      ctx.selected = null;
      ctx.show("library");
      doc.querySelector<HTMLElement>(`#lw-rulesets li[data-ruleset-id="${CSS.escape(entry.id)}"] button.ruleset`)?.focus();
    },
    { class: "small", "aria-label": `Close the details of ${entry.id}` },
  );
  const root = el(
    doc,
    "section",
    { id: "lw-selected", "aria-labelledby": "lw-selected-title" },
    el(doc, "div", { class: "details-head" }, el(doc, "h2", { id: "lw-selected-title" }, entry.id), close),
  );
  const { ruleset, status } = entry;
  if (!ruleset || !status) {
    root.append(...unloadable(ctx, entry));
    if (entry.source === "stored") root.append(removeControl(ctx, entry));
  } else {
    root.append(...standing(ctx, ruleset, status), ...actions(ctx, entry, ruleset.file));
    if (entry.source === "stored") root.append(removeControl(ctx, entry));
    root.append(...record(ctx, entry, ruleset, status), ...combinationList(ctx, entry, ruleset, status));
  }
  return root;
}

/** Opens the stored ruleset (or a draft of it already open) in the editor. */
function editStored(ctx: PaneContext, entry: LibraryEntry, make: () => Draft): void {
  const existing = ctx.drafts.list().find((d) => d.base.kind === "stored" && d.base.id === entry.id);
  const draft = existing ?? make();
  if (!existing) ctx.drafts.put(draft);
  ctx.openDraft = draft.key;
  ctx.show("editor");
}

/** A stored entry that no longer loads: why, and the way to mend it. */
function unloadable(ctx: PaneContext, entry: LibraryEntry): HTMLElement[] {
  const { doc } = ctx;
  return [
    el(doc, "p", { class: "problem", id: "lw-selected-problem" }, `This stored ruleset no longer loads: ${entry.problem ?? "unknown problem"}. It is kept as it was stored; formulas naming it show this message. Edit it as a draft to mend it.`),
    el(doc, "div", { class: "actions" }, button(doc, "Edit as a draft", () => editStored(ctx, entry, () => draftOfUnloadable(entry.id, ctx.store().find(entry.id)?.file)))),
  ];
}

/** Identity, verification and approval, and how much its sources confirm: what decides whether to use it, first. */
function standing(ctx: PaneContext, ruleset: Ruleset, status: RulesetStatus): HTMLElement[] {
  const { doc } = ctx;
  const f = ruleset.file;
  return [
    el(doc, "p", { class: "entry-title" }, f.title),
    el(doc, "p", { class: "detail" }, `${f.standard.name} ${f.standard.edition}${f.standard.clauses ? ` — ${f.standard.clauses}` : ""}`, f.basis ? ` · ${f.basis}` : "", ` · version ${f.version}`),
    el(doc, "p", { class: "badges" }, verificationBadge(doc, status), " ", approvalBadge(doc, f, status)),
    el(doc, "p", { id: "lw-selected-summary" }, status.summary),
    coverageLine(doc, status, "lw-selected-coverage"),
  ];
}

/** What is from memory (in full), the approval note, fingerprint, source and notes. */
function record(ctx: PaneContext, entry: LibraryEntry, ruleset: Ruleset, status: RulesetStatus): HTMLElement[] {
  const { doc } = ctx;
  const f = ruleset.file;
  return [
    ...(status.verification === "unverified" ? [fromMemoryBox(doc, f)] : []),
    ...(f.approval.note ? [el(doc, "p", {}, `Approval note: ${f.approval.note}`)] : []),
    el(doc, "p", { class: "detail" }, "Fingerprint ", el(doc, "span", { class: "fingerprint", id: "lw-selected-fingerprint" }, status.fingerprint)),
    el(doc, "p", { class: "detail" }, sourceLine(entry, ctx.storedWhere)),
    ...(f.notes ?? []).map((note) => el(doc, "p", { class: "note" }, note)),
  ];
}

/** What can be done with a ruleset that loads: edit (stored), copy, approve, compare, export. */
function actions(ctx: PaneContext, entry: LibraryEntry, file: RulesetFile): HTMLElement[] {
  const { doc } = ctx;
  const copyForm = copyControl(ctx, entry);
  const row = el(
    doc,
    "div",
    { class: "actions" },
    entry.source === "stored" ? button(doc, "Edit as a draft", () => editStored(ctx, entry, () => draftOfStored(entry))) : null,
    button(doc, "Open a copy…", () => {
      copyForm.hidden = false;
      copyForm.querySelector("input")?.focus();
    }),
    button(doc, "Approve…", () => ctx.show("approve")),
    button(doc, "Compare…", () => {
      const mine = entry.source === "stored" ? `stored:${entry.id}` : `shipped:${entry.id}`;
      ctx.comparePair = { before: entry.shippedFingerprint ? `shipped:${entry.id}` : mine, after: mine };
      ctx.show("compare");
    }),
    ...exportButtons(ctx, file),
  );
  return [row, copyForm];
}

/** The combination list for the parameters typed, under the same stamp a formula's result carries. */
function combinationList(ctx: PaneContext, entry: LibraryEntry, ruleset: Ruleset, status: RulesetStatus): HTMLElement[] {
  const { doc } = ctx;
  const paramsId = uniqueId("lw-params");
  const params = el(doc, "input", { id: "lw-params", type: "text", autocomplete: "off", spellcheck: "false", "aria-describedby": paramsId });
  const combos = el(doc, "div", { id: "lw-combos" });
  const stamp = stampLine(ruleset.file, status, entryOrigin(entry, ctx.storedWhere));
  const render = () => combos.replaceChildren(...comboList(doc, ruleset, params.value, { tableId: "lw-combo-table", stamp }));
  params.addEventListener("change", render);
  render();
  return [
    el(doc, "h3", {}, "Combination list"),
    el(doc, "label", { for: "lw-params" }, "Parameters"),
    params,
    el(doc, "p", { id: paramsId, class: "hint" }, "e.g. SDS=1.2; rho=1.3 — empty: the ruleset's defaults. Press Enter to apply."),
    combos,
  ];
}

/** "Open a copy…": the id the copy will have, chosen by the user and checked before the draft opens. */
function copyControl(ctx: PaneContext, entry: LibraryEntry): HTMLElement {
  const { doc } = ctx;
  const inputId = uniqueId("lw-copy-id");
  const problemId = uniqueId("lw-copy-problem");
  const { input, problem, submit: open } = newIdField(ctx, { input: inputId, problem: problemId }, { value: `${entry.id}-firm` }, (id) => draftOfCopy(entry, id));
  const form = el(
    doc,
    "div",
    { class: "inline-form", id: "lw-copy-form" },
    el(doc, "label", { for: inputId }, `Id of the copy of ${entry.id} (lower-case letters, digits, '.', '_', '-')`),
    input,
    problem,
    button(doc, "Open the copy as a draft", open, { id: "lw-copy-open" }),
  );
  form.hidden = true;
  return form;
}

/** Removing a stored ruleset takes a second, explicit click that says what follows. */
function removeControl(ctx: PaneContext, entry: LibraryEntry): HTMLElement {
  const { doc } = ctx;
  const box = el(doc, "div", { class: "inline-form" });
  const consequence = entry.shippedFingerprint
    ? `Formulas naming "${entry.id}" will use the shipped ruleset again.`
    : `Formulas naming "${entry.id}" will show an error until it is stored again.`;
  const confirm = button(
    doc,
    `Yes, remove ${entry.id} from ${ctx.storedWhere}`,
    () => {
      void ctx
        .store()
        .remove(entry.id)
        .then((result) => {
          if (result.ok) {
            ctx.notice(withAfterWrite(`Removed ${entry.id} from ${ctx.storedWhere}. ${consequence}`, result), "done");
            ctx.selected = null;
          } else {
            ctx.notice(result.problems.map((p) => p.message).join("; "), "problem");
          }
          ctx.show("library");
        });
    },
    { class: "danger" },
  );
  const explain = el(doc, "p", { class: "hint" }, `${consequence} Export it first if you may need it again.`);
  confirm.hidden = true;
  explain.hidden = true;
  box.append(
    button(doc, "Remove from store…", () => {
      confirm.hidden = false;
      explain.hidden = false;
      confirm.focus();
    }),
    explain,
    confirm,
  );
  return box;
}
