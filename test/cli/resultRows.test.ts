/**
 * One reader of result rows: a cases-as-columns table gives the same result
 * ids, the same refusals and the same messages whether it is streamed from a
 * CSV file, read whole from a JSON file, or given to a formula. The rules are
 * ours (docs/case-tables.md, "Cases as columns"): a row's id is its id cells
 * joined with " / ", "row N" where they are blank; an id given twice is refused
 * with both places. The ruleset is the shipped en1990-str-6.10; no value is
 * checked here, only which rows are read and what is said.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { body, evaluateFormula, value } from "../functions/outcome.js";
import { csvRows, errorLines, loadwright } from "./harness.js";

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-result-rows-"));
});

const RULESET = "en1990-str-6.10";

/** The table as a CSV file, a JSON file and a formula's range at Loads!A1. */
async function throughEveryPath(name: string, table: (string | number)[][]) {
  const csvFile = `${name}.csv`;
  const jsonFile = `${name}.json`;
  writeFileSync(join(dir, csvFile), table.map((r) => r.join(",")).join("\n") + "\n");
  writeFileSync(join(dir, jsonFile), JSON.stringify(table));
  const csv = await loadwright(["envelope", csvFile, "--ruleset", RULESET, "--format", "csv"], { cwd: dir });
  const json = await loadwright(["envelope", jsonFile, "--ruleset", RULESET, "--format", "csv"], { cwd: dir });
  const formula = evaluateFormula(ENVELOPE, [table, [[RULESET]], null, null], [`Loads!A1:C${table.length}`, "Loads!F1"]);
  return { csv, json, formula };
}


describe("a result id given twice", () => {
  test("is refused alike in a streamed CSV file, a JSON file and a formula, with both places", async () => {
    const { csv, json, formula } = await throughEveryPath("twice", [
      ["result", "G", "Q"],
      ["B1", 10, 5],
      ["B2", 11, 6],
      ["B1", 12, 7],
    ]);
    expect(csv.status).toBe(1);
    // Streamed, the rows before it have been written: the exit status says the output is incomplete (docs/command-line.md).
    expect(errorLines(csv.stderr)).toEqual(['twice.csv line 4, column A (B1): result "B1" appears twice (also at line 2, column A)']);
    expect(json.status).toBe(1);
    expect(errorLines(json.stderr)).toEqual(['twice.json line 1, column 46 (B1): result "B1" appears twice (also at line 1, column 22)']);
    expect(formula.ok).toBe(false);
    if (formula.ok) return;
    expect(formula.message).toBe('cases, Loads!A4: result "B1" appears twice (also at Loads!A2)');
    // The sentence itself is the core's, word for word, on every path.
    const sentence = (text: string) => text.replace(/^.*: (result ".*" appears twice) \(also at .*\)$/, "$1");
    expect(new Set([...errorLines(csv.stderr), ...errorLines(json.stderr), formula.message].map(sentence))).toEqual(new Set(['result "B1" appears twice']));
  });
});

describe("a result row without an id", () => {
  test('is named "row N" by its row of the table in a streamed CSV file, a JSON file and a formula', async () => {
    const { csv, json, formula } = await throughEveryPath("unnamed", [
      ["result", "G", "Q"],
      ["B1", 10, 5],
      ["", 11, 6],
    ]);
    expect(csv.status).toBe(0);
    expect(json.status).toBe(0);
    expect(csvRows(csv.stdout).map((r) => r[0])).toEqual(["result", "B1", "row 3"]);
    expect(csvRows(json.stdout).map((r) => r[0])).toEqual(["result", "B1", "row 3"]);
    expect(body(value(formula)).map((r) => r[0])).toEqual(["B1", "row 3"]);
  });
});

describe("a value that is not a number", () => {
  test("is named by its case header alike in a streamed CSV file, a JSON file and a formula", async () => {
    const { csv, json, formula } = await throughEveryPath("text", [
      ["result", "G", "Q"],
      ["B1", 10, "n/a"],
    ]);
    expect(errorLines(csv.stderr)).toEqual(['text.csv line 2, column C (Q): "n/a" is not a number']);
    expect(errorLines(json.stderr)).toEqual(['text.json line 1, column 30 (Q): "n/a" is not a number']);
    expect(!formula.ok && formula.message).toBe('cases, Loads!C2 (Q): "n/a" is not a number');
  });
});

describe("a streamed file with a bad row", () => {
  test("gives the envelope of every row before it, then stops with the error (docs/command-line.md, errors)", async () => {
    // 3,000 rows of G = 10, Q = 5 (invented); row 2,501 of the file's result rows holds text.
    const lines = ["result,G,Q", ...Array.from({ length: 3000 }, (_, i) => `R${i + 1},10,${i === 2500 ? "n/a" : 5}`)];
    writeFileSync(join(dir, "bad-late.csv"), lines.join("\n") + "\n");
    const run = await loadwright(["envelope", "bad-late.csv", "--ruleset", RULESET, "--format", "csv"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(errorLines(run.stderr)).toEqual(['bad-late.csv line 2502, column C (Q): "n/a" is not a number']);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["result", "max", "max row", "min", "min row"]);
    expect(rows.slice(1).map((r) => r[0])).toEqual(Array.from({ length: 2500 }, (_, i) => `R${i + 1}`));
    // EN 1990 (6.10) with G = 10, Q = 5: max 1.35 × 10 + 1.5 × 5 = 21 (Q leading); min 1.0 × 10 = 10 (Q absent) [EN 1990 A1 Table A1.2(B), recommended γ].
    expect(rows[1].slice(1, 2).map(Number)).toEqual([21]);
    expect(Number(rows[1][3])).toBe(10);
  });
});
