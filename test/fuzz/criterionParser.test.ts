/**
 * Fuzz target: the criterion parser (parseCriterion) and, for every criterion
 * it accepts, its value on rows whose components are zero, negative and huge.
 * A refusal must name a character of the criterion; a row where the criterion
 * has no value must be refused with the row and the character, never NaN.
 */
import { describe } from "vitest";
import { criterionFault, evaluateCriterion } from "../../src/core/evaluate/criteria.js";
import { parseCriterion } from "../../src/core/index.js";
import { fuzzClass } from "./fuzzClass.js";
import { CRITERION_COMPONENTS, deeplyNested, huge, hugeNumbers, mutated, randomText, SAMPLE_CRITERIA } from "./generators.js";
import type { Verdict } from "./robustness.js";

const ROWS: number[][] = [CRITERION_COMPONENTS.map(() => 0), CRITERION_COMPONENTS.map((_, k) => -1 - k), CRITERION_COMPONENTS.map(() => 1e300), CRITERION_COMPONENTS.map((_, k) => k * 0.5)];

export function criterionTarget(text: string): Verdict {
  const inText = (position: number | undefined) => position !== undefined && Number.isInteger(position) && position >= 1 && position <= text.length + 1;
  const parsed = parseCriterion(text, CRITERION_COMPONENTS);
  if (!parsed.ok) return { located: parsed.problems.every((p) => inText(p.place.position) && p.message !== "") };
  for (const row of ROWS) {
    const v = evaluateCriterion(parsed.value.expr, row);
    if (!Number.isFinite(v) && !inText(criterionFault(parsed.value, row, "1: row").place.position)) return { located: false };
  }
  return { located: true };
}

describe("criterion parser", () => {
  fuzzClass("criterion parser: mutated criteria", 0.18, mutated(SAMPLE_CRITERIA), criterionTarget);
  fuzzClass("criterion parser: random text", 0.05, randomText, criterionTarget);
  fuzzClass("criterion parser: deep nesting", 0.025, deeplyNested("max ", "V"), criterionTarget);
  fuzzClass("criterion parser: megabyte and over-long texts", 0.005, huge("max ", ["V + ", "(", "-", "|", "sqrt(", "[C1 top]*"]), criterionTarget);
  fuzzClass("criterion parser: huge numbers", 0.02, hugeNumbers((n) => `max V/(${n}) + ${n}*N - sqrt(${n})`), criterionTarget);
});
