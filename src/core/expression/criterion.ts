/**
 * Reads a criterion for governing rows — "max V", "min N", "max |M|",
 * "max sqrt(Vx^2 + Vy^2)", "max(V)", "max(V, N)" — with the arithmetic rules
 * every expression shares (grammar in parser.ts). Names are the components of
 * a case table: bare (V, Mx) or any header in square brackets ([M top]).
 */
import { operands, type Arith, type NameNode } from "./ast.js";
import { ArithmeticParser, Stop, type ParseFailure } from "./arithmeticParser.js";
import { constantFault } from "./evaluate.js";
import { lex, type Token } from "./lexer.js";
import { lengthFailure } from "./parser.js";

export type Sense = "max" | "min";

export interface ParsedCriterion {
  sense: Sense;
  expr: Arith;
  /** Every name `expr` reads, with the index of its component. */
  components: ReadonlyMap<string, number>;
}

/** What a criterion's names may be: the components, and a message for a name that is none of them. */
export interface ComponentNames {
  /** The index of a component, or undefined. */
  indexOf(name: string): number | undefined;
  /** Why a name is not a component (with the nearest component, if any). */
  unknown(name: string): string;
}

export type CriterionParse = { ok: true; criterion: ParsedCriterion } | { ok: false; error: ParseFailure };

export function parseCriterionText(text: string, names: ComponentNames): CriterionParse {
  const tooLong = lengthFailure(text, "criterion");
  if (tooLong) return { ok: false, error: tooLong };
  const lexed = lex(text);
  if (!lexed.ok) return { ok: false, error: { position: lexed.position, message: lexed.message, kind: "syntax" } };
  const parser = new CriterionParser(lexed.tokens, names, text);
  try {
    const criterion = parser.criterion();
    const fault = constantFault(criterion.expr);
    if (fault) return { ok: false, error: { position: fault.position, message: fault.message, kind: "syntax" } };
    return { ok: true, criterion };
  } catch (e) {
    if (e instanceof Stop) return { ok: false, error: e.failure };
    throw e;
  }
}

/**
 * The component names a criterion reads, in order of first use (where it does
 * not parse, those read before the fault), without reading any table: a
 * streamed file keeps only the result rows these name.
 */
export function criterionNames(text: string): string[] {
  const seen: string[] = [];
  const open: ComponentNames = {
    indexOf: (name) => {
      if (!seen.includes(name)) seen.push(name);
      return seen.indexOf(name);
    },
    unknown: () => "",
  };
  parseCriterionText(text, open);
  return seen;
}

class CriterionParser extends ArithmeticParser {
  private readonly components = new Map<string, number>();

  constructor(
    tokens: Token[],
    private readonly names: ComponentNames,
    private readonly text: string,
  ) {
    super(tokens);
  }

  protected isDefinedName(text: string): boolean {
    // A component named like a function is read as the component unless "(" follows it.
    return this.peekKind(1) !== "open" && this.names.indexOf(text) !== undefined;
  }

  /** In a criterion a value is multiplied only with "*". */
  protected juxtaposes(): boolean {
    return false;
  }

  protected nameNode(token: Token): Arith {
    const index = this.names.indexOf(token.text);
    if (index === undefined) {
      const fn = token.kind === "name" ? token.text.toLowerCase() : "";
      if (fn === "abs" || fn === "sqrt") this.stop(token.position, `write ${fn} with its value in brackets: ${fn}(V)`);
      if (fn === "max" || fn === "min") this.stop(token.position, `${fn} inside a criterion is a function: ${fn}(a, b) gives the ${fn === "max" ? "larger" : "smaller"} of a and b in each row`);
      this.stop(token.position, this.names.unknown(token.text), "unknown-name");
    }
    this.next();
    const node: NameNode = { kind: "name", name: token.text, span: this.spanOf(token) };
    this.components.set(token.text, index);
    return node;
  }

  protected override missingValue(token: Token): string {
    if (token.kind === "end") return `criterion "${this.text.trim()}" ends where a value is expected`;
    return `unexpected ${this.describe(token)}`;
  }

  protected override oneArgument(fn: "max" | "min"): string {
    return `${fn}(…) inside a criterion takes two or more values and gives the ${fn === "max" ? "larger" : "smaller"} in each row; the criterion's own sense comes first: "${fn} V" or "${fn}(V)"`;
  }

  /** criterion := sense arith | ("max" | "min") "(" arith ("," arith)+ ")" … */
  criterion(): ParsedCriterion {
    const first = this.t;
    const word = first.kind === "name" ? first.text.toLowerCase() : "";
    if (word !== "max" && word !== "min") {
      this.stop(first.position, `a criterion starts with max or min, e.g. "max V" or "min N"; found "${first.text}"`);
    }
    const sense: "max" | "min" = word;
    // "max(V, N)": the function max of the sense max, the largest of V and N over every row.
    if (!(this.peekKind(1) === "open" && this.commaInBracketAt(this.i + 1))) this.next();
    const expr = this.arith();
    if (!this.at("end")) {
      const after = this.t;
      const hint = after.kind === "name" || after.kind === "quoted" || after.kind === "number" || after.kind === "open" ? `; to multiply, write "*" before it` : "";
      this.stop(after.position, `unexpected ${this.describe(after)} after the criterion's expression${hint}`);
    }
    this.checkComponents(expr);
    return { sense, expr, components: this.components };
  }

  /** Does the bracket opening at token `index` hold a comma at its own level? */
  private commaInBracketAt(index: number): boolean {
    let depth = 0;
    for (let j = index; j < this.tokens.length; j++) {
      const kind = this.tokens[j].kind;
      if (kind === "open") depth++;
      else if (kind === "close" && --depth === 0) return false;
      else if (kind === "comma" && depth === 1) return true;
    }
    return false;
  }

  /** Every name node reached is mapped (a programming error otherwise). */
  private checkComponents(a: Arith): void {
    if (a.kind === "name" && !this.components.has(a.name)) throw new Error(`criterion name "${a.name}" was read without its component`);
    operands(a).forEach((o) => this.checkComponents(o));
  }
}
