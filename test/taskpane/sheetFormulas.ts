/**
 * The formulas the pane wrote, typed into the recorded sheet: each LW.* call
 * read off the cell's formula text (the command line's reader of saved
 * formulas, src/cli/input/formulaText.ts), each argument resolved against the
 * recorded cells as Excel hands a custom function its arguments (a range as
 * rows of values, an empty cell as null; text in quotes as text), and the
 * formula evaluated by the formula layer (src/functions) over a library
 * holding what the workbook's settings store.
 */
import { expect } from "vitest";
import { loadwrightCalls, parseReference } from "../../src/cli/input/formulaText.js";
import type { OutputCell } from "../../src/functions/formula.js";
import { FORMULAS_BY_ID } from "../../src/functions/functions.js";
import { evaluateFormula } from "../../src/functions/runFormula.js";
import { RulesetLibrary } from "../../src/workbook/rulesetLibrary.js";
import { RulesetStore, STORE_KEY } from "../../src/workbook/rulesetStore.js";
import { memoryBackend } from "../../src/workbook/settingsBackend.js";
import type { StandInCell } from "./excelStandIn.js";

export type Sheets = Record<string, Record<string, StandInCell>>;

export interface Evaluated {
  name: string;
  /** Each argument as written. */
  args: string[];
  result: OutputCell[][];
}

const letters = (column: number) => {
  let n = column;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
};

/** One argument as Excel would pass it. */
function argumentValue(text: string, sheet: string, sheets: Sheets, names: Record<string, string>): unknown {
  if (text === "") return null;
  if (/^".*"$/.test(text)) return text.slice(1, -1).replace(/""/g, '"');
  if (/^[+-]?\d+(\.\d+)?$/.test(text)) return Number(text);
  const reference = parseReference(names[text] ?? text);
  if (!reference) throw new Error(`the argument ${text} is neither a reference, a name, nor a constant`);
  const on = sheets[reference.sheet ?? sheet];
  if (!on) throw new Error(`the argument ${text} names no sheet of the workbook`);
  const rows: unknown[][] = [];
  for (let r = reference.first.row; r <= reference.last.row; r++) {
    const row: unknown[] = [];
    for (let c = reference.first.column; c <= reference.last.column; c++) {
      const cell = on[`${letters(c)}${r}`];
      row.push(cell === undefined || cell.value === "" ? null : cell.value);
    }
    rows.push(row);
  }
  return rows;
}

/** The formula of a cell (with its "="), evaluated as Excel would call the add-in's function. */
export function evaluateCell(formula: string, sheet: string, sheets: Sheets, settings: Record<string, string>, names: Record<string, string> = {}): Evaluated {
  const calls = loadwrightCalls(formula.replace(/^=/, ""));
  expect(calls, formula).toHaveLength(1);
  const [call] = calls;
  const id = call.name.replace(/^LW\./, "") as keyof typeof FORMULAS_BY_ID;
  const declared = FORMULAS_BY_ID[id];
  expect(declared, call.name).toBeDefined();
  const stored = settings[STORE_KEY];
  const library = new RulesetLibrary(new RulesetStore(memoryBackend(stored === undefined ? {} : { [STORE_KEY]: stored })));
  const raws = call.args.map((a) => argumentValue(a, sheet, sheets, names));
  const outcome = evaluateFormula(declared, raws, { library });
  if (!outcome.ok) expect.fail(`${formula} gives #VALUE!: ${outcome.message}`);
  return { name: call.name, args: call.args, result: outcome.value };
}
