/**
 * Bad input is loud: every error ends the run with a non-zero status and one
 * line per problem on standard error that names the file, line and column
 * (or the option, or the ruleset entry) and what is wrong — never a stack
 * trace. Each case writes a real file and runs the real command line.
 */
import { mkdtempSync, writeFileSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, test } from "vitest";
import { errorLines, FIXTURES, loadwright } from "./harness.js";

let dir: string;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-errors-"));
  writeFileSync(join(dir, "rules.json"), readFileSync(join(FIXTURES, "strength-fixture.json")));
});

function file(name: string, text: string): string {
  writeFileSync(join(dir, name), text);
  return name;
}


async function refused(args: string[]) {
  const run = await loadwright(args, { cwd: dir });
  expect(run.status).toBe(1);
  expect(run.stderr).not.toMatch(/^\s+at /m); // no stack trace
  expect(run.stderr).not.toMatch(/internal error/);
  const lines = errorLines(run.stderr);
  expect(lines.length).toBeGreaterThan(0);
  return lines;
}

const RULES = ["--ruleset", "rules.json", "--format", "csv"];

describe("errors in case files", () => {
  test("names a missing file", async () => {
    expect(await refused(["envelope", "nowhere.csv", ...RULES])).toEqual(["nowhere.csv: no such file"]);
  });

  test("names an empty file", async () => {
    const lines = await refused(["envelope", file("empty.csv", ""), ...RULES]);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^empty\.csv: the file is empty/);
  });

  test("names the line and column where a row is shorter than the header row", async () => {
    const name = file("ragged.csv", "result,D,L\nC1,140,420\nC2,152\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toEqual([expect.stringMatching(/^ragged\.csv line 3, column C: the row has 2 fields where the header row \(line 1\) has 3/)]);
  });

  test("names the line and column where a row is longer than the header row", async () => {
    const name = file("long.csv", "case,P\nD,140\nL,420,7\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toEqual([expect.stringMatching(/^long\.csv line 3, column C: the row has 3 fields where the header row \(line 1\) has 2/)]);
  });

  test("names the cell that holds text instead of a number, cases as rows", async () => {
    const name = file("text-rows.csv", "case,P,V\nD,140,2\nL,4x0,5\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toEqual([expect.stringMatching(/^text-rows\.csv line 3, column B \(L \/ P\): "4x0" is not a number/)]);
  });

  test("names the cell that holds text instead of a number in a streamed export", async () => {
    const name = file("text-columns.csv", "result,D,L\nC1,140,420\nC2,152,n/a\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toEqual([expect.stringMatching(/^text-columns\.csv line 3, column C \(L\): "n\/a" is not a number/)]);
  });

  test("names a duplicate case header and where it first appears", async () => {
    const name = file("duplicate.csv", "result,D,L,D\nC1,1,2,3\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toEqual([expect.stringMatching(/^duplicate\.csv line 1, column D \(D\): case header "D" appears twice \(also at line 1, column B\)$/)]);
  });

  test("names a header that is no load symbol of the ruleset, with the symbols there are", async () => {
    const name = file("unknown.csv", "result,D,Q,L\nC1,1,2,3\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^unknown\.csv line 1, column C \(Q\): case header "Q" names no load symbol of test-fixture-strength/);
    expect(lines[0]).toMatch(/symbols: D, L, Lr, S, W/);
  });

  test("suggests --id-columns when a second name column reads as a case header", async () => {
    const name = file("two-ids.csv", "member,station,D,L\nM1,0,140,420\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines[0]).toMatch(/^two-ids\.csv line 1, column B \(station\): case header "station" names no load symbol/);
    expect(lines[1]).toBe("if column B is part of each result row's name, say how many columns name a row: --id-columns 2");
  });

  test("counts lines across empty lines and quoted line breaks", async () => {
    const name = file("lines.csv", 'case,P,V\nD,140,2\n\n"L",420,5\nW:N,"-50\n",10\nW:E,abc,-8\n');
    const lines = await refused(["envelope", name, ...RULES]);
    // Line 1 header, 2 D, 3 empty, 4 L, 5–6 W:N (a quoted line break; "-50" and a break reads as -50), 7 W:E.
    expect(lines).toEqual(['lines.csv line 7, column B (W:E / P): "abc" is not a number']);
  });

  test("names a mistyped case header down the first column of a cases-as-rows table", async () => {
    const name = file("unknown-rows.csv", "case,P\nD,140\nLx,420\n");
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines[0]).toMatch(/^unknown-rows\.csv line 3, column A \(Lx\): case header "Lx" names no load symbol of test-fixture-strength/);
  });

  test("names the line and column of a JSON case file's bad cell", async () => {
    const name = file("cells.json", '[\n  ["case", "P"],\n  ["D", 140],\n  ["L", "420"]\n]\n');
    const lines = await refused(["envelope", name, ...RULES]);
    expect(lines).toEqual([expect.stringMatching(/^cells\.json line 4, column 9 \(L \/ P\): "420" is not a number \(a number stored as text\? convert it\)/)]);
  });

  test("names the line and column of a JSON syntax error", async () => {
    const name = file("broken.json", '[\n  ["case", "P"],\n  ["D", 140,]\n]\n');
    const lines = await refused(["envelope", name, ...RULES]);
    // The trailing comma: line 3 is `  ["D", 140,]`, and the "]" at column 13 is where it stops being JSON.
    expect(lines).toEqual(["broken.json line 3, column 13: not valid JSON: Unexpected token ']'"]);
  });

  test("names a directory given as a case file", async () => {
    expect(await refused(["envelope", ".", ...RULES])).toEqual([". : is a directory, not a case file".replace(" :", ":")]);
  });
});

describe("errors in rulesets and parameters", () => {
  test("names the line and column of a JSON syntax error in a ruleset file", async () => {
    const name = file("trailing-comma.json", '{\n  "format": "loadwright-ruleset/1",\n}\n');
    const lines = await refused(["combos", "--ruleset", name, "--format", "csv"]);
    expect(lines).toEqual([expect.stringMatching(/^trailing-comma\.json line 3, column 1: not valid JSON/)]);
  });

  test("names an unknown ruleset and says how to list the shipped ones", async () => {
    const lines = await refused(["combos", "--ruleset", "no-such-ruleset", "--format", "csv"]);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^--ruleset: unknown ruleset "no-such-ruleset": no shipped ruleset has this id and there is no file of that name/);
    expect(lines[0]).toMatch(/`loadwright rulesets` lists them/);
  });

  test("names the line, column, combination and character of an unknown name in a ruleset file", async () => {
    const rules = JSON.parse(readFileSync(join(FIXTURES, "strength-fixture.json"), "utf8"));
    rules.combinations[1].expression = "1.2D + 1.6L + 0.5(Lr or Sx)";
    const name = file("bad-rules.json", JSON.stringify(rules, null, 2));
    const text = readFileSync(join(dir, name), "utf8");
    const line = text.split("\n").findIndex((l) => l.includes("Sx")) + 1;
    const column = text.split("\n")[line - 1].indexOf("Sx") + 1;
    const lines = await refused(["combos", "--ruleset", name, "--format", "csv"]);
    expect(lines).toEqual([
      expect.stringMatching(new RegExp(`^bad-rules\\.json line ${line}, column ${column} \\(combinations\\[1\\]\\.expression, combination "2", character 25\\): unknown name "Sx"`)),
    ]);
  });

  test("names a parameter value that is not allowed", async () => {
    // ASCE/SEI 7-16 §2.3.1 exception [confirmed in the 7-10 text]: the factor on L is 1.0 or 0.5, nothing else.
    const lines = await refused(["combos", "--ruleset", "rules.json", "--param", "fL=0.7", "--format", "csv"]);
    expect(lines).toEqual([expect.stringMatching(/^--param: parameter fL = 0\.7 is not one of the allowed values 0\.5, 1/)]);
  });

  test("names an unknown parameter with the ones there are", async () => {
    const lines = await refused(["combos", "--ruleset", "rules.json", "--param", "fl=0.5", "--format", "csv"]);
    expect(lines).toEqual([expect.stringMatching(/^--param: unknown parameter "fl"; did you mean "fL"\? \(parameters of test-fixture-strength: fL\)/)]);
  });

  test("names a parameter written without a value", async () => {
    const lines = await refused(["combos", "--ruleset", "rules.json", "--param", "fL", "--format", "csv"]);
    expect(lines).toEqual(['--param "fL", character 1: "fL" is not name=value']);
  });

  test("names a criterion that names no component", async () => {
    const lines = await refused(["governing", join(FIXTURES, "reactions-rows.csv"), ...RULES, "--criterion", "max Q"]);
    expect(lines[0]).toMatch(/^--criterion "max Q", character 5: "Q" is not a component of the case table/);
  });

  test("names a criterion's result row that a streamed export does not have, with the nearest id", async () => {
    const lines = await refused(["governing", join(FIXTURES, "export-columns.csv"), ...RULES, "--criterion", "max [C1 botom]"]);
    expect(lines).toEqual([expect.stringMatching(/^--criterion "max \[C1 botom\]": no result row of .*export-columns\.csv is named "C1 botom"; did you mean "C1 bottom"\?/)]);
  });
});

describe("errors in the command line itself", () => {
  test("exits with status 2 and one line for an unknown command", async () => {
    const run = await loadwright(["envelopes"], { cwd: dir });
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/^loadwright: error: unknown command 'envelopes'/);
  });

  test("exits with status 2 when --ruleset is missing", async () => {
    const run = await loadwright(["envelope", "x.csv"], { cwd: dir });
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/^loadwright: error: required option '-r, --ruleset <id\|file>' not specified/);
  });

  test("refuses an unknown output format", async () => {
    expect(await refused(["rulesets", "--format", "xml"])).toEqual(['--format: "xml" is not an output format (table, csv, json, md)']);
  });
});
