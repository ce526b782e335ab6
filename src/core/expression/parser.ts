/**
 * The expression language: combinations as the codes print them, and criteria
 * for governing rows, read by one lexer (lexer.ts) and one set of arithmetic
 * rules (arithmeticParser.ts). Our own recursive descent; nothing is ever
 * evaluated as JavaScript. This file reads combinations; criterion.ts reads
 * criteria.
 *
 * Grammar (each rule with an example):
 *
 * Arithmetic, shared by factors and criteria
 *   arith     := product (("+" | "-") product)*     1.2 + 0.2*SDS, N/2000 + M/350
 *   product   := unary (("*" | "/") unary)*         0.2*SDS, abs(T) / 120
 *              | unary unary…                        0.2SDS — in a factor, a value written right
 *                                                    after another multiplies it
 *   unary     := "-" unary | power                  -0.2, -V^2 (that is −(V²))
 *   power     := primary ["^" unary]                Vx^2, 2^-1, 2^3^2 (that is 2^9)
 *   primary   := number                             1.2, .5 (a decimal point, never a comma)
 *              | name                               SDS, psi0 (factor); V, [C1 top] (criterion)
 *              | call                               sqrt(Vx^2 + Vy^2)
 *              | "(" arith ")"                       (1.2 + 0.2*SDS)
 *              | "|" arith "|"                       |M| — the same as abs(M)
 *   call      := function "(" arith ("," arith)* ")"  abs(T), sqrt(x), max(a, b), min(a, b, c)
 *   function  := "abs" | "sqrt" | "max" | "min"     in any letter case; max and min take two or more
 *
 * Combinations
 *   sum       := [sign] term (sign term)*           1.2D + 1.6L − 0.5W
 *   sign      := "+" | "-" | "±"                    "+-" and "-+" also mean ±: both ways
 *   term      := [factor ["*"]] body [mark]         0.5(Lr or S or R), rho*E!, (1.35 or 1.0)G
 *   factor    := fvalue (["*" | "/"] fvalue)*       1.5*psi0, 0.2SDS, 0.5sqrt(SDS)
 *   fvalue    := power, without a leading sign      (1.2 + 0.2*SDS), SDS^0.5
 *   choice    := arith ("or" arith)*                (1.35 or 1.0): one of them, each in turn —
 *                                                    what "(" … ")" holds inside a factor
 *   body      := symbol                            D, Lr, W
 *              | "(" sum ("or" sum)* ")"           (Lr or S or R), (L or 0.5W), (0.6W)
 *              | "lead" "(" symbol ("," symbol)* ")"   lead(Q, S, W): each leads in turn
 *              | "others"                          the lead list's symbols that do not lead
 *   mark      := "!" | "?"                         ! never left out, ? may be left out
 *
 * Criteria (criterion.ts)
 *   criterion := sense arith                        max V, min N, max |M|, max N/2000 + M/350
 *              | sense "(" arith ")" …             max(V): the sense with brackets
 *              | ("max" | "min") "(" arith ("," arith)+ ")" …   max(V, N): the largest of V and N
 *   sense     := "max" | "min"                      in any letter case
 *   name      := a component: V, Mx, or any header in square brackets, [M top], [C1 / 0.5]
 *   In a criterion nothing is multiplied without "*", and "or" has no place.
 *
 * In a factor a name is a parameter, a value set by a choice parameter, or a
 * symbol attribute (psi0): which names are symbols and which are values comes
 * from the ruleset, so "(…)" is a factor when it holds no load symbol and a body
 * when it does. A name the ruleset or the table defines is that name; otherwise
 * a function word followed by "(" is the function.
 *
 * Limits (src/core/limits.ts): an expression or criterion holds at most
 * 2,000 characters and nests brackets, bars, functions, signs and powers at
 * most 32 deep; the choices of one expression's factors can be taken at most
 * 1,000 ways together. Arithmetic on numbers alone that has no value (1/0,
 * sqrt(-1)) is refused where it is written.
 */
import { binary, operands, type Arith, type Body, type Presence, type Span, type Sum, type Term, type TermSign } from "./ast.js";
import { ArithmeticParser, Stop, type ParseFailure } from "./arithmeticParser.js";
import { constantFault } from "./evaluate.js";
import { lex, type Token } from "./lexer.js";
import { FUNCTION_NAMES } from "./ast.js";
import { countText, LIMITS } from "../limits.js";

export type { ParseFailure } from "./arithmeticParser.js";

export type NameKind = "symbol" | "value" | "unknown";

export interface NameClassifier {
  kind(name: string): NameKind;
  symbols(): readonly string[];
  values(): readonly string[];
}

/** Words of the language, which cannot name a symbol, parameter or value. */
export const KEYWORDS = ["or", "lead", "others", ...FUNCTION_NAMES] as const;

export type ParseResult = { ok: true; sum: Sum } | { ok: false; error: ParseFailure };

/** Text over the stated length, or null: checked before anything else is read. */
export function lengthFailure(text: string, what: "expression" | "criterion"): ParseFailure | null {
  if (text.length <= LIMITS.expressionCharacters) return null;
  return {
    position: LIMITS.expressionCharacters + 1,
    message: `the ${what} has ${countText(text.length)} characters; at most ${countText(LIMITS.expressionCharacters)} are read`,
    kind: "syntax",
  };
}

export function parseExpression(text: string, names: NameClassifier): ParseResult {
  const tooLong = lengthFailure(text, "expression");
  if (tooLong) return { ok: false, error: tooLong };
  const lexed = lex(text);
  if (!lexed.ok) return { ok: false, error: { position: lexed.position, message: lexed.message, kind: "syntax" } };
  if (lexed.tokens.length === 1) {
    return { ok: false, error: { position: 1, message: "the expression is empty", kind: "syntax" } };
  }
  const parser = new CombinationParser(lexed.tokens, names);
  try {
    const sum = parser.sum(true);
    parser.expectEnd();
    checkFactors(sum);
    return { ok: true, sum };
  } catch (e) {
    if (e instanceof Stop) return { ok: false, error: e.failure };
    throw e;
  }
}

/** Arithmetic on numbers alone that has no value, and more ways to take the choices than the stated limit. */
function checkFactors(sum: Sum): void {
  let ways = 1;
  const visitChoices = (a: Arith) => {
    if (a.kind === "choice") {
      ways *= a.options.length;
      if (ways > LIMITS.factorChoices) {
        throw new Stop({ position: a.span.start, message: `the factors' "(a or b)" choices can be taken more than ${countText(LIMITS.factorChoices)} ways together`, kind: "syntax" });
      }
    }
    operands(a).forEach(visitChoices);
  };
  const visit = (s: Sum) => {
    for (const term of s.terms) {
      if (term.factor) {
        const fault = constantFault(term.factor);
        if (fault) throw new Stop({ position: fault.position, message: fault.message, kind: "syntax" });
        visitChoices(term.factor);
      }
      if (term.body.kind === "group") term.body.alternatives.forEach(visit);
    }
  };
  visit(sum);
}

class CombinationParser extends ArithmeticParser {
  constructor(
    tokens: Token[],
    private readonly names: NameClassifier,
  ) {
    super(tokens);
  }

  protected isDefinedName(text: string): boolean {
    return this.names.kind(text) !== "unknown";
  }

  /** Inside a factor's brackets a value written right after another multiplies it: (0.2SDS). */
  protected juxtaposes(): boolean {
    return (this.at("number") || this.at("name") || this.at("open")) && !this.atWord("or");
  }

  protected nameNode(token: Token): Arith {
    if (token.kind === "quoted") {
      this.stop(token.position, `square brackets name a component in a criterion; a combination writes its symbols and values without them ("${token.text}")`);
    }
    if (token.text === "or") this.stop(token.position, '"or" separates alternatives inside brackets: write (a or b)');
    if (token.text === "lead" || token.text === "others") this.stop(token.position, `"${token.text}" cannot stand inside a factor`);
    const kind = this.names.kind(token.text);
    if (kind === "unknown") this.unknownName(token);
    if (kind === "symbol") {
      if (this.bracketDepth > 0) {
        this.stop(token.position, `the load symbol "${token.text}" cannot stand inside a factor's brackets; write the factor, then the symbol: (1.2 + 0.2*SDS)D`);
      }
      this.stop(token.position, `expected a number or parameter, found the load symbol "${token.text}"`);
    }
    this.next();
    return { kind: "name", name: token.text, span: this.spanOf(token) };
  }

  /** "(" choice ")" in a factor: one value, or alternatives each taken in turn. */
  protected override bracketContents(): Arith {
    const start = this.t.position;
    const options: Arith[] = [this.arith()];
    while (this.atWord("or")) {
      this.next();
      options.push(this.arith());
    }
    return options.length === 1 ? options[0] : { kind: "choice", options, span: { start, end: this.endOfPrevious() } };
  }

  protected override missingValue(token: Token): string {
    return `expected a number, a parameter or a load symbol, found ${this.describe(token)}`;
  }

  expectEnd(): void {
    if (this.at("end")) return;
    if (this.at("close")) this.stop(this.t.position, 'this ")" has no matching "("');
    if (this.atWord("or")) this.stop(this.t.position, '"or" separates alternatives inside brackets: write (a or b)');
    if (this.at("divide")) {
      this.stop(this.t.position, "a factor goes before the load symbol it multiplies: write 0.5W, not W/2");
    }
    this.stop(this.t.position, `expected "+" or "-" before ${this.describe(this.t)}`);
  }

  /** sum := [sign] term (sign term)* — stops before ")", "or" and the end. */
  sum(topLevel: boolean): Sum {
    const start = this.t.position;
    const terms: Term[] = [];
    let sign: TermSign = "+";
    let signPosition: number | null = null;
    if (this.at("plus") || this.at("minus") || this.at("plusminus")) {
      signPosition = this.t.position;
      sign = this.signOf(this.next());
    }
    terms.push(this.term(sign, signPosition ?? this.t.position));
    while (this.at("plus") || this.at("minus") || this.at("plusminus")) {
      const signToken = this.next();
      terms.push(this.term(this.signOf(signToken), signToken.position));
    }
    // Inside brackets the caller closes (and reports an unclosed bracket at its "(").
    if (!topLevel && !(this.at("close") || this.atWord("or") || this.at("end"))) this.expectEnd();
    return { terms, span: { start, end: this.endOfPrevious() } };
  }

  private signOf(token: Token): TermSign {
    return token.kind === "plus" ? "+" : token.kind === "minus" ? "-" : "±";
  }

  /** term := [factor ["*"]] body [mark] */
  private term(sign: TermSign, start: number): Term {
    if (this.at("end") || this.at("close")) this.stop(this.t.position, `expected a load symbol before ${this.describe(this.t)}`);
    let factor: Arith | null = null;
    if (!this.atBodyStart()) {
      factor = this.factor();
    }
    if (!this.atBodyStart()) {
      const atBoundary = this.at("end") || this.at("plus") || this.at("minus") || this.at("plusminus") || this.at("close");
      if (atBoundary || this.atWord("or")) {
        const last = this.tokens[this.i - 1];
        if (factor && last.kind === "name") {
          this.stop(last.position, `"${last.text}" is not a load symbol of this ruleset, so nothing follows the factor (symbols: ${this.names.symbols().join(", ")})`);
        }
        if (factor) this.stop(factor.span.start, `the factor "${this.sourceOf(factor.span)}" multiplies no load symbol`);
        this.stop(this.t.position, `expected a load symbol before ${this.describe(this.t)}`);
      }
      this.stop(this.t.position, `expected a load symbol, found ${this.describe(this.t)}`);
    }
    const body = this.body();
    let presence: Presence = null;
    if (this.at("must") || this.at("may")) {
      presence = this.next().kind === "must" ? "must" : "may";
    }
    if (this.at("must") || this.at("may")) this.stop(this.t.position, 'a term takes one mark at most: "!" or "?"');
    return { sign, factor, body, presence, span: { start, end: this.endOfPrevious() } };
  }

  /** Is the next token the start of a body (a symbol, lead, others, or a bracket holding a symbol)? */
  private atBodyStart(): boolean {
    const token = this.t;
    if (token.kind === "name") {
      if (token.text === "lead" || token.text === "others") return true;
      if (token.text === "or" || this.atCall()) return false;
      const kind = this.names.kind(token.text);
      if (kind === "unknown") this.unknownName(token);
      return kind === "symbol";
    }
    if (token.kind === "open") return this.bracketHoldsSymbol(this.i);
    return false;
  }

  private bracketHoldsSymbol(openIndex: number): boolean {
    let depth = 0;
    for (let j = openIndex; j < this.tokens.length; j++) {
      const token = this.tokens[j];
      if (token.kind === "open") depth++;
      else if (token.kind === "close") {
        depth--;
        if (depth === 0) return false;
      } else if (token.kind === "name") {
        if (token.text === "lead" || token.text === "others") return true;
        if (token.text !== "or" && this.names.kind(token.text) === "symbol") return true;
      } else if (token.kind === "end") return false;
    }
    return false;
  }

  /** factor := fvalue (["*" | "/"] fvalue)* ["*"] — ends where the body starts. */
  private factor(): Arith {
    let left = this.factorValue();
    for (;;) {
      if (this.at("times")) {
        this.next();
        if (this.atBodyStart()) return left;
        left = binary("*", left, this.factorValue());
      } else if (this.at("divide")) {
        this.next();
        left = binary("/", left, this.factorValue());
      } else if (!this.atBodyStart() && !this.atWord("or") && (this.at("number") || this.at("name") || this.at("open"))) {
        left = binary("*", left, this.factorValue());
      } else {
        return left;
      }
    }
  }

  /** fvalue := power, without a leading sign (signs go between terms). */
  private factorValue(): Arith {
    const token = this.t;
    if (token.kind === "minus") this.stop(token.position, 'a sign goes between terms; write "- 0.2W", or put a negative factor in brackets: (-0.2)W');
    return this.power();
  }

  /** body := symbol | "(" sum ("or" sum)* ")" | lead(...) | others */
  private body(): Body {
    const token = this.t;
    if (token.kind === "name" && token.text === "lead") {
      this.next();
      const open = this.t;
      if (!this.at("open")) this.stop(open.position, "write the leading actions in brackets: lead(Q, S, W)");
      this.next();
      const symbols: { name: string; span: Span }[] = [];
      for (;;) {
        const s = this.t;
        if (s.kind !== "name" || this.names.kind(s.text) !== "symbol") {
          if (s.kind === "name" && this.names.kind(s.text) === "unknown") this.unknownName(s);
          this.stop(s.position, `lead(…) lists load symbols separated by commas; found ${this.describe(s)}`);
        }
        this.next();
        if (symbols.some((x) => x.name === s.text)) this.stop(s.position, `"${s.text}" is listed twice in lead(…)`);
        symbols.push({ name: s.text, span: this.spanOf(s) });
        if (this.at("comma")) {
          this.next();
          continue;
        }
        break;
      }
      this.closeBody(open);
      return { kind: "lead", symbols, span: { start: token.position, end: this.endOfPrevious() } };
    }
    if (token.kind === "name" && token.text === "others") {
      this.next();
      return { kind: "others", span: this.spanOf(token) };
    }
    if (token.kind === "name") {
      this.next();
      return { kind: "symbol", name: token.text, span: this.spanOf(token) };
    }
    // "(" sum ("or" sum)* ")"
    this.next();
    return this.nest(token.position, () => {
      const alternatives: Sum[] = [this.sum(false)];
      while (this.atWord("or")) {
        this.next();
        alternatives.push(this.sum(false));
      }
      this.closeBody(token);
      return { kind: "group", alternatives, span: { start: token.position, end: this.endOfPrevious() } };
    });
  }

  /** The ")" of a body: an unclosed one is shown at its "(". */
  private closeBody(open: Token): void {
    if (this.at("close")) {
      this.next();
      return;
    }
    if (this.at("end")) this.stop(open.position, 'this "(" is not closed');
    this.stop(this.t.position, `expected ")" to close the "(" at character ${open.position}, found ${this.describe(this.t)}`);
  }

  private sourceOf(span: Span): string {
    return this.tokens
      .filter((t) => t.position >= span.start && t.position < span.end && t.kind !== "end")
      .map((t) => (t.kind === "quoted" ? `[${t.text}]` : t.text))
      .join("");
  }

  private unknownName(token: Token): never {
    this.stop(token.position, unknownNameMessage(token.text, this.names), "unknown-name");
  }
}

/** "unknown name" with the nearest fix we can see: another casing, or a missing "*". */
export function unknownNameMessage(text: string, names: NameClassifier): string {
  const symbols = names.symbols();
  const values = names.values();
  let hint = "";
  const sameLetters = [...symbols, ...values].find((n) => n.toLowerCase() === text.toLowerCase());
  if (sameLetters) {
    hint = `; did you mean "${sameLetters}"?`;
  } else {
    for (const v of values) {
      const rest = text.slice(v.length);
      if (text.startsWith(v) && symbols.includes(rest)) {
        hint = `; did you mean "${v}*${rest}"?`;
        break;
      }
    }
  }
  const listed = (xs: readonly string[]) => (xs.length === 0 ? "none" : xs.join(", "));
  return `unknown name "${text}": not a load symbol or value of this ruleset${hint} (symbols: ${listed(symbols)}; values: ${listed(values)})`;
}
