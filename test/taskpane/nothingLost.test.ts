/**
 * Nothing the user stored is lost to a failed import, an invalid edit, a failed
 * firm library load or a refused save: the pane inside "Excel" (the stand-in of
 * excelStandIn.ts) with two stored rulesets in the workbook's settings and two
 * drafts in browser storage — one that loads, one that is not yet JSON — and
 * after each failure every stored ruleset (the session's settings and the
 * document's copy, byte for byte), every draft (byte for byte, but the one
 * being edited, which keeps exactly what was typed) and the firm library's
 * address are as they were. Other tests hold parts of this with one draft or
 * none (importExport, rulesetWorkflow, firmLibrary, storeFailures; the list is
 * in docs/reliability.md).
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { FIRM_LIBRARY_LINK_KEY } from "../../src/workbook/firmLibraryLink.js";
import { STORE_FORMAT, STORE_KEY } from "../../src/workbook/rulesetStore.js";
import { DRAFTS_FORMAT, DRAFTS_KEY, type Draft } from "../../src/taskpane/draftStore.js";
import { SEISMIC_FIXTURE, STRENGTH_FIXTURE } from "../functions/fixtures.js";
import { openExcelPane, type ExcelPane } from "./excelPane.js";
import { showView } from "./pane.js";

let pane: ExcelPane;
let dir: string;
const page = () => pane.page;

const FIRM = { ...STRENGTH_FIXTURE, id: "firm-strength", title: "Firm copy of the strength fixture (invented for the test)" };
const draft = (key: string, text: string): Draft => ({
  key,
  text,
  base: { kind: "new", id: null, fingerprint: null, approval: { approvedBy: null, date: null, fingerprint: null } },
  opened: "2026-01-05T10:00:00Z",
  changed: "2026-01-05T10:00:00Z",
});
const DRAFTS = { format: DRAFTS_FORMAT, drafts: [draft("draft-loads", JSON.stringify(FIRM, null, 2)), draft("draft-broken", '{\n  "format": "loadwright-ruleset/1",\n  "id": "half-typed"\n')] };
const STORED = JSON.stringify({ format: STORE_FORMAT, rulesets: [STRENGTH_FIXTURE, SEISMIC_FIXTURE] });
// A library read once from a file: no address, so nothing is fetched on opening (firmLibrary.test.ts holds that check).
const LINK = JSON.stringify({ format: "loadwright-library-link/1", address: null, lastRead: { from: "file", name: "firm-library.json", at: "2026-01-05T09:00:00.000Z", title: "Invented Engineers: approved load combinations", date: "2026-01-02" } });

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "loadwright-nothing-lost-"));
  pane = await openExcelPane(
    { sheets: { Loads: {} }, active: "Loads", selection: "Loads!A1", settings: { [STORE_KEY]: STORED, [FIRM_LIBRARY_LINK_KEY]: LINK } },
    { [DRAFTS_KEY]: JSON.stringify(DRAFTS) },
  );
});

afterAll(async () => {
  await pane?.close();
  rmSync(dir, { recursive: true, force: true });
});

interface Kept {
  stored: string | undefined;
  saved: string | undefined;
  link: string | undefined;
  drafts: Record<string, Draft>;
}

/** Everything the user keeps: stored rulesets (session and document), the library's address, every draft by key. */
async function kept(): Promise<Kept> {
  const settings = await pane.settings();
  const saved = await page().evaluate(() => ({ ...window.__standIn.savedSettings }));
  const drafts = JSON.parse((await page().evaluate((key) => window.localStorage.getItem(key), DRAFTS_KEY)) ?? "{}") as { drafts: Draft[] };
  return { stored: settings[STORE_KEY], saved: saved[STORE_KEY], link: settings[FIRM_LIBRARY_LINK_KEY], drafts: Object.fromEntries(drafts.drafts.map((d) => [d.key, d])) };
}

async function importText(text: string): Promise<void> {
  await showView(page(), "transfer");
  await page().locator("#lw-import-text").fill(text);
  await page().locator("#lw-import-check").click();
  await page().waitForSelector("#lw-import-refused");
}

describe("nothing stored is lost", () => {
  test("to a failed import: text that is not JSON, a bad expression, a forbidden field name, a file over the size limit", async () => {
    const before = await kept();
    expect(before.stored).toBe(STORED);
    expect(Object.keys(before.drafts)).toEqual(["draft-loads", "draft-broken"]);
    await importText("{ not json");
    expect(await kept()).toEqual(before);
    await importText(JSON.stringify({ ...FIRM, combinations: [{ id: "1", expression: "1.4D + (", clause: "invented" }] }));
    expect(await kept()).toEqual(before);
    await importText(JSON.stringify(FIRM).replace('"symbols":{', '"symbols":{"__proto__":{"description":"x","permanence":"permanent"},'));
    expect(await kept()).toEqual(before);
    // A ruleset file over the stated limit of 262,144 characters (docs/rulesets.md, "Limits").
    const huge = path.join(dir, "huge.json");
    writeFileSync(huge, JSON.stringify({ ...FIRM, notes: "x".repeat(300_000) }));
    await showView(page(), "transfer");
    await page().locator("#lw-import-file").setInputFiles(huge);
    await page().waitForSelector("#lw-import-refused:has-text('huge.json')");
    expect(await kept()).toEqual(before);
  });

  test("to a failed firm library load: a file that does not load as a library", async () => {
    const before = await kept();
    const bad = path.join(dir, "library.json");
    writeFileSync(bad, JSON.stringify({ format: "loadwright-library/1", title: "broken", rulesets: "none" }));
    await showView(page(), "firm-library");
    const [chooser] = await Promise.all([page().waitForEvent("filechooser"), page().locator("#lw-firm-file").click()]);
    await chooser.setFiles(bad);
    await page().waitForSelector("#lw-firm-refused:has-text('library.json')");
    expect(await kept()).toEqual(before);
  });

  test("to a refused save: the workbook's settings failing, the draft kept as it was", async () => {
    const before = await kept();
    await showView(page(), "editor");
    await page().locator("#lw-draft-pick").selectOption("draft-loads");
    await page().waitForSelector('#lw-draft-status[data-state="loads"]');
    for (const failing of [["saveAsync fails later"], ["set throws"], ["saveAsync throws"]]) {
      await page().evaluate((steps) => window.__standIn.failing.push(...steps), failing);
      await page().locator("#lw-store").click();
      await page().waitForSelector("#lw-notice.notice-problem");
      expect(await page().locator("#lw-notice").textContent()).toMatch(/what was stored before is unchanged\. The draft is kept; nothing stored changed\.$/);
      await page().evaluate(() => document.querySelector("#lw-notice")?.classList.remove("notice-problem"));
      expect(await kept()).toEqual(before);
    }
  });

  test("to an invalid edit: the stored rulesets and the other drafts unchanged, the edited draft keeping exactly what was typed", async () => {
    const before = await kept();
    await showView(page(), "editor");
    await page().locator("#lw-draft-pick").selectOption("draft-loads");
    await page().locator("#lw-mode-text").click();
    const text = `${DRAFTS.drafts[0].text.replace('"expression": "1.4D"', '"expression": "1.4D + (("')}`;
    await page().locator("#lw-json").fill(text);
    await page().waitForSelector('#lw-draft-status[data-state="problems"]');
    expect(await page().locator("#lw-store").isDisabled()).toBe(true);
    // The edit is saved as the user types (debounced): wait until the draft holds it.
    await page().waitForFunction(
      ([key, typed]) => (JSON.parse(window.localStorage.getItem(key) ?? "{}") as { drafts: { key: string; text: string }[] }).drafts.some((d) => d.key === "draft-loads" && d.text === typed),
      [DRAFTS_KEY, text] as const,
    );
    const after = await kept();
    expect({ stored: after.stored, saved: after.saved, link: after.link }).toEqual({ stored: before.stored, saved: before.saved, link: before.link });
    expect(after.drafts["draft-broken"]).toEqual(before.drafts["draft-broken"]);
    expect(after.drafts["draft-loads"]).toEqual({ ...before.drafts["draft-loads"], text, changed: after.drafts["draft-loads"].changed });
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
