/**
 * The one arithmetic evaluator, for a combination's factors and for criteria
 * alike. Names are read through the caller (a parameter or symbol attribute in
 * a factor, a component of the row in a criterion). Arithmetic that has no
 * real, finite value — a division by zero, the square root of a negative
 * number, a negative number to a fractional power, a result too large for a
 * number — is a fault at the character where it happens, never NaN or Infinity.
 */
import { operands, type Arith, type ChoiceNode, type NameNode } from "./ast.js";

export interface ArithEnvironment {
  /** The value of a name. */
  name(node: NameNode): number;
  /** The option a choice takes (factors only); the first when not given. */
  option?(node: ChoiceNode): number;
}

export type FaultKind = "division-by-zero" | "square-root-of-negative" | "power-not-real" | "too-large";

export interface ArithFault {
  kind: FaultKind;
  /** 1-based character where the fault is: the divisor, the function, the operator. */
  position: number;
  /** What is wrong, without the place: "division by zero". */
  message: string;
}

export type ArithValue = { ok: true; value: number } | { ok: false; fault: ArithFault };

class Fault extends Error {
  constructor(readonly fault: ArithFault) {
    super(fault.message);
  }
}

export function evaluateArith(a: Arith, env: ArithEnvironment): ArithValue {
  try {
    return { ok: true, value: value(a, env) };
  } catch (e) {
    if (e instanceof Fault) return { ok: false, fault: e.fault };
    throw e;
  }
}

/**
 * The first fault that no value of a name can mend: in the parts of an
 * expression that read no name and make no choice (`1/0`, `sqrt(-4)`), and a
 * division by such a part that is zero (`V / 0`). A parser refuses these as
 * soon as they are read.
 */
export function constantFault(a: Arith): ArithFault | null {
  if (isConstant(a)) {
    const v = evaluateArith(a, { name: () => NaN });
    return v.ok ? null : v.fault;
  }
  for (const o of operands(a)) {
    const f = constantFault(o);
    if (f) return f;
  }
  if (a.kind === "binary" && a.op === "/" && isConstant(a.right)) {
    const divisor = evaluateArith(a.right, { name: () => NaN });
    if (divisor.ok && divisor.value === 0) return { kind: "division-by-zero", position: a.right.span.start, message: "division by zero" };
  }
  return null;
}

function isConstant(a: Arith): boolean {
  if (a.kind === "name" || a.kind === "choice") return false;
  return operands(a).every(isConstant);
}

function value(a: Arith, env: ArithEnvironment): number {
  switch (a.kind) {
    case "number":
      return a.value;
    case "name":
      return env.name(a);
    case "negate":
      return -value(a.operand, env);
    case "choice":
      return value(a.options[env.option?.(a) ?? 0], env);
    case "binary": {
      const l = value(a.left, env);
      const r = value(a.right, env);
      switch (a.op) {
        case "+":
          return finite(l + r, a);
        case "-":
          return finite(l - r, a);
        case "*":
          return finite(l * r, a);
        case "/":
          if (r === 0) throw new Fault({ kind: "division-by-zero", position: a.right.span.start, message: "division by zero" });
          return finite(l / r, a);
        case "^":
          return power(l, r, a);
      }
    }
    // falls through: every binary operator returns above
    case "call":
      return call(a, env);
  }
}

function power(base: number, exponent: number, node: Extract<Arith, { kind: "binary" }>): number {
  if (base === 0 && exponent < 0) {
    throw new Fault({ kind: "division-by-zero", position: node.left.span.start, message: `0 to the power ${shown(exponent)} is a division by zero` });
  }
  const v = Math.pow(base, exponent);
  if (Number.isNaN(v)) {
    throw new Fault({ kind: "power-not-real", position: node.right.span.start, message: `${shown(base)} to the power ${shown(exponent)} is not a real number (a negative number to a fractional power)` });
  }
  return finite(v, node);
}

function call(a: Extract<Arith, { kind: "call" }>, env: ArithEnvironment): number {
  switch (a.fn) {
    case "abs":
      return Math.abs(value(a.args[0], env));
    case "sqrt": {
      const x = value(a.args[0], env);
      if (x < 0) throw new Fault({ kind: "square-root-of-negative", position: a.span.start, message: `the square root of a negative number (${shown(x)})` });
      return Math.sqrt(x);
    }
    case "max": {
      let m = value(a.args[0], env);
      for (let k = 1; k < a.args.length; k++) m = Math.max(m, value(a.args[k], env));
      return m;
    }
    case "min": {
      let m = value(a.args[0], env);
      for (let k = 1; k < a.args.length; k++) m = Math.min(m, value(a.args[k], env));
      return m;
    }
  }
}

/** A number in a message as a person reads it: 12 significant digits at most (-4.2, not -4.199999999999999). */
function shown(v: number): string {
  return String(Number(v.toPrecision(12)));
}

function finite(v: number, node: Arith): number {
  if (Number.isFinite(v)) return v;
  throw new Fault({ kind: "too-large", position: node.span.start, message: "the result is too large to compute with" });
}
