import { describe, expect, test } from "vitest";
import { describeProblem, readCaseMap, readCaseTable, rulesetFromRows, type Cell, type Result } from "../../../src/core/index.js";

const typed = rulesetFromRows([
  ["2", "1.2D + 1.6L + 0.5(Lr or S or R)", "ASCE/SEI 7-16 §2.3.1 (2)"],
  ["4", "1.2D + 1.0W! + L + 0.5(Lr or S or R)", "ASCE/SEI 7-16 §2.3.1 (4)"],
  ["6", "1.2D + E! + L + 0.2S", "ASCE/SEI 7-16 §2.3.6 (6)"],
]);
if (!typed.ok) throw new Error("ruleset refused");
const ruleset = typed.value;

function messages<T>(r: Result<T>): string[] {
  return r.ok ? [] : r.problems.map((p) => describeProblem(p));
}

describe("readCaseTable", () => {
  test("reads cases as rows: components across, one case per row", () => {
    const r = readCaseTable(
      [
        ["", "P", "V"],
        ["D", 140, 2],
        ["L", 420, 5],
        ["W:N", -50, 10],
      ],
      ruleset,
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.orientation).toBe("rows");
    expect(r.value.components).toEqual(["P", "V"]);
    expect(r.value.cases).toEqual([
      { header: "D", symbol: "D" },
      { header: "L", symbol: "L" },
      { header: "W:N", symbol: "W" },
    ]);
    expect([...r.value.values[0]]).toEqual([140, 420, -50]);
    expect([...r.value.values[1]]).toEqual([2, 5, 10]);
  });

  test("reads cases as columns: one result per row, with its id", () => {
    const r = readCaseTable(
      [
        ["result", "D", "L", "W:N"],
        ["C1 top", 140, 420, -50],
        ["C1 bottom", 152, 420, -61],
      ],
      ruleset,
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.orientation).toBe("columns");
    expect(r.value.components).toEqual(["C1 top", "C1 bottom"]);
    expect([...r.value.values[1]]).toEqual([152, 420, -61]);
  });

  test("joins several id columns of an export into one result id", () => {
    const r = readCaseTable(
      [
        ["member", "station", "D", "L"],
        ["B12", 0.5, 10, 4],
      ],
      ruleset,
      { idColumns: 2 },
    );
    expect(r.ok && r.value.components).toEqual(["B12 / 0.5"]);
  });

  test("reads blank value cells as zero however Excel sends them: null, empty text or undefined", () => {
    const r = readCaseTable([["", "P", "V", "M"], ["D", null, "", undefined], ["L", 0, "  ", 3]], ruleset);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.values.map((v) => [...v])).toEqual([
      [0, 0],
      [0, 0],
      [0, 3],
    ]);
  });

  test("ignores blank rows and columns at the edge of a generously selected range", () => {
    const r = readCaseTable([["", "P", null], ["D", 1, null], [null, null, null]], ruleset);
    expect(r.ok && r.value.components).toEqual(["P"]);
    expect(r.ok && r.value.cases.length).toBe(1);
  });

  test("names the cell of text, a number stored as text, or a boolean in a value cell", () => {
    expect(messages(readCaseTable([["", "P", "V"], ["D", "abc", 2], ["L", "12.5", true]], ruleset))).toEqual([
      'cell B2: "abc" is not a number',
      'cell B3: "12.5" is not a number (a number stored as text? convert it)',
      "cell C3: TRUE is not a number",
    ]);
  });

  test("accepts numbers written as text where asked (CSV files)", () => {
    const r = readCaseTable([["", "P"], ["D", "12.5"], ["L", "-3e2"]], ruleset, { numbersAsText: true });
    expect(r.ok && [...r.value.values[0]]).toEqual([12.5, -300]);
  });

  test("names a header that names no symbol, with the symbols there are and a likely fix", () => {
    expect(messages(readCaseTable([["", "P"], ["D", 1], ["LR", 2]], ruleset, { orientation: "rows" }))).toEqual([
      'cell A3: case header "LR" names no load symbol of the typed ruleset; did you mean "Lr"? (symbols: D, L, Lr, S, R, W, E; write SYMBOL or SYMBOL:name, or assign the header in a case map)',
    ]);
  });

  test("names both places of a duplicate case header", () => {
    expect(messages(readCaseTable([["id", "D", "L", "D"], ["x", 1, 2, 3]], ruleset))).toEqual(['cell D1: case header "D" appears twice (also at B1)']);
  });

  test("names a duplicate or empty component header", () => {
    expect(messages(readCaseTable([["", "P", "P", null], ["D", 1, 2, 3]], ruleset))).toEqual([
      'cell C1: component "P" appears twice (also at B1)',
      "cell D1: the component header is empty",
    ]);
  });

  test("names one mistyped header where most headers read as cases", () => {
    expect(messages(readCaseTable([["", "P", "V"], ["D", 140, 2], ["L", 420, 5], ["Wn", -50, 10]], ruleset))).toEqual([
      'cell A4: case header "Wn" names no load symbol of the typed ruleset; did you mean "W:n"? (symbols: D, L, Lr, S, R, W, E; write SYMBOL or SYMBOL:name, or assign the header in a case map)',
    ]);
  });

  test("says when neither orientation fits, and when both do", () => {
    expect(messages(readCaseTable([["", "P"], ["Dead", 1]], ruleset))[0]).toMatch(/^neither the first row nor the first column holds load cases/);
    expect(messages(readCaseTable([["", "D"], ["L", 1]], ruleset))[0]).toMatch(/^both the first row and the first column read as load cases/);
    expect(readCaseTable([["", "D"], ["L", 1]], ruleset, { orientation: "columns" }).ok).toBe(true);
  });

  test("skips a blank row of any width, as a CSV's empty line gives it", () => {
    const r = readCaseTable([["case", "P"], ["D", 140], [""], ["L", 420]], ruleset);
    expect(r.ok && [...r.value.values[0]]).toEqual([140, 420]);
  });

  test("names both rows of a result id that appears twice in a cases-as-columns table", () => {
    expect(messages(readCaseTable([["result", "D", "L"], ["C1", 1, 2], ["C2", 1, 2], ["C1", 3, 4]], ruleset))).toEqual(['cell A4: result "C1" appears twice (also at A2)']);
  });

  test("refuses ragged rows and a table without values", () => {
    expect(messages(readCaseTable([["", "P", "V"], ["D", 1]], ruleset))).toEqual(["row 2: it has 2 cells where the header row has 3"]);
    expect(messages(readCaseTable([["", "P"]], ruleset))).toEqual(["the case table needs a header row, a header column and at least one value"]);
  });

  test("does not change the matrix it reads", () => {
    const matrix: Cell[][] = [["", "P"], ["D", null], ["L", 3]];
    const copy = JSON.parse(JSON.stringify(matrix));
    readCaseTable(matrix, ruleset);
    expect(matrix).toEqual(copy);
  });
});

describe("readCaseMap", () => {
  test("assigns headers written another way to symbols, and changes how a symbol's cases combine", () => {
    const map = readCaseMap([["Wind 0deg", "W"], ["Wind 90deg", "W"], ["E", "orthogonal"], ["D", "each"]], ruleset);
    expect(map.ok).toBe(true);
    if (!map.ok) return;
    const r = readCaseTable([["", "P"], ["D", 1], ["Wind 0deg", 2], ["Wind 90deg", 3]], ruleset, { map: map.value });
    expect(r.ok && r.value.cases.map((c) => c.symbol)).toEqual(["D", "W", "W"]);
    expect(Object.fromEntries(map.value.modes)).toEqual({ E: "orthogonal", D: "each" });
  });

  test("names the cell of a row it cannot read", () => {
    expect(messages(readCaseMap([["Wind", "X"], ["Q", "sum"], ["Wind", null]], ruleset))).toEqual([
      'cell B1: "X" is neither a load symbol of the typed ruleset nor sum, each, orthogonal, independent, one-way or both-ways',
      'cell A2: "Q" is not a load symbol of the typed ruleset (symbols: D, L, Lr, S, R, W, E)',
      "cell B3: a case map row needs two cells: [header, symbol], [symbol, sum|each|orthogonal|independent] or [symbol, one-way|both-ways]",
    ]);
  });
});
