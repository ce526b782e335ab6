/**
 * The arithmetic every expression shares, in a combination's factors: the
 * functions and powers criteria use are read and valued the same way there,
 * refused the same way where they have no value, and written back as a
 * checker reads them. Every value is worked out by hand beside its check.
 */
import { describe, expect, test } from "vitest";
import {
  describeProblem,
  explain,
  LIMITS,
  planForTable,
  readCaseTable,
  rulesetFromRows,
  type Cell,
  type Result,
} from "../../../src/core/index.js";
import { parseExpression, type NameClassifier } from "../../../src/core/expression/parser.js";

/** A typed ruleset of one combination, planned on a table where D = 100 and E = 10 (values invented; E only where used). */
function planned(expression: string, params: Record<string, number>) {
  const ruleset = rulesetFromRows([["x", expression, "invented"]]);
  if (!ruleset.ok) return ruleset;
  const rows: Cell[][] = [
    ["", "P"],
    ["D", 100],
    ["E", 10],
  ];
  const table = readCaseTable(
    rows.filter((r, k) => k === 0 || ruleset.value.symbolByName.has(String(r[0]))),
    ruleset.value,
  );
  if (!table.ok) throw new Error("the table does not read");
  const plan = planForTable(ruleset.value, params, table.value);
  return plan.ok ? { ok: true as const, value: { plan: plan.value, table: table.value } } : plan;
}

function messages<T>(r: Result<T>): string[] {
  return r.ok ? [] : r.problems.map((p) => describeProblem(p));
}

function explained(expression: string, params: Record<string, number>, row: number): string[] {
  const p = planned(expression, params);
  if (!p.ok) throw new Error(messages(p).join("; "));
  const e = explain(p.value.plan, p.value.table, row, "P");
  if (!e.ok) throw new Error(messages(e).join("; "));
  return e.value.text;
}

describe("functions and powers in a factor", () => {
  test("max(a, b) takes the larger: max(1.2, 0.9 + 0.2·SDS) on D", () => {
    // SDS = 2: 0.9 + 0.2 × 2 = 1.3 > 1.2, so 1.3D = 130; with E: 130 + 1.0 × 10 = 140 (values invented).
    expect(explained("max(1.2, 0.9 + 0.2*SDS)D + 1.0E!", { SDS: 2 }, 1)).toEqual([
      "x: 1.3D + E",
      "combination x (invented): max(1.2, 0.9 + 0.2*SDS)D + 1.0E!",
      "P = 1.3 × 100 [D] + 1 × 10 [E]",
      "  = 130 + 10",
      "  = 140",
      "factor 1.3 on D = max(1.2, 0.9 + 0.2 × SDS)",
      "factor 1 on E = 1",
      "parameters: SDS = 2 (given)",
    ]);
    // SDS = 1: 0.9 + 0.2 = 1.1 < 1.2, so 1.2D.
    expect(explained("max(1.2, 0.9 + 0.2*SDS)D + 1.0E!", { SDS: 1 }, 1)[2]).toBe("P = 1.2 × 100 [D] + 1 × 10 [E]");
  });

  test("sqrt, powers and |…| on parameters, juxtaposed as printed factors are", () => {
    // 0.5·√2.25 = 0.75 on D; 2.25^0.5 = 1.5 on E; 75 + 15 = 90.
    const text = explained("0.5sqrt(SDS)D + SDS^0.5 E!", { SDS: 2.25 }, 1);
    expect(text.slice(2, 7)).toEqual(["P = 0.75 × 100 [D] + 1.5 × 10 [E]", "  = 75 + 15", "  = 90", "factor 0.75 on D = 0.5 × sqrt(SDS)", "factor 1.5 on E = SDS ^ 0.5"]);
    // |−1.3| = 1.3 on E; the negative base of a power keeps its brackets when written back: (-b) ^ 2 = 4 on D.
    const abs = explained("(-b)^2 D + |rho|E!", { b: 2, rho: -1.3 }, 1);
    expect(abs.slice(5, 7)).toEqual(["factor 4 on D = (-b) ^ 2", "factor 1.3 on E = abs(rho)"]);
  });

  test("refuses a parameter value that leaves a factor without a value, at its character", () => {
    expect(messages(planned("sqrt(b)D", { b: -1 }))).toEqual(['combination "x", character 1: the square root of a negative number (-1) in the factor on D']);
    expect(messages(planned("b^-1 D", { b: 0 }))).toEqual(['combination "x", character 1: 0 to the power -1 is a division by zero in the factor on D']);
    expect(messages(planned("(-b)^0.5 D", { b: 8 }))).toEqual(['combination "x", character 6: -8 to the power 0.5 is not a real number (a negative number to a fractional power) in the factor on D']);
    // 10^200 × 10^200 = 10^400, beyond the largest double (about 1.8 × 10^308).
    expect(messages(planned("(b*b)D", { b: 1e200 }))[0]).toBe('combination "x", character 1: the result is too large to compute with in the factor on D');
  });
});

const SYMBOLS = ["D", "L", "W", "E"];
const VALUES = ["SDS", "rho", "b"];
const names: NameClassifier = {
  kind: (n) => (SYMBOLS.includes(n) ? "symbol" : VALUES.includes(n) ? "value" : "unknown"),
  symbols: () => SYMBOLS,
  values: () => VALUES,
};

function failure(text: string) {
  const r = parseExpression(text, names);
  if (r.ok) throw new Error(`${text.slice(0, 40)} parsed`);
  return r.error;
}

describe("an expression refused as it is read", () => {
  test.each([
    ["(1/0)D", 4, "division by zero"],
    ["1.2D + sqrt(-4)L", 8, "the square root of a negative number (-4)"],
    ["(b/(1 - 1))D", 4, "division by zero"],
    [`${"9".repeat(400)}D`, 1, "is too large to compute with"],
    // 10^200 × 10^200 = 10^400, beyond the largest double (about 1.8 × 10^308): refused at the bracket holding the product.
    [`(1${"0".repeat(200)} * 1${"0".repeat(200)})D`, 1, "the result is too large to compute with"],
    ["max(1.2)D", 1, "max(…) takes two or more values"],
    ["sqrt(1, 2)D", 1, "sqrt(…) takes one value, not 2"],
    ["[C1 top]", 1, "square brackets name a component in a criterion"],
    ["max(1.2, D)", 10, 'the load symbol "D" cannot stand inside a factor\'s brackets'],
  ])("%s at character %i", (text, position, message) => {
    const error = failure(text);
    expect(error.message).toContain(message);
    expect(error.position).toBe(position);
  });
});

describe("the stated limits", () => {
  test(`an expression holds at most ${LIMITS.expressionCharacters} characters`, () => {
    const long = "1.2D + ".repeat(400).slice(0, LIMITS.expressionCharacters + 1);
    expect(failure(long)).toEqual({ position: 2_001, message: "the expression has 2,001 characters; at most 2,000 are read", kind: "syntax" });
    expect(parseExpression(`${"1.2D + ".repeat(285)}1.2D`, names).ok).toBe(true); // 1,999 characters
  });

  test(`brackets nest at most ${LIMITS.expressionNesting} deep, in a body or a factor`, () => {
    const deep = (n: number, core: string) => `${"(".repeat(n)}${core}${")".repeat(n)}`;
    expect(parseExpression(deep(32, "D"), names).ok).toBe(true);
    expect(failure(deep(33, "D"))).toEqual({ position: 33, message: "brackets, |…|, functions, signs and powers are nested more than 32 deep here", kind: "syntax" });
    expect(failure(`${deep(40, "1.2")}D`).position).toBe(33);
    // Signs count as nesting: the bracket and 31 signs fill the 32 levels; the 32nd sign, character 33, is refused.
    expect(failure(`(${"-".repeat(40)}1)D`).position).toBe(33);
    // The defect this limit mends: 5,000 nested brackets overflowed the stack; now the length refuses them first.
    expect(failure(deep(5_000, "D")).message).toBe("the expression has 10,001 characters; at most 2,000 are read");
  });

  test(`the choices of one expression's factors can be taken at most ${LIMITS.factorChoices} ways`, () => {
    // 2^9 = 512 ways are read; 2^10 = 1,024 are more than 1,000, refused at the tenth choice (character 1 + 9 × 8 = 73).
    expect(parseExpression(`${"(1 or 2)".repeat(9)}D`, names).ok).toBe(true);
    expect(failure(`${"(1 or 2)".repeat(10)}D`)).toEqual({ position: 73, message: `the factors' "(a or b)" choices can be taken more than 1,000 ways together`, kind: "syntax" });
  });
});
