/**
 * What a user must know before trusting a ruleset's numbers: whether its
 * factors were checked against the published source, and whether a firm has
 * approved this exact content.
 */
import { fingerprintOf, shortFingerprint } from "./fingerprint.js";
import type { Ruleset } from "./model.js";

export type Verification = "checked" | "unverified" | "user";
export type Approval = "approved" | "changed-since-approval" | "not-approved";

export interface RulesetStatus {
  verification: Verification;
  approval: Approval;
  fingerprint: string;
  shortFingerprint: string;
  /** One line for a calculation stamp, a task pane badge or a CLI header. */
  summary: string;
  /** The sources marked "from-memory", for the warning text. */
  fromMemory: string[];
  /** How many combinations a confirmed source vouches for and none leaves open from memory. */
  combinations: CombinationCoverage;
}

export interface CombinationCoverage {
  total: number;
  confirmed: number;
  /** Ids of the combinations not confirmed, in ruleset order. */
  unconfirmed: string[];
}

/**
 * A combination is confirmed when a confirmed provenance entry lists it and no
 * from-memory entry does; a ruleset typed in cells confirms none.
 */
export function combinationCoverage(ruleset: Ruleset): CombinationCoverage {
  const ids = ruleset.combinations.map((c) => c.id);
  if (ruleset.origin === "cells") return { total: ids.length, confirmed: 0, unconfirmed: ids };
  const confirmed = new Set<string>();
  const open = new Set<string>();
  for (const entry of ruleset.file.provenance) {
    for (const id of entry.combinations ?? []) (entry.status === "confirmed" ? confirmed : open).add(id);
  }
  const unconfirmed = ids.filter((id) => !confirmed.has(id) || open.has(id));
  return { total: ids.length, confirmed: ids.length - unconfirmed.length, unconfirmed };
}

export const VERIFICATION_TEXT: Record<Verification, string> = {
  checked: "factors checked against the sources named in its provenance",
  unverified: "UNVERIFIED: some factors are from memory; verify against the standard before use",
  user: "typed in the workbook: not checked by Loadwright",
};

export function rulesetStatus(ruleset: Ruleset): RulesetStatus {
  const fingerprint = fingerprintOf(ruleset.file);
  const fromMemory = ruleset.file.provenance.filter((p) => p.status === "from-memory").map((p) => `${p.source} (${p.covers})`);
  const verification: Verification = ruleset.origin === "cells" ? "user" : fromMemory.length > 0 ? "unverified" : "checked";
  const { approvedBy, date, fingerprint: approvedPrint } = ruleset.file.approval;
  let approval: Approval = "not-approved";
  if (approvedPrint) approval = approvedPrint === fingerprint ? "approved" : "changed-since-approval";
  const approvalText =
    approval === "approved"
      ? `approved by ${approvedBy ?? "(no name)"} on ${date ?? "(no date)"}`
      : approval === "changed-since-approval"
        ? `CHANGED since its approval by ${approvedBy ?? "(no name)"} on ${date ?? "(no date)"}: the approval no longer applies`
        : "not approved";
  return {
    verification,
    approval,
    fingerprint,
    shortFingerprint: shortFingerprint(fingerprint),
    summary: `${VERIFICATION_TEXT[verification]}; ${approvalText}`,
    fromMemory,
    combinations: combinationCoverage(ruleset),
  };
}
