/**
 * The second thread of a two-core `loadwright envelope … --format csv`: the
 * main thread reads and checks the file, this thread evaluates each block of
 * result rows and writes its CSV lines. It plans the same ruleset, parameters
 * and case headers as the main thread (planning is deterministic), so its
 * lines are the ones the main thread would have written.
 */
import { parentPort, workerData } from "node:worker_threads";
import { blockExtremesEvaluator, compiledPlanOf, extremesBlock, labelOf, loadRuleset, planForTable, type CaseMode, type LoadCase, type ParameterInput, type RulesetFile } from "../../core/index.js";
import { csvField, numberText } from "../output/cells.js";
import { rowTexts } from "../output/rowTexts.js";

export interface EnvelopeWorkerSetup {
  file: RulesetFile;
  parameters: ParameterInput;
  cases: LoadCase[];
  modes: [string, CaseMode][];
  reversible: [string, boolean][];
}

/** A block of result rows: ids, and values row after row. */
export interface EnvelopeBlock {
  seq: number;
  count: number;
  ids: string[];
  values: Float64Array;
}

/** The block's CSV lines; `stoppedAt` ≥ 0: the result row with a concrete row (`rowLabel`) that has no finite value (lines stop before it). */
export interface EnvelopeLines {
  seq: number;
  text: string;
  stoppedAt: number;
  rowLabel: string;
}

function start(setup: EnvelopeWorkerSetup): (block: EnvelopeBlock) => EnvelopeLines {
  const ruleset = loadRuleset(setup.file);
  if (!ruleset.ok) throw new Error("the ruleset the main thread loaded does not load here");
  const map = { symbolOf: new Map<string, string>(), modes: new Map(setup.modes), reversible: new Map(setup.reversible) };
  const plan = planForTable(ruleset.value, setup.parameters, { orientation: "columns", cases: setup.cases, components: [], values: [], map });
  if (!plan.ok) throw new Error("the plan the main thread made does not plan here");
  const compiled = compiledPlanOf(plan.value);
  const evaluator = blockExtremesEvaluator(compiled);
  const width = compiled.maxTerms;
  let found = extremesBlock(compiled, 0);
  const field = rowTexts(compiled, csvField);
  return (block) => {
    if (found.capacity < block.count) found = extremesBlock(compiled, block.count);
    const done = evaluator.evaluate(block.values, block.count, found, true);
    if (done < 0) throw new Error("the plan has no rows");
    let text = "";
    for (let n = 0; n < done; n++) {
      const maxLabel = field(found.maxBranch[n], found.maxChoices, n * width, found.maxRow[n]);
      const minLabel = field(found.minBranch[n], found.minChoices, n * width, found.minRow[n]);
      text += `${csvField(block.ids[n])},${numberText(found.maxValue[n])},${maxLabel},${numberText(found.minValue[n])},${minLabel}\n`;
    }
    if (done < block.count) return { seq: block.seq, text, stoppedAt: done, rowLabel: labelOf(compiled, found.faultBranch, found.faultChoices) };
    return { seq: block.seq, text, stoppedAt: -1, rowLabel: "" };
  };
}

if (parentPort) {
  const port = parentPort;
  const lines = start(workerData as EnvelopeWorkerSetup);
  port.on("message", (block: EnvelopeBlock) => port.postMessage(lines(block)));
}
