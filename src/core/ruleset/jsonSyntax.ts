/**
 * Where JSON text goes wrong, as line and column: the built-in parser's message
 * names no position on every platform, so a tolerant scanner locates the first
 * error once JSON.parse has refused the text; and a field written twice, which
 * JSON.parse accepts silently (keeping the last), is found the same way.
 */
import { parse, printParseErrorCode, visit, type ParseError } from "jsonc-parser";
import { LIMITS } from "../limits.js";
import { lineAndColumn, nestingBeyond } from "./jsonLimits.js";

const WORDS: Record<string, string> = {
  InvalidSymbol: "unexpected text",
  InvalidNumberFormat: "a malformed number",
  PropertyNameExpected: "a field name in double quotes is expected",
  ValueExpected: "a value is expected",
  ColonExpected: 'a ":" is expected',
  CommaExpected: 'a "," is expected',
  CloseBraceExpected: 'a "}" is expected',
  CloseBracketExpected: 'a "]" is expected',
  EndOfFileExpected: "there is text after the end of the JSON value",
  InvalidCommentToken: "comments are not allowed",
  UnexpectedEndOfString: "a string is not closed",
  InvalidEscapeCharacter: "an invalid escape in a string",
  InvalidCharacter: "a control character inside a string",
};

/** "a "," is expected at line 3, column 9", or the parser's own message when the scanner finds nothing. */
export function jsonSyntaxError(text: string, fallback: string): string {
  if (text.trim() === "") return "the text is empty";
  // The scanner reads nested values recursively: text beyond the nesting limit is refused before it (jsonLimits.ts).
  if (nestingBeyond(text, LIMITS.jsonNesting) !== null) return fallback;
  const errors: ParseError[] = [];
  parse(text, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
  const first = errors[0];
  if (!first) return fallback;
  const { line, column } = lineAndColumn(text, first.offset);
  return `${WORDS[printParseErrorCode(first.error)] ?? "unexpected text"} at line ${line}, column ${column}`;
}

export interface DuplicateKey {
  /** JSON path of the later of the two fields. */
  path: (string | number)[];
  key: string;
  /** Offset of the later key's opening quote, and its line and column (1-based). */
  offset: number;
  length: number;
  line: number;
  column: number;
}

/** Every field name written twice in the same object, with the path and place of the later one. */
export function duplicateKeys(text: string): DuplicateKey[] {
  if (nestingBeyond(text, LIMITS.jsonNesting) !== null) return [];
  const out: DuplicateKey[] = [];
  // One set of names per open object; read as a stream of events, without building a tree (long files).
  const open: Set<string>[] = [];
  visit(
    text,
    {
      onObjectBegin: () => {
        open.push(new Set());
      },
      onObjectEnd: () => {
        open.pop();
      },
      onObjectProperty: (key, offset, length, startLine, startCharacter, pathSupplier) => {
        const seen = open[open.length - 1];
        if (!seen) return;
        if (seen.has(key)) out.push({ path: [...pathSupplier(), key], key, offset, length, line: startLine + 1, column: startCharacter + 1 });
        seen.add(key);
      },
    },
    { disallowComments: true, allowTrailingComma: false },
  );
  return out;
}
