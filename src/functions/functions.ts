/// <reference types="custom-functions-runtime" />
/**
 * The LW.* formulas as Excel registers them. Only this file's top-level
 * function declarations are read by the metadata generator (their JSDoc becomes
 * functions.json and the tooltips Excel shows while typing); the webpack loader
 * appends the CustomFunctions.associate calls. Each function only hands its
 * arguments to runFormula: the logic lives in ./formulas and is tested without
 * Excel. Excel calls these functions with no way to pass anything else, so
 * the add-in's entry hands over the workbook's rulesets once, with
 * connectWorkbook, before any call can arrive.
 */
import { COMBOS } from "./formulas/combosFormula.js";
import { ENVELOPE } from "./formulas/envelopeFormula.js";
import { EXPLAIN } from "./formulas/explainFormula.js";
import { FACTORED } from "./formulas/factoredFormula.js";
import { GOVERNING } from "./formulas/governingFormula.js";
import { RULESET } from "./formulas/rulesetFormula.js";
import type { FormulaContext } from "./formula.js";
import { runFormula } from "./runFormula.js";
import { RulesetLibrary } from "../workbook/rulesetLibrary.js";
import { RulesetStore } from "../workbook/rulesetStore.js";
import { memoryBackend } from "../workbook/settingsBackend.js";

/** Until the entry connects the workbook: the shipped rulesets and nothing stored. */
let workbook: FormulaContext = { library: new RulesetLibrary(new RulesetStore(memoryBackend())) };

/** The add-in's entry gives the formulas the library of the workbook they run in. */
export function connectWorkbook(context: FormulaContext): void {
  workbook = context;
}

/**
 * The factored matrix: every combination row of the ruleset, with its label and the value of every component. Row 1 stamps the ruleset and its status.
 * @customfunction FACTORED
 * @param cases Case table with headers: load cases (D, L, W:N…) down, components across; or cases across, result rows down.
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param [params] Parameters: name/value pairs, or text such as "SDS=1.2; rho=1.3". Omitted: the ruleset's defaults.
 * @param [options] Options and case map: orientation rows/columns, id columns n, [header, symbol], [symbol, sum/each/orthogonal].
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns A header row, then one row per combination row: label, then component values.
 * @requiresParameterAddresses
 */
export function factoredFormula(cases: unknown[][], ruleset: unknown[][], params?: unknown[][], options?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(FACTORED, [cases, ruleset, params, options], workbook, invocation);
}

/**
 * The envelope: max and min of every component (or of every result row) over all combination rows, each with the label of the row that gives it.
 * @customfunction ENVELOPE
 * @param cases Case table with headers: load cases (D, L, W:N…) down, components across; or cases across, result rows down.
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param [params] Parameters: name/value pairs, or text such as "SDS=1.2; rho=1.3". Omitted: the ruleset's defaults.
 * @param [options] Options and case map: orientation rows/columns, id columns n, [header, symbol], [symbol, sum/each/orthogonal].
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns Per component: max, row giving max, min, row giving min.
 * @requiresParameterAddresses
 */
export function envelopeFormula(cases: unknown[][], ruleset: unknown[][], params?: unknown[][], options?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(ENVELOPE, [cases, ruleset, params, options], workbook, invocation);
}

/**
 * The governing rows: the combination row each criterion selects, with every concurrent component value of that row.
 * @customfunction GOVERNING
 * @param cases Case table with headers: load cases (D, L, W:N…) down, components across; or cases across, result rows down.
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param [criteria] Text cells such as "max V", "min N", "max |M|". Omitted: the max and min of every component.
 * @param [params] Parameters: name/value pairs, or text such as "SDS=1.2; rho=1.3". Omitted: the ruleset's defaults.
 * @param [options] Options and case map: orientation rows/columns, id columns n, [header, symbol], [symbol, sum/each/orthogonal].
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns One line per criterion: criterion, value, row label, concurrent component values.
 * @requiresParameterAddresses
 */
export function governingFormula(
  cases: unknown[][],
  ruleset: unknown[][],
  criteria?: unknown[][],
  params?: unknown[][],
  options?: unknown[][],
  invocation?: CustomFunctions.Invocation,
): unknown[][] {
  return runFormula(GOVERNING, [cases, ruleset, criteria, params, options], workbook, invocation);
}

/**
 * The combination list a checker reads: every combination row with its label, clause and the factor on every load symbol (or on every case).
 * @customfunction COMBOS
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param [params] Parameters: name/value pairs, or text such as "SDS=1.2; rho=1.3". Omitted: the ruleset's defaults.
 * @param [cases] A case table or its row/column of case headers: factors per case. Omitted: one column per load symbol.
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns A header row, then per combination row: label, clause, factors.
 * @requiresParameterAddresses
 */
export function combosFormula(ruleset: unknown[][], params?: unknown[][], cases?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(COMBOS, [ruleset, params, cases], workbook, invocation);
}

/**
 * One value's derivation as text: the row and its clause, factor × case value for every case, the sum, and the parameters in force.
 * @customfunction EXPLAIN
 * @param cases Case table with headers: load cases (D, L, W:N…) down, components across; or cases across, result rows down.
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param row A row label as LW.FACTORED, LW.ENVELOPE or LW.GOVERNING shows it, or its number in LW.FACTORED's listing.
 * @param component A component header of the case table, or a result row's id (cases as columns).
 * @param [params] Parameters: name/value pairs, or text such as "SDS=1.2; rho=1.3". Omitted: the ruleset's defaults.
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns The derivation, one line per cell, down one column.
 * @requiresParameterAddresses
 */
export function explainFormula(cases: unknown[][], ruleset: unknown[][], row: unknown, component: unknown, params?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(EXPLAIN, [cases, ruleset, row, component, params], workbook, invocation);
}

/**
 * The identity of a ruleset for stamping a calculation: id, title, standard and edition, version, fingerprint, verification and approval status.
 * @customfunction RULESET
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns Field and value rows.
 * @requiresParameterAddresses
 */
export function rulesetFormula(ruleset: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(RULESET, [ruleset], workbook, invocation);
}

/** The formula each registered id runs, so a test can hold functions.json to the code. */
export const FORMULAS_BY_ID = { FACTORED, ENVELOPE, GOVERNING, COMBOS, EXPLAIN, RULESET } as const;
