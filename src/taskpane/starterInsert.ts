/**
 * Inserting the starter formulas: the block is laid out from the core's
 * result sizes for this table, then the whole block is read before anything
 * is written. An empty block is written at once; one that holds anything is
 * written only after a confirmation naming the range, and then cleared first
 * so that no old cell blocks a spill. The block never covers the case table.
 */
import { defaultCriteria, parseCriterion, resultSizes, type Parameter } from "../core/index.js";
import { areaName, parseReference, type SheetArea } from "../sheet/sheetArea.js";
import { filledCells, type SheetHost } from "../sheet/sheetHost.js";
import { starterBlock, type StarterBlock, type StarterParameter } from "../sheet/starterBlock.js";
import { tableName, type PaneResult, type TableOnSheet } from "./sheetTable.js";

export interface PreparedInsert {
  block: StarterBlock;
  /** Cells of the block that are not empty (A1 addresses): a confirmation must name the range first. */
  filled: string[];
}

/** The criteria typed one a line, each checked against the table; none typed: the max and min of every component. */
export function criteriaTexts(t: TableOnSheet, text: string): PaneResult<string[]> {
  const lines = text.split("\n").map((l) => l.trim());
  const given = lines.filter((l) => l !== "");
  if (given.length === 0) return { ok: true, value: defaultCriteria(t.table).map((c) => c.text) };
  const problems: string[] = [];
  lines.forEach((line, i) => {
    if (line === "") return;
    const parsed = parseCriterion(line, t.table.components);
    if (!parsed.ok) for (const p of parsed.problems) problems.push(`criteria, line ${i + 1}${p.place.position !== undefined ? `, character ${p.place.position}` : ""} (${line}): ${p.message}`);
  });
  return problems.length > 0 ? { ok: false, lines: problems } : { ok: true, value: [...new Set(given)] };
}

/** The block's parameter cells: each of the ruleset's parameters with the value typed in the pane, else its default. */
export function starterParameters(parameters: readonly Parameter[], given: Readonly<Record<string, number | string>>): StarterParameter[] {
  return parameters.map((p) => ({ name: p.name, value: given[p.name] ?? p.default ?? null }));
}

/** Where the block goes: the cell typed (its sheet, else the table's), or one column right of the case table. */
export function anchorOf(t: TableOnSheet, atText: string): PaneResult<{ sheet: string; top: number; left: number }> {
  const table = t.read.area;
  if (atText.trim() === "") return { ok: true, value: { sheet: table.sheet, top: table.top, left: table.left + table.columns + 1 } };
  const parsed = parseReference(atText);
  if (!parsed) return { ok: false, lines: [`Write at: "${atText.trim()}" is not a cell such as F1 or Calc!B2.`] };
  return { ok: true, value: { sheet: parsed.sheet ?? table.sheet, top: parsed.top, left: parsed.left } };
}

export async function prepareInsert(host: SheetHost, t: TableOnSheet, criteriaText: string, atText: string): Promise<PaneResult<PreparedInsert>> {
  const entry = t.choice.entry;
  if (!entry) return { ok: false, lines: ["Formulas name a stored or shipped ruleset, not a draft: store the draft first (Editor › Store), or choose a stored or shipped ruleset."] };
  const criteria = criteriaTexts(t, criteriaText);
  if (!criteria.ok) return criteria;
  const anchor = anchorOf(t, atText);
  if (!anchor.ok) return anchor;
  const built = starterBlock({
    anchor: anchor.value,
    cases: { area: t.read.area, name: t.read.name },
    rulesetId: entry.id,
    parameters: starterParameters(t.ruleset.parameters, t.given),
    criteria: criteria.value,
    sizes: resultSizes(t.plan, t.table, criteria.value.length),
  });
  if (!built.ok) return { ok: false, lines: built.problems.map((p) => p.message) };
  const block = built.value;
  if (overlaps(block.area, t.read.area)) {
    return { ok: false, lines: [`The formulas need ${areaName(block.area)}, which covers the case table ${tableName(t.read)}; choose a cell outside it.`] };
  }
  const before = await host.readArea(block.area);
  if (!before.ok) return { ok: false, lines: before.problems.map((p) => p.message) };
  return { ok: true, value: { block, filled: filledCells(before.value) } };
}

/** Writes the block (cleared first: it is empty, or its owner confirmed writing over it). */
export async function writeInsert(host: SheetHost, prepared: PreparedInsert): Promise<PaneResult<true>> {
  const { block } = prepared;
  const written = await host.write(block.area.sheet, block.cells, { clear: block.area });
  return written.ok ? written : { ok: false, lines: written.problems.map((p) => `The formulas were not (all) written: ${p.message}`) };
}

function overlaps(a: SheetArea, b: SheetArea): boolean {
  return a.sheet === b.sheet && a.top < b.top + b.rows && b.top < a.top + a.rows && a.left < b.left + b.columns && b.left < a.left + a.columns;
}
