/**
 * Ruleset text is only ever text. Rulesets whose names, titles, notes,
 * descriptions, sources and expressions carry markup, script, `javascript:`
 * addresses, right-to-left overrides and 10,000-character names are stored,
 * imported, edited, compared, approved and exported in every view, in
 * headless Chromium at 320 px: nothing they hold runs, no element of theirs
 * appears in the page, their words are shown as written, nothing scrolls
 * sideways, and the page's Content-Security-Policy reports no violation (the
 * policy is shown to be in force first: an inline script and an eval are refused).
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { DEMO_RULESET } from "../../src/addin/demoRuleset.js";
import { STORE_FORMAT, type RulesetFile } from "../../src/core/index.js";
import { openPane, screenshotInView, showView, type Pane } from "./pane.js";

/** Each payload records its name in window.__ran if it ever runs. */
const PAYLOAD = {
  img: `<img src=x onerror="window.__ran.push('img')">`,
  script: `</script><script>window.__ran.push('script')</script>`,
  url: `javascript:window.__ran.push('url')`,
  svg: `<svg onload="window.__ran.push('svg')"><a href="javascript:window.__ran.push('svg-link')">x</a></svg>`,
  frame: `<iframe src="javascript:window.__ran.push('frame')"></iframe>`,
  rtl: "\u202Edevorppa\u202C not approved",
};
/**
 * Long names: a ruleset id and a title of 10,000 characters, and a load symbol as long as an
 * expression that uses it may be (1,990 characters, within the stated limit of 2,000 for "1.2D + k*Qqq…").
 */
const LONG_ID = `hostile-${"x".repeat(10_000 - "hostile-".length)}`;
const LONG_SYMBOL = `Q${"q".repeat(1_989)}`;
const LONG_WORD = "W".repeat(10_000);

function hostileRuleset(id: string): RulesetFile {
  return {
    format: "loadwright-ruleset/1",
    id,
    title: `${PAYLOAD.img} ${PAYLOAD.rtl} ${LONG_WORD}`,
    standard: { name: PAYLOAD.script, edition: PAYLOAD.url, clauses: PAYLOAD.frame },
    basis: PAYLOAD.svg,
    version: `1.0.0 ${PAYLOAD.img}`,
    symbols: {
      D: { description: PAYLOAD.img, permanence: "permanent" },
      [LONG_SYMBOL]: { description: PAYLOAD.script, permanence: "transient" },
    },
    parameters: { k: { type: "number", description: `${PAYLOAD.url} ${PAYLOAD.svg}`, unit: PAYLOAD.frame, default: 1.5, min: 1, max: 2 } },
    combinations: [
      { id: "A", expression: `1.2D + k*${LONG_SYMBOL}`, clause: PAYLOAD.frame, description: PAYLOAD.img },
      { id: "B", expression: "0.9D", clause: PAYLOAD.script, description: PAYLOAD.rtl },
    ],
    notes: [PAYLOAD.img, PAYLOAD.script, PAYLOAD.url, PAYLOAD.svg, PAYLOAD.rtl, LONG_WORD],
    provenance: [{ source: PAYLOAD.img, status: "from-memory", covers: PAYLOAD.script, combinations: ["A"], locator: PAYLOAD.url, note: PAYLOAD.frame }],
    // An approval of other content: shown as void, with the approver's name as written.
    approval: { approvedBy: PAYLOAD.img, date: "2026-01-01", fingerprint: "0".repeat(64), note: PAYLOAD.script },
  };
}

/** One that no longer loads: its expression is markup, whose first character the problem message quotes. */
function brokenRuleset(): RulesetFile {
  const file = hostileRuleset("hostile-broken");
  file.combinations = [{ id: "A", expression: `1.2D + ${PAYLOAD.img}`, clause: PAYLOAD.script }];
  return file;
}

/** Installed before the page's scripts on every load: where payloads and the policy report. */
const WATCH = `
  window.__ran = [];
  window.__violations = [];
  document.addEventListener("securitypolicyviolation", (e) => window.__violations.push(e.violatedDirective + " " + e.blockedURI));
`;

let pane: Pane;

beforeAll(async () => {
  pane = await openPane({ width: 320, height: 760, initScript: WATCH });
});

afterAll(async () => {
  await pane?.close();
});

/** What the page shows that it should not: anything run, any element or handler the payloads carry, any violation, any sideways scroll. */
async function damage(): Promise<{ ran: string[]; injected: string[]; violations: string[]; overflow: number }> {
  return pane.page.evaluate(() => {
    const w = window as unknown as { __ran: string[]; __violations: string[] };
    const injected: string[] = [];
    for (const e of document.querySelectorAll("*")) {
      const tag = e.tagName.toLowerCase();
      for (const a of e.attributes) {
        if (/^on/i.test(a.name)) injected.push(`${tag}[${a.name}]`);
        if (/^\s*javascript:/i.test(a.value)) injected.push(`${tag}[${a.name}=javascript:]`);
      }
      if (["img", "iframe", "frame", "object", "embed", "a"].includes(tag)) injected.push(tag);
      if (tag === "svg" && !e.classList.contains("icon")) injected.push("svg");
      if (tag === "script" && !(e as HTMLScriptElement).src) injected.push("inline script");
    }
    const view = document.getElementById("lw-view") as HTMLElement;
    const overflow = Math.max(document.documentElement.scrollWidth - document.documentElement.clientWidth, view.scrollWidth - view.clientWidth);
    return { ran: [...w.__ran], injected, violations: [...w.__violations], overflow };
  });
}

const NONE = { ran: [], injected: [], violations: [], overflow: 0 };
const shownText = () => pane.page.evaluate(() => document.body.innerText);

describe("the page's Content-Security-Policy", () => {
  test("is in force: an inline script, an inline handler and a string given to setTimeout are refused, each reported", async () => {
    // Code the test itself runs comes through the browser's debugging protocol, which the policy does not govern;
    // these three are the page's own, and the policy must stop each.
    await pane.page.evaluate(() => {
      const script = document.createElement("script");
      script.textContent = "window.__ran.push('inline script')";
      document.body.append(script);
      script.remove();
      const handled = document.createElement("button");
      handled.setAttribute("onclick", "window.__ran.push('inline handler')");
      document.body.append(handled);
      handled.click();
      handled.remove();
      // A string for setTimeout is compiled as eval is.
      (window.setTimeout as (code: string, ms: number) => number)("window.__ran.push('string timer')", 0);
    });
    await pane.page.waitForFunction(() => (window as unknown as { __violations: string[] }).__violations.length >= 3);
    await pane.page.waitForTimeout(50);
    const seen = await damage();
    expect(seen.ran).toEqual([]);
    expect(seen.violations.sort()).toEqual(["script-src-attr inline", "script-src-elem inline", "script-src eval"].sort());
  });

  test("reports nothing while the pane starts and shows the library", async () => {
    await pane.page.reload();
    await pane.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
    expect(await damage()).toEqual(NONE);
  });
});

describe("hostile rulesets in every view", () => {
  beforeAll(async () => {
    const value = JSON.stringify({ format: STORE_FORMAT, rulesets: [DEMO_RULESET, hostileRuleset(LONG_ID), brokenRuleset()] });
    await pane.page.evaluate((text) => window.localStorage.setItem("loadwright.rulesets", text), value);
    await pane.page.reload();
    await pane.page.waitForSelector(`#lw-rulesets li[data-ruleset-id="hostile-broken"]`);
  });

  test("library: the list and the details, words as written", async () => {
    expect(await damage()).toEqual(NONE);
    await pane.page.locator(`#lw-rulesets li[data-ruleset-id="${LONG_ID}"] button.ruleset`).click();
    await pane.page.waitForSelector("#lw-combo-table");
    expect(await damage()).toEqual(NONE);
    const text = await shownText();
    for (const words of [PAYLOAD.img, PAYLOAD.script, PAYLOAD.url, PAYLOAD.svg, PAYLOAD.frame, PAYLOAD.rtl]) expect(text).toContain(words);
    expect((await pane.page.locator("#lw-selected-title").textContent()) === LONG_ID, "the 10,000-character id in full").toBe(true);
    expect((await pane.page.locator("#lw-combo-table th").allTextContents()).includes(LONG_SYMBOL), "the 1,990-character symbol heads its column").toBe(true);
    expect(await pane.page.locator(`#lw-rulesets li[data-ruleset-id="${LONG_ID}"] [data-approval]`).textContent()).toBe(
      `APPROVAL VOID: CHANGED since approval by ${PAYLOAD.img} on 2026-01-01`,
    );
    await screenshotInView(pane.page, "hostile-library");
    await pane.page.locator('#lw-rulesets li[data-ruleset-id="hostile-broken"] button.ruleset').click();
    await pane.page.waitForSelector("#lw-selected-problem");
    // "1.2D + <img …": the 8th character is the "<" (hand count).
    expect(await pane.page.locator("#lw-selected-problem").textContent()).toContain('character 8: unexpected character "<"');
    expect(await damage()).toEqual(NONE);
  });

  test("editor: the form and the JSON text of a draft of it", async () => {
    await pane.page.locator(`#lw-rulesets li[data-ruleset-id="${LONG_ID}"] button.ruleset`).click();
    await pane.page.locator("#lw-selected").getByRole("button", { name: "Edit as a draft" }).click();
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    expect(await pane.page.locator('[data-control-for="title"]').inputValue()).toBe(hostileRuleset(LONG_ID).title);
    for (const section of ["symbols", "parameters", "notes", "provenance", "approval"]) await pane.page.locator(`details[data-section="${section}"] > summary`).click();
    expect(await damage()).toEqual(NONE);
    // A draft whose expression is markup: its problem quotes it, beside the field and in the list.
    await pane.page.locator('[data-control-for="combinations[1].expression"]').fill(`0.9D + ${PAYLOAD.img}`);
    await pane.page.waitForSelector('#lw-draft-status[data-state="problems"]');
    expect(await pane.page.locator("#lw-draft-problems").textContent()).toContain("combinations[1].expression");
    expect(await damage()).toEqual(NONE);
    await screenshotInView(pane.page, "hostile-editor");
    await pane.page.locator("#lw-mode-text").click();
    expect(await pane.page.locator("#lw-json").inputValue()).toContain(JSON.stringify(PAYLOAD.script));
    expect(await damage()).toEqual(NONE);
    await pane.page.locator("#lw-mode-form").click();
  });

  test("compare: the hostile ruleset against a shipped one", async () => {
    await showView(pane.page, "compare");
    await pane.page.locator("#lw-compare-before").selectOption("shipped:asce7-16-strength");
    await pane.page.locator("#lw-compare-after").selectOption(`stored:${LONG_ID}`);
    await pane.page.locator("#lw-compare-params").fill("SDS=1.0");
    await pane.page.locator("#lw-compare-params").press("Enter");
    await pane.page.waitForSelector("#lw-compare-summary");
    expect(await shownText()).toContain(PAYLOAD.svg);
    expect(await damage()).toEqual(NONE);
    await screenshotInView(pane.page, "hostile-compare");
  });

  test("approve: the hostile ruleset chosen, its from-memory sources listed", async () => {
    await showView(pane.page, "library");
    await pane.page.locator(`#lw-rulesets li[data-ruleset-id="${LONG_ID}"] button.ruleset`).click();
    await showView(pane.page, "approve");
    expect((await pane.page.locator("#lw-approve-pick").inputValue()) === LONG_ID, "the hostile ruleset is chosen").toBe(true);
    expect(await pane.page.locator("#lw-approve-unverified").textContent()).toContain(PAYLOAD.img);
    expect(await damage()).toEqual(NONE);
  });

  test("import and export: refused hostile text, a hostile file that loads, and its JSON shown to copy", async () => {
    await showView(pane.page, "transfer");
    await pane.page.locator("#lw-import-text").fill(JSON.stringify({ ...hostileRuleset("hostile-import"), format: PAYLOAD.img, [PAYLOAD.script]: PAYLOAD.url }));
    await pane.page.locator("#lw-import-check").click();
    await pane.page.waitForSelector("#lw-import-problems li");
    expect(await pane.page.locator("#lw-import-problems").textContent()).toContain(PAYLOAD.script);
    expect(await damage()).toEqual(NONE);
    await pane.page.locator("#lw-import-text").fill(JSON.stringify(hostileRuleset("hostile-import")));
    await pane.page.locator("#lw-import-check").click();
    await pane.page.waitForSelector("#lw-import-ok");
    expect(await pane.page.locator("#lw-import-ok").textContent()).toContain(PAYLOAD.img);
    await pane.page.locator("#lw-export-pick").selectOption(`stored:${LONG_ID}`);
    await pane.page.locator("#lw-export-show").click();
    expect(JSON.parse(await pane.page.locator("#lw-export-text").inputValue())).toEqual(hostileRuleset(LONG_ID));
    expect(await damage()).toEqual(NONE);
    await screenshotInView(pane.page, "hostile-transfer");
  });

  test("firm library: the stored hostile rulesets listed against no library yet", async () => {
    await showView(pane.page, "firm-library");
    await pane.page.waitForSelector("#lw-firm-library");
    expect(await damage()).toEqual(NONE);
    await screenshotInView(pane.page, "hostile-firm-library");
  });

  test("sheet: the hostile ruleset chosen and previewed on the demo table, its problems quoted as text", async () => {
    await showView(pane.page, "sheet");
    const value = await pane.page.locator("#lw-sheet-ruleset option").evaluateAll((options, id) => options.map((o) => (o as HTMLOptionElement).value).find((v) => v.endsWith(id)) ?? "", LONG_ID);
    expect(value.endsWith(LONG_ID), "the hostile ruleset is offered").toBe(true);
    await pane.page.locator("#lw-sheet-ruleset").selectOption(value);
    await pane.page.locator("#lw-sheet-preview").click();
    await pane.page.waitForFunction(() => (document.querySelector("#lw-view")?.textContent ?? "").length > 0);
    expect(await damage()).toEqual(NONE);
    await screenshotInView(pane.page, "hostile-sheet");
  });

  test("writes nothing to the console but the policy's own refusals of the first test", () => {
    expect(pane.console.filter((line) => !line.includes("Content Security Policy"))).toEqual([]);
  });
});
