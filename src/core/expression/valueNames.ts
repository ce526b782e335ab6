import type { Arith, Sum } from "./ast.js";
import { eachArithNode } from "./walk.js";

/** Every value name (parameter, choice value, attribute) a combination's factors read. */
export function valueNames(sum: Sum, out = new Set<string>()): Set<string> {
  for (const term of sum.terms) {
    if (term.factor) arithNames(term.factor, out);
    if (term.body.kind === "group") for (const alt of term.body.alternatives) valueNames(alt, out);
  }
  return out;
}

function arithNames(a: Arith, out: Set<string>): void {
  eachArithNode(a, (n) => {
    if (n.kind === "name") out.add(n.name);
  });
}
