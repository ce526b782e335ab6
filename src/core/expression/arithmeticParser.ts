/**
 * The arithmetic rules of the expression language (see the grammar in
 * parser.ts), shared by combination factors and criteria: one reading of
 * numbers, names, signs, + - * / ^, |…| and the functions abs, sqrt, max and
 * min. A subclass says what a name is (a parameter or attribute in a factor, a
 * component in a criterion), what brackets may hold ("(a or b)" in a factor),
 * and whether a value written right after another multiplies it (0.2SDS in a
 * factor). Nothing is ever evaluated as JavaScript.
 */
import { binary, FUNCTION_NAMES, type Arith, type FunctionName, type Span } from "./ast.js";
import type { Token, TokenKind } from "./lexer.js";
import { LIMITS } from "../limits.js";

export interface ParseFailure {
  position: number;
  message: string;
  kind: "syntax" | "unknown-name";
}

/** Ends a parse from any depth; caught where the parse began, never outside the parser. */
export class Stop extends Error {
  constructor(readonly failure: ParseFailure) {
    super(failure.message);
  }
}

/** The function word of a name, in any letter case ("SQRT" is sqrt), or null. */
export function functionNamed(text: string): FunctionName | null {
  const lower = text.toLowerCase();
  return (FUNCTION_NAMES as readonly string[]).includes(lower) ? (lower as FunctionName) : null;
}

export abstract class ArithmeticParser {
  protected i = 0;
  private nesting = 0;
  /** Factor brackets the parser is inside, for messages about what they may hold. */
  protected bracketDepth = 0;

  constructor(protected readonly tokens: Token[]) {}

  /** A name read as a value: a parameter or attribute in a factor, a component in a criterion. */
  protected abstract nameNode(token: Token): Arith;
  /** May the current token start a value that multiplies the one before it, written without "*"? */
  protected abstract juxtaposes(): boolean;
  /** Is this name, written here, a name of the ruleset or table rather than a function? */
  protected abstract isDefinedName(text: string): boolean;

  protected get t(): Token {
    return this.tokens[this.i];
  }
  protected at(kind: TokenKind): boolean {
    return this.t.kind === kind;
  }
  protected atWord(word: string): boolean {
    return this.t.kind === "name" && this.t.text === word;
  }
  protected next(): Token {
    const token = this.t;
    if (token.kind !== "end") this.i++;
    return token;
  }
  protected peekKind(offset: number): TokenKind {
    return this.tokens[Math.min(this.i + offset, this.tokens.length - 1)].kind;
  }
  protected stop(position: number, message: string, kind: ParseFailure["kind"] = "syntax"): never {
    throw new Stop({ position, message, kind });
  }
  protected describe(token: Token): string {
    if (token.kind === "end") return "the end of the expression";
    return token.kind === "quoted" ? `"[${token.text}]"` : `"${token.text}"`;
  }
  protected endOfPrevious(): number {
    const prev = this.tokens[this.i - 1];
    return prev ? prev.end : 1;
  }
  protected spanOf(token: Token): Span {
    return { start: token.position, end: token.end };
  }

  /** Runs one level of nesting (a bracket, a bar, a function, a sign, a power), refusing beyond the stated limit. */
  protected nest<T>(position: number, read: () => T): T {
    if (this.nesting >= LIMITS.expressionNesting) {
      this.stop(position, `brackets, |…|, functions, signs and powers are nested more than ${LIMITS.expressionNesting} deep here`);
    }
    this.nesting++;
    try {
      return read();
    } finally {
      this.nesting--;
    }
  }

  /** Is the current token a function word followed by "(" (and not a name of the ruleset or table)? */
  protected atCall(): boolean {
    return this.t.kind === "name" && this.peekKind(1) === "open" && functionNamed(this.t.text) !== null && !this.isDefinedName(this.t.text);
  }

  /** arith := product (("+" | "-") product)* */
  arith(): Arith {
    let left = this.product();
    while (this.at("plus") || this.at("minus")) {
      const op = this.next().kind === "plus" ? "+" : "-";
      left = binary(op, left, this.product());
    }
    if (this.at("plusminus")) this.stop(this.t.position, '"±" marks a term acting both ways; it cannot stand inside a factor or a criterion');
    return left;
  }

  /** product := unary (("*" | "/") unary | juxtaposed unary)* */
  protected product(): Arith {
    let left = this.unary();
    for (;;) {
      if (this.at("times") || this.at("divide")) {
        const op = this.next().kind === "times" ? "*" : "/";
        left = binary(op, left, this.unary());
      } else if (this.juxtaposes()) {
        left = binary("*", left, this.unary());
      } else {
        return left;
      }
    }
  }

  /** unary := "-" unary | power   (−V^2 is −(V²)) */
  protected unary(): Arith {
    if (this.at("minus")) {
      const token = this.next();
      const operand = this.nest(token.position, () => this.unary());
      return { kind: "negate", operand, span: { start: token.position, end: operand.span.end } };
    }
    return this.power();
  }

  /** power := primary ["^" unary]   (2^3^2 is 2^9) */
  protected power(): Arith {
    const base = this.primary();
    if (!this.at("power")) return base;
    const caret = this.next();
    const exponent = this.nest(caret.position, () => this.unary());
    return binary("^", base, exponent);
  }

  /** primary := number | name | call | "(" arith ")" | "|" arith "|" */
  protected primary(): Arith {
    const token = this.t;
    if (token.kind === "number") {
      this.next();
      return { kind: "number", value: token.value as number, span: this.spanOf(token) };
    }
    if (this.atCall()) return this.call();
    if (token.kind === "name" || token.kind === "quoted") return this.nameNode(token);
    if (token.kind === "open") {
      this.next();
      return this.nest(token.position, () => {
        this.bracketDepth++;
        try {
          const inner = this.bracketContents();
          this.close(token);
          return { ...inner, span: { start: token.position, end: this.endOfPrevious() } };
        } finally {
          this.bracketDepth--;
        }
      });
    }
    if (token.kind === "bar") {
      this.next();
      return this.nest(token.position, () => {
        const operand = this.arith();
        if (!this.at("bar")) this.stop(this.t.position, `expected a closing "|" for the "|" at character ${token.position}, found ${this.describe(this.t)}`);
        this.next();
        return { kind: "call", fn: "abs", args: [operand], span: { start: token.position, end: this.endOfPrevious() } };
      });
    }
    return this.stop(token.position, this.missingValue(token));
  }

  /** What a bracket in a primary holds: plain arithmetic (a factor adds "or" choices). */
  protected bracketContents(): Arith {
    return this.arith();
  }

  /** The message where a value is expected and `token` stands. */
  protected missingValue(token: Token): string {
    return `expected a number, a name or "(", found ${this.describe(token)}`;
  }

  /** call := function "(" arith ("," arith)* ")" — abs(x), sqrt(x), max(a, b, …), min(a, b, …) */
  protected call(): Arith {
    const word = this.next();
    const fn = functionNamed(word.text) as FunctionName;
    const open = this.next();
    return this.nest(word.position, () => {
      this.bracketDepth++;
      try {
        const args: Arith[] = [this.arith()];
        while (this.at("comma")) {
          this.next();
          args.push(this.arith());
        }
        if (!this.at("close")) {
          if (this.at("end")) this.stop(this.t.position, `expected ")" to close the "(" at character ${open.position}, found the end of the expression`);
          this.stop(this.t.position, `expected "," or ")" in ${fn}(…), found ${this.describe(this.t)}`);
        }
        this.next();
        const span = { start: word.position, end: this.endOfPrevious() };
        if ((fn === "abs" || fn === "sqrt") && args.length !== 1) this.stop(word.position, `${fn}(…) takes one value, not ${args.length}: ${fn}(x)`);
        if ((fn === "max" || fn === "min") && args.length < 2) this.stop(word.position, this.oneArgument(fn));
        return { kind: "call", fn, args, span };
      } finally {
        this.bracketDepth--;
      }
    });
  }

  /** max(x) or min(x) with one value. */
  protected oneArgument(fn: "max" | "min"): string {
    return `${fn}(…) takes two or more values separated by commas, the ${fn === "max" ? "larger" : "smaller"} of which it gives: ${fn}(a, b)`;
  }

  protected close(open: Token): void {
    if (this.at("close")) {
      this.next();
      return;
    }
    if (this.at("end")) this.stop(this.t.position, `expected ")" to close the "(" at character ${open.position}, found the end of the expression`);
    this.stop(this.t.position, `expected ")" to close the "(" at character ${open.position}, found ${this.describe(this.t)}`);
  }
}
