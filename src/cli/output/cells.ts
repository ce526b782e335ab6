/** Values as text: numbers for people and CSV, fields escaped for CSV and Markdown. */
import { formatNumber } from "../../core/index.js";

/** 12 significant digits (168, not 168.00000000000003); never "-0". JSON keeps full precision. */
export function numberText(value: number): string {
  if (value === 0) return "0";
  const short = fourDecimalText(value);
  if (short !== null) return short;
  // Rounded to 12 digits before any String(value): writing a double's shortest form is the costly part,
  // and a factored sum (12.600000000000001) seldom has a short one.
  const rounded = roundedText(value);
  if (rounded !== null) return rounded;
  // A number whose shortest form has at most 12 characters (and no exponent) has at most 12
  // significant digits, which is what formatNumber would write.
  const plain = String(value);
  if (plain.length <= 12 && !plain.includes("e")) return plain;
  return formatNumber(value);
}

/**
 * The text of a value that is the double nearest a decimal with at most four
 * decimals and |value| < 1e8 (factored two-decimal results often are), written
 * from integers — null otherwise. Such a decimal is the only one of four
 * decimals or fewer that reads back as the value (two of them differ by 1e-4,
 * far more than a double's spacing below 1e8), so it is the value's shortest
 * form, String(value); and with at most 8 + 4 significant digits it is also
 * what the 12-digit rule writes.
 */
function fourDecimalText(value: number): string | null {
  const size = Math.abs(value);
  if (!(size < 1e8)) return null;
  const scaled = Math.round(size * 1e4);
  if (scaled / 1e4 !== size) return null;
  const whole = Math.floor(scaled / 1e4);
  const fraction = scaled - whole * 1e4;
  const text = fraction === 0 ? String(whole) : `${whole}.${fractionText(fraction, 4)}`;
  return value < 0 ? `-${text}` : text;
}

/** Runs of zeros, by length: the zeros a fraction's digits follow. */
const ZEROS = Array.from({ length: 12 }, (_, n) => "0".repeat(n));

/** The digits after the point of an integer 0 < fraction < 10^places read as fraction / 10^places: leading zeros kept, trailing ones dropped. */
function fractionText(fraction: number, places: number): string {
  // Math.floor(f / 10) × 10 === f exactly where 10 divides f (f below 2^53); `%` on a double costs a call.
  for (let tenth = Math.floor(fraction / 10); tenth * 10 === fraction; tenth = Math.floor(fraction / 10)) {
    fraction = tenth;
    places--;
  }
  const digits = String(fraction);
  return ZEROS[places - digits.length] + digits;
}

/** Powers of ten, every one a double exactly. */
const POWERS = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11];

/**
 * formatNumber's text for 1 ≤ |value| < 1e11, without toPrecision: with k
 * decimals to keep 12 significant digits, the digits are n = round(value × 10^k)
 * — exact where value × 10^k (below 1e12, so off by less than 1e-4) is not
 * within 0.001 of a half — and n / 10^k, one division of exact doubles, is the
 * double nearest the 12-digit decimal, as Number(value.toPrecision(12)) is.
 * Null where that cannot be told this way; the caller then asks formatNumber.
 */
function roundedText(value: number): string | null {
  const size = Math.abs(value);
  if (!(size >= 1 && size < 1e11)) return null;
  let exponent = Math.floor(Math.log10(size));
  // log10 may be off by one next to a power of ten: settle it with the exact powers.
  if (POWERS[exponent] > size) exponent--;
  else if (POWERS[exponent + 1] <= size) exponent++;
  const decimals = 11 - exponent;
  const scaled = size * POWERS[decimals];
  const whole = Math.floor(scaled);
  const fraction = scaled - whole;
  if (Math.abs(fraction - 0.5) < 1e-3) return null;
  const digits = fraction > 0.5 ? whole + 1 : whole;
  return decimalText(value < 0, digits, decimals);
}

/**
 * String(±digits / 10^decimals) for an integer 0 < digits ≤ 10^12, written from integers:
 * that quotient is the double nearest the decimal digits × 10^−decimals, which has at most 12
 * significant digits, and no shorter decimal is as near it (two decimals of 12 digits or fewer
 * lie much further apart than doubles do), so its shortest form is that decimal, trailing zeros
 * dropped, written without an exponent below 1e21 (ECMA-262 Number::toString).
 */
function decimalText(negative: boolean, digits: number, decimals: number): string {
  const unit = POWERS[decimals];
  // Exact: digits is an integer below 2^53 and the quotient is rounded by far less than 10^−decimals.
  let whole = Math.floor(digits / unit);
  let fraction = digits - whole * unit;
  if (fraction < 0) {
    whole--;
    fraction += unit;
  }
  const text = fraction === 0 ? String(whole) : `${whole}.${fractionText(fraction, decimals)}`;
  return negative ? `-${text}` : text;
}

/** A JSON number: full precision, -0 written as 0. */
export function jsonNumber(value: number): number {
  return value === 0 ? 0 : value;
}

export function csvField(text: string, delimiter = ","): string {
  return text.includes(delimiter) || /["\r\n]/.test(text) || /^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(fields: string[], delimiter = ","): string {
  return fields.map((f) => csvField(f, delimiter)).join(delimiter);
}

export function mdCell(text: string): string {
  return text.replace(/\\/g, "\\\\").replace(/\|/g, "\\|").replace(/\r?\n/g, " ");
}
