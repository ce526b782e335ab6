/**
 * The shipped IBC 2018 rulesets held against the equations as adopted codes
 * print them. No text of the 2018 edition printing the equations was found: the
 * factors below are those of the IBC 2012- and 2015-based texts, and that the
 * 2018 edition prints the same is [memory] (the rulesets are UNVERIFIED for it).
 *
 * [NYC]  New York City Building Code (2022 edition, based on IBC 2015) §BC 1605.2,
 *        https://nacmiaslaw.com/resources/legal-codes/21362, and §BC 1605.3.1 (numbered there
 *        16-12 to 16-20), https://nacmiaslaw.com/resources/legal-codes/21365.
 * [FBC]  Florida Building Code, Building, 5th edition (2014, based on IBC 2012) §1605.3.1,
 *        Equations 16-8 to 16-16 and Exceptions 1–5, https://up.codes/s/basic-load-combinations.
 * [UP]   §1605.2 in a text referring to ASCE/SEI 7-16 (2018 era): Equation numbers 16-1 to 16-7,
 *        f1, f2, Exceptions 1–2, https://up.codes/s/load-combinations-using-strength-design-or-load-and-resistance-factor-design.
 * [IL]   Building Code 2018 of Illinois §1605.3.2: Equations 16-17 to 16-22,
 *        https://up.codes/s/alternative-basic-load-combinations — which leaves 16-8 to 16-16 to §1605.3.1.
 * [SA]   Santa Ana Basis of Design (2024) Table 2.3-4, ASCE 7-16 §2.3.6 with Ev = 0.2·SDS·D and ρ,
 *        https://publicdocs.santa-ana.org/BuildingWeblink/0/doc/549199/Page352.aspx.
 * [SKGA] S. K. Ghosh Associates, "Some Comments on E in the 2012 IBC Load Combinations" (2014):
 *        E = Eh + Ev in Equation 16-5, Eh − Ev in 16-7, https://skghoshassociates.com/blog/some-comments-on-e-in-the-2012-ibc-load-combinations.
 * [EV]   City of Everett, WA permit calculation, ASD combinations with Ev written out on D
 *        ((1 + 0.14SDS)D, (1.0 + 0.105SDS)D, (0.6 − 0.14SDS)D), https://lfportal.everettwa.gov/WebLink/0/doc/1077293/Page17.aspx.
 */
import { describe, expect, test } from "vitest";
import { expectPrintedRows, mayBeAbsent, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const SDS = 0.8; // invented project value for these tests
const RHO = 1.3; // ρ = 1.3, ASCE/SEI 7-16 §12.3.4 [memory]
const GRAVITY_WIND_SEISMIC = ["D", "L", "Lr", "S", "R", "W", "E"];
const FLUID_EARTH = ["D", "F", "H", "W", "E"];

describe("ibc2018-strength", () => {
  const ruleset = shipped("ibc2018-strength");

  test("expands to Equations 16-1 to 16-7 with f1 = 0.5 and f2 = 0.2", () => {
    // Terms and factors [NYC] §BC 1605.2; numbers 16-1 to 16-7 [UP]; 2018 = 2015 text [memory].
    // E = ρ·QE ± 0.2·SDS·D: [SKGA] for 16-5/16-7, [SA] for the ASCE/SEI 7-16 forms.
    const rows: FactorRow[] = [
      row("16-1", { D: 1.4 }), // 1.4(D + F) [NYC]
      row("16-2", { D: 1.2, L: 1.6, Lr: 0.5 }), // 1.2(D + F) + 1.6(L + H) + 0.5(Lr or S or R) [NYC]
      row("16-2", { D: 1.2, L: 1.6, S: 0.5 }),
      row("16-2", { D: 1.2, L: 1.6, R: 0.5 }),
      row("16-3", { D: 1.2, Lr: 1.6, L: 0.5 }), // 1.2(D + F) + 1.6(Lr or S or R) + 1.6H + (f1L or 0.5W) [NYC]
      row("16-3", { D: 1.2, Lr: 1.6, W: 0.5 }),
      row("16-3", { D: 1.2, S: 1.6, L: 0.5 }),
      row("16-3", { D: 1.2, S: 1.6, W: 0.5 }),
      row("16-3", { D: 1.2, R: 1.6, L: 0.5 }),
      row("16-3", { D: 1.2, R: 1.6, W: 0.5 }),
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, Lr: 0.5 }), // 1.2(D + F) + 1.0W + f1L + 1.6H + 0.5(Lr or S or R) [NYC]
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, S: 0.5 }),
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, R: 0.5 }),
      row("16-5", { D: 1.2 + 0.2 * SDS, E: RHO, L: 0.5, S: 0.2 }), // 1.2(D + F) + 1.0E + f1L + 1.6H + f2S [NYC], E = Eh + Ev [SKGA]
      row("16-6", { D: 0.9, W: 1.0 }), // 0.9D + 1.0W + 1.6H [NYC]
      row("16-7", { D: 0.9 - 0.2 * SDS, E: RHO }), // 0.9(D + F) + 1.0E + 1.6H [NYC], E = Eh − Ev [SKGA]
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, f1: 0.5, f2: 0.2 }, GRAVITY_WIND_SEISMIC), rows);
  });

  test("gives F the factor of D except in 16-6, and H 1.6 or its resisting factor except in 16-1", () => {
    // [NYC]: 1.4(D + F), 1.2(D + F), 0.9D + 1.0W + 1.6H, 0.9(D + F) + 1.0E + 1.6H; Exception 2:
    // H resisting the primary variable load, 0.9 where permanent, 0 otherwise.
    const rows: FactorRow[] = [
      row("16-1", { D: 1.4, F: 1.4 }),
      ...[1.6, 0.9].flatMap((h) => [
        row("16-2", { D: 1.2, F: 1.2, H: h }),
        row("16-3", { D: 1.2, F: 1.2, W: 0.5, H: h }),
        row("16-4", { D: 1.2, F: 1.2, W: 1.0, H: h }),
        row("16-5", { D: 1.2 + 0.2 * SDS, F: 1.2, E: RHO, H: h }),
        row("16-6", { D: 0.9, W: 1.0, H: h }),
        row("16-7", { D: 0.9 - 0.2 * SDS, F: 0.9, E: RHO, H: h }),
      ]),
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, hResist: 0.9 }, FLUID_EARTH), rows);
  });

  test.each([
    // [NYC], [UP]: f1 = 1 for places of public assembly with live loads over 100 psf and for parking
    // garages, 0.5 for other live loads; f2 = 0.7 for roofs that do not shed snow, 0.2 for others.
    [1.0, 0.7],
    [0.5, 0.7],
    [1.0, 0.2],
  ])("takes f1 = %s on L and f2 = %s on S in Equation 16-5", (f1, f2) => {
    const rows = printedRows(planWith(ruleset, { SDS, f1, f2 }, ["D", "L", "S", "E"])).filter((r) => r.id === "16-5");
    expect(rows.map((r) => [r.factors.L, r.factors.S])).toEqual([[f1, f2]]);
  });

  test("defaults f1 and f2 to the larger values, which never understate L or S", () => {
    const rows = printedRows(planWith(ruleset, { SDS }, ["D", "L", "S", "E"])).filter((r) => r.id === "16-5");
    expect(rows.map((r) => [r.factors.L, r.factors.S])).toEqual([[1.0, 0.7]]);
  });
});

describe("ibc2018-asd", () => {
  const ruleset = shipped("ibc2018-asd");

  test("expands to Equations 16-8 to 16-16, Equation 16-12 once with W and once with E", () => {
    // Terms and factors [FBC] Equations 16-8 to 16-16 (and [NYC] 16-12 to 16-20 but for the sixth);
    // numbers [FBC], and 16-8 to 16-16 in 2018 by [IL] and [UP]; 2018 = 2012/2015 text [memory].
    // 0.7E with E = ρ·QE ± 0.2·SDS·D: 0.14·SDS·D and 0.105·SDS·D on D [EV].
    const rows: FactorRow[] = [
      row("16-8", { D: 1.0 }), // D + F [FBC]
      row("16-9", { D: 1.0, L: 1.0 }), // D + H + F + L [FBC]
      row("16-10", { D: 1.0, Lr: 1.0 }), // D + H + F + (Lr or S or R) [FBC]
      row("16-10", { D: 1.0, S: 1.0 }),
      row("16-10", { D: 1.0, R: 1.0 }),
      row("16-11", { D: 1.0, L: 0.75, Lr: 0.75 }), // D + H + F + 0.75(L) + 0.75(Lr or S or R) [FBC]
      row("16-11", { D: 1.0, L: 0.75, S: 0.75 }),
      row("16-11", { D: 1.0, L: 0.75, R: 0.75 }),
      row("16-12 (W)", { D: 1.0, W: 0.6 }), // D + H + F + (0.6W or 0.7E) [FBC], with W
      row("16-12 (E)", { D: 1.0 + 0.14 * SDS, E: 0.7 * RHO }), // the same with 0.7E [FBC]; (1 + 0.14SDS)D [EV]
      row("16-13", { D: 1.0, W: 0.75 * 0.6, L: 0.75, Lr: 0.75 }), // D + H + F + 0.75(0.6W) + 0.75L + 0.75(Lr or S or R) [FBC]
      row("16-13", { D: 1.0, W: 0.75 * 0.6, L: 0.75, S: 0.75 }),
      row("16-13", { D: 1.0, W: 0.75 * 0.6, L: 0.75, R: 0.75 }),
      row("16-14", { D: 1.0 + 0.105 * SDS, E: 0.75 * 0.7 * RHO, L: 0.75, S: 0.75 }), // D + H + F + 0.75(0.7E) + 0.75L + 0.75S [FBC]; (1.0 + 0.105SDS)D [EV]
      row("16-15", { D: 0.6, W: 0.6 }), // 0.6D + 0.6W + H [FBC]
      row("16-16", { D: 0.6 - 0.14 * SDS, E: 0.7 * RHO }), // 0.6(D + F) + 0.7E + H [FBC]; (0.6 − 0.14SDS)D [EV]
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC), rows);
  });

  test("gives F the factor of D except in 16-15, and H 1.0 or its resisting factor except in 16-8", () => {
    // [FBC]: D + F, D + H + F + …, 0.6D + 0.6W + H, 0.6(D + F) + 0.7E + H; Exception 3: H resisting
    // the primary variable load, 0.6 where permanent, 0 otherwise.
    const rows: FactorRow[] = [
      row("16-8", { D: 1.0, F: 1.0 }),
      ...[1.0, 0.6].flatMap((h) => [
        row("16-9", { D: 1.0, F: 1.0, H: h }),
        row("16-10", { D: 1.0, F: 1.0, H: h }),
        row("16-11", { D: 1.0, F: 1.0, H: h }),
        row("16-12 (W)", { D: 1.0, F: 1.0, W: 0.6, H: h }),
        row("16-12 (E)", { D: 1.0 + 0.14 * SDS, F: 1.0, E: 0.7 * RHO, H: h }),
        row("16-13", { D: 1.0, F: 1.0, W: 0.45, H: h }),
        row("16-14", { D: 1.0 + 0.105 * SDS, F: 1.0, E: 0.525 * RHO, H: h }),
        row("16-15", { D: 0.6, W: 0.6, H: h }),
        row("16-16", { D: 0.6 - 0.14 * SDS, F: 0.6, E: 0.7 * RHO, H: h }),
      ]),
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, hResist: 0.6 }, FLUID_EARTH), rows);
  });

  test("takes 0.9D in Equation 16-16 only where declared for special reinforced masonry shear walls", () => {
    // [FBC] Exception 5: in Equation 16-16, 0.6D is permitted to be increased to 0.9D for special
    // reinforced masonry shear walls complying with Chapter 21. F keeps 0.6 (the exception names D).
    const on = (params: Record<string, number>) => printedRows(planWith(ruleset, { SDS, ...params }, ["D", "F", "E"])).filter((r) => r.id === "16-16");
    expect(on({}).map((r) => [r.factors.D, r.factors.F])).toEqual([[0.6 - 0.14 * SDS, 0.6]]);
    expect(on({ fDmasonry: 0.9 }).map((r) => [r.factors.D, r.factors.F])).toEqual([[0.9 - 0.14 * SDS, 0.6]]);
  });

  test("never takes wind and earthquake in one row", () => {
    // [FBC] 16-12 "(0.6W or 0.7E)": one or the other; the ruleset forms it once with each.
    const rows = printedRows(planWith(ruleset, { SDS }, GRAVITY_WIND_SEISMIC));
    expect(rows.filter((r) => r.factors.W !== undefined && r.factors.E !== undefined)).toEqual([]);
  });

  test("lists which terms may be absent in each equation", () => {
    // Combinations investigated with one or more variable loads set to zero: IBC §1605.1 [memory], as a
    // load-determination guide restates it (chapter 2 introduction, https://www.scribd.com/document/519272438);
    // the defining W and E always act.
    expect(mayBeAbsent(planWith(ruleset, { SDS }, GRAVITY_WIND_SEISMIC))).toEqual({
      "16-8": [],
      "16-9": ["L"],
      "16-10": ["(Lr or S or R)"],
      "16-11": ["0.75L", "0.75(Lr or S or R)"],
      "16-12 (W)": [],
      "16-12 (E)": [],
      "16-13": ["0.75L", "0.75(Lr or S or R)"],
      "16-14": ["0.75L", "0.75S"],
      "16-15": [],
      "16-16": [],
    });
  });
});
