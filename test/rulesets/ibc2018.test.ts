/**
 * The shipped IBC 2018 strength ruleset held against §1605.2's equations. The f1
 * and f2 definitions are [confirmed] (shared/REFERENCES.md); the equations
 * themselves are [memory].
 */
import { describe, expect, test } from "vitest";
import { expectPrintedRows, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const SDS = 0.8; // invented project value for these tests
const RHO = 1.3; // ρ = 1.3, ASCE/SEI 7-16 §12.3.4 [memory]

describe("ibc2018-strength", () => {
  const ruleset = shipped("ibc2018-strength");

  test("expands to Equations 16-1 to 16-7 with f1 = 0.5 and f2 = 0.2", () => {
    // IBC 2018 §1605.2 [memory for the equations; f1, f2 confirmed], with E = ρ·QE ± 0.2·SDS·D
    // (ASCE/SEI 7-16 §12.4.2, Ev = 0.2·SDS·D confirmed).
    const rows: FactorRow[] = [
      row("16-1", { D: 1.4 }), // 1.4(D + F)
      row("16-2", { D: 1.2, L: 1.6, Lr: 0.5 }), // 1.2(D + F) + 1.6(L + H) + 0.5(Lr or S or R)
      row("16-2", { D: 1.2, L: 1.6, S: 0.5 }),
      row("16-2", { D: 1.2, L: 1.6, R: 0.5 }),
      row("16-3", { D: 1.2, Lr: 1.6, L: 0.5 }), // 1.2(D + F) + 1.6(Lr or S or R) + 1.6H + (f1L or 0.5W)
      row("16-3", { D: 1.2, Lr: 1.6, W: 0.5 }),
      row("16-3", { D: 1.2, S: 1.6, L: 0.5 }),
      row("16-3", { D: 1.2, S: 1.6, W: 0.5 }),
      row("16-3", { D: 1.2, R: 1.6, L: 0.5 }),
      row("16-3", { D: 1.2, R: 1.6, W: 0.5 }),
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, Lr: 0.5 }), // 1.2(D + F) + 1.0W + f1L + 1.6H + 0.5(Lr or S or R)
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, S: 0.5 }),
      row("16-4", { D: 1.2, W: 1.0, L: 0.5, R: 0.5 }),
      row("16-5", { D: 1.2 + 0.2 * SDS, E: RHO, L: 0.5, S: 0.2 }), // 1.2(D + F) + 1.0E + f1L + 1.6H + f2S
      row("16-6", { D: 0.9, W: 1.0 }), // 0.9D + 1.0W + 1.6H
      row("16-7", { D: 0.9 - 0.2 * SDS, E: RHO }), // 0.9(D + F) + 1.0E + 1.6H
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, f1: 0.5, f2: 0.2 }, ["D", "L", "Lr", "S", "R", "W", "E"]), rows);
  });

  test("gives F the factor of D except in 16-6, and H 1.6 or its resisting factor except in 16-1", () => {
    // IBC 2018 §1605.2 [memory]: 1.4(D + F), 1.2(D + F), 0.9D + 1.0W + 1.6H, 0.9(D + F) + 1.0E + 1.6H;
    // H resisting: 0.9 where permanent.
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
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, hResist: 0.9 }, ["D", "F", "H", "W", "E"]), rows);
  });

  test.each([
    // IBC 2018 §1605.2 [confirmed]: f1 = 1.0 for public assembly over 100 psf and parking garages, else 0.5;
    // f2 = 0.7 for roofs that do not shed snow, else 0.2.
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
