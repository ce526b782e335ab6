/**
 * The layer map of docs/design.md ("Layers") is held by lint: a file planted in
 * each folder with an import that crosses the wrong way is refused by
 * `no-restricted-imports`, and the same file importing what its folder may
 * import passes. ESLint's Node API lints the planted text under the planted
 * path (nothing is written into src/); type-aware rules are switched off for
 * these texts, which no TypeScript project holds.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { ESLint } from "eslint";
import tseslint from "typescript-eslint";
import { describe, expect, test } from "vitest";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const eslint = new ESLint({ cwd: ROOT, overrideConfig: tseslint.configs.disableTypeChecked });

/** The import rule's messages for one planted file. */
async function refusals(file: string, from: string): Promise<string[]> {
  const code = `import * as planted from "${from}";\nexport const used = planted;\n`;
  const [result] = await eslint.lintText(code, { filePath: path.join(ROOT, file) });
  return result.messages.filter((m) => m.ruleId === "no-restricted-imports").map((m) => m.message);
}

// docs/design.md, "Layers": the core imports nothing of the adapters; src/workbook and src/sheet import the
// core only; functions, taskpane and cli import the core (the first two also src/workbook, the last two also
// src/sheet) and never each other; only src/addin/main.ts wires everything.
const WRONG_WAY: [file: string, from: string][] = [
  ["src/core/ruleset/planted.ts", "../../workbook/rulesetLibrary.js"],
  ["src/core/text/planted.ts", "../../addin/main.js"],
  ["src/core/planted.ts", "../functions/formula.js"],
  ["src/core/planted.ts", "../taskpane/dom.js"],
  ["src/core/planted.ts", "../cli/run.js"],
  ["src/workbook/planted.ts", "../functions/formula.js"],
  ["src/workbook/planted.ts", "../taskpane/paneContext.js"],
  ["src/functions/planted.ts", "../taskpane/dom.js"],
  ["src/functions/formulas/planted.ts", "../../addin/main.js"],
  ["src/functions/planted.ts", "../cli/cliError.js"],
  ["src/taskpane/planted.ts", "../functions/formula.js"],
  ["src/taskpane/planted.ts", "../addin/demoRuleset.js"],
  ["src/cli/commands/planted.ts", "../../functions/formula.js"],
  ["src/cli/output/planted.ts", "../../workbook/rulesetStore.js"],
  ["src/cli/planted.ts", "../taskpane/dom.js"],
  ["src/addin/planted.ts", "../taskpane/taskpane.js"],
  ["src/addin/planted.ts", "../functions/functions.js"],
  ["src/core/planted.ts", "../sheet/sheetArea.js"],
  ["src/sheet/planted.ts", "../taskpane/dom.js"],
  ["src/sheet/planted.ts", "../workbook/rulesetStore.js"],
  ["src/functions/planted.ts", "../sheet/reviewerSheet.js"],
  ["src/report/planted.ts", "../cli/cliError.js"],
  ["src/report/planted.ts", "node:fs"],
  ["src/core/planted.ts", "../report/html.js"],
];

const RIGHT_WAY: [file: string, from: string][] = [
  ["src/core/text/planted.ts", "../ruleset/schema.js"],
  ["src/workbook/planted.ts", "../core/index.js"],
  ["src/functions/planted.ts", "../workbook/rulesetLibrary.js"],
  ["src/taskpane/planted.ts", "../workbook/rulesetLibrary.js"],
  ["src/cli/commands/planted.ts", "../../core/index.js"],
  ["src/addin/main.ts", "../taskpane/taskpane.js"],
  ["src/addin/main.ts", "../functions/functions.js"],
  ["src/sheet/planted.ts", "../core/index.js"],
  ["src/taskpane/planted.ts", "../sheet/sheetHost.js"],
  ["src/addin/planted.ts", "../sheet/sheetHost.js"],
  ["src/cli/commands/planted.ts", "../../sheet/reviewerSheet.js"],
  ["src/report/planted.ts", "../core/index.js"],
  ["src/cli/commands/planted.ts", "../../report/calcReport.js"],
];

describe("the import rules of each folder", () => {
  test.each(WRONG_WAY)("refuses %s importing %s", async (file, from) => {
    expect(await refusals(file, from)).toHaveLength(1);
  });

  test.each(RIGHT_WAY)("lets %s import %s", async (file, from) => {
    expect(await refusals(file, from)).toEqual([]);
  });

  test("keeps the core free of Node and Office", async () => {
    expect(await refusals("src/core/planted.ts", "node:fs")).toHaveLength(1);
    expect(await refusals("src/core/planted.ts", "office-addin-dev-certs")).toHaveLength(1);
  });
});
