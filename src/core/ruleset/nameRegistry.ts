/**
 * The names a ruleset gives — load symbols, parameters, the values choice
 * parameters set, symbol attributes — share one space: a name may stand for
 * one thing only, and never for a word of the expression language. The
 * registry records what each name stands for, for clash messages and for the
 * expression parser.
 */
import { KEYWORDS } from "../expression/parser.js";
import { problem, type Problem } from "../problems.js";
import type { ValueKind } from "./model.js";

export class NameRegistry {
  /** Name → what already uses it ("the load symbol D"). */
  private readonly owner = new Map<string, string>();
  /** Every name a factor may use, and what it is. */
  readonly values = new Map<string, ValueKind>();

  /** Claims a name for `what`; a problem at `path` when the name is a keyword or already stands for something else. */
  claim(name: string, what: string, path: (string | number)[]): Problem | null {
    if ((KEYWORDS as readonly string[]).includes(name)) {
      return problem("ruleset-name-clash", `"${name}" is a word of the expression language and cannot name ${what}`, { path });
    }
    const earlier = this.owner.get(name);
    if (earlier !== undefined && earlier !== what) {
      return problem("ruleset-name-clash", `"${name}" already names ${earlier}; it cannot also name ${what}`, { path });
    }
    this.owner.set(name, what);
    return null;
  }

  /** A value a factor may read by name: a number parameter's or a choice parameter's value. */
  isParameterValue(name: string): boolean {
    const kind = this.values.get(name);
    return kind === "parameter" || kind === "choice-value";
  }
}

/** Collects problems, skipping the nulls of checks that passed. */
export function collect(into: Problem[], ...found: (Problem | null)[]): void {
  for (const p of found) if (p) into.push(p);
}
