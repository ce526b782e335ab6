/**
 * Debian's Chromium, headless, with a fresh profile, driven by playwright-core.
 * Office's script (office.js from Microsoft's CDN) is answered with an empty
 * script: the tests run the page as it runs outside Excel, with whatever
 * stand-in globals a test installs.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export const CHROMIUM = "/usr/bin/chromium";

const FLAGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
  "--no-first-run",
  "--disable-quic",
];

export interface Browser {
  page: Page;
  /** Everything the page wrote to its console and every uncaught error, for assertions. */
  console: string[];
  close(): Promise<void>;
}

export interface BrowserOptions {
  /** More command-line flags (a test trusting its own certificate, say). */
  args?: string[];
}

export async function openBrowser(options: BrowserOptions = {}): Promise<Browser> {
  const profile = mkdtempSync(path.join(tmpdir(), "loadwright-chromium-"));
  const context: BrowserContext = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: [...FLAGS, ...(options.args ?? [])],
  });
  await context.route("https://appsforoffice.microsoft.com/**", (route) =>
    route.fulfill({ status: 200, contentType: "text/javascript", body: "/* office.js is not loaded in tests */" }),
  );
  const page = context.pages()[0] ?? (await context.newPage());
  const console: string[] = [];
  page.on("console", (m) => console.push(`${m.type()}: ${m.text()}`));
  page.on("pageerror", (e) => console.push(`pageerror: ${e.message}`));
  return {
    page,
    console,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
