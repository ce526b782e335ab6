/**
 * Result rows of a streamed case table, a batch at a time: the one way the CSV
 * and the worksheet readers hand their rows on, so that both give the rows
 * before a bad one first, then the error, and refuse a table with no rows alike.
 */

/** Result rows of a cases-as-columns file, a batch at a time; the batch is reused, so read it before asking for the next. */
export interface RowBatch {
  count: number;
  ids: string[];
  /** count × cases values, row after row, in the order of `cases`. */
  values: Float64Array;
  lines: Int32Array;
}

/** One result row of a cases-as-columns file. */
export interface ResultRow {
  id: string;
  /** Value per case, in the order of `cases`. */
  values: Float64Array;
  line: number;
}

/** Result rows handed over at a time: enough to make the cost per batch negligible, few enough to stay small. */
export const BATCH_ROWS = 1024;

export function emptyBatch(caseCount: number): RowBatch {
  return { count: 0, ids: new Array<string>(BATCH_ROWS), values: new Float64Array(BATCH_ROWS * caseCount), lines: new Int32Array(BATCH_ROWS) };
}

export interface BatchSource {
  /** Adds rows to the batch until it holds BATCH_ROWS (true) or the table ends (false); throws at a bad row. */
  fill(): Promise<boolean>;
  /** The error to give for one thrown while filling (a reader may know better, e.g. that the file was cut meanwhile). */
  stoppedBy(error: unknown): Promise<unknown>;
  /** The refusal of a table with no result rows below its header row. */
  empty(): Error;
  /** What was being read, for the rare throw of a non-error. */
  what: string;
  close(): Promise<void>;
}

/** The batches of a source: full ones as they fill, the rows before a bad one, then its error. */
export async function* batchesOf(batch: RowBatch, source: BatchSource): AsyncGenerator<RowBatch> {
  let count = 0;
  let stopped: unknown = null;
  try {
    try {
      while (await source.fill()) {
        count += batch.count;
        yield batch;
        batch.count = 0;
      }
    } catch (e) {
      stopped = await source.stoppedBy(e);
    }
    if (batch.count > 0) {
      count += batch.count;
      yield batch;
      batch.count = 0;
    }
    if (stopped !== null) throw stopped instanceof Error ? stopped : new Error(`reading ${source.what} stopped on a value that is not an error`);
    if (count === 0) throw source.empty();
  } finally {
    await source.close();
  }
}

/** The same rows one at a time, each with its own copy of the values. */
export async function* rowsOf(batches: AsyncIterable<RowBatch>, caseCount: number): AsyncGenerator<ResultRow> {
  for await (const b of batches) {
    for (let n = 0; n < b.count; n++) yield { id: b.ids[n], values: b.values.slice(n * caseCount, (n + 1) * caseCount), line: b.lines[n] };
  }
}
