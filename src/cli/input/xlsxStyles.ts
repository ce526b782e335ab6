/**
 * Which cell styles of a workbook show a number as a date or a time: a case
 * value so formatted is a serial day number, not a load effect, and is refused
 * where it stands. Read from the styles part (SpreadsheetML, ISO/IEC 29500-1
 * §18.8 styles: cellXfs, numFmts [memory: clause numbers]): a cell's `s`
 * attribute indexes cellXfs, whose numFmtId is a built-in format or one of the
 * part's numFmts.
 */
import type { WorkbookPackage } from "./workbookPackage.js";
import { attributeOf } from "./xmlPart.js";

const STYLES = /\/styles$/;

/**
 * Built-in number formats that show dates or times: 14–22 (m/d/yyyy … m/d/yy h:mm),
 * 45–47 (mm:ss, [h]:mm:ss, mmss.0), and the East Asian date formats 27–36 and 50–58
 * (ISO/IEC 29500-1 §18.8.30 numFmt, the list of built-in formats [memory]).
 */
const BUILT_IN_DATES = new Set([14, 15, 16, 17, 18, 19, 20, 21, 22, 27, 28, 29, 30, 31, 32, 33, 34, 35, 36, 45, 46, 47, 50, 51, 52, 53, 54, 55, 56, 57, 58]);

export interface DateStyles {
  /** How a style shows dates ("format yyyy-mm-dd", "built-in date format 14"), or undefined where it shows numbers. */
  dateFormat(style: number): string | undefined;
}

export const NO_DATE_STYLES: DateStyles = { dateFormat: () => undefined };

/** Whether a format code shows a date or a time: a d, m, y, h or s outside quotes, brackets and escapes. */
export function isDateCode(code: string): boolean {
  // Elapsed time ([h], [mm], [ss]) is a time; colours and conditions ([Red], [>100]) are not.
  if (/\[(h+|m+|s+)\]/i.test(code)) return true;
  const bare = code
    .replace(/"[^"]*"/g, "")
    .replace(/\\./g, "")
    .replace(/_./g, "")
    .replace(/\*./g, "")
    .replace(/\[[^\]]*\]/g, "");
  // "General" holds an e, n, r, a and l but no date letter; "E+" is scientific notation.
  return /[dmyhs]/i.test(bare.replace(/General/gi, ""));
}

export async function readDateStyles(pkg: WorkbookPackage, mainPart: string): Promise<DateStyles> {
  const rels = await pkg.relationships(mainPart);
  const stylesRel = rels.find((r) => STYLES.test(r.type) && !r.external);
  if (!stylesRel || !pkg.has(stylesRel.target)) return NO_DATE_STYLES;
  const root = await pkg.xml(stylesRel.target);
  const codes = new Map<number, string>();
  const formatOf: number[] = [];
  for (const list of root.children) {
    if (list.local === "numFmts") {
      for (const f of list.children) {
        if (f.local !== "numFmt") continue;
        const id = Number(attributeOf(f, "numFmtId"));
        if (Number.isInteger(id)) codes.set(id, attributeOf(f, "formatCode") ?? "");
      }
    } else if (list.local === "cellXfs") {
      for (const xf of list.children) if (xf.local === "xf") formatOf.push(Number(attributeOf(xf, "numFmtId") ?? 0));
    }
  }
  const dates = new Map<number, string>();
  formatOf.forEach((id, style) => {
    const code = codes.get(id);
    if (code !== undefined ? isDateCode(code) : BUILT_IN_DATES.has(id)) dates.set(style, code !== undefined ? `format ${code}` : `built-in date format ${id}`);
  });
  return { dateFormat: (style) => dates.get(style) };
}
