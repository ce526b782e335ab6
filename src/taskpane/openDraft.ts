/**
 * How a draft comes about: a stored ruleset edited in place (same id, its
 * approval record kept so the pane can say when it stops applying), a copy of
 * a shipped or stored one under a new id the user chooses (no approval: the
 * copy is another content), an import, or a new ruleset from a small template.
 */
import { RULESET_FORMAT, RULESET_ID_PATTERN, shortFingerprint, withoutApproval, type RulesetFile } from "../core/index.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { isObject, topField } from "./dataPath.js";
import { EMPTY_APPROVAL, type ApprovalBlock } from "./draftCheck.js";
import { newDraftKey, type Draft, type DraftBase } from "./draftStore.js";
import { todayText } from "./dom.js";


export function rulesetText(file: unknown): string {
  return `${JSON.stringify(file, null, 2)}\n`;
}

function draft(text: string, base: DraftBase, now: Date): Draft {
  const time = now.toISOString();
  return { key: newDraftKey(), text, base, opened: time, changed: time };
}

export function approvalOf(file: RulesetFile): ApprovalBlock {
  const a = file.approval;
  return a.note === undefined ? { approvedBy: a.approvedBy, date: a.date, fingerprint: a.fingerprint } : { ...a, note: a.note };
}

/** A stored ruleset edited as a draft: same id, same approval record. */
export function draftOfStored(entry: LibraryEntry, now = new Date()): Draft {
  const file = entry.ruleset!.file;
  return draft(rulesetText(file), { kind: "stored", id: entry.id, fingerprint: entry.status!.fingerprint, approval: approvalOf(file) }, now);
}

/**
 * A stored entry that no longer loads, as a draft to mend: its stored text as it is, under its own id.
 * The approval it carries, if any, stays (it names the content that was approved).
 */
export function draftOfUnloadable(id: string, stored: unknown, now = new Date()): Draft {
  const approval = isObject(stored) ? stored.approval : undefined;
  return draft(rulesetText(stored), { kind: "stored", id, fingerprint: null, approval: isObject(approval) ? (approval as ApprovalBlock) : EMPTY_APPROVAL }, now);
}

/** The approval block a ruleset's text carries, as it is, or none. */
export function approvalIn(text: string): ApprovalBlock {
  const a = topField(text, "approval");
  return isObject(a) ? (a as ApprovalBlock) : EMPTY_APPROVAL;
}

/** Why an id cannot name a new copy, or null when it can. */
export function newIdProblem(id: string, takenIds: ReadonlySet<string>): string | null {
  if (id === "") return "give the copy an id of its own";
  if (!RULESET_ID_PATTERN.test(id)) return `"${id}" is not a ruleset id: lower-case letters, digits, '.', '_' or '-', starting with a letter or digit`;
  if (takenIds.has(id)) return `"${id}" already names a shipped or stored ruleset or an open draft; choose another id`;
  return null;
}

/** A copy of a shipped or stored ruleset under a new id, without approval, with a note saying where it came from. */
export function draftOfCopy(entry: LibraryEntry, id: string, now = new Date()): Draft {
  const original = entry.ruleset!.file;
  const status = entry.status!;
  const from = entry.source === "shipped" ? "shipped with Loadwright" : "stored";
  const note = `Copy of ${original.id} ${original.version} (${from}, fingerprint ${shortFingerprint(status.fingerprint)}) made on ${todayText(now)}.`;
  const file: RulesetFile = { ...withoutApproval(original), id, notes: [...(original.notes ?? []), note] };
  return draft(rulesetText(file), { kind: entry.source, id: entry.id, fingerprint: status.fingerprint, approval: EMPTY_APPROVAL }, now);
}

/** Imported text as a draft, exactly as given (it may not load yet: the editor shows where). */
export function draftOfImport(text: string, now = new Date()): Draft {
  // Text that is not JSON yet carries no approval: the editor says where it breaks.
  const approval = approvalIn(text);
  return draft(text.endsWith("\n") ? text : `${text}\n`, { kind: "imported", id: null, fingerprint: null, approval }, now);
}

/** A new ruleset: one symbol, one combination, and a provenance entry the user must fill in. */
export function draftOfNew(id: string, now = new Date()): Draft {
  const file: RulesetFile = {
    format: RULESET_FORMAT,
    id,
    title: "New ruleset (give its title)",
    standard: { name: "(the standard)", edition: "(its edition)" },
    version: "0.1.0",
    symbols: { D: { description: "dead load", permanence: "permanent" } },
    combinations: [{ id: "1", expression: "1.0D", clause: "(clause of the standard)" }],
    notes: [],
    provenance: [{ source: "(the published source, edition and clause)", status: "from-memory", covers: "all combinations, until checked" }],
    approval: { approvedBy: null, date: null, fingerprint: null },
  };
  return draft(rulesetText(file), { kind: "new", id: null, fingerprint: null, approval: EMPTY_APPROVAL }, now);
}
