/**
 * Resolves a ruleset for one parameter set and one list of cases into a Plan.
 *
 * A combination's terms choose independently (which alternative, which sign,
 * which case of a symbol, left out or not), except for choices several terms
 * share: which action leads in lead(…)/others, and the case and direction of a
 * symbol written more than once. Those shared choices are enumerated as
 * branches; within a branch each term keeps its own list of options, so the
 * worst row is found term by term without enumerating the product.
 */
import type { Arith, Body, Sum, Term } from "../expression/ast.js";
import type { ParameterValues } from "../params/resolveParameters.js";
import { fail, ok, problem, type Problem, type Result } from "../problems.js";
import type { CaseMode, Combination, LoadSymbol, Ruleset } from "../ruleset/model.js";
import { choiceAssignments, evaluateFactor, factorText, type ChoiceAssignment } from "./factor.js";
import { symbolStates, type SymbolState } from "./symbolStates.js";
import type { Branch, Contribution, Plan, PlanCase, PlannedCombination, PlannedTerm, TermOption } from "./types.js";

/** Shared choices beyond this many branches per combination are refused (the row count would be absurd anyway). */
export const MAX_BRANCHES = 100_000;

export interface PlanInput {
  /** Case headers in table order; null plans one case per symbol, named by the symbol (for listing combinations). */
  cases: PlanCase[] | null;
  /** Symbol → how its cases combine, overriding the ruleset (from a case map). */
  modes?: ReadonlyMap<string, CaseMode>;
  /** Symbol → whether each case is also taken reversed, overriding the ruleset (from a case map). */
  reversible?: ReadonlyMap<string, boolean>;
}

export function planCombinations(ruleset: Ruleset, parameters: ParameterValues, input: PlanInput): Result<Plan> {
  const supplied = input.cases !== null;
  const cases: PlanCase[] = input.cases ?? ruleset.symbols.map((s) => ({ header: s.name, symbol: s.name }));
  const casesOf = new Map<string, number[]>(ruleset.symbols.map((s) => [s.name, []]));
  cases.forEach((c, i) => casesOf.get(c.symbol)?.push(i));
  const symbols = symbolAccess(ruleset, parameters, input, casesOf);

  const problems: Problem[] = [];
  const combinations: PlannedCombination[] = [];
  for (const combination of ruleset.combinations) {
    const planned = planOne(combination, ruleset, parameters, symbols, casesOf, supplied, cases);
    // Whatever went wrong inside a combination (a factor, a symbol's states) belongs to that entry.
    if (!planned.ok) problems.push(...planned.problems.map((p) => ({ ...p, place: { ...p.place, entry: combination.id } })));
    else combinations.push(planned.value);
  }
  if (problems.length > 0) return fail(...problems);
  const rowCount = combinations.reduce((n, c) => n + c.rowCount, 0);
  return ok({ ruleset, parameters, cases, casesOf, combinations, rowCount });
}

/** The ways each symbol can act, computed once per plan. */
interface SymbolAccess {
  statesOf: (symbol: string) => Result<SymbolState[]>;
  statesOfCase: (symbol: string, caseIndex: number) => Result<SymbolState[]>;
  /** The cases to give a term each, for a symbol whose cases take their factor options independently; else null. */
  independentCases: (symbol: string) => number[] | null;
}

function symbolAccess(ruleset: Ruleset, parameters: ParameterValues, input: PlanInput, casesOf: ReadonlyMap<string, number[]>): SymbolAccess {
  const cache = new Map<string, Result<SymbolState[]>>();
  const modeOf = (name: string): CaseMode => input.modes?.get(name) ?? (ruleset.symbolByName.get(name) as LoadSymbol).cases;
  const statesFor = (name: string, cases: number[], mode: CaseMode): Result<SymbolState[]> => {
    const symbol = ruleset.symbolByName.get(name) as LoadSymbol;
    const shareName = symbol.orthogonalShare;
    const share = typeof shareName === "number" ? shareName : (parameters.numbers.get(shareName) ?? NaN);
    if (typeof shareName === "string" && Number.isNaN(share) && mode === "orthogonal" && cases.length > 1) {
      // A share named by a parameter the user has not given: say so, never combine with NaN.
      const why = parameters.missing.get(shareName);
      return fail(problem("parameter-missing", `parameter ${shareName} has no default; give its value${why ? ` (${why})` : ""}: it is the share of the other directions of ${name}`));
    }
    const reversible = input.reversible?.get(name) ?? symbol.reversible;
    return symbolStates(symbol, cases, mode, share, reversible);
  };
  return {
    statesOf: (name) => {
      let states = cache.get(name);
      if (!states) cache.set(name, (states = statesFor(name, casesOf.get(name) ?? [], modeOf(name))));
      return states;
    },
    // One case of an "independent" symbol, as a term of its own.
    statesOfCase: (name, caseIndex) => statesFor(name, [caseIndex], "sum"),
    independentCases: (name) => (modeOf(name) === "independent" && (casesOf.get(name)?.length ?? 0) > 1 ? (casesOf.get(name) ?? []) : null),
  };
}

interface Context {
  ruleset: Ruleset;
  parameters: ParameterValues;
  statesOf: (symbol: string) => Result<SymbolState[]>;
  /** Symbol → the state every occurrence takes in this branch. */
  shared: ReadonlyMap<string, SymbolState>;
  /** Symbol → the states one split-off term of an "independent" symbol may take. */
  only?: ReadonlyMap<string, SymbolState[]>;
  /** Does the table have cases of this symbol? (Always, when planning without a table.) */
  hasCases: (symbol: string) => boolean;
  leader: string | null;
}

interface StackEntry {
  factor: Arith;
  choice: ChoiceAssignment;
}

/** What every branch of one combination shares: the combination, its lead(…) list, how often each symbol is written. */
interface CombinationShape {
  combination: Combination;
  leadSymbols: string[];
  occurrences: ReadonlyMap<string, number>;
  symbols: SymbolAccess;
  cases: PlanCase[];
}

function planOne(
  combination: Combination,
  ruleset: Ruleset,
  parameters: ParameterValues,
  symbols: SymbolAccess,
  casesOf: ReadonlyMap<string, number[]>,
  supplied: boolean,
  cases: PlanCase[],
): Result<PlannedCombination> {
  const { statesOf } = symbols;
  const { sum, expression } = combination;
  const leadTerm = sum.terms.find((t) => t.body.kind === "lead");
  const leadSymbols = leadTerm?.body.kind === "lead" ? leadTerm.body.symbols.map((s) => s.name) : [];
  const used = symbolsOfSum(sum, leadSymbols);
  const hasCases = (s: string) => (casesOf.get(s)?.length ?? 0) > 0;
  const notSupplied = supplied ? used.filter((s) => !hasCases(s)) : [];

  const base: Omit<PlannedCombination, "skipped" | "branches" | "rowCount"> = {
    combination,
    notSupplied,
    mayBeAbsent: sum.terms.filter((t) => canBeAbsent(t, ruleset, leadSymbols)).map((t) => termText(t, expression)),
  };

  // A "!" term is what the combination is about (the wind of 0.9D + 1.0W!): without it the row is not this combination.
  for (const term of sum.terms) {
    if (term.presence !== "must") continue;
    const symbols = term.body.kind === "others" ? leadSymbols : symbolsOfBody(term.body, leadSymbols);
    if (symbols.length > 0 && symbols.every((s) => !hasCases(s))) {
      return ok({ ...base, skipped: `${symbols.join(", ")} not in the case table`, branches: [], rowCount: 0 });
    }
  }

  // Shared choices: the leader, then every symbol written more than once with more than one way to act.
  const occurrences = countOccurrences(sum);
  const sharedSymbols: string[] = [];
  const sharedStates: SymbolState[][] = [];
  for (const [s, n] of occurrences) {
    if (n <= 1) continue;
    const states = statesOf(s);
    if (!states.ok) return states;
    if (states.value.length <= 1) continue;
    sharedSymbols.push(s);
    sharedStates.push(states.value);
  }
  // An action with no case in the table cannot lead; with none of them supplied, nothing leads.
  const suppliedLeaders = leadSymbols.filter((s) => !supplied || hasCases(s));
  const leaders: (string | null)[] = suppliedLeaders.length > 0 ? suppliedLeaders : [null];
  const branchCount = sharedStates.reduce((n, states) => n * states.length, leaders.length);
  if (branchCount > MAX_BRANCHES) {
    return fail(
      problem(
        "too-many-rows",
        `the choices its terms share (${[leadSymbols.length ? "the leading action" : "", ...sharedSymbols].filter(Boolean).join(", ")}) give ${branchCount} branches, more than ${MAX_BRANCHES}`,
        { entry: combination.id },
      ),
    );
  }

  const shape: CombinationShape = { combination, leadSymbols, occurrences, symbols, cases };
  const branches: Branch[] = [];
  for (const leader of leaders) {
    for (const assignment of product(sharedStates)) {
      const ctx: Context = {
        ruleset,
        parameters,
        statesOf,
        shared: new Map(sharedSymbols.map((s, k) => [s, assignment[k]])),
        hasCases: (s) => !supplied || hasCases(s),
        leader,
      };
      const branch = planBranch(shape, ctx);
      if (!branch.ok) return branch;
      branches.push(branch.value);
    }
  }
  const rowCount = branches.reduce((n, b) => n + b.terms.reduce((m, t) => m * t.options.length, 1), 0);
  return ok({ ...base, skipped: null, branches, rowCount });
}

/**
 * One branch: the combination's terms under one assignment of the shared
 * choices (the leader, a repeated symbol's way to act). "others" becomes one
 * term per non-leading action, and an "independent" symbol one term per case.
 */
function planBranch(shape: CombinationShape, ctx: Context): Result<Branch> {
  const { combination, leadSymbols, occurrences, symbols, cases } = shape;
  const { sum, expression } = combination;
  const leader = ctx.leader;
  const terms: (PlannedTerm & { leads: boolean })[] = [];
  for (const term of sum.terms) {
    if (term.body.kind === "others") {
      for (const s of leadSymbols) {
        if (s === leader) continue;
        const synthetic: Term = { ...term, body: { kind: "symbol", name: s, span: term.body.span } };
        const options = termOptions(synthetic, [], ctx, leadSymbols);
        if (!options.ok) return options;
        terms.push({ text: s, options: options.value, leads: false });
      }
      continue;
    }
    const split = term.body.kind === "symbol" && occurrences.get(term.body.name) === 1 ? symbols.independentCases(term.body.name) : null;
    if (split && term.body.kind === "symbol") {
      const name = term.body.name;
      for (const k of split) {
        const states = symbols.statesOfCase(name, k);
        if (!states.ok) return states;
        const options = termOptions(term, [], { ...ctx, only: new Map([[name, states.value]]) }, leadSymbols);
        if (!options.ok) return options;
        terms.push({ text: `${termText(term, expression)} [${cases[k].header}]`, options: options.value, leads: false });
      }
      continue;
    }
    const leads = term.body.kind === "lead";
    const options = termOptions(term, [], ctx, leadSymbols);
    if (!options.ok) return options;
    terms.push({ text: leads ? `${leader} (leading)` : termText(term, expression), options: options.value, leads });
  }
  // A term that loads no case in any option (its symbols are not in the table) adds nothing;
  // the combination's notSupplied list says so once, instead of every label saying "absent".
  const kept = terms.filter((t) => t.options.some((o) => o.contributions.length > 0));
  const branch: Branch = { note: leader ? `${leader} leading` : "", terms: kept.map(({ text, options }) => ({ text, options })) };
  const leaderTerm = kept.findIndex((t) => t.leads);
  if (leader && leaderTerm >= 0) branch.leader = { symbol: leader, term: leaderTerm };
  return ok(branch);
}

/**
 * A term's options. `nested`: the term stands inside an alternative, where it
 * acts whenever its alternative does unless marked "?" — absence by default is
 * decided for the whole top-level term, so "(Lr or S or R)!" never goes empty.
 */
function termOptions(term: Term, stack: StackEntry[], ctx: Context, leadSymbols: string[], nested = false): Result<TermOption[]> {
  const options: TermOption[] = [];
  for (const choice of choiceAssignments(term.factor)) {
    const inner = term.factor ? [...stack, { factor: term.factor, choice }] : stack;
    const body = bodyOptions(term.body, inner, ctx, leadSymbols);
    if (!body.ok) return body;
    for (const o of body.value) options.push(o);
  }
  const signed: TermOption[] = [];
  for (const o of options) {
    if (term.sign === "-") signed.push(negate(o, "-1 (subtracted)"));
    else signed.push(o);
    if (term.sign === "±") signed.push(negate(o, "-1 (other direction)"));
  }
  return ok(finalize(signed, nested ? term.presence === "may" : canBeAbsent(term, ctx.ruleset, leadSymbols)));
}

function bodyOptions(body: Body, stack: StackEntry[], ctx: Context, leadSymbols: string[]): Result<TermOption[]> {
  switch (body.kind) {
    case "symbol": {
      const symbol = ctx.ruleset.symbolByName.get(body.name) as LoadSymbol;
      const shared = ctx.shared.get(body.name);
      let states: SymbolState[];
      if (shared) states = [shared];
      else {
        const own = ctx.only?.get(body.name);
        const all = own ? ok(own) : ctx.statesOf(body.name);
        if (!all.ok) return all;
        states = all.value;
      }
      let factor = 1;
      for (const e of stack) {
        const f = evaluateFactor(e.factor, e.choice, symbol, ctx.parameters);
        if (!f.ok) return f;
        factor *= f.value;
      }
      const why = stack.map((e) => factorText(e.factor, e.choice)).concat(attributeNotes(stack, symbol, ctx));
      return ok(
        states.map((state) => ({
          absent: false,
          contributions: state.parts.map((p) => ({
            caseIndex: p.caseIndex,
            factor: factor * p.sign,
            why: productText([...why, p.why]),
          })),
        })),
      );
    }
    case "lead":
      return ctx.leader ? bodyOptions({ kind: "symbol", name: ctx.leader, span: body.span }, stack, ctx, leadSymbols) : ok([{ absent: false, contributions: [] }]);
    case "group": {
      // An alternative whose loads are not in the table is not taken (it is not "no load"), unless none is there.
      const supplied = body.alternatives.filter((alt) => symbolsOfSum(alt, leadSymbols).some(ctx.hasCases));
      const out: TermOption[] = [];
      for (const alternative of supplied.length > 0 ? supplied : body.alternatives) {
        const options = sumOptions(alternative, stack, ctx, leadSymbols);
        if (!options.ok) return options;
        for (const o of options.value) out.push(o);
      }
      return ok(out);
    }
    case "others":
      // Expanded into one term per non-leading symbol by planBranch; never reached inside brackets (rejected on load).
      return ok([]);
  }
}

/** A bracketed sum: the product of its terms' options, added together. */
function sumOptions(sum: Sum, stack: StackEntry[], ctx: Context, leadSymbols: string[]): Result<TermOption[]> {
  let combined: TermOption[] = [{ absent: false, contributions: [] }];
  for (const term of sum.terms) {
    const options = termOptions(term, stack, ctx, leadSymbols, true);
    if (!options.ok) return options;
    const next: TermOption[] = [];
    for (const a of combined) for (const b of options.value) next.push({ absent: false, contributions: [...a.contributions, ...b.contributions] });
    combined = next;
  }
  return ok(combined);
}

/** Psi values and the like, named with the symbol they were read for: "psi0 of W = 0.6". */
function attributeNotes(stack: StackEntry[], symbol: LoadSymbol, ctx: Context): string[] {
  const notes: string[] = [];
  const visit = (a: Arith) => {
    switch (a.kind) {
      case "name": {
        const attr = symbol.attributes.get(a.name);
        if (attr !== undefined) {
          const value = typeof attr === "number" ? attr : ctx.parameters.numbers.get(attr);
          const note = `(${a.name} of ${symbol.name} = ${value}${typeof attr === "string" ? `, from ${attr}` : ""})`;
          if (!notes.includes(note)) notes.push(note);
        }
        break;
      }
      case "negate":
        visit(a.operand);
        break;
      case "binary":
        visit(a.left);
        visit(a.right);
        break;
      case "choice":
        a.options.forEach(visit);
        break;
      case "call":
        a.args.forEach(visit);
        break;
      case "number":
        break;
    }
  };
  for (const e of stack) visit(e.factor);
  return notes.length > 0 ? [notes.join(" ")] : [];
}

/** Factors written as one product, bracketing any sum among several: "(1.2 + 0.2 × SDS) × 0.5". */
function productText(pieces: string[]): string {
  const present = pieces.filter((p) => p !== "");
  if (present.length === 0) return "1";
  if (present.length === 1) return present[0];
  return present.map((p) => (/ [+-] /.test(p) && !/^\(.*\)$/.test(p) ? `(${p})` : p)).join(" × ");
}

function negate(o: TermOption, why: string): TermOption {
  return { absent: o.absent, contributions: o.contributions.map((c) => ({ ...c, factor: -c.factor, why: c.why === "1" ? why : `${c.why} × ${why}` })) };
}

/**
 * Merge factors on the same case, drop zero factors, put "left out" last where
 * the term may be absent (an empty option is then the same thing), and keep the
 * first of options that are identical.
 */
function finalize(options: TermOption[], absentAllowed: boolean): TermOption[] {
  const merged = options.map((o) => ({ absent: o.absent, contributions: mergeContributions(o.contributions) }));
  const kept = absentAllowed ? merged.filter((o) => o.contributions.length > 0) : merged;
  if (absentAllowed) kept.push({ absent: true, contributions: [] });
  const seen = new Set<string>();
  return kept.filter((o) => {
    const key = o.contributions.map((c) => `${c.caseIndex}:${c.factor}`).join(",");
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function mergeContributions(contributions: Contribution[]): Contribution[] {
  const byCase = new Map<number, Contribution>();
  for (const c of contributions) {
    const before = byCase.get(c.caseIndex);
    if (before) byCase.set(c.caseIndex, { caseIndex: c.caseIndex, factor: before.factor + c.factor, why: `${before.why} + ${c.why}` });
    else byCase.set(c.caseIndex, c);
  }
  return [...byCase.values()].filter((c) => c.factor !== 0).sort((a, b) => a.caseIndex - b.caseIndex);
}

/** May this term be left out where that is worse? "?" yes, "!" no, otherwise only if every symbol in it may be. */
export function canBeAbsent(term: Term, ruleset: Ruleset, leadSymbols: string[]): boolean {
  if (term.presence === "may") return true;
  if (term.presence === "must") return false;
  const symbols = term.body.kind === "others" ? leadSymbols : symbolsOfBody(term.body, leadSymbols);
  return symbols.every((s) => ruleset.symbolByName.get(s)?.canBeAbsent ?? false);
}

function symbolsOfBody(body: Body, leadSymbols: string[]): string[] {
  switch (body.kind) {
    case "symbol":
      return [body.name];
    case "lead":
      return body.symbols.map((s) => s.name);
    case "others":
      return leadSymbols;
    case "group":
      return [...new Set(body.alternatives.flatMap((a) => symbolsOfSum(a, leadSymbols)))];
  }
}

function symbolsOfSum(sum: Sum, leadSymbols: string[]): string[] {
  return [...new Set(sum.terms.flatMap((t) => symbolsOfBody(t.body, leadSymbols)))];
}

/** How often each symbol is written; a lead(…) list counts once per symbol and "others" not at all. */
function countOccurrences(sum: Sum, counts = new Map<string, number>()): Map<string, number> {
  for (const term of sum.terms) {
    const body = term.body;
    if (body.kind === "symbol") counts.set(body.name, (counts.get(body.name) ?? 0) + 1);
    else if (body.kind === "lead") for (const s of body.symbols) counts.set(s.name, (counts.get(s.name) ?? 0) + 1);
    else if (body.kind === "group") for (const alt of body.alternatives) countOccurrences(alt, counts);
  }
  return counts;
}

/** The term as written, without its sign: "0.5(Lr or S or R)". */
function termText(term: Term, expression: string): string {
  const start = term.factor ? Math.min(term.factor.span.start, term.body.span.start) : term.body.span.start;
  return expression.slice(start - 1, term.span.end - 1).trim();
}

function* product<T>(lists: T[][]): Generator<T[]> {
  if (lists.length === 0) {
    yield [];
    return;
  }
  const [first, ...rest] = lists;
  for (const x of first) for (const tail of product(rest)) yield [x, ...tail];
}
