/**
 * The file format's schema read as data, through zod 4's public API: which
 * fields a strict object allows at a JSON path of a given file (for "unknown
 * field" messages), following optional and nullable fields, records, lists
 * and the parameter kinds by their "type".
 */
import { z } from "zod";

type Path = readonly (string | number)[];

/** The field names the schema allows at `path` of `input`, where the schema has a strict object there. */
export function allowedKeys(schema: z.core.$ZodType, input: unknown, path: Path): string[] | undefined {
  let node: z.core.$ZodType | undefined = schema;
  let value: unknown = input;
  for (const key of path) {
    node = unwrap(node, value);
    node = node ? child(node, key) : undefined;
    if (!node) return undefined;
    value = value !== null && typeof value === "object" ? (value as Record<string | number, unknown>)[key] : undefined;
  }
  const object = unwrap(node, value);
  return object instanceof z.ZodObject ? Object.keys(object.shape) : undefined;
}

/** The schema of `key` inside an object, a record or a list. */
function child(node: z.core.$ZodType, key: string | number): z.core.$ZodType | undefined {
  if (node instanceof z.ZodObject) return (node.shape as Record<string, z.core.$ZodType>)[String(key)];
  if (node instanceof z.ZodRecord) return node.valueType;
  if (node instanceof z.ZodArray) return node.element;
  return undefined;
}

/** Through optional and nullable wrappers, and into the union member whose discriminator the value carries. */
function unwrap(node: z.core.$ZodType | undefined, value: unknown): z.core.$ZodType | undefined {
  let current = node;
  for (;;) {
    if (current instanceof z.ZodOptional || current instanceof z.ZodNullable) {
      current = current.unwrap();
    } else if (current instanceof z.ZodDiscriminatedUnion) {
      current = member(current, value);
    } else {
      return current;
    }
  }
}

function member(union: z.ZodDiscriminatedUnion, value: unknown): z.core.$ZodType | undefined {
  const discriminator = union.def.discriminator;
  const tag = value !== null && typeof value === "object" ? (value as Record<string, unknown>)[discriminator] : undefined;
  return union.options.find((option) => {
    if (!(option instanceof z.ZodObject)) return false;
    const literal = (option.shape as Record<string, z.core.$ZodType>)[discriminator];
    return literal instanceof z.ZodLiteral && (literal.values as Set<unknown>).has(tag);
  });
}
