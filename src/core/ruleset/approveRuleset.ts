/**
 * A firm's approval of one exact ruleset content: who and when, with the
 * fingerprint of what they approved. Any later edit changes the fingerprint,
 * and the status then shows the approval as no longer applying.
 */
import { fail, ok, problem, type Result } from "../problems.js";
import { fingerprintOf } from "./fingerprint.js";
import type { RulesetFile } from "./schema.js";

export function approveRuleset(file: RulesetFile, approvedBy: string, date: string, note?: string): Result<RulesetFile> {
  const who = approvedBy.trim();
  if (who === "") return fail(problem("ruleset-field", "give the name of the person approving", { path: ["approval", "approvedBy"] }));
  // A day of the calendar: Date rolls 2026-02-30 over into March, so the date must read back unchanged.
  const parsed = new Date(`${date}T00:00:00Z`);
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date) || Number.isNaN(parsed.getTime()) || parsed.toISOString().slice(0, 10) !== date) {
    return fail(problem("ruleset-field", `"${date}" is not a date written YYYY-MM-DD`, { path: ["approval", "date"] }));
  }
  const approval: RulesetFile["approval"] = { approvedBy: who, date, fingerprint: fingerprintOf(file) };
  if (note !== undefined && note.trim() !== "") approval.note = note.trim();
  return ok({ ...file, approval });
}

/** The same content with the approval cleared (for a copy that is being edited). */
export function withoutApproval(file: RulesetFile): RulesetFile {
  return { ...file, approval: { approvedBy: null, date: null, fingerprint: null } };
}
