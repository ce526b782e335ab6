/**
 * The second thread of a two-core `loadwright envelope … --format csv`: the
 * main thread reads and checks the file, this thread evaluates each block of
 * result rows and writes its CSV lines. It plans the same ruleset, parameters
 * and case headers as the main thread (planning is deterministic), so its
 * lines are the ones the main thread would have written.
 */
import { parentPort, workerData } from "node:worker_threads";
import { compiledPlanOf, extremesEvaluator, labelOf, loadRuleset, planForTable, type CaseMode, type LoadCase, type ParameterInput, type RulesetFile } from "../../core/index.js";
import { csvField, numberText } from "../output/cells.js";

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
  const evaluator = extremesEvaluator(compiled);
  const cases = setup.cases.length;
  const escaped = new Map<string, string>();
  const field = (label: string) => {
    let text = escaped.get(label);
    if (text === undefined) escaped.set(label, (text = csvField(label)));
    return text;
  };
  return (block) => {
    let text = "";
    for (let n = 0; n < block.count; n++) {
      const e = evaluator.evaluateAt(block.values, n * cases);
      if (!e) throw new Error("the plan has no rows");
      const { maxValue: max, minValue: min } = e;
      if (!e.finite) return { seq: block.seq, text, stoppedAt: n, rowLabel: labelOf(compiled, e.faultBranch, e.faultChoices) };
      text += `${csvField(block.ids[n])},${numberText(max)},${field(labelOf(compiled, e.maxBranch, e.maxChoices))},${numberText(min)},${field(labelOf(compiled, e.minBranch, e.minChoices))}\n`;
    }
    return { seq: block.seq, text, stoppedAt: -1, rowLabel: "" };
  };
}

if (parentPort) {
  const port = parentPort;
  const lines = start(workerData as EnvelopeWorkerSetup);
  port.on("message", (block: EnvelopeBlock) => port.postMessage(lines(block)));
}
