/**
 * The reviewer's copy from the pane: the same sheet the command line writes
 * (src/sheet/reviewerSheet.ts), for the case table on the sheet and the
 * chosen stored or shipped ruleset, headed by the stamp and the cautions in
 * the catalogue's words, then written into a new worksheet with one loop over
 * its cells. Above the row limit it is refused with the core's message, the
 * one the command line gives.
 */
import {
  coverageText,
  DEFAULT_ROW_LIMIT,
  describeProblem,
  formatNumber,
  FROM_MEMORY_LEAD,
  fromMemoryTexts,
  omissionTexts,
  parseCriterion,
  planOmissions,
  shortCautions,
  stampLine,
  type Criterion,
  type Plan,
  type RulesetOrigin,
} from "../core/index.js";
import { reviewerSheet, type ReviewerSheet } from "../sheet/reviewerSheet.js";
import type { SheetHost } from "../sheet/sheetHost.js";
import { tableName, type PaneResult, type TableOnSheet } from "./sheetTable.js";

/** The sheet's content, or why there is none (a draft, criteria that do not read, too many rows). */
export function reviewerCopy(t: TableOnSheet, criteria: readonly string[] | null, origin: RulesetOrigin, rowLimit = DEFAULT_ROW_LIMIT): PaneResult<ReviewerSheet> {
  if (!t.choice.entry || !t.choice.status) {
    return { ok: false, lines: ["The reviewer's copy names a stored or shipped ruleset, not a draft: store the draft first, or choose a stored or shipped ruleset."] };
  }
  const file = t.ruleset.file;
  const status = t.choice.status;
  const parsed: Criterion[] = [];
  for (const text of criteria ?? []) {
    const c = parseCriterion(text, t.table.components);
    if (!c.ok) return { ok: false, lines: c.problems.map((p) => `criteria (${text}): ${describeProblem(p)}`) };
    parsed.push(c.value);
  }
  const fromMemory = fromMemoryTexts(file);
  const sheet = reviewerSheet(t.plan, t.table, {
    stamp: [stampLine(file, status, origin), `Ruleset: ${file.id} ${file.version}, "${file.title}", ${file.standard.name} ${file.standard.edition}, fingerprint ${status.fingerprint}`],
    cautions: shortCautions(),
    notes: [
      `Combinations: ${coverageText(status.combinations)}`,
      ...(fromMemory.length > 0 ? [`${FROM_MEMORY_LEAD} ${fromMemory.join("; ")}`] : []),
      ...parameterLines(t.plan),
      `Case table: ${tableName(t.read)}`,
      ...omissionTexts(planOmissions(t.plan)).map((n) => `Note: ${n}`),
    ],
    rowLimit,
    ...(criteria !== null && parsed.length > 0 ? { criteria: parsed } : {}),
  });
  if (!sheet.ok) return { ok: false, lines: sheet.problems.map((p) => `${tableName(t.read)}: ${describeProblem(p)}`) };
  return sheet;
}

/** "Parameters: SDS = 1 (given), rho = 1 (default)": every parameter in force, as the copy must record it. */
function parameterLines(plan: Plan): string[] {
  const parts = plan.ruleset.parameters.map((p) => {
    const value = p.kind === "choice" ? (plan.parameters.choices.get(p.name) ?? p.default) : plan.parameters.numbers.get(p.name);
    const shown = typeof value === "number" ? formatNumber(value) : (value ?? "not given (no default; no combination that gives rows reads it)");
    return `${p.name} = ${shown} (${plan.parameters.given.has(p.name) ? "given" : "default"})`;
  });
  return parts.length > 0 ? [`Parameters: ${parts.join(", ")}`] : [];
}

/** Adds a worksheet and writes the copy into it; gives the worksheet's name. */
export async function writeReviewerCopy(host: SheetHost, sheet: ReviewerSheet): Promise<PaneResult<string>> {
  const added = await host.addSheet(sheet.name);
  if (!added.ok) return { ok: false, lines: added.problems.map((p) => p.message) };
  const written = await host.write(added.value, sheet.cells);
  if (!written.ok) return { ok: false, lines: written.problems.map((p) => `The worksheet ${added.value} was added, but the copy was not fully written: ${p.message}`) };
  return { ok: true, value: added.value };
}
