/**
 * The pane as it looks and answers the keyboard, in headless Chromium at the
 * narrowest and widest task pane Excel gives (320 and 450 px), in the light
 * and the dark theme: no view scrolls sideways, the Tab key reaches every
 * control with a visible focus ring, the caution line opens and closes from
 * the keyboard, the view strip holds seven views on one line, and axe-core
 * (Deque's accessibility engine, WCAG 2.x rules) finds nothing serious or
 * critical. Screenshots of every view go to build/taskpane-screenshots/.
 */
import { AxeBuilder } from "@axe-core/playwright";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { compactCautionLine, fullCautions } from "../../src/core/index.js";
import { openPane, screenshot, screenshotInView, showView, type Pane } from "./pane.js";

type View = "library" | "editor" | "compare" | "approve" | "firm-library" | "sheet" | "transfer";
const VIEWS: View[] = ["library", "editor", "compare", "approve", "firm-library", "sheet", "transfer"];
/** Excel's task pane is 320 to 450 px wide (common practice (no source): the widths its pane can be dragged between on Windows). */
const WIDTHS = [320, 450] as const;
const THEMES = ["light", "dark"] as const;

let pane: Pane;

beforeAll(async () => {
  pane = await openPane({ width: 320, height: 760 });
});

afterAll(async () => {
  await pane?.close();
});

const page = (): Page => pane.page;

/** Horizontal overflow of the document and of the view, measured as the brief's check: scrollWidth against clientWidth. */
const overflow = () =>
  page().evaluate(() => {
    const view = document.getElementById("lw-view");
    const doc = document.documentElement;
    return { document: doc.scrollWidth - doc.clientWidth, view: view ? view.scrollWidth - view.clientWidth : Number.NaN };
  });

interface TabWalk {
  /** Every control a user can reach with Tab, in document order (by its walk number). */
  expected: string[];
  /** The controls Tab reached, in order, each once. */
  reached: string[];
  /** Stops whose focus ring is missing or thinner than 2 px. */
  unringed: string[];
  /** Stops covered by the sticky top bar or store bar at their centre. */
  covered: string[];
}

/** Presses Tab from the top of the page until the focus leaves it, and compares what it reached with every tabbable control. */
async function walkTabOrder(): Promise<TabWalk> {
  const expected = await page().evaluate(() => {
    const candidates = document.querySelectorAll<HTMLElement>("button, input, select, textarea, summary, a[href], [tabindex]");
    const out: string[] = [];
    let n = 0;
    for (const c of candidates) {
      c.removeAttribute("data-walk");
      const disabled = (c as HTMLButtonElement).disabled === true;
      if (disabled || c.tabIndex < 0 || !c.checkVisibility({ visibilityProperty: true })) continue;
      n += 1;
      c.setAttribute("data-walk", String(n));
      out.push(`${n} ${c.tagName.toLowerCase()}#${c.id} ${(c.getAttribute("aria-label") ?? c.textContent ?? "").trim().slice(0, 40)}`);
    }
    // The walk starts at the top: the heading takes the focus for a moment (it is not a Tab stop itself).
    window.scrollTo(0, 0);
    const top = document.querySelector("h1") as HTMLElement;
    top.tabIndex = -1;
    top.focus();
    top.removeAttribute("tabindex");
    return out;
  });
  const reached: string[] = [];
  const unringed: string[] = [];
  const covered: string[] = [];
  for (let i = 0; i < expected.length + 20; i++) {
    await page().keyboard.press("Tab");
    const stop = await page().evaluate(() => {
      const a = document.activeElement as HTMLElement | null;
      if (!a || a === document.body) return null;
      const style = getComputedStyle(a);
      const ring = style.outlineStyle !== "none" && parseFloat(style.outlineWidth) >= 2;
      const r = a.getBoundingClientRect();
      const hit = document.elementFromPoint(Math.min(r.left + r.width / 2, innerWidth - 1), Math.min(Math.max(r.top + r.height / 2, 0), innerHeight - 1));
      const seen = hit !== null && (a === hit || a.contains(hit) || hit.contains(a));
      const label = `${a.getAttribute("data-walk") ?? "?"} ${a.tagName.toLowerCase()}#${a.id} ${(a.getAttribute("aria-label") ?? a.textContent ?? "").trim().slice(0, 40)}`;
      return { label, ring, seen };
    });
    if (stop === null) break;
    if (reached[reached.length - 1] === stop.label) continue; // a date field's parts are one control
    if (reached.includes(stop.label)) break;
    reached.push(stop.label);
    if (!stop.ring) unringed.push(stop.label);
    if (!stop.seen) covered.push(stop.label);
  }
  return { expected, reached, unringed, covered };
}

async function seriousViolations(): Promise<string[]> {
  const results = await new AxeBuilder({ page: page() }).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(" ")).slice(0, 4).join("; ")}`);
}

describe("the caution line", () => {
  test("opens in full on first use, and says the catalogue's words in one line", async () => {
    expect(await page().locator("#lw-caution-toggle").textContent()).toBe(compactCautionLine());
    expect(await page().locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("true");
    for (const caution of fullCautions()) expect(await page().locator("#lw-caution-text").textContent()).toContain(caution);
    expect(await page().locator("#lw-caution-text").isVisible()).toBe(true);
    await screenshotInView(page(), "first-use-320-light");
  });

  test("closes and opens with the keyboard: Tab reaches it first, Enter and Space toggle it, Escape closes it", async () => {
    await page().evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    await page().keyboard.press("Tab");
    expect(await page().evaluate(() => document.activeElement?.id)).toBe("lw-caution-toggle");
    await page().keyboard.press("Enter");
    expect(await page().locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("false");
    expect(await page().locator("#lw-caution-text").isVisible()).toBe(false);
    await page().keyboard.press("Space");
    expect(await page().locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("true");
    expect(await page().locator("#lw-caution-text").isVisible()).toBe(true);
    await page().keyboard.press("Tab");
    expect(await page().evaluate(() => document.activeElement?.id)).toBe("lw-caution-ack");
    await page().keyboard.press("Escape");
    expect(await page().locator("#lw-caution-text").isVisible()).toBe(false);
    expect(await page().evaluate(() => document.activeElement?.id)).toBe("lw-caution-toggle");
  });

  test("stays closed once acknowledged, here kept in the browser's storage, and still opens to the full text", async () => {
    await page().keyboard.press("Enter");
    await page().keyboard.press("Tab");
    await page().keyboard.press("Enter");
    await page().waitForSelector("#lw-caution-text", { state: "hidden" });
    const kept = JSON.parse((await page().evaluate(() => window.localStorage.getItem("loadwright.cautions"))) ?? "null") as { cautions: string[] };
    expect(kept.cautions).toEqual(fullCautions());
    await page().reload();
    await page().waitForSelector("#lw-rulesets li[data-ruleset-id]");
    expect(await page().locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("false");
    await page().locator("#lw-caution-toggle").click();
    expect(await page().locator("#lw-caution-record").textContent()).toMatch(/^Acknowledged for this browser on \d{4}-\d{2}-\d{2}\.$/);
    await page().keyboard.press("Escape");
  });
});

describe("the view strip", () => {
  test("holds seven views on one line at 320 px, the chosen one with its name, whichever is chosen", async () => {
    const fits = await page().evaluate(() => {
      const strip = document.getElementById("lw-tabs") as HTMLElement;
      const tabs = [...strip.querySelectorAll<HTMLElement>('[role="tab"]')];
      return tabs.map((chosen) => {
        for (const t of tabs) t.setAttribute("aria-selected", String(t === chosen));
        const tops = new Set(tabs.map((t) => Math.round(t.getBoundingClientRect().top)));
        const label = chosen.querySelector(".tab-label") as HTMLElement;
        return { name: label.textContent, rows: tops.size, overflow: strip.scrollWidth - strip.clientWidth, clipped: label.scrollWidth - label.clientWidth };
      });
    });
    expect(fits).toHaveLength(7);
    for (const f of fits) expect(f, f.name ?? "").toEqual({ name: f.name, rows: 1, overflow: 0, clipped: 0 });
    await showView(page(), "library"); // draws the strip afresh
  });
});

describe("every view", () => {
  beforeAll(async () => {
    // Something in every view: a ruleset chosen in the library, a draft open in the editor (changed, so Compare has a difference).
    await page().locator('#lw-rulesets li[data-ruleset-id="asce7-16-strength"] button.ruleset').click();
    await page().getByRole("button", { name: "Open a copy…" }).click();
    await page().locator("#lw-copy-form input").fill("firm-look");
    await page().locator("#lw-copy-open").click();
    await page().waitForSelector('#lw-draft-status[data-state="loads"]');
    await page().locator('[data-control-for="version"]').fill("1.0.1");
    await page().waitForSelector('#lw-draft-status[data-state="loads"]');
    await showView(page(), "library");
    await page().locator('#lw-rulesets li[data-ruleset-id="asce7-16-strength"] button.ruleset').click();
  });

  for (const theme of THEMES) {
    for (const width of WIDTHS) {
      describe(`at ${width} px, ${theme}`, () => {
        beforeAll(async () => {
          await page().emulateMedia({ colorScheme: theme });
          await page().setViewportSize({ width, height: 760 });
        });

        test("follows the system's theme outside Excel", async () => {
          await page().waitForFunction((t) => document.documentElement.dataset.theme === t, theme, { timeout: 5000 });
          expect(await page().evaluate(() => document.documentElement.dataset.themeSource)).toBe("system");
        });

        for (const view of VIEWS) {
          test(`${view}: nothing scrolls sideways, Tab reaches every control with a visible focus, axe finds nothing serious`, async () => {
            await showView(page(), view);
            expect(await overflow(), view).toEqual({ document: 0, view: 0 });
            const walk = await walkTabOrder();
            // The firm library view, before a library is read, has the fewest controls: address, file, read, and the tabs.
            expect(walk.expected.length, view).toBeGreaterThan(view === "firm-library" ? 3 : 5);
            expect(walk.reached, view).toEqual(walk.expected);
            expect(walk.unringed, view).toEqual([]);
            expect(walk.covered, view).toEqual([]);
            expect(await seriousViolations(), view).toEqual([]);
            await page().evaluate(() => window.scrollTo(0, 0));
            await page().mouse.move(width - 1, 759); // no hover in the pictures
            await screenshot(page(), `${view}-${width}-${theme}`);
            await screenshotInView(page(), `${view}-${width}-${theme}-in-view`);
          });
        }
      });
    }
  }
});

describe("the strip and the keyboard", () => {
  test("moves between views with the arrow keys, and Home and End go to the ends", async () => {
    await showView(page(), "library");
    await page().locator("#lw-tab-library").focus();
    await page().keyboard.press("ArrowLeft");
    await page().waitForSelector('#lw-view[data-view="transfer"]');
    await page().keyboard.press("Home");
    await page().waitForSelector('#lw-view[data-view="library"]');
    expect(await page().evaluate(() => document.activeElement?.id)).toBe("lw-tab-library");
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
