/**
 * `loadwright report`: the calculation report, written by the real command
 * line and read back by headless Chromium — its DOM is the HTML parser here.
 * Every number in it is held to the engine's JSON output for the same input
 * (envelope, governing, factored, explain), every derivation is summed by the
 * test and held to its governing value, names read from files are shown as
 * text and never run, and the PDF is printed and its pages counted.
 * Screenshots of the page go to build/report-screenshots/ (not committed):
 * look at them after changing the layout.
 *
 * Hand check: shared/REFERENCES.md "Hand checks" [confirmed, steel design
 * examples]: PD = 140, PL = 420 gives 1.2·140 + 1.6·420 = 840 under ASCE/SEI
 * 7-16 §2.3.1 (2) (the fixture's ruleset, from memory: see fixtures/README.md).
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { openBrowser, type Browser } from "../addin/chromium.js";
import { rulesetFile } from "../support/rulesetFile.js";
import { FIXTURES, loadwright, ROOT } from "./harness.js";

const DEMO = join(ROOT, "demo/workshop-base-reactions.csv");
/** The demo's invented parameters and criteria (docs/demo.md). */
const DEMO_ARGS = ["--ruleset", "asce7-16-strength", "--param", "SDS=0.5", "--param", "rho=1.3"];
const DEMO_CRITERIA = ["max [A2 Fz]", "min [A1 Fz]", "max |[A1 Fy]|", "max |[B2 Fx]|"];
const SHOTS = join(ROOT, "build/report-screenshots");
const DIGITS = 4;
const HOSTILE = ['<script>alert("id")</script>', '"><img src=x onerror=alert(1)>', "A&amp;B </style><b>bold</b>"];

let dir: string;
let browser: Browser;

interface NumberCell {
  text: string;
  value: string;
  field: string | null;
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "loadwright-report-"));
  mkdirSync(SHOTS, { recursive: true });
  browser = await openBrowser();
});

afterAll(async () => {
  await browser?.close();
});

async function json(args: string[]): Promise<Record<string, unknown>> {
  const run = await loadwright([...args, "--format", "json"], { cwd: dir });
  expect(run.status).toBe(0);
  return JSON.parse(run.stdout) as Record<string, unknown>;
}

async function writeReport(args: string[]): Promise<string> {
  const run = await loadwright(["report", ...args], { cwd: dir });
  expect(run.stderr).toBe("");
  expect(run.status).toBe(0);
  return run.stdout;
}

async function open(html: string) {
  const { page } = browser;
  await page.setViewportSize({ width: 900, height: 1200 });
  await page.goto(pathToFileURL(join(dir, html)).href);
  return page;
}

/** A computed number as shown: its value is the JSON value to four significant digits, and it shows four digits. */
function expectComputed(text: string, value: number): void {
  const shown = text.replace("\u2212", "-");
  expect(Number(shown)).toBe(Number(value.toPrecision(DIGITS)));
  if (value !== 0 && Math.abs(value) < 10 ** DIGITS) expect(shown.replace(/[-.]/g, "").replace(/^0+/, "")).toHaveLength(DIGITS);
}

describe("the demo's calculation report", () => {
  let stdout: string;
  beforeAll(async () => {
    stdout = await writeReport([DEMO, ...DEMO_ARGS, ...DEMO_CRITERIA.flatMap((c) => ["--criterion", c]), "--title", "Workshop column bases (invented)", "--by", "A. Engineer", "--date", "2026-03-02", "--out", "demo.html"]);
  });

  test("is one self-contained file: no script, no outside resource, nothing the page reports", async () => {
    expect(stdout).toMatch(/^Wrote demo\.html: the calculation report/m);
    const html = readFileSync(join(dir, "demo.html"), "utf8");
    expect(html).not.toMatch(/<script|<link|<iframe|@import|url\(/i);
    const page = await open("demo.html");
    const outside = await page.evaluate(() => [...document.querySelectorAll("[src], [href]")].map((e) => e.outerHTML.slice(0, 80)));
    expect(outside).toEqual([]);
    await page.screenshot({ path: join(SHOTS, "demo-first-page.png") });
    await page.screenshot({ path: join(SHOTS, "demo-full.png"), fullPage: true });
    expect(browser.console.filter((l) => !l.startsWith("log:"))).toEqual([]);
  });

  test("states the ruleset in the catalogue's words, the parameters in force and the cautions in full", async () => {
    const page = await open("demo.html");
    const text = await page.evaluate(() => ({
      status: document.querySelector('[data-field="status"]')?.textContent,
      fingerprint: document.querySelector('[data-field="fingerprint"]')?.textContent,
      coverage: document.querySelector('[data-field="coverage"]')?.textContent,
      memory: [...document.querySelectorAll("ul.memory li")].map((l) => l.textContent),
      cautions: [...document.querySelectorAll("ul.cautions li")].map((l) => l.textContent),
      parameters: [...document.querySelectorAll("tr[data-parameter]")].map((r) => [...r.querySelectorAll("td")].slice(0, 3).map((d) => d.textContent)),
    }));
    const body = await json(["envelope", DEMO, ...DEMO_ARGS]);
    const ruleset = body.ruleset as { fingerprint: string; summary: string };
    expect(text.fingerprint).toBe(ruleset.fingerprint);
    expect(text.status).toMatch(/^UNVERIFIED — /);
    expect(text.status).toContain("not approved");
    expect(text.coverage).toMatch(/^\d+ of \d+ combinations confirmed/);
    expect(text.memory.length).toBeGreaterThan(0);
    expect(text.cautions).toHaveLength(3);
    expect(text.cautions[0]).toMatch(/qualified, licensed engineer/);
    const parameters = (body.parameters as { name: string; value: number | string; given: boolean }[]).map((p) => [p.name, String(p.value), p.given ? "given" : "default"]);
    expect(text.parameters).toEqual(parameters);
  });

  test("every envelope value and row is the engine's", async () => {
    const page = await open("demo.html");
    const rows = await page.evaluate(() =>
      [...document.querySelectorAll("#envelope tbody tr")].map((tr) => ({
        result: tr.getAttribute("data-result"),
        cells: [...tr.querySelectorAll("td")].map((td) => ({ text: td.textContent ?? "", value: td.getAttribute("data-value") ?? "", field: td.getAttribute("data-field") })),
      })),
    );
    const body = (await json(["envelope", DEMO, ...DEMO_ARGS])).envelope as { result: string; max: { value: number; row: string }; min: { value: number; row: string } }[];
    expect(rows.map((r) => r.result)).toEqual(body.map((e) => e.result));
    rows.forEach((r, k) => {
      const e = body[k];
      const [, max, maxRow, min, minRow] = r.cells as NumberCell[];
      expect(Number(max.value)).toBe(e.max.value);
      expectComputed(max.text, e.max.value);
      expect(maxRow.text).toBe(e.max.row);
      expect(Number(min.value)).toBe(e.min.value);
      expectComputed(min.text, e.min.value);
      expect(minRow.text).toBe(e.min.row);
    });
  });

  test("every governing row and concurrent value is the engine's, and every derivation sums to its value", async () => {
    const page = await open("demo.html");
    const shown = await page.evaluate(() => ({
      labels: [...document.querySelectorAll("#governing tr[data-governing] td.label")].map((td) => td.textContent),
      concurrent: [...document.querySelectorAll("#governing tr[data-result]")].map((tr) => ({
        result: tr.getAttribute("data-result"),
        cells: [...tr.querySelectorAll("td.num")].map((td) => ({ text: td.textContent ?? "", value: td.getAttribute("data-value") ?? "" })),
      })),
      derivations: [...document.querySelectorAll(".derivation")].map((d) => ({
        governing: Number(d.getAttribute("data-governing")),
        component: d.getAttribute("data-component") ?? "",
        total: Number(d.getAttribute("data-total")),
        totalText: d.querySelector('[data-field="total"]')?.textContent ?? "",
        lines: [...d.querySelectorAll("tr[data-case]")].map((tr) => ({
          case: tr.getAttribute("data-case"),
          factor: Number(tr.querySelector('[data-field="factor"]')?.getAttribute("data-value")),
          factorText: tr.querySelector('[data-field="factor"]')?.textContent ?? "",
          caseValue: Number(tr.querySelector('[data-field="case-value"]')?.getAttribute("data-value")),
          product: Number(tr.querySelector('[data-field="product"]')?.getAttribute("data-value")),
        })),
      })),
    }));
    const body = (await json(["governing", DEMO, ...DEMO_ARGS, ...DEMO_CRITERIA.flatMap((c) => ["--criterion", c])])).rows as { criteria: string[]; label: string; values: Record<string, number> }[];
    expect(shown.labels).toEqual(body.map((g) => g.label));
    for (const r of shown.concurrent) {
      r.cells.forEach((cell, k) => {
        const value = body[k].values[r.result ?? ""];
        expect(Number(cell.value)).toBe(value);
        expectComputed(cell.text, value);
      });
    }
    // One derivation per result a criterion names: four criteria, four results.
    expect(shown.derivations.map((d) => d.component)).toEqual(["A2 Fz", "A1 Fz", "A1 Fy", "B2 Fx"]);
    for (const d of shown.derivations) {
      // The sum, redone here from the factors and case values the report shows.
      const sum = d.lines.reduce((s, l) => s + l.factor * l.caseValue, 0);
      expect(sum).toBeCloseTo(body[d.governing].values[d.component], 9);
      expect(d.total).toBe(body[d.governing].values[d.component]);
      expectComputed(d.totalText, d.total);
      for (const l of d.lines) expect(l.product).toBe(l.factor * l.caseValue);
      const explained = (await json(["explain", DEMO, ...DEMO_ARGS, "--row", body[d.governing].label, "--component", d.component])).explanation as {
        lines: { case: string; factor: number; caseValue: number }[];
        total: number;
      };
      expect(d.lines.map((l) => [l.case, l.factor, l.caseValue])).toEqual(explained.lines.map((l) => [l.case, l.factor, l.caseValue]));
      expect(d.total).toBe(explained.total);
    }
  });

  test("the combination list holds every row the engine lists, with its factors, and one chart per result with the extremes marked", async () => {
    const page = await open("demo.html");
    const shown = await page.evaluate(() => ({
      labels: [...document.querySelectorAll("#combinations tr[data-label]")].map((tr) => tr.getAttribute("data-label")),
      factors: [...document.querySelectorAll("#combinations tr[data-label]")].map((tr) => [...tr.querySelectorAll("td.num")].map((td) => Number(td.getAttribute("data-value")))),
      charts: [...document.querySelectorAll("#plots figure")].map((f) => ({
        result: f.getAttribute("data-result"),
        bars: f.querySelectorAll("rect.bar").length,
        max: f.querySelector("rect.bar.max title")?.textContent ?? "",
        min: f.querySelector("rect.bar.min title")?.textContent ?? "",
        ticks: [...f.querySelectorAll("text.tick")].map((t) => t.textContent),
      })),
    }));
    const listed = (await json(["factored", DEMO, ...DEMO_ARGS])) as { components: string[]; rows: { label: string; values: number[] }[] };
    expect(shown.labels).toEqual(listed.rows.map((r) => r.label));
    const combos = (await json(["combos", "--cases", DEMO, ...DEMO_ARGS])) as { factorsOn: string[]; rows: { label: string; factors: Record<string, number> }[] };
    expect(shown.factors).toEqual(combos.rows.map((r) => combos.factorsOn.map((c) => r.factors[c])));
    const envelope = (await json(["envelope", DEMO, ...DEMO_ARGS])).envelope as { result: string; max: { row: string }; min: { row: string } }[];
    expect(shown.charts.map((c) => c.result)).toEqual(listed.components);
    shown.charts.forEach((c, k) => {
      expect(c.bars).toBe(listed.rows.length);
      expect(c.max.startsWith(`${envelope[k].max.row}: `)).toBe(true);
      expect(c.min.startsWith(`${envelope[k].min.row}: `)).toBe(true);
      expect(c.ticks).toContain("0");
    });
  });

  test("prints to a PDF of several pages on A4, and on Letter", async () => {
    const out = await writeReport([DEMO, ...DEMO_ARGS, "--criterion", "max [A2 Fz]", "--out", "print.html", "--pdf"]);
    expect(out).toMatch(/^Wrote print\.pdf: the report printed by Chromium on A4/m);
    const pdf = readFileSync(join(dir, "print.pdf"));
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const pages = (text: Buffer) => (text.toString("latin1").match(/\/Type\s*\/Page\b/g) ?? []).length;
    expect(pages(pdf)).toBeGreaterThanOrEqual(8);
    // A4 is 210 × 297 mm = 595.3 × 841.9 pt; Letter 8.5 × 11 in = 612 × 792 pt (ISO 216; ANSI/ASME Y14.1) [memory].
    expect(pdf.toString("latin1")).toMatch(/\/MediaBox\s*\[\s*0 0 59[56](\.\d+)? 84[12](\.\d+)?\s*\]/);
    await writeReport([DEMO, ...DEMO_ARGS, "--out", "letter.html", "--pdf", "letter.pdf", "--paper", "letter"]);
    expect(readFileSync(join(dir, "letter.pdf")).toString("latin1")).toMatch(/\/MediaBox\s*\[\s*0 0 612 792\s*\]/);
    if (existsSync("/usr/bin/pdftoppm")) {
      execFileSync("/usr/bin/pdftoppm", ["-r", "60", "-png", "-f", "1", "-l", "1", join(dir, "print.pdf"), join(SHOTS, "pdf-page")]);
      expect(existsSync(join(SHOTS, "pdf-page-01.png")) || existsSync(join(SHOTS, "pdf-page-1.png"))).toBe(true);
    }
  });

  test("refuses --pdf when no Chromium is found, after writing the HTML", async () => {
    const run = await loadwright(["report", DEMO, ...DEMO_ARGS, "--out", "nochrome.html", "--pdf", "--chromium", join(dir, "no-chromium")], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toBe(`loadwright: error: --pdf: no Chromium at ${join(dir, "no-chromium")} (--chromium); the HTML report is written, the PDF is not\n`);
  });
});

describe("a reactions table", () => {
  test("takes the max and min of every component, and derives 840 = 1.2·140 + 1.6·420 as the largest P", async () => {
    await writeReport([join(FIXTURES, "reactions-rows.csv"), "--ruleset", join(FIXTURES, "strength-fixture.json"), "--out", "rows.html"]);
    const page = await open("rows.html");
    const derivation = await page.evaluate(() => {
      const d = [...document.querySelectorAll(".derivation")].find((x) => x.getAttribute("data-component") === "P" && x.querySelector("h3")?.textContent?.includes("2: 1.2D + 1.6L"));
      return d ? [...d.querySelectorAll("tr[data-case]")].map((tr) => [tr.getAttribute("data-case"), tr.querySelector('[data-field="factor"]')?.textContent, tr.querySelector('[data-field="case-value"]')?.textContent, tr.querySelector('[data-field="product"]')?.textContent]).concat([["total", "", "", d.querySelector('[data-field="total"]')?.textContent ?? ""]]) : null;
    });
    // ASCE/SEI 7-16 §2.3.1 (2): 1.2·140 = 168, 1.6·420 = 672, 840 in all (shared/REFERENCES.md "Hand checks" [confirmed]).
    expect(derivation).toEqual([
      ["D", "1.2", "140", "168.0"],
      ["L", "1.6", "420", "672.0"],
      ["total", "", "", "840.0"],
    ]);
    await page.screenshot({ path: join(SHOTS, "reactions-full.png"), fullPage: true });
  });
});

describe("names from files are text", () => {
  test("hostile result ids and ruleset texts are shown as written and never run", async () => {
    const rules = rulesetFile({
      title: `Rules ${HOSTILE[0]}`,
      symbols: { D: { description: HOSTILE[1], permanence: "permanent" }, L: { description: "live", permanence: "transient" } },
      parameters: {},
      combinations: [{ id: "1", expression: "1.2D + 1.6L", clause: HOSTILE[2] }],
    } as Parameters<typeof rulesetFile>[0]);
    writeFileSync(join(dir, "hostile.json"), JSON.stringify(rules));
    const csv = `result,D,L\n"${HOSTILE[0].replace(/"/g, '""')}",1,2\n"${HOSTILE[1].replace(/"/g, '""')}",3,4\n"${HOSTILE[2]}",5,6\n`;
    writeFileSync(join(dir, "hostile.csv"), csv);
    await writeReport(["hostile.csv", "--ruleset", "hostile.json", "--title", HOSTILE[1], "--by", HOSTILE[0], "--out", "hostile.html", "--criterion", `max [${HOSTILE[2]}]`]);
    const page = await open("hostile.html");
    const seen = await page.evaluate(() => ({
      scripts: document.querySelectorAll("script").length,
      images: document.querySelectorAll("img").length,
      bold: document.querySelectorAll("b").length,
      results: [...document.querySelectorAll("#envelope tr[data-result] td:first-child")].map((td) => td.textContent),
      title: document.querySelector("h1")?.textContent,
      styles: document.querySelectorAll("style").length,
      clause: document.querySelector("#combinations tr.group th")?.textContent,
      chartTitles: [...document.querySelectorAll("#plots figure h3")].map((h) => h.textContent),
    }));
    expect(seen).toEqual({
      scripts: 0,
      images: 0,
      bold: 0,
      results: HOSTILE,
      title: HOSTILE[1],
      styles: 1,
      // L is transient, so it may be left out: 1.2D + 1.6L and 1.2D (docs/rulesets.md, "How concrete rows are formed").
      clause: `Combination 1 (${HOSTILE[2]}): 1.2D + 1.6L — 2 rows`,
      chartTitles: HOSTILE,
    });
    expect(browser.console.filter((l) => l.startsWith("pageerror") || /alert/.test(l))).toEqual([]);
  });
});

describe("size limits are stated, never silent", () => {
  test("beyond the row limit the rows are counted per combination and the plots left out, saying so", async () => {
    const out = await writeReport([DEMO, ...DEMO_ARGS, "--row-limit", "50", "--out", "limited.html"]);
    expect(out).toMatch(/^Note: The combinations are listed with their row counts, not row by row: the ruleset forms \d+ concrete rows for this case table, more than the report's row limit of 50 \(--row-limit\)/m);
    const page = await open("limited.html");
    const seen = await page.evaluate(() => ({
      listed: document.querySelectorAll("#combinations tr[data-label]").length,
      counted: [...document.querySelectorAll("#combinations tr[data-combination] td.num")].map((td) => Number(td.getAttribute("data-value"))),
      listing: document.querySelector('[data-field="listing-summary"]')?.textContent ?? "",
      plots: document.querySelector('[data-field="plots-summary"]')?.textContent ?? "",
      charts: document.querySelectorAll("#plots svg").length,
      envelope: document.querySelectorAll("#envelope tbody tr").length,
    }));
    const combos = (await json(["combos", "--cases", DEMO, ...DEMO_ARGS])).rows as { combination: string }[];
    expect(seen.listed).toBe(0);
    expect(seen.counted.reduce((a, b) => a + b, 0)).toBe(combos.length);
    expect(seen.listing).toContain(`${combos.length} concrete rows`);
    expect(seen.plots).toMatch(/^The plots of every row's value are left out/);
    expect(seen.charts).toBe(0);
    expect(seen.envelope).toBe(18);
  });

  test("a table with more results than the result limit is refused", async () => {
    const run = await loadwright(["report", DEMO, ...DEMO_ARGS, "--result-limit", "5", "--out", "big.html"], { cwd: dir });
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/^loadwright: error: .*workshop-base-reactions\.csv: the case table has more than 5 results, beyond the report's limit of 5 \(--result-limit\)/m);
    expect(existsSync(join(dir, "big.html"))).toBe(false);
  });
});
