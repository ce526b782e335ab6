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
  };
}
