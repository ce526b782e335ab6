/**
 * The editor's form and text views in a real browser: a new ruleset built up
 * as a list of combinations (added, moved, removed), symbols renamed, the
 * whole draft edited as JSON text with its problems pointed at by line and
 * column, and what the form itself refuses kept from being stored.
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { loadRuleset } from "../../src/core/index.js";
import { openPane, screenshot, showView, type Pane } from "./pane.js";

let pane: Pane;

beforeAll(async () => {
  pane = await openPane();
});

afterAll(async () => {
  await pane?.close();
});

const draftText = async () => {
  const value = await pane.page.evaluate(() => window.localStorage.getItem("loadwright.drafts"));
  const drafts = (JSON.parse(value ?? "{}") as { drafts: { text: string }[] }).drafts;
  return drafts[drafts.length - 1].text;
};
const control = (path: string) => pane.page.locator(`[data-control-for="${path.replaceAll('"', '\\"')}"]`);
const settled = (state: "loads" | "problems") => pane.page.waitForSelector(`#lw-draft-status[data-state="${state}"]`);

describe("a new ruleset in the form", () => {
  test("starts from a template that loads and shows as UNVERIFIED until its source is confirmed", async () => {
    await showView(pane.page, "editor");
    await pane.page.locator("#lw-new-id").fill("firm-gravity");
    await pane.page.getByRole("button", { name: "Start", exact: true }).click();
    await settled("loads");
    expect(await pane.page.locator("#lw-draft-title").textContent()).toBe("Draft: firm-gravity");
    expect(await pane.page.locator("#lw-draft-status [data-verification]").textContent()).toBe("⚠ UNVERIFIED");
  });

  test("adds, fills, moves and removes combinations, and the draft keeps their order", async () => {
    await pane.page.locator("details[data-section=symbols] > summary").click();
    await pane.page.locator("#lw-add-symbols").fill("L");
    await pane.page.getByRole("button", { name: "Add the symbol" }).click();
    await control("symbols.L.description").fill("live load");
    // An optional setting left unwritten stays out of the file; choosing it and going back leaves no trace.
    const reversible = control("symbols.L.reversible");
    expect(await reversible.inputValue()).toBe("");
    expect(await reversible.locator("option:checked").textContent()).toBe("(not written: no)");
    await reversible.selectOption("true");
    expect((JSON.parse(await draftText()) as { symbols: { L: { reversible?: boolean } } }).symbols.L.reversible).toBe(true);
    await reversible.selectOption("");
    expect(Object.keys((JSON.parse(await draftText()) as { symbols: { L: object } }).symbols.L)).toEqual(["description", "permanence"]);
    await pane.page.getByRole("button", { name: "Add a combination" }).click();
    // The new combination's expression field takes the focus.
    expect(await pane.page.evaluate(() => document.activeElement?.getAttribute("data-control-for"))).toBe("combinations[1].expression");
    // ASCE/SEI 7-16 §2.3.1 (2) without its roof term [confirmed for the 7-10 list]; a firm's gravity-only list, invented for this test.
    await pane.page.keyboard.type("1.2D + 1.6L");
    await control("combinations[1].clause").fill("ASCE/SEI 7-16 §2.3.1 (2)");
    await settled("loads");
    await pane.page.getByRole("button", { name: "Move combination 2 (2) up" }).click();
    await settled("loads");
    let file = JSON.parse(await draftText()) as { combinations: { id: string; expression: string }[] };
    expect(file.combinations.map((c) => c.expression)).toEqual(["1.2D + 1.6L", "1.0D"]);
    // The moved combination is first now, so its "up" is disabled and the focus stays on it through its "down".
    expect(await pane.page.evaluate(() => document.activeElement?.getAttribute("aria-label"))).toBe("Move combination 1 (2) down");
    await pane.page.getByRole("button", { name: "Remove combination 2 (1)" }).click();
    file = JSON.parse(await draftText()) as { combinations: { id: string; expression: string }[] };
    expect(file.combinations.map((c) => c.id)).toEqual(["2"]);
    await screenshot(pane.page, "editor-form");
  });

  test("refuses a symbol name that is taken, keeps the draft from being stored, and renames once it is free", async () => {
    const name = control('symbols.L["(name)"]');
    await name.fill("D");
    await name.dispatchEvent("change");
    expect(await pane.page.locator('[data-problem-for="symbols.L[\\"(name)\\"]"] .problem').textContent()).toBe('"D" already names another symbol');
    expect(await pane.page.locator("#lw-store").isDisabled()).toBe(true);
    await name.fill("Q");
    await name.dispatchEvent("change");
    // The expression still names L, which no longer exists: the engine says so at the expression (hand count: L is character 11 of "1.2D + 1.6L").
    await settled("problems");
    expect(await pane.page.locator('[data-problem-for="combinations[0].expression"] .problem').textContent()).toMatch(/^combination "2", character 11: unknown name "L"/);
    await control("combinations[0].expression").fill("1.2D + 1.6Q");
    await settled("loads");
    expect(Object.keys((JSON.parse(await draftText()) as { symbols: object }).symbols)).toEqual(["D", "Q"]);
  });

  test("refuses decimals written with a comma in a list of allowed values", async () => {
    await pane.page.locator("details[data-section=parameters] > summary").click();
    await pane.page.locator("#lw-add-parameters").fill("kQ");
    await pane.page.getByRole("button", { name: "Add the parameter" }).click();
    await control("parameters.kQ.description").fill("factor on Q (invented for this test)");
    await control("parameters.kQ.allowed").fill("0,5, 1,0");
    expect(await pane.page.locator('[data-problem-for="parameters.kQ.allowed"] .problem').textContent()).toBe('"0,5": write decimals with a point and separate values with ", " or ";"');
    expect(await pane.page.locator("#lw-store").isDisabled()).toBe(true);
    await control("parameters.kQ.allowed").fill("0.5, 1.0");
    await settled("loads");
    expect((JSON.parse(await draftText()) as { parameters: { kQ: { allowed: number[] } } }).parameters.kQ.allowed).toEqual([0.5, 1]);
  });
});

describe("the draft as JSON text", () => {
  test("points at a problem by line and column and selects it in the text", async () => {
    await pane.page.locator("#lw-mode-text").click();
    const area = pane.page.locator("#lw-json");
    const text = (await area.inputValue()).replace('"1.2D + 1.6Q"', '"1.2D + 1.6Qx"');
    await area.fill(text);
    await settled("problems");
    const lines = text.split("\n");
    const line = lines.findIndex((l) => l.includes("1.6Qx")) + 1;
    const column = lines[line - 1].indexOf("Qx") + 1;
    const link = pane.page.locator("#lw-draft-problems button").first();
    // Hand count: "Qx" begins at character 11 of "1.2D + 1.6Qx".
    expect(await link.textContent()).toMatch(new RegExp(`character 11: unknown name "Qx".*\\(line ${line}, column ${column}\\)$`));
    await link.click();
    const selection = await area.evaluate((a: HTMLTextAreaElement) => a.value.slice(a.selectionStart, a.selectionEnd));
    expect(selection).toBe("Q");
    await screenshot(pane.page, "editor-text");
  });

  test("will not switch to the form while the text is not JSON, and says where it breaks", async () => {
    const area = pane.page.locator("#lw-json");
    const broken = (await area.inputValue()).replace('"version": "0.1.0",', '"version": "0.1.0"');
    await area.fill(broken);
    await pane.page.locator("#lw-mode-form").click();
    const lines = broken.split("\n");
    const line = lines.findIndex((l) => l.includes('"version": "0.1.0"')) + 2; // the field after the missing comma
    const column = lines[line - 1].search(/\S/) + 1;
    expect(await pane.page.locator("#lw-mode-problem").textContent()).toBe(`The text is not JSON yet (line ${line}, column ${column}): mend it here before switching to the form.`);
    expect(await pane.page.locator("#lw-json").count()).toBe(1);
    await area.fill(broken.replace('"version": "0.1.0"', '"version": "0.1.0",').replace('"1.2D + 1.6Qx"', '"1.2D + 1.6Q"'));
    await settled("loads");
    await pane.page.locator("#lw-mode-form").click();
    await pane.page.waitForSelector("#lw-form");
  });

  test("stores what it shows: the stored file loads and is the draft", async () => {
    const draft = JSON.parse(await draftText()) as unknown;
    expect(loadRuleset(draft).ok).toBe(true);
    await pane.page.locator("#lw-store").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="firm-gravity"]');
    const stored = JSON.parse((await pane.page.evaluate(() => window.localStorage.getItem("loadwright.rulesets"))) ?? "{}") as { rulesets: unknown[] };
    expect(stored.rulesets).toContainEqual(draft);
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
