import { describe, expect, test } from "vitest";
import type { Arith, Sum, Term } from "../../../src/core/expression/ast.js";
import { parseExpression, type NameClassifier } from "../../../src/core/expression/parser.js";

const SYMBOLS = ["D", "G", "L", "Lr", "S", "R", "W", "E", "Q", "T"];
const VALUES = ["SDS", "rho", "psi0", "psi1", "psi2", "fL"];
const names: NameClassifier = {
  kind: (n) => (SYMBOLS.includes(n) ? "symbol" : VALUES.includes(n) ? "value" : "unknown"),
  symbols: () => SYMBOLS,
  values: () => VALUES,
};

function parse(text: string): Sum {
  const result = parseExpression(text, names);
  if (!result.ok) throw new Error(`${text}: ${result.error.message} at ${result.error.position}`);
  return result.sum;
}

function failure(text: string) {
  const result = parseExpression(text, names);
  if (result.ok) throw new Error(`${text} parsed`);
  return result.error;
}

/** A factor written back plainly, to compare structure without spans. */
function show(a: Arith | null): string {
  if (!a) return "1";
  switch (a.kind) {
    case "number":
      return String(a.value);
    case "name":
      return a.name;
    case "negate":
      return `-(${show(a.operand)})`;
    case "binary":
      return `(${show(a.left)} ${a.op} ${show(a.right)})`;
    case "choice":
      return `{${a.options.map(show).join(" | ")}}`;
    case "call":
      return `${a.fn}(${a.args.map(show).join(", ")})`;
  }
}

function bodyOf(t: Term): string {
  switch (t.body.kind) {
    case "symbol":
      return t.body.name;
    case "group":
      return `(${t.body.alternatives.map((alt) => alt.terms.map((x) => `${x.sign}${show(x.factor)}·${bodyOf(x)}`).join(" ")).join(" or ")})`;
    case "lead":
      return `lead[${t.body.symbols.map((s) => s.name).join(",")}]`;
    case "others":
      return "others";
  }
}

const terms = (text: string) => parse(text).terms.map((t) => `${t.sign}${show(t.factor)}·${bodyOf(t)}${t.presence ? `:${t.presence}` : ""}`);

describe("parseExpression", () => {
  test.each([
    // Forms as printed in ASCE/SEI 7-16 §2.3.1 and §2.3.6 (the list as ASCE/SEI 7-10 §2.3.2, public copy https://www.scribd.com/document/611469328 prints it; the seismic forms as the Santa Ana report applies them).
    ["1.4D", ["+1.4·D"]],
    ["1.2D + 1.6L + 0.5(Lr or S or R)", ["+1.2·D", "+1.6·L", "+0.5·(+1·Lr or +1·S or +1·R)"]],
    ["1.2D + 1.6(Lr or S or R) + (L or 0.5W)", ["+1.2·D", "+1.6·(+1·Lr or +1·S or +1·R)", "+1·(+1·L or +0.5·W)"]],
    ["0.9D + 1.0W", ["+0.9·D", "+1·W"]],
    ["(1.2 + 0.2*SDS)D + rho*E + L + 0.2S", ["+(1.2 + (0.2 * SDS))·D", "+rho·E", "+1·L", "+0.2·S"]],
    ["(0.9 - 0.2SDS)D + rho E", ["+(0.9 - (0.2 * SDS))·D", "+rho·E"]],
    // ASD: D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R), ASCE/SEI 7-16 §2.4.1 [confirmed for the 7-10 list].
    ["D + 0.75L + 0.75(0.6W) + 0.75(Lr or S or R)", ["+1·D", "+0.75·L", "+0.75·(+0.6·W)", "+0.75·(+1·Lr or +1·S or +1·R)"]],
    // EN 1990 Table A1.2(B): γG,sup / γG,inf pair [confirmed].
    ["(1.35 or 1.0)G + 1.5*lead(Q, S, W) + 1.5*psi0*others", ["+{1.35 | 1}·G", "+1.5·lead[Q,S,W]", "+((1.5 * psi0))·others".replace("((1.5 * psi0))", "(1.5 * psi0)")]],
    ["G + (psi1 or psi2)*lead(Q, S) + psi2*others", ["+1·G", "+{psi1 | psi2}·lead[Q,S]", "+psi2·others"]],
  ])("reads %s", (text, expected) => {
    expect(terms(text)).toEqual(expected);
  });

  test("reads signs: minus, ± and +- both ways", () => {
    expect(terms("0.9D - 1.0W")).toEqual(["+0.9·D", "-1·W"]);
    expect(terms("D ± 0.5T")).toEqual(["+1·D", "±0.5·T"]);
    expect(terms("D +- 0.5T")).toEqual(["+1·D", "±0.5·T"]);
    expect(terms("± W")).toEqual(["±1·W"]);
    expect(terms("-0.5W + D")).toEqual(["-0.5·W", "+1·D"]);
  });

  test("reads the marks ! and ?", () => {
    expect(terms("0.9D + 1.0W! + 0.5T?")).toEqual(["+0.9·D", "+1·W:must", "+0.5·T:may"]);
    expect(terms("0.5(Lr or S)?")).toEqual(["+0.5·(+1·Lr or +1·S):may"]);
  });

  test("reads typographic signs copied from a printed code", () => {
    expect(terms("1.2D \u2212 1.0W")).toEqual(["+1.2·D", "-1·W"]);
    expect(terms("1.5\u00d7Q + 1.2\u00b7D")).toEqual(["+1.5·Q", "+1.2·D"]);
    expect(terms("D \u00b1 W")).toEqual(["+1·D", "±1·W"]);
  });

  test("reads 1.0E as 1.0 times E, not as a number in exponent notation", () => {
    expect(terms("1.0E")).toEqual(["+1·E"]);
  });

  test("reads alternatives that hold sums and nested brackets", () => {
    expect(terms("(L + 0.5S or W)")).toEqual(["+1·(+1·L +0.5·S or +1·W)"]);
    expect(terms("0.75(0.6W + (L or S))")).toEqual(["+0.75·(+0.6·W +1·(+1·L or +1·S))"]);
  });

  test("keeps the spans of terms for messages", () => {
    const sum = parse("1.2D + 0.5(Lr or S)");
    expect(sum.terms[1].body.span).toEqual({ start: 11, end: 20 });
    expect(sum.terms[1].factor?.span).toEqual({ start: 8, end: 11 });
  });
});

describe("parseExpression refuses", () => {
  test.each([
    ["1.2D + ", 8, "expected a load symbol before the end of the expression"],
    ["1.2D + 1.6X", 11, 'unknown name "X"'],
    ["1.2d + 1.6L", 4, 'did you mean "D"?'],
    ["1.2D + 1.3rhoE", 11, 'did you mean "rho*E"?'],
    ["1.2D or 0.9D", 6, '"or" separates alternatives inside brackets'],
    ["0.5(Lr or S", 4, 'this "(" is not closed'],
    ["1.2D + 1,6L", 9, "write decimals with a point"],
    ["1.2.3D", 4, '"1.2." is not a number'],
    ["W/2", 2, "a factor goes before the load symbol"],
    ["1.2D + 1.6", 8, 'the factor "1.6" multiplies no load symbol'],
    ["1.2D + 1.6 rho", 12, '"rho" is not a load symbol of this ruleset'],
    ["lead(Q, Q)", 9, '"Q" is listed twice'],
    ["1.2D + $", 8, 'unexpected character "$"'],
    ["1.2D!!", 6, "a term takes one mark at most"],
    ["1.2D + -0.5W", 8, "a sign goes between terms"],
    ["(1.2 + D)", 2, 'the factor "1.2" multiplies no load symbol'],
    ["1.2D)", 5, 'this ")" has no matching "("'],
    ["", 1, "the expression is empty"],
    ["lead Q", 6, "write the leading actions in brackets"],
    ["(1.2 ± 0.2)D", 6, '"±" marks a term acting both ways'],
  ])("%s at character %i", (text, position, message) => {
    const error = failure(text);
    expect(error.message).toContain(message);
    expect(error.position).toBe(position);
  });

  test("lists the symbols and values an unknown name could have been", () => {
    expect(failure("1.2D + 1.6X").message).toBe(
      'unknown name "X": not a load symbol or value of this ruleset (symbols: D, G, L, Lr, S, R, W, E, Q, T; values: SDS, rho, psi0, psi1, psi2, fL)',
    );
  });
});
