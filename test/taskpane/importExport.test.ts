/**
 * Import and export in a real browser: invalid files and pasted text are
 * refused with their problems located and nothing stored changes; a valid
 * file is stored only on request, and only after confirming what it would
 * replace; an export downloads the file that was stored; a save the browser
 * refuses leaves the stored rulesets and the draft as they were.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { DEMO_RULESET } from "../../src/addin/demoRuleset.js";
import { findShippedRuleset } from "../../src/core/index.js";
import { STRENGTH_FIXTURE } from "../functions/fixtures.js";
import { independentFingerprint } from "./fingerprint.js";
import { openPane, screenshot, showView, storedFiles, storedValue, type Pane } from "./pane.js";

let pane: Pane;
let dir: string;

beforeAll(async () => {
  pane = await openPane();
  dir = mkdtempSync(path.join(tmpdir(), "loadwright-import-"));
});

afterAll(async () => {
  await pane?.close();
  rmSync(dir, { recursive: true, force: true });
});

const importText = async (text: string) => {
  await showView(pane.page, "transfer");
  await pane.page.locator("#lw-import-text").fill(text);
  await pane.page.locator("#lw-import-check").click();
};

describe("importing", () => {
  test("refuses pasted text that is not JSON, at the line and column where it breaks, and stores nothing", async () => {
    const before = await storedValue(pane.page);
    // A comma is missing after the id: the next field begins at line 4, column 3 (hand count).
    await importText('{\n  "format": "loadwright-ruleset/1",\n  "id": "firm-broken"\n  "title": "x"\n}');
    expect(await pane.page.locator("#lw-import-refused").textContent()).toBe("pasted text does not load as a ruleset; nothing was stored and nothing stored changed.");
    expect(await pane.page.locator("#lw-import-problems li").allTextContents()).toEqual(['not valid JSON: a "," is expected at line 4, column 3']);
    expect(await storedValue(pane.page)).toBe(before);
    expect(await pane.page.evaluate(() => window.localStorage.getItem("loadwright.drafts"))).toBeNull();
  });

  test("refuses a file with a bad expression, naming its path, character, line and column, and stores nothing", async () => {
    const before = await storedValue(pane.page);
    const file = structuredClone(DEMO_RULESET);
    file.id = "firm-import";
    file.combinations[0].expression = "1.3D + 1.5Lx";
    const text = `${JSON.stringify(file, null, 2)}\n`;
    const where = path.join(dir, "firm-import.json");
    writeFileSync(where, text);
    await showView(pane.page, "transfer");
    await pane.page.locator("#lw-import-file").setInputFiles(where);
    await pane.page.waitForSelector("#lw-import-refused");
    const lines = text.split("\n");
    const line = lines.findIndex((l) => l.includes("1.5Lx")) + 1;
    const column = lines[line - 1].indexOf("Lx") + 1;
    // Hand count: "Lx" begins at character 11 of "1.3D + 1.5Lx".
    const problems = await pane.page.locator("#lw-import-problems li").allTextContents();
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(new RegExp(`^combinations\\[0\\]\\.expression, combination "A", character 11: unknown name "Lx".* \\(line ${line}, column ${column}\\)$`));
    expect(await pane.page.locator("#lw-import-refused").textContent()).toMatch(/^firm-import\.json does not load/);
    expect(await storedValue(pane.page)).toBe(before);
    await screenshot(pane.page, "import-refused");
  });

  test("stores a valid file only when asked, and lists it as stored and checked", async () => {
    const where = path.join(dir, "test-strength.json");
    writeFileSync(where, JSON.stringify(STRENGTH_FIXTURE));
    await showView(pane.page, "transfer");
    await pane.page.locator("#lw-import-file").setInputFiles(where);
    await pane.page.waitForSelector("#lw-import-ok");
    expect((await storedFiles(pane.page)).map((f) => f.id)).toEqual(["demo-invented"]);
    await pane.page.locator("#lw-import-store").click();
    const item = pane.page.locator('#lw-rulesets li[data-ruleset-id="test-strength"]');
    await item.waitFor();
    // The fixture's one provenance source is marked confirmed: docs/rulesets.md, "Rulesets" — no from-memory source, so Checked.
    expect(await item.locator("[data-verification]").textContent()).toBe("Checked");
    expect(await item.locator(".fingerprint").textContent()).toBe(independentFingerprint(STRENGTH_FIXTURE).slice(0, 12));
    expect((await storedFiles(pane.page)).find((f) => f.id === "test-strength")).toEqual(STRENGTH_FIXTURE);
  });

  test("asks before an import replaces a stored ruleset of the same id", async () => {
    await importText(JSON.stringify({ ...DEMO_RULESET, version: "0.2.0" }));
    await pane.page.waitForSelector("#lw-import-ok");
    expect(await pane.page.locator("#lw-import-result .alarm-box").textContent()).toMatch(/^"demo-invented" is already stored in this browser \(fingerprint [0-9a-f]{12}\): storing replaces it/);
    expect(await pane.page.locator("#lw-import-store").isDisabled()).toBe(true);
    await pane.page.locator("#lw-import-confirm").check();
    await pane.page.locator("#lw-import-store").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="demo-invented"]');
    expect((await storedFiles(pane.page)).find((f) => f.id === "demo-invented")?.version).toBe("0.2.0");
  });
});

describe("exporting", () => {
  test("downloads the stored file as <id>.json, which reads back to the same content and fingerprint", async () => {
    await showView(pane.page, "transfer");
    await pane.page.locator("#lw-export-pick").selectOption("stored:test-strength");
    const [download] = await Promise.all([pane.page.waitForEvent("download"), pane.page.locator("#lw-export-download").click()]);
    expect(download.suggestedFilename()).toBe("test-strength.json");
    const target = path.join(dir, "exported.json");
    await download.saveAs(target);
    const exported = JSON.parse(readFileSync(target, "utf8")) as Record<string, unknown>;
    expect(exported).toEqual(STRENGTH_FIXTURE);
    expect(independentFingerprint(exported)).toBe(independentFingerprint(STRENGTH_FIXTURE));
  });

  test("shows the same text to copy where a host blocks downloads", async () => {
    await pane.page.locator("#lw-export-show").click();
    expect(JSON.parse(await pane.page.locator("#lw-export-text").inputValue())).toEqual(STRENGTH_FIXTURE);
    await screenshot(pane.page, "transfer");
  });
});

describe("stored copies of shipped rulesets", () => {
  test("approving a shipped ruleset stores an approved copy with the same content, once its from-memory parts are confirmed", async () => {
    const id = "en1990-str-6.10";
    const shipped = findShippedRuleset(id)!.ruleset.file;
    // Its provenance has a from-memory source (docs/shipped-rulesets.md: UNVERIFIED), so the approver confirms it.
    expect(shipped.provenance.some((p) => p.status === "from-memory")).toBe(true);
    await showView(pane.page, "library");
    await pane.page.locator(`#lw-rulesets li[data-ruleset-id="${id}"] button.ruleset`).click();
    await showView(pane.page, "approve");
    await pane.page.locator("#lw-approver").fill("B. Reviewer");
    await pane.page.locator("#lw-approve-date").fill("2026-03-31");
    await pane.page.locator("#lw-approve-memory").check();
    await pane.page.locator("#lw-approve-button").click();
    await pane.page.waitForSelector('#lw-approve-status [data-approval="approved"]');
    await showView(pane.page, "library");
    const item = pane.page.locator(`#lw-rulesets li[data-ruleset-id="${id}"]`);
    expect(await item.getAttribute("data-source")).toBe("stored");
    expect(await item.locator(".entry-source").textContent()).toBe("stored in this browser: a copy of the shipped ruleset, same content");
    expect(await item.locator("[data-approval]").textContent()).toBe("approved by B. Reviewer on 2026-03-31");
    const stored = (await storedFiles(pane.page)).find((f) => f.id === id)!;
    expect(stored.approval.fingerprint).toBe(independentFingerprint(shipped));
  });

  test("approving a checked ruleset needs no from-memory confirmation", async () => {
    const id = "test-strength-approved";
    // The fixture's one provenance source is confirmed (docs/rulesets.md, "Rulesets": so Checked).
    await importText(JSON.stringify({ ...STRENGTH_FIXTURE, id }));
    await pane.page.waitForSelector("#lw-import-ok");
    await pane.page.locator("#lw-import-store").click();
    const item = pane.page.locator(`#lw-rulesets li[data-ruleset-id="${id}"]`);
    await item.waitFor();
    await item.locator("button.ruleset").click();
    await showView(pane.page, "approve");
    expect(await pane.page.locator("#lw-approve-pick").inputValue()).toBe(id);
    expect(await pane.page.locator("#lw-approve-memory").count()).toBe(0);
    await pane.page.locator("#lw-approver").fill("B. Reviewer");
    await pane.page.locator("#lw-approve-date").fill("2026-03-31");
    await pane.page.locator("#lw-approve-button").click();
    await pane.page.waitForSelector('#lw-approve-status [data-approval="approved"]');
    await showView(pane.page, "library");
    expect(await item.locator("[data-approval]").textContent()).toBe("approved by B. Reviewer on 2026-03-31");
    const stored = (await storedFiles(pane.page)).find((f) => f.id === id)!;
    expect(stored.approval.fingerprint).toBe(independentFingerprint({ ...STRENGTH_FIXTURE, id }));
  });

  test("an imported copy of a shipped id that differs is stored only when confirmed, and says it differs", async () => {
    const id = "en1990-equ";
    const changed = { ...findShippedRuleset(id)!.ruleset.file, version: "1.0.0-firm" };
    await importText(JSON.stringify(changed));
    await pane.page.waitForSelector("#lw-import-ok");
    expect(await pane.page.locator("#lw-import-result .alarm-box p").first().textContent()).toBe(
      `"${id}" is the id of a shipped ruleset; once stored, formulas naming it in this workbook use the imported copy, which DIFFERS from the shipped one.`,
    );
    await pane.page.locator("#lw-import-confirm").check();
    await pane.page.locator("#lw-import-store").click();
    const item = pane.page.locator(`#lw-rulesets li[data-ruleset-id="${id}"]`);
    await item.waitFor();
    expect(await item.locator(".entry-source").textContent()).toBe("stored in this browser: DIFFERS from the shipped ruleset of the same id");
  });
});

describe("a save the browser refuses", () => {
  test("leaves the stored rulesets unchanged and keeps the draft", async () => {
    await showView(pane.page, "library");
    await pane.page.locator('#lw-rulesets li[data-ruleset-id="test-strength"] button.ruleset').click();
    await pane.page.getByRole("button", { name: "Edit as a draft" }).click();
    await pane.page.locator('[data-control-for="version"]').fill("0.0.2-test");
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    const before = await storedValue(pane.page);
    // A full browser store: setItem throws a QuotaExceededError for the rulesets (HTML Living Standard, Web storage, setItem step 4).
    await pane.page.evaluate(() => {
      const original = Storage.prototype.setItem;
      Storage.prototype.setItem = function (key: string, value: string) {
        if (key === "loadwright.rulesets") throw new DOMException("the quota has been exceeded", "QuotaExceededError");
        original.call(this, key, value);
      };
    });
    await pane.page.locator("#lw-store").click();
    await pane.page.waitForSelector("#lw-notice.notice-problem");
    expect(await pane.page.locator("#lw-notice").textContent()).toMatch(/^Not stored: the ruleset was not saved to .*: the quota has been exceeded; what was stored before is unchanged\. The draft is kept; nothing stored changed\.$/);
    expect(await storedValue(pane.page)).toBe(before);
    expect(await pane.page.locator('[data-control-for="version"]').inputValue()).toBe("0.0.2-test");
    const drafts = JSON.parse((await pane.page.evaluate(() => window.localStorage.getItem("loadwright.drafts"))) ?? "{}") as { drafts: { text: string }[] };
    expect(drafts.drafts.some((d) => d.text.includes('"version": "0.0.2-test"'))).toBe(true);
  });

});

describe("a stored ruleset that no longer loads", () => {
  test("is listed as not loading, kept as stored, and can be mended as a draft", async () => {
    await pane.page.reload(); // the page of the test before still refuses stores
    await pane.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
    const broken = { ...structuredClone(DEMO_RULESET), id: "firm-typo" };
    broken.combinations[0].expression = "1.3D + 1.5X";
    const value = JSON.parse((await storedValue(pane.page)) ?? "{}") as { format: string; rulesets: unknown[] };
    value.rulesets.push(broken);
    await pane.page.evaluate((text) => window.localStorage.setItem("loadwright.rulesets", text), JSON.stringify(value));
    await pane.page.reload();
    const item = pane.page.locator('#lw-rulesets li[data-ruleset-id="firm-typo"]');
    await item.waitFor();
    expect(await item.locator("[data-verification]").textContent()).toBe("DOES NOT LOAD");
    await item.locator("button.ruleset").click();
    // Hand count: "X" is character 11 of "1.3D + 1.5X".
    expect(await pane.page.locator("#lw-selected-problem").textContent()).toMatch(/^This stored ruleset no longer loads: combinations\[0\]\.expression, combination "A", character 11: unknown name "X"/);
    await pane.page.locator("#lw-selected").getByRole("button", { name: "Edit as a draft" }).click();
    await pane.page.waitForSelector('#lw-draft-status[data-state="problems"]');
    expect(await pane.page.locator('[data-problem-for="combinations[0].expression"] .problem').textContent()).toMatch(/^combination "A", character 11: unknown name "X"/);
    await pane.page.locator('[data-control-for="combinations[0].expression"]').fill("1.3D + 1.5L");
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    await pane.page.locator("#lw-store").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="firm-typo"]');
    expect(await item.locator("[data-verification]").textContent()).toBe("⚠ UNVERIFIED");
    expect((await storedFiles(pane.page)).find((f) => f.id === "firm-typo")?.combinations[0].expression).toBe("1.3D + 1.5L");
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
