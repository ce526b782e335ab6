/**
 * One value cell, every kind a cell or a CSV field can hold: a finite number is
 * read as itself, a blank as zero, and everything else — text, TRUE/FALSE, a
 * spreadsheet error value, NaN, ±Infinity, text that reads past the largest
 * double — is a problem at its cell naming what is wrong.
 *
 * Number facts: the largest finite double is about 1.7976931348623157 × 10^308
 * and the smallest subnormal 2^-1074 ≈ 4.94 × 10^-324 (IEEE 754 binary64, as
 * ECMA-262 states for Number.MAX_VALUE and Number.MIN_VALUE, https://tc39.es/ecma262/,
 * "Properties of the Number Constructor"); a decimal beyond the largest rounds
 * to Infinity when read (ECMA-262, "StringToNumber", round to nearest) [memory:
 * the section names].
 */
import { describe, expect, test } from "vitest";
import { readValue, type Cell, type Problem } from "../../../src/core/index.js";

const AT = { row: 3, column: 2 };

function read(cell: Cell, numbersAsText = true): { value: number; problems: Problem[] } {
  const problems: Problem[] = [];
  const value = readValue(cell, AT, "L", { numbersAsText }, problems);
  return { value, problems };
}

function refusal(cell: Cell, numbersAsText = true): string {
  const { problems } = read(cell, numbersAsText);
  expect(problems).toHaveLength(1);
  expect(problems[0].kind).toBe("cases-not-a-number");
  expect(problems[0].place).toEqual({ ...AT, header: "L" });
  return problems[0].message;
}

describe("readValue", () => {
  test.each<[Cell, number]>([
    [12.5, 12.5],
    [-3, -3],
    [1.7976931348623157e308, 1.7976931348623157e308],
    [-1.7976931348623157e308, -1.7976931348623157e308],
    [5e-324, 5e-324],
    [2.2250738585072014e-308, 2.2250738585072014e-308],
  ])("reads the finite number %s as itself", (cell, expected) => {
    const { value, problems } = read(cell);
    expect(problems).toEqual([]);
    expect(value).toBe(expected);
  });

  test.each<[string, number]>([
    ["12.5", 12.5],
    ["-3", -3],
    ["1e3", 1000],
    ["+.5", 0.5],
    ["1.7976931348623157e308", 1.7976931348623157e308],
    ["5e-324", 5e-324],
    // Below half the smallest subnormal a decimal reads as zero: a defined value, not an error.
    ["1e-400", 0],
  ])("reads the text %s as a number where numbers come as text (CSV)", (cell, expected) => {
    const { value, problems } = read(cell);
    expect(problems).toEqual([]);
    expect(value).toBe(expected);
  });

  test("reads −0 as a zero, which every output writes as 0", () => {
    expect(read(-0).value === 0).toBe(true);
    expect(read("-0").value === 0).toBe(true);
    expect(read(-0).problems).toEqual([]);
  });

  test.each<Cell>([null, undefined, "", "   ", "\t"])("reads the blank %j as zero", (cell) => {
    const { value, problems } = read(cell);
    expect(problems).toEqual([]);
    expect(value).toBe(0);
  });

  test.each([
    ["1e400", '"1e400" is beyond the largest number Loadwright can hold (about ±1.8 × 10^308)'],
    ["-1e309", '"-1e309" is beyond the largest number Loadwright can hold (about ±1.8 × 10^308)'],
    ["1.8e308", '"1.8e308" is beyond the largest number Loadwright can hold (about ±1.8 × 10^308)'],
    [`1${"0".repeat(400)}`, `"${`1${"0".repeat(39)}`}… (401 characters)" is beyond the largest number Loadwright can hold (about ±1.8 × 10^308)`],
  ])("refuses the text %s, which would read as Infinity", (cell, message) => {
    expect(refusal(cell)).toBe(message);
  });

  test.each<[number, string]>([
    [Infinity, "Infinity is not a finite number"],
    [-Infinity, "-Infinity is not a finite number"],
    [NaN, "NaN is not a finite number"],
  ])("refuses the number %s", (cell, message) => {
    expect(refusal(cell)).toBe(message);
  });

  test.each(["Infinity", "-Infinity", "NaN", "inf", "0x10", "1_000", "1,5", "12 kN", "∞"])("refuses the text %s, which is no decimal number", (cell) => {
    expect(refusal(cell)).toMatch(new RegExp(`^"${cell.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}" is not a number`));
  });

  test.each(["#N/A", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#NULL!", "#SPILL!", "#CALC!"])(
    "names the spreadsheet error value %s as an error value, not a number",
    (cell) => {
      // The error values as Excel shows them in a cell (Microsoft Support, "How to correct a #… error", one page per value) [memory].
      expect(refusal(cell)).toBe(`${cell} is an error value, not a number (the formula that should have given it failed)`);
    },
  );

  test.each<[boolean, string]>([
    [true, "TRUE is not a number"],
    [false, "FALSE is not a number"],
  ])("refuses the boolean %s", (cell, message) => {
    expect(refusal(cell)).toBe(message);
  });

  test("refuses a number written as text in a worksheet cell, with the hint to convert it", () => {
    expect(refusal("12.5", false)).toBe('"12.5" is not a number (a number stored as text? convert it)');
    expect(refusal("1e400", false)).toBe('"1e400" is not a number');
  });

  test("cuts a long text in its message, with its length", () => {
    const long = "x".repeat(100_000);
    expect(refusal(long)).toBe(`"${"x".repeat(40)}… (100,000 characters)" is not a number`);
  });
});
