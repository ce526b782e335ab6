/**
 * LibreOffice Calc, headless, as an independent spreadsheet program: it opens
 * workbooks, recalculates every formula and saves them again as .xlsx, whose
 * cells then hold LibreOffice's own results. Each call gets its own profile
 * directory, so runs in parallel never share one, and the profile tells Calc
 * to recalculate every formula of an Office Open XML file on loading, whatever
 * values the file carries.
 */
import { execFile } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, join } from "node:path";
import { pathToFileURL } from "node:url";
import { promisify } from "node:util";
import { DOMParser, type Element } from "@xmldom/xmldom";
import JSZip from "jszip";

const run = promisify(execFile);

/**
 * org.openoffice.Office.Calc/Formula/Load/OOXMLRecalcMode: 0 recalculates
 * always, 1 never (the default keeps the values stored in the file), 2 asks.
 * Tools › Options › LibreOffice Calc › Formula, "Recalculation on file load".
 */
const ALWAYS_RECALCULATE = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;

/** Recalculates the workbooks in LibreOffice and returns the paths of the saved copies, in the same order. */
export async function recalculatedByLibreOffice(files: string[]): Promise<string[]> {
  const work = mkdtempSync(join(tmpdir(), "loadwright-soffice-"));
  const profile = join(work, "profile");
  mkdirSync(join(profile, "user"), { recursive: true });
  writeFileSync(join(profile, "user", "registrymodifications.xcu"), ALWAYS_RECALCULATE);
  const outDir = join(work, "out");
  await run(
    "soffice",
    [`-env:UserInstallation=${pathToFileURL(profile).href}`, "--headless", "--norestore", "--nolockcheck", "--convert-to", "xlsx:Calc MS Excel 2007 XML", "--outdir", outDir, ...files],
    { timeout: 120_000, env: { ...process.env, HOME: work } },
  );
  return files.map((f) => join(outDir, basename(f)));
}

export interface SavedCell {
  /** The stored value: a number, or text (a shared string, an inline string or a formula's text result). */
  value: string | number;
  /** The formula, where the cell holds one. */
  formula: string | null;
}

const MAIN = "http://schemas.openxmlformats.org/spreadsheetml/2006/main";

/**
 * The first worksheet's cells as stored in an .xlsx file, read from the
 * package's XML parts (ECMA-376 Part 1, §18.3.1.4 c, §18.3.1.40 f, §18.3.1.96 v,
 * §18.4.8 si): exactly what the program that saved it computed, a stored 0
 * included.
 */
export async function savedCells(file: string): Promise<Map<string, SavedCell>> {
  const zip = await JSZip.loadAsync(readFileSync(file));
  const part = async (name: string) => {
    const entry = zip.file(name);
    return entry ? new DOMParser().parseFromString(await entry.async("string"), "text/xml") : null;
  };
  const shared = await part("xl/sharedStrings.xml");
  const strings = shared ? Array.from(shared.getElementsByTagNameNS(MAIN, "si")).map((si) => textOf(si)) : [];
  const sheet = await part("xl/worksheets/sheet1.xml");
  if (!sheet) throw new Error(`${file} has no first worksheet`);
  const cells = new Map<string, SavedCell>();
  for (const c of Array.from(sheet.getElementsByTagNameNS(MAIN, "c"))) {
    const f = c.getElementsByTagNameNS(MAIN, "f")[0];
    const v = c.getElementsByTagNameNS(MAIN, "v")[0];
    const type = c.getAttribute("t") ?? "n";
    const text = type === "inlineStr" ? textOf(c) : (v?.textContent ?? null);
    if (text === null) continue;
    const value = type === "s" ? strings[Number(text)] : type === "str" || type === "inlineStr" ? text : Number(text);
    cells.set(c.getAttribute("r") as string, { value, formula: f?.textContent ?? null });
  }
  return cells;
}

function textOf(element: Element): string {
  return Array.from(element.getElementsByTagNameNS(MAIN, "t"))
    .map((t) => t.textContent ?? "")
    .join("");
}
