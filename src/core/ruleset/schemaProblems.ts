/**
 * Turns the schema library's issues into our problems: one sentence each, with
 * the JSON path, and for an unknown field the fields that are allowed there.
 */
import type { z } from "zod";
import { problem, type Problem } from "../problems.js";
import { nearest } from "../text/nearest.js";

type Issue = z.core.$ZodIssue;
type Path = (string | number)[];

export function schemaProblems(issues: readonly Issue[], schema: z.ZodType, input: unknown): Problem[] {
  const out: Problem[] = [];
  for (const issue of issues) {
    const path = issue.path.filter((p): p is string | number => typeof p !== "symbol");
    if (issue.code === "unrecognized_keys") {
      const allowed = allowedKeys(schema, input, path);
      for (const key of issue.keys) {
        const guess = allowed ? nearest(key, allowed) : undefined;
        const hint = guess ? `; did you mean "${guess}"?` : allowed ? ` (allowed here: ${allowed.join(", ")})` : "";
        out.push(problem("ruleset-field", `unknown field "${key}"${hint}`, { path: [...path, key] }));
      }
      continue;
    }
    out.push(problem("ruleset-field", issueMessage(issue, valueAt(input, path)), { path }));
  }
  return out;
}

function issueMessage(issue: Issue, value: unknown): string {
  switch (issue.code) {
    case "invalid_type":
      return value === undefined ? `is required (${typeWord(issue.expected)})` : `must be ${typeWord(issue.expected)}, not ${describeValue(value)}`;
    case "invalid_value":
      return `must be ${issue.values.map((v) => JSON.stringify(v)).join(" or ")}, not ${describeValue(value)}`;
    case "invalid_union":
      if ("discriminator" in issue && issue.discriminator) {
        const options = (issue as { options?: unknown[] }).options ?? [];
        return `must be ${options.map((o) => JSON.stringify(o)).join(" or ")}, not ${describeValue(value)}`;
      }
      return "does not match any allowed form";
    case "invalid_key":
      return `is not an allowed name: ${issue.issues.map((i) => i.message).join("; ")}`;
    case "invalid_format":
    case "too_small":
    case "too_big":
    case "custom":
      return issue.message.replace(/^Invalid string: /, "");
    default:
      return issue.message;
  }
}

function typeWord(expected: string): string {
  switch (expected) {
    case "number":
      return "a number";
    case "string":
      return "text";
    case "boolean":
      return "true or false";
    case "object":
    case "record":
      return "an object";
    case "array":
      return "a list";
    default:
      return expected;
  }
}

function describeValue(value: unknown): string {
  if (value === null) return "null";
  if (Array.isArray(value)) return "a list";
  if (typeof value === "string") return `the text ${JSON.stringify(value)}`;
  if (typeof value === "object") return "an object";
  return `${typeof value} ${String(value)}`;
}

function valueAt(input: unknown, path: Path): unknown {
  let v: unknown = input;
  for (const key of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<string | number, unknown>)[key];
  }
  return v;
}

/** The field names a strict object at `path` allows, found by walking the schema alongside the input. */
function allowedKeys(schema: z.ZodType, input: unknown, path: Path): string[] | undefined {
  let node: z.ZodType | undefined = schema;
  let value: unknown = input;
  for (const key of [...path, null]) {
    node = unwrap(node, value);
    if (!node) return undefined;
    if (key === null) break;
    const def = node._zod.def as unknown as Record<string, unknown>;
    if (def.type === "object") node = (def.shape as Record<string, z.ZodType>)[String(key)];
    else if (def.type === "record") node = def.valueType as z.ZodType;
    else if (def.type === "array") node = def.element as z.ZodType;
    else return undefined;
    value = value !== null && typeof value === "object" ? (value as Record<string | number, unknown>)[key] : undefined;
  }
  const def = node?._zod.def as unknown as Record<string, unknown> | undefined;
  return def?.type === "object" ? Object.keys(def.shape as object) : undefined;
}

function unwrap(node: z.ZodType | undefined, value: unknown): z.ZodType | undefined {
  for (let guard = 0; node && guard < 8; guard++) {
    const def = node._zod.def as unknown as Record<string, unknown>;
    if (def.type === "optional" || def.type === "nullable") {
      node = def.innerType as z.ZodType;
    } else if (def.type === "union") {
      const options = def.options as z.ZodType[];
      const discriminator = def.discriminator as string | undefined;
      const tag = discriminator && value && typeof value === "object" ? (value as Record<string, unknown>)[discriminator] : undefined;
      node = options.find((o) => {
        const shape = (o._zod.def as unknown as { shape?: Record<string, z.ZodType> }).shape;
        const literal = shape && discriminator ? (shape[discriminator]?._zod.def as unknown as { values?: unknown[] }) : undefined;
        return literal?.values?.includes(tag);
      });
      if (!node) return undefined;
    } else {
      return node;
    }
  }
  return node;
}
