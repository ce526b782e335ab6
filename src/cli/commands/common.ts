/**
 * What the commands that read a case file share: the ruleset, parameters, case
 * map and case file options, the plan, and writing the preamble where the
 * format wants it.
 */
import { describeProblem, notFiniteProblem, planForTable, type CaseMap, type CaseTable, type Plan, type Problem } from "../../core/index.js";
import { cliErrorOf, CliError } from "../cliError.js";
import { caseMapFrom } from "../input/caseMapOption.js";
import { openCases, tableShape, type CaseFileOptions, type CaseInput, type Layout } from "../input/caseInput.js";
import { parameterInput } from "../input/paramOption.js";
import { chooseRuleset, type ChosenRuleset } from "../input/rulesetOption.js";
import { chooseFormat, isMachineFormat, type Format } from "../output/format.js";
import { preambleLines } from "../output/preamble.js";
import { Sink } from "../output/sink.js";

export interface RulesetOptions {
  ruleset: string;
  param: string[];
  format?: string;
}

export interface CaseOptions extends RulesetOptions {
  layout: string;
  idColumns: string;
  delimiter: string;
  map?: string;
  /** An .xlsx case file: the worksheet and the range. */
  sheet?: string;
  range?: string;
}

export interface Io {
  out: Sink;
  err: Sink;
  stdoutIsTerminal: boolean;
}

export function standardIo(): Io {
  return { out: new Sink(process.stdout), err: new Sink(process.stderr), stdoutIsTerminal: process.stdout.isTTY === true };
}

export interface Prepared {
  chosen: ChosenRuleset;
  input: CaseInput;
  plan: Plan;
  format: Format;
}

/** Ruleset, parameters, case file and plan, each refused with a located message. */
export async function prepare(file: string, options: CaseOptions, io: Io): Promise<Prepared> {
  const format = chooseFormat(options.format, io.stdoutIsTerminal);
  const chosen = chooseRuleset(options.ruleset);
  const parameters = parameterInput(options.param);
  const delimiter = delimiterOf(options.delimiter);
  const map = await caseMapFrom(options.map, chosen.ruleset, delimiter);
  const input = await openCases(file, chosen.ruleset, caseFileOptions(options, delimiter, map));
  const plan = planOrFail(chosen, parameters, tableShape(input));
  return { chosen, input, plan, format };
}

export function planOrFail(chosen: ChosenRuleset, parameters: Parameters<typeof planForTable>[1], shape: CaseTable | null): Plan {
  const plan = planForTable(chosen.ruleset, parameters, shape);
  if (plan.ok) return plan.value;
  const where = `ruleset ${chosen.ruleset.file.id}${chosen.source === "shipped" ? "" : ` (${chosen.source})`}`;
  throw cliErrorOf(plan.problems.map((p) => (p.kind.startsWith("parameter-") ? `--param: ${describeProblem(p)}` : `${where}: ${describeProblem(p)}`)));
}

/** "no combination applies": every combination was skipped for this case table. */
export function noRowsError(plan: Plan, file: string): CliError {
  const skipped = plan.combinations.filter((c) => c.skipped !== null).map((c) => `${c.combination.id} (${c.skipped})`);
  return new CliError(`${file}: no combination of ${plan.ruleset.file.id} applies to this case table${skipped.length > 0 ? `: ${skipped.join("; ")}` : ""}`);
}

/** Cautions and identity: on stdout before a table, on stderr beside csv and json. */
export async function writePreamble(io: Io, prepared: Pick<Prepared, "chosen" | "format"> & { plan: Plan | null }): Promise<void> {
  const target = isMachineFormat(prepared.format) ? io.err : io.out;
  for (const line of preambleLines(prepared.chosen, prepared.plan, prepared.format)) target.line(line);
  await io.err.flush();
}

/** What the case file options say, read and checked. */
export function caseFileOptions(options: CaseOptions, delimiter: string, map: CaseMap): CaseFileOptions {
  return { layout: layoutOf(options.layout), idColumns: idColumnsOf(options.idColumns), delimiter, map, sheet: options.sheet, range: options.range };
}

export function layoutOf(option: string): Layout {
  const v = option.trim().toLowerCase();
  if (v === "rows" || v === "columns" || v === "auto") return v;
  throw new CliError(`--layout: "${option}" is not a layout (rows: cases down the first column; columns: cases across the header row; auto)`);
}

export function idColumnsOf(option: string): number {
  const n = Number(option);
  if (!Number.isInteger(n) || n < 1 || n > 50) throw new CliError(`--id-columns: "${option}" is not a whole number from 1 to 50`);
  return n;
}

/** A core problem's text, with how to lift the row limit where that is what stopped it. */
export function withRowLimitHint(p: Problem): string {
  return p.kind === "too-many-rows" ? `${describeProblem(p)} (raise the limit with --row-limit N)` : describeProblem(p);
}

/** --row-limit: a whole number of rows, at least 1. */
export function rowLimitOf(option: string): number {
  const n = Number(option.replace(/[_,]/g, ""));
  if (!Number.isInteger(n) || n < 1) throw new CliError(`--row-limit: "${option}" is not a whole number of rows`);
  return n;
}

export function delimiterOf(option: string): string {
  const d = option === "tab" || option === "\\t" ? "\t" : option;
  if (d.length !== 1 || /[\r\n"]/.test(d)) throw new CliError(`--delimiter: "${option}" is not one character (",", ";" or tab)`);
  return d;
}

/**
 * A value about to be written must be a finite number: never NaN or Infinity in
 * an output. Otherwise the core's words, naming the result and the concrete row,
 * at `place` ("line 12", or "line 3, column A").
 */
export function finiteOrFail(value: number, file: string, place: string, result: string, rowLabel: string): number {
  if (Number.isFinite(value)) return value;
  throw notFiniteError(file, place, result, rowLabel);
}

export function notFiniteError(file: string, place: string, result: string, rowLabel: string): CliError {
  return new CliError(`${file} ${place}: ${notFiniteProblem(JSON.stringify(result), rowLabel).message}`);
}
