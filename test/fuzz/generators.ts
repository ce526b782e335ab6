/**
 * Generated bad and hostile input for the fuzz targets, all seeded through
 * fast-check: grammar-aware mutations of what ships (the combination
 * expressions and files in rulesets/), random bytes, deep nesting, megabyte
 * texts, huge numbers, self-referring parameters, duplicate ids and forbidden
 * field names. Every generator is plain data in, text or value out.
 */
import fc from "fast-check";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { ROOT } from "./robustness.js";

export const SHIPPED_TEXTS: readonly string[] = readdirSync(join(ROOT, "rulesets"))
  .filter((f) => f.endsWith(".json"))
  .sort()
  .map((f) => readFileSync(join(ROOT, "rulesets", f), "utf8"));

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type RulesetJson = { combinations: { id: string; expression: string }[] } & Record<string, Json>;

export const SHIPPED_VALUES: readonly RulesetJson[] = SHIPPED_TEXTS.map((t) => JSON.parse(t) as RulesetJson);

export const SHIPPED_EXPRESSIONS: readonly string[] = [...new Set(SHIPPED_VALUES.flatMap((r) => r.combinations.map((c) => c.expression)))];

/** Criteria as engineers write them, over the components of CRITERION_COMPONENTS. */
export const SAMPLE_CRITERIA: readonly string[] = [
  "max V",
  "min N",
  "max |M|",
  "max N/2000 + M/350",
  "max [C1 top]",
  "max |[C1 top]|",
  "max sqrt(Vx^2 + Vy^2)",
  "max abs(T) / 120 + abs(V) / 95",
  "max(V)",
  "min(N)",
  "max(Vx, Vy)",
  "min min(Vx, Vy, N)",
  "max P*V",
  "max [M0 / 0] - 2*[C1 top]",
  "MAX -V^2",
  "max max(abs(Vx), abs(Vy)) / 2",
];

/** Components of the case table criteria are read against; some named like functions on purpose. */
export const CRITERION_COMPONENTS: readonly string[] = ["P", "V", "M", "N", "Vx", "Vy", "T", "C1 top", "M0 / 0", "abs", "max"];

// ---------------------------------------------------------------- text pieces

/** Pieces a mutation inserts: the language's own tokens, near misses, hostile numbers and characters. */
const PIECES: readonly string[] = [
  "(", ")", "((", "))", "+", "-", "*", "/", "^", "|", ",", "!", "?", "±", "+-", "−", "×", "·", " ", "  ",
  "or", "lead", "others", "lead(", "others(", "sqrt(", "max(", "min(", "abs(", "SQRT(", "sqrt", "max", "min", "abs",
  "0", "0.0", "-0", "1.5", ".5", "1.", "1,5", "1.2.3", "2^1024", "10^308", "0^-1", "(-8)^(1/3)", "sqrt(-1)", "1/0", "1/(1-1)",
  "9".repeat(400), `1${"0".repeat(308)}`, `0.${"0".repeat(400)}1`, "1e5", "NaN", "Infinity",
  "D", "L", "Lr", "S", "W", "E", "G", "Q", "psi0", "psi2", "SDS", "rho", "fL", "xi", "X", "d", "l",
  "V", "N", "M", "Vx", "Vy", "T", "P", "[C1 top]", "[M0 / 0]", "[", "]", "[]", "[ ]",
  "__proto__", "constructor", "prototype", "toString", "hasOwnProperty",
  "\u0000", "\u200b", "\ud800", "😀", "\n", "\t", "$", "#", "{", "}", '"', "\\", "'",
];

/** A text cut into tokens the way a person would edit it: words, numbers, bracketed names, spaces, single characters. */
function tokens(text: string): string[] {
  return text.match(/\s+|[\p{L}_][\p{L}\p{N}_]*|\d+(?:\.\d*)?|\[[^\]]*\]|[\s\S]/gu) ?? [];
}

type Edit = { op: "delete" | "insert" | "replace" | "duplicate" | "swap" | "wrap" | "repeat"; at: number; span: number; piece: string };

const edit: fc.Arbitrary<Edit> = fc.record({
  op: fc.constantFrom("delete", "insert", "replace", "duplicate", "swap", "wrap", "repeat"),
  at: fc.nat(),
  span: fc.integer({ min: 1, max: 6 }),
  piece: fc.constantFrom(...PIECES),
});

function applyEdit(parts: string[], e: Edit): string[] {
  const out = [...parts];
  if (out.length === 0) return [e.piece];
  const at = e.at % out.length;
  const end = Math.min(out.length, at + e.span);
  switch (e.op) {
    case "delete":
      out.splice(at, e.span);
      break;
    case "insert":
      out.splice(at, 0, e.piece);
      break;
    case "replace":
      out.splice(at, 1, e.piece);
      break;
    case "duplicate":
      out.splice(end, 0, ...out.slice(at, end));
      break;
    case "swap":
      if (end < out.length) [out[at], out[end]] = [out[end], out[at]];
      break;
    case "wrap":
      out.splice(end, 0, ")");
      out.splice(at, 0, "(");
      break;
    case "repeat":
      out.splice(end, 0, ...Array.from({ length: e.span * 8 }, () => out.slice(at, end)).flat());
      break;
  }
  return out;
}

/** A text changed by one to five edits at token boundaries. */
export function mutated(texts: readonly string[]): fc.Arbitrary<string> {
  return fc.tuple(fc.constantFrom(...texts), fc.array(edit, { minLength: 1, maxLength: 5 })).map(([text, edits]) => edits.reduce(applyEdit, tokens(text)).join(""));
}

/** Random text: any UTF-16 code units, or only the characters of the language. */
export const randomText: fc.Arbitrary<string> = fc.oneof(
  fc.string({ unit: "binary", maxLength: 300 }),
  fc.string({ unit: fc.constantFrom(..."()+-*/^|,!?±[] .0123456789DLWESqrtmaxinbo_"), maxLength: 300 }),
  fc.string({ unit: fc.constantFrom(...PIECES), maxLength: 60 }),
);

/** Nesting around the limit and far beyond it, in every form the language nests. */
export function deeplyNested(lead: string, core: string): fc.Arbitrary<string> {
  const depth = fc.oneof(fc.integer({ min: 25, max: 40 }), fc.integer({ min: 40, max: 1_000 }), fc.integer({ min: 1_000, max: 200_000 }));
  const form = fc.constantFrom<[string, string]>(["(", ")"], ["|", "|"], ["-", ""], ["2^", ""], ["sqrt(", ")"], ["max(1, ", ")"], ["(1 or ", ")"], ["(D or ", ")"], ["[", "]"], ["(", ""], ["", ")"]);
  return fc.tuple(form, depth).map(([[open, close], n]) => `${lead}${open.repeat(n)}${core}${close.repeat(n)}`);
}

/** Texts of about a megabyte and just over the length limit. */
export function huge(lead: string, units: readonly string[]): fc.Arbitrary<string> {
  return fc.tuple(fc.constantFrom(...units), fc.constantFrom(1_999, 2_001, 50_000, 1_048_577)).map(([unit, length]) => `${lead}${unit.repeat(Math.ceil(length / unit.length))}`.slice(0, length));
}

/** Numbers too large, too small or too long to be numbers, in factors and divisors. */
export function hugeNumbers(template: (n: string) => string): fc.Arbitrary<string> {
  const digits = fc.integer({ min: 300, max: 5_000 });
  return fc.oneof(
    digits.map((k) => template("9".repeat(k))),
    digits.map((k) => template(`0.${"0".repeat(k)}1`)),
    digits.map((k) => template(`1${"0".repeat(k)}`)),
    fc.constantFrom("1e308", `${"9".repeat(300)} * ${"9".repeat(300)}`, `1${"0".repeat(200)}^2`, "2^1023 * 2", "(0.1 - 0.1)").map(template),
  );
}

// ---------------------------------------------------------------- rulesets

const FORBIDDEN = ["__proto__", "constructor", "prototype"];

/** Every path to a value in a JSON value. */
function paths(v: Json, at: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  out.push(at);
  if (Array.isArray(v)) v.forEach((x, i) => paths(x, [...at, i], out));
  else if (v !== null && typeof v === "object") for (const k of Object.keys(v)) paths(v[k], [...at, k], out);
  return out;
}

/** Sets a field as its own, never through a setter (assigning "__proto__" would change a prototype here). */
function setOwn(o: object, key: string | number, value: Json): void {
  Object.defineProperty(o, key, { value, enumerable: true, writable: true, configurable: true });
}

/** The root's field `key` as an object to add to, made one if an earlier change left something else there. */
function objectField(root: RulesetJson, key: string): object {
  const v = root[key];
  if (v !== null && typeof v === "object" && !Array.isArray(v)) return v;
  const fresh = {};
  setOwn(root, key, fresh);
  return fresh;
}

function parentOf(root: Json, path: (string | number)[]): Json {
  let v = root;
  for (const k of path.slice(0, -1)) v = (v as Record<string | number, Json>)[k];
  return v;
}

type Change = { kind: number; at: number; pick: number; value: Json; expression: string };

const change: fc.Arbitrary<Change> = fc.record({
  kind: fc.integer({ min: 0, max: 11 }),
  at: fc.nat(),
  pick: fc.nat(),
  value: fc.oneof(
    fc.jsonValue({ maxDepth: 3 }) as fc.Arbitrary<Json>,
    fc.constantFrom<Json>(1e308, -1e308, 5e-324, -0, 0, -1, 2 ** 53 + 1, "", " ", "toString", "constructor", "__proto__", "or", "max", "D", "psi0", "SDS"),
  ),
  expression: fc.oneof(mutated(SHIPPED_EXPRESSIONS), fc.constantFrom(...SHIPPED_EXPRESSIONS)),
});

/** One structural change to a ruleset value: its fields, names, ids, parameters and expressions. */
function applyChange(root: RulesetJson, c: Change): void {
  const all = paths(root as Json).filter((p) => p.length > 0);
  if (all.length === 0) {
    setOwn(root, "format", c.value); // every field deleted by earlier changes
    return;
  }
  const path = all[c.at % all.length];
  const parent = parentOf(root as Json, path) as Record<string | number, Json> | Json[];
  const key = path[path.length - 1];
  const combos = root.combinations;
  switch (c.kind) {
    case 0: // a field deleted
      if (Array.isArray(parent)) parent.splice(Number(key), 1);
      else delete parent[key];
      break;
    case 1: // a value of another type or an extreme number
      setOwn(parent, key, c.value);
      break;
    case 2: // a field renamed to a forbidden name, a word of the language or another field's name
      if (!Array.isArray(parent)) {
        const v = parent[key];
        delete parent[key];
        setOwn(parent, [...FORBIDDEN, "or", "max", "sqrt", "others", String(c.value)][c.pick % 8], v);
      }
      break;
    case 3: // a duplicate id
      if (Array.isArray(combos) && combos.length > 0) combos.push({ ...combos[c.pick % combos.length] });
      break;
    case 4: // an expression mutated
      if (Array.isArray(combos) && combos.length > 0) combos[c.pick % combos.length] = { ...combos[c.pick % combos.length], expression: c.expression };
      break;
    case 5: // a forbidden field added anywhere objects are
      if (!Array.isArray(parent) && typeof parent === "object" && parent !== null) setOwn(parent, FORBIDDEN[c.pick % 3], c.value);
      else setOwn(root, FORBIDDEN[c.pick % 3], { polluted: true });
      break;
    case 6: // a symbol attribute that names itself, another attribute or a symbol
      for (const s of Object.values((root.symbols ?? {}) as Record<string, Record<string, Json>>)) {
        if (s && typeof s === "object") setOwn(s, "attributes", { psi0: ["psi0", "psi1", "D", "SDS"][c.pick % 4] });
        break;
      }
      break;
    case 7: // a choice parameter whose values name itself, a symbol, or whose default is no choice
      setOwn(objectField(root, "parameters"), "cat", {
        type: "choice",
        description: "self-referring choice",
        default: ["cat", "toString", "A", "constructor"][c.pick % 4],
        choices: { A: { cat: 1, psi0: 0.5 }, B: { D: 2, psi0: 0.7 } },
      });
      break;
    case 8: // an orthogonal share that names itself or a symbol
      for (const s of Object.values((root.symbols ?? {}) as Record<string, Record<string, Json>>)) {
        if (s && typeof s === "object") {
          setOwn(s, "cases", "orthogonal");
          setOwn(s, "orthogonalShare", ["D", "psi0", "SDS", "orthogonalShare"][c.pick % 4]);
        }
        break;
      }
      break;
    case 9: // many combinations, near and over the member limit
      if (Array.isArray(combos) && combos.length > 0) {
        const n = [50, 199, 201][c.pick % 3];
        for (let k = combos.length; k < n; k++) combos.push({ ...combos[k % combos.length], id: `x${k}` });
      }
      break;
    case 10: // a parameter named like a symbol, or with min above max
      setOwn(objectField(root, "parameters"), ["D", "W", "k"][c.pick % 3], { type: "number", description: "clash", min: 2, max: 1, default: c.value as number });
      break;
    case 11: // a provenance entry naming combinations that do not exist
      if (Array.isArray(root.provenance)) root.provenance.push({ source: "x", status: "confirmed", covers: "x", combinations: Array.from({ length: 1 + (c.pick % 220) }, (_, k) => `missing${k}`) });
      break;
  }
}

/** A shipped ruleset with one to four structural changes, as JSON text. */
export const changedRuleset: fc.Arbitrary<string> = fc.tuple(fc.nat(), fc.array(change, { minLength: 1, maxLength: 4 })).map(([pick, changes]) => {
  const root = JSON.parse(SHIPPED_TEXTS[pick % SHIPPED_TEXTS.length]) as RulesetJson;
  for (const c of changes) applyChange(root, c);
  return JSON.stringify(root);
});

/** A shipped ruleset's text with edits at token boundaries (characters, JSON punctuation, forbidden keys). */
const JSON_PIECES = ["{", "}", "[", "]", ",", ":", '"', '"__proto__": {"x": 1},', '"constructor": 1,', '"id": "2",', "1e400", "-1e400", "null", "\\u0000", "\\", "\n"];

export const editedRulesetText: fc.Arbitrary<string> = fc
  .tuple(fc.nat(), fc.array(fc.record({ at: fc.nat(), cut: fc.integer({ min: 0, max: 40 }), piece: fc.constantFrom(...JSON_PIECES, ...PIECES) }), { minLength: 1, maxLength: 4 }))
  .map(([pick, edits]) => {
    let text = SHIPPED_TEXTS[pick % SHIPPED_TEXTS.length];
    for (const e of edits) {
      const at = e.at % (text.length + 1);
      text = text.slice(0, at) + e.piece + text.slice(at + e.cut);
    }
    return text;
  });

/** JSON nested around and far beyond the limit, in the fields a ruleset has and does not have. */
export const deepRuleset: fc.Arbitrary<string> = fc
  .tuple(fc.oneof(fc.integer({ min: 55, max: 70 }), fc.integer({ min: 70, max: 200_000 })), fc.constantFrom("notes", "symbols", "combinations", "x"), fc.constantFrom<[string, string]>(["[", "]"], ['{"a":', "}"], ["[", ""]))
  .map(([n, field, [open, close]]) => {
    const base = SHIPPED_TEXTS[n % SHIPPED_TEXTS.length];
    return `{"${field}": ${open.repeat(n)}1${close.repeat(n)}, ${base.slice(base.indexOf("{") + 1)}`;
  });

/** Ruleset files around the size limit and a megabyte beyond it: notes, one expression, a title. */
export const hugeRuleset: fc.Arbitrary<string> = fc.tuple(fc.nat(), fc.constantFrom(250_000, 262_145, 1_048_576), fc.constantFrom("notes", "expression", "description")).map(([pick, size, where]) => {
  const root = JSON.parse(SHIPPED_TEXTS[pick % SHIPPED_TEXTS.length]) as RulesetJson;
  const filler = "1.2D + ".repeat(Math.ceil(size / 7)).slice(0, size);
  if (where === "notes") setOwn(root, "notes", [filler]);
  else if (where === "expression") root.combinations[0] = { ...root.combinations[0], expression: filler };
  else setOwn(root, "title", filler);
  return JSON.stringify(root);
});

/** Random JSON values and random text where a ruleset is expected. */
export const randomRuleset: fc.Arbitrary<string> = fc.oneof(
  fc.json({ maxDepth: 4 }),
  fc.string({ unit: "binary", maxLength: 500 }),
  fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify({ format: "loadwright-ruleset/1", id: "r", symbols: v, combinations: [v], provenance: v, approval: v })),
);

/** A ruleset input as text and as the value it parses to (parsed here, outside the timed engine call). */
export interface RulesetInput {
  text: string;
  /** JSON.parse(text), or undefined where the text is not JSON. */
  value: unknown;
}

export function withValue(texts: fc.Arbitrary<string>): fc.Arbitrary<RulesetInput> {
  return texts.map((text) => {
    try {
      return { text, value: JSON.parse(text) as unknown };
    } catch {
      return { text, value: undefined };
    }
  });
}
