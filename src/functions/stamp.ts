/**
 * The ruleset stamp: the first row of every formula's result, so that no table
 * of numbers is ever shown without which ruleset produced it and whether that
 * ruleset was checked. The status word comes first (UNVERIFIED, NOT CHECKED,
 * Checked), because a narrow column shows only the start of a cell.
 */
import type { RulesetStatus } from "../core/index.js";
import type { ResolvedRuleset } from "./formula.js";

const VERIFICATION_WORD: Record<RulesetStatus["verification"], string> = {
  unverified: "UNVERIFIED",
  user: "NOT CHECKED",
  checked: "Checked",
};

const ADVICE: Record<RulesetStatus["verification"], string> = {
  unverified: "some factors are from memory; verify against the standard before use",
  user: "not checked by Loadwright",
  checked: "factors checked against the sources in its provenance",
};

const APPROVAL_WORD: Record<RulesetStatus["approval"], string> = {
  approved: "approved",
  "changed-since-approval": "APPROVAL VOID (changed since approved)",
  "not-approved": "not approved",
};

export function verificationWord(status: RulesetStatus): string {
  return VERIFICATION_WORD[status.verification];
}

export function approvalWord(status: RulesetStatus): string {
  return APPROVAL_WORD[status.approval];
}

/** "approved by A. Name on 2026-01-31", "APPROVAL VOID (changed since approved by …)", "not approved". */
export function approvalText(r: ResolvedRuleset): string {
  const { approvedBy, date } = r.ruleset.file.approval;
  const by = `by ${approvedBy ?? "(no name)"} on ${date ?? "(no date)"}`;
  switch (r.status.approval) {
    case "approved":
      return `approved ${by}`;
    case "changed-since-approval":
      return `APPROVAL VOID (changed since approved ${by})`;
    case "not-approved":
      return "not approved";
  }
}

/** "stored in this workbook", "shipped with Loadwright", "typed in cells". */
export function sourceText(r: ResolvedRuleset): string {
  switch (r.source) {
    case "shipped":
      return "shipped with Loadwright";
    case "cells":
      return "typed in cells";
    case "stored":
      return r.shippedFingerprint && r.shippedFingerprint !== r.status.fingerprint
        ? "stored in this workbook (differs from the shipped ruleset of the same id)"
        : "stored in this workbook";
  }
}

/** The ruleset's identity: id, version and standard, and where it comes from. */
export function identityText(r: ResolvedRuleset): string {
  const f = r.ruleset.file;
  if (r.source === "cells") return "ruleset typed in cells";
  return `${f.id} ${f.version} (${f.standard.name} ${f.standard.edition}), ${sourceText(r)}`;
}

export function stampLine(r: ResolvedRuleset): string {
  const s = r.status;
  return [verificationWord(s), approvalText(r), identityText(r), `fingerprint ${s.shortFingerprint}`, ADVICE[s.verification]].join(" · ");
}
