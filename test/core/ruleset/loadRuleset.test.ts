import { describe, expect, test } from "vitest";
import { rulesetFile } from "../../support/rulesetFile.js";
import { describeProblem, loadRuleset, type RulesetFile } from "../../../src/core/index.js";

/** A small valid ruleset (factors from ASCE/SEI 7-16 §2.3.1 (2) and (5) [confirmed for the 7-10 list]). */
function base(): RulesetFile {
  return rulesetFile({
    id: "test-strength",
    title: "Test strength combinations",
    standard: { name: "ASCE/SEI 7", edition: "2016" },
    version: "1",
    symbols: {
      D: { description: "dead load", permanence: "permanent" },
      L: { description: "live load", permanence: "transient", attributes: { psi0: 0.7 } },
      W: { description: "wind load", permanence: "transient", reversible: true },
    },
    parameters: {
      fL: { type: "number", description: "factor on L", default: 1, allowed: [0.5, 1] },
    },
    combinations: [
      { id: "2", expression: "1.2D + 1.6L", clause: "§2.3.1 (2)" },
      { id: "5", expression: "0.9D + 1.0W!", clause: "§2.3.1 (5)" },
    ],
    provenance: [{ source: "ASCE/SEI 7-16 §2.3.1", status: "confirmed", covers: "all" }],
  });

}

function problemsOf(input: unknown): string[] {
  const result = loadRuleset(input);
  if (result.ok) throw new Error("loaded");
  return result.problems.map((p) => describeProblem(p));
}

describe("loadRuleset", () => {
  test("loads a valid ruleset from an object and from JSON text alike", () => {
    const fromObject = loadRuleset(base());
    const fromText = loadRuleset(JSON.stringify(base()));
    expect(fromObject.ok && fromText.ok).toBe(true);
    if (!fromObject.ok) return;
    expect(fromObject.value.symbols.map((s) => s.name)).toEqual(["D", "L", "W"]);
    expect(fromObject.value.combinations.map((c) => c.id)).toEqual(["2", "5"]);
    // Defaults: permanent → cases summed, not absent; transient → each, may be absent.
    const [D, L, W] = fromObject.value.symbols;
    expect([D.cases, D.canBeAbsent, L.cases, L.canBeAbsent, W.reversible]).toEqual(["sum", false, "each", true, true]);
  });

  test("names the line and column of a JSON syntax error", () => {
    expect(problemsOf('{\n  "format": "loadwright-ruleset/1",\n  "id": oops\n}')).toEqual([
      "not valid JSON: unexpected text at line 3, column 9",
    ]);
  });

  test("refuses a field written twice in one object, which JSON.parse would silently keep the last of", () => {
    const text = '{"format": "loadwright-ruleset/1",\n "id": "a",\n "id": "b"}';
    expect(problemsOf(text)).toEqual(['id: field "id" is written twice in one object (line 3, column 2); JSON keeps only the last, so say which is meant']);
  });

  test("refuses an unknown field and suggests the one meant", () => {
    const file = base() as unknown as { symbols: { W: Record<string, unknown> } };
    file.symbols.W.reversable = true;
    expect(problemsOf(file)).toEqual(['symbols.W.reversable: unknown field "reversable"; did you mean "reversible"?']);
  });

  test("lists the fields allowed where an unknown one has no close match", () => {
    const file = { ...base(), colour: "red" };
    expect(problemsOf(file)[0]).toMatch(/^colour: unknown field "colour" \(allowed here: format, id, title, standard, basis, version, symbols, parameters, combinations, notes, provenance, approval\)$/);
  });

  test("names wrong types, missing fields and bad enumerations by their path", () => {
    const file = base() as unknown as Record<string, unknown> & { symbols: { D: Record<string, unknown> }; combinations: Record<string, unknown>[] };
    file.symbols.D.permanence = "perm";
    file.combinations[1].clause = 5;
    delete file.approval;
    expect(problemsOf(file).sort()).toEqual(
      [
        'symbols.D.permanence: must be "permanent" or "transient", not the text "perm"',
        "combinations[1].clause: must be text, not number 5",
        "approval: is required (an object)",
      ].sort(),
    );
  });

  test("refuses a second format or version of the file", () => {
    expect(problemsOf({ ...base(), format: "other/2" })).toEqual(['format: must be "loadwright-ruleset/1", not the text "other/2"']);
  });

  test("names a duplicate combination id", () => {
    const file = base();
    file.combinations[1].id = "2";
    expect(problemsOf(file)).toEqual(['combinations[1].id, combination "2": combination id "2" is already used by combinations[0]']);
  });

  test("refuses a name used for two things, and words of the language as names", () => {
    const file = base();
    file.parameters = { ...file.parameters, D: { type: "number", description: "clash", default: 1 } };
    file.symbols = { ...file.symbols, or: { description: "a word", permanence: "transient" } };
    expect(problemsOf(file).sort()).toEqual(
      ['parameters.D: "D" already names the load symbol D; it cannot also name the parameter D', 'symbols.or: "or" is a word of the expression language and cannot name the load symbol or'].sort(),
    );
  });

  test("checks a parameter's default against its range and allowed values", () => {
    const file = base();
    file.parameters = {
      fL: { type: "number", description: "factor on L", default: 0.75, allowed: [0.5, 1] },
      SDS: { type: "number", description: "design spectral acceleration", default: 4, min: 0, max: 3 },
    };
    expect(problemsOf(file).sort()).toEqual(
      ["parameters.SDS.default: default 4 of SDS is outside 0 … 3", "parameters.fL.default: default 0.75 of fL is not one of 0.5, 1"].sort(),
    );
  });

  test("requires every choice of a choice parameter to set the same values, and a default among them", () => {
    const file = base();
    file.parameters = {
      catQ: {
        type: "choice",
        description: "category of imposed load (EN 1990 Table A1.1)",
        default: "Z",
        choices: { A: { psi0_Q: 0.7, psi1_Q: 0.5 }, E: { psi0_Q: 1.0 } },
      },
    };
    expect(problemsOf(file).sort()).toEqual(
      [
        'parameters.catQ.choices.E: every choice must set the same values as "A" (psi0_Q, psi1_Q); missing psi1_Q',
        'parameters.catQ.default: default "Z" is not one of the choices (A, E)',
      ].sort(),
    );
  });

  test("names the combination and character of an expression that does not parse", () => {
    const file = base();
    file.combinations[0].expression = "1.2D + 1.6LL";
    expect(problemsOf(file)).toEqual([
      'combinations[0].expression, combination "2", character 11: unknown name "LL": not a load symbol or value of this ruleset (symbols: D, L, W; values: fL, psi0)',
    ]);
  });

  test("refuses an attribute in a factor on a symbol that lacks it", () => {
    const file = base();
    file.combinations[0].expression = "1.2D + 1.5*psi0*(L or D)";
    expect(problemsOf(file)).toEqual(['combinations[0].expression, combination "2", character 12: the load symbol D has no attribute "psi0" for this factor']);
  });

  test("refuses others without lead, lead inside brackets and two leads", () => {
    const file = base();
    file.combinations = [
      { id: "a", expression: "D + others", clause: "x" },
      { id: "b", expression: "D + (lead(L, W) or L)", clause: "x" },
      { id: "c", expression: "D + lead(L) + lead(W)", clause: "x" },
    ];
    expect(problemsOf(file)).toEqual([
      'combinations[0].expression, combination "a", character 5: "others" needs a lead(…) in the same combination',
      'combinations[1].expression, combination "b", character 6: lead(…) must stand at the top level of the combination, not inside brackets',
      'combinations[2].expression, combination "c", character 15: a combination takes one lead(…) at most',
    ]);
  });

  test("refuses an orthogonal share on a symbol whose cases are not combined orthogonally", () => {
    const file = base();
    file.symbols.W = { ...file.symbols.W, orthogonalShare: 0.3 };
    expect(problemsOf(file)).toEqual(['symbols.W.orthogonalShare: only applies with "cases": "orthogonal"']);
  });

  test("collects every problem of a file in one pass", () => {
    const file = base();
    file.combinations[0].expression = "1.2D +";
    file.combinations[1].expression = "0.9D + 1.0X";
    expect(problemsOf(file)).toHaveLength(2);
  });

  test("does not change the object it reads", () => {
    const file = base();
    const copy = JSON.parse(JSON.stringify(file));
    loadRuleset(file);
    expect(file).toEqual(copy);
  });
});
