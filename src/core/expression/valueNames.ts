import type { Arith, Sum } from "./ast.js";

/** Every value name (parameter, choice value, attribute) a combination's factors read. */
export function valueNames(sum: Sum, out = new Set<string>()): Set<string> {
  for (const term of sum.terms) {
    if (term.factor) arithNames(term.factor, out);
    if (term.body.kind === "group") for (const alt of term.body.alternatives) valueNames(alt, out);
  }
  return out;
}

function arithNames(a: Arith, out: Set<string>): void {
  switch (a.kind) {
    case "name":
      out.add(a.name);
      break;
    case "negate":
      arithNames(a.operand, out);
      break;
    case "binary":
      arithNames(a.left, out);
      arithNames(a.right, out);
      break;
    case "choice":
      for (const o of a.options) arithNames(o, out);
      break;
    case "call":
      for (const x of a.args) arithNames(x, out);
      break;
    case "number":
      break;
  }
}
