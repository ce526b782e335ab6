/**
 * Where a value sits in a JSON text: the line and column of the value at a
 * path such as ["combinations", 2, "expression"], and of a character inside a
 * string value. JSON.parse gives values without positions; this scanner walks
 * the (already valid) text to find them, so that an error in a ruleset or a
 * case file can name the line and column an editor shows.
 */

export interface TextPosition {
  line: number;
  column: number;
}

/** Line and column (both 1-based) of a character offset. */
export function positionOf(text: string, offset: number): TextPosition {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text.charCodeAt(i) === 10) {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: offset - lineStart + 1 };
}

/**
 * Offset of the value at `path`, or of the deepest value on the way that exists
 * (a missing field is reported at its object). `character` (1-based) moves into
 * a string value to that character of its decoded text.
 */
export function offsetOfPath(text: string, path: readonly (string | number)[], character?: number): number {
  const scanner = new Scanner(text);
  scanner.skipSpace();
  let start = scanner.i;
  for (const key of path) {
    const found = scanner.enter(key);
    if (found === null) return start;
    start = found;
  }
  if (character !== undefined && text[start] === '"') return offsetInString(text, start, character);
  return start;
}

/** Offset of the decoded string's character `character` (1-based), escapes counted as one character. */
function offsetInString(text: string, quote: number, character: number): number {
  let i = quote + 1;
  for (let k = 1; k < character && i < text.length && text[i] !== '"'; k++) {
    if (text[i] === "\\") i += text[i + 1] === "u" ? 6 : 2;
    else i++;
  }
  return i;
}

class Scanner {
  i = 0;
  constructor(readonly text: string) {}

  skipSpace(): void {
    while (this.i < this.text.length && /\s/.test(this.text[this.i])) this.i++;
  }

  /** At a container, move to the value of `key` and return its offset; null if absent. */
  enter(key: string | number): number | null {
    const open = this.text[this.i];
    if (open === "[" && typeof key === "number") {
      this.i++;
      for (let index = 0; ; index++) {
        this.skipSpace();
        if (this.text[this.i] === "]") return null;
        if (index === key) return this.i;
        this.skipValue();
        this.skipSpace();
        if (this.text[this.i] === ",") this.i++;
        else return null;
      }
    }
    if (open === "{" && typeof key === "string") {
      this.i++;
      for (;;) {
        this.skipSpace();
        if (this.text[this.i] !== '"') return null;
        const nameStart = this.i;
        this.skipString();
        const name = JSON.parse(this.text.slice(nameStart, this.i)) as string;
        this.skipSpace();
        this.i++; // ":"
        this.skipSpace();
        if (name === key) return this.i;
        this.skipValue();
        this.skipSpace();
        if (this.text[this.i] === ",") this.i++;
        else return null;
      }
    }
    return null;
  }

  skipString(): void {
    this.i++;
    while (this.i < this.text.length && this.text[this.i] !== '"') this.i += this.text[this.i] === "\\" ? 2 : 1;
    this.i++;
  }

  skipValue(): void {
    const c = this.text[this.i];
    if (c === '"') return this.skipString();
    if (c === "[" || c === "{") {
      let depth = 0;
      while (this.i < this.text.length) {
        const ch = this.text[this.i];
        if (ch === '"') {
          this.skipString();
          continue;
        }
        if (ch === "[" || ch === "{") depth++;
        else if (ch === "]" || ch === "}") depth--;
        this.i++;
        if (depth === 0) return;
      }
      return;
    }
    while (this.i < this.text.length && !/[\s,\]}]/.test(this.text[this.i])) this.i++;
  }
}

/**
 * Offset of the first character where `text` stops being JSON, or null if it
 * is JSON. JSON.parse names a position for some errors only (not for a
 * trailing comma, say); this names one for all.
 */
export function syntaxErrorOffset(text: string): number | null {
  let i = 0;
  const space = () => {
    while (i < text.length && " \t\r\n".includes(text[i])) i++;
  };
  const fail = (): never => {
    throw new SyntaxAt(i);
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) i += word.length;
    else fail();
  };
  const string = () => {
    i++;
    while (i < text.length && text[i] !== '"') {
      if (text.charCodeAt(i) < 0x20) fail();
      if (text[i] === "\\") {
        i++;
        if (text[i] === "u" && /^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) i += 5;
        else if ('"\\/bfnrt'.includes(text[i] ?? "x")) i++;
        else fail();
      } else i++;
    }
    if (i >= text.length) fail();
    i++;
  };
  const value = (): void => {
    space();
    const c = text[i];
    if (c === "{") {
      i++;
      space();
      if (text[i] === "}") return void i++;
      for (;;) {
        space();
        if (text[i] !== '"') fail();
        string();
        space();
        if (text[i] !== ":") fail();
        i++;
        value();
        space();
        if (text[i] === ",") i++;
        else if (text[i] === "}") return void i++;
        else fail();
      }
    }
    if (c === "[") {
      i++;
      space();
      if (text[i] === "]") return void i++;
      for (;;) {
        value();
        space();
        if (text[i] === ",") i++;
        else if (text[i] === "]") return void i++;
        else fail();
      }
    }
    if (c === '"') return string();
    if (c === "t") return literal("true");
    if (c === "f") return literal("false");
    if (c === "n") return literal("null");
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i, i + 400));
    if (!m) fail();
    i += (m as RegExpExecArray)[0].length;
  };
  try {
    value();
    space();
    if (i < text.length) fail();
    return null;
  } catch (e) {
    if (e instanceof SyntaxAt) return e.offset;
    throw e;
  }
}

class SyntaxAt extends Error {
  constructor(readonly offset: number) {
    super("JSON syntax");
  }
}
