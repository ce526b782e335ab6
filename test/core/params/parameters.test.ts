import { describe, expect, test } from "vitest";
import { rulesetFile } from "../../support/rulesetFile.js";
import { describeProblem, loadRuleset, parameterPairs, planCombinations, parseParameterText, resolveParameters, type Result, type RulesetFile } from "../../../src/core/index.js";

/** Parameters as ASCE/SEI 7-16 and EN 1990 use them; the sources of the values stand beside them. */
const file: RulesetFile = rulesetFile({
  id: "params-test",
  title: "parameters test",
  standard: { name: "test", edition: "-" },
  version: "1",
  symbols: {
    D: { description: "dead", permanence: "permanent" },
    Q: { description: "imposed", permanence: "transient", attributes: { psi0: "psi0_Q" } },
  },
  parameters: {
    SDS: { type: "number", description: "design spectral response acceleration, short periods", min: 0, max: 3 },
    rho: { type: "number", description: "redundancy factor", default: 1.0, allowed: [1.0, 1.3] },
    catQ: {
      type: "choice",
      description: "category of imposed load, EN 1990 Table A1.1",
      default: "A",
      // EN 1990 Table A1.1 [confirmed]: A 0.7/0.5/0.3; E 1.0/0.9/0.8.
      choices: { A: { psi0_Q: 0.7, psi1_Q: 0.5, psi2_Q: 0.3 }, E: { psi0_Q: 1.0, psi1_Q: 0.9, psi2_Q: 0.8 } },
    },
  },
  combinations: [{ id: "6", expression: "(1.2 + 0.2*SDS)D + rho*psi0*Q", clause: "test" }],
  provenance: [{ source: "test", status: "confirmed", covers: "all" }],
});
const loaded = loadRuleset(file);
if (!loaded.ok) throw new Error(JSON.stringify(loaded.problems));
const ruleset = loaded.value;

function messages<T>(r: Result<T>): string[] {
  return r.ok ? [] : r.problems.map((p) => describeProblem(p));
}

describe("parseParameterText", () => {
  test("reads name=value pairs separated by semicolons or new lines", () => {
    expect(parseParameterText("SDS=1.2; rho = 1.3\ncatQ=E")).toEqual({ ok: true, value: { SDS: 1.2, rho: 1.3, catQ: "E" } });
    expect(parseParameterText("")).toEqual({ ok: true, value: {} });
  });

  test("names the character of a pair it cannot read", () => {
    expect(messages(parseParameterText("SDS=1.2; rho"))).toEqual(['character 10: "rho" is not name=value']);
    expect(messages(parseParameterText("SDS=; 2x=1"))).toEqual(["character 5: SDS has no value after \"=\"", 'character 7: "2x" is not a parameter name']);
    expect(messages(parseParameterText("SDS=1; SDS=2"))).toEqual(["character 8: SDS is given twice"]);
  });
});

describe("parameterPairs", () => {
  test("reads a two-column range, skipping blank rows", () => {
    expect(parameterPairs([["SDS", 1.1], [null, null], ["catQ", "E"], ["rho", "1.3"]])).toEqual({ ok: true, value: { SDS: 1.1, catQ: "E", rho: 1.3 } });
  });

  test("names the cell of an empty value, a boolean or a repeated name", () => {
    expect(messages(parameterPairs([["SDS", null]]))).toEqual(["cell B1: SDS has no value"]);
    expect(messages(parameterPairs([["SDS", true]]))).toEqual(["cell B1: SDS is TRUE, not a number or a choice"]);
    expect(messages(parameterPairs([["SDS", 1], ["SDS", 2]]))).toEqual(["cell A2: SDS is given twice"]);
  });
});

describe("resolveParameters", () => {
  test("takes given values, defaults, and the values a choice sets", () => {
    const r = resolveParameters(ruleset, { SDS: 1.1, catQ: "E" });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(Object.fromEntries(r.value.numbers)).toEqual({ SDS: 1.1, rho: 1.0, psi0_Q: 1.0, psi1_Q: 0.9, psi2_Q: 0.8 });
    expect(r.value.choices.get("catQ")).toBe("E");
    expect([...r.value.given].sort()).toEqual(["SDS", "catQ"]);
  });

  test("refuses an unknown name, suggesting the one meant", () => {
    expect(messages(resolveParameters(ruleset, { SDS: 1, Rho: 1.3 }))).toEqual(['unknown parameter "Rho"; did you mean "rho"? (parameters of params-test: SDS, rho, catQ)']);
  });

  test("leaves a parameter without default to the combinations that read it", () => {
    const r = resolveParameters(ruleset, {});
    expect(r.ok && Object.fromEntries(r.value.missing)).toEqual({ SDS: "design spectral response acceleration, short periods" });
    // Planned, the combination that reads SDS is refused at the character where it reads it.
    if (!r.ok) return;
    const plan = planCombinations(ruleset, r.value, { cases: null });
    expect(messages(plan)).toEqual(['combination "6", character 12: parameter SDS has no default; give its value (design spectral response acceleration, short periods)']);
  });

  test("refuses values outside the range, outside the allowed list, not numbers, or not a choice", () => {
    expect(messages(resolveParameters(ruleset, { SDS: 3.5, rho: 1.2, catQ: "Z" }))).toEqual([
      "parameter SDS = 3.5 is outside its allowed range 0 … 3",
      "parameter rho = 1.2 is not one of the allowed values 1, 1.3",
      'parameter catQ = "Z" is not one of its choices: A, E',
    ]);
    expect(messages(resolveParameters(ruleset, { SDS: "high" }))).toEqual(['parameter SDS must be a number, not "high"']);
  });
});
