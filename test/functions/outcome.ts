/** Small helpers for running formulas in a workbook of a test's own and reading their outcome. */
import { expect } from "vitest";
import type { Formula, OutputCell } from "../../src/functions/formula.js";
import { NOTE_PREFIX } from "../../src/functions/outputTable.js";
import { evaluateFormula as evaluate, runFormula as run, type Outcome } from "../../src/functions/runFormula.js";
import { RulesetLibrary } from "../../src/workbook/rulesetLibrary.js";
import { RulesetStore } from "../../src/workbook/rulesetStore.js";
import { memoryBackend } from "../../src/workbook/settingsBackend.js";

/** A workbook for one test: its store, the library over it, and the formulas run against that library. */
export interface TestWorkbook {
  store: RulesetStore;
  library: RulesetLibrary;
  evaluateFormula(formula: Formula, raws: readonly unknown[], addresses?: readonly string[]): Outcome;
  runFormula(formula: Formula, raws: readonly unknown[], invocation?: CustomFunctions.Invocation): unknown[][];
}

export function testWorkbook(store = new RulesetStore(memoryBackend())): TestWorkbook {
  const library = new RulesetLibrary(store);
  return {
    store,
    library,
    evaluateFormula: (formula, raws, addresses) => evaluate(formula, raws, { library }, addresses),
    runFormula: (formula, raws, invocation) => run(formula, raws, { library }, invocation),
  };
}

const empty = testWorkbook();

/** Formulas in a workbook that stores nothing: shipped rulesets and rulesets typed in cells. */
export const evaluateFormula = empty.evaluateFormula;
export const runFormula = empty.runFormula;

export function value(outcome: Outcome): OutputCell[][] {
  if (!outcome.ok) expect.fail(`expected a result, got the error: ${outcome.message}`);
  return outcome.value;
}

export function message(outcome: Outcome): string {
  if (outcome.ok) expect.fail(`expected an error, got a result of ${outcome.value.length} rows`);
  return outcome.message;
}

/** The body of a table result: rows after the stamp and the header, without the notes below it. */
export function body(table: OutputCell[][]): OutputCell[][] {
  return table.slice(2).filter((r) => !(typeof r[0] === "string" && r[0].startsWith(NOTE_PREFIX)));
}

/** The row whose first cell is `key`. */
export function rowOf(table: OutputCell[][], key: string): OutputCell[] {
  const row = table.find((r) => r[0] === key);
  if (!row) expect.fail(`no row "${key}" in ${JSON.stringify(table.map((r) => r[0]))}`);
  return row;
}

/** Every cell is a string or a finite number, every row as wide as the first. */
export function expectExcelShaped(table: OutputCell[][]): void {
  const width = table[0].length;
  for (const row of table) {
    expect(row).toHaveLength(width);
    for (const cell of row) expect(typeof cell === "string" || (typeof cell === "number" && Number.isFinite(cell))).toBe(true);
  }
}
