/**
 * `npm run demo`: runs the command line on the invented workshop (demo/),
 * printing the envelope and the governing rows, then writes the demo workbook
 * with the same case table and live LW.* formulas, and the calculation report
 * a checker reads (HTML, beside the workbook).
 *
 *   node build/cli/src/cli/demo/runDemo.js [--data FILE] [--out FILE.xlsx] [--report FILE.html]
 */
import { execFileSync, spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { parse, type Options } from "csv-parse/sync";
import { demoWorkbook } from "./demoWorkbook.js";

const BIN = fileURLToPath(new URL("../../../../../bin/loadwright.js", import.meta.url));

export const DEMO_RULESET = "asce7-16-strength";
/** Invented for the demo (demo/README.md). */
export const DEMO_PARAMETERS: [string, number][] = [
  ["SDS", 0.5],
  ["rho", 1.3],
];
export const DEMO_CRITERIA = ["max [A2 Fz]", "min [A1 Fz]", "max |[A1 Fy]|", "max |[B2 Fx]|"];

function option(name: string, fallback: string): string {
  const i = process.argv.indexOf(name);
  return i >= 0 && process.argv[i + 1] !== undefined ? process.argv[i + 1] : fallback;
}

function loadwright(args: string[], capture: boolean): string {
  if (!capture) {
    const run = spawnSync(process.execPath, [BIN, ...args], { stdio: "inherit" });
    if (run.status !== 0) throw new Error(`loadwright ${args[0]} failed (exit status ${run.status})`);
    return "";
  }
  return execFileSync(process.execPath, [BIN, ...args], { encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] });
}

async function main(): Promise<void> {
  const data = option("--data", "demo/workshop-base-reactions.csv");
  const out = option("--out", "demo/out/loadwright-demo.xlsx");
  const report = option("--report", join(dirname(out), "loadwright-demo-report.html"));
  const common = ["--ruleset", DEMO_RULESET, ...DEMO_PARAMETERS.flatMap(([n, v]) => ["--param", `${n}=${v}`])];
  const criteria = DEMO_CRITERIA.flatMap((c) => ["--criterion", c]);

  process.stdout.write("== Demo: invented column base reactions of a small steel-framed workshop (demo/README.md) ==\n\n");
  process.stdout.write(`$ loadwright envelope ${data} ${common.join(" ")} --format table\n`);
  loadwright(["envelope", data, ...common, "--format", "table"], false);
  process.stdout.write(`\n$ loadwright governing ${data} ${common.join(" ")} ${DEMO_CRITERIA.map((c) => `--criterion "${c}"`).join(" ")} --format table\n`);
  loadwright(["governing", data, ...common, ...criteria, "--format", "table"], false);

  const governing = JSON.parse(loadwright(["governing", data, ...common, ...criteria, "--format", "json"], true)) as { rows: { label: string }[] };
  const [header, ...rows] = parse(readFileSync(data, "utf8"), { bom: true } satisfies Options);
  const workbook = await demoWorkbook({
    cases: { header, rows: rows.map(([id, ...values]) => [id, ...values.map(Number)]) },
    ruleset: DEMO_RULESET,
    parameters: DEMO_PARAMETERS,
    criteria: DEMO_CRITERIA,
    explain: { row: governing.rows[1].label, component: "A1 Fz" },
  });
  mkdirSync(dirname(out), { recursive: true });
  writeFileSync(out, workbook);
  const reportArgs = [data, ...common, ...criteria, "--title", "Workshop column bases (invented demo)", "--by", "Loadwright demo", "--date", "2026-01-01", "--out", report];
  process.stdout.write(`\n$ loadwright report ${reportArgs.map((a) => (/[\s|[\]]/.test(a) ? `"${a}"` : a)).join(" ")}\n`);
  loadwright(["report", ...reportArgs], false);
  process.stdout.write(
    `\nWrote ${out}: the case table and live LW.ENVELOPE, LW.GOVERNING, LW.COMBOS, LW.EXPLAIN and LW.RULESET formulas.\n` +
      "Open it in Excel with the Loadwright add-in loaded (docs/demo.md); without the add-in the formulas show #NAME?.\n" +
      `Open ${report} in a browser for the calculation report a checker reads (docs/report.md); add --pdf to print it.\n`,
  );
}

main().catch((e: unknown) => {
  process.stderr.write(`demo: error: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = 1;
});
