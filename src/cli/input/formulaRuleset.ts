/**
 * Which ruleset a Loadwright formula in a saved workbook names, read as the
 * add-in reads its ruleset argument (src/functions/rulesetArgument.ts): one
 * cell or text holding a ruleset id names a stored or shipped ruleset; any
 * other cells are a ruleset typed in the workbook. A reference is followed to
 * the cell's saved value (a defined name first to the cell it names); what
 * the file alone cannot tell (a computed argument, another workbook) is said,
 * never guessed.
 */
import { RULESET_ID_PATTERN } from "../../core/index.js";
import { address, parseReference, type LoadwrightCall } from "./formulaText.js";
import type { CellValue, CellValues, DefinedName } from "./workbookCells.js";

/** The 0-based position of the ruleset argument of each formula, as declared in src/functions/functions.ts. */
export const RULESET_ARGUMENT: Readonly<Record<string, number>> = {
  "LW.FACTORED": 1,
  "LW.ENVELOPE": 1,
  "LW.GOVERNING": 1,
  "LW.COMBOS": 0,
  "LW.EXPLAIN": 1,
  "LW.RULESET": 0,
};

export type RulesetReference =
  /** `from` says where the id was read: `text`, `Cases!N7`, `name RulesetId → Cases!N7`. */
  | { kind: "id"; id: string; from: string }
  /** A ruleset typed in the workbook's cells (or in the formula's own text). */
  | { kind: "cells"; from: string }
  | { kind: "unresolved"; reason: string }
  | { kind: "not-loadwright"; reason: string };

export interface BookCells {
  /** Sheets in workbook order: the addresses of their formula cells, and the values asked for. */
  sheets: { name: string; formulas: ReadonlySet<string>; values: CellValues }[];
  names: DefinedName[];
}

export function rulesetReference(call: LoadwrightCall, sheet: number, book: BookCells): RulesetReference {
  const position = RULESET_ARGUMENT[call.name];
  if (position === undefined) return { kind: "not-loadwright", reason: `${call.name} is not one of Loadwright's formulas (${Object.keys(RULESET_ARGUMENT).join(", ")})` };
  const arg = call.args[position];
  if (arg === undefined || arg === "") return { kind: "unresolved", reason: "the formula gives no ruleset argument (it shows an error)" };
  return fromArgument(arg, sheet, book, "");
}

function fromArgument(arg: string, sheet: number, book: BookCells, via: string): RulesetReference {
  const literal = /^"((?:[^"]|"")*)"$/.exec(arg);
  if (literal) return fromText(literal[1].replace(/""/g, '"'), `${via}text`);
  if (/^\{.*\}$/s.test(arg)) return { kind: "cells", from: `${via}an array written in the formula` };
  const ref = parseReference(arg);
  if (ref) {
    if (ref.external) return { kind: "unresolved", reason: `${via}${arg} refers to another workbook, which the audit cannot read` };
    const target = ref.sheet === null ? sheet : book.sheets.findIndex((s) => s.name.toLowerCase() === (ref.sheet as string).toLowerCase());
    if (target < 0) return { kind: "unresolved", reason: `${via}${arg} names a sheet "${ref.sheet}" that the workbook does not have` };
    const where = `${quoteSheet(book.sheets[target].name)}!${address(ref.first)}`;
    if (ref.first.row !== ref.last.row || ref.first.column !== ref.last.column) {
      return { kind: "cells", from: `${via}${where}:${address(ref.last)}` };
    }
    const cells = book.sheets[target];
    const value = cells.values.get(address(ref.first));
    const computed = cells.formulas.has(address(ref.first)) ? ", the value its formula last gave" : "";
    return fromCell(value, `${via}${where}${computed}`);
  }
  const name = definedName(arg, sheet, book.names);
  if (name) {
    if (via !== "") return { kind: "unresolved", reason: `${via}name ${arg} names another name; the audit follows one name only` };
    return fromArgument(name.formula.trim(), sheet, book, `name ${arg} → `);
  }
  return { kind: "unresolved", reason: `${via}the ruleset argument ${arg} is an expression the audit does not evaluate; it reads text, a cell or range, or a defined name naming one` };
}

function fromCell(value: CellValue | undefined, from: string): RulesetReference {
  if (value === undefined) return { kind: "unresolved", reason: `${from} is blank: the formula has no ruleset (it shows an error)` };
  switch (value.kind) {
    case "text":
      return fromText(value.text, from);
    case "number":
      return { kind: "unresolved", reason: `${from} holds the number ${value.value}, not a ruleset id (the formula shows an error)` };
    case "boolean":
      return { kind: "unresolved", reason: `${from} holds ${value.value ? "TRUE" : "FALSE"}, not a ruleset id (the formula shows an error)` };
    case "error":
      return { kind: "unresolved", reason: `${from} holds the error ${value.text} (the formula shows an error)` };
  }
}

/** Text that is an id names a ruleset; other text is one row of a typed ruleset, as the add-in reads it. */
function fromText(text: string, from: string): RulesetReference {
  const id = text.trim();
  if (id === "") return { kind: "unresolved", reason: `${from} is empty text: the formula has no ruleset (it shows an error)` };
  return RULESET_ID_PATTERN.test(id) ? { kind: "id", id, from } : { kind: "cells", from };
}

function definedName(text: string, sheet: number, names: DefinedName[]): DefinedName | undefined {
  const key = text.toLowerCase();
  return names.find((n) => n.name.toLowerCase() === key && n.sheet === sheet) ?? names.find((n) => n.name.toLowerCase() === key && n.sheet === null);
}

/** A sheet name as a formula writes it: quoted where it is not a plain word. */
export function quoteSheet(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_.]*$/.test(name) && !/^[A-Za-z]{1,3}\d+$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}
