/**
 * What an audit finds in a saved workbook: every cell holding a Loadwright
 * formula with the ruleset it names, every ruleset the workbook stores, and,
 * against a firm library, the standing of each. It resolves a formula's ruleset
 * as the add-in would (a stored ruleset before a shipped one of the same id)
 * and says where it cannot.
 */
import {
  findShippedRuleset,
  isLibraryApproved,
  rulesetStatus,
  standingOf,
  type Ruleset,
  type RulesetStanding,
  type RulesetStatus,
} from "../../core/index.js";
import { loadwrightCalls, type LoadwrightCall } from "./formulaText.js";
import { rulesetReference, type BookCells, type RulesetReference } from "./formulaRuleset.js";
import type { ChosenLibrary } from "./libraryOption.js";
import { readSheetCells, readWorkbookIndex, type CellValue, type FormulaCell, type Sheet } from "./workbookCells.js";
import { WorkbookPackage } from "./workbookPackage.js";
import { readStoredRulesets, storedProblemLine, type AddInPart, type StoredRuleset } from "./workbookSettings.js";

export interface StoredFinding {
  stored: StoredRuleset;
  /** Null where the stored file no longer loads (see `problems`). */
  ruleset: Ruleset | null;
  status: RulesetStatus | null;
  standing: RulesetStanding | null;
  problems: string[];
}

export type FormulaContent =
  | { source: "stored"; finding: StoredFinding }
  | { source: "shipped"; ruleset: Ruleset; status: RulesetStatus }
  /** No content can be named: unknown id, a stored copy that does not load, copies that disagree. */
  | { source: "none"; reason: string };

export interface FormulaFinding {
  sheet: string;
  cell: string;
  /** As the file stores it, without "=". */
  formula: string;
  call: LoadwrightCall;
  reference: RulesetReference;
  /** Null where the reference names no id (typed cells, unresolved, not a Loadwright formula). */
  content: FormulaContent | null;
  standing: RulesetStanding | null;
  /** With a library: whether this formula uses the library's current approved version; null without one, or for a formula that uses no ruleset. */
  passes: boolean | null;
  /** Why it does not pass, in words. */
  failure: string | null;
}

export interface AuditReport {
  workbook: string;
  sheets: number;
  addInParts: AddInPart[];
  stored: StoredFinding[];
  formulas: FormulaFinding[];
  library: ChosenLibrary | null;
  /** Located lines for stored rulesets that do not load. */
  problems: string[];
}

export async function auditWorkbook(file: string, library: ChosenLibrary | null): Promise<AuditReport> {
  const pkg = await WorkbookPackage.open(file);
  const index = await readWorkbookIndex(pkg);
  const settings = await readStoredRulesets(pkg);

  const stored: StoredFinding[] = settings.rulesets.map((s) => {
    if (!s.loaded.ok) return { stored: s, ruleset: null, status: null, standing: null, problems: s.loaded.problems.map((p) => storedProblemLine(file, s, p)) };
    const status = rulesetStatus(s.loaded.value);
    return { stored: s, ruleset: s.loaded.value, status, standing: library ? standingOf(library.library, s.id, status.fingerprint) : null, problems: [] };
  });

  // First the formulas of every sheet, no values; then only the cells their ruleset arguments name,
  // found by resolving once against values that record what is asked of them.
  const sheets: { sheet: Sheet; formulas: FormulaCell[]; calls: { cell: FormulaCell; call: LoadwrightCall }[] }[] = [];
  for (const sheet of index.sheets) {
    const { formulas } = await readSheetCells(pkg, sheet, index.sharedStrings, new Set());
    sheets.push({ sheet, formulas, calls: formulas.flatMap((cell) => loadwrightCalls(cell.formula).map((call) => ({ cell, call }))) });
  }
  const asked = sheets.map(() => new Set<string>());
  const recording: BookCells = {
    names: index.names,
    sheets: sheets.map((s, i) => ({ name: s.sheet.name, formulas: new Set(s.formulas.map((f) => f.address)), values: { get: (a: string) => void asked[i].add(a) } })),
  };
  sheets.forEach((s, i) => s.calls.forEach(({ call }) => rulesetReference(call, i, recording)));
  const book: BookCells = { names: index.names, sheets: [] };
  for (const [i, s] of sheets.entries()) {
    const values = asked[i].size > 0 ? (await readSheetCells(pkg, s.sheet, index.sharedStrings, asked[i])).values : new Map<string, CellValue>();
    book.sheets.push({ name: s.sheet.name, formulas: recording.sheets[i].formulas, values });
  }

  const formulas: FormulaFinding[] = [];
  sheets.forEach(({ sheet, calls }, sheetIndex) => {
    for (const { cell, call } of calls) {
      const reference = rulesetReference(call, sheetIndex, book);
      const content = reference.kind === "id" ? contentOf(reference.id, stored) : null;
      formulas.push(judge({ sheet: sheet.name, cell: cell.address, formula: cell.formula, call, reference, content, standing: null, passes: null, failure: null }, library));
    }
  });

  return { workbook: file, sheets: index.sheets.length, addInParts: settings.parts, stored, formulas, library, problems: stored.flatMap((s) => s.problems) };
}

/** As the add-in finds a ruleset by id: its stored copy, else the shipped one. */
function contentOf(id: string, stored: StoredFinding[]): FormulaContent {
  // Within one add-in part the first entry of an id is the one read; copies in several parts must agree.
  const perPart = new Map<string, StoredFinding>();
  for (const s of stored) if (s.stored.id === id && !perPart.has(s.stored.part)) perPart.set(s.stored.part, s);
  const copies = [...perPart.values()];
  if (copies.length > 0) {
    const broken = copies.find((c) => c.ruleset === null);
    if (broken) return { source: "none", reason: `the stored ruleset "${id}" (${broken.stored.part}) does not load, so the formula shows an error` };
    const prints = new Set(copies.map((c) => c.status?.fingerprint));
    if (prints.size > 1) return { source: "none", reason: `"${id}" is stored with different content in ${copies.map((c) => c.stored.part).join(" and ")}; which one the formula uses depends on the add-in that opens the workbook` };
    return { source: "stored", finding: copies[0] };
  }
  const shipped = findShippedRuleset(id);
  if (shipped) return { source: "shipped", ruleset: shipped.ruleset, status: shipped.status };
  return { source: "none", reason: `no ruleset "${id}" is stored in the workbook or shipped with this version of Loadwright, so the formula shows an error` };
}

function judge(f: FormulaFinding, library: ChosenLibrary | null): FormulaFinding {
  const status = f.content?.source === "stored" ? f.content.finding.status : f.content?.source === "shipped" ? f.content.status : null;
  if (library && status && f.reference.kind === "id") f.standing = standingOf(library.library, f.reference.id, status.fingerprint);
  if (!library || f.reference.kind === "not-loadwright") return f;
  f.passes = f.standing !== null && isLibraryApproved(f.standing);
  if (f.passes) return f;
  switch (f.reference.kind) {
    case "cells":
      f.failure = "a ruleset typed in the workbook, which no library approval covers";
      break;
    case "unresolved":
      f.failure = f.reference.reason;
      break;
    case "id":
      f.failure = f.content?.source === "none" ? f.content.reason : null;
      break;
  }
  return f;
}
