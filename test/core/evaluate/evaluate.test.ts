/**
 * Envelope, governing rows, factored matrix and explanations on small tables
 * whose every row is worked out by hand below.
 */
import { describe, expect, test } from "vitest";
import {
  defaultCriteria,
  describeProblem,
  envelope,
  explain,
  factored,
  findRow,
  governing,
  parseCriterion,
  planForTable,
  readCaseTable,
  rowLabel,
  rulesetFromRows,
  type Cell,
  type Criterion,
  type Result,
} from "../../../src/core/index.js";

function setup(rows: Cell[][], matrix: Cell[][], params = {}) {
  const ruleset = rulesetFromRows(rows);
  if (!ruleset.ok) throw new Error(JSON.stringify(ruleset.problems));
  const table = readCaseTable(matrix, ruleset.value);
  if (!table.ok) throw new Error(JSON.stringify(table.problems));
  const plan = planForTable(ruleset.value, params, table.value);
  if (!plan.ok) throw new Error(JSON.stringify(plan.problems));
  return { plan: plan.value, table: table.value };
}

function value<T>(r: Result<T>): T {
  if (!r.ok) throw new Error(r.problems.map((p) => describeProblem(p)).join("; "));
  return r.value;
}

function messages<T>(r: Result<T>): string[] {
  return r.ok ? [] : r.problems.map((p) => describeProblem(p));
}

// ASCE/SEI 7-16 §2.3.1 (1), (2), (5) [list confirmed for the 7-10 text]; column loads PD = 140,
// PL = 420 kips from AISC Design Examples (companion to the AISC Steel Construction Manual, American Institute of Steel Construction), Example E.1A; the
// shears and wind values are invented for this test. Every row by hand:
//   1: 1.4D           P = 196           V = 2.8
//   2: 1.2D + 1.6L    P = 168 + 672 = 840   V = 2.4 + 8 = 10.4
//   2: 1.2D [L absent]  P = 168        V = 2.4
//   5: 0.9D + W:N     P = 126 − 50 = 76     V = 1.8 + 10 = 11.8
//   5: 0.9D − W:N     P = 126 + 50 = 176    V = 1.8 − 10 = −8.2
//   5: 0.9D + W:E     P = 146           V = −6.2
//   5: 0.9D − W:E     P = 106           V = 9.8
const COLUMN = setup(
  [
    ["1", "1.4D", "§2.3.1 (1)"],
    ["2", "1.2D + 1.6L", "§2.3.1 (2)"],
    ["5", "0.9D + 1.0W!", "§2.3.1 (5)"],
  ],
  [
    ["", "P", "V"],
    ["D", 140, 2],
    ["L", 420, 5],
    ["W:N", -50, 10],
    ["W:E", 20, -8],
  ],
);

function criteria(...texts: string[]): Criterion[] {
  return texts.map((t) => value(parseCriterion(t, COLUMN.table.components)));
}

describe("envelope", () => {
  test("gives each component's max and min with the row that gives it", () => {
    const result = value(envelope(COLUMN.plan, COLUMN.table));
    expect(result.map((e) => [e.result, e.max.value, e.max.label, e.min.value, e.min.label])).toEqual([
      ["P", 840, "2: 1.2D + 1.6L", 76, "5: 0.9D + W:N"],
      ["V", expect.closeTo(11.8, 12), "5: 0.9D + W:N", expect.closeTo(-8.2, 12), "5: 0.9D - W:N"],
    ]);
  });

  test("does not change the case table it reads", () => {
    const before = COLUMN.table.values.map((v) => [...v]);
    envelope(COLUMN.plan, COLUMN.table);
    expect(COLUMN.table.values.map((v) => [...v])).toEqual(before);
  });
});

describe("governing", () => {
  test("without criteria gives the max and min of every component, a row that governs twice listed once", () => {
    const rows = value(governing(COLUMN.plan, COLUMN.table, defaultCriteria(COLUMN.table)));
    expect(rows.map((r) => [r.criteria, r.label, r.values.map((v) => Number(v.toFixed(9)))])).toEqual([
      [["max P"], "2: 1.2D + 1.6L", [840, 10.4]],
      [["min P", "max V"], "5: 0.9D + W:N", [76, 11.8]],
      [["min V"], "5: 0.9D - W:N", [176, -8.2]],
    ]);
  });

  test("finds the largest of a linear expression, an absolute value and a product", () => {
    // P/1000 + V/20: 1.36 (row 2), 0.336, 0.24, 0.666, −0.234, 0.146 − 0.31, 0.106 + 0.49 → max 1.36.
    // |V|: 11.8. P·V: 8736 (row 2) beats 548.8, 403.2, 896.8, 1038.8.
    const rows = value(governing(COLUMN.plan, COLUMN.table, criteria("max P/1000 + V/20", "max |V|", "max P*V")));
    expect(rows.map((r) => [r.criteria, r.criterionValues.map((v) => Number(v.toFixed(9))), r.label])).toEqual([
      [["max P/1000 + V/20", "max P*V"], [1.36, 8736], "2: 1.2D + 1.6L"],
      [["max |V|"], [11.8], "5: 0.9D + W:N"],
    ]);
  });

  test("refuses a non-linear criterion when the rows are more than the limit", () => {
    expect(messages(governing(COLUMN.plan, COLUMN.table, criteria("max P*V"), { rowLimit: 3 }))[0]).toMatch(
      /^criterion "max P\*V" is not linear in the components, so every row must be evaluated: the ruleset expands to 7 concrete rows/,
    );
  });
});

describe("parseCriterion", () => {
  test.each([
    ["maximum V", 1, 'a criterion starts with max or min, e.g. "max V" or "min N"; found "maximum"'],
    ["max Q", 5, '"Q" is not a component of the case table (components: P, V; write names with spaces in [brackets])'],
    ["max p", 5, '"p" is not a component of the case table; did you mean "P"?'],
    ["max P V", 7, 'unexpected "V" after the criterion\'s expression'],
    ["max (P + V", 11, 'expected ")"'],
    ["max P # 2", 7, 'unexpected character "#"'],
  ])("names the character of a fault in %s", (text, position, message) => {
    const r = parseCriterion(text, ["P", "V"]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems[0].place.position).toBe(position);
    expect(r.problems[0].message).toContain(message);
  });

  test("reads component names with spaces in brackets", () => {
    const r = parseCriterion("max [M top] - 2*[M bot]", ["M top", "M bot"]);
    expect(r.ok && r.value.linear && Object.fromEntries(r.value.linear.weights)).toEqual({ 0: 1, 1: -2 });
  });
});

describe("factored", () => {
  test("lists every row with every component", () => {
    const rows = value(factored(COLUMN.plan, COLUMN.table));
    expect(rows.map((r) => [r.label, ...r.values.map((v) => Number(v.toFixed(9)))])).toEqual([
      ["1: 1.4D", 196, 2.8],
      ["2: 1.2D + 1.6L", 840, 10.4],
      ["2: 1.2D [absent: 1.6L]", 168, 2.4],
      ["5: 0.9D + W:N", 76, 11.8],
      ["5: 0.9D - W:N", 176, -8.2],
      ["5: 0.9D + W:E", 146, -6.2],
      ["5: 0.9D - W:E", 106, 9.8],
    ]);
  });
});

describe("explain", () => {
  test("writes one value out as factors times case values, summed", () => {
    const e = value(explain(COLUMN.plan, COLUMN.table, "2: 1.2D + 1.6L", "P"));
    expect(e.total).toBe(840);
    expect(e.text).toEqual([
      "2: 1.2D + 1.6L",
      "combination 2 (§2.3.1 (2)): 1.2D + 1.6L",
      "P = 1.2 × 140 [D] + 1.6 × 420 [L]",
      "  = 168 + 672",
      "  = 840",
      "factor 1.2 on D = 1.2",
      "factor 1.6 on L = 1.6",
    ]);
  });

  test("shows where a seismic factor comes from, with the parameters in force", () => {
    // The §2.3.6 forms (1.2 + 0.2SDS)D and (0.9 − 0.2SDS)D with ρQE, as a City of Santa Ana basis-of-design
    // report applies them (https://publicdocs.santa-ana.org/BuildingWeblink/0/doc/549199/Page352.aspx, Table 2.3-4);
    // by hand with ρ = 1.3, SDS = 1.10: (1.2 + 0.2·1.10) = 1.42 on D in (6); (0.9 − 0.2·1.10) = 0.68 on D in (7).
    // D = 100 and E = 10 are invented: 1.42·100 + 1.3·10 = 155; 0.68·100 − 1.3·10 = 55.
    const seismic = setup(
      [
        ["6", "(1.2 + 0.2*SDS)D + rho*E! + L + 0.2S", "§2.3.6 (6)"],
        ["7", "(0.9 - 0.2*SDS)D + rho*E!", "§2.3.6 (7)"],
      ],
      [
        ["", "P"],
        ["D", 100],
        ["E", 10],
      ],
      { SDS: 1.1, rho: 1.3 },
    );
    const env = value(envelope(seismic.plan, seismic.table))[0];
    expect([env.max.value, env.max.label]).toEqual([expect.closeTo(155, 9), "6: 1.42D + 1.3E"]);
    expect([env.min.value, env.min.label]).toEqual([expect.closeTo(55, 9), "7: 0.68D - 1.3E"]);
    const e = value(explain(seismic.plan, seismic.table, env.max.label, "P"));
    expect(e.text.slice(2)).toEqual([
      "P = 1.42 × 100 [D] + 1.3 × 10 [E]",
      "  = 142 + 13",
      "  = 155",
      "factor 1.42 on D = 1.2 + 0.2 × SDS",
      "factor 1.3 on E = rho",
      "parameters: SDS = 1.1 (given), rho = 1.3 (given)",
    ]);
  });

  test("writes negative products as a checker does: subtracted, a negative case value in brackets", () => {
    // Row 5: 0.9D - W:N on V: 0.9 × 2 - 1 × 10 = 1.8 - 10 = -8.2 (by hand, table above).
    const e = value(explain(COLUMN.plan, COLUMN.table, "5: 0.9D - W:N", "V"));
    expect(e.text.slice(2, 5)).toEqual(["V = 0.9 × 2 [D] - 1 × 10 [W:N]", "  = 1.8 - 10", "  = -8.2"]);
    const p = value(explain(COLUMN.plan, COLUMN.table, "5: 0.9D + W:N", "P"));
    expect(p.text[2]).toBe("P = 0.9 × 140 [D] + 1 × (-50) [W:N]");
  });

  test("finds a row by its label with typographic signs, or by its number", () => {
    const byLabel = value(findRow(COLUMN.plan, "5: 0.9D \u2212 W:N"));
    expect(rowLabel(COLUMN.plan, byLabel)).toBe("5: 0.9D - W:N");
    expect(rowLabel(COLUMN.plan, value(findRow(COLUMN.plan, 4)))).toBe("5: 0.9D + W:N");
  });

  test("names what it cannot find", () => {
    expect(messages(explain(COLUMN.plan, COLUMN.table, "2: 1.3D", "P"))).toEqual([
      'no row is labelled "2: 1.3D"; a label starts with the combination id (1, 2, 5) and is written as the factored and listed outputs show it',
    ]);
    expect(messages(explain(COLUMN.plan, COLUMN.table, 9, "P"))).toEqual(["row number 9 is outside 1 … 7"]);
    expect(messages(explain(COLUMN.plan, COLUMN.table, 1, "p"))).toEqual(['"p" is not a component of the case table; did you mean "P"? (components: P, V)']);
  });
});
