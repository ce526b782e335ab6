/**
 * The demo: `npm run demo`'s script run as a child process on the bundled,
 * invented workshop (demo/README.md), and the workbook it writes read back
 * with the spreadsheet library and as the zip package it is.
 */
import { execFile } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, test } from "vitest";
import { builtPackage, ROOT } from "./harness.js";

const DATA = join(ROOT, "demo/workshop-base-reactions.csv");
let printed = "";
let workbookPath = "";
let reportPath = "";

beforeAll(async () => {
  const dir = mkdtempSync(join(tmpdir(), "loadwright-demo-"));
  workbookPath = join(dir, "demo.xlsx");
  const script = join(await builtPackage(), "build/cli/src/cli/demo/runDemo.js");
  reportPath = join(dir, "report.html");
  const { stdout } = await promisify(execFile)(process.execPath, [script, "--data", DATA, "--out", workbookPath, "--report", reportPath], { cwd: ROOT });
  printed = stdout;
});

describe("the demo", () => {
  test("prints the envelope and the governing rows of the invented workshop", () => {
    expect(printed).toContain("invented column base reactions");
    expect(printed).toMatch(/UNVERIFIED RULESET/);
    expect(printed).toMatch(/Caution: Results must be reviewed by a qualified, licensed engineer/);
    // Hand checks on the invented demo data with ASCE/SEI 7-16 §2.3.1 (the list as ASCE/SEI 7-10 §2.3.2, public copy https://www.scribd.com/document/611469328 prints it; numbering [memory]):
    // (5) 0.9D + 1.0W: A1 Fz = 0.9·26 − 28 = −4.6, uplift under the wind from 180°.
    expect(printed).toMatch(/\nA1 Fz\s+80\.2\s+4: 1\.2D \+ L \+ 0\.5S - W:180\s+-4\.6\s+5: 0\.9D \+ W:180\n/);
    // (4) 1.2D + 1.0W + L + 0.5S with the 180° case reversed: A2 Fz = 57.6 + 24 + 18 + 50 = 149.6.
    expect(printed).toMatch(/\nA2 Fz\s+149\.6\s+4: 1\.2D \+ L \+ 0\.5S - W:180\s/);
    expect(printed).toContain("G1: max [A2 Fz] → 4: 1.2D + L + 0.5S - W:180");
    expect(printed).toContain("G2: min [A1 Fz] → 5: 0.9D + W:180");
    expect(printed).toContain("Wrote ");
  });

  test("writes the calculation report of the same table, criteria and parameters", () => {
    expect(printed).toContain(`Wrote ${reportPath}: the calculation report`);
    const html = readFileSync(reportPath, "utf8");
    expect(html).toContain("<h1>Workshop column bases (invented demo)</h1>");
    // The derivation of G1 (max [A2 Fz]): (4) 1.2D + 1.0W + L + 0.5S with W:180 reversed, 57.6 + 24 + 18 + 50 = 149.6 (hand check above).
    expect(html).toMatch(/data-component="A2 Fz" data-total="149.6"/);
  });

  test("writes the case table into the workbook as numbers, labelled invented", async () => {
    const book = new ExcelJS.Workbook();
    await book.xlsx.readFile(workbookPath);
    const cases = book.getWorksheet("Cases") as ExcelJS.Worksheet;
    expect(String(cases.getCell("A2").value)).toMatch(/^INVENTED numbers/);
    expect(String(cases.getCell("A3").value)).toMatch(/qualified, licensed engineer/);
    const csv = parse(readFileSync(DATA, "utf8")) as string[][];
    csv.forEach((row, r) =>
      row.forEach((text, c) => {
        const value = cases.getCell(7 + r, 1 + c).value;
        if (r === 0 || c === 0) expect(value).toBe(text);
        else expect(value).toBe(Number(text));
      }),
    );
    expect(cases.getCell("N7").value).toBe("asce7-16-strength");
    expect([cases.getCell("M9").value, cases.getCell("N9").value, cases.getCell("M10").value, cases.getCell("N10").value]).toEqual(["SDS", 0.5, "rho", 1.3]);
  });

  test("stores each LW formula under its add-in name as a formula anchored in one cell", async () => {
    const book = new ExcelJS.Workbook();
    await book.xlsx.readFile(workbookPath);
    const table = "Cases!$A$7:$K$25";
    const params = "Cases!$M$9:$N$10";
    const expected: [string, string, string][] = [
      ["Envelope", "A4", `_xldudf_LW_ENVELOPE(${table},Cases!$N$7,${params})`],
      ["Governing", "A9", `_xldudf_LW_GOVERNING(${table},Cases!$N$7,$A$4:$A$7,${params})`],
      ["Combinations", "A4", `_xldudf_LW_COMBOS(Cases!$N$7,${params},Cases!$B$7:$K$7)`],
      ["Explain", "A7", `_xldudf_LW_EXPLAIN(${table},Cases!$N$7,$B$4,$B$5,${params})`],
      ["Cases", "M13", "_xldudf_LW_RULESET(Cases!$N$7)"],
    ];
    for (const [sheet, address, formula] of expected) {
      const cell = (book.getWorksheet(sheet) as ExcelJS.Worksheet).getCell(address);
      const value = cell.value as { formula?: string; shareType?: string; ref?: string };
      expect(value.formula, `${sheet}!${address}`).toBe(formula);
      expect(value.shareType, `${sheet}!${address}`).toBe("array");
      expect(value.ref, `${sheet}!${address}`).toBe(address);
    }
    const governing = book.getWorksheet("Governing") as ExcelJS.Worksheet;
    expect([4, 5, 6, 7].map((r) => governing.getCell(r, 1).value)).toEqual(["max [A2 Fz]", "min [A1 Fz]", "max |[A1 Fy]|", "max |[B2 Fx]|"]);
    const explain = book.getWorksheet("Explain") as ExcelJS.Worksheet;
    expect(explain.getCell("B4").value).toBe("5: 0.9D + W:180");
    expect(explain.getCell("B5").value).toBe("A1 Fz");
  });

  test("marks every formula as a dynamic array so that it spills without @", async () => {
    const zip = await JSZip.loadAsync(readFileSync(workbookPath));
    const metadata = await (zip.file("xl/metadata.xml") as JSZip.JSZipObject).async("string");
    expect(metadata).toContain('<metadataType name="XLDAPR"');
    expect(metadata).toContain('<xda:dynamicArrayProperties fDynamic="1" fCollapsed="0"/>');
    expect(metadata).toContain('<cellMetadata count="1"><bk><rc t="1" v="0"/></bk></cellMetadata>');
    const types = await (zip.file("[Content_Types].xml") as JSZip.JSZipObject).async("string");
    expect(types).toContain('<Override PartName="/xl/metadata.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheetMetadata+xml"/>');
    const rels = await (zip.file("xl/_rels/workbook.xml.rels") as JSZip.JSZipObject).async("string");
    expect(rels).toMatch(/Type="http:\/\/schemas\.openxmlformats\.org\/officeDocument\/2006\/relationships\/sheetMetadata" Target="metadata\.xml"/);
    let formulas = 0;
    for (const name of Object.keys(zip.files).filter((n) => n.startsWith("xl/worksheets/sheet"))) {
      const xml = await (zip.file(name) as JSZip.JSZipObject).async("string");
      for (const m of xml.matchAll(/<c r="([A-Z]+\d+)"[^>]*>\s*<f[^>]*>_xldudf_LW_/g)) {
        formulas++;
        expect(m[0], `${name} ${m[1]}`).toMatch(/ cm="1"/);
      }
    }
    expect(formulas).toBe(5);
    const workbook = await (zip.file("xl/workbook.xml") as JSZip.JSZipObject).async("string");
    expect(workbook).toMatch(/<calcPr[^>]*fullCalcOnLoad="1"/);
  });
});
