/**
 * The ruleset stamp: one line that heads every table of numbers (a formula's
 * first row, the pane's combination list), so that none is shown without the
 * ruleset that produced it and whether it was checked. The verification word
 * comes first, because a narrow column shows only the start of a cell.
 */
import type { RulesetFile } from "../ruleset/schema.js";
import type { RulesetStatus } from "../ruleset/status.js";
import { sourceText, type RulesetOrigin } from "./sourceText.js";
import { statusText } from "./statusText.js";

/** The ruleset's identity: id, version and standard, and where it comes from. */
export function identityText(file: RulesetFile, origin: RulesetOrigin): string {
  if (origin.kind === "cells") return "ruleset typed in cells";
  return `${file.id} ${file.version} (${file.standard.name} ${file.standard.edition}), ${sourceText(origin, "cell")}`;
}

/** "UNVERIFIED · not approved · asce7-16-strength 1.0.0 (ASCE/SEI 7 2016), shipped with Loadwright · fingerprint … · …". */
export function stampLine(file: RulesetFile, status: RulesetStatus, origin: RulesetOrigin): string {
  const text = statusText(status, file.approval);
  return [text.word, text.approval.cell, identityText(file, origin), `fingerprint ${status.shortFingerprint}`, text.advice].join(" · ");
}
