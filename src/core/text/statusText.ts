/**
 * What every surface says about a ruleset's standing: whether its factors were
 * checked against the sources its provenance names (verification) and whether
 * a firm approved this exact content (approval). One function gives every form
 * a surface needs — a word a narrow cell shows first, a badge, a full sentence —
 * so that a formula's stamp, the task pane and the command line never word the
 * same state differently.
 */
import type { Approval, Verification } from "../ruleset/status.js";

/** Who approved, and when, as the approval block records it. */
export interface ApprovalRecord {
  approvedBy: string | null;
  date: string | null;
}

interface VerificationWords {
  /** First in a stamp, where a narrow column shows only the start of a cell. */
  word: string;
  /** What the state means, to close a stamp. */
  advice: string;
  /** The state in full, for a field of its own. */
  sentence: string;
}

export const VERIFICATION_WORDS: Readonly<Record<Verification, VerificationWords>> = {
  checked: {
    word: "Checked",
    advice: "factors checked against the sources named in its provenance",
    sentence: "factors checked against the sources named in its provenance",
  },
  unverified: {
    word: "UNVERIFIED",
    advice: "some factors are from memory; verify against the standard before use",
    sentence: "UNVERIFIED: some factors are from memory; verify against the standard before use",
  },
  user: {
    word: "NOT CHECKED",
    advice: "not checked by Loadwright",
    sentence: "typed in the workbook: not checked by Loadwright",
  },
};

/** "by A. Name on 2026-01-31", with what the record lacks said as missing. */
export function approvedByText(record: ApprovalRecord): string {
  return `by ${record.approvedBy ?? "(no name)"} on ${record.date ?? "(no date)"}`;
}

/**
 * The approval as each surface places it: in a formula's cell, in the pane's
 * badge and within the status sentence. A void approval reads the same in all
 * three, so an engineer who meets it in a cell finds the same words in the
 * pane and on the command line (docs/design.md, "One vocabulary").
 */
export interface ApprovalWords {
  /** In a formula's stamp and LW.RULESET. */
  cell: string;
  /** The pane's badge. */
  badge: string;
  /** Within the status sentence. */
  sentence: string;
}

export function approvalWords(approval: Approval, record: ApprovalRecord): ApprovalWords {
  const by = approvedByText(record);
  switch (approval) {
    case "approved": {
      const text = `approved ${by}`;
      return { cell: text, badge: text, sentence: text };
    }
    case "changed-since-approval": {
      const text = `APPROVAL VOID: CHANGED since approval ${by}`;
      return { cell: text, badge: text, sentence: text };
    }
    case "not-approved":
      return { cell: "not approved", badge: "not approved", sentence: "not approved" };
  }
}

export interface StatusText extends VerificationWords {
  /** The verification as a badge: a warning sign before anything not checked. */
  badge: string;
  /** Whether the verification must stand out (UNVERIFIED, NOT CHECKED). */
  alarm: boolean;
  /** After a ruleset named in a list of choices: " — UNVERIFIED" where it is, so no choice hides it. */
  listMark: string;
  /** A line that cannot be missed above a command line's output, or null for a checked ruleset. */
  banner: string | null;
  approval: ApprovalWords;
  /** Verification and approval in one line, for a badge's title, a status line or a JSON field. */
  summary: string;
}

/** Every form of a ruleset's standing: the one source of what each surface shows for each state. */
export function statusText(state: { verification: Verification; approval: Approval }, record: ApprovalRecord): StatusText {
  const words = VERIFICATION_WORDS[state.verification];
  const approval = approvalWords(state.approval, record);
  const alarm = state.verification !== "checked";
  return {
    ...words,
    badge: alarm ? `⚠ ${words.word}` : words.word,
    alarm,
    listMark: state.verification === "unverified" ? ` — ${words.word}` : "",
    banner: state.verification === "unverified" ? `*** ${words.word} RULESET: ${words.advice} ***` : null,
    approval,
    summary: `${words.sentence}; ${approval.sentence}`,
  };
}
