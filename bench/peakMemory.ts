/**
 * Loaded with `node --import` in front of the command line by the benchmark:
 * at exit, writes the process's peak resident memory (kB) and the CPU time it
 * used (microseconds, user and system) to the file named by
 * LOADWRIGHT_BENCH_RSS_FILE. Not part of the command line itself.
 */
import { writeFileSync } from "node:fs";

const target = process.env.LOADWRIGHT_BENCH_RSS_FILE;
if (target) {
  process.on("exit", () => {
    const usage = process.resourceUsage();
    writeFileSync(target, JSON.stringify({ maxRss: usage.maxRSS, cpu: usage.userCPUTime + usage.systemCPUTime }));
  });
}
