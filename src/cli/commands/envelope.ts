/** `loadwright envelope FILE`: per component or result row, the largest and smallest value with the row that gives each. */
import { availableParallelism, loadavg } from "node:os";
import { blockExtremesEvaluator, compiledPlanOf, extremesBlock, labelOf } from "../../core/index.js";
import { CliError } from "../cliError.js";
import { parameterInput } from "../input/paramOption.js";
import { csvField, jsonNumber, numberText } from "../output/cells.js";
import { streamedJsonStart } from "../output/preamble.js";
import { rowTexts } from "../output/rowTexts.js";
import { rowWriter } from "../output/rowWriter.js";
import { notFiniteError, noRowsError, prepare, writePreamble, type CaseOptions, type Io } from "./common.js";
import { envelopeOnTwoThreads } from "./envelopeThreads.js";
import { resultBatches } from "./results.js";

export interface EnvelopeOptions extends CaseOptions {
  threads?: string;
}

/** Files from this size on are worth a second thread (starting it costs about a tenth of a second). */
const TWO_THREADS_FROM_BYTES = 64e6;

export async function envelopeCommand(file: string, options: EnvelopeOptions, io: Io): Promise<void> {
  const threads = threadsOf(options.threads ?? "auto");
  const prepared = await prepare(file, options, io);
  const { plan, format, input, chosen } = prepared;
  if (plan.rowCount === 0) throw noRowsError(plan, file);
  await writePreamble(io, prepared);
  const { out } = io;
  if (format === "csv" && input.kind === "stream") {
    const two = threads === 2 || (threads === "auto" && input.totalBytes >= TWO_THREADS_FROM_BYTES && coreToSpare());
    if (two) return envelopeOnTwoThreads(file, input, chosen.ruleset, parameterInput(options.param), io);
  }
  const compiled = compiledPlanOf(plan);
  const evaluator = blockExtremesEvaluator(compiled);
  const width = compiled.maxTerms;
  let found = extremesBlock(compiled, 0);

  // Every result row, in file order: its envelope, checked finite, with the labels of its two rows (as `escape` writes them).
  async function each(write: (id: string, max: number, maxLabel: string, min: number, minLabel: string) => void | Promise<void>, escape = (label: string) => label): Promise<boolean> {
    const rowText = rowTexts(compiled, escape);
    for await (const batch of resultBatches(input, "envelope")) {
      if (found.capacity < batch.count) found = extremesBlock(compiled, batch.count);
      const done = evaluator.evaluate(batch.values, batch.count, found, true);
      if (done < 0) throw noRowsError(plan, file);
      for (let n = 0; n < done; n++) {
        const maxLabel = rowText(found.maxBranch[n], found.maxChoices, n * width, found.maxRow[n]);
        const minLabel = rowText(found.minBranch[n], found.minChoices, n * width, found.minRow[n]);
        const written = write(batch.ids[n], found.maxValue[n], maxLabel, found.minValue[n], minLabel);
        // Awaited only where the writer waits: an await of every row would cost a turn of the event loop each.
        if (written) await written;
      }
      // A row without a finite value (a sum past the largest number) is refused, naming the result and the row.
      if (done < batch.count) throw notFiniteError(file, batch.place(done), batch.ids[done], labelOf(compiled, found.faultBranch, found.faultChoices));
      await out.maybeFlush();
      if (out.isClosed) return false;
    }
    return true;
  }

  if (format === "json") {
    out.line(streamedJsonStart(chosen, plan, "envelope"));
    let first = true;
    const done = await each((result, max, maxRow, min, minRow) => {
      const entry = { result, max: { value: jsonNumber(max), row: maxRow }, min: { value: jsonNumber(min), row: minRow } };
      out.line(`${first ? "" : ","}${JSON.stringify(entry)}`);
      first = false;
    });
    if (!done) return;
    out.line("]}");
    await out.flush();
    return;
  }

  if (format === "csv") {
    // The hot path of a large export: a few labels, written again and again, escaped once each.
    out.line("result,max,max row,min,min row");
    const done = await each((id, max, maxRow, min, minRow) => {
      out.line(`${csvField(id)},${numberText(max)},${maxRow},${numberText(min)},${minRow}`);
    }, csvField);
    if (done) await out.flush();
    return;
  }

  const writer = rowWriter(format, out, [
    { title: "result" },
    { title: "max", align: "right" },
    { title: "max row" },
    { title: "min", align: "right" },
    { title: "min row" },
  ]);
  const done = await each((id, max, maxRow, min, minRow) => writer.row([id, numberText(max), maxRow, numberText(min), minRow]));
  if (done) await writer.end();
}

/**
 * Whether a second core is likely free: the machine has two or more and the
 * last minute's load leaves one. On a busy machine a second thread only adds
 * work (passing blocks between threads) and memory (a second heap).
 */
function coreToSpare(): boolean {
  const cores = availableParallelism();
  return cores >= 2 && loadavg()[0] <= cores - 1.5;
}

/** --threads: 1, 2, or auto (two for a streamed CSV output of a large file, where a core is free). */
function threadsOf(option: string): 1 | 2 | "auto" {
  const v = option.trim().toLowerCase();
  if (v === "1") return 1;
  if (v === "2") return 2;
  if (v === "auto") return "auto";
  throw new CliError(`--threads: "${option}" is not 1, 2 or auto`);
}
