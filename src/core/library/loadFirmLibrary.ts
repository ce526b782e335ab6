/**
 * Reads a firm library file (JSON text or an already-parsed object) and checks
 * the whole of it before anything in it is used: JSON syntax and fields written
 * twice, the library's own fields, then every ruleset with the ruleset loader
 * (its problems keep their paths, under `rulesets[i]`), then what makes a
 * library trustworthy: every ruleset approved, each approval given to exactly
 * this content, no content listed twice, and one current version per id.
 */
import { fail, ok, problem, withinPath, type Problem, type Result } from "../problems.js";
import { fingerprintOf, shortFingerprint } from "../ruleset/fingerprint.js";
import { parseJsonText } from "../ruleset/jsonLimits.js";
import { loadRuleset } from "../ruleset/loadRuleset.js";
import type { Ruleset } from "../ruleset/model.js";
import { schemaProblems } from "../ruleset/schemaProblems.js";
import { calendarDay, firmLibrarySchema, MAX_FIRM_LIBRARY_CHARACTERS, type FirmLibraryFile } from "./firmLibrarySchema.js";

export interface FirmLibraryEntry {
  /** Its place in the file's `rulesets` list (0-based), for messages. */
  index: number;
  ruleset: Ruleset;
  fingerprint: string;
  approvedBy: string;
  /** The approval's day, YYYY-MM-DD. */
  date: string;
  note: string | null;
  /** The id's current version: the one approved last. Earlier ones are kept to recognise superseded copies. */
  current: boolean;
}

export interface FirmLibrary {
  title: string;
  owner: string;
  date: string;
  notes: string[];
  /** In the file's order. */
  entries: FirmLibraryEntry[];
}

export function loadFirmLibrary(input: unknown): Result<FirmLibrary> {
  const size = typeof input === "string" ? input.length : (JSON.stringify(input) ?? "").length;
  if (size > MAX_FIRM_LIBRARY_CHARACTERS) {
    return fail(problem("ruleset-json", `the library holds ${size.toLocaleString("en-US")} characters, more than the ${MAX_FIRM_LIBRARY_CHARACTERS.toLocaleString("en-US")} a library may hold; is this the library file?`));
  }
  let data: unknown = input;
  if (typeof input === "string") {
    const read = parseJsonText(input, { what: "library" });
    if (!read.ok) return read;
    data = read.value;
  }
  const parsed = firmLibrarySchema.safeParse(data);
  if (!parsed.success) return fail(...schemaProblems(parsed.error.issues, firmLibrarySchema, data));
  const file = parsed.data;

  const problems: Problem[] = [];
  const entries: FirmLibraryEntry[] = [];
  file.rulesets.forEach((raw, index) => {
    const loaded = loadRuleset(raw);
    if (!loaded.ok) {
      problems.push(...withinPath(loaded.problems, ["rulesets", index]));
      return;
    }
    const approved = approvalOf(loaded.value, index, file);
    if (!approved.ok) problems.push(...approved.problems);
    else entries.push(approved.value);
  });
  problems.push(...repeatedContent(entries), ...sameDayVersions(entries));
  if (problems.length > 0) return fail(...problems);

  markCurrent(entries);
  return ok({ title: file.title, owner: file.owner, date: file.date, notes: file.notes ?? [], entries });
}

/** The entry for one ruleset, if its approval is complete, is for this content, and is not dated after the library. */
function approvalOf(ruleset: Ruleset, index: number, library: FirmLibraryFile): Result<FirmLibraryEntry> {
  const { id } = ruleset.file;
  const { approvedBy, date, fingerprint: approvedPrint, note } = ruleset.file.approval;
  const at = (field: string) => ({ path: ["rulesets", index, "approval", field] });
  const fingerprint = fingerprintOf(ruleset.file);
  if (approvedPrint === null) {
    return fail(problem("ruleset-field", `ruleset "${id}" is not approved; a library holds only approved rulesets (approve it first: the approval records its fingerprint)`, at("fingerprint")));
  }
  const problems: Problem[] = [];
  if (approvedBy === null || approvedBy.trim() === "") problems.push(problem("ruleset-field", `the approval of "${id}" names no one: give the name of the person who approved it`, at("approvedBy")));
  if (date === null || !calendarDay.safeParse(date).success) {
    problems.push(problem("ruleset-field", `the approval of "${id}" must carry its date written YYYY-MM-DD (a day of the calendar), not ${date === null ? "null" : JSON.stringify(date)}`, at("date")));
  } else if (date > library.date) {
    problems.push(problem("ruleset-field", `"${id}" is approved on ${date}, after the library's own date ${library.date}; a library cannot list an approval given after it was published`, at("date")));
  }
  if (approvedPrint !== fingerprint) {
    problems.push(
      problem(
        "ruleset-field",
        `the approval of "${id}" was given to other content (fingerprint ${shortFingerprint(approvedPrint)}…); this content's fingerprint is ${shortFingerprint(fingerprint)}…, so it changed after approval: approve this content, or put back what was approved`,
        at("fingerprint"),
      ),
    );
  }
  if (problems.length > 0) return fail(...problems);
  return ok({ index, ruleset, fingerprint, approvedBy: (approvedBy as string).trim(), date: date as string, note: note ?? null, current: false });
}

/** The same content (id and fingerprint) listed twice: one of them is a copying mistake. */
function repeatedContent(entries: FirmLibraryEntry[]): Problem[] {
  const seen = new Map<string, FirmLibraryEntry>();
  const out: Problem[] = [];
  for (const e of entries) {
    const key = `${e.ruleset.file.id}\u0000${e.fingerprint}`;
    const first = seen.get(key);
    if (first) {
      out.push(problem("ruleset-duplicate", `the same content of "${e.ruleset.file.id}" (fingerprint ${shortFingerprint(e.fingerprint)}…) is listed twice (also at rulesets[${first.index}]); list each approved content once`, { path: ["rulesets", e.index] }));
    } else {
      seen.set(key, e);
    }
  }
  return out;
}

/**
 * Two versions of one id approved on the same day: which is current would
 * depend on the order of the file, so the library must say it by its dates.
 */
function sameDayVersions(entries: FirmLibraryEntry[]): Problem[] {
  const seen = new Map<string, FirmLibraryEntry>();
  const out: Problem[] = [];
  for (const e of entries) {
    const key = `${e.ruleset.file.id}\u0000${e.date}`;
    const first = seen.get(key);
    if (first && first.fingerprint !== e.fingerprint) {
      out.push(
        problem(
          "ruleset-duplicate",
          `two versions of "${e.ruleset.file.id}" are approved on the same day ${e.date} (also at rulesets[${first.index}]), so the library cannot say which one is current; remove the superseded version, or approve the current one on a later day`,
          { path: ["rulesets", e.index, "approval", "date"] },
        ),
      );
    } else if (!first) {
      seen.set(key, e);
    }
  }
  return out;
}

function markCurrent(entries: FirmLibraryEntry[]): void {
  const latest = new Map<string, FirmLibraryEntry>();
  for (const e of entries) {
    const best = latest.get(e.ruleset.file.id);
    if (!best || e.date > best.date) latest.set(e.ruleset.file.id, e);
  }
  for (const e of latest.values()) e.current = true;
}
