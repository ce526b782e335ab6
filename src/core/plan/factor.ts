/**
 * Factor arithmetic: evaluation for one symbol (attributes such as psi0 take
 * that symbol's value), the choices "(1.35 or 1.0)" a factor holds, and the
 * factor written back as text for explanations.
 */
import type { Arith } from "../expression/ast.js";
import { fail, ok, problem, type Result } from "../problems.js";
import type { LoadSymbol } from "../ruleset/model.js";

/** Which option each choice node takes. */
export type ChoiceAssignment = ReadonlyMap<Arith, number>;

export interface FactorScope {
  /** Parameter and choice-set values. */
  numbers: ReadonlyMap<string, number>;
  /** Parameters without default that were not given: name → description. */
  missing: ReadonlyMap<string, string>;
}

/** Every choice node of a factor, outermost first. */
export function choiceNodes(a: Arith | null, out: Arith[] = []): Arith[] {
  if (!a) return out;
  switch (a.kind) {
    case "choice":
      out.push(a);
      for (const o of a.options) choiceNodes(o, out);
      break;
    case "negate":
      choiceNodes(a.operand, out);
      break;
    case "binary":
      choiceNodes(a.left, out);
      choiceNodes(a.right, out);
      break;
    case "number":
    case "name":
      break;
  }
  return out;
}

/** All assignments of a factor's choices, first option first. Nested choices are only assigned where reached. */
export function choiceAssignments(a: Arith | null): ChoiceAssignment[] {
  const nodes = choiceNodes(a);
  let assignments: Map<Arith, number>[] = [new Map()];
  for (const node of nodes) {
    if (node.kind !== "choice") continue;
    const next: Map<Arith, number>[] = [];
    for (const partial of assignments) {
      for (let k = 0; k < node.options.length; k++) next.push(new Map(partial).set(node, k));
    }
    assignments = next;
  }
  // Assignments differing only in choices that are not reached give the same factor; keep the first.
  const seen = new Set<string>();
  return assignments.filter((m) => {
    const key = reachedKey(a, m);
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function reachedKey(a: Arith | null, m: ChoiceAssignment): string {
  if (!a) return "";
  switch (a.kind) {
    case "choice": {
      const k = m.get(a) ?? 0;
      return `${k}(${reachedKey(a.options[k], m)})`;
    }
    case "negate":
      return reachedKey(a.operand, m);
    case "binary":
      return `${reachedKey(a.left, m)},${reachedKey(a.right, m)}`;
    default:
      return "";
  }
}

/** The factor's value for one symbol; a division by zero, a value that is not finite or a missing parameter is a problem at its character. */
export function evaluateFactor(a: Arith, choice: ChoiceAssignment, symbol: LoadSymbol, scope: FactorScope): Result<number> {
  const value = evaluate(a, choice, symbol, scope);
  if (value.ok && !Number.isFinite(value.value)) {
    return fail(problem("expression-not-finite", `the factor on ${symbol.name} is not a finite number (a division by zero?)`, { position: a.span.start }));
  }
  return value;
}

function evaluate(a: Arith, choice: ChoiceAssignment, symbol: LoadSymbol, scope: FactorScope): Result<number> {
  switch (a.kind) {
    case "number":
      return ok(a.value);
    case "name":
      return valueOf(a.name, a.span.start, symbol, scope);
    case "negate": {
      const operand = evaluate(a.operand, choice, symbol, scope);
      return operand.ok ? ok(-operand.value) : operand;
    }
    case "binary": {
      const left = evaluate(a.left, choice, symbol, scope);
      if (!left.ok) return left;
      const right = evaluate(a.right, choice, symbol, scope);
      if (!right.ok) return right;
      const l = left.value;
      const r = right.value;
      switch (a.op) {
        case "+":
          return ok(l + r);
        case "-":
          return ok(l - r);
        case "*":
          return ok(l * r);
        case "/":
          if (r === 0) return fail(problem("expression-not-finite", `division by zero in the factor on ${symbol.name}`, { position: a.right.span.start }));
          return ok(l / r);
      }
    }
    // falls through: every binary operator returns above
    case "choice":
      return evaluate(a.options[choice.get(a) ?? 0], choice, symbol, scope);
  }
}

function valueOf(name: string, position: number, symbol: LoadSymbol, scope: FactorScope): Result<number> {
  const attribute = symbol.attributes.get(name);
  const valueName = attribute === undefined ? name : attribute;
  if (typeof valueName === "number") return ok(valueName);
  const v = scope.numbers.get(valueName);
  if (v !== undefined) return ok(v);
  const missing = scope.missing.get(valueName);
  if (missing !== undefined) return fail(problem("parameter-missing", `parameter ${valueName} has no default; give its value (${missing})`, { position }));
  return fail(problem("expression-not-finite", `"${valueName}" has no value for ${symbol.name}`, { position }));
}

/** The factor as a checker reads it, with the chosen option of each choice: "(1.2 + 0.2 × SDS)". */
export function factorText(a: Arith, choice: ChoiceAssignment): string {
  return render(a, choice, 0);
}

const PRECEDENCE = { "+": 1, "-": 1, "*": 2, "/": 2 } as const;

function render(a: Arith, choice: ChoiceAssignment, parent: number): string {
  switch (a.kind) {
    case "number":
      return formatNumber(a.value);
    case "name":
      return a.name;
    case "negate":
      return `-${render(a.operand, choice, 3)}`;
    case "choice":
      return render(a.options[choice.get(a) ?? 0], choice, parent);
    case "binary": {
      const p = PRECEDENCE[a.op];
      const op = a.op === "*" ? "×" : a.op;
      const text = `${render(a.left, choice, p)} ${op} ${render(a.right, choice, p + (a.op === "-" || a.op === "/" ? 1 : 0))}`;
      return p < parent ? `(${text})` : text;
    }
  }
}

/** Numbers as an engineer writes them: 1.42, not 1.4200000000000002; no exponent for ordinary sizes. */
export function formatNumber(value: number): string {
  if (value === 0) return "0";
  const rounded = Number(value.toPrecision(12));
  const abs = Math.abs(rounded);
  if (abs >= 1e-6 && abs < 1e15) return String(rounded);
  return rounded.toExponential();
}
