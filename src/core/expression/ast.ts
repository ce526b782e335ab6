/**
 * The parsed form of combination expressions and criteria. Positions are 1-based
 * characters of the source text; `end` is one past the last character.
 */

export interface Span {
  start: number;
  end: number;
}

/** The functions of the arithmetic: abs(x), sqrt(x), max(a, b, …), min(a, b, …). */
export const FUNCTION_NAMES = ["abs", "sqrt", "max", "min"] as const;
export type FunctionName = (typeof FUNCTION_NAMES)[number];

export type BinaryOperator = "+" | "-" | "*" | "/" | "^";

/**
 * Arithmetic, shared by a combination's factors and by criteria: numbers, names
 * (parameters and symbol attributes in a factor, components in a criterion),
 * signs, + - * / ^, functions, and, in factors only, "(a or b)" choices.
 */
export type Arith =
  | { kind: "number"; value: number; span: Span }
  | { kind: "name"; name: string; span: Span }
  | { kind: "negate"; operand: Arith; span: Span }
  | { kind: "binary"; op: BinaryOperator; left: Arith; right: Arith; span: Span }
  | { kind: "call"; fn: FunctionName; args: Arith[]; span: Span }
  | { kind: "choice"; options: Arith[]; span: Span };

export type NameNode = Extract<Arith, { kind: "name" }>;
export type ChoiceNode = Extract<Arith, { kind: "choice" }>;

/** The nodes directly below one node, for walks that treat every operator alike. */
export function operands(a: Arith): readonly Arith[] {
  switch (a.kind) {
    case "number":
    case "name":
      return [];
    case "negate":
      return [a.operand];
    case "binary":
      return [a.left, a.right];
    case "call":
      return a.args;
    case "choice":
      return a.options;
  }
}

/** What a term's factor multiplies. */
export type Body =
  | { kind: "symbol"; name: string; span: Span }
  | { kind: "group"; alternatives: Sum[]; span: Span }
  | { kind: "lead"; symbols: { name: string; span: Span }[]; span: Span }
  | { kind: "others"; span: Span };

/** "+": as written; "-": negated; "±": both ways. */
export type TermSign = "+" | "-" | "±";

/** "must": never left out (`!`); "may": may be left out (`?`); null: the symbols decide. */
export type Presence = "must" | "may" | null;

export interface Term {
  sign: TermSign;
  factor: Arith | null;
  body: Body;
  presence: Presence;
  span: Span;
}

export interface Sum {
  terms: Term[];
  span: Span;
}

export const binary = (op: BinaryOperator, left: Arith, right: Arith): Arith => ({
  kind: "binary",
  op,
  left,
  right,
  span: { start: left.span.start, end: right.span.end },
});
