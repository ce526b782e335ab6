/**
 * The ruleset editor in a real browser, as a firm would use it: a shipped
 * ruleset opened as a copy, an expression typed wrong and mended, the copy
 * stored, approved (with the extra confirmation an UNVERIFIED ruleset needs),
 * edited again, and compared with the shipped original.
 */
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { shippedRulesets } from "../../src/core/index.js";
import { independentFingerprint } from "./fingerprint.js";
import { openPane, overflowsWidth, screenshot, showView, storedFiles, type Pane } from "./pane.js";

let pane: Pane;

beforeAll(async () => {
  pane = await openPane();
});

afterAll(async () => {
  await pane?.close();
});

const entry = (id: string) => pane.page.locator(`#lw-rulesets li[data-ruleset-id="${id}"]`);
const expressionField = (index: number) => pane.page.locator(`[data-control-for="combinations[${index}].expression"]`);
const problemBeside = (index: number) => pane.page.locator(`[data-problem-for="combinations[${index}].expression"]`);

/** ASCE/SEI 7-16 §2.3.1 (2) as the shipped ruleset writes it, with the roof load alternatives (Lr or S or R). */
const SHIPPED_2 = "1.2D + 1.2F + 1.6L + 0.5(Lr or S or R) + (1.6 or hResist)H";
/** A firm copy's edit, invented for this test: a misspelt rain symbol. */
const MISSPELT_2 = "1.2D + 1.2F + 1.6L + 0.5(Lr or S or Rx) + (1.6 or hResist)H";
/** The mended edit, invented for this test: the firm's copy leaves rain out of combination 2. */
const FIRM_2 = "1.2D + 1.2F + 1.6L + 0.5(Lr or S) + (1.6 or hResist)H";
/** Form controls without an accessible name (a label, aria-label, or a button's own text). */
const unlabelledControls = () =>
  pane.page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>("#lw-view input, #lw-view select, #lw-view textarea, #lw-view button")]
      .filter((c) => !((c as HTMLInputElement).labels?.length ?? 0) && !c.getAttribute("aria-label") && (c.tagName !== "BUTTON" || c.textContent?.trim() === ""))
      .map((c) => c.outerHTML.slice(0, 100)),
  );
const today = new Date();
const todayText = `${today.getFullYear()}-${String(today.getMonth() + 1).padStart(2, "0")}-${String(today.getDate()).padStart(2, "0")}`;

describe("the library", () => {
  test("shows every shipped ruleset with its verification in words, approval, source and fingerprint", async () => {
    for (const { ruleset } of shippedRulesets()) {
      const file = ruleset.file;
      const item = entry(file.id);
      const fromMemory = file.provenance.some((p) => p.status === "from-memory");
      // docs/rulesets.md, "Rulesets": any from-memory source marks a ruleset UNVERIFIED; shipped rulesets carry an empty approval block.
      expect(await item.locator("[data-verification]").textContent(), file.id).toBe(fromMemory ? "⚠ UNVERIFIED" : "Checked");
      expect(await item.locator("[data-approval]").textContent(), file.id).toBe("not approved");
      expect(await item.locator(".entry-source").textContent(), file.id).toBe("shipped with Loadwright");
      // docs/rulesets.md, "Rulesets": the fingerprint is the SHA-256 of the canonical JSON (RFC 8785) without the approval block; the pane shows 12 digits.
      expect(await item.locator(".fingerprint").textContent(), file.id).toBe(independentFingerprint(file).slice(0, 12));
    }
    await screenshot(pane.page, "library");
  });

  test("lists what an UNVERIFIED ruleset's provenance marks as from memory", async () => {
    await entry("asce7-16-strength").locator("button.ruleset").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="asce7-16-strength"]');
    const listed = await pane.page.locator("#lw-selected .from-memory li").allTextContents();
    const file = shippedRulesets().find((s) => s.id === "asce7-16-strength")!.ruleset.file;
    const expected = file.provenance.filter((p) => p.status === "from-memory");
    expect(listed).toHaveLength(expected.length);
    for (const [i, p] of expected.entries()) expect(listed[i]).toContain(p.source);
  });
});

describe("editing a copy of a shipped ruleset", () => {
  test("refuses a shipped id for the copy and opens it under a new id", async () => {
    await pane.page.getByRole("button", { name: "Open a copy…" }).click();
    const id = pane.page.locator("#lw-copy-form input");
    await id.fill("asce7-16-strength");
    await pane.page.locator("#lw-copy-open").click();
    expect(await pane.page.locator("#lw-copy-form .field-problem").textContent()).toBe('"asce7-16-strength" already names a shipped or stored ruleset or an open draft; choose another id');
    await id.fill("firm-asce7-16");
    await pane.page.locator("#lw-copy-open").click();
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    expect(await pane.page.locator("#lw-draft-title").textContent()).toBe("Draft: firm-asce7-16");
    expect(await expressionField(1).inputValue()).toBe(SHIPPED_2);
    // The copy keeps the shipped provenance, which has from-memory sources: still UNVERIFIED.
    expect(await pane.page.locator("#lw-draft-status [data-verification]").textContent()).toBe("⚠ UNVERIFIED");
    await screenshot(pane.page, "editor");
  });

  test("shows an expression's problem beside its field, with the character it names marked", async () => {
    await expressionField(1).fill(MISSPELT_2);
    await pane.page.waitForSelector('#lw-draft-status[data-state="problems"]');
    // Hand count: "Rx" begins at character 37 of the expression.
    expect(MISSPELT_2.indexOf("Rx") + 1).toBe(37);
    const beside = problemBeside(1);
    expect(await beside.locator(".problem").textContent()).toMatch(/^combination "2", character 37: unknown name "Rx"/);
    expect(await beside.locator("mark.at").textContent()).toBe("R");
    expect(await expressionField(1).getAttribute("aria-invalid")).toBe("true");
    expect(await pane.page.locator("#lw-store").isDisabled()).toBe(true);
    expect(await pane.page.locator("#lw-draft-problems").textContent()).toContain('combinations[1].expression, combination "2", character 37');
    await expressionField(1).scrollIntoViewIfNeeded();
    await screenshot(pane.page, "editor-problem");
  });

  test("keeps the draft, problem and all, through a reload, and stores nothing meanwhile", async () => {
    await pane.page.reload();
    await pane.page.waitForSelector("#lw-rulesets li[data-ruleset-id]");
    expect((await storedFiles(pane.page)).map((f) => f.id)).toEqual(["demo-invented"]);
    await showView(pane.page, "editor");
    expect(await expressionField(1).inputValue()).toBe(MISSPELT_2);
    await pane.page.waitForSelector('#lw-draft-status[data-state="problems"]');
  });

  test("stores the mended draft, which is still stored after a reload", async () => {
    await expressionField(1).fill(FIRM_2);
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    await pane.page.locator("#lw-store").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="firm-asce7-16"]');
    expect(await pane.page.locator("#lw-notice").isVisible()).toBe(true);
    expect(await pane.page.locator("#lw-notice").textContent()).toMatch(/^Stored firm-asce7-16 1\.0\.0 in this browser \(fingerprint [0-9a-f]{12}\); the draft is closed\.$/);
    await pane.page.reload();
    await pane.page.waitForSelector('#lw-rulesets li[data-ruleset-id="firm-asce7-16"]');
    expect(await entry("firm-asce7-16").locator(".entry-source").textContent()).toBe("stored in this browser");
    const stored = (await storedFiles(pane.page)).find((f) => f.id === "firm-asce7-16");
    expect(stored?.combinations[1].expression).toBe(FIRM_2);
    expect(stored?.approval).toEqual({ approvedBy: null, date: null, fingerprint: null });
    // The shipped original is untouched and still listed as shipped.
    expect(await entry("asce7-16-strength").locator(".entry-source").textContent()).toBe("shipped with Loadwright");
  });
});

describe("approving", () => {
  test("asks an UNVERIFIED ruleset's approver to confirm the from-memory parts were checked, and approves nothing without it", async () => {
    await entry("firm-asce7-16").locator("button.ruleset").click();
    await showView(pane.page, "approve");
    expect(await pane.page.locator("#lw-approve-pick").inputValue()).toBe("firm-asce7-16");
    expect(await pane.page.locator("#lw-approve-date").inputValue()).toBe(todayText);
    await screenshot(pane.page, "approve");
    await pane.page.locator("#lw-approver").fill("A. Checker");
    await pane.page.locator("#lw-approve-button").click();
    expect(await pane.page.locator("#lw-approve-memory-problem").textContent()).toBe(
      "Confirm that you checked the from-memory parts listed above against the standard; nothing was approved.",
    );
    expect((await storedFiles(pane.page)).find((f) => f.id === "firm-asce7-16")?.approval.fingerprint).toBeNull();
  });

  test("records who, when and the fingerprint of this content once confirmed", async () => {
    await pane.page.locator("#lw-approve-memory").check();
    await pane.page.locator("#lw-approve-button").click();
    await pane.page.waitForSelector('#lw-approve-status [data-approval="approved"]');
    expect(await pane.page.locator('#lw-approve-status [data-approval]').textContent()).toBe(`approved by A. Checker on ${todayText}`);
    const stored = (await storedFiles(pane.page)).find((f) => f.id === "firm-asce7-16")!;
    expect(stored.approval.fingerprint).toBe(independentFingerprint(stored as unknown as Record<string, unknown>));
    expect(stored.approval.note).toContain("from memory");
    // Approval does not make a from-memory source confirmed: the ruleset stays UNVERIFIED.
    expect(await pane.page.locator('#lw-approve-status [data-verification]').textContent()).toBe("⚠ UNVERIFIED");
    await screenshot(pane.page, "approved");
  });

  test("shows, while editing the approved ruleset, that the approval will no longer apply, and CHANGED since approval once stored", async () => {
    await showView(pane.page, "library");
    await pane.page.getByRole("button", { name: "Edit as a draft" }).click();
    await pane.page.waitForSelector('#lw-draft-status[data-state="loads"]');
    expect(await pane.page.locator("#lw-approval-void").count()).toBe(0);
    await pane.page.locator('[data-control-for="version"]').fill("1.0.1");
    await pane.page.waitForSelector("#lw-approval-void");
    expect(await pane.page.locator("#lw-approval-void").textContent()).toMatch(new RegExp(`^The approval by A\\. Checker on ${todayText} will no longer apply`));
    expect(await pane.page.locator("#lw-draft-status [data-approval]").textContent()).toBe(`APPROVAL VOID: CHANGED since approval by A. Checker on ${todayText}`);
    await screenshot(pane.page, "editor-approval-void");
    await pane.page.locator("#lw-store").click();
    await pane.page.waitForSelector('#lw-rulesets li.selected[data-ruleset-id="firm-asce7-16"]');
    expect(await entry("firm-asce7-16").locator("[data-approval]").textContent()).toBe(`APPROVAL VOID: CHANGED since approval by A. Checker on ${todayText}`);
    expect(await entry("firm-asce7-16").locator("[data-approval]").getAttribute("data-approval")).toBe("changed-since-approval");
  });
});

describe("comparing", () => {
  test("shows the copy's changed combination and the concrete rows only the shipped original forms", async () => {
    await showView(pane.page, "compare");
    // An UNVERIFIED ruleset says so even as a choice in a list, and only an UNVERIFIED one.
    expect(await pane.page.locator('#lw-compare-before option[value="shipped:asce7-16-strength"]').textContent()).toBe("asce7-16-strength (shipped) — UNVERIFIED");
    for (const { id, status } of shippedRulesets()) {
      const suffix = status.verification === "unverified" ? " — UNVERIFIED" : "";
      expect(await pane.page.locator(`#lw-compare-before option[value="shipped:${id}"]`).textContent()).toBe(`${id} (shipped)${suffix}`);
    }
    await pane.page.locator("#lw-compare-before").selectOption("shipped:asce7-16-strength");
    await pane.page.locator("#lw-compare-after").selectOption("stored:firm-asce7-16");
    // Without SDS (no default) the rows cannot be formed; the pane says so and names it.
    expect(await pane.page.locator("[data-rows-problem]").first().textContent()).toMatch(/parameter SDS has no default.*\(combinations 6, 7\)/);
    await pane.page.locator("#lw-compare-params").fill("SDS=1.0");
    await pane.page.locator("#lw-compare-params").press("Enter");
    const changed = pane.page.locator('#lw-compare-combinations li[data-combination="2"]');
    await changed.waitFor();
    expect(await pane.page.locator("#lw-compare-combinations > li").count()).toBe(1);
    const onlyBefore = await changed.locator(".rows-before .rows li").allTextContents();
    // ASCE/SEI 7-16 §2.3.1 (2): 1.2D + 1.6L + 0.5(Lr or S or R) [confirmed]; F at D's factor, H at 1.6 or hResist = 0, L may be absent
    // [confirmed rules]: the four rows with 0.5R are the shipped original's alone.
    const asMaps = onlyBefore.map((r) => Object.fromEntries(r.split(", ").map((p) => [p.split(" ")[0], Number(p.split(" ")[1])])));
    expect(asMaps).toHaveLength(4);
    for (const want of [
      { D: 1.2, F: 1.2, H: 1.6, L: 1.6, R: 0.5 },
      { D: 1.2, F: 1.2, L: 1.6, R: 0.5 },
      { D: 1.2, F: 1.2, H: 1.6, R: 0.5 },
      { D: 1.2, F: 1.2, R: 0.5 },
    ]) {
      expect(asMaps).toContainEqual(want);
    }
    expect(await changed.locator(".rows-after .rows li").count()).toBe(0);
    const identity = await pane.page.locator("#lw-compare-result section").first().textContent();
    expect(identity).toContain('id: "asce7-16-strength" → "firm-asce7-16"');
    expect(identity).toContain('version: "1.0.0" → "1.0.1"');
    await screenshot(pane.page, "compare");
  });
});

describe("the pane at task-pane width", () => {
  test("keeps the cautions in view on every view, labels every control, and never needs a horizontal scroll bar", async () => {
    for (const view of ["library", "editor", "compare", "approve", "transfer"] as const) {
      await showView(pane.page, view);
      const cautions = await pane.page.locator("#lw-cautions").textContent();
      expect(cautions, view).toContain("must be reviewed by a qualified, licensed engineer");
      expect(cautions, view).toContain("The adopted code edition and its local amendments govern");
      expect(cautions, view).toContain("Shipped rulesets must be checked against the standard before use");
      expect(await pane.page.locator("#lw-cautions").isVisible(), view).toBe(true);
      expect(await overflowsWidth(pane.page), view).toBe(false);
      expect(await unlabelledControls(), view).toEqual([]);
    }
    await pane.page.setViewportSize({ width: 320, height: 800 });
    for (const view of ["library", "editor", "compare", "approve", "transfer"] as const) {
      await showView(pane.page, view);
      expect(await overflowsWidth(pane.page), `${view} at 320 px`).toBe(false);
    }
  });

  test("moves between views with the arrow keys", async () => {
    await showView(pane.page, "library");
    await pane.page.locator("#lw-tab-library").focus();
    await pane.page.keyboard.press("ArrowRight");
    await pane.page.waitForSelector('#lw-view[data-view="editor"]');
    expect(await pane.page.evaluate(() => document.activeElement?.id)).toBe("lw-tab-editor");
    await pane.page.keyboard.press("End");
    await pane.page.waitForSelector('#lw-view[data-view="transfer"]');
    await pane.page.keyboard.press("ArrowRight");
    await pane.page.waitForSelector('#lw-view[data-view="library"]');
  });

  test("writes nothing to the console", () => {
    expect(pane.console).toEqual([]);
  });
});
