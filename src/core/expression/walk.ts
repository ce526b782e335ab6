import type { Arith } from "./ast.js";

/** Visits every node of a factor, each before the nodes inside it, left to right. */
export function eachArithNode(a: Arith, visit: (node: Arith) => void): void {
  visit(a);
  switch (a.kind) {
    case "negate":
      eachArithNode(a.operand, visit);
      break;
    case "binary":
      eachArithNode(a.left, visit);
      eachArithNode(a.right, visit);
      break;
    case "choice":
      for (const o of a.options) eachArithNode(o, visit);
      break;
    case "call":
      for (const x of a.args) eachArithNode(x, visit);
      break;
    case "number":
    case "name":
      break;
  }
}
