/** Values as text: numbers for people and CSV, fields escaped for CSV and Markdown. */
import { formatNumber } from "../../core/index.js";

/** 12 significant digits (168, not 168.00000000000003); never "-0". JSON keeps full precision. */
export function numberText(value: number): string {
  if (value === 0) return "0";
  // Fast path for a streamed million rows: a number whose shortest form has at most 12 characters
  // (and no exponent) has at most 12 significant digits, which is what formatNumber would write.
  const plain = String(value);
  if (plain.length <= 12 && !plain.includes("e")) return plain;
  return formatNumber(value);
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
