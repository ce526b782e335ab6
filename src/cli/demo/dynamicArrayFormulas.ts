/**
 * Marks formulas in a saved .xlsx as dynamic-array (spilling) formulas.
 *
 * Excel stores a spilling formula as an array formula anchored in one cell
 * (<f t="array" ref="A3">) whose cell points (cm="1") at the dynamic-array
 * cell metadata in xl/metadata.xml (metadata type XLDAPR, fDynamic="1"). A
 * formula without that metadata opens as a legacy formula: Excel shows it
 * with the implicit-intersection "@" and returns one value instead of
 * spilling. The spreadsheet library writes the array formula but not the
 * metadata, so this adds it: the part, its content type, the workbook's
 * relationship to it, and cm="1" on each anchored array formula cell.
 */
import JSZip from "jszip";

export const METADATA_PART = "xl/metadata.xml";
const METADATA_CONTENT_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheetMetadata+xml";
const METADATA_RELATIONSHIP = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/sheetMetadata";

const METADATA_XML =
  '<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n' +
  '<metadata xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:xda="http://schemas.microsoft.com/office/spreadsheetml/2017/dynamicarray">' +
  '<metadataTypes count="1"><metadataType name="XLDAPR" minSupportedVersion="120000" copy="1" pasteAll="1" pasteValues="1" merge="1" splitFirst="1" rowColShift="1" clearFormats="1" clearComments="1" assign="1" coerce="1" cellMeta="1"/></metadataTypes>' +
  '<futureMetadata name="XLDAPR" count="1"><bk><extLst><ext uri="{bdbb8cdc-fa1e-496e-a857-3c3f30c029c3}"><xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/></ext></extLst></bk></futureMetadata>' +
  '<cellMetadata count="1"><bk><rc t="1" v="0"/></bk></cellMetadata>' +
  "</metadata>";

/** The workbook with every single-cell array formula marked as spilling. */
export async function markDynamicArrays(xlsx: Uint8Array): Promise<Uint8Array> {
  const zip = await JSZip.loadAsync(xlsx);
  let marked = 0;
  for (const name of Object.keys(zip.files).filter((n) => /^xl\/worksheets\/sheet\d+\.xml$/.test(n))) {
    const xml = await (zip.file(name) as JSZip.JSZipObject).async("string");
    // A cell element whose formula is an array formula anchored in that same one cell.
    const updated = xml.replace(/<c r="([A-Z]+\d+)"([^>]*)>(\s*<f t="array" ref="\1")/g, (_all, ref: string, attributes: string, formula: string) => {
      marked++;
      return `<c r="${ref}"${attributes.replace(/\s+cm="\d+"/, "")} cm="1">${formula}`;
    });
    zip.file(name, updated);
  }
  if (marked === 0) return xlsx;
  zip.file(METADATA_PART, METADATA_XML);

  const typesName = "[Content_Types].xml";
  const types = await (zip.file(typesName) as JSZip.JSZipObject).async("string");
  if (!types.includes(`PartName="/${METADATA_PART}"`)) {
    zip.file(typesName, types.replace("</Types>", `<Override PartName="/${METADATA_PART}" ContentType="${METADATA_CONTENT_TYPE}"/></Types>`));
  }
  const relsName = "xl/_rels/workbook.xml.rels";
  const rels = await (zip.file(relsName) as JSZip.JSZipObject).async("string");
  if (!rels.includes(METADATA_RELATIONSHIP)) {
    const ids = [...rels.matchAll(/Id="rId(\d+)"/g)].map((m) => Number(m[1]));
    const id = `rId${Math.max(0, ...ids) + 1}`;
    zip.file(relsName, rels.replace("</Relationships>", `<Relationship Id="${id}" Type="${METADATA_RELATIONSHIP}" Target="metadata.xml"/></Relationships>`));
  }
  return zip.generateAsync({ type: "uint8array", compression: "DEFLATE" });
}
