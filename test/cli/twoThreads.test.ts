/**
 * `envelope --threads 2` reads on one thread and evaluates on another; what it
 * writes must be byte for byte what one thread writes — on a good file and on
 * files that stop at a bad row (a value that is text, a value too large to give
 * a finite result, a result id given twice), standard error and exit status
 * included. Values are invented; the check is one path against the other, and
 * one row against the hand value of EN 1990 (6.10).
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { csvRows, loadwright } from "./harness.js";

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-threads-"));
});

/** 12,000 result rows under G, Q, W:N, W:E, with `spoil` changing one row's text. */
function exportFile(name: string, spoil: (row: number, line: string) => string = (_r, l) => l): string {
  const lines = ["result,G,Q,W:N,W:E"];
  for (let i = 0; i < 12_000; i++) lines.push(spoil(i, `M${Math.floor(i / 6)} ${["N", "Vy", "Vz", "T", "My", "Mz"][i % 6]},${(i % 89) + 1},${(i * 7) % 53},${((i * 13) % 41) - 20},${((i * 5) % 37) - 18}`));
  writeFileSync(join(dir, name), lines.join("\n") + "\n");
  return name;
}

async function bothWays(name: string) {
  const args = ["envelope", name, "--ruleset", "en1990-str-6.10", "--format", "csv"];
  const one = await loadwright([...args, "--threads", "1"], { cwd: dir });
  const two = await loadwright([...args, "--threads", "2"], { cwd: dir });
  return { one, two };
}

describe("envelope on two threads", () => {
  test("writes what one thread writes", async () => {
    const { one, two } = await bothWays(exportFile("good.csv"));
    expect(one.status).toBe(0);
    expect(two).toEqual(one);
    const rows = csvRows(two.stdout);
    expect(rows).toHaveLength(12_001);
    // Row 1: G = 1, Q = 0, W:N = -20, W:E = -18. EN 1990 6.10 with the recommended factors
    // (A1 Table A1.2(B): 1.35/1.0 on G, 1.5 on the leading action, 1.5·ψ0 = 0.9 on W as an accompanying one):
    // the largest is 1.35·1 + 1.5·20 = 31.35 (W:N reversed, leading).
    expect(Number(rows[1][1])).toBeCloseTo(31.35, 9);
  });

  test("stops where one thread stops, having written the same rows: text in a value", async () => {
    const { one, two } = await bothWays(exportFile("text.csv", (r, l) => (r === 9_000 ? l.replace(/,[^,]*$/, ",n/a") : l)));
    expect(one.status).toBe(1);
    expect(two).toEqual(one);
  });

  test("stops where one thread stops, having written the same rows: a value beyond the largest number", async () => {
    // "1e400" reads as Infinity in JavaScript (ECMA-262, StringToNumber rounds it past the largest double): refused where it is read.
    const { one, two } = await bothWays(exportFile("huge.csv", (r, l) => (r === 7_000 ? l.replace(/,[^,]*$/, ",1e400") : l)));
    expect(one.status).toBe(1);
    expect(one.stderr).toMatch(/huge\.csv line 7002, column E \(W:E\): "1e400" is beyond the largest number Loadwright can hold/);
    expect(two).toEqual(one);
  });

  test("stops where one thread stops, having written the same rows: a factored sum past the largest number", async () => {
    // W:E = 1.7e308: 1.5 × 1.7e308 (W leading, EN 1990 A1 Table A1.2(B)) is past the largest double, about
    // 1.797e308 (IEEE 754 binary64; ECMA-262 Number.MAX_VALUE); 0.9 × 1.7e308 (W accompanying, 1.5·ψ0) is not.
    const { one, two } = await bothWays(exportFile("overflow.csv", (r, l) => (r === 7_000 ? l.replace(/,[^,]*$/, ",1.7e308") : l)));
    expect(one.status).toBe(1);
    expect(one.stderr).toMatch(/overflow\.csv line 7002: "M1166 My" has no finite value in row "[^"]*1\.5W:E[^"]*": the factored sum passes the largest number/);
    expect(one.stdout.trim().split("\n")).toHaveLength(7_001);
    expect(two).toEqual(one);
  });

  test("stops where one thread stops, having written the same rows: a result id given twice", async () => {
    const { one, two } = await bothWays(exportFile("twice.csv", (r, l) => (r === 11_000 ? l.replace(/^[^,]*/, "M0 N") : l)));
    expect(one.status).toBe(1);
    expect(one.stderr).toMatch(/twice\.csv line 11002, column A \(M0 N\): result "M0 N" appears twice \(also at line 2, column A\)/);
    expect(two).toEqual(one);
  });

  test("refuses a number of threads it does not know", async () => {
    const run = await loadwright(["envelope", exportFile("any.csv"), "--ruleset", "en1990-str-6.10", "--threads", "3"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/loadwright: error: --threads: "3" is not 1, 2 or auto/);
  });
});
