/**
 * Criteria for governing rows, written as text: "max V", "min N", "max |M|",
 * "max N/2000 + M/350", "max sqrt(Vx^2 + Vy^2)", "max abs(T) / 120 + abs(V) / 95",
 * "max(V)", "max(V, N)". They are read by the expression language's one parser
 * (grammar in src/core/expression/parser.ts) and valued by its one evaluator.
 *
 * A criterion that is linear in the components (or the absolute value of one,
 * maximised) is found exactly without listing rows; any other (sqrt, ^,
 * max(a, b), a product of components) is evaluated on every row, within the
 * row limit. A row where it has no value (a division by zero, the square root
 * of a negative number) is refused with the row and the character.
 */
import type { Arith } from "../expression/ast.js";
import { parseCriterionText, type ComponentNames } from "../expression/criterion.js";
import { evaluateArith, type ArithEnvironment, type ArithFault } from "../expression/evaluate.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import { nearest } from "../text/nearest.js";

export { criterionNames } from "../expression/criterion.js";

/** A criterion's expression: the arithmetic, and the index of the component each of its names reads. */
export interface CriterionExpr {
  tree: Arith;
  components: ReadonlyMap<string, number>;
}

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

export function parseCriterion(text: string, components: readonly string[]): Result<Criterion> {
  const indexes = new Map<string, number>();
  components.forEach((c, k) => {
    if (!indexes.has(c)) indexes.set(c, k);
  });
  const names: ComponentNames = {
    indexOf: (name) => indexes.get(name),
    unknown: (name) => {
      const guess = nearest(name, components);
      return `"${name}" is not a component of the case table${guess ? `; did you mean "${guess}"?` : ""} (components: ${components.join(", ")}; write names with spaces in [brackets])`;
    },
  };
  const parsed = parseCriterionText(text, names);
  if (!parsed.ok) return fail(problem("criterion-syntax", parsed.error.message, { position: parsed.error.position, header: text }));
  const { sense, expr: tree, components: reads } = parsed.criterion;
  const expr: CriterionExpr = { tree, components: reads };
  const linear = affine(expr);
  // Brackets leave no node of their own, so "max (|M|)" is the absolute value too.
  const absLinear = sense === "max" && tree.kind === "call" && tree.fn === "abs" ? affine({ tree: tree.args[0], components: reads }) : null;
  return ok({ text: text.trim(), sense, expr, linear, absLinear });
}

/** The expression as constant + Σ weight·component, or null if it is not linear. */
export function affine(e: CriterionExpr): Affine | null {
  const walk = (a: Arith): Affine | null => {
    switch (a.kind) {
      case "number":
        return { weights: new Map(), constant: a.value };
      case "name":
        return { weights: new Map([[e.components.get(a.name) as number, 1]]), constant: 0 };
      case "negate": {
        const x = walk(a.operand);
        return x && scale(x, -1);
      }
      case "choice":
        return null;
      case "call":
      case "binary": {
        if (a.kind === "binary" && a.op !== "^") {
          const l = walk(a.left);
          const r = walk(a.right);
          if (!l || !r) return null;
          switch (a.op) {
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
        // Powers and functions are linear only when they read no component: a constant.
        const v = constantValue(a);
        return v === null ? null : { weights: new Map(), constant: v };
      }
    }
  };
  return walk(e.tree);
}

function constantValue(a: Arith): number | null {
  let readsName = false;
  const v = evaluateArith(a, {
    name: () => {
      readsName = true;
      return 1;
    },
  });
  return readsName || !v.ok ? null : v.value;
}

function scale(a: Affine, s: number): Affine {
  return { weights: new Map([...a.weights].map(([k, w]) => [k, w * s])), constant: a.constant * s };
}

function add(a: Affine, b: Affine, sign: number): Affine {
  const weights = new Map(a.weights);
  for (const [k, w] of b.weights) weights.set(k, (weights.get(k) ?? 0) + sign * w);
  return { weights, constant: a.constant + sign * b.constant };
}

function environment(e: CriterionExpr, values: ArrayLike<number>): ArithEnvironment {
  return { name: (node) => values[e.components.get(node.name) as number] };
}

/**
 * The criterion's value for one row's component values; NaN where it has none
 * (a division by zero, the square root of a negative number), which
 * `criterionFault` then says in words.
 */
export function evaluateCriterion(e: CriterionExpr, values: ArrayLike<number>): number {
  const v = evaluateArith(e.tree, environment(e, values));
  return v.ok ? v.value : NaN;
}

/** Why a criterion has no value for a row, at the character where it fails. */
export function criterionFault(criterion: Criterion, values: ArrayLike<number>, rowLabel: string): Problem {
  const v = evaluateArith(criterion.expr.tree, environment(criterion.expr, values));
  const fault: ArithFault = v.ok ? { kind: "too-large", position: 1, message: `the value ${v.value} is not a finite number` } : v.fault;
  return problem("criterion-syntax", `criterion "${criterion.text}" has no value in row ${rowLabel}: ${fault.message}`, {
    position: fault.position,
    header: criterion.text,
  });
}
