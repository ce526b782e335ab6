import { describe, expect, test } from "vitest";
import { calendarDateProblem } from "../../src/taskpane/approvalDate.js";

describe("calendarDateProblem", () => {
  test.each([
    ["2026-02-28", null], // Gregorian calendar: February 2026 has 28 days (2026 is not divisible by 4) — common practice (no source)
    ["2028-02-29", null], // 2028 is a leap year (divisible by 4, not by 100)
    ["2024-12-31", null],
  ])("accepts %s", (text, expected) => {
    expect(calendarDateProblem(text)).toBe(expected);
  });

  test.each([
    ["2026-02-29", '"2026-02-29" is not a day of the calendar'],
    ["2026-04-31", '"2026-04-31" is not a day of the calendar'], // April has 30 days
    ["2100-02-29", '"2100-02-29" is not a day of the calendar'], // 2100 is divisible by 100 and not by 400: no leap day
    ["2026-13-01", '"2026-13-01" is not a day of the calendar'],
    ["31/01/2026", '"31/01/2026" is not a date written YYYY-MM-DD'],
    ["", '"" is not a date written YYYY-MM-DD'],
  ])("refuses %s", (text, expected) => {
    expect(calendarDateProblem(text)).toBe(expected);
  });

  test("refuses 30 February, which Date.parse rolls over to 2 March", () => {
    // ECMA-262 leaves Date.parse of an out-of-range ISO day to the implementation; V8 rolls it over (engine bug reported).
    expect(calendarDateProblem("2026-02-30")).toBe('"2026-02-30" is not a day of the calendar');
  });
});
