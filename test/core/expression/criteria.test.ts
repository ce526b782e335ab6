/**
 * Criteria in the forms engineers write — a shear resultant, an interaction of
 * torsion and shear, the sense with brackets, max(a, b) and min(a, b) inside an
 * expression, powers — held to values worked out by hand on a small table.
 */
import { describe, expect, test } from "vitest";
import {
  criterionNames,
  describeProblem,
  governing,
  parseCriterion,
  planForTable,
  readCaseTable,
  rulesetFromRows,
  type Criterion,
  type GoverningRow,
  type Result,
} from "../../../src/core/index.js";

// ASCE/SEI 7-16 §2.3.1 (1), (2), (5) [list confirmed for the 7-10 text], typed as in the formulas' tests.
// Component values per load case are invented for this test (Vx, Vy shears, T torsion, N axial):
//          Vx   Vy    T    N
//   D       3    4   10    0
//   L       5    0   20  100
//   W:N     0   10  -30   50
// Every concrete row by hand (W acts both ways; L may be absent):
//   1: 1.4D                 Vx 4.2   Vy 5.6    T 14    N 0
//   2: 1.2D + 1.6L          Vx 11.6  Vy 4.8    T 44    N 160
//   2: 1.2D [absent: 1.6L]  Vx 3.6   Vy 4.8    T 12    N 0
//   5: 0.9D + W:N           Vx 2.7   Vy 13.6   T -21   N 50
//   5: 0.9D - W:N           Vx 2.7   Vy -6.4   T 39    N -50
const ruleset = rulesetFromRows([
  ["1", "1.4D", "§2.3.1 (1)"],
  ["2", "1.2D + 1.6L", "§2.3.1 (2)"],
  ["5", "0.9D + 1.0W!", "§2.3.1 (5)"],
]);
if (!ruleset.ok) throw new Error("the typed ruleset does not load");
const table = readCaseTable(
  [
    ["", "Vx", "Vy", "T", "N"],
    ["D", 3, 4, 10, 0],
    ["L", 5, 0, 20, 100],
    ["W:N", 0, 10, -30, 50],
  ],
  ruleset.value,
);
if (!table.ok) throw new Error("the table does not read");
const planned = planForTable(ruleset.value, {}, table.value);
if (!planned.ok) throw new Error("the plan fails");
const PLAN = planned.value;
const TABLE = table.value;
const COMPONENTS = TABLE.components;

function criterion(text: string): Criterion {
  const r = parseCriterion(text, COMPONENTS);
  if (!r.ok) throw new Error(r.problems.map((p) => describeProblem(p)).join("; "));
  return r.value;
}

function governs(text: string): GoverningRow {
  const r = governing(PLAN, TABLE, [criterion(text)]);
  if (!r.ok) throw new Error(r.problems.map((p) => describeProblem(p)).join("; "));
  return r.value[0];
}

function refusal<T>(r: Result<T>): string {
  if (r.ok) throw new Error("accepted");
  return describeProblem(r.problems[0]);
}

describe("criteria as engineers write them", () => {
  test("max sqrt(Vx^2 + Vy^2): the shear resultant, largest where Vy is largest", () => {
    // Resultant √(Vx² + Vy²) per row: 1: √(17.64 + 31.36) = 7; 2: √(134.56 + 23.04) = √157.6 ≈ 12.554;
    // 2 [absent]: √(12.96 + 23.04) = 6; 5 +W: √(7.29 + 184.96) = √192.25 ≈ 13.865; 5 −W: √(7.29 + 40.96) ≈ 6.946.
    // Common practice (no source): the resultant of two perpendicular shears is their vector length.
    const g = governs("max sqrt(Vx^2 + Vy^2)");
    expect(g.label).toBe("5: 0.9D + W:N");
    expect(g.criterionValues[0]).toBeCloseTo(Math.sqrt(7.29 + 184.96), 9);
    const least = governs("min sqrt(Vx^2 + Vy^2)");
    expect(least.label).toBe("2: 1.2D [absent: 1.6L]");
    expect(least.criterionValues[0]).toBeCloseTo(6, 9); // 3.6, 4.8, 6: three times the 1.2, 1.6, 2 of a 3-4-5 triangle
  });

  test("max abs(T) / 120 + abs(Vy) / 95: an interaction of torsion and shear", () => {
    // Per row |T|/120 + |Vy|/95: 1: 14/120 + 5.6/95 ≈ 0.1756; 2: 44/120 + 4.8/95 ≈ 0.3667 + 0.0505 = 0.4172;
    // 2 [absent]: 0.1 + 0.0505 = 0.1505; 5 +W: 21/120 + 13.6/95 ≈ 0.175 + 0.1432 = 0.3182; 5 −W: 39/120 + 6.4/95 ≈ 0.325 + 0.0674 = 0.3924.
    // The capacities 120 and 95 are invented for the test.
    const g = governs("max abs(T) / 120 + abs(Vy) / 95");
    expect(g.label).toBe("2: 1.2D + 1.6L");
    expect(g.criterionValues[0]).toBeCloseTo(44 / 120 + 4.8 / 95, 9);
  });

  test("max(Vy) and min(T): the sense written with brackets, found exactly like max Vy", () => {
    const max = criterion("max(Vy)");
    expect(max.sense).toBe("max");
    expect(max.linear && Object.fromEntries(max.linear.weights)).toEqual({ 1: 1 }); // Vy is the second component
    expect(governs("max(Vy)").criterionValues[0]).toBeCloseTo(13.6, 9); // 0.9·4 + 10, row 5 +W
    expect(governs("min(T)").criterionValues[0]).toBeCloseTo(-21, 9); // 0.9·10 − 30, row 5 +W
    // max(|T|) is the absolute value, maximised: 44 in row 2 (14, 44, 12, 21, 39).
    const abs = criterion("max(|T|)");
    expect(abs.absLinear && Object.fromEntries(abs.absLinear.weights)).toEqual({ 2: 1 });
    expect(governs("max(|T|)").criterionValues[0]).toBeCloseTo(44, 9);
  });

  test("max(a, b) and min(a, b) inside an expression take the larger and smaller in each row", () => {
    // max(Vx, Vy) per row: 5.6, 11.6, 4.8, 13.6, 2.7 → 13.6 (5 +W).
    const larger = governs("max(Vx, Vy)");
    expect([larger.label, larger.criterionValues[0]]).toEqual(["5: 0.9D + W:N", expect.closeTo(13.6, 9)]);
    // min(Vx, Vy) per row: 4.2, 4.8, 3.6, 2.7, −6.4 → −6.4 (5 −W).
    const smaller = governs("min min(Vx, Vy)");
    expect([smaller.label, smaller.criterionValues[0]]).toEqual(["5: 0.9D - W:N", expect.closeTo(-6.4, 9)]);
    // max(Vx, Vy) − min(Vx, Vy) per row: 1.4, 6.8, 1.2, 10.9, 9.1 → 10.9 (5 +W).
    expect(governs("max max(Vx, Vy) - min(Vx, Vy)").criterionValues[0]).toBeCloseTo(10.9, 9);
    expect(criterion("max(Vx, Vy)").linear).toBeNull();
  });

  test("powers bind before signs and group from the right", () => {
    // −Vy² is −(Vy²): per row −31.36, −23.04, −23.04, −184.96, −40.96 → min −184.96 (5 +W); (−Vy)² would be positive.
    expect(governs("min -Vy^2").criterionValues[0]).toBeCloseTo(-184.96, 9);
    // 2^3^2 is 2^9 = 512, a constant, so N·2^3^2/512 is N itself and stays linear: max N = 160 (row 2: 1.6·100).
    const c = criterion("max N * 2^3^2 / 512");
    expect(c.linear && Object.fromEntries(c.linear.weights)).toEqual({ 3: 1 });
    expect(governs("max N * 2^3^2 / 512").criterionValues[0]).toBeCloseTo(160, 9);
  });

  test("names the character and the row where a criterion has no value", () => {
    // N is 0 in row 1 (1.4 × 0): Vy / N divides by zero there, at N (character 10).
    const r = governing(PLAN, TABLE, [criterion("max Vy / N")]);
    expect(refusal(r)).toBe('character 10: criterion "max Vy / N" has no value in row 1: 1.4D: division by zero');
    // T = −21 in row 5 +W, the first row with a negative T: the square root at character 5 has no real value.
    const s = governing(PLAN, TABLE, [criterion("max sqrt(T)")]);
    expect(refusal(s)).toBe('character 5: criterion "max sqrt(T)" has no value in row 5: 0.9D + W:N: the square root of a negative number (-21)');
  });
});

describe("criteria refused as they are read", () => {
  test.each([
    ["max Vy / 0", 10, "division by zero"],
    ["max Vy / (2 - 2)", 10, "division by zero"],
    ["max sqrt(-4)", 5, "the square root of a negative number (-4)"],
    ["max (-8)^(1/3)", 10, "-8 to the power 0.333333333333 is not a real number"],
    ["max max(Vy)", 5, "max(…) inside a criterion takes two or more values"],
    ["max sqrt(Vx, Vy)", 5, "sqrt(…) takes one value, not 2"],
    ["max abs Vy", 5, "write abs with its value in brackets: abs(V)"],
    ["max 2Vx", 6, 'unexpected "Vx" after the criterion\'s expression; to multiply, write "*" before it'],
    ["max Vx +- Vy", 8, '"±" marks a term acting both ways'],
    ["max (Vx or Vy)", 9, 'expected ")" to close the "(" at character 5, found "or"'],
    ["max [Vx", 5, 'this "[" is not closed'],
    ["max Vx^", 8, "ends where a value is expected"],
    ["max max(Vx, Vy", 15, 'expected ")" to close the "(" at character 8'],
    ["max |Vx", 8, 'expected a closing "|" for the "|" at character 5'],
    [`max ${"9".repeat(400)}*Vx`, 5, "is too large to compute with"],
  ])("%s at character %i", (text, position, message) => {
    const r = parseCriterion(text, COMPONENTS);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0].place.position).toBe(position);
    expect(r.problems[0].message).toContain(message);
  });

  test("reads a component named like a function as the component, unless a bracket follows", () => {
    const r = parseCriterion("max abs + max(abs, 1)", ["abs"]);
    expect(r.ok).toBe(true);
  });
});

describe("criterionNames", () => {
  test("lists the components a criterion reads, not its functions or its sense", () => {
    expect(criterionNames("max sqrt([C1 top]^2 + [C1 bottom]^2) + abs(V) / max(V, N)")).toEqual(["C1 top", "C1 bottom", "V", "N"]);
    expect(criterionNames("max(M)")).toEqual(["M"]);
  });
});
