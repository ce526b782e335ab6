/**
 * The shipped ASCE/SEI 7-16 rulesets held against factor tables typed from the
 * public texts named below. Beside every row: the source that confirms its
 * factors, and [memory] for what no public text confirms — above all that 7-16
 * prints the 7-10 lists unchanged, and its numbering (no public text printing
 * the 7-16 §2.3.1, §2.4.1 and §2.4.5 lists was found).
 *
 * [7-10]  ASCE/SEI 7-10 §2.3.2 and §2.4.1, the standard's text shared at
 *         https://www.scribd.com/document/611469328; its chapter 2 rules (exceptions, F, H,
 *         loads not acting) at https://tr.scribd.com/document/357847377.
 * [SA]    3rd & Broadway, Santa Ana, CA, Basis of Design (2024), Table 2.3-4, citing ASCE 7-16
 *         §2.3.6; City of Santa Ana public building records,
 *         https://publicdocs.santa-ana.org/BuildingWeblink/0/doc/549199/Page352.aspx.
 * [EV]    Structural calculation, ASD basic load combinations per ASCE 7-10 §2.4.1 with Ev written
 *         out; City of Everett, WA public permit records,
 *         https://lfportal.everettwa.gov/WebLink/0/doc/1077293/Page17.aspx.
 */
import { describe, expect, test } from "vitest";
import { planCombinations, resolveParameters, type Ruleset } from "../../src/core/index.js";
import { allRows, expectPrintedRows, mayBeAbsent, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const GRAVITY_WIND_SEISMIC = ["D", "L", "Lr", "S", "R", "W", "E"];
const FLUID_EARTH = ["D", "F", "H", "W", "E"];
const SDS = 0.8; // invented project value for these tests
const RHO = 1.3; // ρ = 1.3, §12.3.4 [memory]; [SA] shows ρ multiplying the horizontal effect

// §2.3.1 (1)–(5): factors [7-10] combinations 1–4 and 6; that 7-16 keeps them as (1)–(5) [memory].
// §2.3.6 (6), (7): (1.2 + 0.2SDS)D, (0.9 − 0.2SDS)D and ρ on E [SA]; L and 0.2S in (6) as [7-10]
// combination 5 has them (1.2D + 1.0E + L + 0.2S) [memory for 7-16: SA shows 0.5L and no snow].
const STRENGTH: FactorRow[] = [
  row("1", { D: 1.4 }), // 1.4D [7-10] 1
  row("2", { D: 1.2, L: 1.6, Lr: 0.5 }), // 1.2D + 1.6L + 0.5(Lr or S or R) [7-10] 2
  row("2", { D: 1.2, L: 1.6, S: 0.5 }),
  row("2", { D: 1.2, L: 1.6, R: 0.5 }),
  row("3", { D: 1.2, Lr: 1.6, L: 1.0 }), // 1.2D + 1.6(Lr or S or R) + (L or 0.5W) [7-10] 3
  row("3", { D: 1.2, Lr: 1.6, W: 0.5 }),
  row("3", { D: 1.2, S: 1.6, L: 1.0 }),
  row("3", { D: 1.2, S: 1.6, W: 0.5 }),
  row("3", { D: 1.2, R: 1.6, L: 1.0 }),
  row("3", { D: 1.2, R: 1.6, W: 0.5 }),
  row("4", { D: 1.2, W: 1.0, L: 1.0, Lr: 0.5 }), // 1.2D + 1.0W + L + 0.5(Lr or S or R) [7-10] 4
  row("4", { D: 1.2, W: 1.0, L: 1.0, S: 0.5 }),
  row("4", { D: 1.2, W: 1.0, L: 1.0, R: 0.5 }),
  row("5", { D: 0.9, W: 1.0 }), // 0.9D + 1.0W [7-10] 6
  row("6", { D: 1.2 + 0.2 * SDS, E: RHO, L: 1.0, S: 0.2 }), // (1.2 + 0.2SDS)D + ρQE [SA] LC6; + L + 0.2S [7-10] 5
  row("7", { D: 0.9 - 0.2 * SDS, E: RHO }), // (0.9 − 0.2SDS)D + ρQE [SA] LC7
];

// With the overstrength factor: Emh = Ω0·QE in place of ρ·QE (§12.4.3) [memory].
const OMEGA0 = 2.5; // invented system value for these tests
const OVERSTRENGTH: FactorRow[] = [
  row("6 (Ω0)", { D: 1.2 + 0.2 * SDS, E: OMEGA0, L: 1.0, S: 0.2 }), // (6) with Emh [memory]; D factor [SA]
  row("7 (Ω0)", { D: 0.9 - 0.2 * SDS, E: OMEGA0 }), // (7) with Emh [memory]; D factor [SA]
];

// §2.4.1 (1)–(7): factors [7-10] §2.4.1 1–5, 6a and 7; §2.4.5 (8)–(10): [7-10] 5, 6b and 8 with
// Ev = 0.2·SDS·D written out on D [EV]: 0.7Ev = 0.14·SDS·D, 0.525Ev = 0.105·SDS·D. That 7-16 keeps
// them and numbers them (1)–(10) [memory].
const ASD: FactorRow[] = [
  row("1", { D: 1.0 }), // D [7-10] 1
  row("2", { D: 1.0, L: 1.0 }), // D + L [7-10] 2
  row("3", { D: 1.0, Lr: 1.0 }), // D + (Lr or S or R) [7-10] 3
  row("3", { D: 1.0, S: 1.0 }),
  row("3", { D: 1.0, R: 1.0 }),
  row("4", { D: 1.0, L: 0.75, Lr: 0.75 }), // D + 0.75L + 0.75(Lr or S or R) [7-10] 4
  row("4", { D: 1.0, L: 0.75, S: 0.75 }),
  row("4", { D: 1.0, L: 0.75, R: 0.75 }),
  row("5", { D: 1.0, W: 0.6 }), // D + 0.6W [7-10] 5
  row("6", { D: 1.0, L: 0.75, W: 0.75 * 0.6, Lr: 0.75 }), // D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R) [7-10] 6a
  row("6", { D: 1.0, L: 0.75, W: 0.75 * 0.6, S: 0.75 }),
  row("6", { D: 1.0, L: 0.75, W: 0.75 * 0.6, R: 0.75 }),
  row("7", { D: 0.6, W: 0.6 }), // 0.6D + 0.6W [7-10] 7
  row("8", { D: 1.0 + 0.14 * SDS, E: 0.7 * RHO }), // (1 + 0.14SDS)D + 0.7E [EV]; [7-10] 5
  row("9", { D: 1.0 + 0.105 * SDS, E: 0.525 * RHO, L: 0.75, S: 0.75 }), // (1.0 + 0.105SDS)D + 0.75(0.7E) + 0.75L + 0.75S [EV]; [7-10] 6b
  row("10", { D: 0.6 - 0.14 * SDS, E: 0.7 * RHO }), // (0.6 − 0.14SDS)D + 0.7E [EV]; [7-10] 8
];

const ASD_OVERSTRENGTH: FactorRow[] = [
  row("8 (Ω0)", { D: 1.0 + 0.14 * SDS, E: 0.7 * OMEGA0 }), // (8) with Emh = Ω0·QE [memory]; [EV] applies Ω0 in the same place
  row("9 (Ω0)", { D: 1.0 + 0.105 * SDS, E: 0.525 * OMEGA0, L: 0.75, S: 0.75 }), // (9) with Emh [memory]; [EV]
  row("10 (Ω0)", { D: 0.6 - 0.14 * SDS, E: 0.7 * OMEGA0 }), // (10) with Emh [memory]; [EV]
];

describe("asce7-16-strength", () => {
  const ruleset = shipped("asce7-16-strength");

  test("expands to the combinations of §2.3.1 and §2.3.6", () => {
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC), STRENGTH);
  });

  test("takes 0.5L in combinations 3, 4 and 6 where the live load allowance applies", () => {
    // [7-10] §2.3.2 exception 1: L at 0.5 in its combinations 3, 4 and 5, i.e. (L or 0.5W), the wind
    // combination and the seismic one; 7-16 (3), (4), (6) [memory]. [SA] applies 0.5L in LC6.
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
    // SDS is site-specific ([SA]: "Sds = 1.177 (see geotechnical report)"); no default is safe. A gravity-only table forms no
    // seismic combination (E always acts in them), so it needs no SDS.
    expect(planProblems(ruleset, {}, ["D", "L", "E:x"])[0]).toMatch(/^parameter SDS has no default; give its value/);
    expect(planProblems(ruleset, {}, ["D", "L", "S"])).toEqual([]);
  });

  test("gives F the factor of D and H 1.6 or its resisting factor", () => {
    // [7-10] §2.3.2: F with the factor of D in its combinations 1–5 and 7 — every one but 0.9D + 1.0W
    // (7-16: 5) [memory for 7-16]; H at 1.6 where it adds ([SA] LC7: 1.6H), 0.9 where it resists and
    // is permanent. H not in 1.4D [memory].
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
    // [7-10] §2.3.2: 0 for H that resists and is not permanent; 7-16 [memory].
    const rows = printedRows(planWith(ruleset, { SDS }, ["D", "H"])).filter((r) => r.id === "2");
    expect(rows.map((r) => r.factors.H ?? 0).sort()).toEqual([0, 1.6]);
  });

  test("lists which terms may be absent in each combination", () => {
    // Effects of one or more loads not acting must be investigated ([7-10] §2.3.2; 7-16 [memory]);
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
    // Ω0 depends on the seismic force-resisting system (Table 12.2-1 [memory]; [EV] uses 2.5 for its system).
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
    // ASCE/SEI 7-16 §2.4.1 [memory]: F with the factor of D in every combination but 0.6D + 0.6W;
    // H at 1.0 where it adds, 0.6 where it resists and is permanent, not in combination 1. (The IBC
    // prints the same for its own list: D + F, D + H + F + …, 0.6D + 0.6W + H, Exception 3; see ibc2018.test.ts.)
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
    // Ev belongs to the seismic load effect E (E = Eh ± Ev, ASCE/SEI 7-16 §12.4.2 [memory]; [SA] writes
    // it into the seismic combinations only), so no seismic combination may become a gravity row such
    // as (1.2 + 0.2·SDS)D alone.
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
