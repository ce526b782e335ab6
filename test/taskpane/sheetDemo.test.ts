/**
 * The Sheet view in a plain browser, on the invented demo table kept in the
 * page (src/addin/demoSheetHost.ts): preview, insert (and the question before
 * writing over what it wrote), the reviewer's copy. The demo table's numbers
 * and the demo ruleset's factors are invented for the demo; the expected
 * values below are worked by hand from them.
 */
import { mkdirSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { ROOT } from "../addin/builtAddin.js";
import { openPane, overflowsWidth, screenshot, type Pane } from "./pane.js";

let pane: Pane;
beforeAll(async () => {
  pane = await openPane();
});
afterAll(async () => {
  await pane?.close();
});

const page = () => pane.page;
async function settled(outlet: string): Promise<string> {
  await page().waitForSelector(`#${outlet}:not([data-state="working"])[data-state]`);
  return (await page().locator(`#${outlet}`).getAttribute("data-state")) ?? "";
}

describe("the Sheet view on the demo table", () => {
  test("says it works on the invented demo table, selected from the start", async () => {
    await page().locator("#lw-tab-sheet").click();
    await page().waitForSelector('#lw-view[data-view="sheet"]');
    expect(await page().locator("#lw-sheet-where").textContent()).toContain("an invented case table at Demo!A1:D6, selected");
  });

  test("previews the demo table's envelope under the demo ruleset", async () => {
    await page().locator("#lw-sheet-ruleset").selectOption("entry:demo-invented");
    await page().locator("#lw-sheet-use-selection").click();
    expect(await settled("lw-sheet-preview-result")).toBe("done");
    expect(await page().locator("#lw-sheet-cases").inputValue()).toBe("Demo!A1:D6");
    expect(await page().locator("#lw-sheet-stamp").textContent()).toMatch(/^UNVERIFIED · not approved · demo-invented /);
    const p = page().locator('#lw-sheet-envelope tr[data-component="P"]');
    // By hand from the invented numbers (P: D 120, L 80, S 30, W:N −15, W:E 10) and the demo's invented factors:
    // B = 1.2 × 120 + 1.5 × 80 + 0.5 × 30 = 144 + 120 + 15 = 279 is the largest (A = 1.3 × 120 = 156; C = 0.9 × 120 + 15 = 123);
    // C = 0.9 × 120 − 15 = 93 (W:N acting as given) is the smallest.
    expect(Number(await p.locator("td[data-max]").getAttribute("data-max"))).toBeCloseTo(279, 9);
    expect(await p.locator("td").nth(1).textContent()).toContain("0.5S");
    expect(Number(await p.locator("td[data-min]").getAttribute("data-min"))).toBeCloseTo(93, 9);
    expect(await p.locator("td").nth(3).textContent()).toContain("W:N");
  });

  test("inserts the starter formulas one column right of the table, and lists what it wrote", async () => {
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("done");
    const rows = await page().locator("#lw-sheet-written tbody tr").allTextContents();
    expect(rows[0]).toBe("G2ruleset id demo-invented");
    expect(rows.some((r) => r.includes("=LW.ENVELOPE($A$1:$D$6,$G$2,"))).toBe(true);
    expect(await overflowsWidth(page())).toBe(false);
    const file = await screenshot(page(), "sheet-insert-full");
    expect(file).toMatch(/\.png$/);
    // The insert step alone, for the README.
    const dir = path.join(ROOT, "build", "taskpane-screenshots");
    mkdirSync(dir, { recursive: true });
    await page().locator('section[aria-labelledby="lw-sheet-insert-title"]').screenshot({ path: path.join(dir, "sheet-insert.png") });
  });

  test("asks before writing over what it wrote, and writes nothing when told not to", async () => {
    await page().locator("#lw-sheet-insert").click();
    expect(await settled("lw-sheet-insert-result")).toBe("confirm");
    expect(await page().locator("#lw-sheet-confirm-text").textContent()).toMatch(/^Demo!F1:[A-Z]+\d+ is not empty: \d+ cells hold something \(F1, /);
    await page().locator("#lw-sheet-confirm-cancel").click();
    expect(await settled("lw-sheet-insert-result")).toBe("declined");
  });

  test("writes the reviewer's copy into a new sheet of the demo", async () => {
    await page().locator("#lw-sheet-copy").click();
    expect(await settled("lw-sheet-copy-result")).toBe("done");
    expect(await page().locator("#lw-sheet-copy-result").textContent()).toMatch(/to the new worksheet "Reviewer copy": \d+ combination rows × 3 results, 5 cases/);
  });

  test("labels every control and needs no horizontal scroll bar, down to 320 px", async () => {
    const unlabelled = await page().evaluate(() =>
      [...document.querySelectorAll<HTMLElement>("#lw-view input, #lw-view select, #lw-view textarea, #lw-view button")]
        .filter((c) => !((c as HTMLInputElement).labels?.length ?? 0) && !c.getAttribute("aria-label") && (c.tagName !== "BUTTON" || c.textContent?.trim() === ""))
        .map((c) => c.outerHTML.slice(0, 100)),
    );
    expect(unlabelled).toEqual([]);
    await page().setViewportSize({ width: 320, height: 800 });
    expect(await overflowsWidth(page())).toBe(false);
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
