/**
 * The robustness classes run the command line in this process for volume; here
 * a few generated inputs of each class go through the real command line, a
 * child process of the built package (test/cli/harness.ts), which must answer
 * exactly as the run in this process did: the same status, output and error
 * lines. Then what only the child can show: `--threads 2` writes what
 * `--threads 1` writes on generated exports (good, with a bad row, with a sum
 * past the largest number, with a repeated id); every command run twice gives
 * the same bytes; and the refusals of values past the largest number, word for
 * word, streamed and read whole.
 */
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { loadwright } from "../cli/harness.js";
import { columnsTable, csvStyle, csvText, csvValue, finiteNumber, nearLimit, RULESET, tableRows, type TableSpec } from "./caseGenerators.js";
import { cliInProcess, errorLines, scratch } from "./cliInProcess.js";

const files = scratch("child");

/** An input of a generator, the same on every run. */
const few = <T>(arbitrary: fc.Arbitrary<T>, seed: number) => fc.sample(arbitrary, { numRuns: 1, seed });

const CLASSES: { name: string; runs: () => string[][] }[] = [
  {
    name: "value cells: CSV fields of every kind, streamed",
    runs: () => few(columnsTable(csvValue), 1).map((t) => ["envelope", files.file("csv", csvText(tableRows(t))), "--ruleset", RULESET, "--format", "csv"]),
  },
  {
    name: "value cells: numbers near the largest double",
    runs: () => few(columnsTable(nearLimit.map(String), { oddHeaders: false }), 2).map((t) => ["envelope", files.file("csv", csvText(tableRows(t))), "--ruleset", RULESET, "--format", "json"]),
  },
  {
    name: "case tables: shapes, read whole",
    runs: () => few(columnsTable(csvValue, { ragged: true, minRows: 0 }), 3).map((t) => ["factored", files.file("csv", csvText(tableRows(t))), "--ruleset", RULESET, "--format", "csv"]),
  },
  {
    name: "case tables: how a CSV file is written",
    runs: () =>
      few(fc.tuple(columnsTable(finiteNumber.map(String), { oddHeaders: false }), csvStyle), 4).map(([t, style]) => ["envelope", files.file("csv", csvText(tableRows(t), style)), "--ruleset", RULESET, "--format", "csv", "--delimiter", style.delimiter]),
  },
  {
    name: "case tables: binary garbage",
    runs: () => few(fc.uint8Array({ maxLength: 800 }), 5).map((b) => ["envelope", files.file("csv", Buffer.from(b)), "--ruleset", RULESET]),
  },
];

describe("the command line as a child process answers as the run in this process did", () => {
  test.each(CLASSES)("$name", async ({ runs }) => {
    for (const args of runs()) {
      const inProcess = await cliInProcess(args);
      const child = await loadwright(args);
      expect(child, args.join(" ")).toEqual(inProcess);
      expect([0, 1]).toContain(child.status);
    }
  });
});

/** An export of 12,000 result rows (more than a few blocks of rows for the second thread), `spoil` changing one. */
function generatedExport(seed: number, spoil: (lines: string[]) => void = () => {}): string {
  const [values] = fc.sample(fc.array(fc.integer({ min: -500, max: 500 }), { minLength: 4 * 97, maxLength: 4 * 97 }), { numRuns: 1, seed });
  const lines = ["result,G,Q,W:N,W:E"];
  for (let i = 0; i < 12_000; i++) lines.push(`R${i},${[0, 1, 2, 3].map((k) => values[(i * 4 + k) % values.length] / 8).join(",")}`);
  spoil(lines);
  return files.file("csv", `${lines.join("\n")}\n`);
}

describe("two threads write what one thread writes, on generated exports", () => {
  // test/cli/twoThreads.test.ts holds the same on a good file, text in a value and a result id given twice.
  const cases: [string, () => string][] = [["a sum past the largest number on row 5,000", () => generatedExport(13, (l) => (l[5_001] = l[5_001].replace(/,[^,]*$/, ",1.7e308")))]];
  test.each(cases)("%s", async (_name, make) => {
    const file = make();
    const args = ["envelope", file, "--ruleset", RULESET, "--format", "csv"];
    const one = await loadwright([...args, "--threads", "1"]);
    const two = await loadwright([...args, "--threads", "2"]);
    expect(two).toEqual(one);
    expect([0, 1]).toContain(one.status);
  });
});

describe("every command twice, the same bytes (child process)", () => {
  test("envelope and governing on a generated table", async () => {
    const [t] = fc.sample(columnsTable(finiteNumber.filter((n) => Math.abs(n) < 1e100).map(String), { oddHeaders: false, minRows: 3 }), { numRuns: 1, seed: 21 }) as TableSpec[];
    t.ids = t.ids.map((_, k) => `R${k + 1}`);
    const file = files.file("csv", csvText(tableRows(t)));
    // determinism.test.ts runs every command and format twice in this process; here the child's own output.
    for (const args of [
      ["envelope", file, "--ruleset", RULESET, "--format", "json"],
      ["governing", file, "--ruleset", RULESET, "--format", "table", "--criterion", "max R1", "--criterion", "min R2"],
    ]) {
      const once = await loadwright(args);
      expect(once.status, once.stderr).toBe(0);
      expect(await loadwright(args)).toEqual(once);
    }
  });
});

describe("values past the largest number, through the real command line", () => {
  // The largest double is about 1.7976931348623157e308 (IEEE 754 binary64; ECMA-262 Number.MAX_VALUE); "1e400" reads
  // as Infinity in JavaScript. EN 1990 A1 Table A1.2(B): 1.35 on G (unfavourable), 1.5 on a leading variable action,
  // as "Steel Buildings in Europe, Multi-Storey Steel Buildings, Part 3: Actions" prints them.
  const PASSES = "the factored sum passes the largest number Loadwright can hold (about ±1.8 × 10^308); check the case values";

  test("a streamed export: text beyond it refused at its cell, a sum past it at its line, after the rows before it are written", async () => {
    const text = files.file("csv", "result,G,Q\nC1,10,5\nC2,1e400,5\nC3,1,1\n");
    const run1 = await loadwright(["envelope", text, "--ruleset", RULESET, "--format", "csv"]);
    expect(run1.status).toBe(1);
    expect(errorLines(run1.stderr)).toEqual([`${text} line 3, column B (G): "1e400" is beyond the largest number Loadwright can hold (about ±1.8 × 10^308)`]);
    // C1: 1.35 × 10 + 1.5 × 5 = 21; with Q absent and G favourable, 1.0 × 10 = 10.
    expect(run1.stdout.split("\n")[1]).toMatch(/^C1,21,.*,10,/);

    const sum = files.file("csv", "result,G,Q\nC1,10,5\nC2,1.5e308,5\nC3,1,1\n");
    const run2 = await loadwright(["envelope", sum, "--ruleset", RULESET, "--format", "csv"]);
    expect(run2.status).toBe(1);
    // 1.35 × 1.5e308 = 2.025e308: past it, in the first row that loads G at 1.35.
    expect(errorLines(run2.stderr)).toEqual([`${sum} line 3: "C2" has no finite value in row "6.10: 1.35G + 1.5Q [Q leading]": ${PASSES}`]);
    expect(run2.stdout.trim().split("\n")).toHaveLength(2);
  });

  test("a table read whole (cases as rows) and a JSON file: the result's cell, the row, nothing written", async () => {
    const rows = files.file("csv", ",P,V\nG,1.5e308,2\nQ,5,1\n");
    const run1 = await loadwright(["factored", rows, "--ruleset", RULESET, "--format", "csv"]);
    expect(run1.status).toBe(1);
    expect(errorLines(run1.stderr)).toEqual([`${rows} line 1, column B: "P" has no finite value in row "6.10: 1.35G + 1.5Q [Q leading]": ${PASSES}`]);
    expect(run1.stdout).toBe("");

    const json = files.file("json", '[["result", "G", "Q"],\n ["C1", 10, 5],\n ["C2", 1e400, 5]]');
    const run2 = await loadwright(["envelope", json, "--ruleset", RULESET, "--format", "csv"]);
    expect(run2.status).toBe(1);
    // JSON.parse reads 1e400 as Infinity (ECMA-262, JSON.parse uses the number grammar of the language); it is the
    // ninth character of ' ["C2", 1e400, 5]]' (hand count).
    expect(errorLines(run2.stderr)).toEqual([`${json} line 3, column 9 (G): Infinity is not a finite number`]);
  });
});
