/**
 * Prints the robustness summary after the run: for each class of bad or
 * hostile input (test/fuzz/robustness.ts), how many inputs were tried and how
 * many crashed, hung, gave a problem without its place or changed a built-in
 * prototype. Test files write their counts to build/robustness/; this reporter
 * empties that folder when the run starts and reads it when the run ends, so
 * the summary holds exactly this run's classes.
 */
import { existsSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { join } from "node:path";
import type { Reporter, Vitest } from "vitest/node";
import { ROBUSTNESS_DIR, type RobustnessCounts } from "../fuzz/robustness.js";

const n = (x: number) => String(x).replace(/\B(?=(\d{3})+(?!\d))/g, ",");

export default class RobustnessReporter implements Reporter {
  private ctx: Vitest | null = null;

  onInit(ctx: Vitest): void {
    this.ctx = ctx;
    rmSync(ROBUSTNESS_DIR, { recursive: true, force: true });
  }

  onTestRunEnd(): void {
    if (!existsSync(ROBUSTNESS_DIR)) return;
    const classes = readdirSync(ROBUSTNESS_DIR)
      .filter((f) => f.endsWith(".json"))
      .map((f) => JSON.parse(readFileSync(join(ROBUSTNESS_DIR, f), "utf8")) as RobustnessCounts)
      .sort((a, b) => a.name.localeCompare(b.name));
    if (classes.length === 0) return;
    const sum = (k: keyof Omit<RobustnessCounts, "name">) => classes.reduce((s, c) => s + (c[k] ?? 0), 0);
    const width = Math.max(...classes.map((c) => c.name.length));
    const lines = [
      "",
      `Robustness: ${n(sum("inputs"))} bad or hostile inputs in ${classes.length} classes, crashes ${n(sum("crashes"))}, hangs ${n(sum("hangs"))}, unlocated problems ${n(sum("unlocated"))}, prototype changes ${n(sum("prototypeChanges"))}, wrong outputs ${n(sum("wrongOutputs"))}`,
      ...classes.map(
        (c) =>
          `  ${c.name.padEnd(width)}  ${n(c.inputs).padStart(9)} inputs  crashes ${c.crashes}  hangs ${c.hangs}` +
          (c.unlocated + c.prototypeChanges + (c.wrongOutputs ?? 0) > 0 ? `  unlocated ${c.unlocated}  prototype changes ${c.prototypeChanges}  wrong outputs ${c.wrongOutputs ?? 0}` : ""),
      ),
      "",
    ];
    const log = (line: string) => (this.ctx ? this.ctx.logger.log(line) : process.stdout.write(`${line}\n`));
    lines.forEach(log);
  }
}
