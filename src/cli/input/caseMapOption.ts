/** `--map FILE`: a CSV of two-cell rows, [header, symbol] or [symbol, sum|each|orthogonal] (docs/case-tables.md). */
import { EMPTY_CASE_MAP, readCaseMap, type CaseMap, type Cell, type Ruleset } from "../../core/index.js";
import { CliError } from "../cliError.js";
import { problemsInFile } from "./caseInput.js";
import { readCsv } from "./csvRecords.js";
import { checkReadable } from "./fileAccess.js";
import { csvLocator } from "./locate.js";

export async function caseMapFrom(file: string | undefined, ruleset: Ruleset, delimiter: string): Promise<CaseMap> {
  if (file === undefined) return EMPTY_CASE_MAP;
  checkReadable(file, "case map");
  const rows: Cell[][] = [];
  const lines: number[] = [];
  for await (const record of readCsv(file, { delimiter }).records) {
    rows.push(record.cells);
    lines.push(record.line);
  }
  if (rows.length === 0) throw new CliError(`${file}: the case map is empty`);
  const map = readCaseMap(rows, ruleset);
  if (!map.ok) throw problemsInFile(file, map.problems, csvLocator((row) => lines[row] ?? row + 1));
  return map.value;
}
