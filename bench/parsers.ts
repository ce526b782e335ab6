/**
 * CSV readers on one export, each turning every value into a double: the
 * general reader the command line falls back on (csv-parse, then the core's
 * readValue), the byte scanner the command line streams with, and — where they
 * are installed in the folder named by LOADWRIGHT_BENCH_CANDIDATES (for
 * example `npm install --prefix /tmp/csv-candidates papaparse udsv csv-parser`)
 * — other parsers from the npm registry, as candidates. They are not
 * dependencies of Loadwright.
 */
import { readFileSync, createReadStream } from "node:fs";
import { createRequire } from "node:module";
import { join } from "node:path";
import { readValue, type Problem } from "../src/core/index.js";
import { readCsv } from "../src/cli/input/csvRecords.js";
import { decimalAt } from "../src/cli/input/csvScanner.js";
import { CsvSource } from "../src/cli/input/csvSource.js";

export interface ParserTime {
  name: string;
  ms: number | null;
  note: string;
}

async function medianOf(runs: number, f: () => Promise<number>): Promise<{ ms: number; checksum: number }> {
  const times: number[] = [];
  let checksum = 0;
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    checksum = await f();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { ms: times[times.length >> 1], checksum };
}

export async function parserTimes(file: string, cases: number): Promise<ParserTime[]> {
  const results: ParserTime[] = [];
  const problems: Problem[] = [];
  const options = { numbersAsText: true };

  const general = await medianOf(3, async () => {
    let sum = 0;
    let header = true;
    for await (const record of readCsv(file).records) {
      if (header) {
        header = false;
        continue;
      }
      for (let k = 1; k <= cases; k++) sum += readValue(record.cells[k], { row: 0, column: k }, "", options, problems);
    }
    return sum;
  });
  results.push({ name: "csv-parse + readValue (general)", ms: general.ms, note: "" });

  const scanned = await medianOf(5, async () => {
    const source = await CsvSource.open(file, ",");
    let sum = 0;
    let header = true;
    for (;;) {
      const step = source.next();
      if (step === "wait") {
        await source.refill();
        continue;
      }
      if (step === "end") break;
      if (header) {
        header = false;
        continue;
      }
      // As the command line reads them: the number found with the field, else decimalAt.
      const { buf, fieldStart, fieldEnd, fieldValue } = source.scanner;
      for (let k = 1; k <= cases; k++) {
        const v = fieldValue[k];
        sum += v === v ? v : decimalAt(buf, fieldStart[k], fieldEnd[k]);
      }
    }
    return sum;
  });
  results.push({ name: "byte scanner (command line)", ms: scanned.ms, note: same(scanned.checksum, general.checksum) });

  const folder = process.env.LOADWRIGHT_BENCH_CANDIDATES;
  const candidates: { name: string; run: (require: NodeJS.Require) => Promise<number> }[] = [
    {
      name: "papaparse",
      run: async (require) => {
        const Papa = require("papaparse") as { parse: (text: string, options: object) => { data: string[][] } };
        const rows = Papa.parse(readFileSync(file, "utf8"), { skipEmptyLines: true }).data;
        return sumRows(rows, cases);
      },
    },
    {
      name: "udsv",
      run: async (require) => {
        const { inferSchema, initParser } = require("udsv") as { inferSchema: (csv: string, opts?: object) => object; initParser: (schema: object) => { stringArrs: (csv: string) => string[][] } };
        const text = readFileSync(file, "utf8");
        const parser = initParser(inferSchema(text, { header: () => [] }));
        return sumRows(parser.stringArrs(text), cases);
      },
    },
    {
      name: "csv-parser",
      run: async (require) => {
        const csv = require("csv-parser") as (options: object) => NodeJS.ReadWriteStream;
        let sum = 0;
        for await (const row of createReadStream(file).pipe(csv({ headers: false, skipLines: 1 })) as AsyncIterable<Record<string, string>>) {
          for (let k = 1; k <= cases; k++) sum += Number(row[k]);
        }
        return sum;
      },
    },
  ];
  for (const c of candidates) {
    if (!folder) {
      results.push({ name: c.name, ms: null, note: "not measured (set LOADWRIGHT_BENCH_CANDIDATES to a folder where it is installed)" });
      continue;
    }
    try {
      const require = createRequire(join(folder, "node_modules", "bench.js"));
      const measured = await medianOf(3, () => c.run(require));
      results.push({ name: c.name, ms: measured.ms, note: same(measured.checksum, general.checksum) });
    } catch (e) {
      results.push({ name: c.name, ms: null, note: `not measured: ${e instanceof Error ? e.message.split("\n")[0] : String(e)}` });
    }
  }
  return results;
}

/** Every row after the header: values 1 … cases as Number() reads them (the exports hold plain decimals). */
function sumRows(rows: string[][], cases: number): number {
  let sum = 0;
  for (let r = 1; r < rows.length; r++) for (let k = 1; k <= cases; k++) sum += Number(rows[r][k]);
  return sum;
}

function same(a: number, b: number): string {
  return a === b ? "same values" : "VALUES DIFFER from the general reader";
}
