/**
 * The form's choice of how several cases of a symbol combine is read off the
 * file format's schema, so every case mode the format knows round-trips
 * through the pane: a ruleset using it is imported, opened in the form (which
 * shows the mode as a value of the format), edited there, stored, and the
 * stored file still says the same mode. And the library and the approve view
 * say how many combinations a confirmed source lists. Driven in headless Chromium.
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { caseModeSchema, RULESET_FORMAT, type CaseMode } from "../../src/core/index.js";
import { openPane, showView, storedFiles, type Pane } from "./pane.js";

let pane: Pane;

beforeAll(async () => {
  pane = await openPane();
});

afterAll(async () => {
  await pane?.close();
});

/** A ruleset whose one transient symbol takes the mode; invented for the test: only the file format is exercised. */
function rulesetUsing(mode: CaseMode): string {
  const file = {
    format: RULESET_FORMAT,
    id: `case-mode-${mode}`,
    title: `Case mode ${mode} (invented for the test)`,
    standard: { name: "none (invented for the test)", edition: "-" },
    version: "1",
    symbols: {
      D: { description: "dead load", permanence: "permanent" },
      E: { description: "earthquake load", permanence: "transient", reversible: true, cases: mode, ...(mode === "orthogonal" ? { orthogonalShare: 0.3 } : {}) },
    },
    combinations: [{ id: "1", expression: "1.2D + 1.0E", clause: "invented for the test" }],
    provenance: [{ source: "invented for the test: only the file format is exercised", status: "from-memory", covers: "all combinations" }],
    approval: { approvedBy: null, date: null, fingerprint: null },
  };
  return `${JSON.stringify(file, null, 2)}\n`;
}

const control = (path: string) => pane.page.locator(`[data-control-for="${path}"]`);

describe("the case modes of the format", () => {
  test("are the four docs/case-tables.md names: sum, each, orthogonal, independent", () => {
    // docs/case-tables.md, "Case headers": a case map sets sum, each, orthogonal or independent per symbol.
    expect([...caseModeSchema.options]).toEqual(["sum", "each", "orthogonal", "independent"]);
  });

  test.each([...caseModeSchema.options])("%s round-trips through the form into the stored file", async (mode) => {
    await showView(pane.page, "transfer");
    await pane.page.locator("#lw-import-text").fill(rulesetUsing(mode));
    await pane.page.locator("#lw-import-check").click();
    await pane.page.locator("#lw-import-draft").click();
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    await pane.page.locator("details[data-section=symbols] > summary").click();
    const cases = control("symbols.E.cases");
    expect(await cases.inputValue()).toBe(mode);
    expect(await cases.locator("option:checked").textContent()).toMatch(new RegExp(`^${mode}: `));
    expect(await cases.locator("option").allTextContents()).not.toContainEqual(expect.stringContaining("not a value of the format"));
    // An edit elsewhere in the form writes the whole draft back from the form.
    await control("symbols.E.description").fill("earthquake load, horizontal");
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    await pane.page.locator("#lw-store").click();
    await pane.page.waitForSelector(`#lw-rulesets li.selected[data-ruleset-id="case-mode-${mode}"]`);
    const stored = (await storedFiles(pane.page)).find((f) => f.id === `case-mode-${mode}`) as unknown as { symbols: { E: Record<string, unknown> } };
    expect(stored.symbols.E).toEqual({
      description: "earthquake load, horizontal",
      permanence: "transient",
      reversible: true,
      cases: mode,
      ...(mode === "orthogonal" ? { orthogonalShare: 0.3 } : {}),
    });
  });

});

describe("combinations confirmed", () => {
  test("are counted in the library and the approve view", async () => {
    const file = JSON.parse(rulesetUsing("each")) as { id: string; combinations: unknown[]; provenance: unknown[] };
    file.id = "coverage-shown";
    file.combinations.push({ id: "2", expression: "0.9D + 1.0E", clause: "invented for the test" });
    file.provenance = [
      { source: "a source for combination 1 (invented for the test)", status: "confirmed", covers: "combination 1", combinations: ["1"] },
      { source: "a recollection of combination 2 (invented for the test)", status: "from-memory", covers: "combination 2", combinations: ["2"] },
    ];
    await showView(pane.page, "transfer");
    await pane.page.locator("#lw-import-text").fill(JSON.stringify(file, null, 2));
    await pane.page.locator("#lw-import-check").click();
    await pane.page.locator("#lw-import-store").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="coverage-shown"]');
    // docs/rulesets.md, "Rulesets": confirmed where a confirmed source lists it and no from-memory one does — 1 of the 2.
    expect(await pane.page.locator("#lw-selected-coverage").textContent()).toBe("1 of 2 combinations confirmed; not confirmed: 2");
    expect(await pane.page.locator("#lw-selected .from-memory li").allTextContents()).toEqual(["a recollection of combination 2 (invented for the test) (combination 2; combinations 2)"]);
    await showView(pane.page, "approve");
    expect(await pane.page.locator("#lw-approve-coverage").textContent()).toBe("1 of 2 combinations confirmed; not confirmed: 2");
  });
});

describe("the pane", () => {
  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
