/** Output formats: table and md for people, csv and json for programs. */
import { CliError } from "../cliError.js";

export const FORMATS = ["table", "csv", "json", "md"] as const;
export type Format = (typeof FORMATS)[number];

/** The --format given, or a table on a terminal and CSV into a pipe or file. */
export function chooseFormat(option: string | undefined, stdoutIsTerminal: boolean): Format {
  if (option === undefined) return stdoutIsTerminal ? "table" : "csv";
  const f = option.trim().toLowerCase();
  if ((FORMATS as readonly string[]).includes(f)) return f as Format;
  throw new CliError(`--format: "${option}" is not an output format (table, csv, json, md)`);
}

/** Machine formats keep stdout parseable: the ruleset identity and cautions go to standard error. */
export function isMachineFormat(format: Format): boolean {
  return format === "csv" || format === "json";
}
