/**
 * Editor: a draft opened from the library, an import or a new ruleset, edited
 * as a form or as JSON text, validated as the user types (debounced) with
 * every problem beside its field, kept in browser storage apart from the
 * stored copies, and stored only when it loads — after confirming anything it
 * would replace. Shows when an approval will stop applying.
 */
import { button, el } from "./dom.js";
import { draftEditor } from "./draftEditor.js";
import { baseText, draftId } from "./draftLabel.js";
import type { Draft } from "./draftStore.js";
import { newIdField } from "./newIdField.js";
import { draftOfNew } from "./openDraft.js";
import type { PaneContext } from "./paneContext.js";

export function editorView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const drafts = ctx.drafts.list();
  if (ctx.openDraft === null || !drafts.some((d) => d.key === ctx.openDraft)) ctx.openDraft = drafts[0]?.key ?? null;
  const root = el(doc, "div", { id: "lw-editor" });
  if (ctx.drafts.problem) root.append(el(doc, "p", { class: "problem", role: "alert", id: "lw-drafts-problem" }, ctx.drafts.problem));
  const current = drafts.find((d) => d.key === ctx.openDraft);
  if (!current) {
    root.append(
      el(doc, "p", {}, "No draft is open. Open one from the Library (Edit as a draft, or Open a copy of a shipped or stored ruleset), import one, or start a new ruleset."),
      newRulesetControl(ctx, true),
    );
    return root;
  }
  if (drafts.length > 1) root.append(draftPicker(ctx, drafts));
  root.append(draftEditor(ctx, current), newRulesetControl(ctx, false));
  return root;
}

function draftPicker(ctx: PaneContext, drafts: readonly Draft[]): HTMLElement {
  const { doc } = ctx;
  const select = el(doc, "select", { id: "lw-draft-pick" }, ...drafts.map((d) => el(doc, "option", { value: d.key }, `${draftId(d)} — ${baseText(d)}`)));
  select.value = ctx.openDraft ?? "";
  select.addEventListener("change", () => {
    ctx.openDraft = select.value;
    ctx.show("editor");
  });
  return el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-draft-pick" }, `Open drafts (${drafts.length})`), select);
}

function newRulesetControl(ctx: PaneContext, open: boolean): HTMLElement {
  const { doc } = ctx;
  const { input, problem, submit: start } = newIdField(ctx, { input: "lw-new-id", problem: "lw-new-problem" }, { class: "mono" }, draftOfNew);
  const details = el(
    doc,
    "details",
    { class: "new-ruleset" },
    el(doc, "summary", {}, "Start a new ruleset"),
    el(doc, "label", { for: "lw-new-id" }, "Id of the new ruleset"),
    input,
    problem,
    button(doc, "Start", start),
  );
  details.open = open;
  return details;
}
