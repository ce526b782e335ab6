/**
 * Before a draft is stored: what storing it would replace or shadow. Each is a
 * warning the user must confirm, so that no stored ruleset is replaced by
 * accident — another stored ruleset with the draft's id, a stored copy that
 * changed since the draft was opened, or a shipped ruleset a stored one would
 * stand in for.
 */
import { shortFingerprint, shippedRulesets, type Ruleset } from "../core/index.js";
import type { Library } from "../workbook/rulesetLibrary.js";
import type { DraftBase } from "./draftStore.js";

export interface StoreConflicts {
  /** What storing would replace or shadow: the user confirms before the draft is stored. */
  confirm: string[];
  /** What the user should know, needing no confirmation. */
  info: string[];
}

export function storeConflicts(base: DraftBase, ruleset: Ruleset, lib: Library, storedWhere: string): StoreConflicts {
  const id = ruleset.file.id;
  const out: string[] = [];
  const info: string[] = [];
  const stored = lib.entries.find((e) => e.source === "stored" && e.id === id);
  const editingThis = base.kind === "stored" && base.id === id;
  if (stored && !editingThis) {
    const approval = stored.ruleset?.file.approval.approvedBy ? `, approved by ${stored.ruleset.file.approval.approvedBy} on ${stored.ruleset.file.approval.date ?? "(no date)"}` : "";
    out.push(`A different ruleset "${id}" is stored in ${storedWhere} (fingerprint ${stored.status?.shortFingerprint ?? "—"}${approval}); storing this draft replaces it.`);
  }
  if (stored && editingThis && stored.status && base.fingerprint && stored.status.fingerprint !== base.fingerprint) {
    out.push(
      `The stored "${id}" changed after this draft was opened (fingerprint ${shortFingerprint(base.fingerprint)} then, ${stored.status.shortFingerprint} now); storing this draft replaces the newer stored copy.`,
    );
  }
  if (editingThis && !stored) info.push(`"${id}" is no longer stored in ${storedWhere}; storing this draft stores it again.`);
  if (!stored && shippedRulesets().some((s) => s.id === id)) {
    out.push(`"${id}" is the id of a shipped ruleset; once stored, formulas naming "${id}" in this workbook use this copy instead of the shipped one.`);
  }
  if (base.kind === "stored" && base.id !== null && base.id !== id) {
    info.push(`This draft was opened from "${base.id}" and now has the id "${id}": it is stored as a new ruleset, and "${base.id}" stays stored as it is.`);
  }
  return { confirm: out, info };
}
