/**
 * `loadwright audit BOOK.xlsx [--library FILE]`: which rulesets a saved
 * workbook's formulas use and which rulesets it stores, and, against a firm
 * library, whether each formula uses the library's current approved version.
 * A gate before issue: exit status 3 where one does not (docs/firm-library.md).
 */
import { approvalWords, STANDING_WORDS, standingSentence, type RulesetStatus } from "../../core/index.js";
import { CliError, cliErrorOf, EXIT } from "../cliError.js";
import { libraryFromFile } from "../input/libraryOption.js";
import { auditWorkbook, type AuditReport, type FormulaFinding, type StoredFinding } from "../input/workbookAudit.js";
import { chooseFormat, isMachineFormat, type Format } from "../output/format.js";
import { CAUTIONS, statusWord } from "../output/preamble.js";
import { rowWriter, type Column } from "../output/rowWriter.js";
import type { Io } from "./common.js";

export interface AuditOptions {
  library?: string;
  format?: string;
}

export async function auditCommand(file: string, options: AuditOptions, io: Io): Promise<void> {
  const format = chooseFormat(options.format, io.stdoutIsTerminal);
  const library = options.library === undefined ? null : libraryFromFile(options.library);
  const report = await auditWorkbook(file, library);
  const verdict = verdictOf(report);

  const notes = isMachineFormat(format) ? io.err : io.out;
  for (const line of preamble(report, format)) notes.line(line);
  await io.err.flush();
  if (format === "json") io.out.line(JSON.stringify(auditJson(report, verdict), null, 2));
  else if (format === "csv") await writeCsv(report, io);
  else await writeTables(report, format, io);
  const result = `Result: ${verdict.text}`;
  if (format === "table") io.out.line(`\n${result}`);
  else if (format === "md") io.out.line(`\n**${result}**`);
  else io.err.line(`loadwright: ${result}`);
  await io.out.flush();
  await io.err.flush();

  if (report.problems.length > 0) throw cliErrorOf(report.problems);
  if (verdict.passed === false) throw new CliError(`audit not passed: ${verdict.text}`, [], EXIT.notApproved);
}

interface Verdict {
  checked: boolean;
  passed: boolean | null;
  using: number;
  failing: FormulaFinding[];
  text: string;
}

function verdictOf(report: AuditReport): Verdict {
  const using = report.formulas.filter((f) => f.reference.kind !== "not-loadwright");
  const failing = using.filter((f) => f.passes === false);
  const count = (n: number, what: string) => `${n} ${what}${n === 1 ? "" : "s"}`;
  if (!report.library) {
    return { checked: false, passed: null, using: using.length, failing: [], text: `${count(using.length, "Loadwright formula")} and ${count(report.stored.length, "stored ruleset")} listed; no library given, so nothing was checked against one (--library FILE)` };
  }
  if (using.length === 0) return { checked: true, passed: true, using: 0, failing: [], text: "no Loadwright formula uses a ruleset in this workbook; nothing to check against the library" };
  if (failing.length === 0) return { checked: true, passed: true, using: using.length, failing, text: `every one of the ${count(using.length, "Loadwright formula")} uses the library's current approved version of its ruleset` };
  const cells = failing.slice(0, 8).map((f) => `${f.sheet}!${f.cell}`);
  const more = failing.length > cells.length ? ` and ${failing.length - cells.length} more` : "";
  return { checked: true, passed: false, using: using.length, failing, text: `${failing.length} of ${count(using.length, "Loadwright formula")} use a ruleset that is not the library's current approved version (${cells.join(", ")}${more})` };
}

function preamble(report: AuditReport, format: Format): string[] {
  const lines = [
    `Workbook: ${report.workbook}: ${report.sheets} worksheet${report.sheets === 1 ? "" : "s"}, ${report.formulas.length} Loadwright formula call${report.formulas.length === 1 ? "" : "s"}, ${report.stored.length} stored ruleset${report.stored.length === 1 ? "" : "s"}`,
  ];
  if (report.library) {
    const { library, file } = report.library;
    const current = library.entries.filter((e) => e.current).length;
    lines.push(`Library: ${file}, "${library.title}", ${library.owner}, dated ${library.date}: ${current} current ruleset${current === 1 ? "" : "s"}${library.entries.length > current ? ` and ${library.entries.length - current} superseded` : ""}`);
  }
  // Each UNVERIFIED ruleset in use or stored, by content, with what exactly is from memory.
  const unverified = new Map<string, { id: string; status: RulesetStatus }>();
  const note = (id: string, status: RulesetStatus | null) => {
    if (status?.verification === "unverified") unverified.set(status.fingerprint, { id, status });
  };
  for (const s of report.stored) if (s.ruleset) note(s.ruleset.file.id, s.status);
  for (const f of report.formulas) if (f.content?.source === "shipped") note(f.content.ruleset.file.id, f.content.status);
  if (unverified.size > 0) {
    const ids = [...new Set([...unverified.values()].map((u) => u.id))];
    lines.unshift(
      `*** UNVERIFIED RULESETS IN THIS WORKBOOK: ${ids.join(", ")}: their factors are from memory and have not been checked against the standard ***`,
      ...[...unverified.values()].map((u) => `Unverified: ${u.id} (fingerprint ${u.status.shortFingerprint}), from memory: ${u.status.fromMemory.join("; ")}`),
    );
  }
  lines.push(
    "What this shows: the rulesets the saved file's formulas name and the rulesets it stores, by fingerprint. It does not recalculate: cell values are those last saved, and whether the numbers are right is the engineer's review.",
  );
  const cautions = CAUTIONS.map((c) => `Caution: ${c}`);
  if (format === "md") return [...lines.map((l) => `> ${l}  `), ">", ...cautions.map((l) => `> ${l}  `), ""];
  if (format === "table") return [...lines, ...cautions, ""];
  return [...lines, ...cautions].map((l) => `loadwright: ${l}`);
}

/** As the user sees it in Excel: =LW.ENVELOPE(…) rather than the stored _xldudf_LW_ENVELOPE(…). */
export function shownFormula(stored: string): string {
  return `=${stored.replace(/(?:_xlfn\.|_xlws\.)?_xldudf_LW_([A-Za-z][A-Za-z0-9]*)\s*\(/gi, (_m, fn: string) => `LW.${fn.toUpperCase()}(`)}`;
}

function referenceText(f: FormulaFinding): { ruleset: string; from: string } {
  switch (f.reference.kind) {
    case "id":
      return { ruleset: f.reference.id, from: f.reference.from };
    case "cells":
      return { ruleset: "(typed in cells)", from: f.reference.from };
    case "unresolved":
      return { ruleset: "(cannot be resolved)", from: f.reference.reason };
    case "not-loadwright":
      return { ruleset: "", from: f.reference.reason };
  }
}

function contentText(f: FormulaFinding): string {
  if (f.reference.kind === "cells") return "typed in the workbook: not checked by Loadwright";
  if (!f.content) return "";
  switch (f.content.source) {
    case "stored":
      return `stored in the workbook (${f.content.finding.stored.part})`;
    case "shipped":
      return "shipped with Loadwright (not stored in the workbook)";
    case "none":
      return f.content.reason;
  }
}

function statusOf(f: FormulaFinding): RulesetStatus | null {
  if (f.content?.source === "stored") return f.content.finding.status;
  if (f.content?.source === "shipped") return f.content.status;
  return null;
}

function libraryWord(f: FormulaFinding): string {
  if (f.passes === null) return "";
  if (f.standing) return STANDING_WORDS[f.standing.standing].short;
  return "CANNOT BE CHECKED";
}

function storedLibraryWord(s: StoredFinding, report: AuditReport): string {
  if (!report.library) return "";
  if (!s.standing) return "DOES NOT LOAD";
  return STANDING_WORDS[s.standing.standing].short;
}

async function writeTables(report: AuditReport, format: "table" | "md", io: Io): Promise<void> {
  const heading = (text: string) => io.out.line(format === "md" ? `### ${text}\n` : text);
  const withLibrary = report.library !== null;

  heading(`Stored rulesets (the workbook's add-in settings${report.addInParts.length > 0 ? `: ${report.addInParts.map((p) => p.part).join(", ")}` : ": none"})`);
  if (report.stored.length === 0) io.out.line(report.addInParts.length === 0 ? "No add-in settings in this workbook: it stores no rulesets." : "The workbook's add-in settings hold no Loadwright rulesets.");
  else {
    const columns: Column[] = [{ title: "id" }, { title: "version" }, { title: "fingerprint" }, { title: "verification" }, { title: "approval" }, ...(withLibrary ? [{ title: "library" }] : [])];
    const writer = rowWriter(format, io.out, columns);
    for (const s of report.stored) {
      const file = s.ruleset?.file;
      await writer.row([s.stored.id, file?.version ?? "", s.status ? s.status.shortFingerprint : "", s.status ? statusWord(s.status) : "DOES NOT LOAD", s.status && file ? approvalWords(s.status.approval, file.approval).cell : s.problems.length > 0 ? "see the errors below" : "", ...(withLibrary ? [storedLibraryWord(s, report)] : [])]);
    }
    await writer.end();
    if (withLibrary) for (const s of report.stored) if (s.standing && s.standing.standing !== "same") io.out.line(`${format === "md" ? "- " : "  "}${s.stored.id}: ${standingSentence(s.standing)}`);
  }
  io.out.line("");

  heading("Loadwright formulas");
  if (report.formulas.length === 0) io.out.line("No cell holds a Loadwright formula (LW.…).");
  else {
    const columns: Column[] = [...titled(FORMULA_FIELDS), ...titled(["fingerprint", "verification"]), ...(withLibrary ? titled(["library"]) : [])];
    const writer = rowWriter(format, io.out, columns);
    for (const f of report.formulas) {
      const { ruleset, from } = referenceText(f);
      const status = statusOf(f);
      await writer.row([f.sheet, f.cell, shownFormula(f.formula), ruleset, from, contentText(f), status?.shortFingerprint ?? "", status ? statusWord(status) : "", ...(withLibrary ? [libraryWord(f)] : [])]);
    }
    await writer.end();
    if (withLibrary) {
      for (const f of report.formulas.filter((x) => x.passes === false)) {
        io.out.line(`${format === "md" ? "- " : "  "}${f.sheet}!${f.cell}: ${f.standing ? standingSentence(f.standing) : `CANNOT BE CHECKED: ${f.failure ?? "no ruleset"}`}`);
      }
    }
  }
}

/** What the audit says of each formula, in the table and in CSV alike. */
const FORMULA_FIELDS = ["sheet", "cell", "formula", "ruleset", "read from", "content"];

const titled = (titles: readonly string[]): Column[] => titles.map((title) => ({ title }));

/** One CSV table: a line per stored ruleset, then a line per formula, told apart by `record`. */
async function writeCsv(report: AuditReport, io: Io): Promise<void> {
  const writer = rowWriter("csv", io.out, titled(["record", ...FORMULA_FIELDS, "version", "fingerprint", "verification", "approval", "library", "library detail"]));
  for (const s of report.stored) {
    await writer.row([
      "stored ruleset",
      "",
      "",
      "",
      s.stored.id,
      `${s.stored.part}, entry ${s.stored.entry + 1}`,
      "stored in the workbook",
      s.ruleset?.file.version ?? "",
      s.status?.fingerprint ?? "",
      s.status ? statusWord(s.status) : "DOES NOT LOAD",
      s.status?.approval ?? "",
      report.library ? (s.standing?.standing ?? "does-not-load") : "",
      s.standing ? standingSentence(s.standing) : s.problems.join("; "),
    ]);
  }
  for (const f of report.formulas) {
    const { ruleset, from } = referenceText(f);
    const status = statusOf(f);
    await writer.row([
      "formula",
      f.sheet,
      f.cell,
      shownFormula(f.formula),
      ruleset,
      from,
      contentText(f),
      f.content?.source === "stored" ? (f.content.finding.ruleset?.file.version ?? "") : f.content?.source === "shipped" ? f.content.ruleset.file.version : "",
      status?.fingerprint ?? "",
      status ? statusWord(status) : "",
      status?.approval ?? "",
      f.passes === null ? "" : (f.standing?.standing ?? "cannot-be-checked"),
      f.standing ? standingSentence(f.standing) : (f.failure ?? ""),
    ]);
  }
  await writer.end();
}

/** The ruleset identity fields of the JSON contract, null where there is no content to name. */
function statusJson(status: RulesetStatus | null) {
  return status
    ? { fingerprint: status.fingerprint, status: status.verification, approval: status.approval, summary: status.summary }
    : { fingerprint: null, status: null, approval: null, summary: null };
}

function auditJson(report: AuditReport, verdict: Verdict) {
  return {
    workbook: report.workbook,
    library: report.library
      ? {
          file: report.library.file,
          title: report.library.library.title,
          owner: report.library.library.owner,
          date: report.library.library.date,
          rulesets: report.library.library.entries.map((e) => ({ id: e.ruleset.file.id, version: e.ruleset.file.version, fingerprint: e.fingerprint, approvedBy: e.approvedBy, date: e.date, current: e.current })),
        }
      : null,
    addInParts: report.addInParts,
    storedRulesets: report.stored.map((s) => ({
      id: s.stored.id,
      part: s.stored.part,
      entry: s.stored.entry,
      loads: s.ruleset !== null,
      problems: s.problems,
      version: s.ruleset?.file.version ?? null,
      ...statusJson(s.status),
      standing: s.standing ? { standing: s.standing.standing, text: standingSentence(s.standing) } : null,
    })),
    formulas: report.formulas.map((f) => {
      const status = statusOf(f);
      return {
        sheet: f.sheet,
        cell: f.cell,
        formula: shownFormula(f.formula),
        stored: f.formula,
        function: f.call.name,
        ruleset: {
          reference: f.reference.kind,
          id: f.reference.kind === "id" ? f.reference.id : null,
          from: f.reference.kind === "id" || f.reference.kind === "cells" ? f.reference.from : null,
          reason: f.reference.kind === "unresolved" || f.reference.kind === "not-loadwright" ? f.reference.reason : f.content?.source === "none" ? f.content.reason : null,
          source: f.reference.kind === "cells" ? "cells" : (f.content?.source ?? null),
          part: f.content?.source === "stored" ? f.content.finding.stored.part : null,
          version: f.content?.source === "stored" ? (f.content.finding.ruleset?.file.version ?? null) : f.content?.source === "shipped" ? f.content.ruleset.file.version : null,
          ...statusJson(status),
        },
        standing: f.standing ? { standing: f.standing.standing, text: standingSentence(f.standing) } : null,
        libraryApproved: f.passes,
        failure: f.passes === false ? (f.standing ? standingSentence(f.standing) : f.failure) : null,
      };
    }),
    result: { checked: verdict.checked, passed: verdict.passed, formulas: verdict.using, notApproved: verdict.failing.length, text: verdict.text },
    cautions: CAUTIONS,
  };
}
