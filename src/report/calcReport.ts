/**
 * What a checker's calculation report holds, gathered from the engine for one
 * case table, ruleset, parameter set and list of criteria: the ruleset's stamp
 * in the catalogue's words, the parameters in force, what the case table leaves
 * out, the case table as given, the combination rows with their clauses, the
 * envelope, the governing rows, the derivation of every governing value, and
 * every row's factored values for the plots — or, beyond the row limit, the
 * stated summary that stands in for them. Rendering is renderReport's.
 */
import {
  comboRows,
  combinationCoverage,
  criterionNames,
  envelope,
  explain,
  factored,
  fromMemoryTexts,
  fullCautions,
  governing,
  planOmissions,
  statusText,
  FROM_MEMORY_LEAD,
  type CaseTable,
  type ComboRow,
  type Criterion,
  type EnvelopeEntry,
  type Explanation,
  type GoverningRow,
  type Plan,
  type PlanOmissions,
  type Problem,
  type Result,
  type RulesetStatus,
  type StatusText,
} from "../core/index.js";

/** The report's own limits (docs/report.md, "Size limits"). */
export const REPORT_ROW_LIMIT = 2_000;
export const REPORT_RESULT_LIMIT = 100;
/** Criteria that are not linear are evaluated on every row, up to the limit every command uses. */
export const CRITERION_ROW_LIMIT = 200_000;

export interface ReportRequest {
  title: string;
  by: string | null;
  date: string | null;
  /** The case file as the user named it. */
  file: string;
  /** Loadwright's version. */
  version: string;
  status: RulesetStatus;
  /** "shipped" or the ruleset file read. */
  source: string;
  plan: Plan;
  table: CaseTable;
  /** Parsed criteria; none: the table's own (max and min of every component of a reactions table, none for an export). */
  criteria: Criterion[];
  /** Significant digits of computed values. */
  digits: number;
  /** The most concrete rows listed and drawn one by one. */
  rowLimit: number;
}

export interface ParameterLine {
  name: string;
  value: number | string;
  given: boolean;
  description: string;
}

export interface RulesetStamp {
  id: string;
  version: string;
  title: string;
  standard: string;
  source: string;
  fingerprint: string;
  shortFingerprint: string;
  words: StatusText;
  coverage: { total: number; confirmed: number; unconfirmed: string[] };
  fromMemoryLead: string | null;
  fromMemory: string[];
  approvedBy: string | null;
  approvedOn: string | null;
}

export interface CombinationGroup {
  id: string;
  clause: string;
  expression: string;
  rowCount: number;
  /** Its rows, or null where the listing is summarised. */
  rows: ComboRow[] | null;
}

export interface Derivation {
  governing: number;
  explanation: Explanation;
}

export interface RowValues {
  label: string;
  combination: string;
  /** One value per component, in table order. */
  values: number[];
}

export interface CalcReport {
  request: ReportRequest;
  stamp: RulesetStamp;
  parameters: ParameterLine[];
  cautions: string[];
  omissions: PlanOmissions;
  groups: CombinationGroup[];
  /** Set where the rows are not listed one by one, with why. */
  listingSummary: string | null;
  envelope: EnvelopeEntry[];
  governing: GoverningRow[];
  /** Said where there are no governing rows. */
  governingNote: string | null;
  derivations: Derivation[];
  /** Every row's values (for the plots), or null where they are left out (`plotsNote` says why). */
  rows: RowValues[] | null;
  plotsNote: string | null;
}

export function calcReport(request: ReportRequest): Result<CalcReport> {
  const { plan, table, status } = request;
  const file = plan.ruleset.file;
  const words = statusText(status, file.approval);
  const coverage = combinationCoverage(plan.ruleset);
  const fromMemory = fromMemoryTexts(file);
  const stamp: RulesetStamp = {
    id: file.id,
    version: file.version,
    title: file.title,
    standard: `${file.standard.name} ${file.standard.edition}${file.standard.clauses ? ` ${file.standard.clauses}` : ""}`,
    source: request.source === "shipped" ? "shipped with Loadwright" : `file ${request.source}`,
    fingerprint: status.fingerprint,
    shortFingerprint: status.shortFingerprint,
    words,
    coverage,
    fromMemoryLead: fromMemory.length > 0 ? FROM_MEMORY_LEAD : null,
    fromMemory,
    approvedBy: file.approval.approvedBy ?? null,
    approvedOn: file.approval.date ?? null,
  };
  const parameters: ParameterLine[] = plan.ruleset.parameters.map((p) => ({
    name: p.name,
    value: p.kind === "choice" ? (plan.parameters.choices.get(p.name) ?? p.default) : (plan.parameters.numbers.get(p.name) ?? NaN),
    given: plan.parameters.given.has(p.name),
    description: p.description,
  }));

  const problems: Problem[] = [];
  const listed = plan.rowCount <= request.rowLimit;
  const listing = listed ? comboRows(plan, request.rowLimit) : null;
  if (listing && !listing.ok) problems.push(...listing.problems);
  const groups: CombinationGroup[] = plan.combinations
    .filter((c) => c.skipped === null)
    .map((c) => ({
      id: c.combination.id,
      clause: c.combination.clause,
      expression: c.combination.expression,
      rowCount: c.rowCount,
      rows: listing?.ok ? listing.value.filter((r) => r.combination === c.combination.id) : null,
    }));
  const limitText = `the ruleset forms ${count(plan.rowCount, "concrete row")} for this case table, more than the report's row limit of ${request.rowLimit.toLocaleString("en-US")} (--row-limit)`;
  const listingSummary = listed ? null : `The combinations are listed with their row counts, not row by row: ${limitText}. The envelope, the governing rows and their derivations are complete.`;

  const env = envelope(plan, table);
  if (!env.ok) problems.push(...env.problems);
  const gov = request.criteria.length > 0 ? governing(plan, table, request.criteria, { rowLimit: CRITERION_ROW_LIMIT }) : null;
  if (gov && !gov.ok) problems.push(...gov.problems);
  const rows = listed ? factored(plan, table, request.rowLimit) : null;
  if (rows && !rows.ok) problems.push(...rows.problems);
  if (problems.length > 0 || !env.ok || (gov && !gov.ok) || (rows && !rows.ok) || (listing && !listing.ok)) return { ok: false, problems };

  const governingRows = gov?.ok ? gov.value : [];
  const derivations: Derivation[] = [];
  governingRows.forEach((g, k) => {
    const names = new Set(g.criteria.flatMap((c) => criterionNames(c)));
    for (const name of table.components.filter((c) => names.has(c))) {
      const x = explain(plan, table, g.label, name);
      if (x.ok) derivations.push({ governing: k, explanation: x.value });
      else problems.push(...x.problems);
    }
  });
  if (problems.length > 0) return { ok: false, problems };

  return {
    ok: true,
    value: {
      request,
      stamp,
      parameters,
      cautions: fullCautions(),
      omissions: planOmissions(plan),
      groups,
      listingSummary,
      envelope: env.value,
      governing: governingRows,
      governingNote:
        governingRows.length > 0
          ? null
          : "No criterion was given, so no governing rows are chosen: each result's extremes are in the envelope. Give --criterion to choose rows (e.g. \"max |[C1 top]|\").",
      derivations,
      rows: rows?.ok ? rows.value.map((r) => ({ label: r.label, combination: r.combination, values: r.values })) : null,
      plotsNote: listed ? null : `The plots of every row's value are left out: ${limitText}.`,
    },
  };
}

function count(n: number, noun: string): string {
  return `${n.toLocaleString("en-US")} ${noun}${n === 1 ? "" : "s"}`;
}

/** How many results the report holds at most; the caller refuses a larger table with this sentence (`results` null: more than the limit, reading stopped). */
export function tooManyResults(results: number | null, limit: number): string {
  return `the case table has ${results === null ? `more than ${count(limit, "result")}` : count(results, "result")}, beyond the report's limit of ${limit.toLocaleString("en-US")} (--result-limit): a report is read page by page; use envelope or governing for a whole export, or name fewer results with --range`;
}
