/**
 * `loadwright audit` as a checker runs it: a real child process on real
 * workbooks — the demo workbook (`npm run demo`'s script, docs/demo.md), copies
 * of it storing rulesets as Office stores add-in settings (workbookFixtures.ts,
 * after [MS-OWEXML] and the platform's "Persist add-in state and settings"),
 * a workbook written in the forms Excel uses, and hostile or damaged files —
 * against firm libraries made from shipped rulesets with invented approvals
 * (docs/firm-library.md defines the standings and the exit statuses).
 */
import { execFile, execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import JSZip from "jszip";
import { beforeAll, describe, expect, test } from "vitest";
import { fingerprintOf, type RulesetFile } from "../../src/core/index.js";
import { approved, libraryOf, revised, shipped } from "../core/library/libraryFiles.js";
import { builtPackage, csvRows, loadwright, ROOT } from "./harness.js";
import { excelStyleWorkbook, storeValue, webExtensionPart, withAddInPart, withStoredRulesets, zipBomb } from "./workbookFixtures.js";

let dir = "";
let demo: Uint8Array;

/** The cells of the demo's five formulas and what each calls (docs/demo.md, "The workbook"). */
const DEMO_FORMULAS = [
  ["Cases", "M13", "LW.RULESET"],
  ["Envelope", "A4", "LW.ENVELOPE"],
  ["Governing", "A9", "LW.GOVERNING"],
  ["Combinations", "A4", "LW.COMBOS"],
  ["Explain", "A7", "LW.EXPLAIN"],
];

const v1 = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2025-06-30");
const v2 = approved(revised(v1, "1.0.1"), "B. Approver (invented)", "2026-02-27");

function write(name: string, data: Uint8Array | string): string {
  writeFileSync(join(dir, name), data);
  return name;
}

function library(name: string, rulesets: RulesetFile[]): string {
  return write(name, JSON.stringify(libraryOf(rulesets), null, 2));
}

async function audit(args: string[]) {
  const run = await loadwright(["audit", ...args], { cwd: dir });
  expect(run.stderr).not.toMatch(/^\s+at /m); // never a stack trace
  expect(run.stderr).not.toMatch(/internal error/);
  return run;
}

async function auditJson(args: string[]) {
  const run = await audit([...args, "--format", "json"]);
  return { ...run, json: JSON.parse(run.stdout) as AuditJson };
}

interface AuditJson {
  workbook: string;
  library: { title: string; rulesets: { id: string; current: boolean }[] } | null;
  addInParts: { part: string; addIn: string; holdsRulesets: boolean }[];
  storedRulesets: { id: string; part: string; loads: boolean; fingerprint: string | null; standing: { standing: string; text: string } | null; problems: string[] }[];
  formulas: {
    sheet: string;
    cell: string;
    formula: string;
    stored: string;
    function: string;
    ruleset: { reference: string; id: string | null; from: string | null; reason: string | null; source: string | null; part: string | null; fingerprint: string | null; status: string | null };
    standing: { standing: string; text: string } | null;
    libraryApproved: boolean | null;
  }[];
  result: { checked: boolean; passed: boolean | null; formulas: number; notApproved: number; text: string };
  cautions: string[];
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-audit-"));
  const script = join(await builtPackage(), "build/cli/src/cli/demo/runDemo.js");
  await promisify(execFile)(process.execPath, [script, "--data", join(ROOT, "demo/workshop-base-reactions.csv"), "--out", join(dir, "demo.xlsx")], { cwd: ROOT });
  demo = readFileSync(join(dir, "demo.xlsx"));
});

describe("audit on the demo workbook", () => {
  test("lists every Loadwright formula with the ruleset it names and where that name was read", async () => {
    const { status, json, stderr } = await auditJson(["demo.xlsx"]);
    expect(status).toBe(0);
    expect(json.formulas.map((f) => [f.sheet, f.cell, f.function])).toEqual(DEMO_FORMULAS);
    // docs/demo.md: the ruleset id sits in Cases!N7 and every formula reads it from there.
    for (const f of json.formulas) {
      expect(f.ruleset).toMatchObject({ reference: "id", id: "asce7-16-strength", from: "Cases!N7", source: "shipped" });
      expect(f.stored).toMatch(/^_xldudf_LW_/); // the form the demo writes (docs/demo.md)
      expect(f.formula).toMatch(/^=LW\./);
    }
    expect(json.formulas[1].formula).toBe("=LW.ENVELOPE(Cases!$A$7:$K$25,Cases!$N$7,Cases!$M$9:$N$10)");
    expect(json.storedRulesets).toEqual([]);
    expect(json.result).toMatchObject({ checked: false, passed: null, formulas: 5 });
    expect(json.cautions[0]).toMatch(/qualified, licensed engineer/);
    expect(stderr).toMatch(/^loadwright: \*\*\* UNVERIFIED RULESETS IN THIS WORKBOOK: asce7-16-strength/m);
  });

  test("prints the table with cautions first and UNVERIFIED beside each formula", async () => {
    const { status, stdout } = await audit(["demo.xlsx", "--format", "table"]);
    expect(status).toBe(0);
    expect(stdout.split("\n")[0]).toMatch(/^\*\*\* UNVERIFIED RULESETS IN THIS WORKBOOK/);
    expect(stdout).toMatch(/Caution: Results must be reviewed by a qualified, licensed engineer/);
    expect(stdout).toMatch(/No add-in settings in this workbook: it stores no rulesets\./);
    expect(stdout).toMatch(/\nEnvelope\s+A4\s+=LW\.ENVELOPE\(Cases!\$A\$7:\$K\$25,Cases!\$N\$7,Cases!\$M\$9:\$N\$10\)\s+asce7-16-strength\s+Cases!N7\s+shipped with Loadwright \(not stored in the workbook\)\s+[0-9a-f]{12}\s+UNVERIFIED\n/);
    expect(stdout).toMatch(/Result: 5 Loadwright formulas and 0 stored rulesets listed; no library given/);
  });

  test("passes when the library approved the shipped ruleset the formulas use, unchanged", async () => {
    const { status, json } = await auditJson(["demo.xlsx", "--library", library("shipped-approved.json", [approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2026-02-27")])]);
    expect(status).toBe(0);
    expect(json.formulas.every((f) => f.standing?.standing === "same" && f.libraryApproved === true)).toBe(true);
    expect(json.result).toMatchObject({ checked: true, passed: true, formulas: 5, notApproved: 0 });
  });

  test("fails, exit status 3, when the library does not hold the ruleset", async () => {
    const { status, stdout, stderr } = await audit(["demo.xlsx", "--library", library("other.json", [approved(shipped("en1990-equ"), "A. Approver (invented)", "2026-02-27")]), "--format", "table"]);
    expect(status).toBe(3);
    expect(stdout).toMatch(/\nEnvelope\s+A4\s+.*UNVERIFIED\s+not in library\n/);
    expect(stdout).toContain('Envelope!A4: not in library: the library holds no ruleset "asce7-16-strength"');
    expect(stderr).toMatch(/loadwright: error: audit not passed: 5 of 5 Loadwright formulas use a ruleset that is not the library's current approved version \(Cases!M13, Envelope!A4, Governing!A9, Combinations!A4, Explain!A7\)/);
  });
});

describe("audit on workbooks that store rulesets", () => {
  test("passes a workbook storing exactly the library's current version", async () => {
    write("stores-current.xlsx", await withStoredRulesets(demo, [v2]));
    const { status, json } = await auditJson(["stores-current.xlsx", "--library", library("two-versions.json", [v1, v2])]);
    expect(status).toBe(0);
    expect(json.addInParts).toEqual([{ part: "xl/webextensions/webextension1.xml", addIn: "f08e1263-da3a-4fea-969f-bcf2d0cafa40", storeType: "Registry", holdsRulesets: true }]);
    expect(json.storedRulesets.map((s) => [s.id, s.loads, s.fingerprint, s.standing?.standing])).toEqual([["asce7-16-strength", true, fingerprintOf(v2), "same"]]);
    for (const f of json.formulas) expect(f.ruleset).toMatchObject({ source: "stored", part: "xl/webextensions/webextension1.xml", fingerprint: fingerprintOf(v2) });
    expect(json.result.passed).toBe(true);
  });

  test("fails a workbook whose stored ruleset was changed locally, naming the standing", async () => {
    const local = revised(v2, "1.0.1-site");
    write("changed.xlsx", await withStoredRulesets(demo, [local]));
    const { status, stdout, stderr } = await audit(["changed.xlsx", "--library", library("two-versions.json", [v1, v2]), "--format", "table"]);
    expect(status).toBe(3);
    expect(stdout).toMatch(/\nasce7-16-strength\s+1\.0\.1-site\s+[0-9a-f]{12}\s+UNVERIFIED\s+not approved\s+CHANGED LOCALLY\n/);
    expect(stdout).toContain(`asce7-16-strength: CHANGED LOCALLY: fingerprint ${fingerprintOf(local).slice(0, 12)} matches no version of "asce7-16-strength" in the library`);
    expect(stdout).toMatch(/\nExplain\s+A7\s+.*stored in the workbook \(xl\/webextensions\/webextension1\.xml\)\s+[0-9a-f]{12}\s+UNVERIFIED\s+CHANGED LOCALLY\n/);
    expect(stderr).toMatch(/audit not passed: 5 of 5 Loadwright formulas use a ruleset that is not the library's current approved version/);
  });

  test("fails a workbook holding a version the library has superseded", async () => {
    write("superseded.xlsx", await withStoredRulesets(demo, [v1]));
    const { status, json } = await auditJson(["superseded.xlsx", "--library", library("two-versions.json", [v1, v2])]);
    expect(status).toBe(3);
    expect(json.storedRulesets[0].standing?.standing).toBe("library-newer");
    expect(json.formulas[0].standing?.text).toMatch(/^LIBRARY HAS NEWER: this is the superseded version 1\.0\.0 approved by A\. Approver \(invented\) on 2025-06-30/);
    expect(json.result).toMatchObject({ passed: false, notApproved: 5 });
  });

  test("refuses to name a ruleset stored with different content by two add-in installations", async () => {
    // Settings are kept per add-in (Office.Settings: "saved per add-in and per document"), so a workbook
    // opened with two installations of the add-in under different ids holds two add-in parts.
    const zip = await JSZip.loadAsync(await withStoredRulesets(demo, [v2]));
    const second = webExtensionPart(`    <we:property name="loadwright.rulesets" value="${storeValue([v1])}"/>`).replace(/<we:reference id="[^"]*"/, '<we:reference id="wa200000000"');
    zip.file("xl/webextensions/webextension2.xml", second);
    const types = await (zip.file("[Content_Types].xml") as JSZip.JSZipObject).async("string");
    zip.file("[Content_Types].xml", types.replace("</Types>", '<Override PartName="/xl/webextensions/webextension2.xml" ContentType="application/vnd.ms-office.webextension+xml"/></Types>'));
    write("two-installations.xlsx", await zip.generateAsync({ type: "uint8array" }));
    const { status, json } = await auditJson(["two-installations.xlsx", "--library", library("two-versions.json", [v1, v2])]);
    expect(status).toBe(3);
    expect(json.addInParts.map((p) => [p.part, p.addIn])).toEqual([
      ["xl/webextensions/webextension1.xml", "f08e1263-da3a-4fea-969f-bcf2d0cafa40"],
      ["xl/webextensions/webextension2.xml", "wa200000000"],
    ]);
    expect(json.storedRulesets.map((s) => [s.part, s.standing?.standing])).toEqual([
      ["xl/webextensions/webextension1.xml", "same"],
      ["xl/webextensions/webextension2.xml", "library-newer"],
    ]);
    expect(json.formulas[0].ruleset).toMatchObject({ source: "none", reason: expect.stringMatching(/"asce7-16-strength" is stored with different content in xl\/webextensions\/webextension1\.xml and xl\/webextensions\/webextension2\.xml/) });
    expect(json.formulas[0].libraryApproved).toBe(false);
  });

  test("lists stored rulesets without a library, exit 0, and in CSV one line per stored ruleset and per formula", async () => {
    write("stores-two.xlsx", await withStoredRulesets(demo, [v2, approved(shipped("en1990-equ"), "A. Approver (invented)", "2026-01-05")]));
    const { status, stdout } = await audit(["stores-two.xlsx", "--format", "csv"]);
    expect(status).toBe(0);
    const rows = csvRows(stdout);
    expect(rows[0].slice(0, 5)).toEqual(["record", "sheet", "cell", "formula", "ruleset"]);
    expect(rows.slice(1).map((r) => [r[0], r[4]])).toEqual([
      ["stored ruleset", "asce7-16-strength"],
      ["stored ruleset", "en1990-equ"],
      ...DEMO_FORMULAS.map(() => ["formula", "asce7-16-strength"]),
    ]);
  });
});

describe("audit on the forms Excel writes", () => {
  /**
   * Sheet "Load cases" holds ids as a shared string (A1), an inline string (B1) and a formula's
   * saved text value (C1); sheet "Calc" names them through a text argument, a shared formula
   * filled across (A2:C2, its text only in A2), a defined name inside Excel's implicit
   * intersection wrapper, a range typed in cells, a computed argument, a nested call, an id
   * inside quotes that is no call, and another workbook.
   */
  const workbook = () =>
    excelStyleWorkbook(
      [
        {
          name: "Load cases",
          rows:
            '<row r="1"><c r="A1" t="s"><v>0</v></c><c r="B1" t="inlineStr"><is><t>en1990-equ</t></is></c>' +
            '<c r="C1" t="str"><f>LOWER("NBCC2020-ULS")</f><v>nbcc2020-uls</v></c></row>',
        },
        {
          name: "Calc",
          rows:
            '<row r="1"><c r="A1"><f>_xldudf_LW_RULESET("en1990-str-6.10")</f></c>' +
            '<c r="E1" t="s"><v>1</v></c><c r="F1" t="s"><v>2</v></c></row>' +
            "<row r=\"2\"><c r=\"A2\"><f t=\"shared\" ref=\"A2:C2\" si=\"0\">_xldudf_LW_RULESET('Load cases'!A1)</f></c>" +
            '<c r="B2"><f t="shared" si="0"/></c><c r="C2"><f t="shared" si="0"/></c></row>' +
            '<row r="3"><c r="A3"><f>_xlfn.SINGLE(_xldudf_LW_RULESET(RulesetId))</f></c></row>' +
            '<row r="4"><c r="A4"><f t="array" ref="A4">LW.COMBOS(Calc!$E$1:$F$1)</f></c></row>' +
            '<row r="5"><c r="A5"><f>_xldudf_LW_RULESET(IF(TRUE,"en1990-equ","x"))</f></c></row>' +
            '<row r="6"><c r="A6"><f>IF(1,_xldudf_LW_RULESET("asce7-22-strength"),0)</f></c></row>' +
            '<row r="7"><c r="A7" t="str"><f>CONCAT("_xldudf_LW_RULESET(""x"")")</f><v>_xldudf_LW_RULESET("x")</v></c></row>' +
            '<row r="8"><c r="A8"><f>_xldudf_LW_RULESET([1]Sheet1!$A$1)</f></c></row>',
        },
      ],
      ["asce7-16-strength", "1", "1.2D + 1.6L"],
      "<definedName name=\"RulesetId\">'Load cases'!$A$1</definedName>",
    );

  test("reads each form and says where a ruleset cannot be named", async () => {
    write("excel-forms.xlsx", await workbook());
    const { status, json } = await auditJson(["excel-forms.xlsx"]);
    expect(status).toBe(0);
    // Expected by hand from the cells written above and the add-in's reading of its ruleset argument
    // (docs/formulas.md: an id in quotes or in one cell; a range of rows is a ruleset typed in cells).
    expect(json.formulas.map((f) => [f.sheet, f.cell, f.ruleset.reference, f.ruleset.id, f.ruleset.from])).toEqual([
      ["Calc", "A1", "id", "en1990-str-6.10", "text"],
      ["Calc", "A2", "id", "asce7-16-strength", "'Load cases'!A1"],
      ["Calc", "B2", "id", "en1990-equ", "'Load cases'!B1"],
      ["Calc", "C2", "id", "nbcc2020-uls", "'Load cases'!C1, the value its formula last gave"],
      ["Calc", "A3", "id", "asce7-16-strength", "name RulesetId → 'Load cases'!A1"],
      ["Calc", "A4", "cells", null, "Calc!E1:F1"],
      ["Calc", "A5", "unresolved", null, null],
      ["Calc", "A6", "id", "asce7-22-strength", "text"],
      ["Calc", "A8", "unresolved", null, null],
    ]);
    const byCell = new Map(json.formulas.map((f) => [`${f.sheet}!${f.cell}`, f]));
    expect(byCell.get("Calc!B2")?.stored).toBe("_xldudf_LW_RULESET('Load cases'!B1)"); // the shared formula moved one column
    expect(byCell.get("Calc!A4")?.formula).toBe("=LW.COMBOS(Calc!$E$1:$F$1)");
    expect(byCell.get("Calc!A5")?.ruleset.reason).toMatch(/the ruleset argument IF\(TRUE,"en1990-equ","x"\) is an expression the audit does not evaluate/);
    expect(byCell.get("Calc!A8")?.ruleset.reason).toMatch(/refers to another workbook/);
  });

  test("counts what cannot be resolved or is typed in cells as not approved", async () => {
    const { status, json } = await auditJson(["excel-forms.xlsx", "--library", library("strength.json", [v2])]);
    expect(status).toBe(3);
    const failing = json.formulas.filter((f) => f.libraryApproved === false).map((f) => `${f.sheet}!${f.cell}`);
    expect(failing).toEqual(["Calc!A1", "Calc!A2", "Calc!B2", "Calc!C2", "Calc!A3", "Calc!A4", "Calc!A5", "Calc!A6", "Calc!A8"]);
  });

  const soffice = (() => {
    try {
      execFileSync("soffice", ["--version"], { stdio: "ignore" });
      return true;
    } catch {
      return false;
    }
  })();

  // CI installs LibreOffice Calc (.ci/run): a workbook saved by another spreadsheet program.
  test.skipIf(!soffice)("reads the demo workbook after LibreOffice Calc has opened and saved it", async () => {
    const out = join(dir, "libreoffice");
    mkdirSync(out, { recursive: true });
    await promisify(execFile)("soffice", ["--headless", `-env:UserInstallation=file://${join(dir, "lo-profile")}`, "--convert-to", "xlsx", "--outdir", out, join(dir, "demo.xlsx")], { timeout: 120_000 });
    const { status, json } = await auditJson([join(out, "demo.xlsx")]);
    expect(status).toBe(0);
    expect(json.formulas.map((f) => [f.sheet, f.cell, f.function, f.ruleset.id, f.ruleset.from])).toEqual(DEMO_FORMULAS.map(([s, c, fn]) => [s, c, fn, "asce7-16-strength", "Cases!N7"]));
  }, 180_000);
});

describe("audit refuses what it cannot read, with located messages", () => {
  async function refused(file: string, args: string[] = []) {
    const run = await audit([file, ...args]);
    expect(run.status).toBe(1);
    return run.stderr;
  }

  test("a missing file, a directory, a text file, an empty file and an Excel 97-2003 file", async () => {
    expect(await refused("missing.xlsx")).toMatch(/^loadwright: error: missing\.xlsx: no such file$/m);
    expect(await refused(".")).toMatch(/^loadwright: error: \.: is a directory, not a workbook$/m);
    expect(await refused(write("text.xlsx", "id,expression\n1,1.2D\n"))).toMatch(/^loadwright: error: text\.xlsx: not a zip package, so not an \.xlsx workbook \(Can't find end of central directory : is this a zip file \?\)$/m);
    expect(await refused(write("empty.xlsx", ""))).toMatch(/^loadwright: error: empty\.xlsx: not a zip package/m);
    // Compound File Binary signature D0 CF 11 E0 A1 B1 1A E1 ([MS-CFB] §2.2, https://learn.microsoft.com/openspecs/windows_protocols/ms-cfb/).
    const cfb = Uint8Array.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, ...new Array(504).fill(0)]);
    expect(await refused(write("old.xls", cfb))).toMatch(/old\.xls: an Excel 97-2003 workbook \(\.xls\) or a password-protected workbook/);
  });

  test("a zip that is not a workbook, a Word document, a truncated package", async () => {
    const zip = new JSZip();
    zip.file("readme.txt", "hello");
    expect(await refused(write("plain.zip", await zip.generateAsync({ type: "uint8array" })))).toMatch(/plain\.zip: a zip file without \[Content_Types\]\.xml, so not an Office document/);
    const docx = await JSZip.loadAsync(demo);
    const types = await (docx.file("[Content_Types].xml") as JSZip.JSZipObject).async("string");
    docx.file("[Content_Types].xml", types.replace("spreadsheetml.sheet.main+xml", "wordprocessingml.document.main+xml"));
    expect(await refused(write("word.xlsx", await docx.generateAsync({ type: "uint8array" })))).toMatch(/word\.xlsx: a Word document, not a workbook/);
    expect(await refused(write("truncated.xlsx", demo.slice(0, Math.floor(demo.length / 2))))).toMatch(/truncated\.xlsx: not a zip package/);
  });

  test("a worksheet that is not well-formed XML, by part, line and column", async () => {
    const zip = await JSZip.loadAsync(demo);
    zip.file("xl/worksheets/sheet2.xml", '<?xml version="1.0"?>\n<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main">\n<sheetData><row r="1"><c r="A1"></row></sheetData></worksheet>');
    expect(await refused(write("bad-sheet.xlsx", await zip.generateAsync({ type: "uint8array" })))).toMatch(/^loadwright: error: bad-sheet\.xlsx: xl\/worksheets\/sheet2\.xml line 3, column \d+: not well-formed XML: unexpected close tag\.?$/m);
  });

  test("a damaged settings part: not XML, a value that is not JSON, a store in another format", async () => {
    const part = "xl/webextensions/webextension1.xml";
    write("settings-xml.xlsx", await withAddInPart(demo, webExtensionPart('    <we:property name="loadwright.rulesets" value="{}">')));
    expect(await refused("settings-xml.xlsx")).toMatch(new RegExp(`settings-xml\\.xlsx: ${part} line \\d+, column \\d+: not well-formed XML`));
    const notJson = webExtensionPart('    <we:property name="loadwright.rulesets" value="&quot;{&quot;"/>');
    const line = notJson.split("\n").findIndex((l) => l.includes("loadwright.rulesets")) + 1;
    write("settings-json.xlsx", await withAddInPart(demo, notJson));
    expect(await refused("settings-json.xlsx")).toMatch(
      new RegExp(`settings-json\\.xlsx: ${part} line ${line}, column \\d+: the setting "loadwright\\.rulesets" holds text that is not JSON: a "\\}" is expected at line 1, column 2 of the text; the stored rulesets cannot be read`),
    );
    write("settings-format.xlsx", await withAddInPart(demo, webExtensionPart(`    <we:property name="loadwright.rulesets" value="${storeValue([]).replace("loadwright-store/1", "other/1")}"/>`)));
    expect(await refused("settings-format.xlsx")).toMatch(/the setting "loadwright\.rulesets" is not in the loadwright-store\/1 format/);
  });

  test("a stored ruleset that does not load: listed, then named by part, entry and place, exit 1", async () => {
    const broken = structuredClone(v2);
    broken.combinations[0].expression = "1.4D + 1.6Lx";
    write("broken-store.xlsx", await withStoredRulesets(demo, [broken]));
    const { status, stdout, stderr } = await audit(["broken-store.xlsx", "--format", "table"]);
    expect(status).toBe(1);
    expect(stdout).toMatch(/\nasce7-16-strength\s+DOES NOT LOAD\s+see the errors below\n/);
    expect(stdout).toMatch(/\nEnvelope\s+A4\s+.*the stored ruleset "asce7-16-strength" \(xl\/webextensions\/webextension1\.xml\) does not load, so the formula shows an error/);
    expect(stderr).toMatch(/^loadwright: error: broken-store\.xlsx: xl\/webextensions\/webextension1\.xml, stored ruleset 1 "asce7-16-strength" \(combinations\[0\]\.expression, combination "1", character 11\): unknown name "Lx"/m);
  });

  test("a package whose part inflates past the limit (a zip bomb)", async () => {
    write("bomb.xlsx", await zipBomb(300 * 1024 * 1024));
    expect(await refused("bomb.xlsx")).toMatch(/^loadwright: error: bomb\.xlsx: \[Content_Types\]\.xml: the part inflates to more than 256 MB; the audit refuses it \(a damaged or hostile package\?\)$/m);
  });

  test("a library that does not load, by line and column", async () => {
    const text = JSON.stringify(libraryOf([shipped("en1990-equ")]), null, 2);
    write("unapproved.json", text);
    const stderr = await refused("demo.xlsx", ["--library", "unapproved.json"]);
    const lines = text.split("\n");
    const approval = lines.findIndex((l) => l.includes('"approval"'));
    const line = approval + lines.slice(approval).findIndex((l) => l.includes('"fingerprint"')) + 1;
    expect(stderr).toMatch(new RegExp(`^loadwright: error: unapproved\\.json line ${line}, column \\d+ \\(rulesets\\[0\\]\\.approval\\.fingerprint\\): ruleset "en1990-equ" is not approved`, "m"));
  });
});

describe("library: checking a firm library before it is published", () => {
  test("lists each version with its approval, the one approved last as current, and UNVERIFIED ones first", async () => {
    const file = library("publish.json", [v2, v1, approved(shipped("en1990-equ"), "C. Approver (invented)", "2026-01-05")]);
    const run = await loadwright(["library", file, "--format", "csv"], { cwd: dir });
    expect(run.status).toBe(0);
    expect(run.stderr).toMatch(/^loadwright: \*\*\* UNVERIFIED RULESETS IN THIS LIBRARY: asce7-16-strength/m);
    expect(run.stderr).toMatch(/loads; 2 current rulesets and 1 superseded/);
    expect(csvRows(run.stdout).map((r) => r.slice(0, 5))).toEqual([
      ["id", "version", "standing in library", "approved by", "date"],
      ["asce7-16-strength", "1.0.1", "current", "B. Approver (invented)", "2026-02-27"],
      ["asce7-16-strength", v1.version, "superseded", "A. Approver (invented)", "2025-06-30"],
      ["en1990-equ", shipped("en1990-equ").version, "current", "C. Approver (invented)", "2026-01-05"],
    ]);
  });

  test("refuses a library that does not load, exit 1, every problem on its own line", async () => {
    const changed = { ...v2, version: "1.0.1-edited" };
    const run = await loadwright(["library", library("bad.json", [v1, changed, v1])], { cwd: dir });
    expect(run.status).toBe(1);
    const lines = run.stderr.split("\n").filter((l) => l.startsWith("loadwright: error: "));
    expect(lines).toHaveLength(2);
    expect(lines[0]).toMatch(/^loadwright: error: bad\.json line \d+, column \d+ \(rulesets\[1\]\.approval\.fingerprint\): the approval of "asce7-16-strength" was given to other content/);
    expect(lines[1]).toMatch(/^loadwright: error: bad\.json line \d+, column \d+ \(rulesets\[2\]\): the same content of "asce7-16-strength" .* is listed twice \(also at rulesets\[0\]\)/);
  });
});
