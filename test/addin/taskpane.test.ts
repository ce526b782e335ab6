import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { shippedRulesets } from "../../src/core/index.js";
import { builtAddin } from "./builtAddin.js";
import { openBrowser, type Browser } from "./chromium.js";
import { serveDirectory, type StaticServer } from "./staticServer.js";

let server: StaticServer;
let browser: Browser;

beforeAll(async () => {
  server = await serveDirectory(await builtAddin());
  browser = await openBrowser();
  await browser.page.goto(`${server.origin}/taskpane.html`);
  await browser.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const statusOf = (id: string) => browser.page.locator(`#lw-rulesets li[data-ruleset-id="${id}"] [data-verification]`).textContent();

describe("the task pane in a plain browser", () => {
  test("shows the cautions", async () => {
    const text = await browser.page.locator("#lw-cautions").textContent();
    expect(text).toContain("Every result must be reviewed by a qualified, licensed engineer");
    expect(text).toContain("The adopted code edition and its local amendments govern");
    expect(text).toContain("Shipped rulesets must be checked against the standard before use");
    expect(text).toContain("UNVERIFIED");
  });

  test("says it runs without Excel and keeps rulesets in the browser", async () => {
    expect(await browser.page.locator("#lw-mode").textContent()).toBe(
      "In a browser (demo, no Excel): stored rulesets live in this browser's local storage (demo: not saved in any workbook).",
    );
  });

  test("lists every shipped ruleset, UNVERIFIED exactly where its provenance has a source from memory", async () => {
    for (const { ruleset } of shippedRulesets()) {
      const fromMemory = ruleset.file.provenance.some((p) => p.status === "from-memory");
      expect(await statusOf(ruleset.file.id), ruleset.file.id).toBe(fromMemory ? "⚠ UNVERIFIED" : "Checked");
    }
  });

  test("puts the invented demo ruleset in browser storage, marked UNVERIFIED", async () => {
    expect(await statusOf("demo-invented")).toBe("⚠ UNVERIFIED");
    const stored = await browser.page.evaluate(() => window.localStorage.getItem("loadwright.rulesets"));
    expect(JSON.parse(stored ?? "{}").rulesets.map((r: { id: string }) => r.id)).toEqual(["demo-invented"]);
  });

  test("shows the combination list of the selected ruleset with its stamp", async () => {
    await browser.page.locator('button.ruleset:text-is("demo-invented")').click();
    await browser.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="demo-invented"]');
    expect(await browser.page.locator("#lw-stamp").textContent()).toMatch(/^UNVERIFIED · not approved · demo-invented 0\.1\.0/);
    const header = await browser.page.locator("#lw-combo-table tr").first().locator("th").allTextContents();
    expect(header).toEqual(["combination row", "clause", "D", "L", "S", "W"]);
    expect(await browser.page.locator('#lw-combo-table td:text-is("A: 1.3D")').count()).toBe(1);
  });

  test("shows a parameter outside its range as a message, not a list", async () => {
    await browser.page.locator("#lw-params").fill("kL=9");
    await browser.page.locator("#lw-params").dispatchEvent("change");
    // The demo's invented parameter kL allows 1 to 2.
    expect(await browser.page.locator("#lw-combos .problem").textContent()).toMatch(/^params, character 1: parameter kL = 9 is outside its allowed range 1 … 2/);
  });

  test("does not add the demo again on the next visit", async () => {
    await browser.page.reload();
    await browser.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
    expect(await browser.page.locator('#lw-rulesets li[data-ruleset-id="demo-invented"]').count()).toBe(1);
  });

  test("writes nothing to the console", () => {
    expect(browser.console).toEqual([]);
  });
});
