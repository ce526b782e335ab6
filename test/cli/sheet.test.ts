/**
 * `loadwright sheet`: the reviewer's copy recomputed by another spreadsheet
 * program. The written workbook is recalculated by LibreOffice Calc (headless,
 * its own profile) and every number it computes — each factored value, the
 * envelope and the governing rows — is held to the engine's output from the
 * command line's JSON (`combos`, `factored`, `envelope`, `governing`).
 *
 * The case table is invented for this test (numbers chosen only to give each
 * load a different effect); what is checked is that the plain formulas
 * reproduce the engine, not any published value. The engine itself is held to
 * published factors in test/rulesets and test/core.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, test } from "vitest";
import { loadwright } from "./harness.js";
import { recalculatedByLibreOffice, savedCells, type SavedCell } from "./libreOffice.js";

// Invented reactions (kips, kip-ft): dead, live, roof live, snow, wind from four directions, earthquake along two axes.
const CASES = `case,P,V,M
D,140,2.0,10
L,420,5.0,22
Lr,35,0.5,4
S,60,1.0,6
W:N,-50,10,48
W:E,20,-8,-31
W:S,-45,-9.5,-44
W:W,25,7,29
E:x,12,15,66
E:y,-8,6,-21
`;
// The last is not linear: the engine evaluates it on every row, the sheet writes SQRT and ^ as the spreadsheet reads them.
const CRITERIA = ["max |M|", "min P", "max P/1000 + M/200", "max |V|", "max sqrt(V^2 + M^2)"];
// SDS given (asce7-16-strength has no default for it); E's two cases taken with the orthogonal share (a case map row).
const RULESET = ["--ruleset", "asce7-16-strength", "--param", "SDS=1.0", "--map", "map.csv"];

interface Factored {
  components: string[];
  rows: { label: string; combination: string; values: number[] }[];
}
interface Combos {
  factorsOn: string[];
  rows: { label: string; clause: string; factors: Record<string, number> }[];
}
interface Envelope {
  envelope: { result: string; max: { value: number; row: string }; min: { value: number; row: string } }[];
}
interface Governing {
  rows: { criteria: string[]; label: string; values: Record<string, number> }[];
}

type Value = string | number | null;

let dir: string;
let written: ExcelJS.Worksheet;
let recalculated: Saved;
let canary: Saved;
let factored: Factored;
let combos: Combos;
let envelope: Envelope;
let governing: Governing;

/** A saved workbook's first sheet, read by 1-based row and column. */
class Saved {
  constructor(private readonly cells: Map<string, SavedCell>) {}

  at(row: number, column: number): Value {
    return this.cells.get(`${letters(column)}${row}`)?.value ?? null;
  }

  /** The 1-based row whose column A reads `text`. */
  rowOf(text: string, from = 1): number {
    const last = Math.max(...[...this.cells.keys()].map((a) => Number(/\d+$/.exec(a)?.[0])));
    for (let r = from; r <= last; r++) if (this.at(r, 1) === text) return r;
    throw new Error(`no row reads "${text}"`);
  }

  /** The 1-based column whose header (in `row`) reads `text`, from column `from`. */
  columnOf(row: number, text: string, from = 4): number {
    for (let c = from; c < from + 200; c++) if (this.at(row, c) === text) return c;
    throw new Error(`no column of row ${row} reads "${text}"`);
  }
}

function letters(column: number): string {
  let n = column;
  let out = "";
  while (n > 0) {
    out = String.fromCharCode(65 + ((n - 1) % 26)) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}

function formulaOf(ws: ExcelJS.Worksheet, address: string): string | null {
  const v = ws.getCell(address).value;
  return v !== null && typeof v === "object" && "formula" in v ? String((v as { formula: string }).formula) : null;
}

async function json<T>(args: string[]): Promise<T> {
  const run = await loadwright([...args, "--format", "json"], { cwd: dir });
  expect(run.status, run.stderr).toBe(0);
  return JSON.parse(run.stdout) as T;
}

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-sheet-"));
  writeFileSync(join(dir, "reactions.csv"), CASES);
  writeFileSync(join(dir, "map.csv"), "E,orthogonal\n");
  const criteria = CRITERIA.flatMap((c) => ["--criterion", c]);
  const made = await loadwright(["sheet", "reactions.csv", ...RULESET, ...criteria, "--out", "review.xlsx"], { cwd: dir });
  expect(made.status, made.stderr).toBe(0);
  [factored, combos, envelope, governing] = await Promise.all([
    json<Factored>(["factored", "reactions.csv", ...RULESET]),
    json<Combos>(["combos", "--cases", "reactions.csv", ...RULESET]),
    json<Envelope>(["envelope", "reactions.csv", ...RULESET]),
    json<Governing>(["governing", "reactions.csv", ...RULESET, ...criteria]),
  ]);

  const book = new ExcelJS.Workbook();
  await book.xlsx.readFile(join(dir, "review.xlsx"));
  written = book.worksheets[0];

  // A second copy whose first factored value carries a wrong stored result: if Calc kept stored
  // results instead of recalculating, that cell would read 12345 after the round trip.
  const tampered = new ExcelJS.Workbook();
  await tampered.xlsx.readFile(join(dir, "review.xlsx"));
  const ws = tampered.worksheets[0];
  const layout = new Saved(await savedCells(join(dir, "review.xlsx")));
  const first = layout.rowOf("combination row") + 1;
  const cell = ws.getCell(first, layout.columnOf(first - 1, "P"));
  cell.value = { formula: formulaOf(ws, cell.address) as string, result: 12345 } as ExcelJS.CellFormulaValue;
  await tampered.xlsx.writeFile(join(dir, "tampered.xlsx"));

  const [out, tamperedOut] = await recalculatedByLibreOffice([join(dir, "review.xlsx"), join(dir, "tampered.xlsx")]);
  recalculated = new Saved(await savedCells(out));
  canary = new Saved(await savedCells(tamperedOut));
}, 120_000);

describe("loadwright sheet, recalculated by LibreOffice Calc", () => {
  test("stores formulas without results, so every number shown is the spreadsheet program's own", () => {
    let formulas = 0;
    written.eachRow((row) =>
      row.eachCell((cell) => {
        const v = cell.value;
        if (v !== null && typeof v === "object" && "formula" in v) {
          formulas++;
          expect((v as { result?: unknown }).result, cell.address).toBeUndefined();
        }
      }),
    );
    // 3 results × every row, 4 criteria × every row, 3 × 5 envelope cells … at least the factored values.
    expect(formulas).toBeGreaterThan(3 * factored.rows.length);
  });

  test("recalculates on loading even where the file stores a wrong result", () => {
    const first = canary.rowOf("combination row") + 1;
    const p = canary.at(first, canary.columnOf(first - 1, "P"));
    expect(p).not.toBe(12345);
    expect(close(p as number, factored.rows[0].values[0])).toBe(true);
  });

  test("heads the sheet with the ruleset stamp, its status and the cautions as text", () => {
    const head = Array.from({ length: 12 }, (_, i) => String(recalculated.at(i + 1, 1) ?? "")).join("\n");
    expect(head).toContain("UNVERIFIED");
    expect(head).toMatch(/asce7-16-strength 1\.0\.0/);
    expect(head).toMatch(/fingerprint [0-9a-f]{12}/);
    expect(head).toContain("qualified, licensed engineer");
    expect(head).toContain("SDS = 1 (given)");
    // F, R and H have no case here: the sheet says so, as every output does.
    expect(head).toMatch(/no case of F, R, H in the case table/);
  });

  test("holds the factor table to the engine's combination list, row by row and case by case", () => {
    const header = recalculated.rowOf("combination row");
    expect(combos.rows.length).toBe(factored.rows.length);
    combos.rows.forEach((row, i) => {
      const r = header + 1 + i;
      expect(recalculated.at(r, 1)).toBe(row.label);
      expect(recalculated.at(r, 3)).toBe(row.clause);
      combos.factorsOn.forEach((name, k) => {
        expect(recalculated.at(header, 4 + k)).toBe(name);
        expect(Number(recalculated.at(r, 4 + k)), `${row.label} on ${name}`).toBeCloseTo(row.factors[name], 12);
      });
    });
  });

  test("recomputes every factored value of every row as the engine does", () => {
    const header = recalculated.rowOf("combination row");
    const columns = factored.components.map((c) => recalculated.columnOf(header, c, 4 + combos.factorsOn.length));
    expect(factored.rows.length).toBeGreaterThan(100);
    factored.rows.forEach((row, i) => {
      const r = header + 1 + i;
      expect(recalculated.at(r, 1)).toBe(row.label);
      row.values.forEach((v, c) => {
        const got = recalculated.at(r, columns[c]);
        expect(typeof got, `${row.label} ${factored.components[c]}`).toBe("number");
        expect(close(got as number, v), `${row.label} ${factored.components[c]}: ${got} vs ${v}`).toBe(true);
      });
    });
  });

  /** The engine's value of a row named by label, for ties: two rows of equal value may both be named. */
  const valueOf = (label: string, component: string) => {
    const row = factored.rows.find((r) => r.label === label);
    if (!row) throw new Error(`the sheet names a row the engine does not list: ${label}`);
    return row.values[factored.components.indexOf(component)];
  };

  test("finds the engine's envelope with MAX, MIN, INDEX and MATCH", () => {
    const header = recalculated.rowOf("result", recalculated.rowOf("Envelope: per result, the largest and smallest factored value over every combination row"));
    envelope.envelope.forEach((e, i) => {
      const r = header + 1 + i;
      expect(recalculated.at(r, 1)).toBe(e.result);
      const [max, maxRow, min, minRow] = [2, 3, 4, 5].map((c) => recalculated.at(r, c));
      expect(close(max as number, e.max.value), `max ${e.result}`).toBe(true);
      expect(close(min as number, e.min.value), `min ${e.result}`).toBe(true);
      // The row named is the engine's, or one of equal value listed before it.
      if (maxRow !== e.max.row) expect(close(valueOf(String(maxRow), e.result), e.max.value)).toBe(true);
      if (minRow !== e.min.row) expect(close(valueOf(String(minRow), e.result), e.min.value)).toBe(true);
    });
    // The rows with reversed wind and with the orthogonal seismic share are among those named.
    const named = envelope.envelope.flatMap((e) => [e.max.row, e.min.row]).join("\n");
    expect(named).toMatch(/0\.39E:y/);
  });

  test("selects the engine's governing row for each criterion, with every concurrent value", () => {
    const header = recalculated.rowOf("criterion");
    CRITERIA.forEach((criterion, g) => {
      const r = header + 1 + g;
      expect(recalculated.at(r, 1)).toBe(criterion);
      const engine = governing.rows.find((row) => row.criteria.includes(criterion));
      expect(engine, criterion).toBeDefined();
      const label = String(recalculated.at(r, 3));
      factored.components.forEach((component, c) => {
        const got = recalculated.at(r, 4 + c) as number;
        const expected = label === engine?.label ? (engine.values[component] as number) : valueOf(label, component);
        expect(close(got, expected), `${criterion}: ${component}`).toBe(true);
      });
      if (label !== engine?.label) {
        // A tie: the row the sheet names must give the criterion the same value as the engine's row.
        const value = recalculated.at(r, 2) as number;
        const m = engine?.values.M ?? NaN;
        if (criterion === "max |M|") expect(close(value, Math.abs(m))).toBe(true);
      }
    });
  });
});

describe("loadwright sheet refuses", () => {
  test("an output that is not an .xlsx workbook, naming the option", async () => {
    const run = await loadwright(["sheet", "reactions.csv", ...RULESET, "--out", "review.csv"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toContain('--out: "review.csv" does not end in .xlsx');
  });

  test("a listing beyond the row limit, with how to raise it", async () => {
    const run = await loadwright(["sheet", "reactions.csv", ...RULESET, "--row-limit", "50", "--out", "big.xlsx"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/reactions\.csv: the ruleset expands to [\d,]+ concrete rows for this case table, more than the limit of 50/);
    expect(run.stderr).toContain("--row-limit N");
  });

  test("a criterion naming no component, at its character", async () => {
    const run = await loadwright(["sheet", "reactions.csv", ...RULESET, "--criterion", "max Q", "--out", "q.xlsx"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/--criterion "max Q", character 5: "Q" is not a component/);
  });

  test("an output format, which a workbook does not have", async () => {
    const run = await loadwright(["sheet", "reactions.csv", ...RULESET, "--format", "json", "--out", "f.xlsx"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toContain("--format: the sheet command writes a workbook");
  });
});
