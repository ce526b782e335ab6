/**
 * Criteria for governing rows, written as text:
 *
 *   criterion := ("max" | "min") expr      max V, min N, max |M|, max N/2000 + M/350
 *   expr      := term (("+" | "-") term)*
 *   term      := unary (("*" | "/") unary)*
 *   unary     := "-" unary | primary
 *   primary   := number | component | "(" expr ")" | "|" expr "|" | "abs" primary
 *   component := a name (V, Mx) or any header in square brackets ([M top], [C1 / 0.5])
 *
 * A criterion that is linear in the components (or the absolute value of one,
 * maximised) is found exactly without listing rows; any other is evaluated on
 * every row, within the row limit.
 */
import { fail, ok, problem, type Result } from "../problems.js";
import { nearest } from "../text/nearest.js";

export type CriterionExpr =
  | { kind: "number"; value: number }
  | { kind: "component"; index: number }
  | { kind: "negate"; operand: CriterionExpr }
  | { kind: "abs"; operand: CriterionExpr }
  | { kind: "binary"; op: "+" | "-" | "*" | "/"; left: CriterionExpr; right: CriterionExpr };

export interface Affine {
  weights: Map<number, number>;
  constant: number;
}

export interface Criterion {
  text: string;
  sense: "max" | "min";
  expr: CriterionExpr;
  /** The expression as weights on components, where it is linear. */
  linear: Affine | null;
  /** max |linear|: the larger of max and −min of the linear part. */
  absLinear: Affine | null;
}

type Token = { kind: "number" | "name" | "op"; text: string; position: number };

export function parseCriterion(text: string, components: readonly string[]): Result<Criterion> {
  const tokens: Token[] = [];
  const re = /\s*(?:(\d+(?:\.\d+)?|\.\d+)|(\[[^\]]*\])|([\p{L}_][\p{L}\p{N}_]*)|([-+*/()|]))/uy;
  let i = 0;
  while (i < text.length) {
    if (/^\s*$/.test(text.slice(i))) break;
    re.lastIndex = i;
    const m = re.exec(text);
    if (!m) {
      const at = i + (text.slice(i).length - text.slice(i).trimStart().length);
      return fail(problem("criterion-syntax", `unexpected character "${text[at]}" in criterion "${text}"`, { position: at + 1 }));
    }
    const position = m.index + m[0].length - (m[1] ?? m[2] ?? m[3] ?? m[4]).length + 1;
    if (m[1]) tokens.push({ kind: "number", text: m[1], position });
    else if (m[2]) tokens.push({ kind: "name", text: m[2].slice(1, -1).trim(), position });
    else if (m[3]) tokens.push({ kind: "name", text: m[3], position });
    else tokens.push({ kind: "op", text: m[4], position });
    i = re.lastIndex;
  }
  let k = 0;
  const stop = (message: string, position = tokens[k]?.position ?? text.length + 1) => {
    throw new CriterionStop(message, position);
  };
  const peek = () => tokens[k];
  const isOp = (op: string) => tokens[k]?.kind === "op" && tokens[k].text === op;

  const primary = (): CriterionExpr => {
    const t = peek();
    if (!t) return stop(`criterion "${text}" ends where a value is expected`);
    if (t.kind === "number") {
      k++;
      return { kind: "number", value: Number(t.text) };
    }
    if (t.kind === "name" && t.text.toLowerCase() === "abs" && !components.includes(t.text)) {
      k++;
      return { kind: "abs", operand: primary() };
    }
    if (t.kind === "name") {
      k++;
      const index = components.indexOf(t.text);
      if (index < 0) {
        const guess = nearest(t.text, components);
        stop(`"${t.text}" is not a component of the case table${guess ? `; did you mean "${guess}"?` : ""} (components: ${components.join(", ")}; write names with spaces in [brackets])`, t.position);
      }
      return { kind: "component", index };
    }
    if (isOp("(")) {
      k++;
      const e = expr();
      if (!isOp(")")) stop('expected ")"');
      k++;
      return e;
    }
    if (isOp("|")) {
      k++;
      const e = expr();
      if (!isOp("|")) stop('expected a closing "|"');
      k++;
      return { kind: "abs", operand: e };
    }
    return stop(`unexpected "${t.text}"`);
  };
  const unary = (): CriterionExpr => {
    if (isOp("-")) {
      k++;
      return { kind: "negate", operand: unary() };
    }
    return primary();
  };
  const term = (): CriterionExpr => {
    let left = unary();
    while (isOp("*") || isOp("/")) {
      const op = tokens[k++].text as "*" | "/";
      left = { kind: "binary", op, left, right: unary() };
    }
    return left;
  };
  const expr = (): CriterionExpr => {
    let left = term();
    while (isOp("+") || isOp("-")) {
      const op = tokens[k++].text as "+" | "-";
      left = { kind: "binary", op, left, right: term() };
    }
    return left;
  };

  try {
    const first = tokens[k];
    const sense = first?.kind === "name" ? first.text.toLowerCase() : "";
    if (sense !== "max" && sense !== "min") {
      stop(`a criterion starts with max or min, e.g. "max V" or "min N"; found "${first?.text ?? ""}"`, first?.position ?? 1);
    }
    k++;
    const e = expr();
    if (k < tokens.length) stop(`unexpected "${tokens[k].text}" after the criterion's expression`);
    const linear = affine(e);
    const absLinear = sense === "max" && e.kind === "abs" ? affine(e.operand) : null;
    return ok({ text: text.trim(), sense: sense as "max" | "min", expr: e, linear, absLinear });
  } catch (error) {
    if (error instanceof CriterionStop) return fail(problem("criterion-syntax", error.message, { position: error.position, header: text }));
    throw error;
  }
}

class CriterionStop extends Error {
  constructor(
    message: string,
    readonly position: number,
  ) {
    super(message);
  }
}

/** The expression as constant + Σ weight·component, or null if it is not linear. */
export function affine(e: CriterionExpr): Affine | null {
  switch (e.kind) {
    case "number":
      return { weights: new Map(), constant: e.value };
    case "component":
      return { weights: new Map([[e.index, 1]]), constant: 0 };
    case "negate": {
      const a = affine(e.operand);
      return a && scale(a, -1);
    }
    case "abs":
      return null;
    case "binary": {
      const l = affine(e.left);
      const r = affine(e.right);
      if (!l || !r) return null;
      switch (e.op) {
        case "+":
          return add(l, r, 1);
        case "-":
          return add(l, r, -1);
        case "*":
          if (l.weights.size === 0) return scale(r, l.constant);
          if (r.weights.size === 0) return scale(l, r.constant);
          return null;
        case "/":
          return r.weights.size === 0 && r.constant !== 0 ? scale(l, 1 / r.constant) : null;
      }
    }
  }
}

function scale(a: Affine, s: number): Affine {
  return { weights: new Map([...a.weights].map(([k, w]) => [k, w * s])), constant: a.constant * s };
}

function add(a: Affine, b: Affine, sign: number): Affine {
  const weights = new Map(a.weights);
  for (const [k, w] of b.weights) weights.set(k, (weights.get(k) ?? 0) + sign * w);
  return { weights, constant: a.constant + sign * b.constant };
}

/** The criterion's value for one row's component values. */
export function evaluateCriterion(e: CriterionExpr, values: ArrayLike<number>): number {
  switch (e.kind) {
    case "number":
      return e.value;
    case "component":
      return values[e.index];
    case "negate":
      return -evaluateCriterion(e.operand, values);
    case "abs":
      return Math.abs(evaluateCriterion(e.operand, values));
    case "binary": {
      const l = evaluateCriterion(e.left, values);
      const r = evaluateCriterion(e.right, values);
      switch (e.op) {
        case "+":
          return l + r;
        case "-":
          return l - r;
        case "*":
          return l * r;
        case "/":
          return l / r;
      }
    }
  }
}
