/**
 * The parsed form of a combination expression. Positions are 1-based characters
 * of the source expression; `end` is one past the last character.
 */

export interface Span {
  start: number;
  end: number;
}

/** Arithmetic of a factor: numbers, parameters, symbol attributes, and "(a or b)" choices. */
export type Arith =
  | { kind: "number"; value: number; span: Span }
  | { kind: "name"; name: string; span: Span }
  | { kind: "negate"; operand: Arith; span: Span }
  | { kind: "binary"; op: "+" | "-" | "*" | "/"; left: Arith; right: Arith; span: Span }
  | { kind: "choice"; options: Arith[]; span: Span };

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

export const num = (value: number, span: Span): Arith => ({ kind: "number", value, span });
export const name = (n: string, span: Span): Arith => ({ kind: "name", name: n, span });
export const binary = (op: "+" | "-" | "*" | "/", left: Arith, right: Arith): Arith => ({
  kind: "binary",
  op,
  left,
  right,
  span: { start: left.span.start, end: right.span.end },
});
