/**
 * Where a value sits in a JSON text: the line and column of the value at a
 * path such as ["combinations", 2, "expression"], of a character inside a
 * string value, and of the first syntax error. JSON.parse gives values without
 * positions; jsonc-parser's tree and tolerant parser give them, so that an
 * error in a ruleset or a case file names the line and column an editor shows.
 */
import { findNodeAtLocation, parse, parseTree, type ParseError } from "jsonc-parser";

export interface TextPosition {
  line: number;
  column: number;
}

/** Line and column (both 1-based) of a character offset. */
export function positionOf(text: string, offset: number): TextPosition {
  const before = text.slice(0, offset);
  const line = before.split("\n").length;
  return { line, column: offset - before.lastIndexOf("\n") };
}

/**
 * Offset of the value at `path`, or of the deepest value on the way that exists
 * (a missing field is reported at its object). `character` (1-based) moves into
 * a string value to that character of its decoded text.
 */
export function offsetOfPath(text: string, path: readonly (string | number)[], character?: number): number {
  const root = parseTree(text);
  if (!root) return 0;
  for (let depth = path.length; depth >= 0; depth--) {
    const node = findNodeAtLocation(root, path.slice(0, depth));
    if (!node) continue;
    if (character !== undefined && depth === path.length && node.type === "string") return offsetInString(text, node.offset, character);
    return node.offset;
  }
  return root.offset;
}

/** Offset of the decoded string's character `character` (1-based), an escape counted as one character. */
function offsetInString(text: string, quote: number, character: number): number {
  let i = quote + 1;
  for (let k = 1; k < character && i < text.length && text[i] !== '"'; k++) {
    if (text[i] === "\\") i += text[i + 1] === "u" ? 6 : 2;
    else i++;
  }
  return i;
}

/** Offset of the first place where `text` stops being strict JSON, or null if it is JSON. */
export function syntaxErrorOffset(text: string): number | null {
  const errors: ParseError[] = [];
  parse(text, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
  return errors[0]?.offset ?? null;
}
