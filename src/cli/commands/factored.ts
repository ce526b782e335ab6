/** `loadwright factored FILE`: every concrete row with the value of every component (within the row limit). */
import { factored, type CaseTable } from "../../core/index.js";
import { CliError } from "../cliError.js";
import { problemsInFile, type CaseInput } from "../input/caseInput.js";
import { csvLocator, type CellLocator } from "../input/locate.js";
import { jsonNumber, numberText } from "../output/cells.js";
import { jsonHeader } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import { noRowsError, prepare, rowLimitOf, writePreamble, type CaseOptions, type Io, withRowLimitHint } from "./common.js";

export async function factoredCommand(file: string, options: CaseOptions & { rowLimit: string }, io: Io): Promise<void> {
  const rowLimit = rowLimitOf(options.rowLimit);
  const prepared = await prepare(file, options, io);
  const { plan, format, chosen } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  const table = await wholeTable(prepared.input);
  const rows = factored(plan, table, rowLimit);
  if (!rows.ok) {
    // A value past the largest number is placed in the file; the row limit is about the whole table.
    if (rows.problems.some((p) => p.kind === "result-not-finite")) throw problemsInFile(file, rows.problems, locatorOf(prepared.input));
    throw new CliError(`${file}: ${rows.problems.map(withRowLimitHint).join("; ")}`);
  }
  await writePreamble(io, prepared);

  if (format === "json") {
    const body = {
      ...jsonHeader(chosen, plan),
      components: table.components,
      rows: rows.value.map((r) => ({ label: r.label, combination: r.combination, values: r.values.map(jsonNumber) })),
    };
    io.out.line(JSON.stringify(body));
    await io.out.flush();
    return;
  }
  const writer = rowWriter(format, io.out, [
    { title: "label" },
    { title: "combination" },
    ...table.components.map((c) => ({ title: c, align: "right" as const })),
  ]);
  for (const r of rows.value) {
    await writer.row([r.label, r.combination, ...r.values.map(numberText)]);
    if (io.out.isClosed) return;
  }
  await writer.end();
}

/** A streamed file gathered into one table: listing every row needs every result at once. Each result is placed at its line's first cell. */
export async function wholeTable(input: CaseInput): Promise<CaseTable> {
  if (input.kind === "table") return input.table;
  const components: string[] = [];
  const values: Float64Array[] = [];
  const componentPlaces: { row: number; column: number }[] = [];
  for await (const row of input.rows) {
    components.push(row.id);
    values.push(row.values);
    componentPlaces.push({ row: row.line - 1, column: 0 });
  }
  return { orientation: "columns", cases: input.cases, components, values, map: input.map, componentPlaces };
}

/** The file's line and column of a cell of the table wholeTable gives. */
export function locatorOf(input: CaseInput): CellLocator {
  return input.kind === "table" ? input.at : csvLocator((row) => row + 1);
}
