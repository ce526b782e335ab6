/**
 * Workbooks for the audit's tests, written as the file formats document them:
 *
 * - `withStoredRulesets` puts rulesets into a copy of a workbook the way Office
 *   saves an add-in's document settings: an Office Add-in part
 *   (xl/webextensions/webextension1.xml, content type
 *   application/vnd.ms-office.webextension+xml, we:webextension with
 *   we:reference and we:properties/we:property name value; [MS-OWEXML] §2.2.1,
 *   §2.2.7, §5.1, https://learn.microsoft.com/openspecs/office_standards/ms-owexml/),
 *   reached from the package through a task pane part (xl/webextensions/taskpanes.xml,
 *   relationship types …/2011/relationships/webextensiontaskpanes and
 *   …/2011/relationships/webextension), as in "Automatically open a task pane with
 *   a document" (https://learn.microsoft.com/office/dev/add-ins/develop/automatically-open-a-task-pane-with-a-document).
 *   The setting's value is its JSON ("Persist add-in state and settings": settings
 *   are stored as serialized JSON), so the add-in's one text setting is a quoted
 *   JSON string holding the store's JSON.
 * - `excelStyleWorkbook` writes a small workbook part by part in the forms Excel
 *   uses and the spreadsheet library does not (shared formulas, inline strings, a
 *   formula's saved text value, defined names, quoted sheet names), after
 *   ISO/IEC 29500-1 §18.3.1.40 (f), §18.3.1.4 (c) and §18.2.5 (definedName)
 *   [memory: the last two clause numbers].
 */
import JSZip from "jszip";

/** The add-in's id in manifest.xml, as Office writes it in we:reference. */
export const ADDIN_ID = "f08e1263-da3a-4fea-969f-bcf2d0cafa40";
export const STORE_KEY = "loadwright.rulesets";

const WE = "http://schemas.microsoft.com/office/webextensions/webextension/2010/11";
const WETP = "http://schemas.microsoft.com/office/webextensions/taskpanes/2010/11";
const R = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";
const REL_TASKPANES = "http://schemas.microsoft.com/office/2011/relationships/webextensiontaskpanes";
const REL_WEBEXTENSION = "http://schemas.microsoft.com/office/2011/relationships/webextension";

export function xmlAttribute(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}

/** The value attribute Office writes for the add-in's store: the JSON of the text the add-in saved. */
export function storeValue(rulesets: unknown[]): string {
  return xmlAttribute(JSON.stringify(JSON.stringify({ format: "loadwright-store/1", rulesets })));
}

export function webExtensionPart(properties: string): string {
  return (
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n' +
    `<we:webextension xmlns:we="${WE}" id="{6C1F2E1B-3A2B-4C5D-9E8F-0A1B2C3D4E5F}">\n` +
    `  <we:reference id="${ADDIN_ID}" version="0.1.0.0" store="developer" storeType="Registry"/>\n` +
    "  <we:alternateReferences/>\n" +
    `  <we:properties>\n${properties}\n  </we:properties>\n` +
    "  <we:bindings/>\n" +
    `  <we:snapshot xmlns:r="${R}"/>\n` +
    "</we:webextension>\n"
  );
}

/** A copy of the workbook with the add-in part `webextension` (its whole XML) linked in as Office links it. */
export async function withAddInPart(xlsx: Uint8Array, webextension: string): Promise<Uint8Array> {
  const zip = await JSZip.loadAsync(xlsx);
  zip.file("xl/webextensions/webextension1.xml", webextension);
  zip.file(
    "xl/webextensions/taskpanes.xml",
    `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<wetp:taskpanes xmlns:wetp="${WETP}"><wetp:taskpane dockstate="right" visibility="0" width="350" row="4"><wetp:webextensionref xmlns:r="${R}" r:id="rId1"/></wetp:taskpane></wetp:taskpanes>`,
  );
  zip.file(
    "xl/webextensions/_rels/taskpanes.xml.rels",
    `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="${REL_WEBEXTENSION}" Target="webextension1.xml"/></Relationships>`,
  );
  const rels = await (zip.file("_rels/.rels") as JSZip.JSZipObject).async("string");
  zip.file("_rels/.rels", rels.replace("</Relationships>", `<Relationship Id="rIdLw1" Type="${REL_TASKPANES}" Target="xl/webextensions/taskpanes.xml"/></Relationships>`));
  const types = await (zip.file("[Content_Types].xml") as JSZip.JSZipObject).async("string");
  zip.file(
    "[Content_Types].xml",
    types.replace(
      "</Types>",
      '<Override PartName="/xl/webextensions/taskpanes.xml" ContentType="application/vnd.ms-office.webextensiontaskpanes+xml"/>' +
        '<Override PartName="/xl/webextensions/webextension1.xml" ContentType="application/vnd.ms-office.webextension+xml"/></Types>',
    ),
  );
  return zip.generateAsync({ type: "uint8array", compression: "DEFLATE" });
}

/** A copy of the workbook storing these ruleset files, as the add-in's Store saves them. */
export function withStoredRulesets(xlsx: Uint8Array, rulesets: unknown[]): Promise<Uint8Array> {
  return withAddInPart(
    xlsx,
    webExtensionPart(`    <we:property name="Office.AutoShowTaskpaneWithDocument" value="true"/>\n    <we:property name="${STORE_KEY}" value="${storeValue(rulesets)}"/>`),
  );
}

const MAIN = "http://schemas.openxmlformats.org/spreadsheetml/2006/main";

export interface SheetXml {
  name: string;
  /** The <sheetData> children: rows of cells. */
  rows: string;
}

/** A workbook written part by part, as Excel lays one out (shared strings given in order). */
export async function excelStyleWorkbook(sheets: SheetXml[], sharedStrings: string[], definedNames = ""): Promise<Uint8Array> {
  const zip = new JSZip();
  zip.file(
    "[Content_Types].xml",
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">' +
      '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>' +
      '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>' +
      sheets.map((_s, i) => `<Override PartName="/xl/worksheets/sheet${i + 1}.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>`).join("") +
      '<Override PartName="/xl/sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/></Types>',
  );
  zip.file(
    "_rels/.rels",
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>',
  );
  zip.file(
    "xl/workbook.xml",
    `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<workbook xmlns="${MAIN}" xmlns:r="${R}"><sheets>` +
      sheets.map((s, i) => `<sheet name="${xmlAttribute(s.name)}" sheetId="${i + 1}" r:id="rId${i + 1}"/>`).join("") +
      `</sheets>${definedNames ? `<definedNames>${definedNames}</definedNames>` : ""}<calcPr calcId="191029"/></workbook>`,
  );
  zip.file(
    "xl/_rels/workbook.xml.rels",
    '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">' +
      sheets.map((_s, i) => `<Relationship Id="rId${i + 1}" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet${i + 1}.xml"/>`).join("") +
      `<Relationship Id="rId${sheets.length + 1}" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sharedStrings" Target="sharedStrings.xml"/></Relationships>`,
  );
  sheets.forEach((s, i) => zip.file(`xl/worksheets/sheet${i + 1}.xml`, `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<worksheet xmlns="${MAIN}"><sheetData>${s.rows}</sheetData></worksheet>`));
  zip.file(
    "xl/sharedStrings.xml",
    `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n<sst xmlns="${MAIN}" count="${sharedStrings.length}" uniqueCount="${sharedStrings.length}">` +
      sharedStrings.map((t) => `<si><t>${xmlAttribute(t)}</t></si>`).join("") +
      "</sst>",
  );
  return zip.generateAsync({ type: "uint8array", compression: "DEFLATE" });
}

/**
 * A zip package written byte by byte (PKWARE APPNOTE.TXT 6.3: local file header
 * §4.3.7, central directory §4.3.12, end of central directory §4.3.16), for a
 * hostile package whose one part is `inflated` zero bytes deflated by zlib —
 * a "zip bomb" the spreadsheet tools would not write.
 */
export async function zipBomb(inflated: number): Promise<Uint8Array> {
  const { deflateRawSync } = await import("node:zlib");
  // The first part any reader opens: the content types.
  const entries = [{ name: "[Content_Types].xml", method: 8, data: new Uint8Array(deflateRawSync(Buffer.alloc(inflated), { level: 1 })), size: inflated }];
  const parts: Uint8Array[] = [];
  const central: Uint8Array[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = new TextEncoder().encode(e.name);
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(e.method, 8);
    local.writeUInt32LE(e.data.length, 18);
    local.writeUInt32LE(e.size, 22);
    local.writeUInt16LE(name.length, 26);
    const dir = Buffer.alloc(46);
    dir.writeUInt32LE(0x02014b50, 0);
    dir.writeUInt16LE(20, 4);
    dir.writeUInt16LE(20, 6);
    dir.writeUInt16LE(e.method, 10);
    dir.writeUInt32LE(e.data.length, 20);
    dir.writeUInt32LE(e.size, 24);
    dir.writeUInt16LE(name.length, 28);
    dir.writeUInt32LE(offset, 42);
    parts.push(local, name, e.data);
    central.push(dir, name);
    offset += local.length + name.length + e.data.length;
  }
  const centralSize = central.reduce((n, b) => n + b.length, 0);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(centralSize, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...parts, ...central, end]);
}
