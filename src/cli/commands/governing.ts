/**
 * `loadwright governing FILE`: the rows chosen by criteria ("max V", "min N",
 * "max |M|", "max N/2000 + M/350"), each with the concurrent value of every
 * component in that same row.
 *
 * A cases-as-rows table is small and goes to the core whole. A cases-as-columns
 * file is streamed: a first pass keeps only the result rows the criteria name
 * and chooses the governing rows from them (exactly, as the core does for a
 * small table); further passes write every result's value in each governing
 * row. Memory stays flat in the number of result rows, whatever the criteria.
 */
import { criterionNames, governing, parseCriterion, rowValue, defaultCriteria, didYouMean, NearestName, type CaseTable, type Criterion, type GoverningRow } from "../../core/index.js";
import { cliErrorOf, CliError } from "../cliError.js";
import { openCases, problemsInFile, type CaseStream } from "../input/caseInput.js";
import { jsonNumber, numberText } from "../output/cells.js";
import { jsonHeader, streamedJsonStart } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import { caseFileOptions, delimiterOf, finiteOrFail, idColumnsOf, noRowsError, prepare, rowLimitOf, writePreamble, type CaseOptions, type Io, type Prepared, withRowLimitHint } from "./common.js";
import { resultsOf } from "./results.js";
import { caseMapFrom } from "../input/caseMapOption.js";
import { csvLocator } from "../input/locate.js";

export interface GoverningCommandOptions extends CaseOptions {
  criterion: string[];
  rowLimit: string;
}

export async function governingCommand(file: string, options: GoverningCommandOptions, io: Io): Promise<void> {
  rowLimitOf(options.rowLimit);
  const prepared = await prepare(file, options, io);
  const { plan, input } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  if (input.kind === "table") return governingOfTable(file, prepared, input.table, options, io);
  return governingOfStream(file, prepared, input, options, io);
}

export function criteriaOrFail(texts: string[], components: readonly string[]): Criterion[] {
  const lines: string[] = [];
  const criteria: Criterion[] = [];
  for (const text of texts) {
    const parsed = parseCriterion(text, components);
    if (parsed.ok) criteria.push(parsed.value);
    else for (const p of parsed.problems) lines.push(`--criterion "${text}"${p.place.position !== undefined ? `, character ${p.place.position}` : ""}: ${p.message}`);
  }
  if (lines.length > 0) throw cliErrorOf(lines);
  return criteria;
}

async function governingOfTable(file: string, prepared: Prepared, table: CaseTable, options: GoverningCommandOptions, io: Io): Promise<void> {
  const { plan, format, chosen } = prepared;
  const texts = options.criterion;
  const criteria = texts.length > 0 ? criteriaOrFail(texts, table.components) : defaultCriteria(table);
  const result = governing(plan, table, criteria, { rowLimit: rowLimitOf(options.rowLimit) });
  if (!result.ok) {
    if (prepared.input.kind === "table" && result.problems.some((p) => p.kind === "result-not-finite")) throw problemsInFile(file, result.problems, prepared.input.at);
    throw cliErrorOf(result.problems.map((p) => `${file}: ${withRowLimitHint(p)}`));
  }
  await writePreamble(io, prepared);
  if (format === "json") {
    const body = {
      ...jsonHeader(chosen, plan),
      rows: result.value.map((g) => ({
        criteria: g.criteria,
        label: g.label,
        combination: plan.combinations[g.row.combination].combination.id,
        values: Object.fromEntries(table.components.map((c, k) => [c, jsonNumber(g.values[k])])),
      })),
    };
    io.out.line(JSON.stringify(body, null, 2));
    await io.out.flush();
    return;
  }
  const writer = rowWriter(format, io.out, [
    { title: "criteria" },
    { title: "label" },
    ...table.components.map((c) => ({ title: c, align: "right" as const })),
  ]);
  for (const g of result.value) await writer.row([g.criteria.join("; "), g.label, ...g.values.map(numberText)]);
  await writer.end();
}

function idColumnsText(n: number): string {
  return n === 1 ? "a result row's id is its first cell" : `a result row's id is its first ${n} cells joined with " / "`;
}

async function governingOfStream(file: string, prepared: Prepared, first: CaseStream, options: GoverningCommandOptions, io: Io): Promise<void> {
  const { plan, format, chosen } = prepared;
  if (options.criterion.length === 0) {
    await first.close();
    throw new CliError(
      `${file}: cases are columns here, so every result row is a component; say which rows govern with --criterion (e.g. --criterion "max [C1 top]"), or use \`loadwright envelope\` for every result's largest and smallest value`,
    );
  }
  // Pass 1: keep the result rows the criteria name (as the parser reads them, not their functions);
  // note the closest id to each name that is missing.
  const wanted = new Set(options.criterion.flatMap(criterionNames));
  const found = new Map<string, Float64Array>();
  const lineOf = new Map<string, number>();
  const closest = new Map([...wanted].map((name) => [name, new NearestName(name)]));
  for await (const r of resultsOf(first, "governing (choosing rows)")) {
    if (wanted.has(r.id)) {
      if (!found.has(r.id)) {
        found.set(r.id, Float64Array.from(r.values));
        if (r.line !== null) lineOf.set(r.id, r.line);
      }
      continue;
    }
    for (const name of wanted) if (!found.has(name)) closest.get(name)?.consider(r.id);
  }
  const missing = [...wanted].filter((n) => !found.has(n));
  if (missing.length > 0) {
    throw cliErrorOf(
      missing.map((name) => {
        const text = options.criterion.find((t) => criterionNames(t).includes(name)) ?? "";
        return `--criterion "${text}": no result row of ${file} is named "${name}"${didYouMean(closest.get(name)?.best)} (${idColumnsText(idColumnsOf(options.idColumns))}; write names with spaces in [brackets])`;
      }),
    );
  }
  const components = [...found.keys()];
  const reduced: CaseTable = {
    orientation: "columns",
    cases: first.cases,
    components,
    values: components.map((c) => found.get(c) as Float64Array),
    map: first.map,
    componentPlaces: components.map((c) => ({ row: (lineOf.get(c) ?? 1) - 1, column: 0 })),
  };
  const criteria = criteriaOrFail(options.criterion, components);
  const chosenRows = governing(plan, reduced, criteria, { rowLimit: rowLimitOf(options.rowLimit) });
  if (!chosenRows.ok) {
    if (chosenRows.problems.some((p) => p.kind === "result-not-finite")) throw problemsInFile(file, chosenRows.problems, csvLocator((row) => row + 1));
    throw cliErrorOf(chosenRows.problems.map((p) => `${file}: ${withRowLimitHint(p)}`));
  }
  const rows = chosenRows.value;
  await writePreamble(io, prepared);

  const reopen = async (): Promise<CaseStream> => {
    const delimiter = delimiterOf(options.delimiter);
    const map = await caseMapFrom(options.map, chosen.ruleset, delimiter);
    const again = await openCases(file, chosen.ruleset, caseFileOptions(options, delimiter, map));
    if (again.kind !== "stream") throw new CliError(`${file}: the file changed while it was read`);
    return again;
  };

  if (format === "json") {
    io.out.line(streamedJsonStart(chosen, plan, "rows"));
    for (let g = 0; g < rows.length; g++) {
      const row = rows[g];
      const head = { criteria: row.criteria, label: row.label, combination: plan.combinations[row.row.combination].combination.id };
      io.out.line(`${g === 0 ? "" : ","}${JSON.stringify(head).slice(0, -1)},"values":{`);
      let firstValue = true;
      for await (const r of resultsOf(await reopen(), `governing (row ${g + 1} of ${rows.length})`)) {
        const v = finiteOrFail(rowValue(plan, row.row, r.values), file, r.place, r.id, row.label);
        io.out.line(`${firstValue ? "" : ","}${JSON.stringify(r.id)}:${JSON.stringify(jsonNumber(v))}`);
        firstValue = false;
        await io.out.maybeFlush();
        if (io.out.isClosed) return;
      }
      io.out.line("}}");
    }
    io.out.line("]}");
    await io.out.flush();
    return;
  }

  // People's formats and CSV: one line per result, one column per governing row (named G1, G2 … in the legend).
  const legend = rows.map((g, k) => `G${k + 1}: ${g.criteria.join("; ")} → ${g.label}`);
  const columnTitle = (g: GoverningRow, k: number) => (format === "csv" ? `${g.criteria.join("; ")} → ${g.label}` : `G${k + 1}`);
  if (format !== "csv") {
    for (const line of legend) io.out.line(line);
    io.out.line("");
  }
  const idTitle = first.idHeaders.filter((h) => h !== "").join(" / ") || "result";
  const writer = rowWriter(format, io.out, [{ title: idTitle }, ...rows.map((g, k) => ({ title: columnTitle(g, k), align: "right" as const }))]);
  for await (const r of resultsOf(await reopen(), "governing (concurrent values)")) {
    await writer.row([r.id, ...rows.map((g) => numberText(finiteOrFail(rowValue(plan, g.row, r.values), file, r.place, r.id, g.label)))]);
    if (io.out.isClosed) return;
  }
  await writer.end();
}

