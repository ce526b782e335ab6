/**
 * Argument handling, declared once: each kind of argument has one reader, and
 * readers run in an order where a later kind can use what an earlier one read
 * (a case table needs its ruleset and options; criteria need the table's
 * components). A formula only lists its arguments and their kinds.
 */
import type { Problem, ProblemKind, Result } from "../core/index.js";
import { readCaseHeadersArgument, readCasesArgument } from "./casesArgument.js";
import { readCriteriaArgument } from "./criteriaArgument.js";
import { given, type ArgumentKind, type ArgumentSpec, type Formula, type FormulaArguments, type FormulaContext } from "./formula.js";
import { DEFAULT_OPTIONS, readOptionsArgument } from "./optionsArgument.js";
import { NO_PARAMETERS, readParamsArgument } from "./paramsArgument.js";
import { readRulesetArgument } from "./rulesetArgument.js";
import { readComponentArgument, readRowArgument } from "./scalarArguments.js";

interface KindReader {
  /** Readers run by ascending order. */
  order: number;
  read(raw: unknown, args: FormulaArguments, context: FormulaContext): Result<unknown>;
}

/** Keep a reader's value on the arguments, or pass its problems on. */
function into<T>(result: Result<T>, keep: (value: T) => void): Result<T> {
  if (result.ok) keep(result.value);
  return result;
}

export const ARGUMENT_KINDS: Record<ArgumentKind, KindReader> = {
  ruleset: { order: 0, read: (raw, args, context) => into(readRulesetArgument(raw, context.library), (v) => (args.ruleset = v)) },
  params: { order: 1, read: (raw, args) => into(readParamsArgument(raw), (v) => (args.params = v)) },
  options: {
    order: 2,
    read: (raw, args) => into(readOptionsArgument(raw, given(args.ruleset, "ruleset").ruleset), (v) => (args.options = v)),
  },
  cases: {
    order: 3,
    read: (raw, args) => into(readCasesArgument(raw, given(args.ruleset, "ruleset").ruleset, args.options), (v) => (args.table = v)),
  },
  caseHeaders: {
    order: 3,
    read: (raw, args) => into(readCaseHeadersArgument(raw, given(args.ruleset, "ruleset").ruleset), (v) => (args.cases = v)),
  },
  criteria: { order: 4, read: (raw, args) => into(readCriteriaArgument(raw, given(args.table, "cases")), (v) => (args.criteria = v)) },
  row: { order: 4, read: (raw, args) => into(readRowArgument(raw), (v) => (args.row = v)) },
  component: { order: 4, read: (raw, args) => into(readComponentArgument(raw), (v) => (args.component = v)) },
};

/**
 * Which argument a problem found while evaluating belongs to (a parameter out of
 * range belongs to params, a row label that matches nothing to row). Other
 * problems that name a combination belong to the ruleset.
 */
export const PROBLEM_ARGUMENT: Partial<Record<ProblemKind, ArgumentKind>> = {
  "parameter-unknown": "params",
  "parameter-missing": "params",
  "parameter-not-number": "params",
  "parameter-out-of-range": "params",
  "parameter-not-allowed": "params",
  "parameter-syntax": "params",
  "expression-syntax": "ruleset",
  "expression-unknown-name": "ruleset",
  "expression-structure": "ruleset",
  "expression-attribute": "ruleset",
  "expression-not-finite": "ruleset",
  "ruleset-unknown": "ruleset",
  "ruleset-store": "ruleset",
  "unknown-row": "row",
  "unknown-component": "component",
  "criterion-syntax": "criteria",
  // A sum past the largest number comes from the case values: the message names the result and the row, the place its cell.
  "result-not-finite": "cases",
};

export type ReadArguments =
  | { ok: true; value: FormulaArguments }
  | { ok: false; argument: ArgumentSpec; index: number; problems: Problem[] };

/** Reads every argument of a formula in dependency order; stops at the first argument with problems. */
export function readArguments(formula: Formula, raws: readonly unknown[], context: FormulaContext): ReadArguments {
  const args: FormulaArguments = {
    ruleset: null,
    params: NO_PARAMETERS,
    options: DEFAULT_OPTIONS,
    table: null,
    cases: null,
    criteria: null,
    row: null,
    component: null,
  };
  const order = formula.parameters
    .map((spec, index) => ({ spec, index }))
    .sort((a, b) => ARGUMENT_KINDS[a.spec.kind].order - ARGUMENT_KINDS[b.spec.kind].order);
  for (const { spec, index } of order) {
    const result = ARGUMENT_KINDS[spec.kind].read(raws[index] ?? null, args, context);
    if (!result.ok) return { ok: false, argument: spec, index, problems: result.problems };
  }
  return { ok: true, value: args };
}
