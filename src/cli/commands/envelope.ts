/** `loadwright envelope FILE`: per component or result row, the largest and smallest value with the row that gives each. */
import { extremes } from "../../core/index.js";
import { jsonNumber, numberText } from "../output/cells.js";
import { CAUTIONS, parametersJson, rulesetJson } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import { finiteOrFail, noRowsError, prepare, writePreamble, type CaseOptions, type Io } from "./common.js";
import { labelCache } from "./labelCache.js";
import { resultsOf } from "./results.js";

export async function envelopeCommand(file: string, options: CaseOptions, io: Io): Promise<void> {
  const prepared = await prepare(file, options, io);
  const { plan, format, input, chosen } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  await writePreamble(io, prepared);
  const { out } = io;
  const label = labelCache(plan);

  if (format === "json") {
    out.line(`{"ruleset":${JSON.stringify(rulesetJson(chosen))},"parameters":${JSON.stringify(parametersJson(plan))},"cautions":${JSON.stringify(CAUTIONS)},"envelope":[`);
    let first = true;
    for await (const r of resultsOf(input, "envelope")) {
      const e = extremes(plan, r.values);
      if (!e) throw noRowsError(plan, file);
      const entry = {
        result: r.id,
        max: { value: jsonNumber(finiteOrFail(e.max.value, file, r.where)), row: label(e.max.row) },
        min: { value: jsonNumber(finiteOrFail(e.min.value, file, r.where)), row: label(e.min.row) },
      };
      out.line(`${first ? "" : ","}${JSON.stringify(entry)}`);
      first = false;
      await out.maybeFlush();
      if (out.isClosed) return;
    }
    out.line("]}");
    await out.flush();
    return;
  }

  const writer = rowWriter(format, out, [
    { title: "result" },
    { title: "max", align: "right" },
    { title: "max row" },
    { title: "min", align: "right" },
    { title: "min row" },
  ]);
  for await (const r of resultsOf(input, "envelope")) {
    const e = extremes(plan, r.values);
    if (!e) throw noRowsError(plan, file);
    await writer.row([
      r.id,
      numberText(finiteOrFail(e.max.value, file, r.where)),
      label(e.max.row),
      numberText(finiteOrFail(e.min.value, file, r.where)),
      label(e.min.row),
    ]);
    if (out.isClosed) return;
  }
  await writer.end();
}
