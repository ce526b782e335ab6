/**
 * Robustness classes: case tables of every shape and every way of being
 * written, through the worksheet reader (the formulas) and the command line's
 * readers (run in this process): empty, header only, one row, ragged rows,
 * blank, whitespace-only and duplicate headers, duplicate result ids; byte
 * order marks, CRLF and CR line ends, quoted fields with delimiters and line
 * breaks, another delimiter; unusual Unicode; binary garbage. Every input gets
 * a defined result or located problems. Where the answer is known without the
 * engine it is checked too: a table written another way gives the same output,
 * byte for byte; result ids come out exactly as written (trimmed, "row N" where
 * blank: docs/case-tables.md, "Result ids").
 */
import { parse } from "csv-parse/sync";
import fc from "fast-check";
import { describe } from "vitest";
import type { Cell } from "../../src/core/index.js";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { fuzzClass, fuzzClassAsync } from "../fuzz/fuzzClass.js";
import { shown, type Verdict } from "../fuzz/robustness.js";
import { evaluateFormula } from "../functions/outcome.js";
import { caseHeader, columnsTable, csvStyle, csvText, csvValue, finiteNumber, HEADERS, PLAIN_CSV, RULESET, tableRows, type CsvStyle, type TableSpec } from "./caseGenerators.js";
import { cliInProcess, scratch } from "./cliInProcess.js";
import { cliVerdict, envelopeCsvOutput, formulaVerdict } from "./verdicts.js";

const files = scratch("tables");

/** Any shape: 0–5 rows, ragged rows, odd and repeated headers, repeated and blank ids. */
const anyShape: fc.Arbitrary<TableSpec> = fc
  .tuple(columnsTable(csvValue, { ragged: true, minRows: 0, maxRows: 5 }), fc.nat(9), caseHeader)
  .map(([t, twice, extra]) => (twice === 0 && t.headers.length > 0 ? { ...t, headers: [...t.headers, t.headers[0]], values: t.values.map((v) => [...v, "1"]) } : twice === 1 ? { ...t, headers: [...t.headers, extra], values: t.values.map((v) => [...v, "2"]) } : t));

/** The rows of a table as a worksheet range: rectangular, padded with blanks; numbers where the text is one. */
function asRange(t: TableSpec): Cell[][] {
  const rows = tableRows(t);
  const width = Math.max(...rows.map((r) => r.length));
  return rows.map((r, i) => Array.from({ length: width }, (_, c) => (c >= r.length ? null : i > 0 && c > 0 && r[c].trim() !== "" && Number.isFinite(Number(r[c])) ? Number(r[c]) : r[c])));
}

const describeTable = (t: TableSpec) => shown(csvText(tableRows(t)));

describe("tables of every shape", () => {
  fuzzClass(
    "case tables: shapes in a worksheet (empty, header only, one row, ragged, blank and repeated headers, repeated ids)",
    0.03,
    fc.oneof({ weight: 12, arbitrary: anyShape.map(asRange) }, { weight: 1, arbitrary: fc.constantFrom<Cell[][]>([], [[]], [[null]], [[""]], [["result"]], [["", ""], ["", ""]]) }),
    (range) => formulaVerdict(evaluateFormula(ENVELOPE, [range, [[RULESET]], null, null], ["Loads!A1:Z99", "Loads!AB1"]), "Loads"),
    (r) => JSON.stringify(r),
  );

  fuzzClassAsync(
    "case tables: shapes in a CSV file, streamed and read whole (envelope, factored)",
    0.02,
    anyShape,
    async (t) => {
      const file = files.file("csv", csvText(tableRows(t)));
      const envelope = await cliInProcess(["envelope", file, "--ruleset", RULESET, "--format", "csv", "--threads", "1"]);
      const factored = await cliInProcess(["factored", file, "--ruleset", RULESET, "--format", "csv"]);
      const a = cliVerdict(envelope, file, envelopeCsvOutput);
      const b = cliVerdict(factored, file);
      return { located: a.located && b.located, wrongOutput: a.wrongOutput ?? b.wrongOutput };
    },
    describeTable,
  );
});

/** A table of numbers, ids that need quoting (a delimiter, a quote, a line break), in any style. */
const styled = fc.tuple(
  columnsTable(finiteNumber.map(String), { oddHeaders: false, maxRows: 5 }).chain((t) =>
    fc.array(fc.constantFrom("wall, east", 'say "hi"', "two\nlines", "semi;colon", "cr\rhere", " padded "), { minLength: t.ids.length, maxLength: t.ids.length }).map((ids) => ({ ...t, ids: ids.map((id, k) => (k % 2 === 0 ? id : t.ids[k])) })),
  ),
  csvStyle,
);

async function sameAsPlain([t, style]: [TableSpec, CsvStyle]): Promise<Verdict> {
  const rows = tableRows(t);
  const plainFile = files.file("csv", csvText(rows, PLAIN_CSV));
  const styledFile = files.file("csv", csvText(rows, style));
  const args = (file: string, delimiter: string) => ["envelope", file, "--ruleset", RULESET, "--format", "csv", "--threads", "1", "--delimiter", delimiter];
  const plain = await cliInProcess(args(plainFile, ","));
  const other = await cliInProcess(args(styledFile, style.delimiter));
  const verdict = cliVerdict(other, styledFile, envelopeCsvOutput);
  const named = (text: string, file: string) => text.split(file).join("FILE");
  const same = plain.status === other.status && plain.stdout === other.stdout && named(plain.stderr, plainFile) === named(other.stderr, styledFile);
  return { located: verdict.located, wrongOutput: verdict.wrongOutput ?? (same ? null : `differs from the plain file: ${JSON.stringify({ plain, other })}`) };
}

describe("how a CSV file is written", () => {
  fuzzClassAsync(
    "case tables: byte order mark, CRLF and CR, quoted delimiters and line breaks, ';' (the same output as the plain file)",
    0.02,
    styled,
    sameAsPlain,
    ([t, style]) => shown(csvText(tableRows(t), style)),
  );
});

/** Text of unusual Unicode: combining marks, right-to-left scripts, emoji and their sequences, NUL and other controls. */
const unusual: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom("e\u0301\u0302", "\u05e9\u05dc\u05d5\u05dd", "\u0645\u0631\u062d\u0628\u0627 C1", "\u202eC1", "👩‍👩‍👧", "🏳️‍🌈", "C\u0000 1", "\u0007bell", "\u00a0C1\u00a0", "Ⅻ", "ﬁ", "\u{10ffff}", "北 柱", "C1\u200d"),
  fc.string({ unit: "grapheme", minLength: 1, maxLength: 6 }),
  fc.string({ unit: "binary", minLength: 1, maxLength: 4 }).filter((s) => !/[\ud800-\udfff]/.test(s)),
);

/** What a result id reads as: its text trimmed (String.prototype.trim: the white space of ECMA-262), "row N" where blank. */
const idAsRead = (id: string, row: number) => (id.trim() === "" ? `row ${row + 1}` : id.trim());

describe("unusual Unicode", () => {
  fuzzClassAsync(
    "case tables: unusual Unicode in result ids and case headers (ids come out exactly as written)",
    0.02,
    fc.tuple(columnsTable(finiteNumber.filter((n) => Math.abs(n) < 1e300).map(String), { oddHeaders: false, maxRows: 4 }), fc.array(unusual, { minLength: 4, maxLength: 4 }), fc.option(unusual, { nil: undefined })).map(([t, names, header]) => ({
      ...t,
      ids: t.ids.map((id, k) => (k % 2 === 0 ? names[k] : id)),
      headers: header === undefined ? t.headers : [...t.headers.slice(0, -1), `W:${header}`],
    })),
    async (t) => {
      const file = files.file("csv", csvText(tableRows(t)));
      // Cases as columns, said: an id that happens to be a load symbol would make the layout a guess.
      const run = await cliInProcess(["envelope", file, "--ruleset", RULESET, "--format", "csv", "--threads", "1", "--layout", "columns"]);
      const verdict = cliVerdict(run, file, envelopeCsvOutput);
      if (run.status !== 0 || verdict.wrongOutput) return verdict;
      const written = (parse(run.stdout) as string[][]).slice(1).map((r) => r[0]);
      const expected = t.ids.map((id, k) => idAsRead(id, k + 1));
      return { ...verdict, wrongOutput: JSON.stringify(written) === JSON.stringify(expected) ? null : `ids ${JSON.stringify(written)} where ${JSON.stringify(expected)} were written` };
    },
    describeTable,
  );

  fuzzClass(
    "case tables: unusual Unicode in a worksheet (ids come out exactly as written)",
    0.02,
    fc.tuple(fc.array(unusual, { minLength: 1, maxLength: 4 }), fc.array(fc.integer({ min: -99, max: 99 }), { minLength: 4, maxLength: 4 })),
    ([ids, numbers]) => {
      const range: Cell[][] = [["result", "G", "Q"], ...ids.map((id, k) => [id, numbers[k % 4], numbers[(k + 1) % 4]])];
      // Cases as columns, said (options): an id that happens to be a load symbol would make the layout a guess.
      const outcome = evaluateFormula(ENVELOPE, [range, [[RULESET]], null, "orientation=columns"], ["Loads!A1:C9", "Loads!E1"]);
      const verdict = formulaVerdict(outcome, "Loads");
      if (!outcome.ok) {
        // Only an id given twice (as read, trimmed) may refuse this table.
        const read = ids.map((id, k) => idAsRead(id, k + 1));
        const repeated = new Set(read).size < read.length;
        return { ...verdict, wrongOutput: repeated ? null : `refused: ${outcome.message}` };
      }
      // Below the stamp and the header, one row per result, then the notes.
      const written = outcome.value.slice(2, 2 + ids.length).map((r) => r[0]);
      const expected = ids.map((id, k) => idAsRead(id, k + 1));
      return { ...verdict, wrongOutput: JSON.stringify(written) === JSON.stringify(expected) ? null : `ids ${JSON.stringify(written)} where ${JSON.stringify(expected)} were given` };
    },
    (x) => JSON.stringify(x),
  );
});

describe("binary garbage", () => {
  const garbage = fc.oneof(
    fc.uint8Array({ maxLength: 3000 }),
    // Garbage after a good header row: the reader gets as far as the values.
    fc.uint8Array({ maxLength: 600 }).map((b) => Buffer.concat([Buffer.from(`result,${HEADERS.slice(0, 3).join(",")}\n`), b])),
    fc.uint8Array({ maxLength: 600 }).map((b) => Buffer.concat([Buffer.from([0xff, 0xfe]), b])),
  );
  fuzzClassAsync(
    "case tables: binary garbage as a CSV file and as a JSON file",
    0.02,
    garbage,
    async (bytes) => {
      const buffer = Buffer.from(bytes);
      const csv = files.file("csv", buffer);
      const json = files.file("json", buffer);
      const a = cliVerdict(await cliInProcess(["envelope", csv, "--ruleset", RULESET, "--format", "csv", "--threads", "1"]), csv, envelopeCsvOutput);
      const b = cliVerdict(await cliInProcess(["envelope", json, "--ruleset", RULESET, "--format", "csv"]), json, envelopeCsvOutput);
      return { located: a.located && b.located, wrongOutput: a.wrongOutput ?? b.wrongOutput };
    },
    (b) => shown(Buffer.from(b).toString("latin1")),
  );
});


