/**
 * The Sheet view inside Excel, against a stand-in for Office and Excel.run
 * that records what the add-in reads, writes and asks (excelStandIn.ts): the
 * envelope previewed on the selection, the problems of a range that is not a
 * case table, the starter formulas inserted (and then typed into the recorded
 * sheet and evaluated by the formula layer), the confirmation before writing
 * over anything, the reviewer's copy in a new worksheet, the refusal above
 * the row limit with the command line's message, and the recalculation after
 * a ruleset is stored. The tests run in order on one page.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { comboRows, envelope, loadRuleset, planForTable, readCaseTable, shortCautions, type Cell, type RulesetFile } from "../../src/core/index.js";
import { STORE_FORMAT, STORE_KEY } from "../../src/workbook/rulesetStore.js";
import { loadwright } from "../cli/harness.js";
import { STRENGTH_FIXTURE } from "../functions/fixtures.js";
import { rulesetFile } from "../support/rulesetFile.js";
import { openExcelPane, type ExcelPane } from "./excelPane.js";
import type { StandInRecord } from "./excelStandIn.js";
import { screenshot } from "./pane.js";
import { evaluateCell, type Sheets } from "./sheetFormulas.js";

/**
 * A combination whose rows multiply past the row limit: one case of each of
 * X, Y and Z taken in turn (transient symbols act one case at a time, and "!"
 * keeps each term), 60 × 60 × 60 = 216,000 rows. Invented for the test.
 */
const MANY_ROWS: RulesetFile = rulesetFile({
  id: "test-many-rows",
  symbols: {
    X: { description: "invented load", permanence: "transient" },
    Y: { description: "invented load", permanence: "transient" },
    Z: { description: "invented load", permanence: "transient" },
  },
  combinations: [{ id: "1", expression: "1.0X! + 1.0Y! + 1.0Z!", clause: "invented for the test" }],
});
const MANY_CASES = ["X", "Y", "Z"].flatMap((s) => Array.from({ length: 60 }, (_, i) => `${s}:${i + 1}`));

/** A draft being edited: ASCE/SEI 7-16 §2.3.1 (2) alone, with L kept ("!") [confirmed, steel design examples' load case]. */
const DRAFT: RulesetFile = rulesetFile({
  id: "firm-column",
  title: "Firm draft: one strength combination",
  symbols: { D: { description: "dead load", permanence: "permanent" }, L: { description: "live load", permanence: "transient" } },
  combinations: [{ id: "2", expression: "1.2D + 1.6L!", clause: "ASCE/SEI 7-16 §2.3.1 (2)" }],
});

const letters = (column: number) => {
  let n = column + 1;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
};
const a1 = (row: number, column: number) => `${letters(column)}${row + 1}`;
/** "F12" → 0-based row and column. */
const position = (address: string) => {
  const m = /^\$?([A-Z]+)\$?(\d+)$/.exec(address) as RegExpExecArray;
  return { row: Number(m[2]) - 1, column: [...m[1]].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0) - 1 };
};

// The column of the steel design examples: PD = 140 kips, PL = 420 kips [confirmed, steel design examples,
// as test/core/handChecks.test.ts cites them].
const COLUMN_TABLE: Cell[][] = [
  ["", "P"],
  ["D", 140],
  ["L", 420],
];
const manyCells: Record<string, string | number> = {};
MANY_CASES.forEach((h, i) => {
  manyCells[a1(0, i + 1)] = h;
  manyCells[a1(1, i + 1)] = 1;
});
manyCells.A1 = "result";
manyCells.A2 = "C1";
const MANY_ADDRESS = `Many!A1:${a1(1, MANY_CASES.length)}`;

let pane: ExcelPane;
const page = () => pane.page;

beforeAll(async () => {
  pane = await openExcelPane(
    {
      sheets: {
        Loads: {
          B1: "P",
          A2: "D",
          B2: 140,
          A3: "L",
          B3: 420,
          // Not case tables (invented): a header that names no load symbol; a value that is text.
          B10: "P",
          C10: "V",
          A11: "D",
          B11: 3,
          C11: 2,
          A12: "Q",
          B12: 5,
          C12: 1,
          B20: "P",
          A21: "D",
          B21: "'abc",
          A22: "L",
          B22: 5,
          // A dead load near the largest double (invented): 1.4 × 1.5e308 = 2.1e308 has no finite value.
          B30: "P",
          A31: "D",
          B31: 1.5e308,
          A32: "L",
          B32: 0,
        },
        Calc: {},
        Review: { C5: "keep me" },
        Many: manyCells,
      },
      active: "Loads",
      selection: "Loads!A1:B3",
      names: { Reactions: "Loads!A1:B3" },
      settings: { [STORE_KEY]: JSON.stringify({ format: STORE_FORMAT, rulesets: [STRENGTH_FIXTURE, MANY_ROWS] }) },
    },
    {
      "loadwright.drafts": JSON.stringify({
        format: "loadwright-drafts/1",
        drafts: [{ key: "draft-column", text: JSON.stringify(DRAFT, null, 2), base: { kind: "new", id: null, fingerprint: null, approval: DRAFT.approval }, opened: "2026-01-05T10:00:00Z", changed: "2026-01-05T10:00:00Z" }],
      }),
    },
  );
});

afterAll(async () => {
  await pane?.close();
});

async function showSheet(): Promise<void> {
  await page().locator("#lw-tab-sheet").click();
  await page().waitForSelector('#lw-view[data-view="sheet"]');
}

async function settled(outlet: string): Promise<string> {
  await page().waitForSelector(`#${outlet}:not([data-state="working"])[data-state]`);
  return (await page().locator(`#${outlet}`).getAttribute("data-state")) ?? "";
}

function engineEnvelope(file: RulesetFile, table: Cell[][]) {
  const ruleset = loadRuleset(file);
  if (!ruleset.ok) throw new Error("the fixture does not load");
  const cases = readCaseTable(table, ruleset.value);
  if (!cases.ok) throw new Error("the table does not read");
  const plan = planForTable(ruleset.value, {}, cases.value);
  if (!plan.ok) throw new Error("no plan");
  const entries = envelope(plan.value, cases.value);
  if (!entries.ok) throw new Error("no envelope");
  return { entries: entries.value, plan: plan.value, table: cases.value };
}

const callIndex = (record: StandInRecord, pattern: RegExp, from = 0) => record.calls.findIndex((c, i) => i >= from && pattern.test(c));

describe("the envelope preview", () => {
  test("reads the selected range and shows its envelope: 840 under 1.2D + 1.6L for PD = 140, PL = 420", async () => {
    await showSheet();
    await page().locator("#lw-sheet-ruleset").selectOption("entry:test-strength");
    await page().locator("#lw-sheet-use-selection").click();
    expect(await settled("lw-sheet-preview-result")).toBe("done");
    expect(await page().locator("#lw-sheet-cases").inputValue()).toBe("Loads!A1:B3");
    const row = page().locator('#lw-sheet-envelope tr[data-component="P"]');
    // [confirmed, steel design examples]: 1.2 × 140 + 1.6 × 420 = 168 + 672 = 840 kips, ASCE/SEI 7-16 §2.3.1 (2).
    expect(Number(await row.locator("td[data-max]").getAttribute("data-max"))).toBeCloseTo(840, 9);
    expect((await row.locator("td").nth(1).textContent())?.startsWith("2: 1.2D + 1.6L")).toBe(true);
    // 1.2 × 140 = 168 with L left out, where a transient load may be absent (docs/design.md, "Concrete rows"):
    // less than 1.4 × 140 = 196 under §2.3.1 (1).
    expect(Number(await row.locator("td[data-min]").getAttribute("data-min"))).toBeCloseTo(168, 9);
    expect(await page().locator("#lw-sheet-stamp").textContent()).toMatch(/^Checked · not approved · test-strength /);
    // The selection was asked for, loaded and synced before any value was read.
    const record = await pane.record();
    const asked = callIndex(record, /^getSelectedRange$/);
    const loaded = callIndex(record, /^load Range values,formulas$/, asked);
    expect(asked).toBeGreaterThanOrEqual(0);
    expect(loaded).toBeGreaterThan(asked);
    expect(callIndex(record, /^sync$/, loaded)).toBeGreaterThan(loaded);
    await screenshot(page(), "sheet-preview");
  });

  test("names the cells of a range that is not a case table, and what is wrong with each", async () => {
    const problems = async (range: string) => {
      await page().locator("#lw-sheet-cases").fill(range);
      await page().locator("#lw-sheet-preview").click();
      expect(await settled("lw-sheet-preview-result")).toBe("problem");
      const lines = await page().locator("#lw-sheet-preview-result li").allTextContents();
      expect(lines.every((l) => l.startsWith(`${range} is not a case table for test-strength: `)), lines.join("\n")).toBe(true);
      return lines;
    };
    // Loads!A12 holds "Q", which names no load symbol of the ruleset.
    expect((await problems("Loads!A10:C12")).some((l) => /: Loads!A12\b.*"Q"/.test(l))).toBe(true);
    // Loads!B21 holds the text "abc" where a number belongs, under the header P of the case D.
    expect((await problems("Loads!A20:B22")).some((l) => /: Loads!B21\b.*"abc".*not a number/.test(l))).toBe(true);
  });

  test("names the result and the row whose factored sum passes the largest number, and shows no number", async () => {
    await page().locator("#lw-sheet-cases").fill("Loads!A30:B32");
    await page().locator("#lw-sheet-preview").click();
    await settled("lw-sheet-preview-result");
    // The largest double is about 1.7976931348623157 × 10^308 (IEEE 754 binary64; ECMA-262 Number.MAX_VALUE):
    // ASCE/SEI 7-16 §2.3.1 (1), 1.4D, is the first row to pass it.
    expect(await page().locator("#lw-sheet-preview-result p.problem").allTextContents()).toEqual([
      'Loads!A30:B32: Loads!B30: "P" has no finite value in row "1: 1.4D": the factored sum passes the largest number Loadwright can hold (about ±1.8 × 10^308); check the case values',
    ]);
    expect(await page().locator("#lw-sheet-envelope").count()).toBe(0);
  });

  test("previews a draft being edited, before it is stored", async () => {
    await page().locator("#lw-sheet-cases").fill("");
    await page().locator("#lw-sheet-ruleset").selectOption("draft:draft-column");
    await page().locator("#lw-sheet-preview").click();
    expect(await settled("lw-sheet-preview-result")).toBe("done");
    expect(await page().locator("#lw-sheet-stamp").textContent()).toContain("draft firm-column");
    // [confirmed, steel design examples]: 1.2 × 140 + 1.6 × 420 = 840; the only combination, L kept ("!"), so also the minimum.
    const row = page().locator('#lw-sheet-envelope tr[data-component="P"]');
    expect(Number(await row.locator("td[data-max]").getAttribute("data-max"))).toBeCloseTo(840, 9);
    expect(Number(await row.locator("td[data-min]").getAttribute("data-min"))).toBeCloseTo(840, 9);
  });

  test("will not insert formulas naming a draft", async () => {
    const before = (await pane.record()).writes.length;
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("problem");
    expect(await page().locator("#lw-sheet-insert-result").textContent()).toContain("Formulas name a stored or shipped ruleset, not a draft");
    expect((await pane.record()).writes.length).toBe(before);
  });
});

describe("inserting the starter formulas", () => {
  let sheets: Sheets;
  let settings: Record<string, string>;
  /** Address → formula of every LW.* cell written on Calc. */
  let formulas: Record<string, string>;

  test("reads the whole block first, then writes it when it is empty, with no confirmation", async () => {
    await page().locator("#lw-sheet-ruleset").selectOption("entry:test-strength");
    await page().locator("#lw-sheet-cases").fill("Loads!A1:B3");
    await page().locator("#lw-sheet-criteria").fill("max P\nmin P");
    await page().locator("#lw-sheet-at").fill("Calc!A1");
    const before = await pane.record();
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("done");
    const record = await pane.record();
    const firstWrite = callIndex(record, /^formulas Calc!/, before.calls.length);
    const blockRead = callIndex(record, /^getRange Calc!A1:[A-Z]+\d+$/, before.calls.length);
    expect(blockRead).toBeGreaterThan(0);
    expect(callIndex(record, /^load Range values,formulas$/, blockRead)).toBeLessThan(firstWrite);
    expect(record.clears.filter((c) => c.sheet === "Calc").map((c) => c.applyTo)).toEqual(["Contents"]);
    sheets = await pane.sheets();
    settings = await pane.settings();
    formulas = Object.fromEntries(Object.entries(sheets.Calc).filter(([, c]) => c.formula.startsWith("=LW.")).map(([a, c]) => [a, c.formula]));
    expect(Object.values(formulas).map((f) => /^=(LW\.[A-Z]+)\(/.exec(f)?.[1]).sort()).toEqual(["LW.COMBOS", "LW.ENVELOPE", "LW.GOVERNING", "LW.RULESET"]);
    await screenshot(page(), "sheet-inserted");
  });

  test("gives every formula the block's cells and the case table's range, never a typed value", () => {
    const text = (address: string) => sheets.Calc[address.replace(/\$/g, "")]?.value;
    for (const formula of Object.values(formulas)) {
      const { name, args } = evaluateCell(formula, "Calc", sheets, settings);
      for (const arg of args) expect(arg, `${name}: ${arg}`).toMatch(/^(Loads!)?\$[A-Z]+\$\d+(:\$[A-Z]+\$\d+)?$/);
      const rulesetArg = name === "LW.RULESET" || name === "LW.COMBOS" ? args[0] : args[1];
      expect(text(rulesetArg), `${name}'s ruleset`).toBe("test-strength");
      if (name !== "LW.RULESET") {
        const casesArg = name === "LW.COMBOS" ? args[2] : args[0];
        expect(casesArg, `${name}'s cases`).toBe("Loads!$A$1:$B$3");
        const paramsArg = name === "LW.COMBOS" ? args[1] : name === "LW.GOVERNING" ? args[3] : args[2];
        // The parameter block: under a "parameter" header, two columns (test-strength has no parameters: one blank row to fill).
        const [first] = paramsArg.split(":");
        const { row, column } = position(first);
        expect(text(a1(row - 1, column)), `${name}'s params header`).toBe("parameter");
      }
      if (name === "LW.GOVERNING") {
        const [from, to] = args[2].split(":").map(position);
        const criteria = Array.from({ length: to.row - from.row + 1 }, (_, i) => text(a1(from.row + i, from.column)));
        expect(criteria).toEqual(["max P", "min P"]);
      }
    }
  });

  test("gives, typed into the sheet, what the engine gives: the envelope 840 / 168, the governing rows, every combination row", () => {
    const engine = engineEnvelope(STRENGTH_FIXTURE, COLUMN_TABLE);
    const results = Object.fromEntries(Object.values(formulas).map((f) => {
      const e = evaluateCell(f, "Calc", sheets, settings);
      return [e.name, e.result];
    }));
    const env = results["LW.ENVELOPE"];
    expect(env[1]).toEqual(["component", "max", "row giving max", "min", "row giving min"]);
    const p = env.find((r) => r[0] === "P") as (string | number)[];
    expect(p).toEqual([engine.entries[0].result, engine.entries[0].max.value, engine.entries[0].max.label, engine.entries[0].min.value, engine.entries[0].min.label]);
    // [confirmed, steel design examples]: 840 kips under 1.2D + 1.6L; 168 = 1.2 × 140 with L left out.
    expect(p[1] as number).toBeCloseTo(840, 9);
    expect(p[3] as number).toBeCloseTo(168, 9);
    const gov = results["LW.GOVERNING"];
    expect(gov.find((r) => r[0] === "max P")?.[1] as number).toBeCloseTo(840, 9);
    expect(gov.find((r) => r[0] === "min P")?.[1] as number).toBeCloseTo(168, 9);
    const rows = comboRows(engine.plan);
    if (!rows.ok) throw new Error("no rows");
    const combos = results["LW.COMBOS"];
    expect(combos.slice(2).filter((r) => !String(r[0]).startsWith("note: ")).map((r) => r[0])).toEqual(rows.value.map((r) => r.label));
    expect(results["LW.RULESET"].find((r) => r[0] === "id")?.[1]).toBe("test-strength");
  });

  test("leaves each formula room for all it spills: no spill covers another written cell or another spill", () => {
    const written = Object.entries(sheets.Calc).map(([address]) => position(address));
    const spills = Object.entries(formulas).map(([address, formula]) => {
      const { result } = evaluateCell(formula, "Calc", sheets, settings);
      const at = position(address);
      return { address, top: at.row, left: at.column, rows: result.length, columns: result[0].length };
    });
    for (const s of spills) {
      const inside = (p: { row: number; column: number }) => p.row >= s.top && p.row < s.top + s.rows && p.column >= s.left && p.column < s.left + s.columns;
      expect(written.filter(inside).map((p) => a1(p.row, p.column)), `${s.address}'s spill`).toEqual([s.address]);
      for (const o of spills) {
        if (o === s) continue;
        const apart = o.left >= s.left + s.columns || s.left >= o.left + o.columns || o.top >= s.top + s.rows || s.top >= o.top + o.rows;
        expect(apart, `${s.address} and ${o.address}`).toBe(true);
      }
    }
  });

  test("uses the name a case table was given", async () => {
    await page().locator("#lw-sheet-cases").fill("Reactions");
    await page().locator("#lw-sheet-at").fill("Calc!A60");
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("done");
    const now = await pane.sheets();
    const envelopeCell = Object.entries(now.Calc).find(([a, c]) => position(a).row >= 59 && c.formula.startsWith("=LW.ENVELOPE("));
    expect(envelopeCell?.[1].formula).toMatch(/^=LW\.ENVELOPE\(Reactions,\$B\$61,/);
    const { result } = evaluateCell(envelopeCell?.[1].formula ?? "", "Calc", now, settings, { Reactions: "Loads!$A$1:$B$3" });
    // [confirmed, steel design examples]: 840.
    expect(result.find((r) => r[0] === "P")?.[1] as number).toBeCloseTo(840, 9);
  });

  test("says where the cell to write at is no cell, or on no worksheet, and writes nothing", async () => {
    await page().locator("#lw-sheet-cases").fill("Loads!A1:B3");
    const before = (await pane.record()).writes.length;
    for (const [at, said] of [
      ["the top", 'Write at: "the top" is not a cell such as F1 or Calc!B2.'],
      ["Nowhere!A1", 'there is no worksheet named "Nowhere" in this workbook'],
    ]) {
      await page().locator("#lw-sheet-at").fill(at);
      await page().locator("#lw-sheet-insert").click();
      expect(await settled("lw-sheet-insert-result")).toBe("problem");
      expect(await page().locator("#lw-sheet-insert-result li").allTextContents()).toEqual([said]);
    }
    expect((await pane.record()).writes.length).toBe(before);
  });
});

describe("writing over cells", () => {
  test("asks first, naming the range and the cells that hold something; declining writes nothing", async () => {
    await page().locator("#lw-sheet-cases").fill("Loads!A1:B3");
    await page().locator("#lw-sheet-at").fill("Review!A1");
    const before = await pane.record();
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("confirm");
    const question = (await page().locator("#lw-sheet-confirm-text").textContent()) ?? "";
    expect(question).toMatch(/^Review!A1:[A-Z]+\d+ is not empty: 1 cell holds something \(C5\)\./);
    const range = /^(Review!A1:[A-Z]+\d+)/.exec(question)?.[1];
    expect(await page().locator("#lw-sheet-confirm-write").textContent()).toBe(`Write over ${range}`);
    let record = await pane.record();
    expect(record.writes.length).toBe(before.writes.length);
    expect(record.clears.length).toBe(before.clears.length);
    await page().locator("#lw-sheet-confirm-cancel").click();
    expect(await settled("lw-sheet-insert-result")).toBe("declined");
    record = await pane.record();
    expect(record.writes.length).toBe(before.writes.length);
    expect((await pane.sheets()).Review).toEqual({ C5: { value: "keep me", formula: "" } });
  });

  test("writes over them once confirmed, clearing the whole range first", async () => {
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("confirm");
    const range = (await page().locator("#lw-sheet-confirm-write").textContent())?.replace(/^Write over /, "");
    const before = await pane.record();
    await page().locator("#lw-sheet-confirm-write").click();
    expect(await settled("lw-sheet-insert-result")).toBe("done");
    const record = await pane.record();
    const clear = callIndex(record, /^clear Review!/, before.calls.length);
    expect(record.calls[clear]).toBe(`clear ${range} Contents`);
    expect(callIndex(record, /^formulas Review!/, before.calls.length)).toBeGreaterThan(clear);
    expect((await pane.sheets()).Review.C5).toBeUndefined();
  });
});

describe("the reviewer's copy", () => {
  test("is written into a new worksheet, under the stamp and the cautions, with factors and SUMPRODUCT formulas", async () => {
    await page().locator("#lw-sheet-copy").click();
    expect(await settled("lw-sheet-copy-result")).toBe("done");
    const record = await pane.record();
    expect(record.calls).toContain("worksheets.add Reviewer copy");
    const copy = (await pane.sheets())["Reviewer copy"];
    expect(String(copy.A2.value)).toMatch(/^Checked · not approved · test-strength /);
    const lines = Object.entries(copy).filter(([a]) => /^A\d+$/.test(a)).map(([, c]) => String(c.value));
    for (const caution of shortCautions()) expect(lines).toContain(`Caution: ${caution}`);
    // The row "2: 1.2D + 1.6L": its factored value is a SUMPRODUCT of its factors and the case values, 840 by hand.
    const [labelAddress] = Object.entries(copy).find(([a, c]) => /^A\d+$/.test(a) && c.value === "2: 1.2D + 1.6L") ?? [""];
    const row = position(labelAddress).row;
    const formula = Object.entries(copy).find(([a, c]) => position(a).row === row && c.formula.startsWith("=SUMPRODUCT("))?.[1].formula ?? "";
    const m = /^=SUMPRODUCT\(\$([A-Z]+)(\d+):\$([A-Z]+)(\d+),\$([A-Z]+)\$(\d+):\$([A-Z]+)\$(\d+)\)$/.exec(formula);
    expect(m, formula).not.toBeNull();
    const [, f1, fr, f2, , c1, cr] = m as RegExpExecArray;
    const width = position(`${f2}1`).column - position(`${f1}1`).column + 1;
    const factors = Array.from({ length: width }, (_, i) => copy[a1(Number(fr) - 1, position(`${f1}1`).column + i)]?.value as number);
    const values = Array.from({ length: width }, (_, i) => copy[a1(Number(cr) - 1, position(`${c1}1`).column + i)]?.value as number);
    // ASCE/SEI 7-16 §2.3.1 (2): 1.2 on D and 1.6 on L [confirmed]; PD = 140, PL = 420 [confirmed, steel design examples].
    expect(factors).toEqual([1.2, 1.6]);
    expect(values).toEqual([140, 420]);
    expect(factors.reduce((s, f, i) => s + f * values[i], 0)).toBeCloseTo(840, 9);
    expect(await page().locator("#lw-notice").textContent()).toContain('to the new worksheet "Reviewer copy"');
  });

  test("is refused above the row limit with the message the command line gives", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "loadwright-many-"));
    try {
      writeFileSync(path.join(dir, "many.csv"), `result,${MANY_CASES.join(",")}\nC1,${MANY_CASES.map(() => 1).join(",")}\n`);
      writeFileSync(path.join(dir, "many.json"), JSON.stringify(MANY_ROWS));
      const cli = await loadwright(["sheet", "many.csv", "--ruleset", "many.json", "--out", "many.xlsx"], { cwd: dir });
      expect(cli.status).not.toBe(0);
      const sentence = /many\.csv: (.*) \(raise the limit with --row-limit N\)/.exec(cli.stderr)?.[1];
      expect(sentence, cli.stderr).toMatch(/216,000 concrete rows/);
      await page().locator("#lw-sheet-ruleset").selectOption("entry:test-many-rows");
      await page().locator("#lw-sheet-cases").fill(MANY_ADDRESS);
      await page().locator("#lw-sheet-criteria").fill("");
      const sheetsBefore = Object.keys(await pane.sheets());
      await page().locator("#lw-sheet-copy").click();
      expect(await settled("lw-sheet-copy-result")).toBe("problem");
      expect(await page().locator("#lw-sheet-copy-result .problem").textContent()).toBe(`${MANY_ADDRESS}: ${sentence}`);
      expect(Object.keys(await pane.sheets())).toEqual(sheetsBefore);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe("after a ruleset is stored", () => {
  test("asks Excel for a full recalculation once the settings are saved, and says so", async () => {
    await page().locator("#lw-tab-library").click();
    await page().locator('#lw-rulesets li[data-ruleset-id="test-strength"] button.ruleset').click();
    await page().locator("#lw-tab-approve").click();
    await page().waitForSelector('#lw-view[data-view="approve"]');
    await page().locator("#lw-approver").fill("A. Checker");
    const before = await pane.record();
    await page().locator("#lw-approve-button").click();
    await page().waitForSelector('#lw-approve-status [data-approval="approved"]');
    const record = await pane.record();
    const saved = callIndex(record, /^settings\.saveAsync$/, before.calls.length);
    const calculated = callIndex(record, /^calculate Full$/, before.calls.length);
    expect(saved).toBeGreaterThan(0);
    expect(calculated).toBeGreaterThan(saved);
    expect(callIndex(record, /^sync$/, calculated)).toBeGreaterThan(calculated);
    expect(record.calculations.slice(before.calculations.length)).toEqual(["Full"]);
    expect(await page().locator("#lw-notice").textContent()).toContain("Excel recalculated the workbook: formulas naming test-strength now use what is stored.");
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
