/**
 * Where a ruleset problem sits in the JSON text a user edits: the JSON path
 * (and, inside an expression, the character) turned into an offset, line and
 * column, so the text view can point at it. Also finds what JSON.parse hides:
 * a field written twice in one object, of which the parser silently keeps the last.
 */
import { findNodeAtLocation, parseTree, type Node, type ParseError } from "jsonc-parser";
import { duplicateKeys as findDuplicateKeys, jsonTextProblem } from "../core/index.js";

export interface TextSpot {
  /** 0-based offset of the first character and the length to select. */
  offset: number;
  length: number;
  /** 1-based, as an editor shows them. */
  line: number;
  column: number;
}

export function spotAt(text: string, offset: number, length: number): TextSpot {
  const before = text.slice(0, offset);
  const line = before.split("\n").length;
  const column = offset - before.lastIndexOf("\n");
  return { offset, length, line, column };
}

/** Text nested beyond the engine's limit is not read as a tree (the reader recurses); the engine refuses it. */
const tooDeep = (text: string) => jsonTextProblem(text, { what: "draft" }) !== null;

function tree(text: string): Node | undefined {
  if (tooDeep(text)) return undefined;
  const errors: ParseError[] = [];
  return parseTree(text, errors, { disallowComments: true, allowTrailingComma: false });
}

/**
 * The spot of a JSON path; with `position` (1-based character of the decoded
 * string), that character inside the string value. A path that is not in the
 * text (a required field that is missing) gives its nearest enclosing value.
 */
export function locatePath(text: string, path: (string | number)[], position?: number): TextSpot | null {
  const root = tree(text);
  if (!root) return null;
  for (let n = path.length; n >= 0; n--) {
    const node = findNodeAtLocation(root, path.slice(0, n));
    if (!node) continue;
    if (n === path.length && position !== undefined && node.type === "string") {
      const raw = text.slice(node.offset, node.offset + node.length);
      const at = rawIndexOfCharacter(raw, position);
      return spotAt(text, node.offset + at, 1);
    }
    // A field's name for an unknown field, so the selection shows what to remove.
    const target = n === path.length && node.parent?.type === "property" ? node.parent : node;
    return spotAt(text, target.offset, Math.min(target.length, 200));
  }
  return null;
}

/** Index in a raw JSON string literal (with its quotes and escapes) of the decoded string's 1-based character. */
export function rawIndexOfCharacter(raw: string, position: number): number {
  let i = 1; // after the opening quote
  for (let decoded = 1; decoded < position && i < raw.length - 1; decoded++) {
    if (raw[i] === "\\") i += raw[i + 1] === "u" ? 6 : 2;
    else i += 1;
  }
  return Math.min(i, Math.max(raw.length - 1, 0));
}

export interface DuplicateKey {
  path: (string | number)[];
  key: string;
  spot: TextSpot;
}

/** Every field name written twice in the same object, with the path of the later one (found by the engine). */
export function duplicateKeys(text: string): DuplicateKey[] {
  return findDuplicateKeys(text).map((d) => ({ path: d.path, key: d.key, spot: spotAt(text, d.offset, d.length) }));
}

/** The spot of the first JSON syntax error, if the text has one. */
export function syntaxErrorSpot(text: string): TextSpot | null {
  if (tooDeep(text)) return null;
  const errors: ParseError[] = [];
  parseTree(text, errors, { disallowComments: true, allowTrailingComma: false });
  const first = errors[0];
  return first ? spotAt(text, first.offset, Math.max(first.length, 1)) : null;
}
