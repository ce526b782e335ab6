/**
 * Parser for combination expressions as the codes print them. Our own recursive
 * descent; nothing is ever evaluated as JavaScript.
 *
 * Grammar (each rule with an example):
 *
 *   sum      := [sign] term (sign term)*          1.2D + 1.6L − 0.5W
 *   sign     := "+" | "-" | "±"                   "+-" and "-+" also mean ±: both ways
 *   term     := [factor ["*"]] body [mark]        0.5(Lr or S or R), rho*E!, (1.35 or 1.0)G
 *   factor   := fprimary (["*" | "/"] fprimary)*  1.5*psi0, 0.2SDS
 *   fprimary := number | value | "(" choice ")"   (1.2 + 0.2*SDS), (1.35 or 1.0)
 *   choice   := arith ("or" arith)*               1.35 or 1.0: one of them, each in turn
 *   arith    := product (("+" | "-") product)*    1.2 + 0.2*SDS
 *   product  := unary (["*" | "/"] unary)*        0.2SDS — juxtaposition multiplies
 *   unary    := "-" unary | fprimary
 *   body     := symbol                            D, Lr, W
 *             | "(" sum ("or" sum)* ")"           (Lr or S or R), (L or 0.5W), (0.6W)
 *             | "lead" "(" symbol ("," symbol)* ")"   lead(Q, S, W): each leads in turn
 *             | "others"                          the lead list's symbols that do not lead
 *   mark     := "!" | "?"                         ! never left out, ? may be left out
 *
 * `value` is a parameter, a value set by a choice parameter, or a symbol attribute
 * (psi0): which names are symbols and which are values comes from the ruleset, so
 * "(…)" is a factor when it holds no load symbol and a body when it does.
 */
import type { Arith, Body, Presence, Span, Sum, Term, TermSign } from "./ast.js";
import { binary } from "./ast.js";
import { lex, type Token, type TokenKind } from "./lexer.js";

export type NameKind = "symbol" | "value" | "unknown";

export interface NameClassifier {
  kind(name: string): NameKind;
  symbols(): readonly string[];
  values(): readonly string[];
}

export const KEYWORDS = ["or", "lead", "others"] as const;

export interface ParseFailure {
  position: number;
  message: string;
  kind: "syntax" | "unknown-name";
}

export type ParseResult = { ok: true; sum: Sum } | { ok: false; error: ParseFailure };

class Stop extends Error {
  constructor(readonly failure: ParseFailure) {
    super(failure.message);
  }
}

export function parseExpression(text: string, names: NameClassifier): ParseResult {
  const lexed = lex(text);
  if (!lexed.ok) return { ok: false, error: { position: lexed.position, message: lexed.message, kind: "syntax" } };
  if (lexed.tokens.length === 1) {
    return { ok: false, error: { position: 1, message: "the expression is empty", kind: "syntax" } };
  }
  const parser = new Parser(lexed.tokens, names);
  try {
    const sum = parser.sum(true);
    parser.expectEnd();
    return { ok: true, sum };
  } catch (e) {
    if (e instanceof Stop) return { ok: false, error: e.failure };
    throw e;
  }
}

class Parser {
  private i = 0;
  constructor(
    private readonly tokens: Token[],
    private readonly names: NameClassifier,
  ) {}

  private get t(): Token {
    return this.tokens[this.i];
  }
  private at(kind: TokenKind): boolean {
    return this.t.kind === kind;
  }
  private atWord(word: string): boolean {
    return this.t.kind === "name" && this.t.text === word;
  }
  private next(): Token {
    const token = this.t;
    if (token.kind !== "end") this.i++;
    return token;
  }
  private stop(position: number, message: string, kind: ParseFailure["kind"] = "syntax"): never {
    throw new Stop({ position, message, kind });
  }
  private describe(token: Token): string {
    return token.kind === "end" ? "the end of the expression" : `"${token.text}"`;
  }
  private endOfPrevious(): number {
    const prev = this.tokens[this.i - 1];
    return prev ? prev.position + prev.text.length : 1;
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
      if (token.text === "or") return false;
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

  /** factor := fprimary (["*" | "/"] fprimary)* ["*"] — ends where the body starts. */
  private factor(): Arith {
    let left = this.factorPrimary();
    for (;;) {
      if (this.at("times")) {
        this.next();
        if (this.atBodyStart()) return left;
        left = binary("*", left, this.factorPrimary());
      } else if (this.at("divide")) {
        this.next();
        left = binary("/", left, this.factorPrimary());
      } else if (!this.atBodyStart() && !this.atWord("or") && (this.at("number") || this.at("name") || this.at("open"))) {
        left = binary("*", left, this.factorPrimary());
      } else {
        return left;
      }
    }
  }

  /** fprimary := number | value | "(" choice ")" */
  private factorPrimary(): Arith {
    const token = this.t;
    if (token.kind === "number") {
      this.next();
      return { kind: "number", value: token.value as number, span: this.spanOf(token) };
    }
    if (token.kind === "name") {
      if (token.text === "or") this.stop(token.position, '"or" separates alternatives inside brackets: write (a or b)');
      const kind = this.names.kind(token.text);
      if (kind === "unknown") this.unknownName(token);
      if (kind === "symbol") this.stop(token.position, `expected a number or parameter, found the load symbol "${token.text}"`);
      this.next();
      return { kind: "name", name: token.text, span: this.spanOf(token) };
    }
    if (token.kind === "open") {
      this.next();
      const options: Arith[] = [this.arith()];
      while (this.atWord("or")) {
        this.next();
        options.push(this.arith());
      }
      this.close(token);
      const span = { start: token.position, end: this.endOfPrevious() };
      return options.length === 1 ? { ...options[0], span } : { kind: "choice", options, span };
    }
    if (token.kind === "minus") this.stop(token.position, 'a sign goes between terms; write "- 0.2W", or put a negative factor in brackets: (-0.2)W');
    this.stop(token.position, `expected a number, a parameter or a load symbol, found ${this.describe(token)}`);
  }

  /** arith := product (("+" | "-") product)* */
  private arith(): Arith {
    let left = this.product();
    while (this.at("plus") || this.at("minus")) {
      const op = this.next().kind === "plus" ? "+" : "-";
      left = binary(op, left, this.product());
    }
    if (this.at("plusminus")) this.stop(this.t.position, '"±" marks a term acting both ways; it cannot stand inside a factor');
    return left;
  }

  /** product := unary (["*" | "/"] unary)* */
  private product(): Arith {
    let left = this.unary();
    for (;;) {
      if (this.at("times") || this.at("divide")) {
        const op = this.next().kind === "times" ? "*" : "/";
        left = binary(op, left, this.unary());
      } else if ((this.at("number") || this.at("name") || this.at("open")) && !this.atWord("or")) {
        left = binary("*", left, this.unary());
      } else {
        return left;
      }
    }
  }

  private unary(): Arith {
    if (this.at("minus")) {
      const token = this.next();
      const operand = this.unary();
      return { kind: "negate", operand, span: { start: token.position, end: operand.span.end } };
    }
    const token = this.t;
    if (token.kind === "name" && token.text !== "or" && this.names.kind(token.text) === "symbol") {
      this.stop(token.position, `the load symbol "${token.text}" cannot stand inside a factor's brackets; write the factor, then the symbol: (1.2 + 0.2*SDS)D`);
    }
    if (token.kind === "name" && (token.text === "lead" || token.text === "others")) {
      this.stop(token.position, `"${token.text}" cannot stand inside a factor`);
    }
    return this.factorPrimary();
  }

  /** body := symbol | "(" sum ("or" sum)* ")" | lead(...) | others */
  private body(): Body {
    const token = this.t;
    if (token.kind === "name" && token.text === "lead") {
      this.next();
      const open = this.t;
      if (!this.at("open")) this.stop(open.position, 'write the leading actions in brackets: lead(Q, S, W)');
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
      this.close(open);
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
    const alternatives: Sum[] = [this.sum(false)];
    while (this.atWord("or")) {
      this.next();
      alternatives.push(this.sum(false));
    }
    this.close(token);
    return { kind: "group", alternatives, span: { start: token.position, end: this.endOfPrevious() } };
  }

  private close(open: Token): void {
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
      .map((t) => t.text)
      .join("");
  }

  private spanOf(token: Token): Span {
    return { start: token.position, end: token.position + token.text.length };
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
