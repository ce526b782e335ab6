/**
 * The ruleset stamp heading every formula's result, in the catalogue's words
 * (core/text/stamp.ts): a formula names rulesets stored in its workbook, shipped
 * with Loadwright, or typed in cells.
 */
import { shippedTwin, stampLine, type RulesetOrigin } from "../core/index.js";
import type { ResolvedRuleset } from "./formula.js";

/** Where a formula's stored rulesets live, as its messages and stamps say it. */
export const STORED_WHERE = "this workbook";

export function originOf(r: ResolvedRuleset): RulesetOrigin {
  switch (r.source) {
    case "shipped":
      return { kind: "shipped" };
    case "cells":
      return { kind: "cells" };
    case "stored":
      return { kind: "stored", where: STORED_WHERE, shipped: shippedTwin(r.shippedFingerprint, r.status.fingerprint) };
  }
}

export function stampOf(r: ResolvedRuleset): string {
  return stampLine(r.ruleset.file, r.status, originOf(r));
}
