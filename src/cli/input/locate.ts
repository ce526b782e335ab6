/**
 * Problems from the core carry a 0-based row/column of the input matrix; the
 * user needs the file, line and column they can open. These turn one into the
 * other: "cases.csv line 5, column D (L:roof)".
 */
import { columnLetters, describeProblem, type Problem } from "../../core/index.js";

export interface CellLocator {
  /** "line 5, column D" for a 0-based matrix row and column. */
  cell(row: number, column: number): string;
  /** "line 5" for a whole matrix row. */
  row(row: number): string;
}

/** CSV: matrix row r came from line lineOf(r); columns are spreadsheet letters, as Excel shows the file. */
export function csvLocator(lineOf: (row: number) => number): CellLocator {
  return {
    cell: (row, column) => `line ${lineOf(row)}, column ${columnLetters(column)}`,
    row: (row) => `line ${lineOf(row)}`,
  };
}

/** One located line: `file line L, column C (header): message`, or `file: message` where the core gave no cell. */
export function describeInFile(file: string, p: Problem, at: CellLocator): string {
  const { row, column, header, ...rest } = p.place;
  // What is left (JSON path, entry, character, a second cell such as a duplicate's first place) the core words;
  // the callback turns that second cell into the file's line and column too.
  const text = describeProblem({ ...p, place: rest }, { cell: (row, column) => at.cell(row, column) });
  const named = header !== undefined ? ` (${header})` : "";
  if (row !== undefined && column !== undefined) return `${file} ${at.cell(row, column)}${named}: ${text}`;
  if (row !== undefined) return `${file} ${at.row(row)}${named}: ${text}`;
  return `${file}: ${text}`;
}
