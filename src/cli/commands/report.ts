/**
 * `loadwright report FILE --out calc.html`: the checker's calculation report
 * (src/report) for one case file, written as one self-contained HTML file and,
 * with --pdf, printed by headless Chromium. The case table is read whole: a
 * report is read page by page, so a table of more results than the result
 * limit is refused (reading stops there), and beyond the row limit the row by
 * row listing and the plots are replaced by a stated summary.
 */
import { writeFileSync } from "node:fs";
import { defaultCriteria, type CaseTable } from "../../core/index.js";
import { calcReport, REPORT_RESULT_LIMIT, REPORT_ROW_LIMIT, tooManyResults } from "../../report/calcReport.js";
import { renderReport } from "../../report/renderReport.js";
import { cliErrorOf, CliError } from "../cliError.js";
import type { CaseInput } from "../input/caseInput.js";
import { fileErrorText } from "../input/fileAccess.js";
import { VERSION } from "../version.js";
import { criteriaOrFail } from "./governing.js";
import { noRowsError, prepare, rowLimitOf, writePreamble, withRowLimitHint, type CaseOptions, type Io } from "./common.js";
import { findChromium, paperOf, printPdf } from "./reportPdf.js";

export interface ReportOptions extends CaseOptions {
  out: string;
  criterion: string[];
  title?: string;
  by?: string;
  date?: string;
  pdf?: string | boolean;
  paper: string;
  chromium?: string;
  digits: string;
  rowLimit: string;
  resultLimit: string;
}

export async function reportCommand(file: string, options: ReportOptions, io: Io): Promise<void> {
  if (!/\.html?$/i.test(options.out)) throw new CliError(`--out: "${options.out}" does not end in .html; the report is an HTML file (add --pdf for a PDF beside it)`);
  const digits = digitsOf(options.digits);
  const rowLimit = rowLimitOf(options.rowLimit);
  const resultLimit = limitOf(options.resultLimit, "--result-limit");
  const paper = paperOf(options.paper);
  const pdf = options.pdf === undefined || options.pdf === false ? null : options.pdf === true ? options.out.replace(/\.html?$/i, ".pdf") : options.pdf;
  if (pdf !== null && !/\.pdf$/i.test(pdf)) throw new CliError(`--pdf: "${pdf}" does not end in .pdf`);
  const chromium = pdf !== null ? findChromium(options.chromium) : null;

  const prepared = await prepare(file, { ...options, format: "table" }, io);
  const { plan, chosen } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  const table = await boundedTable(prepared.input, resultLimit);
  const criteria = options.criterion.length > 0 ? criteriaOrFail(options.criterion, table.components) : table.orientation === "rows" ? defaultCriteria(table) : [];
  const report = calcReport({
    title: options.title ?? `Load combinations: ${file}`,
    by: options.by ?? null,
    date: options.date ?? null,
    file,
    version: VERSION,
    status: chosen.status,
    source: chosen.source,
    plan,
    table,
    criteria,
    digits,
    rowLimit,
  });
  if (!report.ok) throw cliErrorOf(report.problems.map((p) => `${file}: ${withRowLimitHint(p)}`));
  for (const e of report.value.envelope) {
    if (!Number.isFinite(e.max.value) || !Number.isFinite(e.min.value)) throw new CliError(`${file} (${e.result}): a factored value is not a finite number (are the case values far too large?)`);
  }
  const html = renderReport(report.value);
  try {
    writeFileSync(options.out, html);
  } catch (e) {
    throw new CliError(`--out: ${options.out}: ${fileErrorText(e)}`);
  }
  await writePreamble(io, { chosen, plan, format: "table" });
  io.out.line(`Wrote ${options.out}: the calculation report (${sizeText(Buffer.byteLength(html))}; open it in a browser, or print it on A4 or Letter).`);
  if (report.value.listingSummary) io.out.line(`Note: ${report.value.listingSummary}`);
  await io.out.flush();
  if (pdf !== null && chromium !== null) {
    const bytes = await printPdf(options.out, pdf, paper, chromium);
    io.out.line(`Wrote ${pdf}: the report printed by Chromium on ${paper} (${sizeText(bytes)}).`);
  }
  await io.out.flush();
}

/** The case table whole, refused (and no further read) past the result limit. */
async function boundedTable(input: CaseInput, limit: number): Promise<CaseTable> {
  if (input.kind === "table") {
    if (input.table.components.length > limit) throw new CliError(`${input.file}: ${tooManyResults(input.table.components.length, limit)}`);
    return input.table;
  }
  const components: string[] = [];
  const values: Float64Array[] = [];
  for await (const row of input.rows) {
    if (components.length === limit) {
      await input.close();
      throw new CliError(`${input.file}: ${tooManyResults(null, limit)}`);
    }
    components.push(row.id);
    values.push(row.values);
  }
  return { orientation: "columns", cases: input.cases, components, values, map: input.map };
}

function digitsOf(option: string): number {
  const n = Number(option);
  if (!Number.isInteger(n) || n < 2 || n > 12) throw new CliError(`--digits: "${option}" is not a whole number of significant digits from 2 to 12`);
  return n;
}

function limitOf(option: string, name: string): number {
  const n = Number(option.replace(/[_,]/g, ""));
  if (!Number.isInteger(n) || n < 1) throw new CliError(`${name}: "${option}" is not a whole number`);
  return n;
}

function sizeText(bytes: number): string {
  return bytes >= 1e6 ? `${(bytes / 1e6).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1e3))} kB`;
}

export const REPORT_DEFAULTS = { rowLimit: String(REPORT_ROW_LIMIT), resultLimit: String(REPORT_RESULT_LIMIT), digits: "4", paper: "a4" };
