/**
 * The words the pane shows for a ruleset's standing: verification first
 * (UNVERIFIED in capitals, never only a colour), then the approval with who
 * and when, then where the ruleset comes from. The same words as the formula
 * stamps (src/functions/stamp.ts), written out in full where the pane has room.
 */
import type { RulesetFile, RulesetStatus } from "../core/index.js";
import { verificationWord } from "../functions/stamp.js";
import type { LibraryEntry } from "../addin/rulesetLibrary.js";
import { el } from "./dom.js";

/** "approved by A. Name on 2026-01-31", "APPROVAL VOID: CHANGED since approval by …", "not approved". */
export function approvalLine(file: RulesetFile, status: RulesetStatus): string {
  const { approvedBy, date } = file.approval;
  const by = `by ${approvedBy ?? "(no name)"} on ${date ?? "(no date)"}`;
  switch (status.approval) {
    case "approved":
      return `approved ${by}`;
    case "changed-since-approval":
      return `APPROVAL VOID: CHANGED since approval ${by}`;
    case "not-approved":
      return "not approved";
  }
}

/** Where a library entry comes from, in words; a stored copy of a shipped id says whether it differs. */
export function sourceLine(entry: LibraryEntry, storedWhere: string): string {
  if (entry.source === "shipped") return "shipped with Loadwright";
  if (entry.shippedFingerprint === null) return `stored in ${storedWhere}`;
  if (entry.status && entry.status.fingerprint === entry.shippedFingerprint) return `stored in ${storedWhere}: a copy of the shipped ruleset, same content`;
  return `stored in ${storedWhere}: DIFFERS from the shipped ruleset of the same id`;
}

/** The verification badge: a word a reader cannot miss, with the status summary as its title. */
export function verificationBadge(doc: Document, status: RulesetStatus | null): HTMLElement {
  if (!status) return el(doc, "span", { class: "badge badge-alarm", "data-verification": "invalid" }, "DOES NOT LOAD");
  const word = verificationWord(status);
  const alarm = status.verification !== "checked";
  return el(
    doc,
    "span",
    { class: alarm ? "badge badge-alarm" : "badge badge-ok", "data-verification": status.verification, title: status.summary },
    alarm ? `⚠ ${word}` : word,
  );
}

export function approvalBadge(doc: Document, file: RulesetFile, status: RulesetStatus): HTMLElement {
  const kind = status.approval;
  return el(doc, "span", { class: kind === "changed-since-approval" ? "badge badge-alarm" : kind === "approved" ? "badge badge-ok" : "badge", "data-approval": kind }, approvalLine(file, status));
}

/** For a ruleset named in a list (a select's option): " — UNVERIFIED" where it is, so no choice hides it. */
export function unverifiedSuffix(status: RulesetStatus | null): string {
  return status?.verification === "unverified" ? " — UNVERIFIED" : "";
}

/** What an UNVERIFIED ruleset's provenance marks as from memory, one line per source. */
export function fromMemoryList(doc: Document, file: RulesetFile): HTMLElement {
  const items = file.provenance
    .filter((p) => p.status === "from-memory")
    .map((p) => el(doc, "li", {}, el(doc, "strong", {}, p.source), ` — covers: ${p.covers}`, p.note ? ` (${p.note})` : ""));
  return el(doc, "ul", { class: "from-memory" }, ...items);
}
