/**
 * The task pane in headless Chromium for the workflow tests: the shared
 * production build served on localhost, a fresh browser profile (so browser
 * storage starts empty, as on a first visit), at a task pane's width.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import type { Page } from "playwright-core";
import { builtAddin, ROOT } from "../addin/builtAddin.js";
import { openBrowser, type Browser } from "../addin/chromium.js";
import { serveDirectory, type StaticServer } from "../addin/staticServer.js";

/** Excel's task pane is about 320–450 px wide. */
export const PANE_WIDTH = 360;

export interface Pane {
  page: Page;
  console: string[];
  origin: string;
  close(): Promise<void>;
}

export interface PaneSetup {
  width?: number;
  height?: number;
  /** Run in the page before its own scripts, on every load. */
  initScript?: string;
  /** What the page gets as Office's script (office.js), asked for on every load; an empty script unless given. */
  officeScript?: () => string;
  /** More command-line flags for Chromium (a test trusting its own certificate, say). */
  args?: string[];
}

export async function openPane(setup: PaneSetup = {}): Promise<Pane> {
  const server: StaticServer = await serveDirectory(await builtAddin());
  const browser: Browser = await openBrowser(setup.args ? { args: setup.args } : {});
  await browser.page.setViewportSize({ width: setup.width ?? PANE_WIDTH, height: setup.height ?? 900 });
  if (setup.initScript !== undefined) await browser.page.addInitScript(setup.initScript);
  const officeScript = setup.officeScript;
  if (officeScript !== undefined) {
    await browser.page.route("https://appsforoffice.microsoft.com/**", (route) => route.fulfill({ status: 200, contentType: "text/javascript", body: officeScript() }));
  }
  await browser.page.goto(`${server.origin}/taskpane.html`);
  await browser.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
  return {
    page: browser.page,
    console: browser.console,
    origin: server.origin,
    close: async () => {
      await browser.close();
      await server.close();
    },
  };
}

/** Screenshots to look at (build/ is not committed). */
export async function screenshot(page: Page, name: string): Promise<string> {
  const dir = path.join(ROOT, "build", "taskpane-screenshots");
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** A screenshot of what the pane shows without scrolling, as a user first sees it. */
export async function screenshotInView(page: Page, name: string): Promise<string> {
  const dir = path.join(ROOT, "build", "taskpane-screenshots");
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${name}.png`);
  await page.screenshot({ path: file });
  return file;
}

/** Whether anything on the page is wider than the pane (a horizontal scroll bar in Excel). */
export function overflowsWidth(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);
}

export async function showView(page: Page, view: "library" | "editor" | "compare" | "approve" | "transfer" | "firm-library" | "sheet"): Promise<void> {
  await page.locator(`#lw-tab-${view}`).click();
  await page.waitForSelector(`#lw-view[data-view="${view}"]`);
}

export function storedValue(page: Page): Promise<string | null> {
  return page.evaluate(() => window.localStorage.getItem("loadwright.rulesets"));
}

export async function storedFiles(page: Page): Promise<{ id: string; approval: { approvedBy: string | null; date: string | null; fingerprint: string | null; note?: string }; combinations: { id: string; expression: string }[]; version: string }[]> {
  const value = await storedValue(page);
  return value === null ? [] : (JSON.parse(value) as { rulesets: never[] }).rulesets;
}
