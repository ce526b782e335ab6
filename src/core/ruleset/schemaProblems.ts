/**
 * Turns the schema library's issues into our problems: one sentence each, with
 * the JSON path, and for an unknown field the fields that are allowed there.
 */
import type { z } from "zod";
import { problem, type Problem } from "../problems.js";
import { nearest } from "../text/nearest.js";
import { allowedKeys } from "./schemaWalk.js";

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
  // What is left from JSON is a number or a boolean.
  return `${typeof value} ${JSON.stringify(value) ?? ""}`;
}

function valueAt(input: unknown, path: Path): unknown {
  let v: unknown = input;
  for (const key of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<string | number, unknown>)[key];
  }
  return v;
}
