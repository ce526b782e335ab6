/**
 * A case file (CSV or JSON) opened for one ruleset. A cases-as-columns CSV —
 * an analysis export, possibly a million result rows — is streamed: its header
 * row is read once and its result rows come a block at a time, their values
 * read from the file's bytes, so memory stays flat. Everything else (cases-as-rows tables, JSON files) is small and read
 * whole by the core's readCaseTable.
 */
import {
  cellText,
  columnLetters,
  isBlank,
  jsonTextProblem,
  jsonValueProblems,
  readCaseHeaders,
  readCaseTable,
  readValue,
  namesLoadSymbol,
  resultRowReader,
  type CaseMap,
  type CaseTable,
  type Cell,
  type LoadCase,
  type Orientation,
  type Problem,
  type Ruleset,
} from "../../core/index.js";
import { cliErrorOf, CliError } from "../cliError.js";
import type { CsvRecord } from "./csvRecords.js";
import { decimalAt } from "./csvScanner.js";
import { CsvSource } from "./csvSource.js";
import { checkReadable, readText } from "./fileAccess.js";
import { offsetOfPath, positionOf, syntaxErrorOffset } from "./jsonLocation.js";
import { csvLocator, describeInFile, type CellLocator } from "./locate.js";
import { BATCH_ROWS, batchesOf, emptyBatch, rowsOf, type BatchSource, type ResultRow, type RowBatch } from "./rowBatches.js";
import { openXlsxCases } from "./xlsxCases.js";

export type Layout = Orientation | "auto";

export interface CaseFileOptions {
  layout: Layout;
  /** Cases as columns: how many leading columns name a result row. */
  idColumns: number;
  delimiter: string;
  map: CaseMap;
  /** How records are found: in the file's bytes ("bytes", the default), or by csv-parse alone (the general reader the scanner is held to). */
  reader?: "bytes" | "csv-parse";
  /** An .xlsx workbook: the worksheet (default the first) and the range (default the used range). */
  sheet?: string | undefined;
  range?: string | undefined;
}

export interface CaseStream {
  kind: "stream";
  file: string;
  cases: LoadCase[];
  map: CaseMap;
  /** The header row as written, for naming columns. */
  idHeaders: string[];
  /** The result rows in batches (fast), or one at a time (`rows`); use one of the two, once. */
  batches: AsyncGenerator<RowBatch>;
  rows: AsyncGenerator<ResultRow>;
  totalBytes: number;
  bytesRead(): number;
  /** Stop reading (the rows are not wanted, or not all of them). */
  close(): Promise<void>;
  /** Where a row is, by the line `lines` gives for it: "Results!17:17" in a workbook; "line 17" where absent. */
  rowPlace?: (line: number) => string;
}

/** A case stream over one batch and the source that fills it. */
export function caseStreamOf(
  batch: RowBatch,
  source: BatchSource,
  table: { file: string; cases: LoadCase[]; map: CaseMap; idHeaders: string[]; totalBytes: number },
  bytesRead: () => number,
  rowPlace?: (line: number) => string,
): CaseStream {
  return {
    kind: "stream",
    ...table,
    batches: batchesOf(batch, source),
    rows: rowsOf(batchesOf(batch, source), table.cases.length),
    bytesRead,
    close: () => source.close(),
    ...(rowPlace ? { rowPlace } : {}),
  };
}

export interface CaseFile {
  kind: "table";
  file: string;
  table: CaseTable;
  /** The file's line and column of a cell of the table read (for a problem found after reading, such as a sum past the largest number). */
  at: CellLocator;
}

export type CaseInput = CaseStream | CaseFile;

/** The cases and case map of either kind, for planning. */
export function tableShape(input: CaseInput): CaseTable {
  if (input.kind === "table") return input.table;
  return { orientation: "columns", cases: input.cases, components: [], values: [], map: input.map };
}

export async function openCases(file: string, ruleset: Ruleset, options: CaseFileOptions): Promise<CaseInput> {
  if (/\.json$/i.test(file)) return openJsonCases(file, ruleset, options);
  if (/\.xlsx$/i.test(file)) return openXlsxCases(file, ruleset, options);
  if (options.sheet !== undefined || options.range !== undefined) throw new CliError(`${file}: --sheet and --range read an .xlsx workbook; this is not one (its name does not end in .xlsx)`);
  const totalBytes = checkReadable(file, "case file");
  const source = await CsvSource.open(file, options.delimiter, options.reader ?? "bytes");
  const first = await firstRecord(source);
  if (!first) throw new CliError(`${file}: the file is empty; a case file starts with a header row (docs/case-tables.md)`);
  const lastNamed = lastNonBlank(first.cells);
  const reads = (cell: Cell) => namesLoadSymbol(cellText(cell), ruleset, options.map);

  const headerCells = first.cells.slice(options.idColumns, lastNamed + 1);
  const headerReaders = headerCells.filter(reads).length;
  const buffered: CsvRecord[] = [];
  const whole = async (): Promise<CaseFile> => {
    for (let record = await nextRecord(source); record; record = await nextRecord(source)) buffered.push(record);
    return wholeTable(file, [first, ...buffered], ruleset, options, reads);
  };
  if (options.layout === "rows" || (options.layout === "auto" && headerReaders === 0)) return whole();
  if (options.layout === "auto") {
    // Cases as columns if the header row names cases and the first result row's id does not read as one.
    for (;;) {
      const next = await nextRecord(source);
      if (!next) return wholeTable(file, [first, ...buffered], ruleset, options, reads);
      buffered.push(next);
      const firstCell = next.cells[0];
      if (isBlank(firstCell)) continue;
      if (reads(firstCell)) return whole();
      break;
    }
  }
  return caseStream(file, first, buffered, source, ruleset, options, totalBytes);
}

/** The next record as cells, or null at the end of the file. */
async function nextRecord(source: CsvSource): Promise<CsvRecord | null> {
  for (;;) {
    const step = source.next();
    if (step === "record") return source.record();
    if (step === "end") return null;
    await source.refill();
  }
}

async function firstRecord(source: CsvSource): Promise<CsvRecord | null> {
  for (let record = await nextRecord(source); record; record = await nextRecord(source)) if (!record.cells.every(isBlank)) return record;
  return null;
}

export function lastNonBlank(cells: Cell[]): number {
  let last = cells.length - 1;
  while (last >= 0 && isBlank(cells[last])) last--;
  return last;
}

/** Every record as wide as the header row: a ragged file is refused with the line that differs. */
function checkWidth(file: string, record: CsvRecord, header: CsvRecord): void {
  if (record.cells.length === header.cells.length || record.cells.every(isBlank)) return;
  throw widthError(file, record.cells.length, record.line, header);
}

/** A row of `fields` fields at `line` where the header row has another width. */
function widthError(file: string, fields: number, line: number, header: CsvRecord): CliError {
  const width = header.cells.length;
  const where = fields < width ? `column ${columnLetters(fields)}` : `column ${columnLetters(width)}`;
  return new CliError(
    `${file} line ${line}, ${where}: the row has ${fields} field${fields === 1 ? "" : "s"} where the header row (line ${header.line}) has ${width}; every row of a case table has the header row's width`,
  );
}

function wholeTable(file: string, records: CsvRecord[], ruleset: Ruleset, options: CaseFileOptions, reads: (cell: Cell) => boolean): CaseFile {
  for (const record of records) checkWidth(file, record, records[0]);
  const lines = records.map((r) => r.line);
  // An empty line is a blank row as wide as the others: the core skips blank rows.
  const width = records[0].cells.length;
  const matrix: Cell[][] = records.map((r) => (r.cells.every(isBlank) ? new Array<Cell>(width).fill(null) : r.cells));
  const orientation = options.layout === "auto" ? leaningOrientation(matrix, options.idColumns, reads) : options.layout;
  const table = readCaseTable(matrix, ruleset, { orientation, idColumns: options.idColumns, map: options.map, numbersAsText: true });
  const at = csvLocator((row) => lines[row] ?? row + 1);
  if (!table.ok) throw problemsInFile(file, table.problems, at);
  return { kind: "table", file, table: table.value, at };
}

/**
 * Where only one side names any case at all, read the table that way, so that a
 * mistyped header is reported where it is ("Q" names no load symbol) rather
 * than as an undecidable layout. Otherwise the core decides (or says it cannot).
 */
export function leaningOrientation(matrix: Cell[][], idColumns: number, reads: (cell: Cell) => boolean): Layout {
  const header = matrix[0].slice(idColumns).filter((c) => !isBlank(c));
  const firstColumn = matrix.slice(1).map((r) => r[0]).filter((c) => !isBlank(c));
  const inHeader = header.filter(reads).length;
  const inColumn = firstColumn.filter(reads).length;
  if (inHeader > 0 && inColumn === 0) return "columns";
  if (inColumn > 0 && inHeader === 0) return "rows";
  return "auto";
}

export function problemsInFile(file: string, problems: Problem[], at: CellLocator): CliError {
  return cliErrorOf(problems.map((p) => describeInFile(file, p, at)));
}

function caseStream(
  file: string,
  header: CsvRecord,
  buffered: CsvRecord[],
  source: CsvSource,
  ruleset: Ruleset,
  options: CaseFileOptions,
  totalBytes: number,
): CaseStream {
  const width = header.cells.length;
  const named = lastNonBlank(header.cells) + 1;
  const idColumns = options.idColumns;
  if (named <= idColumns) {
    throw new CliError(`${file} line ${header.line}: the header row names no load case after the ${idColumns} result-id column${idColumns === 1 ? "" : "s"}`);
  }
  const headers = readCaseHeaders(header.cells.slice(idColumns, named), ruleset, options.map, (i) => ({ row: header.line - 1, column: i + idColumns }));
  if (!headers.ok) {
    const error = problemsInFile(file, headers.problems, csvLocator((row) => row + 1));
    // "station" right after the id column of "member,station,D,L": more columns name a result row.
    const firstUnknown = headers.problems.find((p) => p.kind === "cases-unknown-symbol" && p.place.column === idColumns);
    if (firstUnknown) error.more.push(`if column ${columnLetters(idColumns)} is part of each result row's name, say how many columns name a row: --id-columns ${idColumns + 1}`);
    throw error;
  }
  const cases = headers.value;
  const caseCount = cases.length;
  const rowReader = resultRowReader(cases, { idColumns, numbersAsText: true });
  // Rows are counted from the header row (row 0), as the whole-table reader counts them; lines are the file's.
  const lines = lineBook(header.line);
  const at = csvLocator((row) => lines.lineOf(row));
  let nextRow = 1;

  const batch = emptyBatch(caseCount);
  const problems: Problem[] = [];

  const refuseUnnamed = (column: number, line: number) =>
    new CliError(`${file} line ${line}, column ${columnLetters(column)}: a value in a column whose header is blank; name the case in the header row or clear the column`);

  /** A record given as cells (read while the layout was decided, or by csv-parse): the core reads it whole. */
  const addCells = (record: CsvRecord): void => {
    const row = nextRow++;
    lines.note(row, record.line);
    if (record.cells.every(isBlank)) return;
    if (record.cells.length !== width) throw widthError(file, record.cells.length, record.line, header);
    const read = rowReader.read(record.cells, row);
    for (let c = named; c < width; c++) if (!isBlank(record.cells[c])) throw refuseUnnamed(c, record.line);
    if (!read.ok) throw problemsInFile(file, read.problems, at);
    if (!read.value) return;
    const n = batch.count++;
    batch.ids[n] = read.value.id;
    batch.values.set(read.value.values, n * caseCount);
    batch.lines[n] = record.line;
  };

  /**
   * A record in the scanner's fields: the same reading as the core's, with each
   * value read from its bytes where it is a plain decimal number, and by the
   * core's readValue from its text otherwise (blanks, spaces, text: its words).
   */
  const addScanned = (): void => {
    const row = nextRow++;
    const line = source.line;
    lines.note(row, line);
    const scanner = source.scanner;
    const fields = scanner.fieldCount;
    const numbers = scanner.fieldValue;
    // A number in the first value field (read by the scanner) is no blank; otherwise every field is looked at.
    if (!(fields > idColumns && numbers[idColumns] === numbers[idColumns]) && allBlank(source)) return;
    if (fields !== width) throw widthError(file, fields, line, header);
    const idCells: string[] = [];
    for (let c = 0; c < idColumns; c++) idCells.push(source.text(c));
    const id = rowReader.idOf(idCells, row);
    problems.length = 0;
    const repeated = rowReader.claim(id, row);
    if (repeated) problems.push(repeated);
    const n = batch.count;
    const base = n * caseCount;
    const values = batch.values;
    const { buf, fieldStart, fieldEnd } = scanner;
    for (let k = 0; k < caseCount; k++) {
      const c = k + idColumns;
      let v = numbers[c];
      if (v !== v) {
        // Not read on the way (quoted, long, text or blank): read from the bytes where it is a decimal number at all.
        v = decimalAt(buf, fieldStart[c], fieldEnd[c]);
        // Not a plain decimal (NaN), or one beyond the largest double ("1e400" is Infinity): the core reads the text, and refuses the latter.
        if (v - v !== 0) v = readValue(source.text(c), { row, column: c }, cases[k].header, VALUE_OPTIONS, problems);
      }
      values[base + k] = v;
    }
    for (let c = named; c < width; c++) if (!fieldBlank(source, c)) throw refuseUnnamed(c, line);
    if (problems.length > 0) throw problemsInFile(file, problems, at);
    batch.count = n + 1;
    batch.ids[n] = id;
    batch.lines[n] = line;
  };

  let bufferedRead = false;
  const fill = async (): Promise<boolean> => {
    if (!bufferedRead) {
      bufferedRead = true;
      for (const record of buffered) addCells(record);
    }
    for (;;) {
      const step = source.next();
      if (step === "record") {
        if (source.fromBytes) addScanned();
        else addCells(source.record());
        if (batch.count === BATCH_ROWS) return true;
        continue;
      }
      if (step === "end") return false;
      await source.refill();
    }
  };
  return caseStreamOf(
    batch,
    {
      fill,
      // Unless the file was cut meanwhile, which is what the "bad row" then is.
      stoppedBy: async (e) => (e instanceof CliError ? ((await source.shrinkError()) ?? e) : e),
      empty: () => new CliError(`${file}: the case table has no result rows below its header row`),
      what: "the case file",
      close: () => source.close(),
    },
    { file, cases, map: options.map, idHeaders: header.cells.slice(0, idColumns).map(cellText), totalBytes },
    () => source.bytesRead(),
  );
}

const VALUE_OPTIONS = { numbersAsText: true };

/** A field is blank as the core's isBlank says: nothing but white space. */
function fieldBlank(source: CsvSource, k: number): boolean {
  const { buf, fieldStart, fieldEnd } = source.scanner;
  for (let p = fieldStart[k]; p < fieldEnd[k]; p++) {
    const b = buf[p];
    if (b === 0x20 || (b >= 0x09 && b <= 0x0d)) continue;
    // Other white space (no-break space, …) is not ASCII: the text decides.
    return b < 0x80 ? false : isBlank(source.text(k));
  }
  return true;
}

function allBlank(source: CsvSource): boolean {
  for (let k = 0; k < source.scanner.fieldCount; k++) if (!fieldBlank(source, k)) return false;
  return true;
}

function openJsonCases(file: string, ruleset: Ruleset, options: CaseFileOptions): CaseFile {
  const text = readText(file, "case file");
  // Nested beyond the limit: refused before the recursive readers that locate places see it.
  const deep = jsonTextProblem(text, { what: "case file" });
  if (deep) throw new CliError(`${file}: ${deep.message}`);
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new CliError(`${file}${jsonErrorPlace(text)}: not valid JSON: ${jsonErrorMessage(e)}`);
  }
  const forbidden = jsonValueProblems(data);
  if (forbidden.length > 0) throw cliErrorOf(forbidden.map((p) => `${file} ${lineColumn(text, p.place.path ?? [])}: ${p.message}`));
  const at: CellLocator = {
    cell: (row, column) => lineColumn(text, [row, column]),
    row: (row) => lineColumn(text, [row]),
  };
  const shape = "a JSON case file is an array of rows, each an array of cells (text, numbers or null), the header row first";
  if (!Array.isArray(data)) throw new CliError(`${file} ${lineColumn(text, [])}: ${shape}`);
  const matrix: Cell[][] = [];
  data.forEach((row: unknown, r) => {
    if (!Array.isArray(row)) throw new CliError(`${file} ${lineColumn(text, [r])}: row ${r + 1} is not an array; ${shape}`);
    row.forEach((cell: unknown, c) => {
      if (cell !== null && typeof cell === "object") throw new CliError(`${file} ${lineColumn(text, [r, c])}: a cell holds an ${Array.isArray(cell) ? "array" : "object"}; ${shape}`);
    });
    matrix.push(row as Cell[]);
  });
  const table = readCaseTable(matrix, ruleset, { orientation: options.layout, idColumns: options.idColumns, map: options.map, numbersAsText: false });
  if (!table.ok) throw problemsInFile(file, table.problems, at);
  return { kind: "table", file, table: table.value, at };
}

function lineColumn(text: string, path: (string | number)[]): string {
  const p = positionOf(text, offsetOfPath(text, path));
  return `line ${p.line}, column ${p.column}`;
}

/** " line L, column C" of a JSON syntax error. */
export function jsonErrorPlace(text: string): string {
  const offset = syntaxErrorOffset(text);
  if (offset === null) return "";
  const p = positionOf(text, offset);
  return ` line ${p.line}, column ${p.column}`;
}

/** JSON.parse's message without its position and its copy of the text. */
export function jsonErrorMessage(e: unknown): string {
  const message = e instanceof Error ? e.message : String(e);
  return message
    .replace(/\s*\(line \d+ column \d+\)/, "")
    .replace(/ in JSON at position \d+/, "")
    .replace(/^(Unexpected token '.'), [\s\S]*$/, "$1");
}

/**
 * Which file line each table row (counted from the header row) starts on,
 * for rows already read: kept as the points where a row's line stops being
 * the previous row's line + 1 (a quoted field over several lines), so memory
 * stays flat for a file of a million rows.
 */
function lineBook(headerLine: number): { note(row: number, line: number): void; lineOf(row: number): number } {
  const rows: number[] = [0];
  const offsets: number[] = [headerLine];
  return {
    note(row, line) {
      if (line - row !== offsets[offsets.length - 1]) {
        rows.push(row);
        offsets.push(line - row);
      }
    },
    lineOf(row) {
      let lo = 0;
      let hi = rows.length - 1;
      while (lo < hi) {
        const mid = (lo + hi + 1) >> 1;
        if (rows[mid] <= row) lo = mid;
        else hi = mid - 1;
      }
      return row + offsets[lo];
    },
  };
}
