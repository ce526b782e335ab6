/**
 * A ruleset's standing as the pane shows it, in the catalogue's words
 * (core/text): verification first (UNVERIFIED in capitals, never only a
 * colour), then the approval with who and when, then where the ruleset comes
 * from, how many combinations a source confirms and what is from memory.
 */
import {
  coverageText,
  FROM_MEMORY_LEAD,
  fromMemoryText,
  sourceText,
  statusText,
  type RulesetFile,
  type RulesetStatus,
} from "../core/index.js";
import { entryOrigin, type LibraryEntry } from "../workbook/rulesetLibrary.js";
import { el } from "./dom.js";

/** What the verification badge says where a stored ruleset no longer loads. */
export const DOES_NOT_LOAD = "DOES NOT LOAD";

/** The approval as the pane's badge words it: "approved by A. Name on 2026-01-31", "APPROVAL VOID: CHANGED since approval by …". */
export function approvalLine(file: RulesetFile, status: RulesetStatus): string {
  return statusText(status, file.approval).approval.badge;
}

/** Where a library entry comes from, in words; a stored copy of a shipped id says whether it differs. */
export function sourceLine(entry: LibraryEntry, storedWhere: string): string {
  return sourceText(entryOrigin(entry, storedWhere), "line");
}

/** The verification badge's words: "⚠ UNVERIFIED", "Checked", or DOES NOT LOAD for a stored entry that no longer loads. */
export function verificationBadgeText(status: RulesetStatus | null): string {
  return status ? statusText(status, { approvedBy: null, date: null }).badge : DOES_NOT_LOAD;
}

/** The verification badge: a word a reader cannot miss, with the status summary as its title. */
export function verificationBadge(doc: Document, status: RulesetStatus | null): HTMLElement {
  if (!status) return el(doc, "span", { class: "badge badge-alarm", "data-verification": "invalid" }, DOES_NOT_LOAD);
  const alarm = status.verification !== "checked";
  return el(
    doc,
    "span",
    { class: alarm ? "badge badge-alarm" : "badge badge-ok", "data-verification": status.verification, title: status.summary },
    verificationBadgeText(status),
  );
}

export function approvalBadge(doc: Document, file: RulesetFile, status: RulesetStatus): HTMLElement {
  const kind = status.approval;
  return el(doc, "span", { class: kind === "changed-since-approval" ? "badge badge-alarm" : kind === "approved" ? "badge badge-ok" : "badge", "data-approval": kind }, approvalLine(file, status));
}

/** For a ruleset named in a list (a select's option): " — UNVERIFIED" where it is, so no choice hides it. */
export function unverifiedSuffix(status: RulesetStatus | null): string {
  return status ? statusText(status, { approvedBy: null, date: null }).listMark : "";
}

/** How many combinations a source confirms: "5 of 7 combinations confirmed; not confirmed: 3, 4". */
export function coverageLine(doc: Document, status: RulesetStatus, id: string): HTMLElement {
  return el(doc, "p", { class: "coverage", id }, coverageText(status.combinations));
}

/** What an UNVERIFIED ruleset's provenance marks as from memory, one line per source, under the catalogue's lead. */
export function fromMemoryBox(doc: Document, file: RulesetFile, ...more: HTMLElement[]): HTMLElement {
  const items = file.provenance.filter((p) => p.status === "from-memory").map((p) => el(doc, "li", {}, fromMemoryText(p), p.note ? ` — ${p.note}` : ""));
  return el(doc, "div", { class: "alarm-box from-memory-box" }, el(doc, "p", {}, FROM_MEMORY_LEAD), el(doc, "ul", { class: "from-memory" }, ...items), ...more);
}
