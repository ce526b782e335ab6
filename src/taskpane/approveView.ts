/**
 * Approve: a firm's checker records who approved which exact content and when.
 * The approval carries the fingerprint, so any later edit shows it as void.
 * An UNVERIFIED ruleset needs an extra, explicit confirmation that the parts
 * its provenance marks as from memory were checked against the standard.
 */
import { approveRuleset, describeProblem, formatPath, type Ruleset, type RulesetStatus } from "../core/index.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { withAfterWrite } from "./afterWrite.js";
import { calendarDateProblem } from "./approvalDate.js";
import { button, el, todayText } from "./dom.js";
import type { PaneContext } from "./paneContext.js";
import { approvalBadge, coverageLine, fromMemoryBox, sourceLine, unverifiedSuffix, verificationBadge } from "./statusText.js";

/** Recorded in the approval note when an UNVERIFIED ruleset is approved. */
export const MEMORY_CHECK_NOTE = "The approver confirmed checking the parts its provenance marks as from memory against the standard.";

/** A library entry that loads, which is what can be approved. */
interface Approvable {
  entry: LibraryEntry;
  ruleset: Ruleset;
  status: RulesetStatus;
}

export function approveView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const root = el(doc, "div", { id: "lw-approve" });
  const approvable: Approvable[] = ctx
    .library()
    .entries.flatMap((entry) => (entry.ruleset && entry.status ? [{ entry, ruleset: entry.ruleset, status: entry.status }] : []));
  if (approvable.length === 0) {
    root.append(el(doc, "p", {}, "No ruleset can be approved: none is shipped or stored that loads."));
    return root;
  }
  const chosen = approvable.find((a) => a.entry.id === ctx.selected) ?? approvable[0];
  ctx.selected = chosen.entry.id;
  root.append(picker(ctx, approvable, chosen.entry.id));
  if (ctx.drafts.list().length > 0) root.append(el(doc, "p", { class: "hint" }, "Drafts are approved once stored: store a draft first, then approve the stored ruleset."));
  root.append(approvalForm(ctx, chosen));
  return root;
}

function picker(ctx: PaneContext, approvable: readonly Approvable[], selected: string): HTMLElement {
  const { doc } = ctx;
  const label = ({ entry }: Approvable) => `${entry.id} (${entry.source === "stored" ? `stored in ${ctx.storedWhere}` : "shipped"})${unverifiedSuffix(entry.status)}`;
  const pick = el(doc, "select", { id: "lw-approve-pick" }, ...approvable.map((a) => el(doc, "option", { value: a.entry.id }, label(a))));
  pick.value = selected;
  pick.addEventListener("change", () => {
    ctx.selected = pick.value;
    ctx.show("approve");
    doc.getElementById("lw-approve-pick")?.focus();
  });
  return el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-approve-pick" }, "Ruleset to approve"), pick);
}

/** What is being approved: identity, standing, how much its sources confirm, the fingerprint the approval will record. */
function standing(ctx: PaneContext, { entry, ruleset, status }: Approvable): HTMLElement[] {
  const { doc } = ctx;
  const file = ruleset.file;
  const out = [
    el(doc, "h2", { id: "lw-approve-title" }, `${file.id} ${file.version}`),
    el(doc, "p", { class: "entry-title" }, file.title),
    el(doc, "p", { class: "badges", id: "lw-approve-status" }, verificationBadge(doc, status), " ", approvalBadge(doc, file, status)),
    coverageLine(doc, status, "lw-approve-coverage"),
    el(doc, "p", {}, sourceLine(entry, ctx.storedWhere)),
    el(doc, "p", {}, "Content fingerprint (what the approval records) ", el(doc, "span", { class: "fingerprint", id: "lw-approve-fingerprint" }, status.fingerprint)),
  ];
  if (entry.source === "shipped") {
    out.push(
      el(doc, "p", { class: "hint" }, `Approving a shipped ruleset stores an approved copy of it in ${ctx.storedWhere} under the same id, with the same content and fingerprint; formulas naming "${file.id}" then use that copy.`),
    );
  }
  if (status.approval !== "not-approved") out.push(el(doc, "p", { class: "hint" }, "Approving again replaces the approval recorded now."));
  return out;
}

interface MemoryConfirmation {
  box: HTMLElement;
  check: HTMLInputElement;
  problem: HTMLElement;
}

/** For an UNVERIFIED ruleset: what is from memory, and the approver's explicit confirmation of having checked it. */
function memoryConfirmation(doc: Document, ruleset: Ruleset): MemoryConfirmation {
  const { file } = ruleset;
  const check = el(doc, "input", { type: "checkbox", id: "lw-approve-memory", "aria-describedby": "lw-approve-memory-problem" });
  const problem = el(doc, "div", { class: "field-problem", id: "lw-approve-memory-problem", role: "alert" });
  const box = fromMemoryBox(
    doc,
    file,
    el(doc, "label", { for: "lw-approve-memory", class: "check" }, check, ` I have checked every part listed above against ${file.standard.name} ${file.standard.edition} myself, and the factors agree with the edition this firm has adopted.`),
    problem,
    el(doc, "p", { class: "hint" }, "Approval does not change the verification: the ruleset stays UNVERIFIED until its provenance marks those sources as confirmed (edit the provenance in a draft)."),
  );
  box.id = "lw-approve-unverified";
  return { box, check, problem };
}

function field(doc: Document, id: string, label: string, control: HTMLElement, problem?: HTMLElement): HTMLElement {
  return el(doc, "div", { class: "field" }, el(doc, "label", { for: id }, label), control, problem ?? null);
}

function approvalForm(ctx: PaneContext, approvable: Approvable): HTMLElement {
  const { doc } = ctx;
  const { ruleset, status } = approvable;
  const file = ruleset.file;
  const memory = status.verification === "unverified" ? memoryConfirmation(doc, ruleset) : null;
  const name = el(doc, "input", { id: "lw-approver", type: "text", autocomplete: "name", "aria-describedby": "lw-approver-problem" });
  const date = el(doc, "input", { id: "lw-approve-date", type: "date", "aria-describedby": "lw-approve-date-problem" });
  date.value = todayText();
  const note = el(doc, "textarea", { id: "lw-approve-note", rows: "2" });
  const nameProblem = el(doc, "div", { class: "field-problem", id: "lw-approver-problem", role: "alert" });
  const dateProblem = el(doc, "div", { class: "field-problem", id: "lw-approve-date-problem", role: "alert" });
  const outcome = el(doc, "p", { id: "lw-approve-outcome", role: "status" });

  const refuse = (slot: HTMLElement, control: HTMLElement, text: string) => {
    slot.textContent = text;
    control.setAttribute("aria-invalid", "true");
    control.focus();
  };
  const approve = async () => {
    for (const slot of [nameProblem, dateProblem, memory?.problem]) if (slot) slot.textContent = "";
    for (const c of [name, date, memory?.check]) c?.removeAttribute("aria-invalid");
    if (memory && !memory.check.checked) return refuse(memory.problem, memory.check, "Confirm that you checked the from-memory parts listed above against the standard; nothing was approved.");
    const badDate = calendarDateProblem(date.value);
    if (badDate) return refuse(dateProblem, date, `${badDate}; nothing was approved.`);
    const noteText = [note.value.trim(), memory ? MEMORY_CHECK_NOTE : ""].filter((t) => t !== "").join(" ");
    const approved = approveRuleset(file, name.value, date.value, noteText === "" ? undefined : noteText);
    if (!approved.ok) {
      for (const p of approved.problems) {
        if (formatPath(p.place.path ?? []) === "approval.date") refuse(dateProblem, date, p.message);
        else refuse(nameProblem, name, p.message);
      }
      return;
    }
    const saved = await ctx.store().save(approved.value);
    if (!saved.ok) {
      outcome.className = "problem";
      outcome.textContent = `Not approved: ${saved.problems.map((p) => describeProblem(p)).join("; ")}`;
      return;
    }
    ctx.notice(withAfterWrite(`Approved ${file.id} by ${approved.value.approval.approvedBy ?? ""} on ${approved.value.approval.date ?? ""} (fingerprint ${status.shortFingerprint}); stored in ${ctx.storedWhere}.`, saved), "done");
    ctx.selected = file.id;
    ctx.show("approve");
  };

  const fields = el(
    doc,
    "div",
    { class: "approve-fields" },
    memory?.box ?? null,
    field(doc, "lw-approver", "Approved by (name)", name, nameProblem),
    field(doc, "lw-approve-date", "Date (today unless you say otherwise)", date, dateProblem),
    field(doc, "lw-approve-note", "Note (optional)", note),
    button(doc, `Approve and store in ${ctx.storedWhere}`, () => void approve(), { id: "lw-approve-button", class: "primary" }),
    outcome,
  );
  return el(doc, "section", { "aria-labelledby": "lw-approve-title" }, ...standing(ctx, approvable), fields);
}
