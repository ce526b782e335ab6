/**
 * How combinations expand into concrete rows, checked against rows and counts
 * worked out by hand from the codes' forms.
 */
import { describe, expect, test } from "vitest";
import { rulesetFile } from "../../support/rulesetFile.js";
import {
  comboRows,
  describeProblem,
  listRows,
  loadRuleset,
  planForTable,
  readCaseMap,
  readCaseTable,
  rowLabel,
  rulesetFromRows,
  type Cell,
  type Plan,
  type Ruleset,
  type RulesetFile,
} from "../../../src/core/index.js";

function typed(rows: Cell[][]): Ruleset {
  const r = rulesetFromRows(rows);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

function plan(ruleset: Ruleset, table: Cell[][], params = {}, map: Cell[][] = []): Plan {
  const m = readCaseMap(map, ruleset);
  if (!m.ok) throw new Error(JSON.stringify(m.problems));
  const t = readCaseTable(table, ruleset, { map: m.value, orientation: "rows" });
  if (!t.ok) throw new Error(JSON.stringify(t.problems));
  const p = planForTable(ruleset, params, t.value);
  if (!p.ok) throw new Error(JSON.stringify(p.problems));
  return p.value;
}

/** Every row's factors as "header factor" pairs, for comparing with hand-written rows. */
function factorRows(p: Plan): string[] {
  const rows = comboRows(p);
  if (!rows.ok) throw new Error("refused");
  return rows.value.map((r) =>
    r.factors
      .map((f, i) => (f === 0 ? "" : `${p.cases[i].header} ${Number(f.toPrecision(10))}`))
      .filter(Boolean)
      .join(", "),
  );
}

/** A cases-as-rows table with one component, every case valued 1. */
const table = (headers: string[]): Cell[][] => [["", "V"], ...headers.map((h) => [h, 1])];

// ASCE/SEI 7-16 §2.3.1 basic combinations [list confirmed for the 7-10 text, which 7-16 keeps;
// numbering memory: ASCE/SEI 7-10 §2.3.2 (public copy: https://www.scribd.com/document/611469328)] and §2.3.6 seismic forms [forms confirmed by the Santa Ana report cited in
// test/core/evaluate/evaluate.test.ts; numbering memory].
const ASCE_STRENGTH = [
  ["1", "1.4D", "§2.3.1 (1)"],
  ["2", "1.2D + 1.6L + 0.5(Lr or S or R)", "§2.3.1 (2)"],
  ["3", "1.2D + 1.6(Lr or S or R) + (L or 0.5W)", "§2.3.1 (3)"],
  ["4", "1.2D + 1.0W! + L + 0.5(Lr or S or R)", "§2.3.1 (4)"],
  ["5", "0.9D + 1.0W!", "§2.3.1 (5)"],
  ["6", "(1.2 + 0.2*SDS)D + rho*E! + L + 0.2S", "§2.3.6 (6)"],
  ["7", "(0.9 - 0.2*SDS)D + rho*E!", "§2.3.6 (7)"],
];
const WIND = Array.from({ length: 12 }, (_, k) => `W:${k + 1}`);
const ASCE_TABLE = table(["D", "L", "Lr", "S", "R", ...WIND, "E:x", "E:y"]);

describe("row counts", () => {
  test("ASCE 7 strength with 24 wind cases and 8 seismic cases gives 191 rows when every listed load acts", () => {
    // docs/design.md, "Exactness": hundreds of rows before absent-load variants; 191 here. By hand, with
    // 12 wind directions each way (24 wind cases) and E:x, E:y under the orthogonal rule
    // (ASCE/SEI 7-16 §12.5.3: 2 leading directions × 4 sign pairs = 8 seismic cases):
    //   1: 1   2: 3 (Lr|S|R)   3: 3 × (L + 24 W) = 75   4: 24 × 3 = 72   5: 24   6: 8   7: 8
    //   1 + 3 + 75 + 72 + 24 + 8 + 8 = 191
    const allActing = [
      ["1", "1.4D", "§2.3.1 (1)"],
      ["2", "1.2D + 1.6L! + 0.5(Lr or S or R)!", "§2.3.1 (2)"],
      ["3", "1.2D + 1.6(Lr or S or R)! + (L or 0.5W)!", "§2.3.1 (3)"],
      ["4", "1.2D + 1.0W! + L! + 0.5(Lr or S or R)!", "§2.3.1 (4)"],
      ["5", "0.9D + 1.0W!", "§2.3.1 (5)"],
      ["6", "(1.2 + 0.2*SDS)D + rho*E! + L! + 0.2S!", "§2.3.6 (6)"],
      ["7", "(0.9 - 0.2*SDS)D + rho*E!", "§2.3.6 (7)"],
    ];
    const p = plan(typed(allActing), ASCE_TABLE, { SDS: 1.1, rho: 1.3 }, [["E", "orthogonal"]]);
    expect(p.combinations.map((c) => c.rowCount)).toEqual([1, 3, 75, 72, 24, 8, 8]);
    expect(p.rowCount).toBe(191);
  });

  test("with every load that may be absent also taken out, the same table gives 369 rows", () => {
    // Each transient term without "!" may be absent (one more option):
    //   1: 1
    //   2: L present/absent × (Lr, S, R, absent) = 2 × 4 = 8
    //   3: (Lr, S, R, absent) × (L, 24 W, absent) = 4 × 26 = 104
    //   4: 24 W × L present/absent × 4 = 192
    //   5: 24
    //   6: 8 E × L 2 × S 2 = 32
    //   7: 8
    //   1 + 8 + 104 + 192 + 24 + 32 + 8 = 369
    const p = plan(typed(ASCE_STRENGTH), ASCE_TABLE, { SDS: 1.1, rho: 1.3 }, [["E", "orthogonal"]]);
    expect(p.combinations.map((c) => c.rowCount)).toEqual([1, 8, 104, 192, 24, 32, 8]);
    expect(p.rowCount).toBe(369);
  });

  test("refuses to list rows beyond the limit and says how many there would be", () => {
    const p = plan(typed(ASCE_STRENGTH), ASCE_TABLE, { SDS: 1.1, rho: 1.3 }, [["E", "orthogonal"]]);
    const r = listRows(p, 100);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(describeProblem(r.problems[0])).toMatch(/^the ruleset expands to 369 concrete rows for this case table, more than the limit of 100; use the envelope/);
  });
});

describe("expansion", () => {
  test("takes the orthogonal rule as 100 % one way plus 30 % the other, every sign, each direction leading", () => {
    // ASCE/SEI 7-16 §12.5.3 [confirmed for the 7-10 text]: with ρ = 1.3, 1.3 on the leading
    // direction and 0.3 × 1.3 = 0.39 on the other.
    const p = plan(typed([["7", "rho*E!", "§2.3.6 (7)"]]), table(["E:x", "E:y"]), { rho: 1.3 }, [["E", "orthogonal"]]);
    expect(factorRows(p).sort()).toEqual(
      [
        "E:x 1.3, E:y 0.39",
        "E:x -1.3, E:y 0.39",
        "E:x 1.3, E:y -0.39",
        "E:x -1.3, E:y -0.39",
        "E:x 0.39, E:y 1.3",
        "E:x -0.39, E:y 1.3",
        "E:x 0.39, E:y -1.3",
        "E:x -0.39, E:y -1.3",
      ].sort(),
    );
  });

  test("takes each variable action leading in turn with the others at ψ0 (EN 1990 6.10)", () => {
    // EN 1990 6.10 with γG = 1.35, γQ = 1.5, ψ0 snow (≤ 1000 m) 0.5, ψ0 wind 0.6 (Table A1.1 [confirmed]):
    // the steel design guide's check values [confirmed]: 1.35G + 1.5S + 0.9W and 1.35G + 1.5W + 0.75S.
    const ruleset = euroRuleset("1.35G + 1.5*lead(S, W) + 1.5*psi0*others");
    const rows = factorRows(plan(ruleset, table(["G", "S", "W"])));
    expect(rows).toContain("G 1.35, S 1.5, W 0.9");
    expect(rows).toContain("G 1.35, S 0.75, W 1.5");
  });

  test("gives the characteristic and frequent serviceability rows of EN 1990 6.14b and 6.15b", () => {
    // Steel design guide [confirmed]: characteristic G + S + 0.6W and G + W + 0.5S;
    // frequent G + 0.2S and G + 0.2W (ψ1 snow ≤ 1000 m 0.2, ψ2 wind 0; ψ1 wind 0.2, ψ2 snow 0).
    const characteristic = factorRows(plan(euroRuleset("G + lead(S, W) + psi0*others"), table(["G", "S", "W"])));
    expect(characteristic).toContain("G 1, S 1, W 0.6");
    expect(characteristic).toContain("G 1, S 0.5, W 1");
    const frequent = factorRows(plan(euroRuleset("G + psi1*lead(S, W) + psi2*others"), table(["G", "S", "W"])));
    expect(frequent).toContain("G 1, S 0.2");
    expect(frequent).toContain("G 1, W 0.2");
  });

  test("applies a factor pair to all cases of a permanent action together", () => {
    // EN 1990 Table A1.2(B) γG,sup 1.35 / γG,inf 1.00 [confirmed]; one factor for all permanent
    // actions from one source (A1.3.1 note [memory]).
    const rows = factorRows(plan(euroRuleset("(1.35 or 1.0)G"), table(["G:self", "G:finishes"])));
    expect(rows).toEqual(["G:self 1.35, G:finishes 1.35", "G:self 1, G:finishes 1"]);
  });

  test("lets cases of a permanent action from different sources take the factor pair each on its own", () => {
    // EN 1990 A1.3.1(4) [memory]: one factor for all permanent actions from one source; actions from
    // different sources (here self weight and soil, invented headers) are factored independently.
    const rows = factorRows(plan(euroRuleset("(1.35 or 1.0)G"), table(["G:self", "G:soil"]), {}, [["G", "independent"]]));
    expect(rows.sort()).toEqual(["G:self 1.35, G:soil 1.35", "G:self 1.35, G:soil 1", "G:self 1, G:soil 1.35", "G:self 1, G:soil 1"].sort());
  });

  test("gives a symbol written twice the same case and direction in both places", () => {
    const rows = factorRows(plan(typed([["x", "W! + 0.5W", "invented"]]), table(["W:N", "W:E"])));
    expect(rows.sort()).toEqual(["W:E -1.5", "W:E 1.5", "W:N -1.5", "W:N 1.5", "W:E -1", "W:E 1", "W:N -1", "W:N 1"].sort());
  });

  test("skips a combination whose defining load has no case, and lists loads not supplied", () => {
    const p = plan(typed(ASCE_STRENGTH), table(["D", "L", "S"]), { SDS: 1.1, rho: 1.3 });
    expect(p.combinations.map((c) => c.skipped)).toEqual([null, null, null, "W not in the case table", "W not in the case table", "E not in the case table", "E not in the case table"]);
    expect(p.combinations[1].notSupplied).toEqual(["Lr", "R"]);
    expect(p.combinations[1].mayBeAbsent).toEqual(["1.6L", "0.5(Lr or S or R)"]);
  });

  test("labels rows with the factors, the leading action and the terms left out", () => {
    const p = plan(typed(ASCE_STRENGTH.slice(1, 2)), table(["D", "L", "S"]));
    const labels = (listRows(p).ok ? (listRows(p) as { value: Parameters<typeof rowLabel>[1][] }).value : []).map((r) => rowLabel(p, r));
    expect(labels).toEqual([
      "2: 1.2D + 1.6L + 0.5S",
      "2: 1.2D + 1.6L [absent: 0.5(Lr or S or R)]",
      "2: 1.2D + 0.5S [absent: 1.6L]",
      "2: 1.2D [absent: 1.6L, 0.5(Lr or S or R)]",
    ]);
    const euro = plan(euroRuleset("1.35G + 1.5*lead(S, W) + 1.5*psi0*others"), table(["G", "S", "W"]));
    const euroLabels = (listRows(euro).ok ? (listRows(euro) as { value: Parameters<typeof rowLabel>[1][] }).value : []).map((r) => rowLabel(euro, r));
    expect(euroLabels).toContain("6.10: 1.35G + 1.5S + 0.9W [S leading]");
    expect(euroLabels).toContain("6.10: 1.35G + 0.9W [absent: S (leading)]");
  });

  test("takes only the alternatives whose loads are in the table, so a term that always acts never goes empty", () => {
    // ASCE/SEI 7-22 "W or Wt" [confirmed, design-magazine articles]; with no tornado case only W is taken:
    // ±W × L present or absent = 4 rows, every one with wind.
    const rows = factorRows(plan(typed([["4", "1.2D + (1.0W or 1.0Wt)! + L", "x"]]), table(["D", "L", "W"])));
    expect(rows.sort()).toEqual(["D 1.2, L 1, W 1", "D 1.2, L 1, W -1", "D 1.2, W 1", "D 1.2, W -1"].sort());
  });

  test("takes a reversible symbol one way where the case map says the table holds every direction", () => {
    const rows = factorRows(plan(typed([["5", "0.9D + 1.0W!", "x"]]), table(["D", "W:N", "W:S"]), {}, [["W", "one-way"]]));
    expect(rows).toEqual(["D 0.9, W:N 1", "D 0.9, W:S 1"]);
    const both = factorRows(plan(typed([["5", "0.9D + 1.0T!", "x"]]), table(["D", "T"]), {}, [["T", "both-ways"]]));
    expect(both).toEqual(["D 0.9, T 1", "D 0.9, T -1"]);
  });

  test("names the combination and character of a factor that is not a finite number", () => {
    const ruleset = typed([["x", "(1/b)D", "invented"]]);
    const t = readCaseTable(table(["D"]), ruleset);
    if (!t.ok) throw new Error("refused");
    const p = planForTable(ruleset, { b: 0 }, t.value);
    expect(p.ok).toBe(false);
    if (p.ok) return;
    expect(describeProblem(p.problems[0])).toBe('combination "x", character 4: division by zero in the factor on D');
  });
});

describe("an orthogonal share named by a parameter", () => {
  // The 100 % + 30 % rule of ASCE/SEI 7-16 §12.5.3 [confirmed for the 7-10 text] with its share as a parameter.
  const file = rulesetFile({
    symbols: {
      D: { description: "dead load", permanence: "permanent" },
      E: { description: "earthquake", permanence: "transient", reversible: true, cases: "orthogonal", orthogonalShare: "eShare" },
    },
    parameters: { eShare: { type: "number", description: "share of the other direction", min: 0, max: 1 } },
    combinations: [{ id: "7", expression: "0.9D + 1.0E!", clause: "invented for the test" }],
  });
  const loaded = loadRuleset(file);
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.problems));
  const ruleset = loaded.value;

  test("must be given where two directions combine, and is refused by name, never taken as NaN", () => {
    const t = readCaseTable(table(["D", "E:x", "E:y"]), ruleset);
    if (!t.ok) throw new Error("refused");
    const p = planForTable(ruleset, {}, t.value);
    expect(p.ok).toBe(false);
    if (p.ok) return;
    expect(describeProblem(p.problems[0])).toBe('combination "7": parameter eShare has no default; give its value (share of the other direction): it is the share of the other directions of E');
  });

  test("is not asked for where one direction leaves nothing to share", () => {
    const t = readCaseTable(table(["D", "E:x"]), ruleset);
    if (!t.ok) throw new Error("refused");
    expect(planForTable(ruleset, {}, t.value).ok).toBe(true);
  });

  test("takes the value given: 1.0 on one direction, 0.3 on the other, every sign (8 rows)", () => {
    const t = readCaseTable(table(["D", "E:x", "E:y"]), ruleset);
    if (!t.ok) throw new Error("refused");
    const p = planForTable(ruleset, { eShare: 0.3 }, t.value);
    if (!p.ok) throw new Error(JSON.stringify(p.problems));
    expect(p.value.rowCount).toBe(8);
  });
});

/** G, S, W with EN 1990 Table A1.1 ψ values for snow (altitude ≤ 1000 m) and wind [confirmed]. */
function euroRuleset(expression: string): Ruleset {
  const file: RulesetFile = rulesetFile({
    id: "en1990-test",
    title: "EN 1990 forms for tests",
    standard: { name: "EN 1990", edition: "2002" },
    version: "1",
    symbols: {
      G: { description: "permanent action", permanence: "permanent" },
      S: { description: "snow, altitude ≤ 1000 m", permanence: "transient", attributes: { psi0: 0.5, psi1: 0.2, psi2: 0 } },
      W: { description: "wind", permanence: "transient", attributes: { psi0: 0.6, psi1: 0.2, psi2: 0 } },
    },
    combinations: [{ id: "6.10", expression, clause: "EN 1990 (6.10)" }],
    provenance: [{ source: "EN 1990 Table A1.1, A1.2(B)", status: "confirmed", covers: "all" }],
  });

  const r = loadRuleset(file);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}
