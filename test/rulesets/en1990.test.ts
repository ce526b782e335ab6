/**
 * The shipped EN 1990 rulesets (recommended values) held against factor tables
 * typed from EN 1990 Annex A1 as shared/REFERENCES.md gives it: partial factors of
 * Table A1.2(A)–(C) and ψ of Table A1.1 [confirmed, a steel design guide quoting
 * the tables]; expressions 6.10, 6.10a/b, 6.14b, 6.15b, 6.12b [confirmed]; 6.16b
 * and most of 6.11b [memory].
 */
import { describe, expect, test } from "vitest";
import { resolveParameters } from "../../src/core/index.js";
import { expectPrintedRows, mayBeAbsent, planWith, printedRows, row, shipped, type FactorRow } from "./factorRows.js";

const VARIABLE = ["Q", "Q2", "S", "W", "T"];
// EN 1990 Table A1.1 [confirmed]: category C 0.7/0.7/0.6; category A 0.7/0.5/0.3; snow, other member
// states, altitude ≤ 1000 m 0.5/0.2/0; wind 0.6/0.2/0; temperature (non-fire) 0.6/0.5/0.
const PARAMETERS = { catQ: "C", catQ2: "A", snow: "upTo1000m" };
// So ψ0: Q 0.7, Q2 0.7, S 0.5, W 0.6, T 0.6; ψ1: Q 0.7, Q2 0.5, S 0.2, W 0.2, T 0.5; ψ2: Q 0.6, Q2 0.3, S, W, T 0.
const PSI0 = { Q: 0.7, Q2: 0.7, S: 0.5, W: 0.6, T: 0.6 };

describe("en1990-str-6.10", () => {
  test("takes each variable action leading at 1.5 with the others at 1.5ψ0, G at 1.35 or 1.0", () => {
    // EN 1990 (6.10) with Table A1.2(B) [confirmed]: γG,sup 1.35, γG,inf 1.00, γQ 1.50.
    const rows: FactorRow[] = [
      row("6.10", { G: 1.35, Q: 1.5, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 * 0.6 }), // Q leading
      row("6.10", { G: 1.0, Q: 1.5, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 * 0.6 }),
      row("6.10", { G: 1.35, Q: 1.5 * 0.7, Q2: 1.5, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 * 0.6 }), // Q2 leading
      row("6.10", { G: 1.0, Q: 1.5 * 0.7, Q2: 1.5, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 * 0.6 }),
      row("6.10", { G: 1.35, Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5, W: 1.5 * 0.6, T: 1.5 * 0.6 }), // S leading
      row("6.10", { G: 1.0, Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5, W: 1.5 * 0.6, T: 1.5 * 0.6 }),
      row("6.10", { G: 1.35, Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5, T: 1.5 * 0.6 }), // W leading
      row("6.10", { G: 1.0, Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5, T: 1.5 * 0.6 }),
      row("6.10", { G: 1.35, Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 }), // T leading
      row("6.10", { G: 1.0, Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 }),
    ];
    expectPrintedRows(planWith(shipped("en1990-str-6.10"), PARAMETERS, ["G", ...VARIABLE]), rows);
  });

  test("lets every variable action be absent (γQ = 0 where favourable) but never G", () => {
    // EN 1990 Table A1.2(B) [confirmed]: γQ = 0 where favourable; G always acts, at γG,sup or γG,inf.
    expect(mayBeAbsent(planWith(shipped("en1990-str-6.10"), PARAMETERS, ["G", ...VARIABLE]))).toEqual({
      "6.10": ["1.5*lead(Q, Q2, S, W, T)", "1.5*psi0*others"],
    });
  });
});

describe("en1990-str-6.10ab", () => {
  test("takes 6.10a with every action at 1.5ψ0 and 6.10b with ξ·1.35 on unfavourable G", () => {
    // EN 1990 (6.10a), (6.10b) with Table A1.2(B) [confirmed]: ξ = 0.85; ξ on γG,sup only [memory].
    const xi = 0.85;
    const companions = { Q: 1.5 * 0.7, Q2: 1.5 * 0.7, S: 1.5 * 0.5, W: 1.5 * 0.6, T: 1.5 * 0.6 };
    const rows: FactorRow[] = [
      row("6.10a", { G: 1.35, ...companions }),
      row("6.10a", { G: 1.0, ...companions }),
      row("6.10b", { G: xi * 1.35, ...companions, Q: 1.5 }), // Q leading
      row("6.10b", { G: 1.0, ...companions, Q: 1.5 }),
      row("6.10b", { G: xi * 1.35, ...companions, Q2: 1.5 }), // Q2 leading
      row("6.10b", { G: 1.0, ...companions, Q2: 1.5 }),
      row("6.10b", { G: xi * 1.35, ...companions, S: 1.5 }), // S leading
      row("6.10b", { G: 1.0, ...companions, S: 1.5 }),
      row("6.10b", { G: xi * 1.35, ...companions, W: 1.5 }), // W leading
      row("6.10b", { G: 1.0, ...companions, W: 1.5 }),
      row("6.10b", { G: xi * 1.35, ...companions, T: 1.5 }), // T leading
      row("6.10b", { G: 1.0, ...companions, T: 1.5 }),
    ];
    expectPrintedRows(planWith(shipped("en1990-str-6.10ab"), PARAMETERS, ["G", ...VARIABLE]), rows);
  });

  test("takes a National Annex's ξ", () => {
    // ξ = 0.925 with γG = 1.35: the UK National Annex values of the concrete handbook's column example
    // (shared/REFERENCES.md [confirmed]).
    const rows = printedRows(planWith(shipped("en1990-str-6.10ab"), { xi: 0.925 }, ["G", "Q"])).filter((r) => r.id === "6.10b");
    expect([...new Set(rows.map((r) => Number(r.factors.G.toPrecision(10))))].sort()).toEqual([1, 1.24875]);
  });
});

describe("en1990-equ", () => {
  test("takes 1.10 on destabilising and 0.90 on stabilising permanent actions", () => {
    // EN 1990 (6.10) with Table A1.2(A), set A [confirmed]: γG,sup 1.10, γG,inf 0.90, γQ 1.50.
    const rows: FactorRow[] = VARIABLE.map((leader) =>
      row("A1.2(A)", { Gdst: 1.1, Gstb: 0.9, ...scaled(PSI0, 1.5), [leader]: 1.5 }),
    );
    expectPrintedRows(planWith(shipped("en1990-equ"), PARAMETERS, ["Gdst", "Gstb", ...VARIABLE]), rows);
  });
});

describe("en1990-geo-set-c", () => {
  test("takes G at 1.0 and the leading action at 1.3, the others at 1.3ψ0", () => {
    // EN 1990 (6.10) with Table A1.2(C), set C [confirmed]: γG 1.00, γQ 1.30.
    const rows: FactorRow[] = VARIABLE.map((leader) => row("A1.2(C)", { G: 1.0, ...scaled(PSI0, 1.3), [leader]: 1.3 }));
    expectPrintedRows(planWith(shipped("en1990-geo-set-c"), PARAMETERS, ["G", ...VARIABLE]), rows);
  });
});

describe("EN 1990 serviceability", () => {
  test("characteristic: G + Qk,1 + Σψ0·Qk,i", () => {
    // EN 1990 (6.14b) [confirmed].
    const rows: FactorRow[] = VARIABLE.map((leader) => row("6.14b", { G: 1, ...PSI0, [leader]: 1 }));
    expectPrintedRows(planWith(shipped("en1990-sls-characteristic"), PARAMETERS, ["G", ...VARIABLE]), rows);
  });

  test("frequent: G + ψ1,1·Qk,1 + Σψ2·Qk,i", () => {
    // EN 1990 (6.15b) [confirmed]; wind, temperature and snow (≤ 1000 m) have ψ2 = 0.
    const rows: FactorRow[] = [
      row("6.15b", { G: 1, Q: 0.7, Q2: 0.3 }), // Q leading at ψ1 = 0.7
      row("6.15b", { G: 1, Q: 0.6, Q2: 0.5 }), // Q2 leading at ψ1 = 0.5
      row("6.15b", { G: 1, Q: 0.6, Q2: 0.3, S: 0.2 }), // S leading at ψ1 = 0.2
      row("6.15b", { G: 1, Q: 0.6, Q2: 0.3, W: 0.2 }), // W leading at ψ1 = 0.2
      row("6.15b", { G: 1, Q: 0.6, Q2: 0.3, T: 0.5 }), // T leading at ψ1 = 0.5
    ];
    expectPrintedRows(planWith(shipped("en1990-sls-frequent"), PARAMETERS, ["G", ...VARIABLE]), rows);
  });

  test("quasi-permanent: G + Σψ2·Qk,i", () => {
    // EN 1990 (6.16b) [memory]; ψ2 from Table A1.1 [confirmed].
    expectPrintedRows(planWith(shipped("en1990-sls-quasi-permanent"), PARAMETERS, ["G", ...VARIABLE]), [row("6.16b", { G: 1, Q: 0.6, Q2: 0.3 })]);
  });
});

describe("en1990-accidental", () => {
  test("takes the accidental action with the main accompanying action at ψ1 or ψ2 and the others at ψ2", () => {
    // EN 1990 (6.11b): (ψ1,1 or ψ2,1) on the main accompanying action [confirmed]; G at 1.0, Ad, others
    // at ψ2 [memory]. Where ψ2 = 0 (S ≤ 1000 m, W, T) the ψ2 choice is the action left out.
    const rows: FactorRow[] = [
      row("6.11b", { G: 1, Ad: 1, Q: 0.7, Q2: 0.3 }),
      row("6.11b", { G: 1, Ad: 1, Q: 0.6, Q2: 0.3 }),
      row("6.11b", { G: 1, Ad: 1, Q: 0.6, Q2: 0.5 }),
      row("6.11b", { G: 1, Ad: 1, Q: 0.6, Q2: 0.3 }),
      row("6.11b", { G: 1, Ad: 1, Q: 0.6, Q2: 0.3, S: 0.2 }),
      row("6.11b", { G: 1, Ad: 1, Q: 0.6, Q2: 0.3, W: 0.2 }),
      row("6.11b", { G: 1, Ad: 1, Q: 0.6, Q2: 0.3, T: 0.5 }),
    ];
    expectPrintedRows(planWith(shipped("en1990-accidental"), PARAMETERS, ["G", "Ad", ...VARIABLE]), rows);
  });
});

describe("en1990-seismic", () => {
  test("takes G + AEd + Σψ2·Qk,i", () => {
    // EN 1990 (6.12b) [confirmed]; ψ2 from Table A1.1 [confirmed].
    expectPrintedRows(planWith(shipped("en1990-seismic"), PARAMETERS, ["G", "AEd", ...VARIABLE]), [row("6.12b", { G: 1, AEd: 1, Q: 0.6, Q2: 0.3 })]);
  });

  test("combines two seismic directions as 100 % and 30 %, every sign", () => {
    // EN 1998-1 §4.3.3.5.2 [memory]: the default rule for AEd cases.
    const plan = planWith(shipped("en1990-seismic"), PARAMETERS, ["G", "AEd:x", "AEd:y"]);
    const directions = printedRows(plan).map((r) => [r.factors["AEd:x"], r.factors["AEd:y"]]);
    expect(directions).toEqual([[1, 0.3], [0.3, 1]]);
    expect(plan.rowCount).toBe(8); // 2 leading directions × 4 sign pairs, nothing else may vary here
  });
});

describe("EN 1990 Table A1.1", () => {
  // EN 1990 Table A1.1 [confirmed]: ψ0 / ψ1 / ψ2 by category of imposed load.
  test.each([
    ["A", 0.7, 0.5, 0.3],
    ["B", 0.7, 0.5, 0.3],
    ["C", 0.7, 0.7, 0.6],
    ["D", 0.7, 0.7, 0.6],
    ["E", 1.0, 0.9, 0.8],
    ["F", 0.7, 0.7, 0.6],
    ["G", 0.7, 0.5, 0.3],
    ["H", 0, 0, 0],
  ])("category %s gives ψ0 %s, ψ1 %s, ψ2 %s to Q and to Q2", (category, psi0, psi1, psi2) => {
    for (const id of ["en1990-str-6.10", "en1990-sls-frequent", "en1990-accidental"]) {
      const resolved = resolveParameters(shipped(id), { catQ: category, catQ2: category });
      if (!resolved.ok) throw new Error(JSON.stringify(resolved.problems));
      const n = resolved.value.numbers;
      expect([n.get("psi0_Q"), n.get("psi1_Q"), n.get("psi2_Q")]).toEqual([psi0, psi1, psi2]);
      expect([n.get("psi0_Q2"), n.get("psi1_Q2"), n.get("psi2_Q2")]).toEqual([psi0, psi1, psi2]);
    }
  });

  test.each([
    // EN 1990 Table A1.1 [confirmed]: snow loads on buildings.
    ["nordic", 0.7, 0.5, 0.2], // Finland, Iceland, Norway, Sweden
    ["over1000m", 0.7, 0.5, 0.2], // other CEN member states, H > 1000 m a.s.l.
    ["upTo1000m", 0.5, 0.2, 0], // other CEN member states, H ≤ 1000 m a.s.l.
  ])("snow site %s gives ψ0 %s, ψ1 %s, ψ2 %s", (snow, psi0, psi1, psi2) => {
    const resolved = resolveParameters(shipped("en1990-str-6.10"), { snow });
    if (!resolved.ok) throw new Error(JSON.stringify(resolved.problems));
    const n = resolved.value.numbers;
    expect([n.get("psi0_S"), n.get("psi1_S"), n.get("psi2_S")]).toEqual([psi0, psi1, psi2]);
  });

  test("puts the category's ψ0 on a companion imposed load in 6.10", () => {
    // EN 1990 (6.10) [confirmed]: with snow leading, Q accompanies at γQ·ψ0 = 1.5 × 1.0 for category E
    // (storage, Table A1.1 [confirmed]).
    const rows = printedRows(planWith(shipped("en1990-str-6.10"), { catQ: "E" }, ["G", "Q", "S"]));
    expect(rows.filter((r) => r.factors.S === 1.5).map((r) => r.factors.Q)).toEqual([1.5, 1.5]);
  });

  test("keeps the ψ of wind and temperature fixed in every EN 1990 ruleset", () => {
    // EN 1990 Table A1.1 [confirmed]: wind 0.6/0.2/0; temperature (non-fire) 0.6/0.5/0.
    const ids = ["en1990-str-6.10", "en1990-str-6.10ab", "en1990-equ", "en1990-geo-set-c", "en1990-sls-characteristic", "en1990-sls-frequent", "en1990-sls-quasi-permanent", "en1990-accidental", "en1990-seismic"];
    for (const id of ids) {
      const symbols = shipped(id).symbolByName;
      expect([...(symbols.get("W")?.attributes ?? [])]).toEqual([["psi0", 0.6], ["psi1", 0.2], ["psi2", 0]]);
      expect([...(symbols.get("T")?.attributes ?? [])]).toEqual([["psi0", 0.6], ["psi1", 0.5], ["psi2", 0]]);
    }
  });
});

function scaled(psi: Record<string, number>, gamma: number): Record<string, number> {
  return Object.fromEntries(Object.entries(psi).map(([k, v]) => [k, gamma * v]));
}
