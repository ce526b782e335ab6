/**
 * Hostile input through the real command line, as a child process on real
 * files: a ruleset, a criterion or a case file beyond the stated limits, or
 * holding a field that reaches a prototype, ends the run with status 1 and one
 * located line — never "internal error" (status 70) or a stack trace. And
 * criteria in the forms engineers write work on a streamed export.
 */
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { errorLines, FIXTURES, loadwright } from "./harness.js";

let dir: string;
const fixture = JSON.parse(readFileSync(join(FIXTURES, "strength-fixture.json"), "utf8")) as { combinations: { expression: string }[] };

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-hostile-"));
  writeFileSync(join(dir, "rules.json"), JSON.stringify(fixture, null, 2));
  writeFileSync(join(dir, "reactions-rows.csv"), readFileSync(join(FIXTURES, "reactions-rows.csv")));
});

function file(name: string, text: string): string {
  writeFileSync(join(dir, name), text);
  return name;
}

/** A copy of the fixture ruleset whose first combination is `expression`, pretty-printed like a hand-kept file. */
function rulesWith(name: string, expression: string): { name: string; text: string } {
  const copy = structuredClone(fixture);
  copy.combinations[0].expression = expression;
  const text = JSON.stringify(copy, null, 2);
  return { name: file(name, text), text };
}

/** "line L, column C" of the character `after` characters past the start of `needle` in `text`, as an editor counts. */
function placeOf(text: string, needle: string, after = 0): string {
  const offset = text.indexOf(needle) + after;
  const before = text.slice(0, offset);
  return `line ${before.split("\n").length}, column ${offset - before.lastIndexOf("\n")}`;
}

async function refused(args: string[]): Promise<string[]> {
  const run = await loadwright(args, { cwd: dir });
  expect(run.stderr).not.toMatch(/internal error/);
  expect(run.stderr).not.toMatch(/^\s+at /m);
  expect(run.status).toBe(1);
  return errorLines(run.stderr);
}

describe("hostile rulesets", () => {
  test("refuses a combination with 5,000 nested brackets, naming the file line, the entry and the character", async () => {
    // This once stopped the command line with "internal error: Maximum call stack size exceeded" (status 70).
    const { name, text } = rulesWith("brackets.json", `${"(".repeat(5_000)}D${")".repeat(5_000)}`);
    // Character 2,001 of the expression: its opening quote, then 2,000 characters on.
    expect(await refused(["combos", "--ruleset", name])).toEqual([
      `brackets.json ${placeOf(text, '"((((', 2_001)} (combinations[0].expression, combination "1", character 2001): the expression has 10,001 characters; at most 2,000 are read`,
    ]);
  });

  test("refuses brackets nested beyond the limit within the length limit, at the first one too deep", async () => {
    const { name, text } = rulesWith("nested.json", `${"(".repeat(40)}D${")".repeat(40)}`);
    expect(await refused(["combos", "--ruleset", name])).toEqual([
      `nested.json ${placeOf(text, '"((((', 33)} (combinations[0].expression, combination "1", character 33): brackets, |…|, functions, signs and powers are nested more than 32 deep here`,
    ]);
  });

  test("refuses a ruleset file nested 100,000 deep at the line and column of the first level too deep", async () => {
    const name = file("deep.json", `{"notes": ${"[".repeat(100_000)}${"]".repeat(100_000)}}`);
    // "{" is level 1; the 64th "[" (offset 10 + 63) is level 65, at column 74.
    expect(await refused(["combos", "--ruleset", name])).toEqual(["deep.json line 1, column 74: objects and lists are nested more than 64 deep"]);
  });

  test("refuses __proto__ among the symbols, at its line and path", async () => {
    const text = JSON.stringify(fixture, null, 2).replace('"symbols": {', '"symbols": {\n    "__proto__": { "description": "x", "permanence": "permanent" },');
    const name = file("proto.json", text);
    // The place of the refused field's value, its "{".
    expect(await refused(["combos", "--ruleset", name])).toEqual([
      `proto.json ${placeOf(text, '"__proto__": {', 13)} (symbols.__proto__): the field name "__proto__" is refused: a program copying fields by name would change an object's prototype with it`,
    ]);
  });
});

describe("hostile criteria and case files", () => {
  test("refuses a criterion with 5,000 nested brackets at its character", async () => {
    const criterion = `max ${"(".repeat(5_000)}V${")".repeat(5_000)}`;
    const lines = await refused(["governing", "reactions-rows.csv", "--ruleset", "rules.json", "--criterion", criterion]);
    expect(lines).toEqual([expect.stringMatching(/^--criterion "max \(+V\)+", character 2001: the criterion has 10,005 characters; at most 2,000 are read$/)]);
  });

  test("refuses a JSON case file nested beyond the limit", async () => {
    const name = file("deep-cases.json", `${"[".repeat(100_000)}${"]".repeat(100_000)}`);
    expect(await refused(["envelope", name, "--ruleset", "rules.json"])).toEqual(["deep-cases.json: objects and lists are nested more than 64 deep at line 1, column 65"]);
  });

  test("refuses a JSON case file with a field that reaches a prototype, at its line and column", async () => {
    const name = file("proto-cases.json", '[["", "P"],\n ["D", 140],\n {"__proto__": {"polluted": true}}]');
    expect(await refused(["envelope", name, "--ruleset", "rules.json"])).toEqual([
      'proto-cases.json line 3, column 16: the field name "__proto__" is refused: a program copying fields by name would change an object\'s prototype with it',
    ]);
  });
});

describe("criteria engineers write, on a streamed export", () => {
  test("max sqrt([C1 top]^2 + [C1 bottom]^2) reads only the rows it names and finds the row by hand", async () => {
    // export-columns.csv (test/cli/fixtures): C1 top D 140, L 420; C1 bottom D 152, L 420. The largest of
    // √(top² + bottom²) is in §2.3.1 (2) 1.2D + 1.6L: top 168 + 672 = 840, bottom 182.4 + 672 = 854.4
    // (with wind, (4) reaches at most 1.2·152 + 420 + 61 = 663.4, less).
    const run = await loadwright(["governing", join(FIXTURES, "export-columns.csv"), "--ruleset", "rules.json", "--criterion", "max sqrt([C1 top]^2 + [C1 bottom]^2)", "--format", "json"], { cwd: dir });
    expect(run.status).toBe(0);
    const rows = JSON.parse(run.stdout).rows;
    expect(rows).toHaveLength(1);
    expect(rows[0].label).toBe("2: 1.2D + 1.6L");
    expect(rows[0].values["C1 top"]).toBeCloseTo(840, 9);
    expect(rows[0].values["C1 bottom"]).toBeCloseTo(854.4, 9);
  });
});
