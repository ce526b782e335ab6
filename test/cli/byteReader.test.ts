/**
 * The streamed CSV reader finds records and numbers in a file's bytes. It is
 * held here to the general reader — csv-parse (csv.js.org/parse, the
 * project's CSV dependency) for records, and the core's readValue for values
 * (Number() of the text, where it is a decimal number) — on random and
 * hostile files written to disk: quoted fields, "" escapes, delimiters and line
 * breaks inside quotes, CRLF, CR and LF line ends (mixed, too), byte order
 * marks, empty lines, ragged rows, malformed quotes, invalid UTF-8 and other
 * garbage bytes, numbers of every form. Both readers must give the same result
 * ids, the same values bit for bit and the same lines — or the same errors,
 * word for word.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import fc from "fast-check";
import { beforeAll, describe, expect, test } from "vitest";
import { EMPTY_CASE_MAP, findShippedRuleset, type Ruleset } from "../../src/core/index.js";
import { CliError } from "../../src/cli/cliError.js";
import { openCases, type CaseFileOptions } from "../../src/cli/input/caseInput.js";
import { readCsv } from "../../src/cli/input/csvRecords.js";
import { decimalAt, PLAIN } from "../../src/cli/input/csvScanner.js";
import { CsvSource } from "../../src/cli/input/csvSource.js";

let dir: string;
let ruleset: Ruleset;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-bytes-"));
  const shipped = findShippedRuleset("asce7-16-strength");
  if (!shipped) throw new Error("asce7-16-strength is not shipped");
  ruleset = shipped.ruleset;
});

/** What a reader made of a file: every result row (id, values as bit patterns, line), or its error text. */
async function readWith(path: string, reader: "bytes" | "csv-parse", idColumns = 1): Promise<unknown> {
  const options: CaseFileOptions = { layout: "auto", idColumns, delimiter: ",", map: EMPTY_CASE_MAP, reader };
  try {
    const input = await openCases(path, ruleset, options);
    if (input.kind === "table") return { table: input.table.components, values: input.table.values.map((v) => [...v].map(bits)) };
    const rows: unknown[] = [];
    for await (const row of input.rows) rows.push([row.id, [...row.values].map(bits), row.line]);
    return { stream: rows };
  } catch (e) {
    if (e instanceof CliError) return { error: [e.message, ...e.more] };
    throw e;
  }
}

/** A double's exact bits as text: -0 and 0, and every last digit, tell apart. */
function bits(v: number): string {
  return Object.is(v, -0) ? "-0" : Number.isNaN(v) ? "NaN" : v.toString(16);
}

let fileCount = 0;
async function sameFromBoth(bytes: Buffer, idColumns = 1): Promise<void> {
  const path = join(dir, `f${fileCount++}.csv`);
  writeFileSync(path, bytes);
  const general = await readWith(path, "csv-parse", idColumns);
  const scanned = await readWith(path, "bytes", idColumns);
  expect(scanned, JSON.stringify(bytes.toString("latin1"))).toEqual(general);
}

const utf8 = (s: string) => Buffer.from(s, "utf8");

/** Cells an export may hold, and cells it should not. */
const numberText = fc.oneof(
  fc.double({ noNaN: true }).map((v) => String(v)),
  fc.integer({ min: -100000, max: 100000 }).map((v) => String(v)),
  fc.tuple(fc.integer({ min: -9999, max: 9999 }), fc.integer({ min: 0, max: 99999 })).map(([a, b]) => `${a}.${b}`),
  fc.constantFrom("0", "-0", "+0", "-0.0", ".5", "5.", "+.5e-3", "1e22", "1e23", "1e-22", "1e-23", "9007199254740991", "9007199254740993", "12345678901234567890", "0.1000000000000000055511151231257827", "1e400", "-1e400", "1e-400", "00012.500", "1E+5", "4.9e-324"),
);
const oddCell = fc.constantFrom("", " ", "\t", " 12.5 ", "12,5", "n/a", "1.2.3", "--1", "1e", "e5", ".", "+", "1_000", "0x10", "Infinity", "NaN", "\u00a012\u00a0", "\ufeff7", "é", "TRUE");
const quotedCell = fc.oneof(
  numberText.map((t) => `"${t}"`),
  fc.constantFrom('"a,b"', '"x""y"', '""', '""""', '"line\nbreak"', '"cr\rinside"', '"crlf\r\ninside"', '" 3 "', '"1,5"'),
);
const cell = fc.oneof({ weight: 6, arbitrary: numberText }, { weight: 2, arbitrary: oddCell }, { weight: 1, arbitrary: quotedCell });

const lineEnd = fc.constantFrom("\n", "\r\n", "\r");

/** A cases-as-columns file: header D, L, W:N, E:x; 0–8 rows of 4 or 5 cells (sometimes ragged), blank lines, mixed line ends. */
const exportFile = fc
  .record({
    bom: fc.boolean(),
    end: lineEnd,
    mixed: fc.boolean(),
    rows: fc.array(fc.oneof({ weight: 8, arbitrary: fc.array(cell, { minLength: 4, maxLength: 4 }) }, { weight: 1, arbitrary: fc.array(cell, { minLength: 0, maxLength: 6 }) }), {
      maxLength: 8,
    }),
    ids: fc.array(fc.constantFrom("C1", "C2", "C1 top", "", '"M1, s0"', "C2"), { minLength: 8, maxLength: 8 }),
    ends: fc.array(lineEnd, { minLength: 9, maxLength: 9 }),
    finalEnd: fc.boolean(),
  })
  .map(({ bom, end, mixed, rows, ids, ends, finalEnd }) => {
    const lines = ["result,D,L,W:N,E:x", ...rows.map((cells, r) => (cells.length === 0 ? "" : [ids[r], ...cells].join(",")))];
    let text = "";
    lines.forEach((line, k) => {
      text += line;
      if (k < lines.length - 1 || finalEnd) text += mixed ? ends[k] : end;
    });
    return Buffer.concat([bom ? Buffer.from([0xef, 0xbb, 0xbf]) : Buffer.alloc(0), utf8(text)]);
  });

/** Any bytes at all after a good header line: quotes, delimiters, line ends, digits, invalid UTF-8. */
const hostileFile = fc
  .tuple(
    fc.constantFrom("result,D,L\n", "result,D,L\r\n", "\ufeffresult,D,L\r", '"result","D","L"\n', "\n\nresult,D,L\n"),
    fc.array(
      fc.constantFrom(..."0123456789.,-+eE\"\n\r \tx", "\u00a0", "é", "\xff", "\xfe\xff", "\xc3", "\x00", "1e400", "C1", '""', '",', ',"'),
      { maxLength: 60 },
    ),
  )
  .map(([head, pieces]) => Buffer.concat([utf8(head), ...pieces.map((p) => (/^[\x80-\xff]+$/.test(p) && p !== "é" ? Buffer.from(p, "latin1") : utf8(p)))]));

describe("the streamed CSV reader", () => {
  test("reads random exports as csv-parse and the core's readValue do", async () => {
    await fc.assert(fc.asyncProperty(exportFile, (bytes) => sameFromBoth(bytes)), { numRuns: 300, seed: 4101 });
  });

  test("reads hostile bytes as csv-parse and the core's readValue do, errors included", async () => {
    await fc.assert(fc.asyncProperty(hostileFile, (bytes) => sameFromBoth(bytes)), { numRuns: 400, seed: 4102 });
  });

  test("reads ids over several columns, and files whose records end in a quote, alike", async () => {
    for (const text of [
      'member,station,D,L\nM1,0,1,2\n"M1",1,3,4\nM1,"0",5,6\n',
      'result,D,L\n"C1","1","2"',
      'result,D,L\n"C1","1","2"\r\n"C2",3,"4"\r\n',
      'result,D,L\nC1,1,"2\n',
      'result,D,L\nC1,1,2"\n',
      'result,D,L\nC1,"1"x,2\n',
      "result,D,L\nC1,1,2\n\n\n",
      "\xff\xferesult,D,L\n",
    ]) {
      await sameFromBoth(Buffer.from(text, "latin1"), text.startsWith("member") ? 2 : 1);
    }
  });
});

describe("records found in bytes read a few at a time", () => {
  test("are csv-parse's records, with the same lines, wherever the reads split them", async () => {
    const records = async (path: string, source: CsvSource | null) => {
      const out: unknown[] = [];
      try {
        if (source) {
          for (;;) {
            const step = source.next();
            if (step === "record") out.push(source.record());
            else if (step === "end") break;
            else await source.refill();
          }
        } else for await (const record of readCsv(path).records) out.push(record);
      } catch (e) {
        if (!(e instanceof CliError)) throw e;
        out.push(e.message);
      }
      return out;
    };
    await fc.assert(
      fc.asyncProperty(fc.oneof(exportFile, hostileFile), fc.integer({ min: 1, max: 17 }), async (bytes, chunk) => {
        const path = join(dir, `r${fileCount++}.csv`);
        writeFileSync(path, bytes);
        expect(await records(path, await CsvSource.open(path, ",", "bytes", chunk))).toEqual(await records(path, null));
      }),
      { numRuns: 300, seed: 4104 },
    );
  });
});

describe("numbers read from bytes", () => {
  test("are exactly Number() of the text wherever the text is a decimal number", () => {
    // ECMAScript's Number() of a decimal string (ECMA-262, StringToNumber) is the reference.
    const decimal = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
    fc.assert(
      fc.property(fc.oneof(numberText, oddCell, fc.string({ unit: fc.constantFrom(..."0123456789.eE+-") })), (text) => {
        const bytes = Buffer.from(text, "utf8");
        const v = decimalAt(bytes, 0, bytes.length);
        if (decimal.test(text)) expect(bits(v)).toBe(bits(Number(text)));
        else expect(Number.isNaN(v)).toBe(true);
      }),
      { numRuns: 20000, seed: 4103 },
    );
  });
});

describe("numbers read while the fields are found", () => {
  test("are decimalAt's numbers exactly, wherever the reads split the file, and NaN only where a field needs the general reading", async () => {
    // A plain field of a sign, up to 15 digits and a point, and no exponent: one division of exact doubles reads it, so the scanner must have.
    const short = /^[+-]?(?=\.?\d)\d*(\.\d*)?$/;
    await fc.assert(
      fc.asyncProperty(fc.oneof(exportFile, hostileFile), fc.integer({ min: 1, max: 17 }), async (bytes, chunk) => {
        const path = join(dir, `n${fileCount++}.csv`);
        writeFileSync(path, bytes);
        const source = await CsvSource.open(path, ",", "bytes", chunk);
        try {
          for (;;) {
            const step = source.next();
            if (step === "end") break;
            if (step === "wait") {
              await source.refill();
              continue;
            }
            if (!source.fromBytes) continue;
            const s = source.scanner;
            for (let k = 0; k < s.fieldCount; k++) {
              const read = s.fieldValue[k];
              const text = s.buf.subarray(s.fieldStart[k], s.fieldEnd[k]);
              const plain = s.fieldKind[k] === PLAIN;
              if (!Number.isNaN(read)) {
                expect(plain).toBe(true);
                expect(bits(read)).toBe(bits(decimalAt(s.buf, s.fieldStart[k], s.fieldEnd[k])));
              } else if (plain) {
                const latin1 = Buffer.from(text).toString("latin1");
                const digits = latin1.replace(/\D/g, "").length;
                if (short.test(latin1) && digits <= 15) expect.fail(`"${latin1}" was not read`);
              }
            }
          }
        } catch (e) {
          if (!(e instanceof CliError)) throw e;
        } finally {
          await source.close();
        }
      }),
      { numRuns: 300, seed: 4105 },
    );
  });
});
