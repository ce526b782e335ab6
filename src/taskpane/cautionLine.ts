/**
 * The cautions above every view: one line in the catalogue's compact words
 * that opens the full text, and the full text itself, shown open until someone
 * acknowledges it for this workbook (the acknowledgement is kept with the
 * workbook; see src/workbook/cautionAcknowledgement.ts). Enter or Space on the
 * line opens and closes it; Escape closes it from anywhere inside.
 */
import { compactCautionLine, fullCautions } from "../core/index.js";
import type { CautionAcknowledgement } from "../workbook/cautionAcknowledgement.js";
import { button, el, todayText } from "./dom.js";
import { icon } from "./icons.js";

export interface CautionLineOptions {
  record: CautionAcknowledgement;
  /** Short words for where the acknowledgement is kept: "this workbook", "this browser". */
  keptIn: string;
}

export function renderCautionLine(doc: Document, section: HTMLElement, options: CautionLineOptions): void {
  const { record, keptIn } = options;
  const toggle = el(
    doc,
    "button",
    { type: "button", id: "lw-caution-toggle", class: "caution-line", "aria-expanded": "false", "aria-controls": "lw-caution-text" },
    icon(doc, "warning", "icon caution-icon"),
    el(doc, "span", { class: "caution-words" }, compactCautionLine()),
    icon(doc, "chevron", "icon chevron"),
  );
  const recordLine = el(doc, "p", { class: "hint", id: "lw-caution-record" });
  const problem = el(doc, "p", { class: "problem", id: "lw-caution-problem", role: "alert" });
  problem.hidden = true;
  const acknowledge = button(doc, "I have read the cautions", () => void confirmRead(), { id: "lw-caution-ack", class: "primary" });
  const close = button(doc, "Close", () => setOpen(false, true), { id: "lw-caution-close" });
  const text = el(
    doc,
    "div",
    { id: "lw-caution-text", class: "caution-text", role: "group", "aria-label": "The cautions in full" },
    ...fullCautions().map((c) => el(doc, "p", {}, c)),
    recordLine,
    problem,
    el(doc, "div", { class: "actions" }, acknowledge, close),
  );

  const showRecord = () => {
    const current = record.current();
    recordLine.textContent = current ? `Acknowledged for ${keptIn} on ${current.date}.` : `Shown in full until someone acknowledges them for ${keptIn}.`;
    acknowledge.hidden = current !== null;
    close.hidden = current === null;
  };
  const setOpen = (open: boolean, focusLine = false) => {
    text.hidden = !open;
    toggle.setAttribute("aria-expanded", String(open));
    section.classList.toggle("open", open);
    if (focusLine) toggle.focus();
  };
  const confirmRead = async () => {
    acknowledge.disabled = true;
    const done = await record.acknowledge(todayText());
    acknowledge.disabled = false;
    problem.hidden = done.ok;
    problem.textContent = done.ok ? "" : done.problems.map((p) => p.message).join("; ");
    showRecord();
    if (done.ok) setOpen(false, true);
  };

  toggle.addEventListener("click", () => setOpen(text.hidden));
  section.addEventListener("keydown", (e) => {
    if (e.key !== "Escape" || text.hidden) return;
    e.preventDefault();
    setOpen(false, true);
  });
  section.replaceChildren(toggle, text);
  showRecord();
  setOpen(record.current() === null);
}
