/**
 * The field where a user names a new draft (a new ruleset, a copy of a shipped
 * one): the id is checked against the file format and the ids already taken
 * before the draft opens in the editor.
 */
import type { Draft } from "./draftStore.js";
import { el } from "./dom.js";
import { newIdProblem } from "./openDraft.js";
import type { PaneContext } from "./paneContext.js";
import { takenIds } from "./takenIds.js";

export interface NewIdField {
  input: HTMLInputElement;
  problem: HTMLElement;
  /** Check the id and, if it is free and well formed, open the draft `makeDraft` gives. */
  submit: () => void;
}

export function newIdField(
  ctx: PaneContext,
  ids: { input: string; problem: string },
  attributes: Record<string, string>,
  makeDraft: (id: string) => Draft,
): NewIdField {
  const { doc } = ctx;
  const input = el(doc, "input", { id: ids.input, type: "text", autocomplete: "off", spellcheck: "false", "aria-describedby": ids.problem, ...attributes });
  const problem = el(doc, "p", { id: ids.problem, class: "field-problem", role: "alert" });
  const submit = () => {
    const id = input.value.trim();
    const why = newIdProblem(id, takenIds(ctx));
    if (why) {
      problem.textContent = why;
      input.setAttribute("aria-invalid", "true");
      input.focus();
      return;
    }
    const draft = makeDraft(id);
    ctx.drafts.put(draft);
    ctx.openDraft = draft.key;
    ctx.show("editor");
  };
  input.addEventListener("keydown", (e) => {
    if (e.key === "Enter") submit();
  });
  return { input, problem, submit };
}
