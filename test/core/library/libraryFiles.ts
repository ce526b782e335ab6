/**
 * Hand-made firm libraries for the tests: shipped rulesets, approved with
 * approveRuleset by invented approvers on invented days (nothing here is a
 * real firm's approval), and "corrected versions" made by editing a copy.
 */
import { approveRuleset, findShippedRuleset, FIRM_LIBRARY_FORMAT, type RulesetFile } from "../../../src/core/index.js";

export function shipped(id: string): RulesetFile {
  const file = findShippedRuleset(id)?.ruleset.file;
  if (!file) throw new Error(`no shipped ruleset ${id}`);
  return structuredClone(file) as RulesetFile;
}

export function approved(file: RulesetFile, approvedBy: string, date: string): RulesetFile {
  const result = approveRuleset(file, approvedBy, date);
  if (!result.ok) throw new Error(JSON.stringify(result.problems));
  return result.value;
}

/** Another content of the same id: a later version with one more note (the fingerprint covers notes). */
export function revised(file: RulesetFile, version: string): RulesetFile {
  return { ...structuredClone(file), version, notes: [...(file.notes ?? []), `Revised as ${version} (invented for the tests).`], approval: { approvedBy: null, date: null, fingerprint: null } };
}

export interface LibraryFileShape {
  format: string;
  title: string;
  owner: string;
  date: string;
  notes?: string[];
  rulesets: unknown[];
}

export function libraryOf(rulesets: unknown[], date = "2026-03-02"): LibraryFileShape {
  return { format: FIRM_LIBRARY_FORMAT, title: "Invented Engineers: approved load combinations", owner: "Invented Engineers, technical director", date, rulesets };
}
