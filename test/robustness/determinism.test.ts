/**
 * The same input gives the same output, byte for byte: every command that
 * reads a case file, run twice on each generated table (in this process, with
 * the plans and labels the first run kept), in each output format; the formulas
 * twice, with their plan cache cold and then warm. cliRepresentative.test.ts
 * does the same through the child process, and holds `--threads 2` to
 * `--threads 1`.
 */
import { readFileSync } from "node:fs";
import fc from "fast-check";
import JSZip from "jszip";
import { describe } from "vitest";
import { clearPlanCache } from "../../src/core/index.js";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { GOVERNING } from "../../src/functions/formulas/governingFormula.js";
import { fuzzClass, fuzzClassAsync } from "../fuzz/fuzzClass.js";
import { shown } from "../fuzz/robustness.js";
import { evaluateFormula } from "../functions/outcome.js";
import { columnsTable, csvText, finiteNumber, RULESET, tableRows, type TableSpec } from "./caseGenerators.js";
import { cliInProcess, scratch, type CliOutcome } from "./cliInProcess.js";
import { cliVerdict } from "./verdicts.js";

const files = scratch("determinism");

/** Tables that read: numbers of every size (some sums pass the largest double), distinct ids. */
const readable: fc.Arbitrary<TableSpec> = columnsTable(finiteNumber.map(String), { oddHeaders: false, maxRows: 5 }).map((t) => ({ ...t, ids: t.ids.map((id, k) => `${id.trim() || "R"} ${k + 1}`) }));

/** Every command over a case file, in every format it writes. */
function commands(file: string, t: TableSpec): string[][] {
  const ruleset = ["--ruleset", RULESET];
  const first = t.ids[0];
  return [
    ...["csv", "json", "table", "md"].map((format) => ["envelope", file, ...ruleset, "--format", format, "--threads", "1"]),
    ["factored", file, ...ruleset, "--format", "csv"],
    ["factored", file, ...ruleset, "--format", "json"],
    ["governing", file, ...ruleset, "--format", "csv", "--criterion", `max [${first}]`, "--criterion", `min [${first}]`],
    ["governing", file, ...ruleset, "--format", "json", "--criterion", `max |[${first}]|`],
    ["explain", file, ...ruleset, "--row", "1", "--component", first, "--format", "json"],
    ["combos", ...ruleset, "--cases", file, "--format", "csv"],
    // The reviewer's copy (a spreadsheet package, the slowest to write) for tables of one result.
    ...(t.ids.length === 1 ? [["sheet", file, ...ruleset, "--out", `${file}.xlsx`]] : []),
  ];
}

/**
 * The reviewer's copy is a package that records when it was written (the
 * spreadsheet library stamps the document's creation time): its worksheet is
 * what must not change.
 */
async function worksheetXml(book: string): Promise<string> {
  try {
    const zip = await JSZip.loadAsync(readFileSync(book));
    return (await zip.file("xl/worksheets/sheet1.xml")?.async("string")) ?? "(no worksheet)";
  } catch {
    return "(not written)";
  }
}

const differs = (a: CliOutcome, b: CliOutcome) => a.status !== b.status || a.stdout !== b.stdout || a.stderr !== b.stderr;

describe("the same input, the same output", () => {
  fuzzClassAsync(
    "output: every command twice on the same case file, byte for byte (csv, json, table, md)",
    0.01,
    readable,
    async (t) => {
      const file = files.file("csv", csvText(tableRows(t)));
      let located = true;
      for (const args of commands(file, t)) {
        const once = await cliInProcess(args);
        const book = args[0] === "sheet" ? await worksheetXml(`${file}.xlsx`) : "";
        const again = await cliInProcess(args);
        const bookAgain = args[0] === "sheet" ? await worksheetXml(`${file}.xlsx`) : "";
        const verdict = cliVerdict(again, file);
        located &&= verdict.located;
        if (differs(once, again) || book !== bookAgain) return { located, wrongOutput: `${args.join(" ")}: ${JSON.stringify({ once, again, book, bookAgain })}` };
      }
      return { located, wrongOutput: null };
    },
    (t) => shown(csvText(tableRows(t))),
    // Each input is a dozen commands run twice, the reviewer's copy among them: its own bound, stated in docs/reliability.md.
    { hangMs: 3_000 },
  );

  fuzzClass(
    "output: the formulas twice, with their plans made and then kept, give the same result",
    0.015,
    readable,
    (t) => {
      const range = tableRows(t).map((r, i) => (i === 0 ? r : r.map((c, k) => (k === 0 ? c : Number(c)))));
      const calls: [typeof ENVELOPE, unknown[]][] = [
        [ENVELOPE, [range, [[RULESET]], null, null]],
        [FACTORED, [range, [[RULESET]], null, null]],
        [GOVERNING, [range, [[RULESET]], [[`max [${t.ids[0]}]`]], null, null]],
      ];
      for (const [formula, args] of calls) {
        clearPlanCache();
        const cold = evaluateFormula(formula, args);
        const warm = evaluateFormula(formula, args);
        if (JSON.stringify(cold) !== JSON.stringify(warm)) return { located: true, wrongOutput: `${formula.name}: ${JSON.stringify({ cold, warm })}` };
      }
      return { located: true, wrongOutput: null };
    },
    (t) => shown(csvText(tableRows(t))),
  );
});
