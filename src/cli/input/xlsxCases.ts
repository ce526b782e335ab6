/**
 * A case table on a worksheet of an .xlsx workbook (`--sheet`, `--range`),
 * read as a CSV file is: the first non-blank row of the range is the header
 * row; cases as columns are streamed a row at a time through the core's one
 * result-row reader (ids, the "row N" fallback, an id given twice), so the
 * messages are the CSV path's, placed at the sheet and cell (`Results!D17`);
 * cases as rows are read whole by the core's readCaseTable. What a CSV file
 * cannot hold is answered where it stands: a number shown as a date, a formula
 * with no saved value, merged cells. Rows are numbered as the sheet numbers
 * them, so a row whose id cells are blank is "row N" counted from the header
 * row, as in a CSV export of the same sheet.
 */
import {
  cellText,
  columnLetters,
  isBlank,
  namesLoadSymbol,
  problem,
  readCaseHeaders,
  readCaseTable,
  resultRowReader,
  nearest,
  didYouMean,
  type Cell,
  type Problem,
  type Ruleset,
} from "../../core/index.js";
import { sheetPrefix } from "../../sheet/sheetArea.js";
import { CliError } from "../cliError.js";
import { caseStreamOf, lastNonBlank, leaningOrientation, problemsInFile, type CaseFile, type CaseFileOptions, type CaseInput, type CaseStream } from "./caseInput.js";
import { BATCH_ROWS, emptyBatch } from "./rowBatches.js";
import type { CellLocator } from "./locate.js";
import { readWorkbookIndex } from "./workbookCells.js";
import { MAX_WORKBOOK_BYTES, WorkbookPackage, type PackageLimits } from "./workbookPackage.js";
import { parseArea, sheetRows, type SheetArea, type SheetRecord, type SheetRows } from "./xlsxRows.js";
import { readDateStyles } from "./xlsxStyles.js";

/**
 * A worksheet is streamed, never held, so it may inflate far beyond what the audit
 * holds in memory: 4 GB of XML is some ten million rows of a wide export. The
 * shared strings, which are held, keep the audit's limit through the total.
 */
export const CASE_FILE_LIMITS: PackageLimits = {
  workbookBytes: MAX_WORKBOOK_BYTES,
  partBytes: 4096 * 1024 * 1024,
  readBytes: 4096 * 1024 * 1024,
  use: "a case file",
};

export interface SheetChoice {
  /** The sheet's name (case as Excel ignores it); undefined for the first. */
  sheet?: string | undefined;
  /** A1:Q2000; undefined for the used range. */
  range?: string | undefined;
}

export async function openXlsxCases(file: string, ruleset: Ruleset, options: CaseFileOptions & SheetChoice): Promise<CaseInput> {
  const range = options.range === undefined ? null : rangeOf(options.range);
  const pkg = await WorkbookPackage.open(file, CASE_FILE_LIMITS);
  const index = await readWorkbookIndex(pkg);
  if (index.sheets.length === 0) throw new CliError(`${file}: the workbook has no worksheet`);
  let sheet = index.sheets[0];
  if (options.sheet !== undefined) {
    const wanted = options.sheet.trim().toLowerCase();
    const found = index.sheets.find((s) => s.name.toLowerCase() === wanted);
    if (!found) {
      const names = index.sheets.map((s) => s.name);
      throw new CliError(`--sheet: ${file} has no worksheet "${options.sheet}"${didYouMean(nearest(options.sheet, names))} (worksheets: ${names.join(", ")})`);
    }
    sheet = found;
  }
  const dates = await readDateStyles(pkg, index.mainPart);
  const prefix = sheetPrefix(sheet.name);
  const rows = sheetRows(pkg, { part: sheet.part, sharedStrings: index.sharedStrings, dates, range, sheet: sheet.name, prefix });
  const reads = (cell: Cell) => namesLoadSymbol(cellText(cell), ruleset, options.map);
  const records = rows.records;
  const next = async (): Promise<SheetRecord | null> => {
    const step = await records.next();
    return step.done ? null : step.value;
  };

  let header: SheetRecord | null = null;
  for (let r = await next(); r; r = await next()) {
    if (!r.cells.every(isBlank) || r.odd) {
      header = r;
      break;
    }
  }
  const where = `${prefix}${range ? areaText(range) : ""}`.replace(/!$/, "");
  if (!header) throw new CliError(`${file} ${where}: the ${range ? "range" : "worksheet"} is empty; a case table starts with a header row (docs/case-tables.md)`);
  const left = rows.area().left;
  const headerRow = header.row;
  const at = sheetLocator(prefix, left, headerRow);
  const idColumns = options.idColumns;
  // The header row fixes the table's width: the range's, or up to the header row's last named cell.
  const named = lastNonBlank(header.cells) + 1;
  const width = range ? range.right - range.left + 1 : named;
  const table: SheetArea = { top: headerRow, left, bottom: range ? range.bottom : Infinity, right: left + width - 1 };
  refuseOdd(file, header, headerRow, at, "cases-header");

  const buffered: SheetRecord[] = [];
  const whole = async (): Promise<CaseFile> => {
    for (let r = await next(); r; r = await next()) buffered.push(r);
    return wholeTable(file, [header, ...buffered], rows, table, ruleset, options, at, reads);
  };
  const headerReaders = header.cells.slice(idColumns, named).filter(reads).length;
  if (options.layout === "rows" || (options.layout === "auto" && headerReaders === 0)) return whole();
  if (options.layout === "auto") {
    // Cases as columns if the header row names cases and the first result row's id does not read as one (as for CSV).
    for (;;) {
      const r = await next();
      if (!r) return wholeTable(file, [header, ...buffered], rows, table, ruleset, options, at, reads);
      buffered.push(r);
      const firstCell = r.cells[0];
      if (isBlank(firstCell)) continue;
      if (reads(firstCell)) return whole();
      break;
    }
  }
  return sheetStream(file, header, buffered, rows, table, ruleset, options, at, pkg.partSize(sheet.part));
}

function rangeOf(text: string): SheetArea {
  const area = parseArea(text);
  if (!area) throw new CliError(`--range: "${text}" is not a range of cells such as A1:Q2000`);
  return area;
}

function areaText(area: SheetArea): string {
  const first = `${columnLetters(area.left - 1)}${area.top}`;
  if (!Number.isFinite(area.bottom) || !Number.isFinite(area.right)) return `${first}:…`;
  const last = `${columnLetters(area.right - 1)}${area.bottom}`;
  return first === last ? first : `${first}:${last}`;
}

/** Table row r (the header row being row 0) and column c, as the sheet names the cell: `Results!D17`. */
function sheetLocator(prefix: string, left: number, headerRow: number): CellLocator {
  return {
    cell: (row, column) => `${prefix}${columnLetters(left - 1 + column)}${headerRow + row}`,
    row: (row) => `${prefix}${headerRow + row}:${headerRow + row}`,
  };
}

/** A record's odd cells (dates, formulas without a value) refused where they stand. */
function refuseOdd(file: string, record: SheetRecord, headerRow: number, at: CellLocator, kind: "cases-header" | "cases-not-a-number"): void {
  if (!record.odd) return;
  const problems = record.odd.map((o) => problem(kind, o.message, { row: record.row - headerRow, column: o.column }));
  throw problemsInFile(file, problems, at);
}

/** Merged areas that overlap the table: a merged cell reads as its first cell and blanks, which the table must not hold. */
function mergedProblems(rows: SheetRows, table: SheetArea, lastRow: number, at: CellLocator): Problem[] {
  const problems: Problem[] = [];
  for (const m of rows.merges()) {
    if (m.bottom < table.top || m.top > Math.min(table.bottom, lastRow) || m.right < table.left || m.left > table.right) continue;
    const area = `${at.cell(m.top - table.top, m.left - table.left).replace(/^.*!/, "")}:${columnLetters(m.right - 1)}${m.bottom}`;
    const inHeader = m.top === table.top;
    problems.push(
      problem(
        inHeader ? "cases-header" : "cases-not-a-number",
        inHeader
          ? `the header cells ${area} are merged; a case table has one header a column: unmerge them and name each column`
          : `the cells ${area} are merged, so all but the first read as blank; unmerge them and give each cell its value`,
        { row: Math.max(m.top, table.top) - table.top, column: Math.max(m.left, table.left) - table.left },
      ),
    );
  }
  return problems;
}

/** The rest of the sheet read (rows discarded) for its merged areas, which follow the cells. */
async function drain(rows: SheetRows): Promise<void> {
  for await (const _ of rows.records) void _;
}

function refuseBeyondHeader(file: string, record: SheetRecord, named: number, headerRow: number, at: CellLocator): void {
  for (let c = named; c < record.cells.length; c++) {
    if (!isBlank(record.cells[c])) {
      throw new CliError(`${file} ${at.cell(record.row - headerRow, c)}: a value in a column whose header is blank; name the case in the header row or clear the column (or give --range)`);
    }
  }
}

function wholeTable(
  file: string,
  records: SheetRecord[],
  rows: SheetRows,
  table: SheetArea,
  ruleset: Ruleset,
  options: CaseFileOptions,
  at: CellLocator,
  reads: (cell: Cell) => boolean,
): CaseFile {
  const headerRow = table.top;
  const merged = mergedProblems(rows, table, Infinity, at);
  if (merged.length > 0) throw problemsInFile(file, merged, at);
  const width = table.right - table.left + 1;
  // Rows as the sheet numbers them: a row the sheet does not hold is a blank row, as an empty CSV line is.
  const matrix: Cell[][] = [];
  for (const record of records) {
    refuseOdd(file, record, headerRow, at, record.row === headerRow ? "cases-header" : "cases-not-a-number");
    refuseBeyondHeader(file, record, width, headerRow, at);
    while (matrix.length < record.row - headerRow) matrix.push(BLANK_ROW);
    const cells = record.cells.slice();
    while (cells.length < width) cells.push(null);
    matrix.push(cells);
  }
  const orientation = options.layout === "auto" ? leaningOrientation(matrix, options.idColumns, reads) : options.layout;
  const read = readCaseTable(matrix, ruleset, { orientation, idColumns: options.idColumns, map: options.map, numbersAsText: false });
  if (!read.ok) throw problemsInFile(file, read.problems, at);
  return { kind: "table", file, table: read.value, at };
}

const BLANK_ROW: Cell[] = [];

async function sheetStream(
  file: string,
  header: SheetRecord,
  buffered: SheetRecord[],
  rows: SheetRows,
  table: SheetArea,
  ruleset: Ruleset,
  options: CaseFileOptions,
  at: CellLocator,
  partSize: number,
): Promise<CaseStream> {
  const headerRow = header.row;
  const idColumns = options.idColumns;
  const named = lastNonBlank(header.cells) + 1;
  if (named <= idColumns) {
    throw new CliError(`${file} ${at.row(0)}: the header row names no load case after the ${idColumns} result-id column${idColumns === 1 ? "" : "s"}`);
  }
  const headers = readCaseHeaders(header.cells.slice(idColumns, named), ruleset, options.map, (i) => ({ row: 0, column: i + idColumns }));
  if (!headers.ok) return refuseHeaders(file, headers.problems, rows, table, at, idColumns);
  const cases = headers.value;
  const caseCount = cases.length;
  const reader = resultRowReader(cases, { idColumns, numbersAsText: false });
  const batch = emptyBatch(caseCount);
  let lastRow = headerRow;

  const add = (record: SheetRecord): void => {
    const row = record.row - headerRow;
    lastRow = record.row;
    if (record.cells.every(isBlank) && !record.odd) return;
    refuseOdd(file, record, headerRow, at, "cases-not-a-number");
    refuseBeyondHeader(file, record, named, headerRow, at);
    const read = reader.read(record.cells, row);
    if (!read.ok) throw problemsInFile(file, read.problems, at);
    if (!read.value) return;
    const n = batch.count++;
    batch.ids[n] = read.value.id;
    batch.values.set(read.value.values, n * caseCount);
    batch.lines[n] = record.row;
  };

  let bufferedRead = false;
  const fill = async (): Promise<boolean> => {
    if (!bufferedRead) {
      bufferedRead = true;
      for (const record of buffered) add(record);
    }
    while (batch.count < BATCH_ROWS) {
      const next = await rows.records.next();
      if (next.done) {
        const merged = mergedProblems(rows, table, lastRow, at);
        if (merged.length > 0) throw problemsInFile(file, merged, at);
        return false;
      }
      add(next.value);
    }
    return true;
  };
  return caseStreamOf(
    batch,
    {
      fill,
      stoppedBy: (e) => Promise.resolve(e),
      empty: () => new CliError(`${file} ${at.row(0)}: the case table has no result rows below its header row`),
      what: "the worksheet",
      close: async () => {
        await rows.records.return(undefined);
      },
    },
    { file, cases, map: options.map, idHeaders: header.cells.slice(0, idColumns).map(cellText), totalBytes: partSize },
    () => rows.charactersRead(),
    (line) => at.row(line - headerRow),
  );
}

/** The header row's problems, worded as merged cells where a merge is their cause (known only once the sheet is read). */
async function refuseHeaders(file: string, problems: Problem[], rows: SheetRows, table: SheetArea, at: CellLocator, idColumns: number): Promise<never> {
  await drain(rows);
  const merged = mergedProblems(rows, { ...table, bottom: table.top }, table.top, at);
  if (merged.length > 0) throw problemsInFile(file, merged, at);
  const error = problemsInFile(file, problems, at);
  const firstUnknown = problems.find((p) => p.kind === "cases-unknown-symbol" && p.place.column === idColumns);
  if (firstUnknown) error.more.push(`if column ${columnLetters(table.left - 1 + idColumns)} is part of each result row's name, say how many columns name a row: --id-columns ${idColumns + 1}`);
  throw error;
}
