/**
 * How many concrete rows a shipped ruleset gives for a stated case table, worked
 * out by hand in each test's comment: once with every term acting (the count a
 * code's list gives), once with the terms that may be absent also left out.
 */
import { describe, expect, test } from "vitest";
import { comboRows, type Plan } from "../../src/core/index.js";
import { planWith, shipped } from "./factorRows.js";

const WIND_12 = Array.from({ length: 12 }, (_, k) => `W:${k + 1}`);

/** Rows per combination, and how many of them leave no term out (their label names no absent term). */
function counts(plan: Plan) {
  const rows = comboRows(plan);
  if (!rows.ok) throw new Error("refused");
  const ids = plan.combinations.map((c) => c.combination.id);
  return {
    perCombination: plan.combinations.map((c) => c.rowCount),
    total: plan.rowCount,
    everyTermActing: ids.map((id) => rows.value.filter((r) => r.combination === id && !r.label.includes("absent:")).length),
  };
}

describe("asce7-16-strength row counts", () => {
  // D, L, Lr, S, R; 12 wind directions, each also reversed (W is reversible): 24 wind cases;
  // E:x and E:y under the orthogonal rule (ASCE/SEI 7-16 §12.5.3 [confirmed for the 7-10 text]):
  // 2 leading directions × 4 sign pairs = 8 seismic cases. No F, no H.
  const headers = ["D", "L", "Lr", "S", "R", ...WIND_12, "E:x", "E:y"];

  test("gives 191 rows with every term acting and 369 with the absent-load variants", () => {
    // Every term acting, counted by hand (the 191 of docs/design.md):
    //   1: 1.4D                                      1
    //   2: 1.2D + 1.6L + 0.5(Lr|S|R)                 3
    //   3: 1.2D + 1.6(Lr|S|R) + (L|0.5W)             3 × (1 + 24) = 75
    //   4: 1.2D + W + L + 0.5(Lr|S|R)                24 × 3 = 72
    //   5: 0.9D + W                                  24
    //   6: (1.2 + 0.2SDS)D + ρE + L + 0.2S           8
    //   7: (0.9 − 0.2SDS)D + ρE                      8          → 191
    // With each transient term without "!" also absent (one more option each):
    //   1: 1;  2: L 2 × roof 4 = 8;  3: roof 4 × (L, 24 W, absent) 26 = 104;  4: 24 × L 2 × roof 4 = 192;
    //   5: 24;  6: 8 × L 2 × S 2 = 32;  7: 8                              → 369
    const c = counts(planWith(shipped("asce7-16-strength"), { SDS: 1.1 }, headers));
    expect(c.everyTermActing).toEqual([1, 3, 75, 72, 24, 8, 8]);
    expect(c.everyTermActing.reduce((a, b) => a + b)).toBe(191);
    expect(c.perCombination).toEqual([1, 8, 104, 192, 24, 32, 8]);
    expect(c.total).toBe(369);
  });

  test("gives 359 and 681 rows where 24 wind cases are declared, each also reversed", () => {
    // The same table with 24 wind directions declared (W:1 … W:24): 48 wind cases with reversal.
    // Every term acting: 1 + 3 + 3 × (1 + 48) + 48 × 3 + 48 + 8 + 8 = 1 + 3 + 147 + 144 + 48 + 8 + 8 = 359.
    // With absent variants: 1 + 8 + 4 × (1 + 48 + 1) + 48 × 2 × 4 + 48 + 32 + 8
    //                     = 1 + 8 + 200 + 384 + 48 + 32 + 8 = 681.
    const wind24 = Array.from({ length: 24 }, (_, k) => `W:${k + 1}`);
    const c = counts(planWith(shipped("asce7-16-strength"), { SDS: 1.1 }, ["D", "L", "Lr", "S", "R", ...wind24, "E:x", "E:y"]));
    expect(c.everyTermActing).toEqual([1, 3, 147, 144, 48, 8, 8]);
    expect(c.perCombination).toEqual([1, 8, 200, 384, 48, 32, 8]);
    expect(c.total).toBe(681);
  });

  test("doubles every combination but 1.4D when an earth pressure case H is added", () => {
    // H takes 1.6 where it adds or hResist (default 0) where it resists (ASCE/SEI 7-10 §2.3.2 [confirmed]):
    // two options in combinations 2–7, none in 1.4D [memory]. Every term acting:
    //   1 + 2 × (3 + 75 + 72 + 24 + 8 + 8) = 1 + 2 × 190 = 381;
    // with absent variants: 1 + 2 × (8 + 104 + 192 + 24 + 32 + 8) = 1 + 2 × 368 = 737.
    const c = counts(planWith(shipped("asce7-16-strength"), { SDS: 1.1 }, [...headers, "H"]));
    expect(c.everyTermActing.reduce((a, b) => a + b)).toBe(381);
    expect(c.total).toBe(737);
  });
});

describe("asce7-10-strength row counts", () => {
  // The table of the asce7-16-strength counts: D, L, Lr, S, R; 12 wind directions each also reversed (24);
  // E:x and E:y, combined at the share eShare with every sign. No F, no H (the H term of combination 1 has
  // no case, so it counts once).
  const headers = ["D", "L", "Lr", "S", "R", ...WIND_12, "E:x", "E:y"];

  test("gives the 7-16 counts, 191 and 369, where the seismic share is 0.3", () => {
    // Every term acting, in 7-10 order (ASCE/SEI 7-10 §2.3.2, https://www.scribd.com/document/611469328):
    //   1: 1.4D 1;  2: 3;  3: 3 × (1 + 24) = 75;  4: 24 × 3 = 72;  5: 8 seismic states;  6: 24;  7: 8   → 191
    // With absent variants: 1;  2: 2 × 4 = 8;  3: 4 × 26 = 104;  4: 24 × 2 × 4 = 192;  5: 8 × 2 × 2 = 32;
    //   6: 24;  7: 8                                                                                     → 369
    const c = counts(planWith(shipped("asce7-10-strength"), { SDS: 1.1, rho: 1.3, eShare: 0.3 }, headers));
    expect(c.everyTermActing).toEqual([1, 3, 75, 72, 8, 24, 8]);
    expect(c.perCombination).toEqual([1, 8, 104, 192, 32, 24, 8]);
    expect(c.total).toBe(369);
  });

  test("forms 4 seismic states, not 8, where both directions act at full value (the default share)", () => {
    // At share 1, x leading and y leading give the same four sign pairs (±E:x ± E:y): 5 and 7 drop from 8 to 4
    // rows with every term acting, 32 to 16 with the absent variants of 5 → 191 − 8 = 183 and 369 − 16 − 4 = 349.
    const c = counts(planWith(shipped("asce7-10-strength"), { SDS: 1.1, rho: 1.3 }, headers));
    expect(c.everyTermActing).toEqual([1, 3, 75, 72, 4, 24, 4]);
    expect(c.total).toBe(349);
  });
});

describe("nbcc2020-uls row counts", () => {
  // D, L, S; 4 wind directions, each also reversed: 8 wind cases; E:x, E:y under 100 % + 30 %: 8.
  test("gives 77 rows with every term acting and 161 with companions and principals left out", () => {
    // Every term acting (D at 1.25 or 0.9 in cases 2–4):
    //   1: 1
    //   2: D 2 × 1.5L × (1.0S | 8 × 0.4W) 9 = 18
    //   3: D 2 × 1.5S × ((cL + 0.5)L | 8 × 0.4W) 9 = 18
    //   4: D 2 × 8 W × (0.5L | 0.5S) 2 = 32
    //   5: 8 E (with 0.5L + 0.25S) = 8                       → 77
    // With absent variants:
    //   1: 1;  2: 2 × L 2 × companion 10 = 40;  3: 2 × S 2 × 10 = 40;  4: 2 × 8 × 3 = 48;
    //   5: 8 × L 2 × S 2 = 32                                → 161
    const headers = ["D", "L", "S", "W:1", "W:2", "W:3", "W:4", "E:x", "E:y"];
    const c = counts(planWith(shipped("nbcc2020-uls"), {}, headers));
    expect(c.everyTermActing).toEqual([1, 18, 18, 32, 8]);
    expect(c.perCombination).toEqual([1, 40, 40, 48, 32]);
    expect(c.total).toBe(161);
  });
});

describe("en1990-str-6.10 row counts", () => {
  test("gives 180 rows for G, two imposed load arrangements, snow and two wind directions", () => {
    // G; Q:1, Q:2 (arrangements, one at a time); S; W:N, W:E each also reversed. Q2 and T not supplied,
    // so they neither lead nor accompany. lead(Q, Q2, S, W, T) gives one branch per supplied action:
    // Q, S, W leading. In each: G (1.35 or 1.0) 2 × Q (Q:1, Q:2, absent) 3 × S (S, absent) 2 ×
    // W (±W:N, ±W:E, absent) 5 = 60 rows → 3 × 60 = 180.
    // Every supplied action acting, positive or negative wind: 2 × 2 × 1 × 4 = 16 per branch → 48.
    const plan = planWith(shipped("en1990-str-6.10"), {}, ["G", "Q:1", "Q:2", "S", "W:N", "W:E"]);
    expect(plan.combinations[0].branches.map((b) => b.note)).toEqual(["Q leading", "S leading", "W leading"]);
    const c = counts(plan);
    expect(c.perCombination).toEqual([180]);
    expect(c.everyTermActing).toEqual([48]);
  });
});
