/**
 * The pane inside Excel, with a stand-in for Office's script that answers as
 * Excel does (Office.onReady with host Excel; Office.context.officeTheme;
 * Office.context.document.settings, whose saveAsync keeps what was set): the
 * pane takes the host's theme over the system's, and keeps the cautions'
 * acknowledgement in the workbook's document settings, so the same workbook
 * opens with the caution line closed and another shows the cautions in full.
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { fullCautions } from "../../src/core/index.js";
import { openPane, screenshotInView, type Pane } from "./pane.js";

/** What the stand-in workbook holds between loads (its document settings), and the theme Office reports. */
const workbook: { settings: Record<string, unknown>; theme: Record<string, unknown>; refuseSaves: boolean } = {
  settings: {},
  // The dark Office theme as the OfficeTheme interface words it: isDarkTheme, and the colours as "#RRGGBB" (values invented for the test).
  theme: { isDarkTheme: true, bodyBackgroundColor: "#262626", bodyForegroundColor: "#FFFFFF", controlBackgroundColor: "#363636", controlForegroundColor: "#FFFFFF" },
  refuseSaves: false,
};

const officeScript = () => `
  window.__saved = ${JSON.stringify(workbook.settings)};
  const values = { ...window.__saved };
  window.Office = {
    HostType: { Excel: "Excel" },
    AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" },
    onReady: () => Promise.resolve({ host: "Excel", platform: "PC" }),
    context: {
      officeTheme: ${JSON.stringify(workbook.theme)},
      document: {
        settings: {
          get: (key) => (key in values ? values[key] : null),
          set: (key, value) => { values[key] = value; },
          remove: (key) => { delete values[key]; },
          saveAsync: (done) => {
            if (${workbook.refuseSaves}) return done({ status: "failed", error: { message: "the workbook is read-only" } });
            window.__saved = { ...values };
            done({ status: "succeeded" });
          },
        },
      },
    },
  };
`;

let pane: Pane;

beforeAll(async () => {
  pane = await openPane({ width: 320, height: 760, officeScript });
  await pane.page.emulateMedia({ colorScheme: "light" });
});

afterAll(async () => {
  await pane?.close();
});

const saved = () => pane.page.evaluate(() => (window as unknown as { __saved: Record<string, unknown> }).__saved);
const reopen = async () => {
  await pane.page.reload();
  await pane.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
};

describe("the pane in Excel", () => {
  test("runs as in Excel, with stored rulesets in the workbook", async () => {
    expect(await pane.page.locator("#lw-mode").textContent()).toBe("In Excel: formulas LW.* are available; stored rulesets live in this workbook (document settings).");
  });

  test("takes the host's dark theme, though the system prefers light", async () => {
    expect(await pane.page.evaluate(() => [document.documentElement.dataset.theme, document.documentElement.dataset.themeSource])).toEqual(["dark", "host"]);
    expect(await pane.page.evaluate(() => getComputedStyle(document.body).backgroundColor)).toBe("rgb(41, 41, 41)"); // colorNeutralBackground1 of webDarkTheme, #292929
  });

  test("shows the cautions in full in a workbook that never acknowledged them, and keeps the acknowledgement in its document settings", async () => {
    expect(await pane.page.locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("true");
    expect(await pane.page.locator("#lw-caution-record").textContent()).toBe("Shown in full until someone acknowledges them for this workbook.");
    await screenshotInView(pane.page, "excel-dark-first-use");
    await pane.page.locator("#lw-caution-ack").click();
    await pane.page.waitForSelector("#lw-caution-text", { state: "hidden" });
    const kept = JSON.parse(String((await saved())["loadwright.cautions"])) as { format: string; cautions: string[]; date: string };
    expect(kept.format).toBe("loadwright-cautions/1");
    expect(kept.cautions).toEqual(fullCautions());
    // Not in the browser: a workbook carries its own acknowledgement.
    expect(await pane.page.evaluate(() => window.localStorage.getItem("loadwright.cautions"))).toBeNull();
    workbook.settings = await saved();
  });

  test("opens the same workbook with the caution line closed, and another with the cautions in full", async () => {
    await reopen();
    expect(await pane.page.locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("false");
    await screenshotInView(pane.page, "excel-dark");
    workbook.settings = {};
    await reopen();
    expect(await pane.page.locator("#lw-caution-toggle").getAttribute("aria-expanded")).toBe("true");
  });

  test("says so where the workbook refuses the acknowledgement, and keeps the cautions open", async () => {
    workbook.refuseSaves = true;
    await reopen();
    await pane.page.locator("#lw-caution-ack").click();
    await pane.page.waitForSelector("#lw-caution-problem:not([hidden])");
    expect(await pane.page.locator("#lw-caution-problem").textContent()).toBe(
      "the acknowledgement of the cautions was not saved to this workbook (document settings): the workbook did not save its settings: the workbook is read-only; they will be shown in full again next time",
    );
    expect(await pane.page.locator("#lw-caution-text").isVisible()).toBe(true);
    workbook.refuseSaves = false;
  });

  test("reads the body colour where Office does not say whether its theme is dark", async () => {
    workbook.theme = { bodyBackgroundColor: "#262626" };
    await reopen();
    expect(await pane.page.evaluate(() => document.documentElement.dataset.theme)).toBe("dark");
    workbook.theme = { isDarkTheme: false, bodyBackgroundColor: "#FFFFFF" };
    await pane.page.emulateMedia({ colorScheme: "dark" });
    await reopen();
    expect(await pane.page.evaluate(() => [document.documentElement.dataset.theme, document.documentElement.dataset.themeSource])).toEqual(["light", "host"]);
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
