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

  test("writes sums of factored two-decimal values, and any size from 1 to 1e11, as the general rule does", () => {
    // The general rule is formatNumber: Number(value.toPrecision(12)) written out (ECMA-262 Number.prototype.toPrecision).
    const twoDecimals = fc.integer({ min: -99_999_999, max: 99_999_999 }).map((n) => n / 100);
    const factor = fc.constantFrom(0.9, 1.2, 1.4, 1.6, 0.5, 0.39, 1.3, 1.35, 1.05, 0.75, 0.2);
    fc.assert(
      fc.property(fc.array(fc.tuple(factor, twoDecimals), { minLength: 1, maxLength: 6 }), (terms) => {
        const v = terms.reduce((sum, [f, x]) => sum + f * x, 0);
        expect(numberText(v)).toBe(formatNumber(v === 0 ? 0 : v));
      }),
      { numRuns: 50_000 },
    );
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e11, noNaN: true }), fc.boolean(), (v, negative) => {
        const x = negative ? -v : v;
        expect(numberText(x)).toBe(formatNumber(x));
      }),
      { numRuns: 50_000 },
    );
    fc.assert(
      fc.property(fc.integer({ min: -(10 ** 12), max: 10 ** 12 }), fc.integer({ min: 0, max: 6 }), (n, decimals) => {
        const x = n / 10 ** decimals;
        expect(numberText(x)).toBe(formatNumber(x === 0 ? 0 : x));
      }),
      { numRuns: 50_000 },
    );
    for (const v of [1, 9.999999999995, 99999999999.95, 1e11 - 1e-4, 0.5 + 1e-12, 123456.7890125, 10, 100.0000000000005, 0.1, 0.0001, 0.00005, 99999999.9999, 1e8, -0.5, 12.3])
      expect(numberText(v)).toBe(formatNumber(v));
  });
});
