/**
 * The cells of a saved .xlsx workbook, read from its parts without Excel:
 * the sheets and defined names of the workbook part, the shared strings, and
 * per worksheet every formula and every value (SpreadsheetML, ISO/IEC 29500-1
 * §18.2 workbook, §18.3 worksheets, §18.4 shared strings [memory: clause
 * numbers]). Worksheets are read as a stream of XML events, never as a tree.
 */
import { CliError } from "../cliError.js";
import { address, cellPosition, slideFormula, type CellPosition } from "./formulaText.js";
import { attributeOf, xmlReader, XmlPartError, type XmlElement, type XmlHandlers } from "./xmlPart.js";
import type { WorkbookPackage } from "./workbookPackage.js";

const MAIN = ["http://schemas.openxmlformats.org/spreadsheetml/2006/main", "http://purl.oclc.org/ooxml/spreadsheetml/main"];
const RELATIONSHIP_ATTRIBUTES = ["http://schemas.openxmlformats.org/officeDocument/2006/relationships", "http://purl.oclc.org/ooxml/officeDocument/relationships"];
const SHARED_STRINGS = /\/sharedStrings$/;
const WORKSHEET = /\/worksheet$/;

/** Main parts the audit reads, and what other documents are, for the message that refuses them. */
const WORKBOOK_TYPES = [
  "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml",
  "application/vnd.ms-excel.sheet.macroEnabled.main+xml",
  "application/vnd.openxmlformats-officedocument.spreadsheetml.template.main+xml",
  "application/vnd.ms-excel.template.macroEnabled.main+xml",
];
const OTHER_DOCUMENTS: [RegExp, string][] = [
  [/ms-excel\.sheet\.binary/, "a binary workbook (.xlsb), which Loadwright does not read: save it as .xlsx"],
  [/wordprocessingml/, "a Word document, not a workbook"],
  [/presentationml/, "a PowerPoint presentation, not a workbook"],
];

export interface Sheet {
  name: string;
  part: string;
}

export interface DefinedName {
  name: string;
  /** Index into the sheets where the name is local to one sheet, else null. */
  sheet: number | null;
  formula: string;
}

export interface WorkbookIndex {
  mainPart: string;
  sheets: Sheet[];
  names: DefinedName[];
  sharedStrings: string[];
}

export type CellValue =
  | { kind: "text"; text: string }
  | { kind: "number"; value: number }
  | { kind: "boolean"; value: boolean }
  | { kind: "error"; text: string };

export interface FormulaCell {
  address: string;
  position: CellPosition;
  /** As stored (without "="); a shared formula's other cells get the first cell's formula moved to them. */
  formula: string;
  kind: "normal" | "array" | "shared" | "dataTable";
  /** For a shared formula's other cells: the cell that holds its text. */
  sharedFrom: string | null;
}

export interface SheetCells {
  formulas: FormulaCell[];
  /** Cell values (a formula cell's as last calculated and saved), by address ("N7"). */
  values: Map<string, CellValue>;
}

export async function readWorkbookIndex(pkg: WorkbookPackage): Promise<WorkbookIndex> {
  const mainPart = await pkg.mainPart();
  const type = pkg.contentType(mainPart) ?? "";
  if (!WORKBOOK_TYPES.includes(type)) {
    const other = OTHER_DOCUMENTS.find(([pattern]) => pattern.test(type));
    throw new CliError(`${pkg.file}: ${other ? other[1] : `its main document ${mainPart} is not a workbook (content type "${type}")`}`);
  }
  const root = await pkg.xml(mainPart);
  if (root.local !== "workbook" || !MAIN.includes(root.uri)) throw pkg.partError(mainPart, root, `is not a workbook part (its root element is <${root.local}>)`);
  const rels = await pkg.relationships(mainPart);
  const child = (el: XmlElement, local: string) => el.children.filter((c) => c.local === local);

  const sheets: Sheet[] = [];
  for (const list of child(root, "sheets")) {
    for (const s of child(list, "sheet")) {
      const name = attributeOf(s, "name") ?? "";
      const id = RELATIONSHIP_ATTRIBUTES.map((uri) => attributeOf(s, "id", uri)).find((v) => v !== undefined);
      const rel = rels.find((r) => r.id === id && !r.external);
      if (!rel) throw pkg.partError(mainPart, s, `sheet "${name}" names relationship ${id ?? "(none)"}, which ${mainPart}'s relationships do not hold`);
      // Chart sheets and dialog sheets hold no cells.
      if (WORKSHEET.test(rel.type)) sheets.push({ name, part: rel.target });
    }
  }
  const names: DefinedName[] = [];
  for (const list of child(root, "definedNames")) {
    for (const n of child(list, "definedName")) {
      const local = attributeOf(n, "localSheetId");
      names.push({ name: attributeOf(n, "name") ?? "", sheet: local === undefined ? null : Number(local), formula: n.text });
    }
  }
  const stringsRel = rels.find((r) => SHARED_STRINGS.test(r.type) && !r.external);
  const sharedStrings = stringsRel && pkg.has(stringsRel.target) ? await readSharedStrings(pkg, stringsRel.target) : [];
  return { mainPart, sheets, names, sharedStrings };
}

/** Each string item's text: its runs joined, phonetic guides (rPh) left out. */
async function readSharedStrings(pkg: WorkbookPackage, part: string): Promise<string[]> {
  const out: string[] = [];
  let current: string | null = null;
  let phonetic = 0;
  await streamPart(pkg, part, {
    open: (el) => {
      if (el.local === "si") current = "";
      else if (el.local === "rPh") phonetic++;
    },
    close: (el) => {
      if (el.local === "t" && current !== null && phonetic === 0) current += el.text;
      else if (el.local === "rPh") phonetic--;
      else if (el.local === "si") {
        out.push(current ?? "");
        current = null;
      }
    },
  });
  return out;
}

/** The cell values a reader asks for, by address. */
export interface CellValues {
  get(address: string): CellValue | undefined;
}

/**
 * A worksheet's formulas, and the values of the cells `wanted` names (of every
 * cell where it is not given: a large sheet's values are kept only on request).
 */
export async function readSheetCells(pkg: WorkbookPackage, sheet: Sheet, sharedStrings: string[], wanted?: ReadonlySet<string>): Promise<SheetCells> {
  const formulas: FormulaCell[] = [];
  const values = new Map<string, CellValue>();
  const masters = new Map<string, { formula: string; position: CellPosition; address: string }>();
  const dependents: { position: CellPosition; address: string; index: string }[] = [];

  let row = 0;
  let column = 0;
  let cell: { address: string; position: CellPosition; type: string; value: string | null; inline: string | null; formula: XmlElement | null } | null = null;
  let phonetic = 0;
  let rootChecked = false;
  await streamPart(pkg, sheet.part, {
    open: (el) => {
      if (!rootChecked) {
        rootChecked = true;
        if (el.local !== "worksheet") throw pkg.partError(sheet.part, el, `is not a worksheet (its root element is <${el.local}>)`);
      }
      if (el.local === "row") {
        row = Number(attributeOf(el, "r") ?? row + 1);
        column = 0;
      } else if (el.local === "c") {
        const r = attributeOf(el, "r");
        const position = r !== undefined ? cellPosition(r) : { row, column: column + 1 };
        if (!position) throw pkg.partError(sheet.part, el, `a cell's reference r="${r}" is not a cell address`);
        column = position.column;
        cell = { address: address(position), position, type: attributeOf(el, "t") ?? "n", value: null, inline: null, formula: null };
      } else if (el.local === "is" && cell) {
        cell.inline = "";
      } else if (el.local === "rPh") {
        phonetic++;
      }
    },
    close: (el) => {
      if (!cell) return;
      if (el.local === "f") cell.formula = el;
      else if (el.local === "v") cell.value = el.text;
      else if (el.local === "rPh") phonetic--;
      else if (el.local === "t" && cell.inline !== null && phonetic === 0) cell.inline += el.text;
      else if (el.local === "c") {
        if (!wanted || wanted.has(cell.address)) {
          const value = cellValue(cell.type, cell.value, cell.inline, sharedStrings);
          if (value) values.set(cell.address, value);
        }
        const f = cell.formula;
        if (f) {
          const kind = (attributeOf(f, "t") ?? "normal") as FormulaCell["kind"];
          const index = attributeOf(f, "si");
          if (kind === "shared" && index !== undefined && f.text.trim() === "") {
            dependents.push({ position: cell.position, address: cell.address, index });
          } else {
            if (kind === "shared" && index !== undefined) masters.set(index, { formula: f.text, position: cell.position, address: cell.address });
            formulas.push({ address: cell.address, position: cell.position, formula: f.text, kind, sharedFrom: null });
          }
        }
        cell = null;
      }
    },
  });
  for (const d of dependents) {
    const master = masters.get(d.index);
    if (!master) continue; // a shared index with no first cell: Excel would not open the file either
    formulas.push({ address: d.address, position: d.position, formula: slideFormula(master.formula, master.position, d.position), kind: "shared", sharedFrom: master.address });
  }
  formulas.sort((a, b) => a.position.row - b.position.row || a.position.column - b.position.column);
  return { formulas, values };
}

function cellValue(type: string, value: string | null, inline: string | null, sharedStrings: string[]): CellValue | null {
  switch (type) {
    case "s": {
      const text = value === null ? undefined : sharedStrings[Number(value)];
      return text === undefined ? null : { kind: "text", text };
    }
    case "inlineStr":
      return inline === null ? null : { kind: "text", text: inline };
    case "str":
      return value === null ? null : { kind: "text", text: value };
    case "b":
      return value === null ? null : { kind: "boolean", value: value.trim() === "1" };
    case "e":
      return value === null ? null : { kind: "error", text: value };
    default: {
      if (value === null || value.trim() === "") return null;
      const n = Number(value);
      return Number.isFinite(n) ? { kind: "number", value: n } : { kind: "text", text: value };
    }
  }
}

async function streamPart(pkg: WorkbookPackage, part: string, handlers: XmlHandlers): Promise<void> {
  const reader = xmlReader(handlers);
  try {
    await pkg.streamText(part, (chunk) => reader.write(chunk));
    reader.close();
  } catch (e) {
    if (e instanceof XmlPartError) throw new CliError(`${pkg.file}: ${part} line ${e.line}, column ${e.column}: not well-formed XML: ${e.message}`);
    throw e;
  }
}
