/**
 * A case file (CSV or JSON) opened for one ruleset. A cases-as-columns CSV —
 * an analysis export, possibly a million result rows — is streamed: its header
 * row is read once and its result rows come one at a time, so memory stays
 * flat. Everything else (cases-as-rows tables, JSON files) is small and read
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
  symbolOfHeader,
  type CaseMap,
  type CaseTable,
  type Cell,
  type LoadCase,
  type Orientation,
  type Problem,
  type Ruleset,
} from "../../core/index.js";
import { cliErrorOf, CliError } from "../cliError.js";
import { readCsv, type CsvReader, type CsvRecord } from "./csvRecords.js";
import { checkReadable, readText } from "./fileAccess.js";
import { offsetOfPath, positionOf, syntaxErrorOffset } from "./jsonLocation.js";
import { csvLocator, describeInFile, type CellLocator } from "./locate.js";

export type Layout = Orientation | "auto";

export interface CaseFileOptions {
  layout: Layout;
  /** Cases as columns: how many leading columns name a result row. */
  idColumns: number;
  delimiter: string;
  map: CaseMap;
}

/** One result row of a cases-as-columns file. */
export interface ResultRow {
  id: string;
  /** Value per case, in the order of `cases`. */
  values: Float64Array;
  line: number;
}

export interface CaseStream {
  kind: "stream";
  file: string;
  cases: LoadCase[];
  map: CaseMap;
  /** The header row as written, for naming columns. */
  idHeaders: string[];
  rows: AsyncGenerator<ResultRow>;
  totalBytes: number;
  bytesRead(): number;
  /** Stop reading (the rows are not wanted, or not all of them). */
  close(): Promise<void>;
}

export interface CaseFile {
  kind: "table";
  file: string;
  table: CaseTable;
}

export type CaseInput = CaseStream | CaseFile;

/** The cases and case map of either kind, for planning. */
export function tableShape(input: CaseInput): CaseTable {
  if (input.kind === "table") return input.table;
  return { orientation: "columns", cases: input.cases, components: [], values: [], map: input.map };
}

export async function openCases(file: string, ruleset: Ruleset, options: CaseFileOptions): Promise<CaseInput> {
  if (/\.json$/i.test(file)) return openJsonCases(file, ruleset, options);
  const totalBytes = checkReadable(file, "case file");
  const reader = readCsv(file, { delimiter: options.delimiter });
  const first = await firstRecord(reader);
  if (!first) throw new CliError(`${file}: the file is empty; a case file starts with a header row (docs/case-tables.md)`);
  const lastNamed = lastNonBlank(first.cells);
  const reads = (cell: Cell) => !("error" in symbolOfHeader(cellText(cell), ruleset, options.map));

  const headerCells = first.cells.slice(options.idColumns, lastNamed + 1);
  const headerReaders = headerCells.filter(reads).length;
  const buffered: CsvRecord[] = [];
  const whole = async (): Promise<CaseFile> => {
    for await (const record of reader.records) buffered.push(record);
    return wholeTable(file, [first, ...buffered], ruleset, options, reads);
  };
  if (options.layout === "rows" || (options.layout === "auto" && headerReaders === 0)) return whole();
  if (options.layout === "auto") {
    // Cases as columns if the header row names cases and the first result row's id does not read as one.
    for (;;) {
      const next = await reader.records.next();
      if (next.done) return wholeTable(file, [first, ...buffered], ruleset, options, reads);
      buffered.push(next.value);
      const firstCell = next.value.cells[0];
      if (isBlank(firstCell)) continue;
      if (reads(firstCell)) return whole();
      break;
    }
  }
  return caseStream(file, first, buffered, reader, ruleset, options, totalBytes);
}

async function firstRecord(reader: CsvReader): Promise<CsvRecord | null> {
  for (;;) {
    const next = await reader.records.next();
    if (next.done) return null;
    if (!next.value.cells.every(isBlank)) return next.value;
  }
}

function lastNonBlank(cells: Cell[]): number {
  let last = cells.length - 1;
  while (last >= 0 && isBlank(cells[last])) last--;
  return last;
}

/** Every record as wide as the header row: a ragged file is refused with the line that differs. */
function checkWidth(file: string, record: CsvRecord, header: CsvRecord): void {
  const width = header.cells.length;
  if (record.cells.length === width || record.cells.every(isBlank)) return;
  const n = record.cells.length;
  const where = n < width ? `column ${columnLetters(n)}` : `column ${columnLetters(width)}`;
  throw new CliError(
    `${file} line ${record.line}, ${where}: the row has ${n} field${n === 1 ? "" : "s"} where the header row (line ${header.line}) has ${width}; every row of a case table has the header row's width`,
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
  if (!table.ok) throw problemsInFile(file, table.problems, csvLocator((row) => lines[row] ?? row + 1));
  return { kind: "table", file, table: table.value };
}

/**
 * Where only one side names any case at all, read the table that way, so that a
 * mistyped header is reported where it is ("Q" names no load symbol) rather
 * than as an undecidable layout. Otherwise the core decides (or says it cannot).
 */
function leaningOrientation(matrix: Cell[][], idColumns: number, reads: (cell: Cell) => boolean): Layout {
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
  reader: CsvReader,
  ruleset: Ruleset,
  options: CaseFileOptions,
  totalBytes: number,
): CaseStream {
  const width = header.cells.length;
  const named = lastNonBlank(header.cells) + 1;
  const idColumns = options.idColumns;
  const at = csvLocator((row) => row + 1);
  if (named <= idColumns) {
    throw new CliError(`${file} line ${header.line}: the header row names no load case after the ${idColumns} result-id column${idColumns === 1 ? "" : "s"}`);
  }
  const headers = readCaseHeaders(header.cells.slice(idColumns, named), ruleset, options.map, (i) => ({ row: header.line - 1, column: i + idColumns }));
  if (!headers.ok) {
    const error = problemsInFile(file, headers.problems, at);
    // "station" right after the id column of "member,station,D,L": more columns name a result row.
    const firstUnknown = headers.problems.find((p) => p.kind === "cases-unknown-symbol" && p.place.column === idColumns);
    if (firstUnknown) error.more.push(`if column ${columnLetters(idColumns)} is part of each result row's name, say how many columns name a row: --id-columns ${idColumns + 1}`);
    throw error;
  }
  const cases = headers.value;
  const valueOptions = { numbersAsText: true };

  async function* rows(): AsyncGenerator<ResultRow> {
    let count = 0;
    const toRow = (record: CsvRecord): ResultRow | null => {
      if (record.cells.every(isBlank)) return null;
      checkWidth(file, record, header);
      const problems: Problem[] = [];
      const row = record.line - 1;
      const id =
        record.cells
          .slice(0, idColumns)
          .map(cellText)
          .filter((t) => t !== "")
          .join(" / ") || `line ${record.line}`;
      const values = new Float64Array(cases.length);
      for (let k = 0; k < cases.length; k++) {
        values[k] = readValue(record.cells[k + idColumns], { row, column: k + idColumns }, cases[k].header, valueOptions, problems);
      }
      for (let c = named; c < width; c++) {
        if (!isBlank(record.cells[c])) {
          throw new CliError(`${file} line ${record.line}, column ${columnLetters(c)}: a value in a column whose header is blank; name the case in the header row or clear the column`);
        }
      }
      if (problems.length > 0) throw problemsInFile(file, problems, at);
      return { id, values, line: record.line };
    };
    for (const record of buffered) {
      const row = toRow(record);
      if (row) {
        count++;
        yield row;
      }
    }
    for await (const record of reader.records) {
      const row = toRow(record);
      if (row) {
        count++;
        yield row;
      }
    }
    if (count === 0) throw new CliError(`${file}: the case table has no result rows below its header row`);
  }

  return {
    kind: "stream",
    file,
    cases,
    map: options.map,
    idHeaders: header.cells.slice(0, idColumns).map(cellText),
    rows: rows(),
    totalBytes,
    bytesRead: reader.bytesRead,
    close: async () => {
      await reader.records.return(undefined);
    },
  };
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
  return { kind: "table", file, table: table.value };
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
