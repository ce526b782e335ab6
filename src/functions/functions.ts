/// <reference types="custom-functions-runtime" />
/**
 * The LW.* formulas as Excel registers them. Only this file's top-level
 * function declarations are read by the metadata generator (their JSDoc becomes
 * functions.json and the tooltips Excel shows while typing); the webpack loader
 * appends the CustomFunctions.associate calls. Each function only hands its
 * arguments to runFormula: the logic lives in ./formulas and is tested without
 * Excel.
 */
import { COMBOS } from "./formulas/combosFormula.js";
import { ENVELOPE } from "./formulas/envelopeFormula.js";
import { EXPLAIN } from "./formulas/explainFormula.js";
import { FACTORED } from "./formulas/factoredFormula.js";
import { GOVERNING } from "./formulas/governingFormula.js";
import { RULESET } from "./formulas/rulesetFormula.js";
import { runFormula } from "./runFormula.js";

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
function factoredFormula(cases: unknown[][], ruleset: unknown[][], params?: unknown[][], options?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(FACTORED, [cases, ruleset, params, options], invocation);
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
function envelopeFormula(cases: unknown[][], ruleset: unknown[][], params?: unknown[][], options?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(ENVELOPE, [cases, ruleset, params, options], invocation);
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
function governingFormula(
  cases: unknown[][],
  ruleset: unknown[][],
  criteria?: unknown[][],
  params?: unknown[][],
  options?: unknown[][],
  invocation?: CustomFunctions.Invocation,
): unknown[][] {
  return runFormula(GOVERNING, [cases, ruleset, criteria, params, options], invocation);
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
function combosFormula(ruleset: unknown[][], params?: unknown[][], cases?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(COMBOS, [ruleset, params, cases], invocation);
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
function explainFormula(cases: unknown[][], ruleset: unknown[][], row: unknown, component: unknown, params?: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(EXPLAIN, [cases, ruleset, row, component, params], invocation);
}

/**
 * The identity of a ruleset for stamping a calculation: id, title, standard and edition, version, fingerprint, verification and approval status.
 * @customfunction RULESET
 * @param ruleset Ruleset id in quotes (shipped, or stored in this workbook), or a range of [id, expression, clause] rows.
 * @param [invocation] Supplied by Excel: where the arguments are, to name cells in messages.
 * @returns Field and value rows.
 * @requiresParameterAddresses
 */
function rulesetFormula(ruleset: unknown[][], invocation?: CustomFunctions.Invocation): unknown[][] {
  return runFormula(RULESET, [ruleset], invocation);
}

/** The registered functions by id, for the entry module and the tests (the loader's associate calls use the declarations above). */
export const FORMULA_FUNCTIONS = {
  FACTORED: factoredFormula,
  ENVELOPE: envelopeFormula,
  GOVERNING: governingFormula,
  COMBOS: combosFormula,
  EXPLAIN: explainFormula,
  RULESET: rulesetFormula,
} as const;

/** The formula each registered id runs, so a test can hold functions.json to the code. */
export const FORMULAS_BY_ID = { FACTORED, ENVELOPE, GOVERNING, COMBOS, EXPLAIN, RULESET } as const;
