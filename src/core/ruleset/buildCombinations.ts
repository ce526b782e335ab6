/**
 * A ruleset's combinations: ids used once, expressions parsed against the
 * registry's names, lead/others placed where they mean something, and every
 * attribute a factor reads present on the symbols it multiplies.
 */
import type { Arith, Sum } from "../expression/ast.js";
import { parseExpression, type NameClassifier } from "../expression/parser.js";
import { eachArithNode } from "../expression/walk.js";
import { problem, type Problem } from "../problems.js";
import type { Combination, LoadSymbol, Parameter, ValueKind } from "./model.js";
import type { NameRegistry } from "./nameRegistry.js";
import type { RulesetFile } from "./schema.js";

export interface CombinationContext {
  names: NameRegistry;
  symbolByName: ReadonlyMap<string, LoadSymbol>;
  parameters: readonly Parameter[];
  /** The symbols an "unknown name" message offers. */
  listedSymbols: readonly string[];
}

/** The combinations that parse, and the index of the first combination with each id (for provenance checks). */
export function buildCombinations(file: RulesetFile, context: CombinationContext, problems: Problem[]): { combinations: Combination[]; ids: ReadonlyMap<string, number> } {
  const { names, symbolByName } = context;
  const choiceNames = context.parameters.filter((p) => p.kind === "choice").map((p) => p.name);
  const classifier: NameClassifier = {
    kind: (n) => (symbolByName.has(n) ? "symbol" : names.values.has(n) ? "value" : "unknown"),
    symbols: () => [...context.listedSymbols],
    values: () => [...names.values.keys()],
  };
  const combinations: Combination[] = [];
  const ids = new Map<string, number>();
  file.combinations.forEach((c, index) => {
    const path = ["combinations", index];
    const before = ids.get(c.id);
    if (before !== undefined) {
      problems.push(problem("ruleset-duplicate", `combination id "${c.id}" is already used by combinations[${before}]`, { path: [...path, "id"], entry: c.id }));
    } else {
      ids.set(c.id, index);
    }
    const parsed = parseExpression(c.expression, classifier);
    if (!parsed.ok) {
      const choiceHint = choiceNames.find((n) => c.expression.includes(n));
      const message =
        parsed.error.kind === "unknown-name" && choiceHint
          ? `${parsed.error.message}. "${choiceHint}" is a choice parameter: use the values it sets`
          : parsed.error.message;
      problems.push(
        problem(parsed.error.kind === "unknown-name" ? "expression-unknown-name" : "expression-syntax", message, {
          path: [...path, "expression"],
          entry: c.id,
          position: parsed.error.position,
        }),
      );
      return;
    }
    for (const s of structureProblems(parsed.sum, symbolByName, names.values)) {
      problems.push(problem(s.kind, s.message, { path: [...path, "expression"], entry: c.id, position: s.position }));
    }
    const combination: Combination = { index, id: c.id, clause: c.clause, expression: c.expression, sum: parsed.sum };
    if (c.description !== undefined) combination.description = c.description;
    combinations.push(combination);
  });
  return { combinations, ids };
}

interface StructureProblem {
  kind: "expression-structure" | "expression-attribute";
  message: string;
  position: number;
}

/** lead/others placement, and attributes that every symbol they multiply must have. */
function structureProblems(sum: Sum, symbols: ReadonlyMap<string, LoadSymbol>, values: ReadonlyMap<string, ValueKind>): StructureProblem[] {
  const out: StructureProblem[] = [];
  const leads = sum.terms.filter((t) => t.body.kind === "lead");
  const others = sum.terms.filter((t) => t.body.kind === "others");
  if (leads.length > 1) out.push({ kind: "expression-structure", message: "a combination takes one lead(…) at most", position: leads[1].body.span.start });
  if (others.length > 1) out.push({ kind: "expression-structure", message: '"others" may appear once', position: others[1].body.span.start });
  if (others.length > 0 && leads.length === 0) {
    out.push({ kind: "expression-structure", message: '"others" needs a lead(…) in the same combination', position: others[0].body.span.start });
  }
  const leadSymbols = leads[0]?.body.kind === "lead" ? leads[0].body.symbols.map((s) => s.name) : [];

  const attributesIn = (a: Arith | null, acc: { name: string; position: number }[] = []) => {
    if (a)
      eachArithNode(a, (n) => {
        if (n.kind === "name" && values.get(n.name) === "attribute") acc.push({ name: n.name, position: n.span.start });
      });
    return acc;
  };


  const check = (s: Sum, enclosing: { name: string; position: number }[], topLevel: boolean) => {
    for (const term of s.terms) {
      const attrs = [...enclosing, ...attributesIn(term.factor)];
      const body = term.body;
      const needAll = (symbolNames: string[]) => {
        for (const attr of attrs) {
          for (const sym of symbolNames) {
            if (!symbols.get(sym)?.attributes.has(attr.name)) {
              out.push({ kind: "expression-attribute", message: `the load symbol ${sym} has no attribute "${attr.name}" for this factor`, position: attr.position });
            }
          }
        }
      };
      switch (body.kind) {
        case "symbol":
          needAll([body.name]);
          break;
        case "lead":
          if (!topLevel) out.push({ kind: "expression-structure", message: "lead(…) must stand at the top level of the combination, not inside brackets", position: body.span.start });
          needAll(body.symbols.map((x) => x.name));
          break;
        case "others":
          if (!topLevel) out.push({ kind: "expression-structure", message: '"others" must stand at the top level of the combination, not inside brackets', position: body.span.start });
          needAll(leadSymbols);
          break;
        case "group":
          for (const alt of body.alternatives) check(alt, attrs, false);
          break;
      }
    }
  };
  check(sum, [], true);
  return out;
}
