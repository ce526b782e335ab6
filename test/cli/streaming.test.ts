/**
 * A cases-as-columns export is streamed: every result row of a large file gets
 * its envelope, checked here against a closed form of the fixture's
 * combinations (ASCE/SEI 7-16 §2.3.1 (1), (2), (4), (5); the list as
 * ASCE/SEI 7-10 §2.3.2 (public copy: https://www.scribd.com/document/611469328) prints it, numbering [memory]) computed by the test
 * itself. Memory and speed are measured by `npm run bench`, not here.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { builtPackage, csvRows, FIXTURES, loadwright } from "./harness.js";

const ROWS = 20_000;
let dir: string;

/** Test inputs: D ≥ 0, L ≥ 0 and one reversible wind case of either sign, varied row by row. */
function loads(i: number) {
  return { d: (i % 97) + 1, l: (i * 7) % 53, w: ((i * 13) % 41) - 20 };
}

/**
 * The envelope by hand for D ≥ 0, L ≥ 0: (1) 1.4D; (2) 1.2D + 1.6L, L may be absent; (4) 1.2D ± W + L,
 * L may be absent; (5) 0.9D ± W. Largest: 1.4D, 1.2D + 1.6L, 1.2D + |W| + L or 0.9D + |W|.
 * Smallest: 0.9D − |W| (below 1.2D − |W|, 1.2D and 1.4D when D ≥ 0).
 */
function byHand(i: number) {
  const { d, l, w } = loads(i);
  const a = Math.abs(w);
  return { max: Math.max(1.4 * d, 1.2 * d + 1.6 * l, 1.2 * d + a + l, 0.9 * d + a), min: 0.9 * d - a };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-stream-"));
  let csv = "member,station,D,L,W:N\n";
  for (let i = 0; i < ROWS; i++) {
    const { d, l, w } = loads(i);
    csv += `M${Math.floor(i / 10)},${i % 10},${d},${l},${w}\n`;
  }
  writeFileSync(join(dir, "export.csv"), csv);
});

describe("a streamed export", () => {
  test("gives every result row's envelope as the hand formula does", async () => {
    const run = await loadwright(["envelope", "export.csv", "--ruleset", join(FIXTURES, "strength-fixture.json"), "--id-columns", "2", "--format", "csv"], { cwd: dir });
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows).toHaveLength(ROWS + 1);
    rows.slice(1).forEach((row, i) => {
      const expected = byHand(i);
      expect(row[0]).toBe(`M${Math.floor(i / 10)} / ${i % 10}`);
      expect(Number(row[1])).toBeCloseTo(expected.max, 9);
      expect(Number(row[3])).toBeCloseTo(expected.min, 9);
    });
  });

  test("writes complete JSON and no progress bar when standard error is not a terminal", async () => {
    const run = await loadwright(["envelope", "export.csv", "--ruleset", join(FIXTURES, "strength-fixture.json"), "--id-columns", "2", "--format", "json"], { cwd: dir });
    expect(run.status).toBe(0);
    const body = JSON.parse(run.stdout);
    expect(body.envelope).toHaveLength(ROWS);
    expect(body.envelope[ROWS - 1].min.value).toBeCloseTo(byHand(ROWS - 1).min, 9);
    expect(run.stderr).not.toMatch(/\[=+-*\]|\d+%/);
  });

  test("chooses a governing row on one result and gives every result's concurrent value", async () => {
    // Row 0: D = 1, L = 0, W = −20: min = 0.9·1 − 20 = −19.1 under 0.9D + W:N (W:N negative, taken as given).
    const run = await loadwright(
      ["governing", "export.csv", "--ruleset", join(FIXTURES, "strength-fixture.json"), "--id-columns", "2", "--criterion", "min [M0 / 0]", "--format", "csv"],
      { cwd: dir },
    );
    expect(run.status).toBe(0);
    const rows = csvRows(run.stdout);
    expect(rows[0]).toEqual(["member / station", "min [M0 / 0] → 5: 0.9D + W:N"]);
    expect(rows).toHaveLength(ROWS + 1);
    rows.slice(1).forEach((row, i) => {
      const { d, w } = loads(i);
      expect(Number(row[1])).toBeCloseTo(0.9 * d + w, 9); // §2.3.1 (5) concurrent: 0.9D + W:N in the same row
    });
  });
});

/** util-linux `script` gives the command a terminal; without it (or without a pseudo-terminal) the test is skipped. */
function terminalAvailable(): boolean {
  try {
    execFileSync("script", ["-qec", "true", "/dev/null"], { stdio: "ignore", timeout: 10_000 });
    return true;
  } catch {
    return false;
  }
}

describe.skipIf(!terminalAvailable())("on a terminal", () => {
  test("a long streamed run draws a progress bar on standard error and clears it at the end", async () => {
    const big = join(dir, "big.csv");
    let csv = "result,D,L,W:N\n";
    for (let i = 0; i < 200_000; i++) csv += `R${i},${(i % 89) + 1},${i % 31},${(i % 23) - 11}\n`;
    writeFileSync(big, csv);
    const bin = join(await builtPackage(), "bin/loadwright.js");
    const typescript = join(dir, "terminal.txt");
    const command = `${JSON.stringify(process.execPath)} ${JSON.stringify(bin)} envelope ${JSON.stringify(big)} --ruleset ${JSON.stringify(join(FIXTURES, "strength-fixture.json"))} > /dev/null`;
    execFileSync("script", ["-qec", command, typescript], { stdio: "ignore", timeout: 120_000 });
    const screen = readFileSync(typescript, "utf8");
    expect(screen).toMatch(/envelope \[=+-*\] \d+% \| [\d.]+\/[\d.]+ MB/);
    expect(screen).toMatch(/\x1b\[2K/); // the bar's line is cleared when the run ends
  });

  test("writes a text table by default when standard output is a terminal", async () => {
    const bin = join(await builtPackage(), "bin/loadwright.js");
    const typescript = join(dir, "table.txt");
    const command = `${JSON.stringify(process.execPath)} ${JSON.stringify(bin)} envelope ${JSON.stringify(join(FIXTURES, "reactions-rows.csv"))} --ruleset ${JSON.stringify(join(FIXTURES, "strength-fixture.json"))}`;
    execFileSync("script", ["-qec", command, typescript], { stdio: "ignore", timeout: 60_000 });
    const screen = readFileSync(typescript, "utf8");
    expect(screen).toMatch(/result\s+max\s+max row\s+min\s+min row/);
    // AISC Design Examples (companion to the AISC Steel Construction Manual, American Institute of Steel Construction), Example E.1A: 1.2·140 + 1.6·420 = 840.
    expect(screen).toMatch(/P\s+840\s+2: 1\.2D \+ 1\.6L/);
  });
});
