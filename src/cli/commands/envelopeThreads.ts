/**
 * `loadwright envelope` on two cores: this thread reads the streamed file and
 * checks every row as usual (ids, values, errors in file order), and hands each
 * block of result rows to a worker (envelopeWorker.ts) that evaluates it and
 * writes its CSV lines; the lines are written here in file order, so the output
 * is byte for byte what one thread writes. A few blocks are in flight at once.
 */
import { Worker } from "node:worker_threads";
import type { ParameterInput, Ruleset } from "../../core/index.js";
import type { CaseStream } from "../input/caseInput.js";
import { notFiniteError, type Io } from "./common.js";
import type { EnvelopeBlock, EnvelopeLines, EnvelopeWorkerSetup } from "./envelopeWorker.js";
import { resultBatches } from "./results.js";

/** Blocks handed over and not yet written: enough to keep both threads busy, few enough to keep memory flat. */
const IN_FLIGHT = 2;

interface Sent {
  lines: Promise<EnvelopeLines>;
  ids: string[];
  fileLines: Int32Array;
}

export async function envelopeOnTwoThreads(file: string, input: CaseStream, ruleset: Ruleset, parameters: ParameterInput, io: Io): Promise<void> {
  const { out } = io;
  const setup: EnvelopeWorkerSetup = {
    file: ruleset.file,
    parameters,
    cases: input.cases,
    modes: [...input.map.modes],
    reversible: [...input.map.reversible],
  };
  // A small young generation: the worker keeps nothing between blocks, and memory must stay flat.
  const worker = new Worker(new URL("./envelopeWorker.js", import.meta.url), { workerData: setup, resourceLimits: { maxYoungGenerationSizeMb: 8 } });
  const waiting = new Map<number, { resolve: (lines: EnvelopeLines) => void; reject: (e: unknown) => void }>();
  const failAll = (e: unknown) => {
    for (const w of waiting.values()) w.reject(e);
    waiting.clear();
  };
  worker.on("message", (lines: EnvelopeLines) => {
    waiting.get(lines.seq)?.resolve(lines);
    waiting.delete(lines.seq);
  });
  worker.on("error", failAll);
  worker.on("exit", (code) => failAll(new Error(`the evaluating thread stopped (${code})`)));

  const sent: Sent[] = [];
  let written = true;
  const writeOldest = async () => {
    const oldest = sent.shift() as Sent;
    const lines = await oldest.lines;
    if (lines.text !== "") out.line(lines.text.slice(0, -1));
    if (lines.stoppedAt >= 0) {
      // A result that is not finite: nothing after it is written.
      written = false;
      throw notFiniteError(file, `line ${oldest.fileLines[lines.stoppedAt]}`, oldest.ids[lines.stoppedAt], lines.rowLabel);
    }
    await out.maybeFlush();
  };

  out.line("result,max,max row,min,min row");
  let seq = 0;
  try {
    try {
      for await (const batch of resultBatches(input, "envelope")) {
        const block: EnvelopeBlock = { seq: seq++, count: batch.count, ids: batch.ids.slice(0, batch.count), values: batch.values.slice(0, batch.count * batch.cases) };
        const lines = new Promise<EnvelopeLines>((resolve, reject) => waiting.set(block.seq, { resolve, reject }));
        worker.postMessage(block, [block.values.buffer as ArrayBuffer]);
        sent.push({ lines, ids: block.ids, fileLines: (batch.lines as Int32Array).slice(0, batch.count) });
        while (sent.length >= IN_FLIGHT) await writeOldest();
        if (out.isClosed) return;
      }
    } catch (e) {
      // A bad row read here: everything before it is written first, in file order (an earlier error comes first).
      if (written) while (sent.length > 0) await writeOldest();
      throw e;
    }
    while (sent.length > 0) await writeOldest();
    await out.flush();
  } finally {
    worker.removeAllListeners("exit");
    await worker.terminate();
  }
}
