/**
 * A case table read off the sheet, as the formulas would read it: the range's
 * values (trailing blank or zero rows and columns dropped, as LW.ENVELOPE
 * does), the chosen ruleset, the parameters typed in the pane, and the plan
 * for them. Every problem names its place on the sheet — "Loads!C4 (L / V):
 * "abc" is not a number" — or its character in the typed parameters.
 */
import {
  describePlace,
  parseParameterText,
  planForTable,
  readCaseTable,
  trimTrailingEmpty,
  type CaseTable,
  type ParameterInput,
  type Plan,
  type Problem,
  type Ruleset,
} from "../core/index.js";
import { areaName, cellInArea, sheetPrefix, type SheetArea } from "../sheet/sheetArea.js";
import type { RangeRead, SheetHost } from "../sheet/sheetHost.js";
import { columnLetters } from "../core/index.js";
import type { SheetChoice } from "./sheetChoices.js";

/** A value, or the lines that say, each with its place, why there is none. */
export type PaneResult<T> = { ok: true; value: T } | { ok: false; lines: string[] };

export interface TableOnSheet {
  read: RangeRead;
  choice: SheetChoice;
  ruleset: Ruleset;
  table: CaseTable;
  given: ParameterInput;
  plan: Plan;
}

/** What the case table is called in messages and in the block's title: its name, else its address. */
export function tableName(read: RangeRead): string {
  return read.name ?? areaName(read.area);
}

/** `reference` empty: the selection. */
export async function tableOnSheet(host: SheetHost, reference: string, choice: SheetChoice | undefined, paramsText: string): Promise<PaneResult<TableOnSheet>> {
  if (!choice) return { ok: false, lines: ["Choose a ruleset."] };
  if (!choice.ruleset) return { ok: false, lines: [`${choice.why ?? "the ruleset does not load"}.`] };
  const read = reference.trim() === "" ? await host.selection() : await host.read(reference);
  if (!read.ok) return { ok: false, lines: read.problems.map((p) => p.message) };
  const table = readCaseRange(read.value, choice.ruleset);
  if (!table.ok) return table;
  const given = parseParameterText(paramsText);
  if (!given.ok) return { ok: false, lines: given.problems.map((p) => parameterLine(p, paramsText)) };
  const plan = planForTable(choice.ruleset, given.value, table.value);
  if (!plan.ok) return { ok: false, lines: plan.problems.map((p) => (p.kind.startsWith("parameter-") ? parameterLine(p, paramsText) : `${tableName(read.value)}: ${placedText(p, read.value.area)}`)) };
  return { ok: true, value: { read: read.value, choice, ruleset: choice.ruleset, table: table.value, given: given.value, plan: plan.value } };
}

/** The range's values as a case table for `ruleset`, or every problem placed on the sheet. */
export function readCaseRange(read: RangeRead, ruleset: Ruleset): PaneResult<CaseTable> {
  const filled = read.values.some((row) => row.some((c) => c !== null && c !== undefined && c !== ""));
  if (!filled) return { ok: false, lines: [`${tableName(read)} is empty: select the case table with its header row and header column.`] };
  const table = readCaseTable(trimTrailingEmpty(read.values), ruleset);
  if (!table.ok) return { ok: false, lines: table.problems.map((p) => `${tableName(read)} is not a case table for ${ruleset.file.id}: ${placedText(p, read.area)}`) };
  return table;
}

/** A problem's place on the sheet, then the sentence: `Loads!D3 (L / V): "abc" is not a number`. */
export function placedText(p: Problem, area: SheetArea): string {
  const { row, column, also, header, ...rest } = p.place;
  const parts: string[] = [];
  if (row !== undefined && column !== undefined) parts.push(cellInArea(area, row, column));
  else if (row !== undefined) parts.push(`${sheetPrefix(area.sheet)}row ${area.top + row + 1}`);
  else if (column !== undefined) parts.push(`${sheetPrefix(area.sheet)}column ${columnLetters(area.left + column)}`);
  const described = describePlace(rest);
  if (described !== "") parts.push(described);
  let where = parts.join(", ");
  if (header !== undefined && !p.message.includes(header)) where += where === "" ? `(${header})` : ` (${header})`;
  const sentence = also ? `${p.message} (also at ${cellInArea(area, also.row, also.column)})` : p.message;
  return where === "" ? sentence : `${where}: ${sentence}`;
}

/** A parameter problem names where in the typed text it is: "params, character 1: …". */
function parameterLine(p: Problem, text: string): string {
  const position = p.place.position ?? positionOf(text, p.place.header);
  const entry = p.place.entry !== undefined ? `, combination "${p.place.entry}"` : "";
  return `params${position === null ? "" : `, character ${position}`}${entry}: ${p.message}`;
}

function positionOf(text: string, name: string | undefined): number | null {
  if (name === undefined) return null;
  const escaped = name.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
  const m = new RegExp(`(^|[;\\n])\\s*(${escaped})\\s*=`, "u").exec(text);
  return m ? m.index + m[0].indexOf(m[2]) + 1 : null;
}
