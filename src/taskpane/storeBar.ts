/**
 * The editor's store bar: storing is possible once the draft loads without
 * problems, and only after confirming anything it would replace or shadow.
 */
import { button, el, uniqueId } from "./dom.js";
import { unchangedAfterFailure, withAfterWrite } from "./afterWrite.js";
import type { DraftCheck } from "./draftCheck.js";
import type { Draft } from "./draftStore.js";
import type { PaneContext } from "./paneContext.js";
import { storeConflicts } from "./storeConflicts.js";

export function renderStoreBar(ctx: PaneContext, draft: Draft, check: DraftCheck, localCount: number, bar: HTMLElement): void {
  const { doc } = ctx;
  const store = button(doc, `Store in ${ctx.storedWhere}`, () => undefined, { id: "lw-store", class: "primary" });
  const reason = el(doc, "p", { class: "hint", id: "lw-store-reason" });
  bar.replaceChildren();
  const ruleset = check.ruleset;
  if (!ruleset || localCount > 0) {
    store.disabled = true;
    reason.textContent = "Storing is possible once the draft loads without problems; what is stored now stays as it is.";
    bar.append(store, reason);
    return;
  }
  const conflicts = storeConflicts(draft.base, ruleset, ctx.library(), ctx.storedWhere);
  for (const line of conflicts.info) bar.append(el(doc, "p", { class: "hint" }, line));
  let confirm: HTMLInputElement | null = null;
  if (conflicts.confirm.length > 0) {
    const id = uniqueId("lw-store-confirm");
    confirm = el(doc, "input", { type: "checkbox", id });
    bar.append(
      el(doc, "div", { class: "alarm-box" }, ...conflicts.confirm.map((c) => el(doc, "p", {}, c)), el(doc, "label", { for: id, class: "check" }, confirm, " I mean to store it anyway")),
    );
    store.disabled = true;
    confirm.addEventListener("change", () => {
      store.disabled = !confirm?.checked;
    });
  }
  store.addEventListener("click", () => {
    if (confirm && !confirm.checked) return;
    store.disabled = true;
    void ctx
      .store()
      .save(ruleset.file)
      .then((result) => {
        if (!result.ok) {
          store.disabled = false;
          const text = result.problems.map((p) => p.message).join("; ");
          reason.textContent = `Not stored: ${text}. The draft is kept.`;
          reason.className = "problem";
          ctx.notice(`Not stored: ${text}. The draft is kept${unchangedAfterFailure(result)}.`, "problem");
          return;
        }
        ctx.drafts.remove(draft.key);
        ctx.openDraft = null;
        ctx.selected = ruleset.file.id;
        ctx.notice(withAfterWrite(`Stored ${ruleset.file.id} ${ruleset.file.version} in ${ctx.storedWhere} (fingerprint ${check.status?.shortFingerprint ?? ""}); the draft is closed.`, result), "done");
        ctx.show("library");
      });
  });
  reason.textContent = "Stores exactly this content; the draft is then closed.";
  bar.append(store, reason);
}
