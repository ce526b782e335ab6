/**
 * What a formula is: its name, its arguments (each of a declared kind, read in
 * one place — argumentKinds.ts), and an evaluation over the read arguments that
 * returns a table of cells or located problems.
 */
import type { CaseMap, CaseTable, Criterion, ParameterInput, PlanCase, Result, Ruleset, RulesetStatus } from "../core/index.js";
import type { RulesetLibrary, RulesetSource } from "../workbook/rulesetLibrary.js";

export type ArgumentKind = "ruleset" | "params" | "options" | "cases" | "caseHeaders" | "criteria" | "row" | "component";

export interface ArgumentSpec {
  /** The name Excel shows, and the name messages use ("cases", "params"). */
  name: string;
  kind: ArgumentKind;
  optional?: boolean;
}

/** A cell of a formula's result: text labels, numbers as numbers, "" for padding. Never null. */
export type OutputCell = string | number;

export interface ResolvedRuleset {
  ruleset: Ruleset;
  status: RulesetStatus;
  source: RulesetSource;
  /** Stored copy of a shipped id: the shipped one's fingerprint. */
  shippedFingerprint: string | null;
  /** Typed rulesets: combination id → its row in the range, and the column of expressions. */
  entryRows: ReadonlyMap<string, number>;
  expressionColumn: number;
}

export interface GivenParameters {
  input: ParameterInput;
  /** Where each parameter was written: a row/column of the params range, and a character position in text. */
  where: ReadonlyMap<string, { row: number; column: number; position?: number }>;
}

export interface TableOptions {
  orientation: "rows" | "columns" | "auto";
  idColumns: number;
  map: CaseMap;
}

/** Everything the argument readers produce; a formula uses the parts its arguments declare. */
export interface FormulaArguments {
  ruleset: ResolvedRuleset | null;
  params: GivenParameters;
  options: TableOptions;
  table: CaseTable | null;
  /** LW.COMBOS: the cases of a table or a header row/column, or null for one column per symbol. */
  cases: PlanCase[] | null;
  /** Null: the max and min of every component. */
  criteria: Criterion[] | null;
  row: string | number | null;
  component: string | null;
}

/** What a formula reads besides its arguments, passed in by whoever runs it (the add-in's entry, a test). */
export interface FormulaContext {
  /** The rulesets an id may name: stored with the workbook, then shipped. */
  library: RulesetLibrary;
}

export interface Formula {
  /** As the user types it: "LW.FACTORED". */
  name: string;
  parameters: readonly ArgumentSpec[];
  evaluate(args: FormulaArguments): Result<OutputCell[][]>;
}

/** For a formula body: an argument its declaration guarantees, or a programming error. */
export function given<T>(value: T | null, what: string): T {
  if (value === null) throw new Error(`${what} was not read; the formula's declaration is missing it`);
  return value;
}
