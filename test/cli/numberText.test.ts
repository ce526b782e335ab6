/** The command line's number text: 12 significant digits, its fast path equal to the general rule. */
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { formatNumber } from "../../src/core/index.js";
import { numberText } from "../../src/cli/output/cells.js";

describe("numberText", () => {
  test("writes 1.1 × 3 as 3.3, not 3.3000000000000003", () => {
    // common practice (no source): results are shown to 12 significant digits, floating-point noise dropped.
    expect(1.1 * 3).not.toBe(3.3);
    expect(numberText(1.1 * 3)).toBe("3.3");
  });

  test("never writes -0", () => {
    expect(numberText(-0)).toBe("0");
  });

  test("writes every double as the general 12-digit rule does", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (v) => {
        expect(numberText(v)).toBe(formatNumber(v === 0 ? 0 : v));
      }),
      { numRuns: 20_000 },
    );
    for (const v of [0.000001, 1e-7, 123456789012, 1234567890123, -12345678901, 0.1 + 0.2, 1e15, 5e-324]) expect(numberText(v)).toBe(formatNumber(v));
  });
});
