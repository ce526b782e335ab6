/**
 * Splits a combination expression or a criterion into tokens: one lexer for the
 * whole expression language. Positions are 1-based character numbers, as a
 * user counts them in a cell. Typographic signs that come with text copied from
 * a printed code (− × · ±) are read as their plain equivalents.
 */

export type TokenKind =
  | "number"
  | "name"
  /** A name in square brackets, which may hold spaces and signs: [C1 top]. */
  | "quoted"
  | "plus"
  | "minus"
  | "plusminus"
  | "times"
  | "divide"
  | "power"
  | "bar"
  | "open"
  | "close"
  | "comma"
  | "must"
  | "may"
  | "end";

export interface Token {
  kind: TokenKind;
  /** The token as written; for a quoted name, the name inside the brackets, trimmed. */
  text: string;
  /** 1-based position of the first character. */
  position: number;
  /** 1-based position one past the last character. */
  end: number;
  /** Numeric value of a number token. */
  value?: number;
}

export type LexResult = { ok: true; tokens: Token[] } | { ok: false; position: number; message: string };

const SINGLE = new Map<string, TokenKind>([
  ["+", "plus"],
  ["-", "minus"],
  ["\u2212", "minus"], // minus sign
  ["\u2013", "minus"], // en dash
  ["\u00b1", "plusminus"], // ±
  ["\u2213", "plusminus"], // ∓
  ["*", "times"],
  ["\u00d7", "times"], // ×
  ["\u00b7", "times"], // ·
  ["\u22c5", "times"], // ⋅
  ["/", "divide"],
  ["^", "power"],
  ["|", "bar"],
  ["(", "open"],
  [")", "close"],
  [",", "comma"],
  ["!", "must"],
  ["?", "may"],
]);

const NAME_START = /[\p{L}_]/u;
const NAME_PART = /[\p{L}\p{N}_]/u;

// Plain ASCII is decided by character code; the Unicode classes only for the rest (speed on long texts).
const isDigit = (ch: string | undefined): boolean => ch !== undefined && ch >= "0" && ch <= "9";
const isAsciiLetter = (ch: string): boolean => (ch >= "a" && ch <= "z") || (ch >= "A" && ch <= "Z") || ch === "_";
const isSpace = (ch: string): boolean => ch === " " || (ch >= "\t" && ch <= "\r") || (ch > "\u007f" && /\s/.test(ch));
const isNameStart = (ch: string): boolean => isAsciiLetter(ch) || (ch > "\u007f" && NAME_START.test(ch));
const isNamePart = (ch: string): boolean => isAsciiLetter(ch) || isDigit(ch) || (ch > "\u007f" && NAME_PART.test(ch));

export function lex(text: string): LexResult {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text[i];
    const position = i + 1;
    if (isSpace(ch)) {
      i++;
      continue;
    }
    // "+-" and "-+" written without a space mean "both ways", like ±.
    if ((ch === "+" && text[i + 1] === "-") || (ch === "-" && text[i + 1] === "+")) {
      tokens.push({ kind: "plusminus", text: text.slice(i, i + 2), position, end: position + 2 });
      i += 2;
      continue;
    }
    const single = SINGLE.get(ch);
    if (single) {
      tokens.push({ kind: single, text: ch, position, end: position + 1 });
      i++;
      continue;
    }
    if (isDigit(ch) || (ch === "." && isDigit(text[i + 1]))) {
      let j = i;
      while (j < text.length && isDigit(text[j])) j++;
      if (text[j] === ".") {
        j++;
        while (j < text.length && isDigit(text[j])) j++;
      }
      if (text[j] === "." || text[j] === ",") {
        // "1.2.3" or a decimal comma: refuse rather than guess.
        if (text[j] === "." || isDigit(text[j + 1])) {
          return {
            ok: false,
            position: j + 1,
            message:
              text[j] === ","
                ? `write decimals with a point: "${text.slice(i, j)}.${text[j + 1]}…", not a comma (a comma that separates values takes a space after it: "1, 2")`
                : `"${text.slice(i, j + 1)}" is not a number`,
          };
        }
      }
      const numberText = text.slice(i, j);
      const value = Number(numberText);
      if (!Number.isFinite(value)) {
        const shown = numberText.length > 20 ? `${numberText.slice(0, 12)}… (${numberText.length} digits)` : numberText;
        return { ok: false, position, message: `the number ${shown} is too large to compute with` };
      }
      tokens.push({ kind: "number", text: numberText, position, end: j + 1, value });
      i = j;
      continue;
    }
    if (isNameStart(ch)) {
      let j = i + 1;
      while (j < text.length && isNamePart(text[j])) j++;
      tokens.push({ kind: "name", text: text.slice(i, j), position, end: j + 1 });
      i = j;
      continue;
    }
    if (ch === "[") {
      const close = text.indexOf("]", i + 1);
      if (close < 0) return { ok: false, position, message: 'this "[" is not closed: a name with spaces is written in square brackets, [C1 top]' };
      const inner = text.slice(i + 1, close).trim();
      if (inner === "") return { ok: false, position, message: "the square brackets hold no name" };
      tokens.push({ kind: "quoted", text: inner, position, end: close + 2 });
      i = close + 1;
      continue;
    }
    return { ok: false, position, message: `unexpected character "${ch}"` };
  }
  tokens.push({ kind: "end", text: "", position: text.length + 1, end: text.length + 1 });
  return { ok: true, tokens };
}
