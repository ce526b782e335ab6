/**
 * A CSV file as records, each with the line it starts on, read as a stream so
 * that a million-line export never sits in memory. Fields stay text: the core
 * reads numbers written as text for CSV (numbersAsText).
 */
import { createReadStream } from "node:fs";
import { parse } from "csv-parse";
import { CliError } from "../cliError.js";
import { fileErrorText } from "./fileAccess.js";

export interface CsvRecord {
  cells: string[];
  /** 1-based line the record starts on. */
  line: number;
}

export interface CsvOptions {
  delimiter?: string;
}

export interface CsvReader {
  records: AsyncGenerator<CsvRecord>;
  /** Bytes of the file read so far (for the progress bar). */
  bytesRead(): number;
}

export function readCsv(path: string, options: CsvOptions = {}): CsvReader {
  const file = createReadStream(path);
  // No `info` from the parser (it costs about a third of the parsing time): lines are counted here.
  // Records are taken as the parser finds them (on_record), so that those before a CSV error are given
  // before the error, in file order: the stream alone drops what it parsed in the chunk that failed.
  const found: string[][] = [];
  const parser = parse({
    bom: true,
    relax_column_count: true,
    skip_empty_lines: false,
    delimiter: options.delimiter ?? ",",
    on_record: (record: string[]) => {
      found.push(record);
      return record;
    },
  });
  let fileError: unknown = null;
  file.on("error", (e) => {
    fileError = e;
    parser.destroy();
  });
  file.pipe(parser);

  async function* records(): AsyncGenerator<CsvRecord> {
    let nextLine = 1;
    function* take(): Generator<CsvRecord> {
      const cells = found.shift() as string[];
      yield { cells, line: nextLine };
      // Every line is a record (empty lines too), except where a quoted field holds line breaks.
      nextLine += 1;
      for (const cell of cells) for (let at = cell.indexOf("\n"); at >= 0; at = cell.indexOf("\n", at + 1)) nextLine++;
    }
    try {
      // Each record the stream gives is the next one found.
      for await (const _ of parser as AsyncIterable<string[]>) yield* take();
    } catch (e) {
      if (fileError) throw new CliError(`${path}: ${fileErrorText(fileError)}`);
      while (found.length > 0) yield* take();
      const lines = (e as { lines?: unknown }).lines;
      const at = typeof lines === "number" ? ` line ${lines}` : "";
      const message = e instanceof Error ? e.message.replace(/\s*(at|on) line \d+\.?$/, "") : String(e);
      throw new CliError(`${path}${at}: not readable as CSV: ${message}`);
    } finally {
      file.destroy();
      parser.destroy();
    }
    if (fileError) throw new CliError(`${path}: ${fileErrorText(fileError)}`);
  }

  return { records: records(), bytesRead: () => file.bytesRead };
}
