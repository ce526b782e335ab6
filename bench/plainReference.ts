/**
 * The plain way to an envelope, as a short script would do it: list every
 * concrete row once as a vector of factors on the cases (a dense rows × cases
 * matrix), then for each result row value every concrete row and keep the
 * largest and smallest, the first row listed winning a tie. The bench checks
 * the engine against it and measures how much less work the engine does.
 */
import { enumerateRows, type Plan } from "../src/core/index.js";
import { rowContributions } from "../src/core/evaluate/rows.js";

export interface PlainEnvelope {
  rows: number;
  /** Per result row: max, min, and the row numbers (in listing order) giving each. */
  max: Float64Array;
  min: Float64Array;
  maxRow: Int32Array;
  minRow: Int32Array;
}

export function factorMatrix(plan: Plan): { rows: number; cases: number; factors: Float64Array } {
  const cases = plan.cases.length;
  const refs = [...enumerateRows(plan)];
  const factors = new Float64Array(refs.length * cases);
  refs.forEach((ref, r) => {
    for (const c of rowContributions(plan, ref)) factors[r * cases + c.caseIndex] = c.factor;
  });
  return { rows: refs.length, cases, factors };
}

export function plainEnvelope(matrix: ReturnType<typeof factorMatrix>, values: Float64Array, results: number): PlainEnvelope {
  const { rows, cases, factors } = matrix;
  const out: PlainEnvelope = { rows, max: new Float64Array(results), min: new Float64Array(results), maxRow: new Int32Array(results), minRow: new Int32Array(results) };
  for (let i = 0; i < results; i++) {
    const x = i * cases;
    let max = -Infinity;
    let min = Infinity;
    let maxRow = 0;
    let minRow = 0;
    for (let r = 0; r < rows; r++) {
      const f = r * cases;
      let v = 0;
      for (let k = 0; k < cases; k++) v += factors[f + k] * values[x + k];
      if (v > max) {
        max = v;
        maxRow = r;
      }
      if (v < min) {
        min = v;
        minRow = r;
      }
    }
    out.max[i] = max;
    out.min[i] = min;
    out.maxRow[i] = maxRow;
    out.minRow[i] = minRow;
  }
  return out;
}
