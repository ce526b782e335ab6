/**
 * A concrete row's label as a command writes it (escaped for CSV, or as it
 * is), made once per row of the plan and then found by the row's number: a
 * long export names the same few rows again and again, and a list indexed by
 * row number finds them faster than looking a label up by its text.
 */
import { labelOf, type CompiledPlan } from "../../core/index.js";

/** Plans with more rows than this look their labels up in the plan's own label cache only. */
const LISTED_ROWS = 1 << 16;

/** The text of the row of flat branch `branch` with the options choices[from…]; `row` is its row number where known (≥ 0). */
export type RowText = (branch: number, choices: Int32Array, from: number, row: number) => string;

export function rowTexts(compiled: CompiledPlan, escape: (label: string) => string): RowText {
  const listed = compiled.plan.rowCount <= LISTED_ROWS;
  const texts: (string | undefined)[] = listed ? new Array<string | undefined>(compiled.plan.rowCount).fill(undefined) : [];
  return (branch, choices, from, row) => {
    if (!listed || row < 0 || row >= texts.length) return escape(labelOf(compiled, branch, choices, from));
    let text = texts[row];
    if (text === undefined) texts[row] = text = escape(labelOf(compiled, branch, choices, from));
    return text;
  };
}
