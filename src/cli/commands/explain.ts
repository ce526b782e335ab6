/**
 * `loadwright explain FILE --row LABEL --component NAME`: one value's
 * derivation as a checker writes it out — combination and clause, the factor
 * on every case and where it comes from, the products and their sum. In a
 * streamed file only the named result row is kept.
 */
import { describeProblem, didYouMean, explain, NearestName, type CaseTable } from "../../core/index.js";
import { cliErrorOf, CliError } from "../cliError.js";
import { jsonNumber, numberText } from "../output/cells.js";
import { jsonHeader } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import { problemsInFile } from "../input/caseInput.js";
import { csvLocator, type CellLocator } from "../input/locate.js";
import { noRowsError, prepare, writePreamble, type CaseOptions, type Io } from "./common.js";

export interface ExplainOptions extends CaseOptions {
  row: string;
  component: string;
}

export async function explainCommand(file: string, options: ExplainOptions, io: Io): Promise<void> {
  const prepared = await prepare(file, options, io);
  const { plan, format, chosen, input } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  const wanted = options.component.trim();
  let table: CaseTable;
  let at: CellLocator;
  if (input.kind === "table") {
    table = input.table;
    at = input.at;
  } else {
    let found: { values: Float64Array; line: number } | null = null;
    const guess = new NearestName(wanted);
    for await (const row of input.rows) {
      if (row.id === wanted) {
        found = row;
        break; // leaving the loop closes the file
      }
      guess.consider(row.id);
    }
    if (!found) throw new CliError(`--component: no result row of ${file} is named "${wanted}"${didYouMean(guess.best)}`);
    table = { orientation: "columns", cases: input.cases, components: [wanted], values: [found.values], map: input.map, componentPlaces: [{ row: found.line - 1, column: 0 }] };
    at = csvLocator((r) => r + 1);
  }
  const row = /^\d+$/.test(options.row.trim()) ? Number(options.row.trim()) : options.row;
  const result = explain(plan, table, row, wanted);
  if (!result.ok) {
    // A total past the largest number is the file's; the others are about the options given.
    if (result.problems.some((p) => p.kind === "result-not-finite")) throw problemsInFile(file, result.problems, at);
    throw cliErrorOf(result.problems.map((p) => `${p.kind === "unknown-component" ? "--component" : "--row"}: ${describeProblem(p)}`));
  }
  const x = result.value;
  await writePreamble(io, prepared);

  if (format === "json") {
    const body = {
      ...jsonHeader(chosen, plan),
      explanation: {
        label: x.label,
        combination: x.combination,
        clause: x.clause,
        expression: x.expression,
        component: x.component,
        lines: x.lines.map((l) => ({ case: l.case, factor: jsonNumber(l.factor), why: l.why, caseValue: jsonNumber(l.caseValue), product: jsonNumber(l.product) })),
        total: jsonNumber(x.total),
        parameters: x.parameters.map((p) => ({ name: p.name, value: typeof p.value === "number" ? jsonNumber(p.value) : p.value, given: p.given })),
        text: x.text,
      },
    };
    io.out.line(JSON.stringify(body, null, 2));
    await io.out.flush();
    return;
  }
  if (format === "csv") {
    const writer = rowWriter("csv", io.out, [{ title: "case" }, { title: "factor" }, { title: "why" }, { title: "case value" }, { title: "product" }]);
    for (const l of x.lines) await writer.row([l.case, numberText(l.factor), l.why, numberText(l.caseValue), numberText(l.product)]);
    await writer.row(["total", "", x.label, "", numberText(x.total)]);
    await writer.end();
    return;
  }
  for (const line of x.text) io.out.line(format === "md" ? `    ${line}` : line);
  await io.out.flush();
}
