/**
 * Numbers as the report prints them. What was given (case values, factors,
 * parameters) is shown as given, in its shortest form; what was computed
 * (products, sums, factored values, envelopes) to a fixed number of significant
 * digits, trailing zeros kept, so that every computed value carries the same
 * precision and a column of them reads at a glance. The minus sign is the
 * typographic one (U+2212), which does not break from its number.
 */
import { formatNumber } from "../core/index.js";

export const MINUS = "\u2212";

/** A given number in its shortest form (at most 12 significant digits), with a true minus sign. */
export function givenText(value: number): string {
  return signed(value === 0 ? "0" : formatNumber(value));
}

/** A computed number to `digits` significant digits: 80.20, 149.6, −4.600, 123456 (no exponent where it can be helped). */
export function computedText(value: number, digits: number): string {
  if (value === 0 || !Number.isFinite(value)) return value === 0 ? "0" : String(value);
  const rounded = Number(value.toPrecision(digits));
  if (rounded === 0) return "0";
  const exponent = Math.floor(Math.log10(Math.abs(rounded)));
  const decimals = digits - 1 - exponent;
  if (decimals > 12 || exponent > 20) return signed(rounded.toPrecision(digits).replace(/e\+?/, "e"));
  return signed(rounded.toFixed(Math.max(0, decimals)));
}

function signed(text: string): string {
  return text.startsWith("-") ? `${MINUS}${text.slice(1)}` : text;
}
