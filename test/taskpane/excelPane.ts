/**
 * The built task pane in headless Chromium as it runs inside Excel, with the
 * stand-in for Office and Excel.run (excelStandIn.ts) installed before the
 * add-in's script, at a task pane's width; a fresh browser profile.
 */
import type { Page } from "playwright-core";
import { builtAddin } from "../addin/builtAddin.js";
import { openBrowser } from "../addin/chromium.js";
import { serveDirectory } from "../addin/staticServer.js";
import { installExcelStandIn, type StandInCell, type StandInRecord, type StandInSeed } from "./excelStandIn.js";
import { PANE_WIDTH } from "./pane.js";

export interface ExcelPane {
  page: Page;
  console: string[];
  /** What the add-in asked of the stand-in so far. */
  record(): Promise<StandInRecord>;
  /** The stand-in workbook's cells now: sheet → A1 address → value and formula. */
  sheets(): Promise<Record<string, Record<string, StandInCell>>>;
  settings(): Promise<Record<string, string>>;
  close(): Promise<void>;
}

/** `storage`: browser storage set before the pane starts (drafts live there, inside Excel too). */
export async function openExcelPane(seed: StandInSeed, storage: Record<string, string> = {}): Promise<ExcelPane> {
  const server = await serveDirectory(await builtAddin());
  const browser = await openBrowser();
  await browser.page.addInitScript(installExcelStandIn, seed);
  await browser.page.addInitScript((items: Record<string, string>) => {
    if (sessionStorage.getItem("seeded")) return;
    for (const [k, v] of Object.entries(items)) localStorage.setItem(k, v);
    sessionStorage.setItem("seeded", "1");
  }, storage);
  await browser.page.setViewportSize({ width: PANE_WIDTH, height: 900 });
  await browser.page.goto(`${server.origin}/taskpane.html`);
  await browser.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
  const page = browser.page;
  return {
    page,
    console: browser.console,
    record: () => page.evaluate(() => JSON.parse(JSON.stringify(window.__standIn.record)) as StandInRecord),
    sheets: () => page.evaluate(() => JSON.parse(JSON.stringify(window.__standIn.sheets)) as Record<string, Record<string, StandInCell>>),
    settings: () => page.evaluate(() => ({ ...window.__standIn.settings })),
    close: async () => {
      await browser.close();
      await server.close();
    },
  };
}
