/** Small helpers for reading a formula's outcome in tests. */
import { expect } from "vitest";
import type { OutputCell } from "../../src/functions/formula.js";
import type { Outcome } from "../../src/functions/runFormula.js";

export function value(outcome: Outcome): OutputCell[][] {
  if (!outcome.ok) expect.fail(`expected a result, got the error: ${outcome.message}`);
  return outcome.value;
}

export function message(outcome: Outcome): string {
  if (outcome.ok) expect.fail(`expected an error, got a result of ${outcome.value.length} rows`);
  return outcome.message;
}

/** The body of a table result: rows after the stamp and the header, without notes. */
export function body(table: OutputCell[][]): OutputCell[][] {
  return table.slice(2).filter((r) => !(typeof r[0] === "string" && r[0].startsWith("note:")));
}

/** The row whose first cell is `key`. */
export function rowOf(table: OutputCell[][], key: string): OutputCell[] {
  const row = table.find((r) => r[0] === key);
  if (!row) expect.fail(`no row "${key}" in ${JSON.stringify(table.map((r) => r[0]))}`);
  return row;
}

/** Every cell is a string or a finite number, every row as wide as the first. */
export function expectExcelShaped(table: OutputCell[][]): void {
  const width = table[0].length;
  for (const row of table) {
    expect(row).toHaveLength(width);
    for (const cell of row) expect(typeof cell === "string" || (typeof cell === "number" && Number.isFinite(cell))).toBe(true);
  }
}
