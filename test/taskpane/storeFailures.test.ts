/**
 * The pane inside "Excel" (excelStandIn.ts) when the workbook's settings fail
 * while a ruleset is stored: `saveAsync` reporting a failure, `set` or
 * `saveAsync` throwing, and putting the earlier value back failing too. The
 * pane says which whole content the workbook holds — what was stored before,
 * or the new content held by this session and not saved — and never says
 * "nothing stored changed" where something did; the settings hold one whole
 * value throughout, and the document's copy (what a successful saveAsync
 * persisted) is never touched by a failed write.
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { STORE_FORMAT, STORE_KEY } from "../../src/workbook/rulesetStore.js";
import { SEISMIC_FIXTURE, STRENGTH_FIXTURE } from "../functions/fixtures.js";
import { openExcelPane, type ExcelPane } from "./excelPane.js";
import { showView } from "./pane.js";

let pane: ExcelPane;
const page = () => pane.page;
const BEFORE = JSON.stringify({ format: STORE_FORMAT, rulesets: [STRENGTH_FIXTURE] });

beforeAll(async () => {
  pane = await openExcelPane({ sheets: { Loads: {} }, active: "Loads", selection: "Loads!A1", settings: { [STORE_KEY]: BEFORE } });
});

afterAll(async () => {
  await pane?.close();
});

const storedIds = (text: string | undefined) => (text === undefined ? [] : (JSON.parse(text) as { rulesets: { id: string }[] }).rulesets.map((r) => r.id));

/** Imports SEISMIC_FIXTURE as pasted text, with `failing` steps of the settings write set to fail; the notice the pane gives. */
async function importFailing(failing: string[], version: string): Promise<string> {
  await showView(page(), "transfer");
  await page().locator("#lw-import-text").fill(JSON.stringify({ ...SEISMIC_FIXTURE, version }));
  await page().locator("#lw-import-check").click();
  await page().waitForSelector("#lw-import-ok");
  const confirm = page().locator("#lw-import-confirm");
  if ((await confirm.count()) > 0) await confirm.check();
  await page().evaluate((steps) => window.__standIn.failing.push(...steps), failing);
  await page().locator("#lw-import-store").click();
  await page().waitForSelector("#lw-notice.notice-problem");
  const notice = (await page().locator("#lw-notice").textContent()) ?? "";
  // The next test starts from a quiet notice.
  await page().evaluate(() => document.querySelector("#lw-notice")?.classList.remove("notice-problem"));
  return notice;
}

describe("a store the workbook's settings refuse", () => {
  test.each([
    ["saveAsync reports a failure", ["saveAsync fails later"], "the workbook did not save its settings: the document is read-only"],
    ["saveAsync throws", ["saveAsync throws"], "the workbook did not save its settings: the document is busy"],
    ["set throws", ["set throws"], "the workbook did not take the new settings: the settings cannot be changed now"],
  ])("%s: says that what was stored before is unchanged, and it is", async (_name, failing, reason) => {
    const notice = await importFailing(failing, "0.0.5-test");
    expect(notice).toBe(`Not stored: the ruleset was not saved to this workbook (document settings): ${reason}; what was stored before is unchanged; nothing stored changed.`);
    const settings = await pane.settings();
    expect(settings[STORE_KEY]).toBe(BEFORE);
    expect(await page().evaluate(() => window.__standIn.savedSettings["loadwright.rulesets"])).toBe(BEFORE);
  });

  test("the earlier value cannot be put back either: says the session holds the new content, unsaved, and the library shows it", async () => {
    const notice = await importFailing(["saveAsync fails later", "set throws"], "0.0.6-test");
    expect(notice).toBe(
      "Not stored: the ruleset was not saved to this workbook (document settings): the workbook did not save its settings: the document is read-only; " +
        "and what was stored before could not be put back: this session now uses the new content, which this workbook (document settings) does not hold; " +
        "store it again, or reopen the workbook to return to what was stored before.",
    );
    expect(notice).not.toMatch(/nothing stored changed/i);
    // One whole value: the new content in the session, the earlier one in the document.
    expect(storedIds((await pane.settings())[STORE_KEY])).toEqual(["test-strength", "test-seismic"]);
    expect(await page().evaluate(() => window.__standIn.savedSettings["loadwright.rulesets"])).toBe(BEFORE);
    await showView(page(), "library");
    await page().locator('#lw-rulesets li[data-ruleset-id="test-seismic"]').waitFor();
  });

  test("storing again, once the workbook saves, brings the document up to what the session shows", async () => {
    await showView(page(), "transfer");
    await page().locator("#lw-import-text").fill(JSON.stringify({ ...SEISMIC_FIXTURE, version: "0.0.6-test" }));
    await page().locator("#lw-import-check").click();
    await page().waitForSelector("#lw-import-ok");
    const confirm = page().locator("#lw-import-confirm");
    if ((await confirm.count()) > 0) await confirm.check();
    await page().locator("#lw-import-store").click();
    await page().waitForFunction(() => document.querySelector("#lw-notice")?.textContent?.startsWith("Imported and stored test-seismic") === true);
    expect(storedIds(await page().evaluate(() => window.__standIn.savedSettings["loadwright.rulesets"]))).toEqual(["test-strength", "test-seismic"]);
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
