/**
 * An .xlsx case file is the same table as its CSV: workbooks written here by
 * exceljs (the spreadsheet library, an independent writer of SpreadsheetML)
 * give byte for byte the output of the same table as CSV, in both orientations,
 * through envelope, governing, factored and explain; the cells a CSV file cannot
 * hold (a number shown as a date, a formula without a saved value, merged
 * header cells) and those it holds as text (a number stored as text, TRUE,
 * #DIV/0!) are answered where they stand, as `Results!D17`.
 *
 * The numbers are the CSV path's own, which the other command-line tests hold
 * to hand calculations; what is checked here is that a worksheet reads as the
 * same table. Cell addresses (column letters, row numbers, `Sheet!A1`) are the
 * notation spreadsheets show: common practice (no source).
 */
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, test } from "vitest";
import { csvRows, errorLines, FIXTURES, loadwright } from "./harness.js";

let dir: string;
const RULES = ["--ruleset", join(FIXTURES, "strength-fixture.json")];

type Value = string | number | boolean | null | ExcelJS.CellValue;

function csvTable(name: string): string[][] {
  return csvRows(readFileSync(join(FIXTURES, name), "utf8"));
}

/** A CSV table's cells as a worksheet holds them: numbers as numbers, names as text. */
function typed(rows: string[][]): Value[][] {
  return rows.map((r) => r.map((c) => (c.trim() !== "" && Number.isFinite(Number(c)) ? Number(c) : c === "" ? null : c)));
}

async function workbook(name: string, sheets: { name: string; rows: Value[][]; at?: [number, number]; setup?: (ws: ExcelJS.Worksheet) => void }[]): Promise<string> {
  const wb = new ExcelJS.Workbook();
  for (const s of sheets) {
    const ws = wb.addWorksheet(s.name);
    const [top, left] = s.at ?? [1, 1];
    s.rows.forEach((row, r) =>
      row.forEach((value, c) => {
        if (value !== null && value !== undefined) ws.getCell(top + r, left + c).value = value as ExcelJS.CellValue;
      }),
    );
    s.setup?.(ws);
  }
  await wb.xlsx.writeFile(join(dir, name));
  return name;
}

function file(name: string, text: string): string {
  writeFileSync(join(dir, name), text);
  return name;
}


async function refused(args: string[]): Promise<string[]> {
  const run = await loadwright(args, { cwd: dir });
  expect(run.status).toBe(1);
  expect(run.stderr).not.toMatch(/^\s+at |internal error/m);
  return errorLines(run.stderr);
}

/** The same command on two files: the same status and, byte for byte, the same standard output. */
async function same(args: (file: string) => string[], csv: string, xlsx: string): Promise<string> {
  const a = await loadwright(args(csv), { cwd: dir });
  const b = await loadwright(args(xlsx), { cwd: dir });
  expect(a.status).toBe(0);
  expect(b.status).toBe(0);
  expect(b.stdout).toBe(a.stdout);
  return b.stdout;
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-xlsx-"));
  writeFileSync(join(dir, "columns.csv"), readFileSync(join(FIXTURES, "export-columns.csv")));
  writeFileSync(join(dir, "rows.csv"), readFileSync(join(FIXTURES, "reactions-rows.csv")));
  await workbook("columns.xlsx", [{ name: "Results", rows: typed(csvTable("export-columns.csv")) }]);
  await workbook("rows.xlsx", [{ name: "Reactions", rows: typed(csvTable("reactions-rows.csv")) }]);
  // The table placed away from A1 on the second sheet, with notes around it that --range leaves out.
  const notes: Value[][] = [["notes: invented"], [], ...typed(csvTable("export-columns.csv")).map((r) => [null, ...r]), [], [null, "total", 1, 2, 3, 4]];
  await workbook("placed.xlsx", [
    { name: "Cover", rows: [["calculation 12"]] },
    { name: "Load cases", rows: notes, at: [3, 2] },
  ]);
});

describe("an .xlsx case file reads as the same table in CSV", () => {
  for (const format of ["csv", "json", "table"]) {
    test(`envelope, cases as columns (${format})`, async () => {
      await same((f) => ["envelope", f, ...RULES, "--format", format], "columns.csv", "columns.xlsx");
    });
    test(`envelope, cases as rows (${format})`, async () => {
      await same((f) => ["envelope", f, ...RULES, "--format", format], "rows.csv", "rows.xlsx");
    });
  }

  test("governing, factored and explain, in both orientations", async () => {
    await same((f) => ["governing", f, ...RULES, "--criterion", "max [C1 top]", "--criterion", "min |[C1 bottom]|", "--format", "json"], "columns.csv", "columns.xlsx");
    await same((f) => ["governing", f, ...RULES, "--criterion", "max [C1 top]", "--format", "csv"], "columns.csv", "columns.xlsx");
    await same((f) => ["governing", f, ...RULES, "--format", "csv"], "rows.csv", "rows.xlsx");
    await same((f) => ["factored", f, ...RULES, "--format", "csv"], "columns.csv", "columns.xlsx");
    await same((f) => ["factored", f, ...RULES, "--format", "json"], "rows.csv", "rows.xlsx");
    await same((f) => ["explain", f, ...RULES, "--row", "2: 1.2D + 1.6L", "--component", "C1 top", "--format", "json"], "columns.csv", "columns.xlsx");
    await same((f) => ["explain", f, ...RULES, "--row", "2: 1.2D + 1.6L", "--component", "P", "--format", "csv"], "rows.csv", "rows.xlsx");
  });

  test("--sheet and --range find a table placed anywhere in the workbook", async () => {
    const csv = await loadwright(["envelope", "columns.csv", ...RULES, "--format", "csv"], { cwd: dir });
    const placed = await loadwright(["envelope", "placed.xlsx", ...RULES, "--sheet", "load cases", "--range", "C5:G7", "--format", "csv"], { cwd: dir });
    expect(placed.stderr).not.toMatch(/error/);
    expect(placed.stdout).toBe(csv.stdout);
  });

  test("without --range the used range is read: a value below the table is a row of it, refused where it stands", async () => {
    const lines = await refused(["envelope", "placed.xlsx", ...RULES, "--sheet", "Load cases", "--format", "csv"]);
    // The used range starts at B3 (the note), whose row is read as the header row: one column wide.
    expect(lines).toEqual(["placed.xlsx 'Load cases'!C5: a value in a column whose header is blank; name the case in the header row or clear the column (or give --range)"]);
  });

  test("names the sheets there are when --sheet names none of them", async () => {
    expect(await refused(["envelope", "placed.xlsx", ...RULES, "--sheet", "Load case"])).toEqual([
      '--sheet: placed.xlsx has no worksheet "Load case"; did you mean "Load cases"? (worksheets: Cover, Load cases)',
    ]);
  });

  test("refuses a range that is not one, and --sheet on a CSV file", async () => {
    expect(await refused(["envelope", "columns.xlsx", ...RULES, "--range", "A1:B"])).toEqual(['--range: "A1:B" is not a range of cells such as A1:Q2000']);
    expect(await refused(["envelope", "columns.csv", ...RULES, "--sheet", "Results"])).toEqual([
      "columns.csv: --sheet and --range read an .xlsx workbook; this is not one (its name does not end in .xlsx)",
    ]);
  });
});

describe("ids read as in CSV", () => {
  test("a row whose id cell is blank is row N, counted from the header row, and an id given twice names both rows", async () => {
    const table = "result,D,L,W:N,W:E\nC1,140,420,-50,20\n,152,420,-61,26\n";
    file("blank-id.csv", table);
    await workbook("blank-id.xlsx", [{ name: "Results", rows: typed(csvRows(table)) }]);
    const out = await same((f) => ["envelope", f, ...RULES, "--format", "csv"], "blank-id.csv", "blank-id.xlsx");
    expect(csvRows(out)[2][0]).toBe("row 3");

    const twice = "result,D,L,W:N,W:E\nC1,140,420,-50,20\nC2,152,420,-61,26\nC1,1,2,3,4\n";
    file("twice.csv", twice);
    await workbook("twice.xlsx", [{ name: "Results", rows: typed(csvRows(twice)) }]);
    const a = await refused(["envelope", "twice.csv", ...RULES, "--format", "csv"]);
    const b = await refused(["envelope", "twice.xlsx", ...RULES, "--format", "csv"]);
    expect(a).toEqual(['twice.csv line 4, column A (C1): result "C1" appears twice (also at line 2, column A)']);
    expect(b).toEqual(['twice.xlsx Results!A4 (C1): result "C1" appears twice (also at Results!A2)']);
  });
});

describe("cells a CSV file holds as text are answered as there", () => {
  const header = ["result", "D", "L", "W:N", "W:E"];
  const cases: [string, Value, string][] = [
    ["a number stored as text", "420", "420"],
    ["a boolean", true, "TRUE"],
    ["an error value", { error: "#DIV/0!" } as ExcelJS.CellErrorValue, "#DIV/0!"],
    ["a formula's saved text", { formula: 'TEXT(1,"0")', result: "1" } as ExcelJS.CellFormulaValue, "1"],
  ];
  for (const [what, cell, csvText] of cases) {
    test(what, async () => {
      const name = what.replace(/\W+/g, "-");
      file(`${name}.csv`, `${header.join(",")}\nC1,140,${csvText},-50,20\n`);
      await workbook(`${name}.xlsx`, [{ name: "Results", rows: [header, ["C1", 140, cell, -50, 20]] }]);
      const fromXlsx = await refused(["envelope", `${name}.xlsx`, ...RULES, "--format", "csv"]);
      // A CSV field is text, so "420" there is a number; in a worksheet a number stored as text is refused, with a hint.
      if (/^\d+$/.test(csvText)) {
        expect(fromXlsx).toEqual([`${name}.xlsx Results!C2 (L): "${csvText}" is not a number (a number stored as text? convert it)`]);
      } else if (csvText.startsWith("#")) {
        // A spreadsheet's error value is named as such, in a worksheet and as the text a CSV export writes of it.
        expect(fromXlsx).toEqual([`${name}.xlsx Results!C2 (L): ${csvText} is an error value, not a number (the formula that should have given it failed)`]);
        expect(await refused(["envelope", `${name}.csv`, ...RULES, "--format", "csv"])).toEqual([`${name}.csv line 2, column C (L): ${csvText} is an error value, not a number (the formula that should have given it failed)`]);
      } else {
        expect(fromXlsx).toEqual([`${name}.xlsx Results!C2 (L): "${csvText}" is not a number`]);
        expect(await refused(["envelope", `${name}.csv`, ...RULES, "--format", "csv"])).toEqual([`${name}.csv line 2, column C (L): "${csvText}" is not a number`]);
      }
    });
  }

  test("shared and inline strings read alike", async () => {
    const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: join(dir, "inline.xlsx"), useSharedStrings: false });
    const ws = wb.addWorksheet("Results");
    ws.addRow([{ richText: [{ text: "res" }, { text: "ult" }] }, "D", "L", "W:N", "W:E"]).commit();
    ws.addRow([{ richText: [{ text: "C1 " }, { text: "top" }] }, 140, 420, -50, 20]).commit();
    ws.addRow(["C1 bottom", 152, 420, -61, 26]).commit();
    ws.commit();
    await wb.commit();
    const xml = await sheetXml("inline.xlsx");
    expect(xml).toMatch(/t="inlineStr"/);
    await same((f) => ["envelope", f, ...RULES, "--format", "csv"], "columns.csv", "inline.xlsx");
  });
});

/** The first worksheet's XML, to check how exceljs wrote a cell. */
async function sheetXml(name: string): Promise<string> {
  const JSZip = (await import("jszip")).default;
  const zip = await JSZip.loadAsync(readFileSync(join(dir, name)));
  return (await zip.file("xl/worksheets/sheet1.xml")?.async("string")) ?? "";
}

describe("cells a CSV file cannot hold are refused where they stand", () => {
  const header = ["result", "D", "L", "W:N", "W:E"];

  test("a number shown as a date", async () => {
    await workbook("date.xlsx", [{ name: "Results", rows: [header, ["C1", 140, new Date(Date.UTC(2024, 0, 15)), -50, 20]] }]);
    const lines = await refused(["envelope", "date.xlsx", ...RULES, "--format", "csv"]);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^date\.xlsx Results!C2: the number 45306 is shown as a date or a time \(built-in date format 14\), so it is a count of days, not a load effect or a name; format the cell as a number/);
    // 2024-01-15 is day 45306 of the 1900 date system (1900-01-01 = 1, with the leap day 1900-02-29 Lotus kept): [memory], checked as
    // the day count from 1899-12-30 here.
    expect((Date.UTC(2024, 0, 15) - Date.UTC(1899, 11, 30)) / 86_400_000).toBe(45306);

    await workbook("custom-date.xlsx", [
      { name: "Results", rows: [header, ["C1", 140, 420, -50, 20]], setup: (ws) => (ws.getCell("D2").numFmt = "yyyy-mm-dd") },
    ]);
    expect(await refused(["envelope", "custom-date.xlsx", ...RULES, "--format", "csv"])).toEqual([
      expect.stringMatching(/^custom-date\.xlsx Results!D2: the number -50 is shown as a date or a time \(format yyyy-mm-dd\)/),
    ]);
  });

  test("a number format that only looks like one is read", async () => {
    await workbook("units.xlsx", [{ name: "Results", rows: [header, ["C1", 140, 420, -50, 20]], setup: (ws) => (ws.getCell("D2").numFmt = '0.00 "kN·m"') }]);
    const run = await loadwright(["envelope", "units.xlsx", ...RULES, "--format", "csv"], { cwd: dir });
    expect(run.status).toBe(0);
  });

  test("a formula without a saved value", async () => {
    await workbook("formula.xlsx", [{ name: "Results", rows: [header, ["C1", 140, { formula: "B2*3" } as ExcelJS.CellFormulaValue, -50, 20]] }]);
    expect(await sheetXml("formula.xlsx")).toMatch(/<c r="C2"><f>B2\*3<\/f><\/c>/);
    expect(await refused(["envelope", "formula.xlsx", ...RULES, "--format", "csv"])).toEqual([
      "formula.xlsx Results!C2: the cell holds the formula =B2*3 but no saved value (the program that wrote the workbook did not calculate it); open the workbook in a spreadsheet program, recalculate and save it, or paste the values",
    ]);
  });

  test("a formula with its saved value is read as that value", async () => {
    await workbook("saved.xlsx", [
      { name: "Results", rows: typed(csvTable("export-columns.csv")), setup: (ws) => (ws.getCell("C2").value = { formula: "B2*3", result: 420 } as ExcelJS.CellFormulaValue) },
    ]);
    await same((f) => ["envelope", f, ...RULES, "--format", "csv"], "columns.csv", "saved.xlsx");
  });

  test("merged header cells, in either orientation", async () => {
    await workbook("merged.xlsx", [{ name: "Results", rows: [["result", "D", "L", null, "W:E"], ["C1", 140, 420, -50, 20]], setup: (ws) => ws.mergeCells("C1:D1") }]);
    expect(await refused(["envelope", "merged.xlsx", ...RULES, "--format", "csv"])).toEqual([
      "merged.xlsx Results!C1: the header cells C1:D1 are merged; a case table has one header a column: unmerge them and name each column",
    ]);
    await workbook("merged-rows.xlsx", [{ name: "Reactions", rows: [["case", "P", "V", null], ["D", 140, 2, 10], ["L", 420, 5, 22]], setup: (ws) => ws.mergeCells("C1:D1") }]);
    expect(await refused(["envelope", "merged-rows.xlsx", ...RULES, "--format", "csv"])).toEqual([
      "merged-rows.xlsx Reactions!C1: the header cells C1:D1 are merged; a case table has one header a column: unmerge them and name each column",
    ]);
  });

  test("merged value cells in a streamed table stop the run, with the cells", async () => {
    await workbook("merged-values.xlsx", [{ name: "Results", rows: [header, ["C1", 140, 420, -50, 20], ["C2", 152, 420, null, 26]], setup: (ws) => ws.mergeCells("C3:D3") }]);
    const lines = await refused(["envelope", "merged-values.xlsx", ...RULES, "--format", "csv"]);
    expect(lines).toEqual(["merged-values.xlsx Results!C3: the cells C3:D3 are merged, so all but the first read as blank; unmerge them and give each cell its value"]);
  });
});

describe("a large worksheet", () => {
  test("200,000 rows stream through envelope with the CSV file's output, in bounded memory", async () => {
    const rows = 200_000;
    const caseNames = ["D", "L", "W:N", "W:E"];
    let csv = `member,station,${caseNames.join(",")}\n`;
    const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: join(dir, "large.xlsx"), useSharedStrings: true });
    const ws = wb.addWorksheet("Results");
    ws.addRow(["member", "station", ...caseNames]).commit();
    for (let i = 0; i < rows; i++) {
      // Invented values, varied row by row.
      const values = [(i % 97) + 1, (i * 7) % 53, ((i * 13) % 41) - 20, ((i * 11) % 37) - 18.5];
      ws.addRow([`M${Math.floor(i / 10)}`, i % 10, ...values]).commit();
      csv += `M${Math.floor(i / 10)},${i % 10},${values.join(",")}\n`;
    }
    ws.commit();
    await wb.commit();
    file("large.csv", csv);
    const args = (f: string) => ["envelope", f, ...RULES, "--id-columns", "2", "--format", "csv", "--threads", "1"];
    const a = await loadwright(args("large.csv"), { cwd: dir });
    const b = await peakMemory(args("large.xlsx"));
    expect(b.status).toBe(0);
    expect(b.stdout).toBe(a.stdout);
    expect(csvRows(b.stdout)).toHaveLength(rows + 1);
    // A bound with ample margin, not a measurement (npm run bench measures): the CSV path keeps about 140 MB here.
    expect(b.peakKb).not.toBeNull();
    expect(b.peakKb).toBeLessThan(300 * 1024);
  }, 180_000);
});

/** The run's output and the child's peak resident memory (Linux: the process's VmHWM, read before it exits). */
async function peakMemory(args: string[]): Promise<{ status: number; stdout: string; peakKb: number | null }> {
  const { spawn } = await import("node:child_process");
  const { builtPackage } = await import("./harness.js");
  const bin = join(await builtPackage(), "bin/loadwright.js");
  // NODE_OPTIONS --require is not for ESM; a wrapper prints the high-water mark on exit to a file instead.
  const report = join(dir, `peak-${Date.now()}.txt`);
  const wrapper = join(dir, "peak.cjs");
  writeFileSync(wrapper, `process.on("exit", () => { try { require("fs").writeFileSync(${JSON.stringify(report)}, require("fs").readFileSync("/proc/self/status", "utf8")); } catch {} });\n`);
  return await new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--require", wrapper, bin, ...args], { cwd: dir, env: { ...process.env, NO_COLOR: "1" } });
    let stdout = "";
    child.stdout.on("data", (c: Buffer) => (stdout += c.toString("utf8")));
    child.stderr.resume();
    child.on("error", reject);
    child.on("close", (status) => {
      let peakKb: number | null = null;
      try {
        const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync(report, "utf8"));
        peakKb = m ? Number(m[1]) : null;
      } catch {
        peakKb = null;
      }
      resolve({ status: status ?? -1, stdout, peakKb });
    });
  });
}
