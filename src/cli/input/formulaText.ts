/**
 * Formulas as a saved workbook stores them (ISO/IEC 29500-1 §18.3.1.40, the f
 * element; https://learn.microsoft.com/previous-versions/office/cc802572(v=office.14)):
 * without the leading "=", with "," between arguments whatever the user's
 * locale, and an add-in's function under the name Excel stores it by. This
 * reads what an audit needs and no more: the Loadwright calls in a formula
 * with their arguments' text, the shape of a cell or range reference, and a
 * shared formula moved to another cell. Text in quotes, quoted sheet names
 * and bracketed table references are skipped as wholes, so that a ruleset id
 * such as "en1990-equ" inside quotes is never read as a reference.
 *
 * A formula evaluator or a full formula grammar would do far more than this
 * needs; none of the tokenizers published for this are kept up, so this is
 * our own, and small.
 */

/** One call of a Loadwright formula inside a cell's formula. */
export interface LoadwrightCall {
  /** As the user types it: LW.ENVELOPE. */
  name: string;
  /** As the file stores it: _xldudf_LW_ENVELOPE, or LW.ENVELOPE where written as text. */
  stored: string;
  /** Each argument's text as written, trimmed ("" for an omitted one). */
  args: string[];
  /** False where the formula ends before the call's closing bracket (a damaged formula). */
  closed: boolean;
}

/** `_xldudf_LW_ENVELOPE(` (how Excel stores an add-in function), `LW.ENVELOPE(`, either after `_xlfn.` or `_xlws.`. */
const CALL = /^(?:_xlfn\.|_xlws\.)?(?:_xldudf_LW_([A-Za-z][A-Za-z0-9]*)|LW\.([A-Za-z][A-Za-z0-9]*))\s*\(/i;
const NAME_CHAR = /[A-Za-z0-9_.\\]/;

/** Where the quoted or bracketed token starting at `i` ends (the index after it). */
function skipToken(formula: string, i: number): number {
  const open = formula[i];
  if (open === '"' || open === "'") {
    let j = i + 1;
    while (j < formula.length) {
      if (formula[j] === open) {
        if (formula[j + 1] === open) j += 2;
        else return j + 1;
      } else j++;
    }
    return j;
  }
  if (open === "[") {
    let depth = 0;
    for (let j = i; j < formula.length; j++) {
      if (formula[j] === "'" && depth > 0) {
        j++; // an escaped character inside a table reference
        continue;
      }
      if (formula[j] === "[") depth++;
      else if (formula[j] === "]" && --depth === 0) return j + 1;
    }
    return formula.length;
  }
  return i + 1;
}

export function loadwrightCalls(formula: string): LoadwrightCall[] {
  const calls: LoadwrightCall[] = [];
  for (let i = 0; i < formula.length; ) {
    const c = formula[i];
    if (c === '"' || c === "'" || c === "[") {
      i = skipToken(formula, i);
      continue;
    }
    if ((i === 0 || !NAME_CHAR.test(formula[i - 1])) && /[_Ll]/.test(c)) {
      const m = CALL.exec(formula.slice(i));
      if (m) {
        const fn = (m[1] ?? m[2]).toUpperCase();
        const { args, closed } = argumentsFrom(formula, i + m[0].length);
        calls.push({ name: `LW.${fn}`, stored: m[0].replace(/\s*\($/, ""), args, closed });
        i += m[0].length; // nested calls inside the arguments are found as the scan goes on
        continue;
      }
    }
    i++;
  }
  return calls;
}

/** The arguments of a call whose "(" ends just before `start`. */
function argumentsFrom(formula: string, start: number): { args: string[]; closed: boolean } {
  const args: string[] = [];
  let depth = 0;
  let from = start;
  for (let i = start; i < formula.length; ) {
    const c = formula[i];
    if (c === '"' || c === "'" || c === "[") {
      i = skipToken(formula, i);
      continue;
    }
    if (c === "(" || c === "{") depth++;
    else if ((c === ")" || c === "}") && depth > 0) depth--;
    else if (c === ")" && depth === 0) {
      const last = formula.slice(from, i).trim();
      if (last !== "" || args.length > 0) args.push(last);
      return { args, closed: true };
    } else if (c === "," && depth === 0) {
      args.push(formula.slice(from, i).trim());
      from = i + 1;
    }
    i++;
  }
  args.push(formula.slice(from).trim());
  return { args, closed: false };
}

/** A cell or range reference written alone, as an argument. */
export interface Reference {
  /** The sheet named before "!" (unquoted), or null for the formula's own sheet. */
  sheet: string | null;
  /** Top-left and bottom-right, 1-based. */
  first: CellPosition;
  last: CellPosition;
  /** A reference into another workbook ([1]Sheet1!A1). */
  external: boolean;
}

export interface CellPosition {
  row: number;
  column: number;
}

const MAX_ROW = 1_048_576;
const MAX_COLUMN = 16_384;
const CELL = /^\$?([A-Za-z]{1,3})\$?(\d+)$/;

/** "B7" or "$B$7" → row 7, column 2; null for anything else (or past the grid's last cell). */
export function cellPosition(text: string): CellPosition | null {
  const m = CELL.exec(text);
  if (!m) return null;
  const column = columnNumber(m[1]);
  const row = Number(m[2]);
  return row >= 1 && row <= MAX_ROW && column <= MAX_COLUMN ? { row, column } : null;
}

export function columnNumber(letters: string): number {
  let n = 0;
  for (const ch of letters.toUpperCase()) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n;
}

export function columnName(column: number): string {
  let n = column;
  let out = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    out = String.fromCharCode(65 + r) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}

export function address(p: CellPosition): string {
  return `${columnName(p.column)}${p.row}`;
}

/** `Cases!$N$7`, `'My cases'!N7:N9`, `N7`; null where the text is not one plain reference. */
export function parseReference(text: string): Reference | null {
  const m = /^(?:('(?:[^']|'')+'|[^'!:,()\s"]+)!)?(\$?[A-Za-z]{1,3}\$?\d+)(?::(\$?[A-Za-z]{1,3}\$?\d+))?$/.exec(text.trim());
  if (!m) return null;
  const first = cellPosition(m[2]);
  const last = m[3] ? cellPosition(m[3]) : first;
  if (!first || !last) return null;
  let sheet: string | null = null;
  let external = false;
  if (m[1]) {
    sheet = m[1].startsWith("'") ? m[1].slice(1, -1).replace(/''/g, "'") : m[1];
    if (/^\[[^\]]*\]/.test(sheet)) external = true;
  }
  return {
    sheet,
    first: { row: Math.min(first.row, last.row), column: Math.min(first.column, last.column) },
    last: { row: Math.max(first.row, last.row), column: Math.max(first.column, last.column) },
    external,
  };
}

/**
 * A shared formula as it reads in another cell of its range (§18.3.1.40: the
 * cells after the first hold only the shared index): every relative reference
 * moved by the distance between the cells, absolute ones ($) kept.
 */
export function slideFormula(formula: string, from: CellPosition, to: CellPosition): string {
  const dRow = to.row - from.row;
  const dColumn = to.column - from.column;
  if (dRow === 0 && dColumn === 0) return formula;
  const moveRow = (dollar: string, row: string) => (dollar ? `${dollar}${row}` : String(Number(row) + dRow));
  const moveColumn = (dollar: string, letters: string) => (dollar ? `${dollar}${letters}` : columnName(columnNumber(letters) + dColumn));
  const plain = (segment: string) =>
    segment.replace(
      /(?<![A-Za-z0-9_.\\$])(?:(\$?)([A-Za-z]{1,3})(\$?)(\d+)|(\$?)([A-Za-z]{1,3}):(\$?)([A-Za-z]{1,3})|(\$?)(\d+):(\$?)(\d+))(?![A-Za-z0-9_.(\\])/g,
      (all: string, cd: string, cl: string, rd: string, r: string, c1d: string, c1: string, c2d: string, c2: string, r1d: string, r1: string, r2d: string, r2: string) => {
        if (cl !== undefined) {
          if (columnNumber(cl) > MAX_COLUMN || Number(r) > MAX_ROW) return all; // a name, not a cell
          return `${moveColumn(cd, cl)}${moveRow(rd, r)}`;
        }
        if (c1 !== undefined) return `${moveColumn(c1d, c1)}:${moveColumn(c2d, c2)}`;
        return `${moveRow(r1d, r1)}:${moveRow(r2d, r2)}`;
      },
    );
  let out = "";
  let from0 = 0;
  for (let i = 0; i < formula.length; ) {
    const c = formula[i];
    if (c === '"' || c === "'" || c === "[") {
      out += plain(formula.slice(from0, i));
      const end = skipToken(formula, i);
      out += formula.slice(i, end);
      i = from0 = end;
      continue;
    }
    i++;
  }
  return out + plain(formula.slice(from0));
}
