/**
 * What JSON text and values may hold before anything reads them field by
 * field: the stated limits on size, nesting and members (src/core/limits.ts),
 * and no field named __proto__, constructor or prototype, which a program that
 * copies fields by name would turn into a change of some object's prototype.
 * The text is scanned first, without recursion, so that text nested a million
 * deep is refused before any recursive reader sees it.
 */
import { countText, FORBIDDEN_KEYS, LIMITS } from "../limits.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import { duplicateKeys, jsonSyntaxError } from "./jsonSyntax.js";

/** Line and column (both 1-based) of a character offset. */
export function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  return { line: before.split("\n").length, column: offset - before.lastIndexOf("\n") };
}

/** Offset of the first "[" or "{" (outside strings) that opens a value nested deeper than `limit`, or null. */
export function nestingBeyond(text: string, limit: number): number | null {
  let depth = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: the next character is escaped
      else if (c === 0x22) inString = false;
      continue;
    }
    if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      if (++depth > limit) return i;
    } else if (c === 0x7d || c === 0x5d) depth--;
  }
  return null;
}

export interface JsonTextOptions {
  /** What the text is, for messages: "ruleset file", "case file". */
  what: string;
  /** The most characters read; none when omitted. */
  characters?: number;
}

/** The text's size and nesting against the stated limits, with line and column; null if within them. */
export function jsonTextProblem(text: string, options: JsonTextOptions): Problem | null {
  if (options.characters !== undefined && text.length > options.characters) {
    return problem("input-limit", `the ${options.what} has ${countText(text.length)} characters; at most ${countText(options.characters)} are read`);
  }
  const deep = nestingBeyond(text, LIMITS.jsonNesting);
  if (deep === null) return null;
  const { line, column } = lineAndColumn(text, deep);
  return problem("input-limit", `objects and lists are nested more than ${LIMITS.jsonNesting} deep at line ${line}, column ${column}`);
}

export interface JsonValueOptions {
  /** The most members of one object or list; none when omitted. */
  members?: number;
}

/**
 * Every forbidden field name in a parsed JSON value, and every object or list
 * beyond the nesting or member limits, each with its JSON path. Own fields
 * only: JSON.parse makes "__proto__" an own field, never a prototype.
 */
export function jsonValueProblems(value: unknown, options: JsonValueOptions = {}): Problem[] {
  const out: Problem[] = [];
  const walk = (v: object, path: (string | number)[], depth: number): void => {
    if (depth > LIMITS.jsonNesting) {
      out.push(problem("input-limit", `objects and lists are nested more than ${LIMITS.jsonNesting} deep here`, { path }));
      return;
    }
    const members = Array.isArray(v) ? v.length : Object.keys(v).length;
    if (options.members !== undefined && members > options.members) {
      out.push(problem("input-limit", `holds ${countText(members)} ${Array.isArray(v) ? "entries" : "fields"}; at most ${countText(options.members)} are read`, { path }));
      return;
    }
    if (Array.isArray(v)) {
      for (let k = 0; k < v.length; k++) {
        const item: unknown = v[k];
        if (item !== null && typeof item === "object") walk(item, [...path, k], depth + 1);
      }
      return;
    }
    for (const key of Object.keys(v)) {
      if (FORBIDDEN_KEYS.includes(key)) {
        out.push(problem("input-forbidden-key", `the field name "${key}" is refused: a program copying fields by name would change an object's prototype with it`, { path: [...path, key] }));
        continue;
      }
      const item: unknown = (v as Record<string, unknown>)[key];
      if (item !== null && typeof item === "object") walk(item, [...path, key], depth + 1);
    }
  };
  if (value !== null && typeof value === "object") walk(value, [], 1);
  return out;
}

/**
 * JSON text read as every Loadwright file format reads it: within the size and
 * nesting limits, valid JSON, and no field written twice in one object (which
 * JSON.parse would silently settle by keeping the last).
 */
export function parseJsonText(text: string, options: JsonTextOptions): Result<unknown> {
  const limit = jsonTextProblem(text, options);
  if (limit) return fail(limit);
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    return fail(problem("ruleset-json", `not valid JSON: ${jsonSyntaxError(text, e instanceof Error ? e.message : String(e))}`));
  }
  const twice = duplicateKeys(text);
  if (twice.length > 0) {
    return fail(...twice.map((d) => problem("ruleset-json", `field "${d.key}" is written twice in one object (line ${d.line}, column ${d.column}); JSON keeps only the last, so say which is meant`, { path: d.path })));
  }
  return ok(data);
}
