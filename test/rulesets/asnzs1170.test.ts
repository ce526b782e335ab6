/**
 * The shipped AS/NZS 1170.0 strength ruleset. Its sources, cited by short name beside each check:
 *
 * [EWPAA] Engineered Wood Products Association of Australasia, Structural Plywood & LVL Design Manual, worked
 *   example "3. Load Combinations", strength limit state citing AS/NZS 1170.0 Cl. 4.2.2:
 *   https://www.yumpu.com/en/document/view/44952437/ewpaa-structural-plywood-and-lvl-design-manual-engineered-/74
 *   (1.2G + 1.5Q; 1.2G + Wu + ψc·Q; 0.9G + Wu against uplift). It shows the forms, not the clause letters.
 * [memory] The clause letters (a)–(g), the combinations (a), (c), (f), (g) and every factor of Table 4.1: no
 *   public text quoting them was found. Shipped UNVERIFIED.
 */
import { describe, expect, test } from "vitest";
import { findShippedRuleset, resolveParameters } from "../../src/core/index.js";
import { expectPrintedRows, mayBeAbsent, planWith, printedRows, row, rowText, shipped, type FactorRow } from "./factorRows.js";

const CASES = ["G", "Q", "Wu", "Eu", "Su"];

describe("asnzs1170-strength", () => {
  const ruleset = shipped("asnzs1170-strength");

  test("expands to the combinations of §4.2.2 with the factors of an office floor", () => {
    // AS/NZS 1170.0 §4.2.2, lettering [memory]; Table 4.1, offices: ψl 0.4, ψc 0.4, ψE 0.3 [memory].
    const rows: FactorRow[] = [
      row("4.2.2(a)", { G: 1.35 }), // (a) 1.35G [memory]
      row("4.2.2(b)", { G: 1.2, Q: 1.5 }), // (b) 1.2G + 1.5Q [EWPAA]
      row("4.2.2(c)", { G: 1.2, Q: 1.5 * 0.4 }), // (c) 1.2G + 1.5ψl·Q [memory]
      row("4.2.2(d)", { G: 1.2, Wu: 1.0, Q: 0.4 }), // (d) 1.2G + Wu + ψc·Q [EWPAA for the form]
      row("4.2.2(e)", { G: 0.9, Wu: 1.0 }), // (e) 0.9G + Wu [EWPAA for the form]
      row("4.2.2(f)", { G: 1.0, Eu: 1.0, Q: 0.3 }), // (f) G + Eu + ψE·Q [memory]
      row("4.2.2(g)", { G: 1.2, Su: 1.0, Q: 0.4 }), // (g) 1.2G + Su + ψc·Q [memory]
    ];
    expectPrintedRows(planWith(ruleset, { use: "offices" }, CASES), rows);
  });

  test("takes wind both with the imposed action and with it left out, and 0.9G against uplift", () => {
    // [EWPAA]: "1.2G + Wu + ψcQ, Q = 0 under max. downward wind loading"; "Wu↑ − 0.9G". Wu acts both ways.
    const labels = printedRows(planWith(ruleset, { use: "offices" }, ["G", "Q", "Wu"])).map(rowText);
    expect(labels).toContain("4.2.2(d): G 1.2, Q 0.4, Wu 1");
    expect(labels).toContain("4.2.2(e): G 0.9, Wu 1");
    const withoutQ = planWith(ruleset, { use: "offices" }, ["G", "Q", "Wu"]);
    expect(mayBeAbsent(withoutQ)["4.2.2(d)"]).toEqual(["psic*Q"]);
  });

  test.each([
    // AS/NZS 1170.0 Table 4.1 [memory]: ψl / ψc / ψE by use.
    ["residential", 0.4, 0.4, 0.3],
    ["offices", 0.4, 0.4, 0.3],
    ["parking", 0.4, 0.4, 0.3],
    ["retail", 0.4, 0.4, 0.3],
    ["storage", 0.6, 0.6, 0.6],
    ["otherFloors", 0.6, 0.6, 0.6],
    ["roofFloorUse", 0.4, 0.4, 0.3],
    ["otherRoofs", 0, 0, 0],
  ])("use %s gives ψl %s, ψc %s, ψE %s", (use, psil, psic, psiE) => {
    const resolved = resolveParameters(ruleset, { use });
    if (!resolved.ok) throw new Error(JSON.stringify(resolved.problems));
    const n = resolved.value.numbers;
    expect([n.get("psil"), n.get("psic"), n.get("psiE")]).toEqual([psil, psic, psiE]);
  });

  test("lets the imposed action be absent but never the wind, earthquake or snow that defines a combination", () => {
    // [EWPAA]: Q = 0 is taken where that is worse (largest downward wind); the same rule is kept for every Q term [memory].
    expect(mayBeAbsent(planWith(ruleset, {}, CASES))).toEqual({
      "4.2.2(a)": [],
      "4.2.2(b)": ["1.5Q"],
      "4.2.2(c)": ["1.5*psil*Q"],
      "4.2.2(d)": ["psic*Q"],
      "4.2.2(e)": [],
      "4.2.2(f)": ["psiE*Q"],
      "4.2.2(g)": ["psic*Q"],
    });
  });

  test("is shipped as UNVERIFIED, and says which parts are recalled", () => {
    const found = findShippedRuleset("asnzs1170-strength");
    expect(found?.status.verification).toBe("unverified");
    expect(found?.status.fromMemory.some((s) => s.includes("Table 4.1"))).toBe(true);
    expect(found?.status.fromMemory.some((s) => s.includes("§4.2.2"))).toBe(true);
    // No combination counts as confirmed: the lettering of all seven is recalled (docs/rulesets.md, provenance).
    expect(found?.status.combinations.confirmed).toBe(0);
  });
});
