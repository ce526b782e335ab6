/**
 * What a user must know before trusting a ruleset's numbers: whether its
 * factors were checked against the published source, and whether a firm has
 * approved this exact content.
 */
import { fromMemoryTexts } from "../text/coverage.js";
import { statusText } from "../text/statusText.js";
import { fingerprintOf, shortFingerprint } from "./fingerprint.js";
import type { Ruleset } from "./model.js";

export type Verification = "checked" | "unverified" | "user";
export type Approval = "approved" | "changed-since-approval" | "not-approved";

export interface RulesetStatus {
  verification: Verification;
  approval: Approval;
  fingerprint: string;
  shortFingerprint: string;
  /** Verification and approval in one line (core/text/statusText.ts): a badge's title, a CLI status line. */
  summary: string;
  /** What each source marked "from-memory" covers, in words (core/text/coverage.ts). */
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

export function rulesetStatus(ruleset: Ruleset): RulesetStatus {
  const fingerprint = fingerprintOf(ruleset.file);
  const fromMemory = fromMemoryTexts(ruleset.file);
  const verification: Verification = ruleset.origin === "cells" ? "user" : fromMemory.length > 0 ? "unverified" : "checked";
  const approvedPrint = ruleset.file.approval.fingerprint;
  let approval: Approval = "not-approved";
  if (approvedPrint) approval = approvedPrint === fingerprint ? "approved" : "changed-since-approval";
  return {
    verification,
    approval,
    fingerprint,
    shortFingerprint: shortFingerprint(fingerprint),
    summary: statusText({ verification, approval }, ruleset.file.approval).summary,
    fromMemory,
    combinations: combinationCoverage(ruleset),
  };
}
