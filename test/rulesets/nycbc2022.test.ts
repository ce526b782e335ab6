/**
 * The shipped New York City Building Code 2022 strength ruleset held against the
 * equations as the city's law prints them. Nothing here is from memory.
 *
 * [NYC]  New York City Building Code (2022) §BC 1605.2, Equations 16-1 to 16-7 with f1, f2 and
 *        Exceptions 1–2, https://nacmiaslaw.com/resources/legal-codes/21362.
 *
 * E is the E of the equations, taken as given with the factor 1.0 they print; Ev, the vertical
 * part of E where the code's definition has one, is Loadwright's own case of it (not printed in
 * [NYC]), taken both ways in 16-5 and 16-7 so that either sign the definition asks for is formed.
 */
import { describe, expect, test } from "vitest";
import { allRows, expectPrintedRows, mayBeAbsent, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const GRAVITY_WIND_SEISMIC = ["D", "L", "Lr", "S", "R", "W", "E"];

describe("nycbc2022-strength", () => {
  const ruleset = shipped("nycbc2022-strength");

  test("expands to Equations 16-1 to 16-7 with f1 = 0.5 and f2 = 0.2", () => {
    const rows: FactorRow[] = [
      row("16-1", { D: 1.4 }), // 1.4(D + F) [NYC] 16-1
      row("16-2", { D: 1.2, L: 1.6, Lr: 0.5 }), // 1.2(D + F) + 1.6(L + H) + 0.5(Lr or S or R) [NYC] 16-2
      row("16-2", { D: 1.2, L: 1.6, S: 0.5 }),
      row("16-2", { D: 1.2, L: 1.6, R: 0.5 }),
      row("16-3", { D: 1.2, Lr: 1.6, L: 0.5 }), // 1.2(D + F) + 1.6(Lr or S or R) + 1.6H + (f1L or 0.5W) [NYC] 16-3
      row("16-3", { D: 1.2, Lr: 1.6, W: 0.5 }),
      row("16-3", { D: 1.2, S: 1.6, L: 0.5 }),
      row("16-3", { D: 1.2, S: 1.6, W: 0.5 }),
      row("16-3", { D: 1.2, R: 1.6, L: 0.5 }),
      row("16-3", { D: 1.2, R: 1.6, W: 0.5 }),
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, Lr: 0.5 }), // 1.2(D + F) + 1.0W + f1L + 1.6H + 0.5(Lr or S or R) [NYC] 16-4
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, S: 0.5 }),
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, R: 0.5 }),
      row("16-5", { D: 1.2, E: 1.0, L: 0.5, S: 0.2 }), // 1.2(D + F) + 1.0E + f1L + 1.6H + f2S [NYC] 16-5
      row("16-6", { D: 0.9, W: 1.0 }), // 0.9D + 1.0W + 1.6H [NYC] 16-6
      row("16-7", { D: 0.9, E: 1.0 }), // 0.9(D + F) + 1.0E + 1.6H [NYC] 16-7
    ];
    expectPrintedRows(planWith(ruleset, { f1: 0.5, f2: 0.2 }, GRAVITY_WIND_SEISMIC), rows);
  });

  test("gives F the factor of D where the equations print D + F, and H 1.6 or its resisting factor except in 16-1", () => {
    // [NYC]: 1.4(D + F) without H; 1.2(D + F) with 1.6H (16-2 as 1.6(L + H)); 0.9D + 1.0W + 1.6H without F;
    // 0.9(D + F) + 1.0E + 1.6H. Exception 2: H resisting the primary variable load effect takes 0.9 where permanent.
    const rows: FactorRow[] = [
      row("16-1", { D: 1.4, F: 1.4 }),
      ...[1.6, 0.9].flatMap((h) => [
        row("16-2", { D: 1.2, F: 1.2, H: h }),
        row("16-3", { D: 1.2, F: 1.2, W: 0.5, H: h }),
        row("16-4", { D: 1.2, F: 1.2, W: 1.0, H: h }),
        row("16-5", { D: 1.2, F: 1.2, E: 1.0, H: h }),
        row("16-6", { D: 0.9, W: 1.0, H: h }),
        row("16-7", { D: 0.9, F: 0.9, E: 1.0, H: h }),
      ]),
    ];
    expectPrintedRows(planWith(ruleset, { hResist: 0.9 }, ["D", "F", "H", "W", "E"]), rows);
  });

  test("takes a resisting H at 0 unless it is declared permanent", () => {
    // [NYC] Exception 2: "H shall be set to zero for all other conditions".
    const rows = printedRows(planWith(ruleset, {}, ["D", "H"])).filter((r) => r.id === "16-2");
    expect(rows.map((r) => r.factors.H ?? 0).sort()).toEqual([0, 1.6]);
  });

  test.each([
    // [NYC]: f1 = 1 for places of public assembly live loads over 100 psf and parking garages, 0.5 for other
    // live loads; f2 = 0.7 for roofs that do not shed snow, 0.2 for others.
    [1.0, 0.7],
    [0.5, 0.7],
    [1.0, 0.2],
  ])("takes f1 = %s on L and f2 = %s on S in Equation 16-5", (f1, f2) => {
    const rows = printedRows(planWith(ruleset, { f1, f2 }, ["D", "L", "S", "E"])).filter((r) => r.id === "16-5");
    expect(rows.map((r) => [r.factors.L, r.factors.S])).toEqual([[f1, f2]]);
  });

  test("defaults f1 and f2 to the larger values, which never understate L or S", () => {
    const rows = printedRows(planWith(ruleset, {}, ["D", "L", "S", "E"])).filter((r) => r.id === "16-5");
    expect(rows.map((r) => [r.factors.L, r.factors.S])).toEqual([[1.0, 0.7]]);
  });

  test("takes the vertical part Ev both ways, and only in 16-5 and 16-7, where E acts", () => {
    const rows = allRows(planWith(ruleset, {}, ["D", "W", "E", "Ev"]));
    const onEv = (id: string) => [...new Set(rows.filter((r) => r.id === id).map((r) => r.factors.Ev ?? 0))].sort();
    expect(onEv("16-5")).toEqual([-1, 0, 1]);
    expect(onEv("16-7")).toEqual([-1, 0, 1]);
    for (const id of ["16-1", "16-2", "16-3", "16-4", "16-6"]) expect(onEv(id), id).toEqual([0]);
    // Without an E case the seismic equations are skipped: Ev never acts alone.
    const withoutE = planWith(ruleset, {}, ["D", "Ev"]);
    expect(withoutE.combinations.filter((c) => c.combination.id === "16-5" || c.combination.id === "16-7").map((c) => c.skipped)).toEqual([
      "E not in the case table",
      "E not in the case table",
    ]);
  });

  test("lists which terms may be absent in each equation", () => {
    // W and E always act in the equations they define; D, F and H are permanent. Whether the code asks for
    // loads set to zero (§BC 1605.1) is not in [NYC]: the rows with a load left out only add to the envelope.
    expect(mayBeAbsent(planWith(ruleset, {}, [...GRAVITY_WIND_SEISMIC, "Ev"]))).toEqual({
      "16-1": [],
      "16-2": ["1.6L", "0.5(Lr or S or R)"],
      "16-3": ["1.6(Lr or S or R)", "(f1*L or 0.5W)"],
      "16-4": ["f1*L", "0.5(Lr or S or R)"],
      "16-5": ["1.0Ev", "f1*L", "f2*S"],
      "16-6": [],
      "16-7": ["1.0Ev"],
    });
  });

  test("never takes wind and earthquake in one row", () => {
    // [NYC]: no equation holds both W and E.
    const rows = allRows(planWith(ruleset, {}, [...GRAVITY_WIND_SEISMIC, "Ev"]));
    expect(rows.filter((r) => r.factors.W !== undefined && r.factors.E !== undefined)).toEqual([]);
  });
});
