/**
 * Fuzz target: the combination expression parser (parseExpression), and the
 * arithmetic evaluator on every factor it accepts, with parameter values that
 * divide by zero, overflow and go negative. A refusal must name a character of
 * the text; a fault of the arithmetic too.
 */
import { describe } from "vitest";
import type { Arith, Sum } from "../../src/core/expression/ast.js";
import { evaluateArith } from "../../src/core/expression/evaluate.js";
import { parseExpression, type NameClassifier } from "../../src/core/expression/parser.js";
import { loadRuleset, type Ruleset } from "../../src/core/index.js";
import { fuzzClass } from "./fuzzClass.js";
import { deeplyNested, huge, hugeNumbers, mutated, randomText, SHIPPED_EXPRESSIONS, SHIPPED_TEXTS } from "./generators.js";
import type { Verdict } from "./robustness.js";

const shipped: Ruleset[] = SHIPPED_TEXTS.map((t) => {
  const r = loadRuleset(t);
  if (!r.ok) throw new Error("a shipped ruleset does not load");
  return r.value;
});
const SYMBOLS = [...new Set(shipped.flatMap((r) => r.symbols.map((s) => s.name)))];
const VALUES = [...new Set(shipped.flatMap((r) => [...r.values.keys()]))];
const NAMES: NameClassifier = {
  kind: (n) => (SYMBOLS.includes(n) ? "symbol" : VALUES.includes(n) ? "value" : "unknown"),
  symbols: () => SYMBOLS,
  values: () => VALUES,
};

/** Values a parameter may take that make arithmetic fail: zero, negative, huge. */
const PROBES = [0, -1, 1e300, 0.5];

function factors(sum: Sum, out: Arith[] = []): Arith[] {
  for (const term of sum.terms) {
    if (term.factor) out.push(term.factor);
    if (term.body.kind === "group") term.body.alternatives.forEach((alt) => factors(alt, out));
  }
  return out;
}

export function expressionTarget(text: string): Verdict {
  const inText = (position: number) => Number.isInteger(position) && position >= 1 && position <= text.length + 1;
  const parsed = parseExpression(text, NAMES);
  if (!parsed.ok) return { located: inText(parsed.error.position) && parsed.error.message !== "" };
  for (const factor of factors(parsed.sum)) {
    for (const probe of PROBES) {
      const v = evaluateArith(factor, { name: () => probe, option: (node) => node.options.length - 1 });
      if (v.ok ? !Number.isFinite(v.value) : !inText(v.fault.position)) return { located: false };
    }
  }
  return { located: true };
}

describe("expression parser", () => {
  fuzzClass("expression parser: mutated shipped expressions", 0.2, mutated(SHIPPED_EXPRESSIONS), expressionTarget);
  fuzzClass("expression parser: random text", 0.07, randomText, expressionTarget);
  fuzzClass("expression parser: deep nesting", 0.025, deeplyNested("1.2", "D"), expressionTarget);
  fuzzClass("expression parser: megabyte and over-long texts", 0.005, huge("", ["1.2D + ", "(", "2^", "|", "x"]), expressionTarget);
  fuzzClass("expression parser: huge numbers", 0.02, hugeNumbers((n) => `(${n})D + ${n}L - 1/(${n})W`), expressionTarget);
});
