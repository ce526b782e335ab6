/**
 * A second, deliberately plain reading of the combination semantics (docs/rulesets.md,
 * "How concrete rows are formed"), written for the property tests only: it
 * enumerates every concrete row as a factor vector by brute force, straight
 * from the parsed expression, sharing nothing with src/core/plan or
 * src/core/evaluate. The engine's fast envelope and its own row listing are
 * both held to it.
 *
 * Semantics, as documented:
 * - a symbol takes one way of acting per row (one case or all, one sign);
 *   `sum` → all cases (and reversed, if reversible), `each` → one case at a
 *   time (and reversed), `orthogonal` → each case leading at 1 with the others
 *   at the share, every sign pattern;
 * - "(a or b)" takes one alternative — among those with a load in the table,
 *   if any; a factor "(x or y)" one option;
 * - "-" negates, "±" takes both signs;
 * - a top-level term may be absent: "?" yes, "!" no, otherwise iff every
 *   symbol in it may be (transient by default); a term inside an alternative
 *   only if marked "?";
 * - lead(…) takes each listed symbol that has cases in turn (none: it adds
 *   nothing); "others" stands for one term per non-leading listed symbol;
 * - a combination with a "!" term whose symbols have no cases gives no rows;
 * - an "independent" symbol written once as a term by itself becomes one term
 *   per case, each taking the term's factor options on its own; elsewhere its
 *   cases act together as under "sum".
 */
import type { Arith, Body, Sum, Term } from "../../../src/core/expression/ast.js";
import type { LoadSymbol, Ruleset } from "../../../src/core/ruleset/model.js";

export type Vector = Map<number, number>;

interface Ctx {
  ruleset: Ruleset;
  numbers: ReadonlyMap<string, number>;
  casesOf: Map<string, number[]>;
  state: Map<string, Vector>; // symbol → its factors on cases for this row
  only?: Map<string, Vector[]>; // a split-off term's own ways to act
  leader: string | null;
  leadSymbols: string[];
}

/** Every concrete row of every combination, as factor vectors (case index → factor). */
export function referenceRows(ruleset: Ruleset, numbers: ReadonlyMap<string, number>, caseSymbols: string[], modes: ReadonlyMap<string, string> = new Map()): Vector[] {
  const casesOf = new Map<string, number[]>(ruleset.symbols.map((s) => [s.name, []]));
  caseSymbols.forEach((s, i) => casesOf.get(s)?.push(i));
  const rows: Vector[] = [];
  for (const combination of ruleset.combinations) {
    const sum = combination.sum;
    const leadTerm = sum.terms.find((t) => t.body.kind === "lead");
    const leadSymbols = leadTerm && leadTerm.body.kind === "lead" ? leadTerm.body.symbols.map((s) => s.name) : [];
    if (sum.terms.some((t) => t.presence === "must" && symbolsIn(t.body, leadSymbols).every((s) => (casesOf.get(s) ?? []).length === 0))) continue;
    const independent = (s: string) => (modes.get(s) ?? ruleset.symbolByName.get(s)?.cases) === "independent" && (casesOf.get(s) ?? []).length > 1;
    const used = [...new Set(sum.terms.flatMap((t) => symbolsIn(t.body, leadSymbols)))];
    const stateLists = used.map((s) => statesOf(ruleset.symbolByName.get(s) as LoadSymbol, casesOf.get(s) ?? [], modes.get(s), numbers));
    const suppliedLeaders = leadSymbols.filter((s) => (casesOf.get(s) ?? []).length > 0);
    for (const leader of suppliedLeaders.length > 0 ? suppliedLeaders : [null]) {
      for (const assignment of cartesian(stateLists)) {
        const ctx: Ctx = { ruleset, numbers, casesOf, state: new Map(used.map((s, k) => [s, assignment[k]])), leader, leadSymbols };
        const terms: { term: Term; only?: Vector[] }[] = [];
        for (const t of sum.terms) {
          if (t.body.kind === "others") {
            for (const s of leadSymbols) if (s !== leader) terms.push({ term: { ...t, body: { kind: "symbol", name: s, span: t.body.span } } });
          } else if (t.body.kind === "symbol" && independent(t.body.name) && occurrences(sum, t.body.name) === 1) {
            // Each case a term of its own, with that case alone (and reversed, if reversible).
            const symbol = ruleset.symbolByName.get(t.body.name) as LoadSymbol;
            for (const c of casesOf.get(t.body.name) ?? []) terms.push({ term: t, only: symbol.reversible ? [new Map([[c, 1]]), new Map([[c, -1]])] : [new Map([[c, 1]])] });
          } else terms.push({ term: t });
        }
        let out: Vector[] = [new Map()];
        for (const { term, only } of terms) {
          const options = termVectors(term, [], only ? { ...ctx, only: new Map([[(term.body as { name: string }).name, only]]) } : ctx, false);
          out = out.flatMap((a) => options.map((b) => add(a, b)));
        }
        for (const row of out) rows.push(row);
      }
    }
  }
  return rows;
}

function sumVectors(terms: Term[], factors: { a: Arith; choice: Map<Arith, number> }[], ctx: Ctx, nested: boolean): Vector[] {
  let out: Vector[] = [new Map()];
  for (const term of terms) {
    const options = termVectors(term, factors, ctx, nested);
    const next: Vector[] = [];
    for (const a of out) for (const b of options) next.push(add(a, b));
    out = next;
  }
  return out;
}

function termVectors(term: Term, factors: { a: Arith; choice: Map<Arith, number> }[], ctx: Ctx, nested: boolean): Vector[] {
  const out: Vector[] = [];
  for (const choice of choicesOf(term.factor)) {
    const inner = term.factor ? [...factors, { a: term.factor, choice }] : factors;
    for (const v of bodyVectors(term.body, inner, ctx)) {
      if (term.sign === "-") out.push(scale(v, -1));
      else out.push(v);
      if (term.sign === "±") out.push(scale(v, -1));
    }
  }
  const symbols = symbolsIn(term.body, ctx.leadSymbols);
  const mayBeAbsent = term.presence === "may" || (!nested && term.presence === null && symbols.every((s) => ctx.ruleset.symbolByName.get(s)?.canBeAbsent));
  if (mayBeAbsent) out.push(new Map());
  return out;
}

function bodyVectors(body: Body, factors: { a: Arith; choice: Map<Arith, number> }[], ctx: Ctx): Vector[] {
  switch (body.kind) {
    case "symbol": {
      const symbol = ctx.ruleset.symbolByName.get(body.name) as LoadSymbol;
      let f = 1;
      for (const { a, choice } of factors) f *= evaluate(a, choice, symbol, ctx.numbers);
      const own = ctx.only?.get(body.name);
      return own ? own.map((v) => scale(v, f)) : [scale(ctx.state.get(body.name) ?? new Map(), f)];
    }
    case "lead":
      return ctx.leader === null ? [new Map()] : bodyVectors({ kind: "symbol", name: ctx.leader, span: body.span }, factors, ctx);
    case "group": {
      const supplied = body.alternatives.filter((alt) => alt.terms.some((t) => symbolsIn(t.body, ctx.leadSymbols).some((s) => (ctx.casesOf.get(s) ?? []).length > 0)));
      return (supplied.length > 0 ? supplied : body.alternatives).flatMap((alt) => sumVectors(alt.terms, factors, ctx, true));
    }
    case "others":
      throw new Error("others inside brackets");
  }
}

function statesOf(symbol: LoadSymbol, cases: number[], mode: string | undefined, numbers: ReadonlyMap<string, number>): Vector[] {
  if (cases.length === 0) return [new Map()];
  const m = mode ?? symbol.cases;
  const withReversal = (vs: Vector[]) => (symbol.reversible ? vs.flatMap((v) => [v, scale(v, -1)]) : vs);
  if (m === "sum" || m === "independent") return withReversal([new Map(cases.map((c) => [c, 1]))]);
  if (m === "each") return withReversal(cases.map((c) => new Map([[c, 1]])));
  const share = typeof symbol.orthogonalShare === "number" ? symbol.orthogonalShare : (numbers.get(symbol.orthogonalShare) as number);
  const out: Vector[] = [];
  for (let lead = 0; lead < cases.length; lead++) {
    for (let signs = 0; signs < 2 ** cases.length; signs++) {
      out.push(new Map(cases.map((c, k) => [c, (k === lead ? 1 : share) * ((signs >> k) & 1 ? -1 : 1)])));
    }
  }
  return out;
}

function evaluate(a: Arith, choice: Map<Arith, number>, symbol: LoadSymbol, numbers: ReadonlyMap<string, number>): number {
  switch (a.kind) {
    case "number":
      return a.value;
    case "name": {
      const attr = symbol.attributes.get(a.name);
      if (attr !== undefined) return typeof attr === "number" ? attr : (numbers.get(attr) as number);
      return numbers.get(a.name) as number;
    }
    case "negate":
      return -evaluate(a.operand, choice, symbol, numbers);
    case "choice":
      return evaluate(a.options[choice.get(a) as number], choice, symbol, numbers);
    case "binary": {
      const l = evaluate(a.left, choice, symbol, numbers);
      const r = evaluate(a.right, choice, symbol, numbers);
      return a.op === "+" ? l + r : a.op === "-" ? l - r : a.op === "*" ? l * r : a.op === "/" ? l / r : l ** r;
    }
    case "call": {
      const xs = a.args.map((x) => evaluate(x, choice, symbol, numbers));
      return a.fn === "abs" ? Math.abs(xs[0]) : a.fn === "sqrt" ? Math.sqrt(xs[0]) : a.fn === "max" ? Math.max(...xs) : Math.min(...xs);
    }
  }
}

/** Every assignment of a factor's choice nodes (nested ones included, even where not reached). */
function choicesOf(a: Arith | null): Map<Arith, number>[] {
  const nodes: Arith[] = [];
  const walk = (x: Arith | null) => {
    if (!x) return;
    if (x.kind === "choice") {
      nodes.push(x);
      x.options.forEach(walk);
    } else if (x.kind === "negate") walk(x.operand);
    else if (x.kind === "call") x.args.forEach(walk);
    else if (x.kind === "binary") {
      walk(x.left);
      walk(x.right);
    }
  };
  walk(a);
  return cartesian(nodes.map((n) => (n.kind === "choice" ? n.options.map((_, k) => k) : [0]))).map((ks) => new Map(nodes.map((n, i) => [n, ks[i]])));
}

/** How often a symbol is written in a combination; a lead(…) list counts once, "others" not at all. */
function occurrences(sum: Sum, name: string): number {
  let n = 0;
  for (const t of sum.terms) {
    if (t.body.kind === "symbol" && t.body.name === name) n++;
    else if (t.body.kind === "lead" && t.body.symbols.some((s) => s.name === name)) n++;
    else if (t.body.kind === "group") for (const alt of t.body.alternatives) n += occurrences(alt, name);
  }
  return n;
}

export function symbolsIn(body: Body, leadSymbols: string[]): string[] {
  switch (body.kind) {
    case "symbol":
      return [body.name];
    case "lead":
    case "others":
      return leadSymbols;
    case "group":
      return body.alternatives.flatMap((alt: Sum) => alt.terms.flatMap((t) => symbolsIn(t.body, leadSymbols)));
  }
}

function add(a: Vector, b: Vector): Vector {
  const out = new Map(a);
  for (const [k, v] of b) out.set(k, (out.get(k) ?? 0) + v);
  return out;
}

function scale(v: Vector, s: number): Vector {
  return new Map([...v].map(([k, x]) => [k, x * s]));
}

function cartesian<T>(lists: T[][]): T[][] {
  let out: T[][] = [[]];
  for (const list of lists) out = out.flatMap((prefix) => list.map((x) => [...prefix, x]));
  return out;
}

/** A vector as a sorted key with zeros dropped and factors rounded to 9 significant digits, for set comparison. */
export function vectorKey(v: Vector): string {
  return [...v]
    .filter(([, f]) => Math.abs(f) > 1e-12)
    .sort((a, b) => a[0] - b[0])
    .map(([k, f]) => `${k}:${Number(f.toPrecision(9))}`)
    .join(",");
}

export function dot(v: Vector, x: ArrayLike<number>): number {
  let s = 0;
  for (const [k, f] of v) s += f * x[k];
  return s;
}
