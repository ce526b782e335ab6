/**
 * `report --pdf`: the report printed by headless Chromium, driven by
 * playwright-core (imported only here, when a PDF is asked for). Chromium is
 * the machine's own — `--chromium PATH`, else LOADWRIGHT_CHROMIUM, else the
 * usual places — and a PDF is refused, saying so, where none is found. The page
 * is opened from the file just written, with every request but that file
 * refused (the report needs none), and printed on A4 or Letter with the
 * report's own page margins, footer and page breaks.
 */
import { existsSync, statSync } from "node:fs";
import { pathToFileURL } from "node:url";
import { CliError } from "../cliError.js";

/** Where Debian, Ubuntu and Fedora put Chromium or Chrome. */
const CANDIDATES = ["/usr/bin/chromium", "/usr/bin/chromium-browser", "/usr/bin/google-chrome", "/usr/bin/google-chrome-stable"];

export type Paper = "A4" | "Letter";

export function paperOf(option: string): Paper {
  const v = option.trim().toLowerCase();
  if (v === "a4") return "A4";
  if (v === "letter") return "Letter";
  throw new CliError(`--paper: "${option}" is not a paper size (a4 or letter)`);
}

/** The Chromium to print with, or a refusal naming where it was looked for. */
export function findChromium(option: string | undefined): string {
  const given = option ?? process.env.LOADWRIGHT_CHROMIUM;
  if (given !== undefined && given !== "") {
    if (existsSync(given) && statSync(given).isFile()) return given;
    throw new CliError(`--pdf: no Chromium at ${given} (${option !== undefined ? "--chromium" : "LOADWRIGHT_CHROMIUM"}); the HTML report is written, the PDF is not`);
  }
  const found = CANDIDATES.find((c) => existsSync(c));
  if (found) return found;
  throw new CliError(
    `--pdf: no Chromium found (looked for ${CANDIDATES.join(", ")}); install it (Debian: apt-get install chromium) or name it with --chromium PATH; the HTML report is written, the PDF is not`,
  );
}

export async function printPdf(html: string, pdf: string, paper: Paper, executablePath: string): Promise<number> {
  let playwright: typeof import("playwright-core");
  try {
    playwright = await import("playwright-core");
  } catch {
    throw new CliError("--pdf: the package playwright-core, which drives Chromium, is not installed (npm ci installs it); the HTML report is written, the PDF is not");
  }
  let browser: import("playwright-core").Browser;
  try {
    browser = await playwright.chromium.launch({ executablePath, headless: true, args: ["--disable-gpu", "--no-first-run", "--disable-background-networking"] });
  } catch (e) {
    throw new CliError(`--pdf: Chromium at ${executablePath} did not start (${(e instanceof Error ? e.message : String(e)).split("\n")[0]}); the HTML report is written, the PDF is not`);
  }
  try {
    const context = await browser.newContext({ javaScriptEnabled: false });
    const url = pathToFileURL(html).href;
    await context.route("**/*", (route) => (route.request().url() === url ? route.continue() : route.abort()));
    const page = await context.newPage();
    await page.goto(url, { waitUntil: "load" });
    const bytes = await page.pdf({ path: pdf, format: paper, printBackground: true, preferCSSPageSize: false, outline: true, tagged: true });
    return bytes.length;
  } finally {
    await browser.close();
  }
}
