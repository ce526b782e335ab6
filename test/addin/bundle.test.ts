import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { COLUMN_TABLE, STRENGTH_ROWS } from "../functions/fixtures.js";
import { builtAddin } from "./builtAddin.js";
import { openBrowser, type Browser } from "./chromium.js";
import { serveDirectory, type StaticServer } from "./staticServer.js";

/** Installed before the page's scripts: records CustomFunctions.associate calls as Excel's runtime would receive them. */
const STAND_IN = `
  window.__associations = {};
  window.CustomFunctions = {
    associate(id, fn) { window.__associations[id] = fn; },
    Error: class { constructor(code, message) { this.code = code; this.message = message; } },
    ErrorCode: { invalidValue: "#VALUE!", notAvailable: "#N/A" },
  };
`;

type Call = { id: string; args: unknown[] };

let server: StaticServer;
let browser: Browser;
let ids: string[];

/** Calls a registered function in the page; errors come back as {code, message}. */
async function invoke(calls: Call[]): Promise<unknown[]> {
  return browser.page.evaluate((list) => {
    const registry = (window as unknown as { __associations: Record<string, (...a: unknown[]) => unknown> }).__associations;
    return list.map(({ id, args }) => {
      const result = registry[id](...args) as unknown[][];
      return result.map((row) => row.map((cell) => (cell !== null && typeof cell === "object" ? { ...(cell as object) } : cell)));
    });
  }, calls);
}

beforeAll(async () => {
  const dist = await builtAddin();
  ids = (JSON.parse(readFileSync(path.join(dist, "functions.json"), "utf8")) as { functions: { id: string }[] }).functions.map((f) => f.id);
  server = await serveDirectory(dist);
  browser = await openBrowser();
  await browser.page.addInitScript(STAND_IN);
  await browser.page.goto(`${server.origin}/taskpane.html`);
  await browser.page.waitForFunction((n) => Object.keys((window as unknown as { __associations: object }).__associations).length >= n, ids.length);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe("the built bundle in Chromium", () => {
  test("associates every id listed in functions.json", async () => {
    const associated = await browser.page.evaluate(() => Object.keys((window as unknown as { __associations: object }).__associations));
    expect(associated.sort()).toEqual([...ids].sort());
  });

  test("computes the hand-checked values in the page", async () => {
    const [factored, envelope, governing, explain] = (await invoke([
      { id: "FACTORED", args: [[["", "P"], ["D", 140], ["L", 420]], [["2", "1.2D + 1.6L", "§2.3.1 (2)"]], null, null] },
      { id: "ENVELOPE", args: [COLUMN_TABLE, STRENGTH_ROWS, null, null] },
      { id: "GOVERNING", args: [COLUMN_TABLE, STRENGTH_ROWS, [["max V"]], null, null] },
      { id: "EXPLAIN", args: [COLUMN_TABLE, STRENGTH_ROWS, "2: 1.2D + 1.6L", "P", null] },
    ])) as unknown[][][];
    // [confirmed, steel design examples]: 1.2 × 140 + 1.6 × 420 = 840 kips (ASCE/SEI 7-16 §2.3.1 (2)).
    expect(factored.find((r) => r[0] === "2: 1.2D + 1.6L")?.[1]).toBeCloseTo(840, 9);
    // By hand (ASCE/SEI 7-10 §2.3.2, public copy https://www.scribd.com/document/611469328, combination 6): min under 0.9D − 1.0W is 0.9 × 140 − 50 = 76.
    const p = envelope.find((r) => r[0] === "P") as unknown[];
    expect(p[1]).toBeCloseTo(840, 9);
    expect(p[3]).toBeCloseTo(76, 9);
    // ASCE/SEI 7-16 §2.3.1 (4): V = 1.2 × 2 + 10 + 5 = 17.4 with P = 168 + 420 − 50 = 538 (V and W invented for the test).
    const v = governing.find((r) => r[0] === "max V") as unknown[];
    expect([v[1], v[2], v[3]]).toEqual([expect.closeTo(17.4, 9), "4: 1.2D + L + W", expect.closeTo(538, 9)]);
    expect(explain.map((r) => r[0])).toContain("  = 168 + 672");
  });

  test("uses the parameters given as text", async () => {
    const [combos] = (await invoke([
      { id: "COMBOS", args: [[["6", "(1.2 + 0.2*SDS)D + rho*E! + L + 0.2S", "§2.3.6 (6)"]], [["SDS=1.10; rho=1.3"]], null] },
    ])) as unknown[][][];
    // [confirmed, ICC example, SDS = 1.10, ρ = 1.3]: 1.2 + 0.2 × 1.10 = 1.42 on D, 1.3 on E.
    const row = combos.find((r) => r[0] === "6: 1.42D + L + 0.2S + 1.3E") as unknown[];
    const header = combos[1];
    expect(row[header.indexOf("D")]).toBeCloseTo(1.42, 12);
    expect(row[header.indexOf("E")]).toBeCloseTo(1.3, 12);
  });

  test("stamps a ruleset kept in browser storage, marked UNVERIFIED", async () => {
    const [identity] = (await invoke([{ id: "RULESET", args: [[["demo-invented"]]] }])) as unknown[][][];
    expect(String(identity[0][0])).toMatch(/^UNVERIFIED · /);
    expect(identity.find((r) => r[0] === "id")?.[1]).toBe("demo-invented");
  });

  test("returns a #VALUE! error that names the cell, without throwing", async () => {
    const table = COLUMN_TABLE.map((r) => [...r]);
    table[2][2] = "abc";
    const [result] = (await invoke([{ id: "ENVELOPE", args: [table, STRENGTH_ROWS, null, null, { parameterAddresses: ["Col!B2:D5", "Col!F2:H7"] }] }])) as unknown[][][];
    expect(result).toEqual([[{ code: "#VALUE!", message: 'cases, Col!D4 (L / V): "abc" is not a number' }]]);
  });

  test("writes nothing to the console", () => {
    expect(browser.console).toEqual([]);
  });
});
