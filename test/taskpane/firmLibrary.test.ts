/**
 * The firm library in a real browser over real HTTPS: a library served by
 * Node's https module on 127.0.0.1 with a self-signed certificate made for the
 * run, which Chromium trusts alone (its SPKI hash); another certificate is not
 * trusted. The workbook (here the browser's storage) holds a superseded
 * version of one ruleset, the library's current version of another, a locally
 * changed copy of a third and one the library does not hold. The pane shows
 * each standing, compares the library's newer version row by row, and stores
 * it only after a confirmation naming what it replaces. Plain HTTP, an
 * untrusted certificate, an oversized body, a connection closed mid-body, an
 * invalid library and a server slower than the timeout are refused with the
 * reason, and nothing stored changes. A file opened through the file chooser
 * works the same way, and the check made when the pane opens reports a
 * workbook that is behind. Approvals, names and dates are invented for the
 * tests (test/core/library/libraryFiles.ts).
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { STORE_FORMAT, type RulesetFile } from "../../src/core/index.js";
import { FIRM_LIBRARY_LINK_KEY } from "../../src/workbook/firmLibraryLink.js";
import { approved, libraryOf, revised, shipped } from "../core/library/libraryFiles.js";
import { independentFingerprint } from "./fingerprint.js";
import { selfSignedCertificate, serveRoutes, type LibraryServer } from "./httpsServer.js";
import { openPane, overflowsWidth, screenshot, showView, storedFiles, storedValue, type Pane } from "./pane.js";

/** ASCE/SEI 7-16 §2.3.1 (2) as the shipped ruleset writes it, with the roof load alternatives (Lr or S or R). */
const SHIPPED_2 = "1.2D + 1.2F + 1.6L + 0.5(Lr or S or R) + (1.6 or hResist)H";
/** The firm's corrected version, invented for this test: rain left out of combination 2. */
const FIRM_2 = "1.2D + 1.2F + 1.6L + 0.5(Lr or S) + (1.6 or hResist)H";

const older = approved(shipped("asce7-16-strength"), "A. Approver (invented)", "2025-06-30");
const newer = approved(
  { ...revised(older, "1.0.1"), combinations: older.combinations.map((c) => (c.id === "2" ? { ...c, expression: FIRM_2 } : c)) },
  "B. Approver (invented)",
  "2026-02-27",
);
const equ = approved(shipped("en1990-equ"), "A. Approver (invented)", "2026-01-05");
const nbcc = approved(shipped("nbcc2020-uls"), "A. Approver (invented)", "2026-01-06");
const str = approved(shipped("en1990-str-6.10"), "A. Approver (invented)", "2026-01-07");
/** A copy edited in the workbook: content the library never held. */
const nbccLocal = revised(nbcc, "1.0.0-local");

const libraryText = `${JSON.stringify(libraryOf([older, newer, equ, nbcc, str]), null, 2)}\n`;

/** An invalid library: a ruleset whose expression names a symbol it does not declare. */
const broken = { ...equ, combinations: [{ ...equ.combinations[0], expression: "1.10Gdst + 0.90Gstb + 1.5Qx" }, ...equ.combinations.slice(1)] };
const invalidText = `${JSON.stringify(libraryOf([older, broken]), null, 2)}\n`;

const LIMIT = 5_000_000;
/** Four times the limit, sent in 64 KiB pieces without announcing its length. */
const OVERSIZED = 4 * LIMIT;

let pane: Pane;
let library: LibraryServer;
let untrusted: LibraryServer;
let plain: LibraryServer;
let dir: string;

const page = () => pane.page;
const linkValue = () => page().evaluate((key) => window.localStorage.getItem(key), FIRM_LIBRARY_LINK_KEY);
const stored = (id: string) => page().locator(`#lw-firm-stored li[data-ruleset-id="${id}"]`);
const fp12 = (file: RulesetFile) => independentFingerprint(file as unknown as Record<string, unknown>).slice(0, 12);

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "loadwright-firm-"));
  const certificate = selfSignedCertificate();
  library = await serveRoutes(
    {
      "/library.json": (_q, r) => r.writeHead(200, { "content-type": "application/json" }).end(libraryText),
      "/invalid.json": (_q, r) => r.writeHead(200, { "content-type": "application/json" }).end(invalidText),
      "/oversized.json": (_q, r) => {
        r.writeHead(200, { "content-type": "application/json" });
        const piece = Buffer.alloc(64 * 1024, 0x20);
        let sent = 0;
        const more = () => {
          while (sent < OVERSIZED && !r.destroyed) {
            sent += piece.byteLength;
            if (!r.write(piece)) return void r.once("drain", more);
          }
          if (!r.destroyed) r.end();
        };
        more();
      },
      "/cut.json": (_q, r) => {
        const body = Buffer.from(libraryText);
        r.writeHead(200, { "content-type": "application/json", "content-length": String(body.byteLength) });
        r.write(body.subarray(0, 1000), () => setTimeout(() => r.socket?.destroy(), 50));
      },
      "/slow.json": (_q, r) => {
        r.writeHead(200, { "content-type": "application/json" });
        // 100 bytes, then nothing: the server hangs with the connection open.
        r.write(" ".repeat(100));
      },
    },
    certificate,
  );
  untrusted = await serveRoutes({ "/library.json": (_q, r) => r.writeHead(200).end(libraryText) }, selfSignedCertificate());
  plain = await serveRoutes({ "/library.json": (_q, r) => r.writeHead(200).end(libraryText) }, null);
  pane = await openPane({ args: [`--ignore-certificate-errors-spki-list=${certificate.spki}`] });
  // The workbook's stored rulesets: the demo ruleset the pane seeds, a superseded version, a current one, a local edit.
  const seeded = (await storedFiles(pane.page)) as unknown[];
  await pane.page.evaluate((value) => window.localStorage.setItem("loadwright.rulesets", value), JSON.stringify({ format: STORE_FORMAT, rulesets: [...seeded, older, equ, nbccLocal] }));
  await pane.page.reload();
  await pane.page.waitForSelector('#lw-rulesets li[data-ruleset-id="asce7-16-strength"]');
});

afterAll(async () => {
  await pane?.close();
  await Promise.all([library?.close(), untrusted?.close(), plain?.close()]);
  rmSync(dir, { recursive: true, force: true });
});

/** Reads from an address and waits for the outcome. */
async function readFrom(address: string): Promise<void> {
  await showView(page(), "firm-library");
  await page().locator("#lw-firm-address").fill(address);
  await page().locator("#lw-firm-fetch").click();
  await page().waitForSelector("#lw-firm-fetch:not([disabled])");
}

/** Every refusal leaves the stored rulesets and the kept address as they were. */
async function expectRefused(read: () => Promise<void>, reason: RegExp): Promise<string[]> {
  const before = { stored: await storedValue(page()), link: await linkValue() };
  await read();
  await page().waitForSelector("#lw-firm-refused");
  const problems = await page().locator("#lw-firm-problems li").allTextContents();
  expect(problems.join("\n")).toMatch(reason);
  expect(await page().locator("#lw-firm-refused").textContent()).toContain("nothing stored changed and the workbook keeps its library address as it was");
  expect(await storedValue(page())).toBe(before.stored);
  expect(await linkValue()).toBe(before.link);
  return problems;
}

describe("reading the firm library over HTTPS", () => {
  test("refuses a plain HTTP address with the reason, before any request", async () => {
    await expectRefused(() => readFrom(`${plain.origin}/library.json`), /^plain HTTP is refused \(http:\/\/127\.0\.0\.1:\d+\/library\.json\): the library would travel unprotected/);
    expect(plain.requests).toEqual([]);
    expect(await page().locator("#lw-firm-held").count()).toBe(0);
  });

  test("refuses a server whose certificate is not the one the browser was told to trust", async () => {
    await expectRefused(() => readFrom(`${untrusted.origin}/library.json`), /^no answer could be read \(.+\): .*its certificate is not trusted/);
    // The TLS handshake fails: the server never sees a request.
    expect(untrusted.requests).toEqual([]);
  });

  test("shows every stored ruleset's standing against the library, in full", async () => {
    const before = await storedValue(page());
    await readFrom(`${library.origin}/library.json`);
    await page().waitForSelector("#lw-firm-held");
    expect(await page().locator("#lw-firm-title").textContent()).toBe("Invented Engineers: approved load combinations");
    // docs/firm-library.md, "Standing": by id and fingerprint; a superseded version is library-newer, the current one same,
    // content the library never held changed-locally, an id it does not hold not-in-library.
    const want: Record<string, string> = { "asce7-16-strength": "library-newer", "en1990-equ": "same", "nbcc2020-uls": "changed-locally", "demo-invented": "not-in-library" };
    for (const [id, standing] of Object.entries(want)) expect(await stored(id).getAttribute("data-standing"), id).toBe(standing);
    expect(await stored("asce7-16-strength").locator("[data-standing]").textContent()).toBe("LIBRARY HAS NEWER");
    expect(await stored("asce7-16-strength").locator(".standing-sentence").textContent()).toBe(
      `LIBRARY HAS NEWER: this is the superseded version 1.0.0 approved by A. Approver (invented) on 2025-06-30 (fingerprint ${fp12(older)}); ` +
        `the library's current one is version 1.0.1 approved by B. Approver (invented) on 2026-02-27 (fingerprint ${fp12(newer)})`,
    );
    expect(await stored("en1990-equ").locator("[data-standing]").textContent()).toBe("same as library");
    expect(await stored("nbcc2020-uls").locator("[data-standing]").textContent()).toBe("CHANGED LOCALLY");
    expect(await stored("demo-invented").locator(".standing-sentence").textContent()).toBe('not in library: the library holds no ruleset "demo-invented"');
    // Only the two needing action offer the library's version.
    expect(await page().locator("#lw-firm-stored [data-take]").evaluateAll((bs) => bs.map((b) => b.getAttribute("data-take")))).toEqual(["asce7-16-strength", "nbcc2020-uls"]);
    // The library's ruleset the workbook does not store.
    expect(await page().locator("#lw-firm-missing li").evaluateAll((ls) => ls.map((l) => l.getAttribute("data-ruleset-id")))).toEqual(["en1990-str-6.10"]);
    // Reading changes nothing stored; the address and the time are kept with the workbook.
    expect(await storedValue(page())).toBe(before);
    const link = JSON.parse((await linkValue()) ?? "null") as { address: string; lastRead: { from: string; name: string; title: string; date: string; at: string } };
    expect(link.address).toBe(`${library.origin}/library.json`);
    expect(link.lastRead).toMatchObject({ from: "address", name: `${library.origin}/library.json`, title: "Invented Engineers: approved load combinations", date: "2026-03-02" });
    expect(Math.abs(Date.parse(link.lastRead.at) - Date.now())).toBeLessThan(60_000);
    await screenshot(page(), "firm-library");
  });

  test("shows the standing beside the status in the Library view, and says the workbook is behind", async () => {
    await showView(page(), "library");
    const badge = (id: string) => page().locator(`#lw-rulesets li[data-ruleset-id="${id}"] [data-firm-standing-for]`);
    expect(await badge("asce7-16-strength").textContent()).toBe("LIBRARY HAS NEWER");
    expect(await badge("en1990-equ").textContent()).toBe("same as library");
    expect(await badge("nbcc2020-uls").textContent()).toBe("CHANGED LOCALLY");
    expect(await badge("demo-invented").textContent()).toBe("not in library");
    // A shipped ruleset not stored here is not judged: formulas use the shipped content.
    expect(await page().locator('#lw-rulesets li[data-ruleset-id="en1990-str-6.10"] [data-firm-standing-for]').count()).toBe(0);
    expect(await page().locator("#lw-firm-behind").getAttribute("data-behind")).toBe("asce7-16-strength");
    expect(await page().locator("#lw-firm-behind").textContent()).toMatch(/^This workbook is BEHIND the firm library "Invented Engineers: approved load combinations" of 2026-03-02 \(read \d{4}-\d\d-\d\d \d\d:\d\d\): LIBRARY HAS NEWER for asce7-16-strength\. Nothing was changed/);
    await screenshot(page(), "library-behind");
  });

  test("compares the library's newer version row by row, and stores it only after a confirmation naming what it replaces", async () => {
    await showView(page(), "firm-library");
    await page().locator('[data-take="asce7-16-strength"]').click();
    await page().waitForSelector("#lw-firm-update");
    // SDS has no default: the seismic combinations' rows wait for it, and the pane says so.
    expect(await page().locator("#lw-firm-compare [data-rows-problem]").first().textContent()).toMatch(/parameter SDS has no default.*\(combinations 6, 7\)/);
    await page().locator("#lw-firm-params").fill("SDS=1.0");
    await page().locator("#lw-firm-params").press("Enter");
    const changed = page().locator('#lw-compare-combinations li[data-combination="2"]');
    await changed.waitFor();
    expect(await page().locator("#lw-compare-combinations > li").count()).toBe(1);
    // ASCE/SEI 7-16 §2.3.1 (2): 1.2D + 1.6L + 0.5(Lr or S or R); F at D's factor, H at 1.6 or hResist = 0, L may be absent
    // (docs/shipped-rulesets.md): the four rows with 0.5R are the stored version's alone; the firm's version adds none.
    const rows = (await changed.locator(".rows-before .rows li").allTextContents()).map((r) => Object.fromEntries(r.split(", ").map((p) => [p.split(" ")[0], Number(p.split(" ")[1])])));
    expect(rows).toHaveLength(4);
    for (const want of [
      { D: 1.2, F: 1.2, H: 1.6, L: 1.6, R: 0.5 },
      { D: 1.2, F: 1.2, L: 1.6, R: 0.5 },
      { D: 1.2, F: 1.2, H: 1.6, R: 0.5 },
      { D: 1.2, F: 1.2, R: 0.5 },
    ]) {
      expect(rows).toContainEqual(want);
    }
    expect(await changed.locator(".rows-after .rows li").count()).toBe(0);
    expect(await page().locator("label[for=lw-firm-confirm]").textContent()).toBe(
      ` Replace the stored "asce7-16-strength" version 1.0.0 (fingerprint ${fp12(older)}; approved by A. Approver (invented) on 2025-06-30) in this browser ` +
        `with the firm library's version 1.0.1 approved by B. Approver (invented) on 2026-02-27 (fingerprint ${fp12(newer)}).`,
    );
    // docs/rulesets.md, "Rulesets": a from-memory source makes a ruleset UNVERIFIED, approved or not; what it covers is said before storing.
    expect(newer.provenance.some((p) => p.status === "from-memory")).toBe(true);
    expect(await page().locator("#lw-firm-update .from-memory-box").count()).toBe(1);
    await screenshot(page(), "firm-library-compare");
    const before = await storedValue(page());
    expect(await page().locator("#lw-firm-store").isDisabled()).toBe(true);
    expect(await storedValue(page())).toBe(before);
    await page().locator("#lw-firm-confirm").check();
    await page().locator("#lw-firm-store").click();
    await page().waitForSelector('#lw-firm-stored li[data-ruleset-id="asce7-16-strength"][data-standing="same"]');
    // The stored copy is the library's file, approval and all: the same content, the same fingerprint.
    const now = (await storedFiles(page())).find((f) => f.id === "asce7-16-strength") as unknown as Record<string, unknown>;
    expect(now).toEqual(newer);
    expect(independentFingerprint(now)).toBe(independentFingerprint(newer as unknown as Record<string, unknown>));
    expect(SHIPPED_2).toBe(older.combinations.find((c) => c.id === "2")?.expression);
    expect(await page().locator("#lw-notice").textContent()).toMatch(
      /^Stored the firm library's "asce7-16-strength" version 1\.0\.1 approved by B\. Approver \(invented\) on 2026-02-27 .* replacing version 1\.0\.0 .*; formulas naming "asce7-16-strength" use it/,
    );
    await showView(page(), "library");
    expect(await page().locator("#lw-firm-behind").count()).toBe(0);
  });

  test("stores a library ruleset the workbook does not hold, after a confirmation naming the shipped ruleset it stands in for", async () => {
    await showView(page(), "firm-library");
    await page().locator('[data-take="en1990-str-6.10"]').click();
    await page().waitForSelector('#lw-firm-update[data-ruleset-id="en1990-str-6.10"]');
    // The library approved the shipped content unchanged: Compare says the content is the same.
    expect(await page().locator("#lw-compare-same").count()).toBe(1);
    const shippedPrint = fp12(shipped("en1990-str-6.10"));
    expect(await page().locator("label[for=lw-firm-confirm]").textContent()).toBe(
      ` Store the firm library's version ${str.version} approved by A. Approver (invented) on 2026-01-07 (fingerprint ${shippedPrint}) in this browser; ` +
        `formulas naming "en1990-str-6.10" then use it instead of the shipped version ${str.version} (fingerprint ${shippedPrint}).`,
    );
    await page().locator("#lw-firm-confirm").check();
    await page().locator("#lw-firm-store").click();
    await page().waitForSelector('#lw-firm-stored li[data-ruleset-id="en1990-str-6.10"][data-standing="same"]');
    expect((await storedFiles(page())).find((f) => f.id === "en1990-str-6.10")).toEqual(str);
    expect(await page().locator("#lw-firm-missing").count()).toBe(0);
  });

  test("refuses a body larger than the limit, reading it as a stream and stopping there", async () => {
    const problems = await expectRefused(() => readFrom(`${library.origin}/oversized.json`), /^the library is larger than the 5,000,000 bytes it may hold: reading stopped at [\d,]+ bytes/);
    const stoppedAt = Number(/stopped at ([\d,]+) bytes/.exec(problems[0])?.[1].replaceAll(",", ""));
    expect(stoppedAt).toBeGreaterThan(LIMIT);
    const served = await library.settled(library.requests.length - 1);
    expect(served).toMatchObject({ path: "/oversized.json", finished: false });
    expect(served.written).toBeLessThan(OVERSIZED);
    // The library read before is still the one shown.
    expect(await page().locator("#lw-firm-title").textContent()).toBe("Invented Engineers: approved load combinations");
  });

  test("refuses a connection closed before the whole library arrived", async () => {
    await expectRefused(() => readFrom(`${library.origin}/cut.json`), /^the connection closed after [\d,]+ bytes, before the whole library arrived/);
    expect(library.requests.at(-1)?.path).toBe("/cut.json");
  });

  test("refuses an invalid library, naming each problem's path, ruleset, character, line and column", async () => {
    const problems = await expectRefused(() => readFrom(`${library.origin}/invalid.json`), /unknown name "Qx"/);
    const lines = invalidText.split("\n");
    const line = lines.findIndex((l) => l.includes("1.5Qx")) + 1;
    const column = lines[line - 1].indexOf("Qx") + 1;
    // Hand count: "Qx" begins at character 26 of "1.10Gdst + 0.90Gstb + 1.5Qx".
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(new RegExp(`^rulesets\\[1\\]\\.combinations\\[0\\]\\.expression, combination "A1\\.2\\(A\\)", character 26: unknown name "Qx".* \\(line ${line}, column ${column}\\)$`));
    expect(await page().locator("#lw-firm-refused").textContent()).toMatch(/invalid\.json does not load as a firm library/);
    await screenshot(page(), "firm-library-refused");
  });
});

describe("opening the library from a file", () => {
  const choose = async (file: string) => {
    await showView(page(), "firm-library");
    const [chooser] = await Promise.all([page().waitForEvent("filechooser"), page().locator("#lw-firm-file").click()]);
    await chooser.setFiles(file);
  };

  test("refuses an invalid file and one over the limit, and changes nothing", async () => {
    const invalid = path.join(dir, "invalid-library.json");
    writeFileSync(invalid, invalidText);
    await expectRefused(async () => {
      await choose(invalid);
      await page().waitForSelector("#lw-firm-refused:has-text('invalid-library.json')");
    }, /unknown name "Qx"/);
    const large = path.join(dir, "large.json");
    writeFileSync(large, Buffer.alloc(LIMIT + 1, 0x20));
    await expectRefused(async () => {
      await choose(large);
      await page().waitForSelector("#lw-firm-refused:has-text('large.json')");
    }, /^large\.json holds 5,000,001 bytes, more than the 5,000,000 bytes a library may hold; nothing was read/);
  });

  test("reads a valid file, shows the same standings, and keeps the address checked on opening", async () => {
    const file = path.join(dir, "firm-library.json");
    writeFileSync(file, libraryText);
    const address = (JSON.parse((await linkValue()) ?? "null") as { address: string }).address;
    await choose(file);
    await page().waitForSelector("#lw-firm-held p:has-text('from firm-library.json')");
    expect(await stored("asce7-16-strength").getAttribute("data-standing")).toBe("same");
    expect(await stored("nbcc2020-uls").getAttribute("data-standing")).toBe("changed-locally");
    const link = JSON.parse((await linkValue()) ?? "null") as { address: string; lastRead: { from: string; name: string } };
    expect(link.address).toBe(address);
    expect(link.lastRead).toMatchObject({ from: "file", name: "firm-library.json" });
  });

  test("labels every control and needs no horizontal scroll bar at task-pane width", async () => {
    await showView(page(), "firm-library");
    await page().locator('[data-take="nbcc2020-uls"]').click();
    await page().waitForSelector("#lw-firm-update");
    const unlabelled = await page().evaluate(() =>
      [...document.querySelectorAll<HTMLElement>("#lw-view input, #lw-view select, #lw-view textarea, #lw-view button")]
        .filter((c) => !((c as HTMLInputElement).labels?.length ?? 0) && !c.getAttribute("aria-label") && (c.tagName !== "BUTTON" || c.textContent?.trim() === ""))
        .map((c) => c.outerHTML.slice(0, 100)),
    );
    expect(unlabelled).toEqual([]);
    for (const width of [360, 320]) {
      await page().setViewportSize({ width, height: 900 });
      expect(await overflowsWidth(page()), `${width} px`).toBe(false);
    }
    await page().setViewportSize({ width: 360, height: 900 });
    await page().locator("#lw-firm-cancel").click();
  });
});

describe("the check on opening", () => {
  test("reports a workbook holding an older version as behind, and changes nothing by itself", async () => {
    // The workbook holds the superseded version again (as one saved before the library moved on).
    const files = (await storedFiles(page())) as unknown[];
    const value = JSON.stringify({ format: STORE_FORMAT, rulesets: files.map((f) => ((f as { id: string }).id === "asce7-16-strength" ? older : f)) });
    await page().evaluate((v) => window.localStorage.setItem("loadwright.rulesets", v), value);
    const link = await linkValue();
    const served = library.requests.length;
    await page().reload();
    await page().waitForSelector("#lw-firm-behind");
    expect(library.requests.slice(served).map((r) => r.path)).toEqual(["/library.json"]);
    expect(await page().locator("#lw-firm-behind").getAttribute("data-behind")).toBe("asce7-16-strength");
    expect(await page().locator("#lw-firm-behind").textContent()).toMatch(/^This workbook is BEHIND the firm library .* \(checked on opening \d{4}-\d\d-\d\d \d\d:\d\d\)/);
    expect(await page().locator('#lw-rulesets li[data-ruleset-id="asce7-16-strength"] [data-firm-standing-for]').textContent()).toBe("LIBRARY HAS NEWER");
    expect(await storedValue(page())).toBe(value);
    expect(await linkValue()).toBe(link);
    await screenshot(page(), "library-behind-on-opening");
  });
});

describe("a server slower than the timeout", () => {
  test("is given up after 30 s with the reason, and nothing stored changes", async () => {
    // The page's clock is driven by the test: the pane's own 30 s timer fires without the test waiting 30 s.
    await page().clock.install();
    await expectRefused(async () => {
      await showView(page(), "firm-library");
      await page().locator("#lw-firm-address").fill(`${library.origin}/slow.json`);
      const asked = library.requests.length;
      await page().locator("#lw-firm-fetch").click();
      await page().waitForSelector("#lw-firm-reading");
      await expect.poll(() => library.requests.length).toBe(asked + 1);
      await page().clock.runFor(31_000);
      await page().waitForSelector("#lw-firm-refused");
    }, /^the server did not deliver the library within 30 s \(100 bytes had arrived\); the request was stopped$/);
    expect(await library.settled(library.requests.length - 1)).toMatchObject({ path: "/slow.json", finished: false });
  });

  test("leaves nothing on the console but the browser's own lines for the refused requests", () => {
    const unexpected = pane.console.filter((line) => !/^error: Failed to load resource: net::ERR_/.test(line));
    expect(unexpected).toEqual([]);
  });
});
