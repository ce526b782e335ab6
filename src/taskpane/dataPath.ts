/** Reading and writing a draft's parsed JSON by path, tolerating any shape the user's text may have. */
import { DECIMAL_TEXT } from "../core/index.js";

export type Path = (string | number)[];
export type JsonObject = Record<string, unknown>;

export function isObject(v: unknown): v is JsonObject {
  return v !== null && typeof v === "object" && !Array.isArray(v);
}

export type ParsedJson = { ok: true; value: unknown } | { ok: false; reason: string };

/** A user's text as JSON, or the parser's reason why not: while a draft is typed, text that is not JSON yet is expected. */
export function parseJson(text: string): ParsedJson {
  try {
    return { ok: true, value: JSON.parse(text) as unknown };
  } catch (e) {
    return { ok: false, reason: e instanceof Error ? e.message : String(e) };
  }
}

/** A field of the text's top-level object; undefined where the text is not a JSON object or lacks the field. */
export function topField(text: string, field: string): unknown {
  const parsed = parseJson(text);
  return parsed.ok && isObject(parsed.value) ? parsed.value[field] : undefined;
}

export function getAt(data: unknown, path: Path): unknown {
  let v = data;
  for (const key of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<string | number, unknown>)[key];
  }
  return v;
}

/** Sets a value, making objects on the way; `undefined` removes the field. */
export function setAt(data: JsonObject, path: Path, value: unknown): void {
  let v: Record<string | number, unknown> = data;
  for (const key of path.slice(0, -1)) {
    const next = v[key];
    if (next === null || typeof next !== "object") v[key] = {};
    v = v[key] as Record<string | number, unknown>;
  }
  const last = path[path.length - 1];
  if (value === undefined) {
    if (Array.isArray(v) && typeof last === "number") v[last] = undefined;
    else delete v[last];
  } else {
    v[last] = value;
  }
}

/** Renames a field of an object in place, keeping the order of its fields. */
export function renameKey(object: JsonObject, from: string, to: string): void {
  const entries = Object.entries(object);
  for (const [k] of entries) delete object[k];
  for (const [k, v] of entries) object[k === from ? to : k] = v;
}

/** The text a field shows for a value of any type. */
export function shownText(v: unknown): string {
  if (v === undefined || v === null) return "";
  if (typeof v === "string") return v;
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  return JSON.stringify(v);
}

/** A number as the format writes it (1.2, 0.5, 1e3) becomes a number; anything else stays text, which the schema then refuses beside the field. */
export function numberOrText(text: string): number | string | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  return DECIMAL_TEXT.test(t) ? Number(t) : t;
}
