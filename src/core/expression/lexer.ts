/**
 * Splits a combination expression into tokens. Positions are 1-based character
 * numbers, as a user counts them in a cell. Typographic signs that come with text
 * copied from a printed code (− × · ±) are read as their plain equivalents.
 */

export type TokenKind =
  | "number"
  | "name"
  | "plus"
  | "minus"
  | "plusminus"
  | "times"
  | "divide"
  | "open"
  | "close"
  | "comma"
  | "must"
  | "may"
  | "end";

export interface Token {
  kind: TokenKind;
  text: string;
  /** 1-based position of the first character. */
  position: number;
  /** Numeric value of a number token. */
  value?: number;
}

export type LexResult = { ok: true; tokens: Token[] } | { ok: false; position: number; message: string };

const SINGLE: Record<string, TokenKind> = {
  "+": "plus",
  "-": "minus",
  "\u2212": "minus", // minus sign
  "\u2013": "minus", // en dash
  "\u00b1": "plusminus", // ±
  "\u2213": "plusminus", // ∓
  "*": "times",
  "\u00d7": "times", // ×
  "\u00b7": "times", // ·
  "\u22c5": "times", // ⋅
  "/": "divide",
  "(": "open",
  ")": "close",
  ",": "comma",
  "!": "must",
  "?": "may",
};

const NAME_START = /[\p{L}_]/u;
const NAME_PART = /[\p{L}\p{N}_]/u;
const DIGIT = /[0-9]/;

export function lex(text: string): LexResult {
  const tokens: Token[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text[i];
    const position = i + 1;
    if (/\s/.test(ch)) {
      i++;
      continue;
    }
    // "+-" and "-+" written without a space mean "both ways", like ±.
    if ((ch === "+" && text[i + 1] === "-") || (ch === "-" && text[i + 1] === "+")) {
      tokens.push({ kind: "plusminus", text: text.slice(i, i + 2), position });
      i += 2;
      continue;
    }
    const single = SINGLE[ch];
    if (single) {
      tokens.push({ kind: single, text: ch, position });
      i++;
      continue;
    }
    if (DIGIT.test(ch) || (ch === "." && DIGIT.test(text[i + 1] ?? ""))) {
      let j = i;
      while (j < text.length && DIGIT.test(text[j])) j++;
      if (text[j] === ".") {
        j++;
        while (j < text.length && DIGIT.test(text[j])) j++;
      }
      if (text[j] === "." || text[j] === ",") {
        // "1.2.3" or a decimal comma: refuse rather than guess.
        if (text[j] === "." || DIGIT.test(text[j + 1] ?? "")) {
          return {
            ok: false,
            position: j + 1,
            message:
              text[j] === ","
                ? `write decimals with a point: "${text.slice(i, j)}.${text[j + 1]}…", not a comma`
                : `"${text.slice(i, j + 1)}" is not a number`,
          };
        }
      }
      const numberText = text.slice(i, j);
      tokens.push({ kind: "number", text: numberText, position, value: Number(numberText) });
      i = j;
      continue;
    }
    if (NAME_START.test(ch)) {
      let j = i + 1;
      while (j < text.length && NAME_PART.test(text[j])) j++;
      tokens.push({ kind: "name", text: text.slice(i, j), position });
      i = j;
      continue;
    }
    return { ok: false, position, message: `unexpected character "${ch}"` };
  }
  tokens.push({ kind: "end", text: "", position: text.length + 1 });
  return { ok: true, tokens };
}
