/**
 * Puts each problem beside the field it concerns: the slot of its JSON path,
 * or of the nearest enclosing entry or section when the form has no field for
 * it (a missing field, an unknown one). In an expression, the character the
 * problem names is marked in a copy of the expression under the field.
 */
import { formatPath } from "../core/index.js";
import type { EditorProblem } from "./draftCheck.js";
import { el } from "./dom.js";

function slotFor(root: HTMLElement, path: (string | number)[]): { slot: HTMLElement; exact: boolean } | null {
  for (let n = path.length; n >= 0; n--) {
    const key = formatPath(path.slice(0, n));
    const slot = root.querySelector<HTMLElement>(`[data-problem-for="${CSS.escape(key)}"]`);
    if (slot) return { slot, exact: n === path.length };
  }
  return null;
}

export function clearProblems(root: HTMLElement): void {
  for (const slot of root.querySelectorAll<HTMLElement>("[data-problem-for]")) slot.replaceChildren();
  for (const control of root.querySelectorAll<HTMLElement>("[aria-invalid]")) control.removeAttribute("aria-invalid");
}

export function placeProblems(root: HTMLElement, problems: readonly EditorProblem[], local: ReadonlyMap<string, string>): void {
  const doc = root.ownerDocument;
  clearProblems(root);
  const mark = (slot: HTMLElement) => slot.parentElement?.querySelector(`[data-control-for="${CSS.escape(slot.dataset.problemFor ?? "")}"]`)?.setAttribute("aria-invalid", "true");
  for (const p of problems) {
    const found = slotFor(root, p.path);
    if (!found) continue;
    const line = el(doc, "p", { class: "problem" }, found.exact ? p.local : p.full);
    found.slot.append(line);
    if (found.exact) mark(found.slot);
    const control = found.exact ? found.slot.parentElement?.querySelector<HTMLInputElement>("input, textarea") : null;
    if (p.position !== null && control) found.slot.append(pointer(doc, control.value, p.position));
  }
  for (const [path, message] of local) {
    const slot = root.querySelector<HTMLElement>(`[data-problem-for="${CSS.escape(path)}"]`);
    if (!slot) continue;
    slot.append(el(doc, "p", { class: "problem" }, message));
    mark(slot);
  }
  // A folded section with a problem in it unfolds, and every section says how many it holds.
  for (const section of root.querySelectorAll<HTMLDetailsElement>("details.form-section")) {
    const count = section.querySelectorAll(".field-problem .problem").length;
    const badge = section.querySelector(".section-problems");
    if (badge) badge.textContent = count === 0 ? "" : ` — ${count} ${count === 1 ? "problem" : "problems"}`;
    if (count > 0) section.open = true;
  }
}

/** The expression with the named character marked: `1.2D + 1.6L + 0.5(Lr or S or ⟦R⟧x)`. */
export function pointer(doc: Document, text: string, position: number): HTMLElement {
  const i = Math.max(0, Math.min(position - 1, text.length));
  const at = i < text.length ? text[i] : " ";
  return el(
    doc,
    "p",
    { class: "pointer mono", "aria-label": `character ${position} of the expression is marked` },
    text.slice(0, i),
    el(doc, "mark", { class: "at" }, at === " " ? "␣" : at),
    text.slice(i + 1),
  );
}
