/**
 * Generated case tables and value cells for the robustness classes, seeded
 * through fast-check: every kind of value a worksheet cell, a CSV field or a
 * JSON cell can hold (numbers of every size, −0, subnormals, NaN, ±Infinity,
 * blanks, text, booleans, spreadsheet error values, numbers written as text
 * past the largest double), tables of every shape (empty, header only, one
 * row, ragged, duplicate and blank headers, duplicate result ids), the ways a
 * file can be written (byte order mark, CRLF or CR, quoting, another
 * delimiter) and unusual Unicode. Plain data in, a matrix or file text out.
 */
import fc from "fast-check";
import type { Cell } from "../../src/core/index.js";

/** The ruleset every class reads its tables for: shipped, no parameter needed; G permanent, Q, S, T transient, W reversible. */
export const RULESET = "en1990-str-6.10";

export const HEADERS = ["G", "Q", "S", "T", "W:N", "W:E", "G:self", "Q:roof"] as const;

/** The largest finite double and the smallest subnormal (IEEE 754 binary64; ECMA-262 Number.MAX_VALUE and Number.MIN_VALUE). */
export const LARGEST = 1.7976931348623157e308;
export const SMALLEST = 5e-324;

/** Numbers a value cell may hold: ordinary, at both ends of the doubles, and near the top (sums past it). */
export const finiteNumber: fc.Arbitrary<number> = fc.oneof(
  { weight: 4, arbitrary: fc.integer({ min: -1000, max: 1000 }) },
  { weight: 2, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
  { weight: 2, arbitrary: fc.constantFrom(0, -0, SMALLEST, -SMALLEST, 2.2250738585072014e-308, LARGEST, -LARGEST, 1.7e308, -1.7e308, 1e308, 9e307, -9e307, 0.1, 12.5) },
);

/** Number cells that are not finite. */
export const hostileNumber: fc.Arbitrary<number> = fc.constantFrom(NaN, Infinity, -Infinity);

/** The error values a spreadsheet cell can show. */
export const ERROR_VALUES = ["#N/A", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#NULL!", "#SPILL!", "#CALC!"] as const;

/** Text that reads as a number, or nearly: past the largest double, below the smallest, odd forms. */
export const numberLikeText: fc.Arbitrary<string> = fc.oneof(
  finiteNumber.map(String),
  finiteNumber.map((n) => n.toExponential()),
  fc.constantFrom("1e400", "-1e400", "1e-400", "1.8e308", "-1.8e308", `1${"0".repeat(400)}`, "+.5", "5.", "1E3", " 12 ", "-0", "0x1A", "1,5", "1_000", "Infinity", "-Infinity", "NaN", "1e", "e5", "--1", "1.2.3", "١٢", "１２"),
);

/** Words and strings of every kind, unusual Unicode included. */
export const wordText: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom("n/a", "abc", "TRUE", "FALSE", "12 kN", "∞", "‐5", "−5", "null", "undefined", "__proto__", "toString", "é", "e\u0301", "שלום", "مرحبا", "😀", "\u0000", "\u200b", "\ufeff5"),
  fc.string({ maxLength: 8 }),
  fc.string({ unit: "grapheme", maxLength: 6 }),
);

export const blankCell: fc.Arbitrary<Cell> = fc.constantFrom<Cell>(null, undefined, "", "  ", "\t");

/** Finite numbers only, many of them near the largest double, so that factored sums pass it (and +∞ meets −∞). */
export const nearLimit: fc.Arbitrary<number> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(LARGEST, -LARGEST, 1.7e308, -1.7e308, 1.2e308, -1.2e308, 9e307, -9e307) },
  { weight: 1, arbitrary: fc.constantFrom(0, -0, SMALLEST, -SMALLEST, 1, -1) },
  { weight: 1, arbitrary: fc.double({ min: -LARGEST, max: LARGEST, noNaN: true }) },
);

/** Any value a worksheet cell gives a formula: mostly numbers, so that most rows reach the evaluation. */
export const worksheetValue: fc.Arbitrary<Cell> = fc.oneof(
  { weight: 30, arbitrary: finiteNumber },
  { weight: 1, arbitrary: hostileNumber },
  { weight: 2, arbitrary: blankCell },
  { weight: 1, arbitrary: numberLikeText },
  { weight: 1, arbitrary: wordText },
  { weight: 1, arbitrary: fc.boolean() },
  { weight: 1, arbitrary: fc.constantFrom(...ERROR_VALUES) },
);

/** Any text a CSV value field holds: mostly numbers, so that most rows reach the evaluation. */
export const csvValue: fc.Arbitrary<string> = fc.oneof(
  { weight: 30, arbitrary: finiteNumber.map(String) },
  { weight: 2, arbitrary: numberLikeText },
  { weight: 2, arbitrary: fc.constantFrom("", " ", "\t") },
  { weight: 1, arbitrary: wordText },
  { weight: 1, arbitrary: fc.constantFrom("TRUE", "FALSE", ...ERROR_VALUES) },
);

/** Result ids from a small pool, so that some repeat; blank ones read as "row N". */
export const resultId: fc.Arbitrary<string> = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom("C1 top", "C1 bottom", "B2", "M12 / 0.5", "wall, east", 'say "hi"') },
  { weight: 1, arbitrary: fc.constantFrom("", " ") },
  { weight: 1, arbitrary: wordText },
);

/** A case header: mostly ones the ruleset reads, some that it does not, blank or whitespace-only. */
export const caseHeader: fc.Arbitrary<string> = fc.oneof(
  { weight: 8, arbitrary: fc.constantFrom(...HEADERS) },
  { weight: 1, arbitrary: fc.constantFrom("X", "g", "W:", "", "   ", "\t", " G ", "W:N ", "Wn", "L") },
  { weight: 1, arbitrary: wordText },
);

export interface TableSpec {
  headers: string[];
  ids: string[];
  /** values[row][case]: as many as headers, or not (a ragged row). */
  values: string[][];
}

/** A cases-as-columns table of 0–6 result rows, some ragged where asked. */
export function columnsTable(value: fc.Arbitrary<string>, options: { ragged?: boolean; minRows?: number; maxRows?: number; oddHeaders?: boolean } = {}): fc.Arbitrary<TableSpec> {
  const odd = options.oddHeaders ?? true;
  return fc.uniqueArray(fc.constantFrom(...HEADERS), { minLength: 1, maxLength: 4 }).chain((chosen) =>
    fc
      .record({
        headers: fc.tuple(...chosen.map((h) => (odd ? fc.oneof({ weight: 12, arbitrary: fc.constant(h) }, { weight: 1, arbitrary: caseHeader }) : fc.constant(h)))),
        rows: fc.array(
          fc.record({
            id: resultId,
            values: fc.array(value, { minLength: chosen.length, maxLength: chosen.length }),
            cut: options.ragged ? fc.oneof({ weight: 5, arbitrary: fc.constant(0) }, { weight: 1, arbitrary: fc.integer({ min: -2, max: 2 }) }) : fc.constant(0),
          }),
          { minLength: options.minRows ?? 1, maxLength: options.maxRows ?? 6 },
        ),
      })
      .map(({ headers, rows }) => ({
        headers,
        ids: rows.map((r) => r.id),
        values: rows.map((r) => (r.cut < 0 ? r.values.slice(0, Math.max(0, r.values.length + r.cut)) : [...r.values, ...new Array<string>(r.cut).fill("1")])),
      })),
  );
}

/** The table as rows of text, the header row first ("result" over the ids). */
export function tableRows(t: TableSpec): string[][] {
  return [["result", ...t.headers], ...t.ids.map((id, r) => [id, ...t.values[r]])];
}

export interface CsvStyle {
  bom: boolean;
  lineEnd: "\n" | "\r\n" | "\r";
  quoteAll: boolean;
  finalLineEnd: boolean;
  delimiter: "," | ";";
}

export const csvStyle: fc.Arbitrary<CsvStyle> = fc.record({
  bom: fc.boolean(),
  lineEnd: fc.constantFrom<CsvStyle["lineEnd"]>("\n", "\r\n", "\r"),
  quoteAll: fc.boolean(),
  finalLineEnd: fc.boolean(),
  delimiter: fc.constantFrom<CsvStyle["delimiter"]>(",", ";"),
});

export const PLAIN_CSV: CsvStyle = { bom: false, lineEnd: "\n", quoteAll: false, finalLineEnd: true, delimiter: "," };

/** A field written as RFC 4180 writes it (https://www.rfc-editor.org/rfc/rfc4180, §2 rules 5–7): quoted where it must be, "" for a quote. */
export function csvField(text: string, style: CsvStyle): string {
  const must = text.includes(style.delimiter) || /["\r\n]/.test(text);
  return must || style.quoteAll ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvText(rows: string[][], style: CsvStyle = PLAIN_CSV): string {
  const body = rows.map((r) => r.map((f) => csvField(f, style)).join(style.delimiter)).join(style.lineEnd);
  return `${style.bom ? "\ufeff" : ""}${body}${style.finalLineEnd ? style.lineEnd : ""}`;
}

/** A worksheet range as the formulas get it: the same table with cells of any kind. */
export function worksheetTable(value: fc.Arbitrary<Cell>): fc.Arbitrary<Cell[][]> {
  return fc.uniqueArray(fc.constantFrom(...HEADERS), { minLength: 1, maxLength: 4 }).chain((headers) =>
    fc
      .array(fc.tuple(resultId, fc.array(value, { minLength: headers.length, maxLength: headers.length })), { minLength: 1, maxLength: 5 })
      .map((rows) => [["result", ...headers], ...rows.map(([id, values]) => [id, ...values])] as Cell[][]),
  );
}

/** Describes a generated file for a failure report. */
export function shownFile(text: string | Buffer): string {
  return typeof text === "string" ? text : `bytes ${text.toString("hex").slice(0, 400)}`;
}
