/**
 * The one reader of result rows (src/core/cases/resultRows.ts) serves both the
 * whole-table reader (readCaseTable: worksheet ranges, JSON files, small CSV
 * files) and the command line's streamed CSV reader. Held here on generated
 * tables — repeated ids, blank ids, text and blanks among the values, headers
 * that name nothing: both give the same result ids and the same values, bit
 * for bit, or refuse the same first bad row with the same sentences at the
 * same lines and columns. The CSV records of the whole-table side come from
 * csv-parse (csv.js.org/parse, the project's general CSV reader).
 */
import { parse } from "csv-parse/sync";
import fc from "fast-check";
import { describe } from "vitest";
import { EMPTY_CASE_MAP, readCaseTable, type Problem } from "../../src/core/index.js";
import { cliErrorOf, CliError } from "../../src/cli/cliError.js";
import { openCases } from "../../src/cli/input/caseInput.js";
import { csvLocator, describeInFile } from "../../src/cli/input/locate.js";
import { fuzzClassAsync } from "../fuzz/fuzzClass.js";
import { shown, type Verdict } from "../fuzz/robustness.js";
import { columnsTable, csvText, csvValue, RULESET, tableRows, type TableSpec } from "./caseGenerators.js";
import { scratch } from "./cliInProcess.js";
import { shippedRuleset } from "./plainEnvelope.js";
import { locatedLine } from "./verdicts.js";

const files = scratch("readers");
const ruleset = shippedRuleset(RULESET);

type Read = { rows: [string, string[]][] } | { error: string[] } | { noRows: true };

/** A double's bits as text: −0 and 0, and every last digit, told apart. */
const bits = (v: number) => (Object.is(v, -0) ? "-0" : v.toString(16));

const NO_ROWS = /(the case table has no result rows|needs a header row, a header column and at least one value)/;

async function streamed(file: string): Promise<Read> {
  try {
    const input = await openCases(file, ruleset, { layout: "columns", idColumns: 1, delimiter: ",", map: EMPTY_CASE_MAP });
    if (input.kind !== "stream") throw new Error("a cases-as-columns CSV file is streamed");
    const rows: [string, string[]][] = [];
    for await (const row of input.rows) rows.push([row.id, [...row.values].map(bits)]);
    return { rows };
  } catch (e) {
    if (!(e instanceof CliError)) throw e;
    const lines = [e.message, ...e.more];
    return NO_ROWS.test(lines[0]) ? { noRows: true } : { error: lines };
  }
}

/** The whole-table reader on csv-parse's records; its refusal as the command line words it for the first row that has a problem. */
function whole(file: string, text: string): Read {
  const matrix = (parse(text, { bom: true, relax_column_count: true }) as string[][]).map((r) => (r.every((c) => c.trim() === "") ? [] : r));
  const table = readCaseTable(matrix, ruleset, { orientation: "columns", numbersAsText: true });
  if (table.ok) return { rows: table.value.components.map((id, k) => [id, [...table.value.values[k]].map(bits)]) };
  if (table.problems.some((p) => NO_ROWS.test(p.message))) return { noRows: true };
  const first = Math.min(...table.problems.map((p) => p.place.row ?? 0));
  const ofFirst: Problem[] = table.problems.filter((p) => (p.place.row ?? 0) === first);
  const error = cliErrorOf(ofFirst.map((p) => describeInFile(file, p, csvLocator((row) => row + 1))));
  return { error: [error.message, ...error.more] };
}

async function bothReaders(t: TableSpec): Promise<Verdict> {
  const text = csvText(tableRows(t));
  const file = files.file("csv", text);
  const a = await streamed(file);
  const b = whole(file, text);
  // The streamed side may add a hint after a header it does not know (--id-columns); the sentences before it are the core's.
  const withoutHint = (r: Read): Read => ("error" in r ? { error: r.error.filter((l) => !/^if column [A-Z]+ is part of each result row's name/.test(l)) } : r);
  const same = JSON.stringify(withoutHint(a)) === JSON.stringify(withoutHint(b));
  const located = !("error" in a) || a.error.every((l) => locatedLine(l, file));
  return { located, wrongOutput: same ? null : `streamed ${JSON.stringify(a)}; whole ${JSON.stringify(b)}` };
}

/**
 * Tables where ids repeat often, some are blank, and values are now and then
 * not numbers. The last header is never blank: there the streamed reader has a
 * rule of its own, about the header row rather than the rows (a value under a
 * trailing blank header is "a value in a column whose header is blank"; the
 * whole-table reader says "the case header is empty"), both located.
 */
const repeatedIds: fc.Arbitrary<TableSpec> = columnsTable(csvValue, { maxRows: 6 })
  .filter((t) => t.headers[t.headers.length - 1].trim() !== "")
  .chain((t) => fc.array(fc.constantFrom("C1", "C2", "C1 ", " C2", "", "row 3", "C3"), { minLength: t.ids.length, maxLength: t.ids.length }).map((ids) => ({ ...t, ids })));

describe("the two readers of result rows", () => {
  fuzzClassAsync(
    "result rows: the streamed and the whole-table reader agree (ids, repeated and blank ids, values, refusals)",
    0.03,
    repeatedIds,
    bothReaders,
    (t) => shown(csvText(tableRows(t))),
  );
});
