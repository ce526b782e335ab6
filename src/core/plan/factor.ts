/**
 * Factor arithmetic: evaluation for one symbol (attributes such as psi0 take
 * that symbol's value), the choices "(1.35 or 1.0)" a factor holds, and the
 * factor written back as text for explanations.
 */
import type { Arith } from "../expression/ast.js";
import { evaluateArith } from "../expression/evaluate.js";
import { eachArithNode } from "../expression/walk.js";
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
  if (a)
    eachArithNode(a, (n) => {
      if (n.kind === "choice") out.push(n);
    });
  return out;
}

/** All assignments of a factor's choices, first option first. Nested choices are only assigned where reached. */
export function choiceAssignments(a: Arith | null): ChoiceAssignment[] {
  const nodes = choiceNodes(a);
  let assignments: Map<Arith, number>[] = [new Map<Arith, number>()];
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
    case "call":
      return a.args.map((x) => reachedKey(x, m)).join(",");
    default:
      return "";
  }
}

/** The factor's value for one symbol; arithmetic without a finite value or a missing parameter is a problem at its character. */
export function evaluateFactor(a: Arith, choice: ChoiceAssignment, symbol: LoadSymbol, scope: FactorScope): Result<number> {
  // The expression language's one evaluator; names read the symbol's attributes, then the parameters.
  // A name without a value is kept as the problem to give, and reads NaN so the evaluation finishes.
  let unnamed: Result<number> | null = null;
  const result = evaluateArith(a, {
    name: (n) => {
      const v = valueOf(n.name, n.span.start, symbol, scope);
      if (v.ok) return v.value;
      unnamed ??= v;
      return NaN;
    },
    option: (node) => choice.get(node) ?? 0,
  });
  if (unnamed) return unnamed;
  if (!result.ok) return fail(problem("expression-not-finite", `${result.fault.message} in the factor on ${symbol.name}`, { position: result.fault.position }));
  if (!Number.isFinite(result.value)) {
    return fail(problem("expression-not-finite", `the factor on ${symbol.name} is not a finite number (a division by zero?)`, { position: a.span.start }));
  }
  return ok(result.value);
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

const PRECEDENCE = { "+": 1, "-": 1, "*": 2, "/": 2, "^": 4 } as const;

function render(a: Arith, choice: ChoiceAssignment, parent: number): string {
  switch (a.kind) {
    case "number":
      return formatNumber(a.value);
    case "name":
      return a.name;
    case "negate":
      // A negative base of a power takes brackets: (-2) ^ 2.
      return parent > 3 ? `(-${render(a.operand, choice, 3)})` : `-${render(a.operand, choice, 3)}`;
    case "choice":
      return render(a.options[choice.get(a) ?? 0], choice, parent);
    case "call":
      return `${a.fn}(${a.args.map((x) => render(x, choice, 0)).join(", ")})`;
    case "binary": {
      const p = PRECEDENCE[a.op];
      const op = a.op === "*" ? "×" : a.op;
      // ^ groups from the right (2 ^ 3 ^ 2 is 2 ^ 9), the others from the left.
      const left = render(a.left, choice, p + (a.op === "^" ? 1 : 0));
      const right = render(a.right, choice, a.op === "^" ? 3 : p + (a.op === "-" || a.op === "/" ? 1 : 0));
      const text = `${left} ${op} ${right}`;
      return p < parent ? `(${text})` : text;
    }
  }
}

/** Texts of numbers already written: a ruleset's few factors are written again in every label and explanation. */
const written = new Map<number, string>();
const WRITTEN_LIMIT = 4096;

/** Numbers as an engineer writes them: 1.42, not 1.4200000000000002; no exponent for ordinary sizes. */
export function formatNumber(value: number): string {
  let text = written.get(value);
  if (text === undefined) {
    if (written.size >= WRITTEN_LIMIT) written.clear();
    written.set(value, (text = numberWritten(value)));
  }
  return text;
}

function numberWritten(value: number): string {
  if (value === 0) return "0";
  const rounded = Number(value.toPrecision(12));
  const abs = Math.abs(rounded);
  if (abs >= 1e-6 && abs < 1e15) return String(rounded);
  return rounded.toExponential();
}
