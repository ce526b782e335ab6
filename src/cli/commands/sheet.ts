/**
 * `loadwright sheet FILE --out book.xlsx`: the reviewer's copy, a worksheet of
 * plain formulas (SUMPRODUCT, MAX, MIN, INDEX, MATCH) over the case table and
 * the factor table, which any spreadsheet program recomputes without
 * Loadwright (docs/reviewer-copy.md).
 */
import { writeFileSync } from "node:fs";
import { resolve } from "node:path";
import { CliError } from "../cliError.js";
import { CAUTIONS, identityLines } from "../output/preamble.js";
import { reviewerSheet } from "../../sheet/reviewerSheet.js";
import { noRowsError, prepare, rowLimitOf, withRowLimitHint, type CaseOptions, type Io } from "./common.js";
import { wholeTable } from "./factored.js";
import { criteriaOrFail } from "./governing.js";

export interface SheetCommandOptions extends CaseOptions {
  criterion: string[];
  rowLimit: string;
  out: string;
}

export async function sheetCommand(file: string, options: SheetCommandOptions, io: Io): Promise<void> {
  if (options.format !== undefined) throw new CliError(`--format: the sheet command writes a workbook (--out) and has no output format`);
  const out = outFileOf(options.out);
  const rowLimit = rowLimitOf(options.rowLimit);
  const prepared = await prepare(file, { ...options, format: "table" }, io);
  const { plan, chosen } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  const table = await wholeTable(prepared.input);
  const criteria = options.criterion.length > 0 ? criteriaOrFail(options.criterion, table.components) : undefined;
  const [status, ...identity] = stampLines(identityLines(chosen, plan));
  const sheet = reviewerSheet(plan, table, {
    stamp: [status, identity[0]],
    notes: identity.slice(1),
    cautions: CAUTIONS,
    rowLimit,
    ...(criteria ? { criteria } : {}),
  });
  if (!sheet.ok) throw new CliError(`${file}: ${sheet.problems.map(withRowLimitHint).join("; ")}`);
  // Loaded here, not with the command line: the spreadsheet library takes longer to load than most commands take to run.
  const { sheetWorkbook } = await import("./sheetWorkbook.js");
  const bytes = await sheetWorkbook(sheet.value);
  try {
    writeFileSync(out, bytes);
  } catch (e) {
    throw new CliError(`--out ${options.out}: cannot write the workbook (${(e as Error).message})`);
  }
  const { rowCount } = sheet.value.layout;
  io.out.line(`Wrote ${options.out}: sheet "${sheet.value.name}", ${rowCount.toLocaleString("en-US")} combination rows × ${table.components.length} results, ${plan.cases.length} cases.`);
  io.out.line(`Ruleset: ${chosen.ruleset.file.id} ${chosen.ruleset.file.version}, ${chosen.status.summary}, fingerprint ${chosen.status.shortFingerprint}`);
  for (const c of CAUTIONS) io.out.line(`Caution: ${c}`);
  await io.out.flush();
}

/** The status line first (with UNVERIFIED in capitals where it applies), then the ruleset's identity and the rest. */
function stampLines(lines: string[]): string[] {
  const status = lines.find((l) => l.startsWith("Status: ")) ?? "";
  const banner = lines.find((l) => l.startsWith("***"));
  const rest = lines.filter((l) => l !== status && l !== banner);
  return [banner ? `${banner.replace(/\*/g, "").trim()}. ${status}` : status, ...rest];
}

function outFileOf(option: string): string {
  if (!/\.xlsx$/i.test(option)) throw new CliError(`--out: "${option}" does not end in .xlsx (the reviewer's copy is an Office Open XML workbook)`);
  return resolve(option);
}
