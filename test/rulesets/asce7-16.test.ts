/**
 * The shipped ASCE/SEI 7-16 rulesets held against factor tables typed from the
 * standard's combinations as shared/REFERENCES.md gives them. Every row names its
 * clause; [memory] marks what is recalled rather than found in a source.
 */
import { describe, expect, test } from "vitest";
import { planCombinations, resolveParameters, type Ruleset } from "../../src/core/index.js";
import { allRows, expectPrintedRows, mayBeAbsent, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const GRAVITY_WIND_SEISMIC = ["D", "L", "Lr", "S", "R", "W", "E"];
const FLUID_EARTH = ["D", "F", "H", "W", "E"];
const SDS = 0.8; // invented project value for these tests
const RHO = 1.3; // ρ = 1.3, §12.3.4 [memory]

// ASCE/SEI 7-16 §2.3.1 (1)–(5): list confirmed for the 7-10 text, which 7-16 keeps; numbering [memory].
// §2.3.6 (6), (7): forms confirmed by a practitioner document citing 7-16, Ev = 0.2·SDS·D [confirmed],
// Eh = ρ·QE [memory]; numbering [memory].
const STRENGTH: FactorRow[] = [
  row("1", { D: 1.4 }), // §2.3.1 (1) 1.4D
  row("2", { D: 1.2, L: 1.6, Lr: 0.5 }), // §2.3.1 (2) 1.2D + 1.6L + 0.5(Lr or S or R)
  row("2", { D: 1.2, L: 1.6, S: 0.5 }),
  row("2", { D: 1.2, L: 1.6, R: 0.5 }),
  row("3", { D: 1.2, Lr: 1.6, L: 1.0 }), // §2.3.1 (3) 1.2D + 1.6(Lr or S or R) + (L or 0.5W)
  row("3", { D: 1.2, Lr: 1.6, W: 0.5 }),
  row("3", { D: 1.2, S: 1.6, L: 1.0 }),
  row("3", { D: 1.2, S: 1.6, W: 0.5 }),
  row("3", { D: 1.2, R: 1.6, L: 1.0 }),
  row("3", { D: 1.2, R: 1.6, W: 0.5 }),
  row("4", { D: 1.2, W: 1.0, L: 1.0, Lr: 0.5 }), // §2.3.1 (4) 1.2D + 1.0W + L + 0.5(Lr or S or R)
  row("4", { D: 1.2, W: 1.0, L: 1.0, S: 0.5 }),
  row("4", { D: 1.2, W: 1.0, L: 1.0, R: 0.5 }),
  row("5", { D: 0.9, W: 1.0 }), // §2.3.1 (5) 0.9D + 1.0W
  row("6", { D: 1.2 + 0.2 * SDS, E: RHO, L: 1.0, S: 0.2 }), // §2.3.6 (6) 1.2D + Ev + Eh + L + 0.2S
  row("7", { D: 0.9 - 0.2 * SDS, E: RHO }), // §2.3.6 (7) 0.9D − Ev + Eh
];

// ASCE/SEI 7-16 §2.3.6 with the overstrength factor: Emh = Ω0·QE in place of Eh (§12.4.3) [memory].
const OMEGA0 = 2.5; // invented system value for these tests
const OVERSTRENGTH: FactorRow[] = [
  row("6 (Ω0)", { D: 1.2 + 0.2 * SDS, E: OMEGA0, L: 1.0, S: 0.2 }), // §2.3.6 (6) with Emh [memory]
  row("7 (Ω0)", { D: 0.9 - 0.2 * SDS, E: OMEGA0 }), // §2.3.6 (7) with Emh [memory]
];

// ASCE/SEI 7-16 §2.4.1 (1)–(7): list confirmed for the 7-10 text; §2.4.5 (8)–(10) [memory];
// Ev = 0.2·SDS·D [confirmed], so 0.7Ev = 0.14·SDS·D and 0.525Ev = 0.105·SDS·D.
const ASD: FactorRow[] = [
  row("1", { D: 1.0 }), // §2.4.1 (1) D
  row("2", { D: 1.0, L: 1.0 }), // §2.4.1 (2) D + L
  row("3", { D: 1.0, Lr: 1.0 }), // §2.4.1 (3) D + (Lr or S or R)
  row("3", { D: 1.0, S: 1.0 }),
  row("3", { D: 1.0, R: 1.0 }),
  row("4", { D: 1.0, L: 0.75, Lr: 0.75 }), // §2.4.1 (4) D + 0.75L + 0.75(Lr or S or R)
  row("4", { D: 1.0, L: 0.75, S: 0.75 }),
  row("4", { D: 1.0, L: 0.75, R: 0.75 }),
  row("5", { D: 1.0, W: 0.6 }), // §2.4.1 (5) D + 0.6W
  row("6", { D: 1.0, L: 0.75, W: 0.75 * 0.6, Lr: 0.75 }), // §2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)
  row("6", { D: 1.0, L: 0.75, W: 0.75 * 0.6, S: 0.75 }),
  row("6", { D: 1.0, L: 0.75, W: 0.75 * 0.6, R: 0.75 }),
  row("7", { D: 0.6, W: 0.6 }), // §2.4.1 (7) 0.6D + 0.6W
  row("8", { D: 1.0 + 0.14 * SDS, E: 0.7 * RHO }), // §2.4.5 (8) 1.0D + 0.7Ev + 0.7Eh [memory]
  row("9", { D: 1.0 + 0.105 * SDS, E: 0.525 * RHO, L: 0.75, S: 0.75 }), // §2.4.5 (9) 1.0D + 0.525Ev + 0.525Eh + 0.75L + 0.75S [memory]
  row("10", { D: 0.6 - 0.14 * SDS, E: 0.7 * RHO }), // §2.4.5 (10) 0.6D − 0.7Ev + 0.7Eh [memory]
];

const ASD_OVERSTRENGTH: FactorRow[] = [
  row("8 (Ω0)", { D: 1.0 + 0.14 * SDS, E: 0.7 * OMEGA0 }), // §2.4.5 (8) with Emh = Ω0·QE [memory]
  row("9 (Ω0)", { D: 1.0 + 0.105 * SDS, E: 0.525 * OMEGA0, L: 0.75, S: 0.75 }), // §2.4.5 (9) with Emh [memory]
  row("10 (Ω0)", { D: 0.6 - 0.14 * SDS, E: 0.7 * OMEGA0 }), // §2.4.5 (10) with Emh [memory]
];

describe("asce7-16-strength", () => {
  const ruleset = shipped("asce7-16-strength");

  test("expands to the combinations of §2.3.1 and §2.3.6", () => {
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC), STRENGTH);
  });

  test("takes 0.5L in combinations 3, 4 and 6 where the live load allowance applies", () => {
    // ASCE/SEI 7-10 §2.3.2 exception 1 [confirmed in the 7-10 text]: L at 0.5 in the 7-10 combinations
    // 3, 4 and 5, i.e. (L or 0.5W), the wind combination and the seismic one (7-16: 3, 4, 6).
    const rows = printedRows(planWith(ruleset, { SDS, rho: RHO, fL: 0.5 }, GRAVITY_WIND_SEISMIC));
    const onL = (id: string) => [...new Set(rows.filter((r) => r.id === id && r.factors.L !== undefined).map((r) => r.factors.L))];
    expect(onL("2")).toEqual([1.6]); // §2.3.1 (2): 1.6L is not reduced
    expect(onL("3")).toEqual([0.5]);
    expect(onL("4")).toEqual([0.5]);
    expect(onL("6")).toEqual([0.5]);
  });

  test("refuses a live load factor other than 1.0 or 0.5", () => {
    const problems = parameterProblems(ruleset, { SDS, fL: 0.75 });
    expect(problems).toEqual(["parameter fL = 0.75 is not one of the allowed values 0.5, 1"]);
  });

  test("asks for SDS rather than assuming one, where a seismic combination is formed", () => {
    // SDS is site-specific (§11.4.5 [memory]); no default is safe. A gravity-only table forms no
    // seismic combination (E always acts in them), so it needs no SDS.
    expect(planProblems(ruleset, {}, ["D", "L", "E:x"])[0]).toMatch(/^parameter SDS has no default; give its value/);
    expect(planProblems(ruleset, {}, ["D", "L", "S"])).toEqual([]);
  });

  test("gives F the factor of D and H 1.6 or its resisting factor", () => {
    // ASCE/SEI 7-10 §2.3.2 [confirmed in the 7-10 text]: F with the factor of D in the 7-10 combinations
    // 1–5 and 7 — every one but 0.9D + 1.0W (7-16: 5) [mapping to the 7-16 numbering: memory];
    // H at 1.6 where it adds, 0.9 where it resists and is permanent. H not in 1.4D [memory].
    const rows: FactorRow[] = [
      row("1", { D: 1.4, F: 1.4 }),
      row("2", { D: 1.2, F: 1.2, H: 1.6 }),
      row("2", { D: 1.2, F: 1.2, H: 0.9 }),
      row("3", { D: 1.2, F: 1.2, W: 0.5, H: 1.6 }),
      row("3", { D: 1.2, F: 1.2, W: 0.5, H: 0.9 }),
      row("4", { D: 1.2, F: 1.2, W: 1.0, H: 1.6 }),
      row("4", { D: 1.2, F: 1.2, W: 1.0, H: 0.9 }),
      row("5", { D: 0.9, W: 1.0, H: 1.6 }),
      row("5", { D: 0.9, W: 1.0, H: 0.9 }),
      row("6", { D: 1.2 + 0.2 * SDS, F: 1.2, E: RHO, H: 1.6 }),
      row("6", { D: 1.2 + 0.2 * SDS, F: 1.2, E: RHO, H: 0.9 }),
      row("7", { D: 0.9 - 0.2 * SDS, F: 0.9, E: RHO, H: 1.6 }),
      row("7", { D: 0.9 - 0.2 * SDS, F: 0.9, E: RHO, H: 0.9 }),
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, hResist: 0.9 }, FLUID_EARTH), rows);
  });

  test("takes a resisting H at 0 unless it is declared permanent", () => {
    // ASCE/SEI 7-10 §2.3.2 [confirmed in the 7-10 text]: 0 for H that resists and is not permanent.
    const rows = printedRows(planWith(ruleset, { SDS }, ["D", "H"])).filter((r) => r.id === "2");
    expect(rows.map((r) => r.factors.H ?? 0).sort()).toEqual([0, 1.6]);
  });

  test("lists which terms may be absent in each combination", () => {
    // Effects of one or more loads not acting must be investigated (ASCE/SEI 7-10 §2.3.2 [confirmed]);
    // the defining W and E always act, and D, F, H are permanent.
    expect(mayBeAbsent(planWith(ruleset, { SDS }, GRAVITY_WIND_SEISMIC))).toEqual({
      "1": [],
      "2": ["1.6L", "0.5(Lr or S or R)"],
      "3": ["1.6(Lr or S or R)", "(fL*L or 0.5W)"],
      "4": ["fL*L", "0.5(Lr or S or R)"],
      "5": [],
      "6": ["fL*L", "0.2S"],
      "7": [],
    });
  });
});

describe("asce7-16-strength-overstrength", () => {
  test("holds every combination of the basic ruleset and the two with Ω0·QE", () => {
    const plan = planWith(shipped("asce7-16-strength-overstrength"), { SDS, rho: RHO, Omega0: OMEGA0 }, GRAVITY_WIND_SEISMIC);
    expectPrintedRows(plan, [...STRENGTH, ...OVERSTRENGTH]);
  });

  test("asks for Ω0 rather than assuming one", () => {
    // Ω0 depends on the seismic force-resisting system (Table 12.2-1 [memory]).
    expect(planProblems(shipped("asce7-16-strength-overstrength"), { SDS }, ["D", "E:x"])[0]).toMatch(/^parameter Omega0 has no default/);
  });

  test("is a separate ruleset, so that ordinary members never take Ω0", () => {
    expect(shipped("asce7-16-strength").parameterByName.has("Omega0")).toBe(false);
  });
});

describe("asce7-16-asd", () => {
  const ruleset = shipped("asce7-16-asd");

  test("expands to the combinations of §2.4.1 and §2.4.5", () => {
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC), ASD);
  });

  test("gives F the factor of D and H 1.0 or its resisting factor", () => {
    // ASCE/SEI 7-10 §2.4.1 [memory]: F with the factor of D in every combination but 0.6D + 0.6W;
    // H at 1.0 where it adds, 0.6 where it resists and is permanent, not in combination 1.
    const rows: FactorRow[] = [
      row("1", { D: 1.0, F: 1.0 }),
      ...[1.0, 0.6].flatMap((h) => [
        row("2", { D: 1.0, F: 1.0, H: h }),
        row("3", { D: 1.0, F: 1.0, H: h }),
        row("4", { D: 1.0, F: 1.0, H: h }),
        row("5", { D: 1.0, F: 1.0, W: 0.6, H: h }),
        row("6", { D: 1.0, F: 1.0, W: 0.45, H: h }),
        row("7", { D: 0.6, W: 0.6, H: h }),
        row("8", { D: 1.0 + 0.14 * SDS, F: 1.0, E: 0.7 * RHO, H: h }),
        row("9", { D: 1.0 + 0.105 * SDS, F: 1.0, E: 0.525 * RHO, H: h }),
        row("10", { D: 0.6 - 0.14 * SDS, F: 0.6, E: 0.7 * RHO, H: h }),
      ]),
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, hResist: 0.6 }, FLUID_EARTH), rows);
  });
});

describe("asce7-16-asd-overstrength", () => {
  test("holds every combination of the basic ruleset and the three with Ω0·QE", () => {
    const plan = planWith(shipped("asce7-16-asd-overstrength"), { SDS, rho: RHO, Omega0: OMEGA0 }, GRAVITY_WIND_SEISMIC);
    expectPrintedRows(plan, [...ASD, ...ASD_OVERSTRENGTH]);
  });
});

describe("the vertical seismic effect", () => {
  const rulesets: [string, Record<string, number>][] = [
    ["asce7-16-strength", { SDS: 1.0 }],
    ["asce7-16-strength-overstrength", { SDS: 1.0, Omega0: 2 }],
    ["asce7-16-asd", { SDS: 1.0 }],
    ["asce7-16-asd-overstrength", { SDS: 1.0, Omega0: 2 }],
  ];

  test.each(rulesets)("%s never puts Ev on D in a row without E", (id, parameters) => {
    // Issue 3, after ASCE/SEI 7-16 §12.4.2 [memory]: Ev belongs to the seismic load effect E, so no
    // seismic combination may degenerate into a gravity row such as (1.2 + 0.2·SDS)D alone.
    const ruleset = shipped(id);
    const seismic = ruleset.combinations.filter((c) => c.expression.includes("SDS")).map((c) => c.id);
    expect(seismic.length).toBeGreaterThanOrEqual(2);
    const withoutE = planWith(ruleset, parameters, ["D", "L", "S"]);
    for (const c of withoutE.combinations.filter((c) => seismic.includes(c.combination.id))) {
      expect(c.skipped).toBe("E not in the case table");
      expect(c.rowCount).toBe(0);
    }
    const withE = planWith(ruleset, parameters, ["D", "L", "S", "E"]);
    const rows = allRows(withE).filter((r) => seismic.includes(r.id));
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) expect(r.factors.E ?? 0).not.toBe(0);
  });
});

/** The messages of the problems that resolving these parameters gives. */
function parameterProblems(ruleset: Ruleset, parameters: Record<string, number>): string[] {
  const resolved = resolveParameters(ruleset, parameters);
  return resolved.ok ? [] : resolved.problems.map((p) => p.message);
}

/** Problems of resolving the parameters and forming the rows for these case headers. */
function planProblems(ruleset: Ruleset, parameters: Record<string, number>, headers: string[]): string[] {
  const resolved = resolveParameters(ruleset, parameters);
  if (!resolved.ok) return resolved.problems.map((p) => p.message);
  const plan = planCombinations(ruleset, resolved.value, { cases: headers.map((h) => ({ header: h, symbol: h.split(":")[0] })) });
  return plan.ok ? [] : plan.problems.map((p) => p.message);
}
