/// <reference types="office-js" />
/**
 * The sheet host inside Excel, over the Excel JavaScript API (ExcelApi 1.4,
 * declared in manifest.xml; test/addin/officeApiRequirements.test.ts cites the
 * page of every call). Each action is one Excel.run: proxies are loaded, then
 * synced, before anything is read from them. Text is written with Excel's
 * leading apostrophe, so that a label such as "-W" or "1/2" stays text and is
 * never read as a formula, a number or a date; numbers are written as numbers
 * and formulas as formulas. A failure of Excel is a located problem naming
 * the range, never a thrown error.
 */
import { problem, type Cell, type Result } from "../core/index.js";
import type { SheetCell, SheetStyle } from "../sheet/reviewerSheet.js";
import { areaAddress, areaName, parseReference, type SheetArea } from "../sheet/sheetArea.js";
import type { RangeRead, SheetHost, WriteOptions } from "../sheet/sheetHost.js";

/** More cells than this in one read is not a case table (a whole column, say): refused before the values are loaded. */
export const MAX_READ_CELLS = 1_000_000;
/** Cells written per sync, so that no request nears the platform's payload limit. */
const CELLS_PER_SYNC = 5_000;
/** Cells read per sync where a block is checked before it is written. */
const READ_CHUNK_CELLS = 100_000;

const failed = (message: string): Result<never> => ({ ok: false, problems: [problem("sheet-range", message)] });
const reasonOf = (e: unknown): string => (e instanceof Error ? e.message : String(e));

export function excelSheetHost(): SheetHost {
  return {
    where: "the open workbook",
    selection: () => attempt("the selection", async (context) => readRange(context, context.workbook.getSelectedRange(), null, "the selection")),
    read: (reference) => attempt(reference, (context) => readReference(context, reference)),
    readArea: (area) =>
      attempt(areaName(area), async (context) => {
        const sheet = await worksheet(context, area.sheet);
        return sheet.ok ? readBlock(context, sheet.value, area) : sheet;
      }),
    write: (sheetName, cells, options) => attempt(`worksheet ${sheetName}`, (context) => writeCells(context, sheetName, cells, options ?? {})),
    addSheet: (name) => attempt(`a new worksheet "${name}"`, (context) => addSheet(context, name)),
  };
}

/** One Excel.run; whatever Excel refuses becomes a problem that names what was being done. */
async function attempt<T>(what: string, batch: (context: Excel.RequestContext) => Promise<Result<T>>): Promise<Result<T>> {
  try {
    return await Excel.run(batch);
  } catch (e) {
    return failed(`${what}: Excel refused (${reasonOf(e)})`);
  }
}

async function worksheet(context: Excel.RequestContext, name: string): Promise<Result<Excel.Worksheet>> {
  const sheet = context.workbook.worksheets.getItemOrNullObject(name);
  sheet.load("name");
  await context.sync();
  return sheet.isNullObject ? failed(`there is no worksheet named "${name}" in this workbook`) : { ok: true, value: sheet };
}

async function readReference(context: Excel.RequestContext, reference: string): Promise<Result<RangeRead>> {
  const parsed = parseReference(reference);
  if (parsed) {
    const sheet = parsed.sheet === null ? context.workbook.worksheets.getActiveWorksheet() : context.workbook.worksheets.getItemOrNullObject(parsed.sheet);
    sheet.load("name");
    await context.sync();
    if (sheet.isNullObject) return failed(`${reference}: there is no worksheet named "${parsed.sheet ?? ""}" in this workbook`);
    return readRange(context, sheet.getRange(areaAddress({ ...parsed, sheet: sheet.name })), null, reference);
  }
  const name = reference.trim();
  const item = context.workbook.names.getItemOrNullObject(name);
  item.load("name, type");
  await context.sync();
  if (item.isNullObject) return failed(`"${name}" is neither a range (such as Loads!A1:D5) nor a name defined in this workbook`);
  if (item.type !== Excel.NamedItemType.range) return failed(`the name "${name}" stands for a ${String(item.type).toLowerCase()}, not a range of cells`);
  return readRange(context, item.getRange(), item.name, name);
}

async function readRange(context: Excel.RequestContext, range: Excel.Range, name: string | null, what: string): Promise<Result<RangeRead>> {
  range.load("address, rowIndex, columnIndex, rowCount, columnCount");
  range.worksheet.load("name");
  await context.sync();
  const cellCount = range.rowCount * range.columnCount;
  if (cellCount > MAX_READ_CELLS) {
    return failed(`${what} (${range.address}) holds ${cellCount.toLocaleString("en-US")} cells, more than a case table; select the table itself, bounded (A1:D40, not A:D)`);
  }
  range.load("values, formulas");
  await context.sync();
  const area: SheetArea = { sheet: range.worksheet.name, top: range.rowIndex, left: range.columnIndex, rows: range.rowCount, columns: range.columnCount };
  const values = (range.values as unknown[][]).map((row) => row.map(cellOf));
  const formulas = (range.formulas as unknown[][]).map((row) => row.map(formulaOf));
  return { ok: true, value: { area, name, values, formulas } };
}

/** A block to be written over, however large (a long combination list): read in parts, each well within a request's limits. */
async function readBlock(context: Excel.RequestContext, sheet: Excel.Worksheet, area: SheetArea): Promise<Result<RangeRead>> {
  const chunk = Math.max(1, Math.floor(READ_CHUNK_CELLS / area.columns));
  const values: Cell[][] = [];
  const formulas: string[][] = [];
  for (let top = area.top; top < area.top + area.rows; top += chunk) {
    const range = sheet.getRange(areaAddress({ ...area, top, rows: Math.min(chunk, area.top + area.rows - top) }));
    range.load("values, formulas");
    await context.sync();
    values.push(...(range.values as unknown[][]).map((row) => row.map(cellOf)));
    formulas.push(...(range.formulas as unknown[][]).map((row) => row.map(formulaOf)));
  }
  return { ok: true, value: { area, name: null, values, formulas } };
}

const formulaOf = (f: unknown): string => (typeof f === "string" && f.startsWith("=") ? f : "");

/** Excel gives "" for an empty cell; the core reads null as blank. */
function cellOf(value: unknown): Cell {
  if (value === "" || value === null || value === undefined) return null;
  if (typeof value === "number" || typeof value === "string" || typeof value === "boolean") return value;
  // Anything else (an entity, a rich value) is shown as its JSON text, which no reader takes for a number.
  return JSON.stringify(value) ?? typeof value;
}

/** What a cell is given: formulas with their "=", numbers as they are, text behind the apostrophe that keeps it text. */
export function writtenForm(cell: SheetCell): string | number {
  switch (cell.kind) {
    case "formula":
      return `=${cell.formula}`;
    case "number":
      return cell.value;
    case "text":
      return `'${cell.value}`;
  }
}

async function writeCells(context: Excel.RequestContext, sheetName: string, cells: readonly SheetCell[], options: WriteOptions): Promise<Result<true>> {
  const found = await worksheet(context, sheetName);
  if (!found.ok) return found;
  const sheet = found.value;
  if (options.clear) sheet.getRange(areaAddress(options.clear)).clear(Excel.ClearApplyTo.contents);
  let pending = 0;
  for (const block of writeBlocks(cells)) {
    const area = { sheet: sheetName, top: block.top, left: block.left, rows: block.rows.length, columns: block.rows[0].length };
    sheet.getRange(areaAddress(area)).formulas = block.rows;
    pending += area.rows * area.columns;
    if (pending >= CELLS_PER_SYNC) {
      await context.sync();
      pending = 0;
    }
  }
  for (const cell of cells) if (cell.style) styleCell(sheet.getRange(cell.address), cell.style);
  await context.sync();
  return { ok: true, value: true };
}

export interface WriteBlock {
  /** 0-based row and column of the block's top-left cell. */
  top: number;
  left: number;
  /** What each cell is given (writtenForm), rows of equal length. */
  rows: (string | number)[][];
}

/**
 * The cells as few rectangles as their shape allows, each written with one
 * range: neighbours on a row make a run, and runs of the same columns on
 * consecutive rows a block (at most CELLS_PER_SYNC cells). A cell not in the
 * list is never written, not even as "", so nothing lands in a spill's way.
 */
export function writeBlocks(cells: readonly SheetCell[]): WriteBlock[] {
  const sorted = [...cells].sort((a, b) => a.row - b.row || a.column - b.column);
  const runs: SheetCell[][] = [];
  for (const cell of sorted) {
    const run = runs[runs.length - 1];
    const previous = run?.[run.length - 1];
    if (previous && previous.row === cell.row && previous.column + 1 === cell.column) run.push(cell);
    else runs.push([cell]);
  }
  const blocks: WriteBlock[] = [];
  const open = new Map<string, WriteBlock>();
  for (const run of runs) {
    const top = run[0].row - 1;
    const key = `${run[0].column}:${run.length}`;
    const block = open.get(key);
    if (block && block.top + block.rows.length === top && (block.rows.length + 1) * run.length <= CELLS_PER_SYNC) {
      block.rows.push(run.map(writtenForm));
    } else {
      const started = { top, left: run[0].column, rows: [run.map(writtenForm)] };
      blocks.push(started);
      open.set(key, started);
    }
  }
  return blocks;
}

function styleCell(range: Excel.Range, style: SheetStyle): void {
  if (style === "caution") range.format.font.color = "#C00000";
  else range.format.font.bold = true;
}

async function addSheet(context: Excel.RequestContext, name: string): Promise<Result<string>> {
  const sheets = context.workbook.worksheets;
  sheets.load("items/name");
  await context.sync();
  const taken = new Set(sheets.items.map((s) => s.name.toLowerCase()));
  let chosen = name;
  for (let n = 2; taken.has(chosen.toLowerCase()); n++) chosen = `${name.slice(0, 26)} (${n})`;
  const added = sheets.add(chosen);
  added.activate();
  await context.sync();
  return { ok: true, value: chosen };
}
