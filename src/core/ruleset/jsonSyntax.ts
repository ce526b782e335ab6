/**
 * Where JSON text goes wrong, as line and column: the built-in parser's message
 * names no position on every platform, so a tolerant scanner locates the first
 * error once JSON.parse has refused the text.
 */
import { parse, printParseErrorCode, type ParseError } from "jsonc-parser";

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
  const errors: ParseError[] = [];
  parse(text, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
  const first = errors[0];
  if (!first) return fallback;
  const before = text.slice(0, first.offset);
  const line = before.split("\n").length;
  const column = first.offset - before.lastIndexOf("\n");
  return `${WORDS[printParseErrorCode(first.error)] ?? "unexpected text"} at line ${line}, column ${column}`;
}
