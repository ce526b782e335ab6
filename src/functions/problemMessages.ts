/**
 * The one place where the core's located problems become the message of a
 * #VALUE! error: the argument's name, the cell on the sheet (from Excel's
 * parameter addresses), the header, the combination and character position,
 * then the core's sentence. "cases, Loads!C5 (W:N / V): "abc" is not a number".
 */
import { countText, describePlace, type Problem } from "../core/index.js";
import { asMatrix } from "./excelCells.js";
import { PROBLEM_ARGUMENT } from "./argumentKinds.js";
import type { ArgumentSpec, FormulaArguments } from "./formula.js";
import { cellName, columnName, parseRangeAddress, rowName, type RangeAddress } from "./rangeAddress.js";

/** At most this many problems are spelt out in one message; the rest are counted. */
export const MAX_PROBLEMS_SHOWN = 3;

export interface ArgumentAt {
  spec: ArgumentSpec;
  range: RangeAddress | null;
  /** A one-cell argument needs no cell named when its place on the sheet is unknown (a value typed in the formula). */
  oneCell: boolean;
}

/** The argument a formula declares at `index`, with its place on the sheet. */
export function argumentAt(parameters: readonly ArgumentSpec[], index: number, raws: readonly unknown[], addresses: readonly string[] | undefined): ArgumentAt {
  const m = asMatrix(raws[index]);
  return { spec: parameters[index], range: parseRangeAddress(addresses?.[index]), oneCell: m !== null && m.length === 1 && m[0].length === 1 };
}

/** The argument of the kind a problem found during evaluation belongs to, if the formula has one. */
export function argumentOf(
  p: Problem,
  parameters: readonly ArgumentSpec[],
  raws: readonly unknown[],
  addresses: readonly string[] | undefined,
): ArgumentAt | null {
  // A parameter problem belongs to params even where it names the combination that reads the parameter.
  const kind = PROBLEM_ARGUMENT[p.kind] ?? (p.place.entry !== undefined ? "ruleset" : undefined);
  const index = parameters.findIndex((s) => s.kind === kind);
  return index < 0 ? null : argumentAt(parameters, index, raws, addresses);
}

export function problemText(p: Problem, at: ArgumentAt | null, args: FormulaArguments | null): string {
  const place = { ...p.place };
  if (at && args) {
    // A parameter checked against its range names the cell it was written in.
    if (at.spec.kind === "params" && place.header !== undefined && place.row === undefined) {
      const where = args.params.where.get(place.header);
      if (where) Object.assign(place, where);
    }
    // A combination typed in cells names its row.
    if (at.spec.kind === "ruleset" && place.entry !== undefined && place.row === undefined && args.ruleset?.source === "cells") {
      const row = args.ruleset.entryRows.get(place.entry);
      if (row !== undefined) Object.assign(place, { row, column: args.ruleset.expressionColumn });
    }
  }
  const range = at?.range ?? null;
  const { row, column, also, ...rest } = place;
  const sentence = also ? `${p.message} (also at ${cellName(range, also.row, also.column)})` : p.message;
  const parts: string[] = [];
  const wholeArgument = range === null && at?.oneCell === true && row === 0 && column === 0;
  if (wholeArgument) {
    // The argument is this one cell: its name adds nothing.
  } else if (row !== undefined && column !== undefined) parts.push(cellName(range, row, column));
  else if (row !== undefined) parts.push(rowName(range, row));
  else if (column !== undefined) parts.push(columnName(range, column));
  const described = describePlace(rest);
  if (described !== "") parts.push(described);
  let where = parts.join(", ");
  // The header is named unless the sentence already names it as a word ("L" in 'case header "L" appears
  // twice', rho in "parameter rho = 1.2"): a letter inside another word (the T of TRUE) is not a mention.
  if (place.header !== undefined && !mentions(sentence, place.header)) where += where === "" ? `(${place.header})` : ` (${place.header})`;
  const prefix = at ? (where === "" ? at.spec.name : `${at.spec.name}, ${where}`) : where;
  return prefix === "" ? sentence : `${prefix}: ${sentence}`;
}

/** Several problems in one message: the first few in full, the rest counted. */
export function problemsText(texts: string[]): string {
  const shown = texts.slice(0, MAX_PROBLEMS_SHOWN).join(" | ");
  const more = texts.length - MAX_PROBLEMS_SHOWN;
  return more > 0 ? `${shown} | (and ${countText(more)} more problem${more === 1 ? "" : "s"})` : shown;
}

/** Whether a sentence names this header as a word of its own, not as letters inside another word. */
function mentions(sentence: string, header: string): boolean {
  const wordy = /[\p{L}\p{N}_]/u;
  for (let at = sentence.indexOf(header); at !== -1; at = sentence.indexOf(header, at + 1)) {
    const before = at === 0 ? "" : sentence[at - 1];
    const after = sentence[at + header.length] ?? "";
    if (!wordy.test(before) && !wordy.test(after)) return true;
  }
  return false;
}
