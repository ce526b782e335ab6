/**
 * The editor form's fields: each a label, a control and a slot beside it where
 * its problems appear, tied to one JSON path of the draft. A field writes the
 * draft as the user types; the form is rebuilt only when its structure changes
 * (an entry added, removed, moved or renamed).
 */
import { formatPath } from "../core/index.js";
import { getAt, numberOrText, setAt, shownText, type JsonObject, type Path } from "./dataPath.js";
import { el, uniqueId } from "./dom.js";

export interface FormContext {
  doc: Document;
  data: JsonObject;
  /** A value changed: keep the draft, validate soon. */
  changed(): void;
  /** The structure changed: rebuild the form and focus the field with this path. */
  rebuild(focus?: string): void;
  /** What the form itself refuses, by field path (a name already taken, a list it cannot read). */
  localProblems: Map<string, string>;
  /** The sections unfolded, kept across rebuilds. */
  openSections: Set<string>;
}

export interface Option {
  value: string;
  label: string;
}

interface FieldSpec {
  label: string;
  path: Path;
  hint?: string;
  /** Removed from the draft when emptied. */
  optional?: boolean;
  className?: string;
}

/** Label, control, hint and problem slot around one control. */
export function fieldShell(fc: FormContext, spec: FieldSpec, control: HTMLElement): HTMLElement {
  const { doc } = fc;
  const path = formatPath(spec.path);
  const id = control.id || uniqueId("lw-f");
  control.id = id;
  const slotId = `${id}-problem`;
  const hintId = spec.hint ? `${id}-hint` : undefined;
  control.setAttribute("aria-describedby", [hintId, slotId].filter(Boolean).join(" "));
  control.setAttribute("data-control-for", path);
  return el(
    doc,
    "div",
    { class: `field ${spec.className ?? ""}`.trim(), "data-path": path },
    el(doc, "label", { for: id }, spec.label),
    control,
    spec.hint ? el(doc, "p", { id: hintId, class: "hint" }, spec.hint) : null,
    el(doc, "div", { id: slotId, class: "field-problem", "data-problem-for": path }),
  );
}

export function textField(fc: FormContext, spec: FieldSpec & { multiline?: boolean; mono?: boolean }): HTMLElement {
  const { doc } = fc;
  const control = (spec.multiline ? el(doc, "textarea", { rows: "2" }) : el(doc, "input", { type: "text" }));
  control.value = shownText(getAt(fc.data, spec.path));
  control.spellcheck = !spec.mono;
  control.autocomplete = "off";
  if (spec.mono) control.classList.add("mono");
  control.addEventListener("input", () => {
    setAt(fc.data, spec.path, spec.optional && control.value === "" ? undefined : control.value);
    fc.changed();
  });
  return fieldShell(fc, spec, control);
}

export function numberField(fc: FormContext, spec: FieldSpec): HTMLElement {
  const { doc } = fc;
  const control = el(doc, "input", { type: "text", inputmode: "decimal", autocomplete: "off", spellcheck: "false" });
  control.value = shownText(getAt(fc.data, spec.path));
  control.addEventListener("input", () => {
    setAt(fc.data, spec.path, numberOrText(control.value));
    fc.changed();
  });
  return fieldShell(fc, { optional: true, ...spec }, control);
}

/**
 * A choice among fixed values; `""` stands for "not written" (the format's
 * default applies), so opening and storing a file never adds or drops a field
 * the user did not touch.
 */
export function selectField(fc: FormContext, spec: FieldSpec & { options: Option[]; parse?: (v: string) => unknown }): HTMLElement {
  const { doc } = fc;
  const current = getAt(fc.data, spec.path);
  const currentText = current === undefined ? "" : shownText(current);
  const options = [...spec.options];
  if (!options.some((o) => o.value === currentText)) options.push({ value: currentText, label: `${currentText} (not a value of the format)` });
  const control = el(doc, "select", {}, ...options.map((o) => optionOf(doc, o)));
  control.value = currentText;
  control.addEventListener("change", () => {
    const v = control.value;
    setAt(fc.data, spec.path, v === "" ? undefined : spec.parse ? spec.parse(v) : v);
    fc.changed();
  });
  return fieldShell(fc, spec, control);
}

/** An option whose value is set even when empty (an empty attribute would make its label the value). */
export function optionOf(doc: Document, o: Option): HTMLOptionElement {
  const option = el(doc, "option", {}, o.label);
  option.value = o.value;
  return option;
}

/**
 * A field whose text the form turns into a value itself (a list, a name, a
 * small table): `read` gives the value, or a problem that is shown beside the
 * field and keeps the draft from being stored until it is mended.
 */
export function parsedField(
  fc: FormContext,
  spec: FieldSpec & { text: string; multiline?: boolean; mono?: boolean; on?: "input" | "change"; read: (text: string) => { problem: string } | { apply: () => void } },
): HTMLElement {
  const { doc } = fc;
  const control = (spec.multiline ? el(doc, "textarea", { rows: "4" }) : el(doc, "input", { type: "text" }));
  control.value = spec.text;
  control.spellcheck = false;
  control.autocomplete = "off";
  if (spec.mono) control.classList.add("mono");
  const path = formatPath(spec.path);
  control.addEventListener(spec.on ?? "input", () => {
    const outcome = spec.read(control.value);
    if ("problem" in outcome) {
      fc.localProblems.set(path, outcome.problem);
      fc.changed();
      return;
    }
    fc.localProblems.delete(path);
    outcome.apply();
  });
  return fieldShell(fc, spec, control);
}

/** A small labelled button that says what it acts on, for screen readers too. */
export function entryButton(doc: Document, text: string, label: string, onClick: () => void, disabled = false): HTMLButtonElement {
  const b = el(doc, "button", { type: "button", class: "small", "aria-label": label, title: label }, text);
  b.disabled = disabled;
  b.addEventListener("click", onClick);
  return b;
}
