/// <reference types="custom-functions-runtime" />
/**
 * The edge between Excel and the engine: read the arguments, evaluate, and turn
 * every problem into one message that names its place. Nothing thrown inside
 * reaches Excel: an unexpected failure becomes a #VALUE! with a plain message.
 */
import { readArguments } from "./argumentKinds.js";
import type { Formula, FormulaContext, OutputCell } from "./formula.js";
import { argumentAt, argumentOf, problemsText, problemText } from "./problemMessages.js";

export type Outcome = { ok: true; value: OutputCell[][] } | { ok: false; message: string };

/** Pure: usable in tests without any Office global. `addresses` are Excel's parameter addresses, if known. */
export function evaluateFormula(formula: Formula, raws: readonly unknown[], context: FormulaContext, addresses?: readonly string[]): Outcome {
  try {
    const read = readArguments(formula, raws, context);
    if (!read.ok) {
      const at = argumentAt(formula.parameters, read.index, raws, addresses);
      return { ok: false, message: problemsText(read.problems.map((p) => problemText(p, at, null))) };
    }
    const result = formula.evaluate(read.value);
    if (result.ok) return result;
    return {
      ok: false,
      message: problemsText(result.problems.map((p) => problemText(p, argumentOf(p, formula.parameters, raws, addresses), read.value))),
    };
  } catch (e) {
    const reason = e instanceof Error ? e.message : String(e);
    return { ok: false, message: `${formula.name} stopped on an internal error (${reason}); this is a defect in Loadwright, please report it with the inputs` };
  }
}

/** For Excel: the result, or a one-cell result holding a #VALUE! error with the message. */
export function runFormula(formula: Formula, raws: readonly unknown[], context: FormulaContext, invocation?: CustomFunctions.Invocation): unknown[][] {
  const outcome = evaluateFormula(formula, raws, context, invocation?.parameterAddresses);
  if (outcome.ok) return outcome.value;
  return [[new CustomFunctions.Error(CustomFunctions.ErrorCode.invalidValue, outcome.message)]];
}
