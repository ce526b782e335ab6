/** The result vectors of a case input, streamed or whole: one per component or result row. */
import type { CaseInput } from "../input/caseInput.js";
import { progressBar } from "../output/progress.js";

export interface Result {
  id: string;
  values: ArrayLike<number>;
  /** Where it is, for a message: "line 12 (C1 top)" or "(V)". */
  where: string;
}

export async function* resultsOf(input: CaseInput, label: string): AsyncGenerator<Result> {
  if (input.kind === "table") {
    const { components, values } = input.table;
    for (let c = 0; c < components.length; c++) yield { id: components[c], values: values[c], where: `(${components[c]})` };
    return;
  }
  const progress = progressBar(input.totalBytes, label);
  let n = 0;
  try {
    for await (const row of input.rows) {
      if (++n % 2048 === 0) progress.update(input.bytesRead());
      yield { id: row.id, values: row.values, where: `line ${row.line} (${row.id})` };
    }
  } finally {
    progress.stop();
  }
}
