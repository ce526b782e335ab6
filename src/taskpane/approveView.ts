/**
 * Approve: a firm's checker records who approved which exact content and when.
 * The approval carries the fingerprint, so any later edit shows it as void.
 * An UNVERIFIED ruleset needs an extra, explicit confirmation that the parts
 * its provenance marks as from memory were checked against the standard.
 */
import { approveRuleset, describeProblem, formatPath } from "../core/index.js";
import type { LibraryEntry } from "../addin/rulesetLibrary.js";
import { calendarDateProblem } from "./approvalDate.js";
import { button, el, todayText } from "./dom.js";
import type { PaneContext } from "./paneContext.js";
import { approvalBadge, fromMemoryList, sourceLine, unverifiedSuffix, verificationBadge } from "./statusText.js";

/** Recorded in the approval note when an UNVERIFIED ruleset is approved. */
export const MEMORY_CHECK_NOTE = "The approver confirmed checking the parts its provenance marks as from memory against the standard.";

export function approveView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const root = el(doc, "div", { id: "lw-approve" });
  const approvable = ctx.library().entries.filter((e) => e.ruleset && e.status);
  const drafts = ctx.drafts.list().length;
  if (approvable.length === 0) {
    root.append(el(doc, "p", {}, "No ruleset can be approved: none is shipped or stored that loads."));
    return root;
  }
  const entry = approvable.find((e) => e.id === ctx.selected) ?? approvable[0];
  ctx.selected = entry.id;
  const pick = el(doc, "select", { id: "lw-approve-pick" }, ...approvable.map((e) => el(doc, "option", { value: e.id }, `${e.id} (${e.source === "stored" ? `stored in ${ctx.storedWhere}` : "shipped"})${unverifiedSuffix(e.status)}`))) as HTMLSelectElement;
  pick.value = entry.id;
  pick.addEventListener("change", () => {
    ctx.selected = pick.value;
    ctx.show("approve");
    doc.getElementById("lw-approve-pick")?.focus();
  });
  root.append(el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-approve-pick" }, "Ruleset to approve"), pick));
  if (drafts > 0) root.append(el(doc, "p", { class: "hint" }, "Drafts are approved once stored: store a draft first, then approve the stored ruleset."));
  root.append(approvalForm(ctx, entry));
  return root;
}

function approvalForm(ctx: PaneContext, entry: LibraryEntry): HTMLElement {
  const { doc } = ctx;
  const file = entry.ruleset!.file;
  const status = entry.status!;
  const root = el(doc, "section", { "aria-labelledby": "lw-approve-title" });
  root.append(
    el(doc, "h2", { id: "lw-approve-title" }, `${file.id} ${file.version}`),
    el(doc, "p", { class: "entry-title" }, file.title),
    el(doc, "p", { class: "badges", id: "lw-approve-status" }, verificationBadge(doc, status), " ", approvalBadge(doc, file, status)),
    el(doc, "p", {}, sourceLine(entry, ctx.storedWhere)),
    el(doc, "p", {}, "Content fingerprint (what the approval records) ", el(doc, "span", { class: "fingerprint", id: "lw-approve-fingerprint" }, status.fingerprint)),
  );
  if (entry.source === "shipped") {
    root.append(
      el(doc, "p", { class: "hint" }, `Approving a shipped ruleset stores an approved copy of it in ${ctx.storedWhere} under the same id, with the same content and fingerprint; formulas naming "${file.id}" then use that copy.`),
    );
  }
  if (status.approval !== "not-approved") {
    root.append(el(doc, "p", { class: "hint" }, "Approving again replaces the approval recorded now."));
  }

  const fields = el(doc, "div", { class: "approve-fields" });
  let memoryCheck: HTMLInputElement | null = null;
  const memoryProblem = el(doc, "div", { class: "field-problem", id: "lw-approve-memory-problem", role: "alert" });
  if (status.verification === "unverified") {
    memoryCheck = el(doc, "input", { type: "checkbox", id: "lw-approve-memory", "aria-describedby": "lw-approve-memory-problem" }) as HTMLInputElement;
    fields.append(
      el(
        doc,
        "div",
        { class: "alarm-box", id: "lw-approve-unverified" },
        el(doc, "p", {}, el(doc, "strong", {}, "⚠ UNVERIFIED. "), "Its provenance marks these sources as from memory, not checked against the published text:"),
        fromMemoryList(doc, file),
        el(
          doc,
          "label",
          { for: "lw-approve-memory", class: "check" },
          memoryCheck,
          ` I have checked every part listed above against ${file.standard.name} ${file.standard.edition} myself, and the factors agree with the edition this firm has adopted.`,
        ),
        memoryProblem,
        el(doc, "p", { class: "hint" }, "Approval does not change the verification: the ruleset stays UNVERIFIED until its provenance marks those sources as confirmed (edit the provenance in a draft)."),
      ),
    );
  }
  const name = el(doc, "input", { id: "lw-approver", type: "text", autocomplete: "name", "aria-describedby": "lw-approver-problem" }) as HTMLInputElement;
  const date = el(doc, "input", { id: "lw-approve-date", type: "date", "aria-describedby": "lw-approve-date-problem" }) as HTMLInputElement;
  date.value = todayText();
  const note = el(doc, "textarea", { id: "lw-approve-note", rows: "2" }) as HTMLTextAreaElement;
  const nameProblem = el(doc, "div", { class: "field-problem", id: "lw-approver-problem", role: "alert" });
  const dateProblem = el(doc, "div", { class: "field-problem", id: "lw-approve-date-problem", role: "alert" });
  const outcome = el(doc, "p", { id: "lw-approve-outcome", role: "status" });
  fields.append(
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-approver" }, "Approved by (name)"), name, nameProblem),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-approve-date" }, "Date (today unless you say otherwise)"), date, dateProblem),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-approve-note" }, "Note (optional)"), note),
  );

  const approve = async () => {
    for (const slot of [nameProblem, dateProblem, memoryProblem]) slot.textContent = "";
    for (const c of [name, date, memoryCheck]) c?.removeAttribute("aria-invalid");
    if (memoryCheck && !memoryCheck.checked) {
      memoryProblem.textContent = "Confirm that you checked the from-memory parts listed above against the standard; nothing was approved.";
      memoryCheck.setAttribute("aria-invalid", "true");
      memoryCheck.focus();
      return;
    }
    const badDate = calendarDateProblem(date.value);
    if (badDate) {
      dateProblem.textContent = `${badDate}; nothing was approved.`;
      date.setAttribute("aria-invalid", "true");
      date.focus();
      return;
    }
    const noteText = [note.value.trim(), memoryCheck ? MEMORY_CHECK_NOTE : ""].filter((t) => t !== "").join(" ");
    const approved = approveRuleset(file, name.value, date.value, noteText === "" ? undefined : noteText);
    if (!approved.ok) {
      for (const p of approved.problems) {
        const field = formatPath(p.place.path ?? []);
        const [slot, control] = field === "approval.date" ? [dateProblem, date] : [nameProblem, name];
        slot.textContent = p.message;
        control.setAttribute("aria-invalid", "true");
        control.focus();
      }
      return;
    }
    const saved = await ctx.store().save(approved.value);
    if (!saved.ok) {
      outcome.className = "problem";
      outcome.textContent = `Not approved: ${saved.problems.map((p) => describeProblem(p)).join("; ")}`;
      return;
    }
    ctx.notice(`Approved ${file.id} by ${approved.value.approval.approvedBy ?? ""} on ${approved.value.approval.date ?? ""} (fingerprint ${status.shortFingerprint}); stored in ${ctx.storedWhere}.`, "done");
    ctx.selected = file.id;
    ctx.show("approve");
  };
  fields.append(button(doc, `Approve and store in ${ctx.storedWhere}`, () => void approve(), { id: "lw-approve-button", class: "primary" }), outcome);
  root.append(fields);
  return root;
}
