/**
 * Checks a schema-valid ruleset file for what a schema cannot see (names used
 * twice, defaults outside their ranges, expressions that do not parse or use a
 * value a symbol lacks) and builds the model the planner works from. Every
 * problem is collected, each with its JSON path and, in expressions, the
 * character position.
 */
import type { Arith, Sum } from "../expression/ast.js";
import { KEYWORDS, parseExpression, type NameClassifier } from "../expression/parser.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import type { Combination, LoadSymbol, Parameter, Ruleset, ValueKind } from "./model.js";
import type { RulesetFile } from "./schema.js";

/** ASCE/SEI 7-16 §12.5.3: 100 % in one direction plus 30 % in the perpendicular one [confirmed for the 7-10 text]. */
export const DEFAULT_ORTHOGONAL_SHARE = 0.3;

/**
 * `listedSymbols`: the symbols an "unknown name" message offers; by default the
 * ruleset's own (a list typed in cells offers the whole catalogue instead).
 */
export function buildRuleset(file: RulesetFile, origin: Ruleset["origin"] = "file", listedSymbols?: readonly string[]): Result<Ruleset> {
  const problems: Problem[] = [];
  const owner = new Map<string, string>(); // name → what already uses it, for clash messages

  const claim = (name: string, what: string, path: (string | number)[]) => {
    if ((KEYWORDS as readonly string[]).includes(name)) {
      problems.push(problem("ruleset-name-clash", `"${name}" is a word of the expression language and cannot name ${what}`, { path }));
      return;
    }
    const earlier = owner.get(name);
    if (earlier !== undefined && earlier !== what) {
      problems.push(problem("ruleset-name-clash", `"${name}" already names ${earlier}; it cannot also name ${what}`, { path }));
      return;
    }
    owner.set(name, what);
  };

  for (const name of Object.keys(file.symbols)) claim(name, `the load symbol ${name}`, ["symbols", name]);

  // Parameters and the values choice parameters set.
  const values = new Map<string, ValueKind>();
  const parameters: Parameter[] = [];
  for (const [name, p] of Object.entries(file.parameters ?? {})) {
    const path = ["parameters", name];
    claim(name, `the parameter ${name}`, path);
    if (p.type === "number") {
      values.set(name, "parameter");
      problems.push(...numberParameterProblems(name, p, path));
      const param: Parameter = { kind: "number", name, description: p.description };
      if (p.unit !== undefined) param.unit = p.unit;
      if (p.default !== undefined) param.default = p.default;
      if (p.min !== undefined) param.min = p.min;
      if (p.max !== undefined) param.max = p.max;
      if (p.allowed !== undefined) param.allowed = p.allowed;
      parameters.push(param);
    } else {
      const entries = Object.entries(p.choices);
      if (entries.length === 0) {
        problems.push(problem("ruleset-field", "must offer at least one choice", { path: [...path, "choices"] }));
        continue;
      }
      const valueNames = Object.keys(entries[0][1]);
      for (const [choice, set] of entries) {
        const names = Object.keys(set);
        const missing = valueNames.filter((v) => !names.includes(v));
        const extra = names.filter((v) => !valueNames.includes(v));
        if (missing.length > 0 || extra.length > 0) {
          problems.push(
            problem(
              "ruleset-field",
              `every choice must set the same values as "${entries[0][0]}" (${valueNames.join(", ")})` +
                (missing.length ? `; missing ${missing.join(", ")}` : "") +
                (extra.length ? `; extra ${extra.join(", ")}` : ""),
              { path: [...path, "choices", choice] },
            ),
          );
        }
      }
      if (!Object.hasOwn(p.choices, p.default)) {
        problems.push(
          problem("parameter-not-allowed", `default "${p.default}" is not one of the choices (${entries.map(([c]) => c).join(", ")})`, {
            path: [...path, "default"],
          }),
        );
      }
      for (const v of valueNames) {
        claim(v, `a value set by the choice parameter ${name}`, [...path, "choices", entries[0][0], v]);
        values.set(v, "choice-value");
      }
      parameters.push({
        kind: "choice",
        name,
        description: p.description,
        default: p.default,
        choices: new Map(entries.map(([c, set]) => [c, new Map(Object.entries(set))])),
        valueNames,
      });
    }
  }

  // Symbols and their attributes.
  const symbols: LoadSymbol[] = [];
  for (const [name, s] of Object.entries(file.symbols)) {
    const path = ["symbols", name];
    const permanent = s.permanence === "permanent";
    const attributes = new Map<string, number | string>();
    for (const [attr, v] of Object.entries(s.attributes ?? {})) {
      claim(attr, `the symbol attribute ${attr}`, [...path, "attributes", attr]);
      if (!values.has(attr)) values.set(attr, "attribute");
      if (typeof v === "string" && values.get(v) !== "parameter" && values.get(v) !== "choice-value") {
        problems.push(
          problem("expression-unknown-name", `"${v}" is not a parameter or a value set by a choice parameter`, {
            path: [...path, "attributes", attr],
          }),
        );
      }
      attributes.set(attr, v);
    }
    const share = s.orthogonalShare ?? DEFAULT_ORTHOGONAL_SHARE;
    if (typeof share === "string" && values.get(share) !== "parameter" && values.get(share) !== "choice-value") {
      problems.push(problem("expression-unknown-name", `"${share}" is not a parameter or a value set by a choice parameter`, { path: [...path, "orthogonalShare"] }));
    }
    if (typeof share === "number" && !(share >= 0 && share <= 1)) {
      problems.push(problem("parameter-out-of-range", `must be between 0 and 1, not ${share}`, { path: [...path, "orthogonalShare"] }));
    }
    if (s.orthogonalShare !== undefined && s.cases !== "orthogonal") {
      problems.push(problem("ruleset-field", 'only applies with "cases": "orthogonal"', { path: [...path, "orthogonalShare"] }));
    }
    symbols.push({
      name,
      description: s.description,
      permanent,
      reversible: s.reversible ?? false,
      cases: s.cases ?? (permanent ? "sum" : "each"),
      orthogonalShare: share,
      canBeAbsent: s.canBeAbsent ?? !permanent,
      attributes,
    });
  }
  const symbolByName = new Map(symbols.map((s) => [s.name, s]));
  const choiceNames = new Set(parameters.filter((p) => p.kind === "choice").map((p) => p.name));

  const names: NameClassifier = {
    kind: (n) => (symbolByName.has(n) ? "symbol" : values.has(n) ? "value" : "unknown"),
    symbols: () => listedSymbols ?? symbols.map((s) => s.name),
    values: () => [...values.keys()],
  };

  // Combinations.
  const combinations: Combination[] = [];
  const seenIds = new Map<string, number>();
  file.combinations.forEach((c, index) => {
    const path = ["combinations", index];
    const before = seenIds.get(c.id);
    if (before !== undefined) {
      problems.push(problem("ruleset-duplicate", `combination id "${c.id}" is already used by combinations[${before}]`, { path: [...path, "id"], entry: c.id }));
    } else {
      seenIds.set(c.id, index);
    }
    const parsed = parseExpression(c.expression, names);
    if (!parsed.ok) {
      const choiceHint = [...choiceNames].find((n) => c.expression.includes(n));
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
    const structural = structureProblems(parsed.sum, symbolByName, values);
    for (const s of structural) {
      problems.push(problem(s.kind, s.message, { path: [...path, "expression"], entry: c.id, position: s.position }));
    }
    const combination: Combination = { index, id: c.id, clause: c.clause, expression: c.expression, sum: parsed.sum };
    if (c.description !== undefined) combination.description = c.description;
    combinations.push(combination);
  });

  file.provenance.forEach((entry, index) => {
    entry.combinations?.forEach((id, k) => {
      if (!seenIds.has(id)) {
        const known = [...seenIds.keys()].join(", ");
        problems.push(problem("ruleset-field", `names combination "${id}", which this ruleset does not have (combinations: ${known})`, { path: ["provenance", index, "combinations", k] }));
      }
    });
  });

  if (problems.length > 0) return fail(...problems);
  return ok({
    file,
    origin,
    symbols,
    symbolByName,
    parameters,
    parameterByName: new Map(parameters.map((p) => [p.name, p])),
    values,
    combinations,
  });
}

function numberParameterProblems(
  name: string,
  p: { default?: number | undefined; min?: number | undefined; max?: number | undefined; allowed?: number[] | undefined },
  path: (string | number)[],
): Problem[] {
  const out: Problem[] = [];
  if (p.min !== undefined && p.max !== undefined && p.min > p.max) {
    out.push(problem("ruleset-field", `min (${p.min}) is above max (${p.max})`, { path }));
  }
  const inRange = (v: number) => (p.min === undefined || v >= p.min) && (p.max === undefined || v <= p.max);
  for (const v of p.allowed ?? []) {
    if (!inRange(v)) out.push(problem("parameter-out-of-range", `allowed value ${v} is outside min/max`, { path: [...path, "allowed"] }));
  }
  if (p.default !== undefined) {
    if (!inRange(p.default)) {
      out.push(problem("parameter-out-of-range", `default ${p.default} of ${name} is outside ${p.min ?? "−∞"} … ${p.max ?? "∞"}`, { path: [...path, "default"] }));
    }
    if (p.allowed && !p.allowed.includes(p.default)) {
      out.push(problem("parameter-not-allowed", `default ${p.default} of ${name} is not one of ${p.allowed.join(", ")}`, { path: [...path, "default"] }));
    }
  }
  return out;
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
    if (!a) return acc;
    switch (a.kind) {
      case "number":
        break;
      case "name":
        if (values.get(a.name) === "attribute") acc.push({ name: a.name, position: a.span.start });
        break;
      case "negate":
        attributesIn(a.operand, acc);
        break;
      case "binary":
        attributesIn(a.left, acc);
        attributesIn(a.right, acc);
        break;
      case "choice":
        for (const o of a.options) attributesIn(o, acc);
        break;
      case "call":
        for (const x of a.args) attributesIn(x, acc);
        break;
    }
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
