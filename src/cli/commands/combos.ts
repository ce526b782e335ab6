/**
 * `loadwright combos`: the concrete combination rows a checker reads, each
 * with its clause and the factor on every load symbol (or, with --cases, on
 * every case of that table).
 */
import { comboRows } from "../../core/index.js";
import { CliError } from "../cliError.js";
import { caseMapFrom } from "../input/caseMapOption.js";
import { openCases, tableShape } from "../input/caseInput.js";
import { parameterInput } from "../input/paramOption.js";
import { chooseRuleset } from "../input/rulesetOption.js";
import { jsonNumber, numberText } from "../output/cells.js";
import { chooseFormat } from "../output/format.js";
import { jsonHeader } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import { caseFileOptions, delimiterOf, planOrFail, rowLimitOf, writePreamble, type CaseOptions, type Io, withRowLimitHint } from "./common.js";

/** The case options read the case file given with --cases, which only names the columns of the list. */
export interface CombosOptions extends CaseOptions {
  cases?: string;
  rowLimit: string;
}

export async function combosCommand(options: CombosOptions, io: Io): Promise<void> {
  const format = chooseFormat(options.format, io.stdoutIsTerminal);
  const rowLimit = rowLimitOf(options.rowLimit);
  const chosen = chooseRuleset(options.ruleset);
  const parameters = parameterInput(options.param);
  let shape = null;
  if (options.cases !== undefined) {
    const delimiter = delimiterOf(options.delimiter);
    const map = await caseMapFrom(options.map, chosen.ruleset, delimiter);
    const input = await openCases(options.cases, chosen.ruleset, caseFileOptions(options, delimiter, map));
    shape = tableShape(input);
    if (input.kind === "stream") await input.close();
  }
  const plan = planOrFail(chosen, parameters, shape);
  const listed = comboRows(plan, rowLimit);
  if (!listed.ok) throw new CliError(`ruleset ${chosen.ruleset.file.id}: ${listed.problems.map(withRowLimitHint).join("; ")}`);
  const names = plan.cases.map((c) => c.header);
  await writePreamble(io, { chosen, plan, format });

  if (format === "json") {
    const body = {
      ...jsonHeader(chosen, plan),
      factorsOn: names,
      skipped: plan.combinations.filter((c) => c.skipped !== null).map((c) => ({ combination: c.combination.id, reason: c.skipped })),
      rows: listed.value.map((r) => ({
        label: r.label,
        combination: r.combination,
        clause: r.clause,
        factors: Object.fromEntries(names.map((n, k) => [n, jsonNumber(r.factors[k])])),
      })),
    };
    io.out.line(JSON.stringify(body, null, 2));
    await io.out.flush();
    return;
  }
  const writer = rowWriter(format, io.out, [
    { title: "label" },
    { title: "combination" },
    { title: "clause" },
    ...names.map((n) => ({ title: n, align: "right" as const })),
  ]);
  for (const r of listed.value) {
    const factors = r.factors.map((f) => (f === 0 && format !== "csv" ? "" : numberText(f)));
    await writer.row([r.label, r.combination, r.clause, ...factors]);
  }
  await writer.end();
}
