/**
 * A ruleset is hostile input until it loads: beyond the stated limits it is
 * refused at once with its place, a field that could reach an object's
 * prototype is refused wherever it stands, and nothing it holds changes a
 * built-in prototype. Limits: src/core/limits.ts, stated in docs/rulesets.md.
 */
import { describe, expect, test } from "vitest";
import { describeProblem, LIMITS, loadRuleset, rulesetFromRows, RULESET_FORMAT, type RulesetFile } from "../../../src/core/index.js";
import { changedPrototype } from "../../fuzz/robustness.js";

/** A small valid ruleset (ASCE/SEI 7-16 §2.3.1 (2) and (5) [confirmed for the 7-10 list]). */
function base(): RulesetFile {
  return {
    format: RULESET_FORMAT,
    id: "hostile",
    title: "Hostile input tests",
    standard: { name: "ASCE/SEI 7", edition: "2016" },
    version: "1",
    symbols: {
      D: { description: "dead load", permanence: "permanent" },
      L: { description: "live load", permanence: "transient" },
      W: { description: "wind load", permanence: "transient", reversible: true },
    },
    combinations: [
      { id: "2", expression: "1.2D + 1.6L", clause: "§2.3.1 (2)" },
      { id: "5", expression: "0.9D + 1.0W!", clause: "§2.3.1 (5)" },
    ],
    provenance: [{ source: "ASCE/SEI 7-16 §2.3.1", status: "confirmed", covers: "all" }],
    approval: { approvedBy: null, date: null, fingerprint: null },
  };
}

function problemsOf(input: unknown): string[] {
  const result = loadRuleset(input);
  if (result.ok) throw new Error("loaded");
  return result.problems.map((p) => describeProblem(p));
}

/** The base ruleset's text with `inject` written right after its opening brace (or after `after`). */
const injected = (inject: string, after = "{") => JSON.stringify(base()).replace(after, `${after}${inject}`);

describe("the stated limits", () => {
  test("refuses text nested beyond the limit before any recursive reader sees it, with line and column", () => {
    const deep = injected(`"notes": ${"[".repeat(100_000)}${"]".repeat(100_000)},`);
    // The opening "{" is level 1, so the 64th "[" (offset 10 + 63 = 73, column 74) is the 65th level.
    expect(problemsOf(deep)).toEqual(["objects and lists are nested more than 64 deep at line 1, column 74"]);
    // Just within the limit the text is read, and only the schema has something to say.
    const within = problemsOf(injected(`"notes": ${"[".repeat(LIMITS.jsonNesting - 1)}${"]".repeat(LIMITS.jsonNesting - 1)},`));
    expect(within).toEqual(["notes[0]: must be text, not a list"]);
  });

  test("refuses a file over the size limit without reading it", () => {
    const big = injected(`"notes": ["${"x".repeat(LIMITS.rulesetCharacters)}"],`);
    expect(problemsOf(big)).toEqual([`the ruleset file has ${(big.length).toLocaleString("en-US")} characters; at most 262,144 are read`]);
  });

  test("refuses a list or object with more members than the limit, at its path", () => {
    const file = base();
    file.combinations = Array.from({ length: LIMITS.rulesetMembers + 1 }, (_, k) => ({ id: `c${k}`, expression: "1.2D", clause: "x" }));
    expect(problemsOf(file)).toEqual(["combinations: holds 201 entries; at most 200 are read"]);
    file.combinations.pop();
    expect(loadRuleset(file).ok).toBe(true);
  });

  test("refuses an expression beyond the length or nesting limits at its character", () => {
    const file = base();
    file.combinations[0].expression = `${"(".repeat(5_000)}D${")".repeat(5_000)}`;
    expect(problemsOf(file)).toEqual(['combinations[0].expression, combination "2", character 2001: the expression has 10,001 characters; at most 2,000 are read']);
    file.combinations[0].expression = `${"(".repeat(40)}D${")".repeat(40)}`;
    expect(problemsOf(file)).toEqual([
      'combinations[0].expression, combination "2", character 33: brackets, |…|, functions, signs and powers are nested more than 32 deep here',
    ]);
  });
});

describe("fields that reach prototypes", () => {
  test.each([
    ['"__proto__": {"polluted": true},', "{", "__proto__: "],
    ['"constructor": {"prototype": {"polluted": true}},', "{", "constructor: "],
    ['"__proto__": {"description": "x", "permanence": "permanent"},', '"symbols":{', "symbols.__proto__: "],
    ['"prototype": 1,', '"D":{', "symbols.D.prototype: "],
  ])("refuses %s wherever it stands, by its path", (inject, after, place) => {
    const problems = problemsOf(injected(inject, after));
    expect(problems.some((p) => p.startsWith(place) && p.includes("is refused"))).toBe(true);
    expect(changedPrototype()).toBeNull();
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  test("refuses them in nested fields of a value as the add-in's store gives it", () => {
    const value = JSON.parse(injected("")) as Record<string, Record<string, unknown>>;
    Object.defineProperty(value.symbols.D, "prototype", { value: { x: 1 }, enumerable: true });
    const choices = JSON.parse('{"A": {"psi0": 0.7}, "__proto__": {"psi0": 0.3}}') as unknown;
    value.parameters = { cat: { type: "choice", description: "category", default: "A", choices } } as unknown as Record<string, unknown>;
    expect(problemsOf(value)).toEqual([
      'symbols.D.prototype: the field name "prototype" is refused: a program copying fields by name would change an object\'s prototype with it',
      'parameters.cat.choices.__proto__: the field name "__proto__" is refused: a program copying fields by name would change an object\'s prototype with it',
    ]);
    expect(changedPrototype()).toBeNull();
  });

  test("takes a choice parameter's default only from its own choices, not from what every object has", () => {
    const file = base() as RulesetFile & { parameters: Record<string, unknown> };
    file.parameters = { cat: { type: "choice", description: "category", default: "toString", choices: { A: { psi0: 0.7 } } } };
    expect(problemsOf(file)).toEqual(['parameters.cat.default: default "toString" is not one of the choices (A)']);
  });

  test("refuses a typed ruleset whose names are what every object has", () => {
    // "constructor" is no load symbol of the catalogue; it would be a parameter named after a field of every object.
    const r = rulesetFromRows([["1", "1.2constructor*D", "x"]]);
    expect(r.ok ? [] : r.problems.map((p) => describeProblem(p))).toEqual(['combination "1", character 4, cell B1: "constructor" cannot name a load symbol or a parameter']);
  });
});
