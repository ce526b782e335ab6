/** `loadwright envelope FILE`: per component or result row, the largest and smallest value with the row that gives each. */
import { envelopeOf } from "../../core/index.js";
import { jsonNumber, numberText } from "../output/cells.js";
import { streamedJsonStart } from "../output/preamble.js";
import { rowWriter } from "../output/rowWriter.js";
import { finiteOrFail, noRowsError, prepare, writePreamble, type CaseOptions, type Io } from "./common.js";
import { resultsOf } from "./results.js";

export async function envelopeCommand(file: string, options: CaseOptions, io: Io): Promise<void> {
  const prepared = await prepare(file, options, io);
  const { plan, format, input, chosen } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  await writePreamble(io, prepared);
  const { out } = io;

  if (format === "json") {
    out.line(streamedJsonStart(chosen, plan, "envelope"));
    let first = true;
    for await (const r of resultsOf(input, "envelope")) {
      const e = envelopeOf(plan, r.id, r.values);
      if (!e) throw noRowsError(plan, file);
      const entry = {
        result: r.id,
        max: { value: jsonNumber(finiteOrFail(e.max.value, file, r.where)), row: e.max.label },
        min: { value: jsonNumber(finiteOrFail(e.min.value, file, r.where)), row: e.min.label },
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
    const e = envelopeOf(plan, r.id, r.values);
    if (!e) throw noRowsError(plan, file);
    await writer.row([
      r.id,
      numberText(finiteOrFail(e.max.value, file, r.where)),
      e.max.label,
      numberText(finiteOrFail(e.min.value, file, r.where)),
      e.min.label,
    ]);
    if (out.isClosed) return;
  }
  await writer.end();
}
