/** The result vectors of a case input, streamed or whole: one per component or result row. */
import type { CaseInput } from "../input/caseInput.js";
import { progressBar } from "../output/progress.js";

export interface Result {
  id: string;
  values: ArrayLike<number>;
  /** Where it is, for a message: "line 12 (C1 top)" or "(V)". */
  where: string;
  /** Where it was named, for a message that names the result itself: "line 12", or "line 3, column A". */
  place: string;
  /** The file line it is on, where the rows come from a streamed file. */
  line: number | null;
}

export async function* resultsOf(input: CaseInput, label: string): AsyncGenerator<Result> {
  for await (const batch of resultBatches(input, label)) {
    for (let n = 0; n < batch.count; n++) yield { id: batch.ids[n], values: batch.values.slice(n * batch.cases, (n + 1) * batch.cases), where: batch.where(n), place: batch.place(n), line: batch.lines ? batch.lines[n] : null };
  }
}

/** Result rows a block at a time: values row after row, `cases` to a row. Read a batch before asking for the next. */
export interface ResultBatch {
  count: number;
  cases: number;
  ids: readonly string[];
  values: Float64Array;
  /** File line of each row, where the rows come from a streamed file. */
  lines: Int32Array | null;
  where(n: number): string;
  /** Where row n was named, for a message that names the result itself: "line 12", or "line 3, column A". */
  place(n: number): string;
}

export async function* resultBatches(input: CaseInput, label: string): AsyncGenerator<ResultBatch> {
  if (input.kind === "table") {
    const { components, values, cases, componentPlaces } = input.table;
    const flat = new Float64Array(components.length * cases.length);
    values.forEach((v, c) => flat.set(v, c * cases.length));
    const place = (n: number) => {
      const at = componentPlaces?.[n];
      return at ? input.at.cell(at.row, at.column) : `(${components[n]})`;
    };
    yield { count: components.length, cases: cases.length, ids: components, values: flat, lines: null, where: (n) => `(${components[n]})`, place };
    return;
  }
  const progress = progressBar(input.totalBytes, label);
  // A streamed row's place: its sheet and cell in a worksheet, its line in a CSV file.
  const placeOf = (line: number) => (input.rowPlace ? input.rowPlace(line) : `line ${line}`);
  try {
    for await (const batch of input.batches) {
      progress.update(input.bytesRead());
      yield {
        count: batch.count,
        cases: input.cases.length,
        ids: batch.ids,
        values: batch.values,
        lines: batch.lines,
        where: (n) => `${placeOf(batch.lines[n])} (${batch.ids[n]})`,
        place: (n) => placeOf(batch.lines[n]),
      };
    }
  } finally {
    progress.stop();
  }
}
