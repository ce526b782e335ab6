/**
 * The pane's stylesheet against the design system it follows: every --token
 * taskpane.css declares for the light and the dark theme carries the value
 * Fluent 2's token package gives that name (@fluentui/tokens, webLightTheme
 * and webDarkTheme), both themes declare the same tokens, and every token a
 * rule uses is declared.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { webDarkTheme, webLightTheme } from "@fluentui/tokens";
import { describe, expect, test } from "vitest";
import { ROOT } from "../addin/builtAddin.js";

const css = readFileSync(path.join(ROOT, "src/taskpane/taskpane.css"), "utf8");

/** The custom properties declared in the first block opened by `selector {`. */
function declared(selector: string): Map<string, string> {
  const start = css.indexOf(`${selector} {`);
  if (start < 0) throw new Error(`taskpane.css has no block ${selector}`);
  const body = css.slice(start + selector.length + 2, css.indexOf("}", start));
  return new Map([...body.matchAll(/--([\w-]+):\s*([^;]+);/g)].map((m) => [m[1], m[2].trim()]));
}

const light = declared(":root");
const dark = declared(':root[data-theme="dark"]');
const same = (value: string) => value.replace(/\s+/g, " ").replace(/,\s*/g, ",").toLowerCase();

describe("taskpane.css", () => {
  test("declares Fluent 2's light values, each under the token's own name", () => {
    expect(light.size).toBeGreaterThan(40);
    for (const [name, value] of light) {
      const expected = (webLightTheme as unknown as Record<string, string | undefined>)[name];
      expect(expected, `--${name} is not a token of @fluentui/tokens`).toBeDefined();
      expect(same(value), `--${name}`).toBe(same(String(expected)));
    }
  });

  test("declares Fluent 2's dark values for every colour and shadow it uses", () => {
    const themed = [...light.keys()].filter((name) => /^(color|shadow)/.test(name));
    expect([...dark.keys()].sort()).toEqual(themed.sort());
    for (const [name, value] of dark) {
      const expected = (webDarkTheme as unknown as Record<string, string | undefined>)[name];
      expect(same(value), `--${name}`).toBe(same(String(expected)));
    }
  });

  test("uses only tokens it declares, and the heights of the sticking bars the pane sets (--lw-…)", () => {
    const used = new Set([...css.matchAll(/var\(--([\w-]+)/g)].map((m) => m[1]));
    const undeclared = [...used].filter((name) => !light.has(name) && !/^lw-/.test(name));
    expect(undeclared).toEqual([]);
    expect([...used].filter((name) => /^lw-/.test(name)).sort()).toEqual(["lw-bottom-height", "lw-top-height"]);
  });
});
