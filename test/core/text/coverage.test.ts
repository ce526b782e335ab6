/**
 * How much of a ruleset its sources vouch for (docs/rulesets.md, "Rulesets": a
 * combination counts as confirmed where a confirmed source lists it and no
 * from-memory one does), and what a plan leaves out, as the catalogue words them.
 * Counts below are by hand from the rulesets written here.
 */
import { describe, expect, test } from "vitest";
import {
  coverageText,
  fromMemoryTexts,
  loadRuleset,
  omissionTexts,
  planCombinations,
  planOmissions,
  resolveParameters,
  rulesetStatus,
  type Ruleset,
  type RulesetFile,
} from "../../../src/core/index.js";
import { rulesetFile } from "../../support/rulesetFile.js";

/** ASCE/SEI 7-16 §2.3.1 (1)–(5) and §2.3.6 (6), (7) as written in the shipped list [7-10 text confirmed; numbering memory]. */
const COMBINATIONS = ["1.4D", "1.2D + 1.6L", "1.2D + 1.6S + (L or 0.5W)", "1.2D + 1.0W! + L + 0.5S", "0.9D + 1.0W!", "1.2D + 1.0E! + L", "0.9D + 1.0E!"].map((expression, i) => ({
  id: String(i + 1),
  expression,
  clause: i < 5 ? `§2.3.1 (${i + 1})` : `§2.3.6 (${i + 1})`,
}));

function ruleset(provenance: RulesetFile["provenance"]): Ruleset {
  const loaded = loadRuleset(
    rulesetFile({
      symbols: {
        D: { description: "dead load", permanence: "permanent" },
        L: { description: "live load", permanence: "transient" },
        S: { description: "snow load", permanence: "transient" },
        W: { description: "wind load", permanence: "transient", reversible: true },
        E: { description: "earthquake load", permanence: "transient", reversible: true },
      },
      combinations: COMBINATIONS,
      provenance,
    }),
  );
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.problems));
  return loaded.value;
}

describe("coverageText", () => {
  test("counts the combinations a confirmed source lists and no from-memory one leaves open", () => {
    const r = ruleset([
      { source: "the 7-10 list", status: "confirmed", covers: "combinations 1 to 5", combinations: ["1", "2", "3", "4", "5"] },
      { source: "the seismic forms", status: "confirmed", covers: "6 and 7", combinations: ["6", "7"] },
      { source: "the numbering", status: "from-memory", covers: "which number each combination has", combinations: ["3", "4"] },
    ]);
    // Seven listed as confirmed, 3 and 4 left open by the from-memory source: 5 of 7.
    expect(coverageText(rulesetStatus(r).combinations)).toBe("5 of 7 combinations confirmed; not confirmed: 3, 4");
  });

  test("says none is confirmed where no source lists its combinations", () => {
    const r = ruleset([{ source: "the 7-10 list", status: "confirmed", covers: "all combinations" }]);
    expect(coverageText(rulesetStatus(r).combinations)).toBe("0 of 7 combinations confirmed; not confirmed: 1, 2, 3, 4, 5, 6, 7");
  });

  test("says what each from-memory source covers and which combinations it leaves open", () => {
    const r = ruleset([
      { source: "the 7-10 list", status: "confirmed", covers: "combinations 1 to 5" },
      { source: "ASCE/SEI 7-16 §2.3.6", status: "from-memory", covers: "the seismic forms", combinations: ["6", "7"] },
    ]);
    expect(fromMemoryTexts(r.file)).toEqual(["ASCE/SEI 7-16 §2.3.6 (the seismic forms; combinations 6, 7)"]);
    expect(rulesetStatus(r).fromMemory).toEqual(fromMemoryTexts(r.file));
  });
});

describe("planOmissions", () => {
  test("gives the combinations without rows and the symbols the table lacks, as data and in words", () => {
    const r = ruleset([{ source: "the 7-10 list", status: "confirmed", covers: "all" }]);
    const values = resolveParameters(r, {});
    if (!values.ok) throw new Error("parameters");
    const plan = planCombinations(r, values.value, { cases: [{ header: "D", symbol: "D" }, { header: "L", symbol: "L" }, { header: "W", symbol: "W" }] });
    if (!plan.ok) throw new Error("plan");
    const omissions = planOmissions(plan.value);
    // "E!" must act, and the table has no E case: 6 and 7 give no rows. S is used by 3 and 4 and has no case.
    expect(omissions.skipped.map((s) => s.combination)).toEqual(["6", "7"]);
    expect(omissions.notSupplied).toEqual(["S"]);
    const texts = omissionTexts(omissions);
    expect(texts[0]).toMatch(/^combination 6 \(§2\.3\.6 \(6\)\) gives no rows: /);
    expect(texts.at(-1)).toBe("no case of S in the case table; their terms contribute nothing");
  });
});
