/**
 * The shipped ASCE/SEI 7-10 rulesets held against factor tables typed from the
 * standard's own text, as the public copies named below print it. Beside every
 * row: the source and the combination it comes from. Nothing here is from memory.
 *
 * [7-10]   ASCE/SEI 7-10 §2.3.1–§2.3.2 (combinations 1–7) and §2.4.1 (combinations 1–8 with 6a
 *          and 6b, "Effects of one or more loads not acting shall be considered"), the standard's
 *          text shared at https://www.scribd.com/document/611469328.
 * [7-10c2] ASCE/SEI 7-10 chapter 2, shared at https://tr.scribd.com/document/357847377: §2.3.2
 *          Exception 1 (0.5L in combinations 3, 4, 5 where Lo ≤ 100 psf, not garages or places of
 *          public assembly), Exception 2 (companion S is pf or ps in 2, 4, 5), F with the load
 *          factor of D in combinations 1 through 5 and 7, H at 1.6 where it adds to the primary
 *          variable load effect and 0.9 (permanent) or 0 where it resists, loads not acting
 *          investigated, wind and earthquake need not act simultaneously.
 * [SKGA]   S. K. Ghosh Associates, "Some Comments on E in the 2012 IBC Load Combinations" (2014),
 *          quoting ASCE/SEI 7-10 §12.4.2: E = Eh + Ev for §2.3.2 combination 5 and §2.4.1
 *          combinations 5 and 6; Eq. 12.4-2, Eh − Ev, for §2.3.2 combination 7 and §2.4.1
 *          combination 8; Eh = ρ·QE (§12.4.2.1), Ev = 0.2·SDS·D (§12.4.2.2),
 *          https://skghoshassociates.com/blog/some-comments-on-e-in-the-2012-ibc-load-combinations.
 * [EV]     City of Everett, WA permit calculation "in compliance with ASCE 7-10 2.4.1":
 *          5. (1 + 0.14SDS)D + E; 6. (1.0 + 0.105SDS)D + 0.75E + 0.75L + 0.75S;
 *          8. (0.6 − 0.14SDS)D + E (its E holding the 0.7),
 *          https://lfportal.everettwa.gov/WebLink/0/doc/1077293/Page17.aspx.
 */
import { describe, expect, test } from "vitest";
import { planCombinations, readCaseTable, resolveParameters, type Ruleset } from "../../src/core/index.js";
import { allRows, expectPrintedRows, mayBeAbsent, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const GRAVITY_WIND_SEISMIC = ["D", "L", "Lr", "S", "R", "W", "E"];
const SDS = 0.8; // invented project value for these tests
const RHO = 1.3; // invented project value for these tests (the standard's ρ is the project's to give)

// Hand calculation from [SKGA]: combination 5 is 1.2D + 1.0(ρ·QE + 0.2·SDS·D) = (1.2 + 0.2·0.8)D + 1.3·QE = 1.36D + 1.3QE;
// combination 7 is 0.9D + 1.0(ρ·QE − 0.2·SDS·D) = 0.74D + 1.3QE.
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
  row("5", { D: 1.36, E: 1.3, L: 1.0, S: 0.2 }), // 1.2D + 1.0E + L + 0.2S [7-10] 5, E = Eh + Ev [SKGA]
  row("6", { D: 0.9, W: 1.0 }), // 0.9D + 1.0W [7-10] 6
  row("7", { D: 0.74, E: 1.3 }), // 0.9D + 1.0E [7-10] 7, E = Eh − Ev [SKGA]; the minus [EV] combination 8
];

// Hand calculation from [SKGA] and [EV]: 0.7Ev = 0.14·SDS·D = 0.112D; 0.75 × 0.7Ev = 0.105·SDS·D = 0.084D;
// 0.7ρ = 0.91; 0.75 × 0.7ρ = 0.6825.
const ASD: FactorRow[] = [
  row("1", { D: 1.0 }), // D [7-10] 1
  row("2", { D: 1.0, L: 1.0 }), // D + L [7-10] 2
  row("3", { D: 1.0, Lr: 1.0 }), // D + (Lr or S or R) [7-10] 3
  row("3", { D: 1.0, S: 1.0 }),
  row("3", { D: 1.0, R: 1.0 }),
  row("4", { D: 1.0, L: 0.75, Lr: 0.75 }), // D + 0.75L + 0.75(Lr or S or R) [7-10] 4
  row("4", { D: 1.0, L: 0.75, S: 0.75 }),
  row("4", { D: 1.0, L: 0.75, R: 0.75 }),
  row("5 (W)", { D: 1.0, W: 0.6 }), // D + (0.6W or 0.7E) [7-10] 5, with W
  row("5 (E)", { D: 1.112, E: 0.91 }), // the same with 0.7E, E = Eh + Ev [SKGA]; (1 + 0.14SDS)D [EV] 5
  row("6a", { D: 1.0, L: 0.75, W: 0.45, Lr: 0.75 }), // D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R) [7-10] 6a
  row("6a", { D: 1.0, L: 0.75, W: 0.45, S: 0.75 }),
  row("6a", { D: 1.0, L: 0.75, W: 0.45, R: 0.75 }),
  row("6b", { D: 1.084, L: 0.75, E: 0.6825, S: 0.75 }), // D + 0.75L + 0.75(0.7E) + 0.75S [7-10] 6b; (1.0 + 0.105SDS)D [EV] 6
  row("7", { D: 0.6, W: 0.6 }), // 0.6D + 0.6W [7-10] 7
  row("8", { D: 0.488, E: 0.91 }), // 0.6D + 0.7E [7-10] 8, E = Eh − Ev [SKGA]; (0.6 − 0.14SDS)D [EV] 8
];

describe("asce7-10-strength", () => {
  const ruleset = shipped("asce7-10-strength");

  test("expands to combinations 1 to 7 of §2.3.2, E per §12.4.2", () => {
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC), STRENGTH);
  });

  test("takes 0.5L in combinations 3, 4 and 5 only, where Exception 1 is declared", () => {
    // [7-10c2] Exception 1: "The load factor on L in combinations 3, 4, and 5 is permitted to equal 0.5".
    const rows = printedRows(planWith(ruleset, { SDS, rho: RHO, fL: 0.5 }, GRAVITY_WIND_SEISMIC));
    const onL = (id: string) => [...new Set(rows.filter((r) => r.id === id && r.factors.L !== undefined).map((r) => r.factors.L))];
    expect(onL("2")).toEqual([1.6]);
    expect(onL("3")).toEqual([0.5]);
    expect(onL("4")).toEqual([0.5]);
    expect(onL("5")).toEqual([0.5]);
    expect(parameterProblems(ruleset, { fL: 0.75 })).toEqual(["parameter fL = 0.75 is not one of the allowed values 0.5, 1"]);
  });

  test("gives F the factor of D in combinations 1 to 5 and 7, and H 1.6 or its resisting factor in all seven", () => {
    // [7-10c2]: "Where fluid loads F are present, they shall be included with the same load factor as dead
    // load D in combinations 1 through 5 and 7"; H with 1.6 where it adds, 0.9 where it resists and is
    // permanent — no combination excepted. The load factor of D in 5 and 7 is the printed 1.2 and 0.9
    // ([7-10] 5, 7); Ev is part of E, not of D's load factor ([SKGA]).
    const rows: FactorRow[] = [
      ...[1.6, 0.9].flatMap((h) => [
        row("1", { D: 1.4, F: 1.4, H: h }),
        row("2", { D: 1.2, F: 1.2, H: h }),
        row("3", { D: 1.2, F: 1.2, W: 0.5, H: h }),
        row("4", { D: 1.2, F: 1.2, W: 1.0, H: h }),
        row("5", { D: 1.36, F: 1.2, E: 1.3, H: h }),
        row("6", { D: 0.9, W: 1.0, H: h }),
        row("7", { D: 0.74, F: 0.9, E: 1.3, H: h }),
      ]),
    ];
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO, hResist: 0.9 }, ["D", "F", "H", "W", "E"]), rows);
  });

  test("also forms combination 1 without H, which has no variable load for H to add to or resist", () => {
    // [7-10c2] names no exception to the H rule; the IBC prints 1.4(D + F) without H (New York City Building
    // Code §BC 1605.2, Equation 16-1). Both readings are formed, so neither is understated.
    const rows = allRows(planWith(ruleset, { hResist: 0.9 }, ["D", "F", "H"])).filter((r) => r.id === "1");
    expect(rows.map((r) => r.factors.H ?? 0).sort()).toEqual([0, 0.9, 1.6]);
  });

  test("takes a resisting H at 0 unless it is declared permanent", () => {
    // [7-10c2]: "a load factor of 0 for all other conditions".
    const rows = printedRows(planWith(ruleset, {}, ["D", "H"])).filter((r) => r.id === "2");
    expect(rows.map((r) => r.factors.H ?? 0).sort()).toEqual([0, 1.6]);
  });

  test("asks for SDS and ρ where a seismic combination is formed, and for neither without E cases", () => {
    // Both are the project's ([SKGA]: Eh = ρ·QE, Ev = 0.2·SDS·D); no text found lists ρ's values, so no default.
    expect(planProblems(ruleset, { SDS }, ["D", "L", "E"]).join("; ")).toMatch(/parameter rho has no default/);
    expect(planProblems(ruleset, { rho: RHO }, ["D", "L", "E"]).join("; ")).toMatch(/parameter SDS has no default/);
    expect(planProblems(ruleset, {}, ["D", "L", "S", "W"])).toEqual([]);
  });

  test("combines two seismic directions at the share given, and by default every direction at full value", () => {
    // The share is the project's (eShare): 0.3 here is an invented value for the test. With share k the
    // rows of combination 5 in which both directions act positively are ρ·E:x + k·ρ·E:y and k·ρ·E:x + ρ·E:y;
    // the default k = 1 gives ρ·(E:x + E:y), once, which bounds every k ≤ 1 (hand reasoning: for each sign,
    // ρ·QEx + k·ρ·|QEy| grows with k); k = 0 gives each direction alone.
    const pairs = (share: Record<string, number>) =>
      printedRows(planWith(ruleset, { SDS, rho: RHO, ...share }, ["D", "E:x", "E:y"]))
        .filter((r) => r.id === "5")
        .map((r) => [r.factors["E:x"] ?? 0, r.factors["E:y"] ?? 0].map((f) => Number(f.toPrecision(10))));
    expect(pairs({ eShare: 0.3 })).toEqual([
      [1.3, 0.39],
      [0.39, 1.3],
    ]);
    expect(pairs({})).toEqual([[1.3, 1.3]]);
    expect(pairs({ eShare: 0 })).toEqual([
      [1.3, 0],
      [0, 1.3],
    ]);
  });

  test("lists which terms may be absent in each combination", () => {
    // [7-10c2]: effects of one or more loads not acting shall be investigated; the defining W and E always
    // act, D and F are permanent, and H may be left out of combination 1 only.
    expect(mayBeAbsent(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC))).toEqual({
      "1": ["(1.6 or hResist)H?"],
      "2": ["1.6L", "0.5(Lr or S or R)"],
      "3": ["1.6(Lr or S or R)", "(fL*L or 0.5W)"],
      "4": ["fL*L", "0.5(Lr or S or R)"],
      "5": ["fL*L", "0.2S"],
      "6": [],
      "7": [],
    });
  });

  test("never takes wind and earthquake in one row", () => {
    // [7-10c2]: wind and earthquake "need not be considered to act simultaneously".
    const rows = allRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC));
    expect(rows.filter((r) => r.factors.W !== undefined && r.factors.E !== undefined)).toEqual([]);
  });
});

describe("asce7-10-asd", () => {
  const ruleset = shipped("asce7-10-asd");

  test("expands to combinations 1 to 8 of §2.4.1, combination 5 once with W and once with E", () => {
    expectPrintedRows(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC), ASD);
  });

  test("lists which terms may be absent in each combination", () => {
    // [7-10] §2.4.1: "Effects of one or more loads not acting shall be considered."
    expect(mayBeAbsent(planWith(ruleset, { SDS, rho: RHO }, GRAVITY_WIND_SEISMIC))).toEqual({
      "1": [],
      "2": ["L"],
      "3": ["(Lr or S or R)"],
      "4": ["0.75L", "0.75(Lr or S or R)"],
      "5 (W)": [],
      "5 (E)": [],
      "6a": ["0.75L", "0.75(Lr or S or R)"],
      "6b": ["0.75L", "0.75S"],
      "7": [],
      "8": [],
    });
  });

  test("refuses a case table with fluid or earth pressure cases, which the text it rests on does not combine", () => {
    // [7-10] prints §2.4.1 without the paragraphs on F and H, so the ruleset has no F or H: such a case is an
    // error that names its header, never a load silently left out.
    const table = readCaseTable(
      [
        ["result", "D", "H"],
        ["wall base", 10, 4],
      ],
      ruleset,
      { orientation: "columns" },
    );
    expect(table.ok).toBe(false);
    if (!table.ok) expect(table.problems.map((p) => p.place.header)).toEqual(["H"]);
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
