/**
 * Values near the largest double: a factored sum past about 1.7976931348623157
 * × 10^308 (IEEE 754 binary64; ECMA-262 Number.MAX_VALUE) has no finite value,
 * and +Infinity + −Infinity is NaN (IEEE 754, invalid operation) [memory: the
 * clause of IEEE 754 that says so]. Every output refuses such a row with the
 * component and the row named — the envelope, the governing rows, the factored
 * rows, one explained value — and never skips it: before, a NaN row was passed
 * over by the max and the min, which then gave a finite, wrong extreme.
 *
 * Factors and values are hand arithmetic on invented numbers (common practice
 * (no source): the rows below are the user's own typed combinations).
 */
import { describe, expect, test } from "vitest";
import {
  envelope,
  explain,
  factored,
  governing,
  parseCriterion,
  planForTable,
  readCaseMap,
  readCaseTable,
  rulesetFromRows,
  describeProblem,
  EMPTY_CASE_MAP,
  type Cell,
  type Problem,
  type Result,
} from "../../../src/core/index.js";

function setup(rows: Cell[][], table: Cell[][], mapRows: Cell[][] = []) {
  const ruleset = rulesetFromRows(rows);
  if (!ruleset.ok) throw new Error(JSON.stringify(ruleset.problems));
  const map = mapRows.length > 0 ? readCaseMap(mapRows, ruleset.value) : { ok: true as const, value: EMPTY_CASE_MAP };
  if (!map.ok) throw new Error(JSON.stringify(map.problems));
  const cases = readCaseTable(table, ruleset.value, { map: map.value });
  if (!cases.ok) throw new Error(JSON.stringify(cases.problems));
  const plan = planForTable(ruleset.value, {}, cases.value);
  if (!plan.ok) throw new Error(JSON.stringify(plan.problems));
  return { plan: plan.value, table: cases.value };
}

function refused<T>(result: Result<T>): Problem {
  if (result.ok) expect.fail(`expected a refusal, got ${JSON.stringify(result.value)}`);
  expect(result.problems).toHaveLength(1);
  expect(result.problems[0].kind).toBe("result-not-finite");
  return result.problems[0];
}

const PASSES = "the factored sum passes the largest number Loadwright can hold (about ±1.8 × 10^308); check the case values";

describe("a row whose sum is +∞ + (−∞)", () => {
  // Row 1: 0.9 × 1.6e308 = 1.44e308, finite. Row 2: 1.2 × 1.6e308 = 1.92e308 (+∞) and 1.6 × (−1.6e308) = −2.56e308 (−∞);
  // W taken one way only. Skipping row 2 gave max = min = 1.44e308 under "1: 0.9D" before: a silent wrong number.
  const { plan, table } = setup(
    [
      ["1", "0.9D", "typed"],
      ["2", "1.2D + 1.6W!", "typed"],
    ],
    [
      ["", "C1"],
      ["D", 1.6e308],
      ["W", -1.6e308],
    ],
    [["W", "one-way"]],
  );

  test("is refused by the envelope, naming the component, its cell and the row", () => {
    const p = refused(envelope(plan, table));
    expect(p.message).toBe(`"C1" has no finite value in row "2: 1.2D + 1.6W": ${PASSES}`);
    expect(p.place).toEqual({ row: 0, column: 1 });
    expect(describeProblem(p)).toBe(`cell B1: "C1" has no finite value in row "2: 1.2D + 1.6W": ${PASSES}`);
  });

  test("is refused by the factored rows and by governing rows", () => {
    expect(refused(factored(plan, table)).message).toBe(`"C1" has no finite value in row "2: 1.2D + 1.6W": ${PASSES}`);
    const criterion = parseCriterion("max C1", table.components);
    if (!criterion.ok) throw new Error("criterion");
    expect(refused(governing(plan, table, [criterion.value])).message).toBe(`criterion "max C1" has no finite value in row "2: 1.2D + 1.6W": ${PASSES}`);
  });

  test("is refused when explained", () => {
    expect(refused(explain(plan, table, "2: 1.2D + 1.6W", "C1")).message).toBe(`"C1" has no finite value in row "2: 1.2D + 1.6W": ${PASSES}`);
    // The other row is finite and explained: 0.9 × 1.6e308 = 1.44e308.
    const one = explain(plan, table, "1: 0.9D", "C1");
    expect(one.ok && one.value.total).toBeCloseTo(1.44e308, -300);
  });
});

describe("a factored sum past the largest number", () => {
  test("1.4 × 1.5e308 (= 2.1e308) is refused; 1.0 × 1.7e308 stands as a finite result", () => {
    const { plan, table } = setup(
      [
        ["1", "1.4D", "typed"],
        ["2", "D", "typed"],
      ],
      [
        ["result", "D"],
        ["near", 1.2e308],
        ["past", 1.5e308],
      ],
    );
    const p = refused(envelope(plan, table));
    // Cases as columns: the result row is named at its id cell (row 3, column A).
    expect(p.place).toEqual({ row: 2, column: 0 });
    expect(p.message).toBe(`"past" has no finite value in row "1: 1.4D": ${PASSES}`);
    const fine = setup([["2", "D", "typed"]], [["result", "D"], ["edge", 1.7976931348623157e308]]);
    const e = envelope(fine.plan, fine.table);
    expect(e.ok && e.value[0].max.value).toBe(1.7976931348623157e308);
  });

  test("two finite terms whose sum passes the largest number are refused, in the row that sums them", () => {
    // 1.0 × 1e308 + 1.0 × 1e308 = 2e308: each option finite, the branch sum is +∞ (monotone rounding: it is the max row).
    const { plan, table } = setup([["1", "D + L", "typed"]], [["", "N"], ["D", 1e308], ["L", 1e308]]);
    expect(refused(envelope(plan, table)).message).toBe(`"N" has no finite value in row "1: D + L": ${PASSES}`);
  });
});

describe("numbers at the other end", () => {
  test("subnormal case values give subnormal, finite results", () => {
    // 1.2 × 5e-324 and 1.6 × 5e-324 rounded as IEEE 754 rounds them (computed here by the language, not the engine).
    const { plan, table } = setup([["2", "1.2D + 1.6L!", "typed"]], [["", "P"], ["D", 5e-324], ["L", 5e-324]]);
    const e = envelope(plan, table);
    expect(e.ok && e.value[0].max.value).toBe(1.2 * 5e-324 + 1.6 * 5e-324);
  });

  test("−0 case values give a zero, never −0", () => {
    const { plan, table } = setup([["2", "1.2D + 1.6L!", "typed"]], [["", "P"], ["D", -0], ["L", -0]]);
    const e = envelope(plan, table);
    expect(e.ok && Object.is(e.value[0].max.value, 0)).toBe(true);
    expect(e.ok && Object.is(e.value[0].min.value, 0)).toBe(true);
  });
});
