/**
 * `npm run bench`: the command line on generated analysis exports of growing
 * size (cases as columns, INVENTED numbers), measuring wall time, rows per
 * second and peak resident memory of the child process. Streaming is right
 * when peak memory stays flat as the row count grows; the target is a
 * 1,000,000-row envelope in well under 1 GB.
 *
 *   npm run bench                  100k and 1M rows
 *   npm run bench -- 20000 200000  other sizes
 */
import { spawn } from "node:child_process";
import { createWriteStream, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const BIN = fileURLToPath(new URL("../../../bin/loadwright.js", import.meta.url));
const PEAK = pathToFileURL(fileURLToPath(new URL("./peakMemory.js", import.meta.url))).href;
const CASES = ["D", "L", "Lr", "S", "W:0", "W:90", "W:180", "W:270", "E:x", "E:y"];
const COMPONENTS = ["N", "Vy", "Vz", "T", "My", "Mz"];

/** A small deterministic generator, so every run reads the same invented file. */
function generator(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

async function writeExport(path: string, rows: number): Promise<void> {
  const random = generator(rows);
  const out = createWriteStream(path);
  const write = (text: string) => (out.write(text) ? Promise.resolve() : new Promise<void>((r) => out.once("drain", () => r())));
  await write(`result,${CASES.join(",")}\n`);
  let chunk = "";
  for (let i = 0; i < rows; i++) {
    const member = Math.floor(i / (COMPONENTS.length * 5)) + 1;
    const station = Math.floor(i / COMPONENTS.length) % 5;
    const id = `M${member} s${station} ${COMPONENTS[i % COMPONENTS.length]}`;
    const values = CASES.map((_, k) => ((random() - (k < 4 ? 0.2 : 0.5)) * 200).toFixed(2));
    chunk += `${id},${values.join(",")}\n`;
    if (chunk.length > 1 << 16) {
      await write(chunk);
      chunk = "";
    }
  }
  await write(chunk);
  await new Promise<void>((resolve, reject) => out.end((e?: Error | null) => (e ? reject(e) : resolve())));
}

interface Measured {
  seconds: number;
  peakMb: number;
}

async function measure(args: string[], dir: string): Promise<Measured> {
  const rssFile = join(dir, "rss.txt");
  rmSync(rssFile, { force: true });
  const started = process.hrtime.bigint();
  const child = spawn(process.execPath, ["--import", PEAK, BIN, ...args], {
    stdio: ["ignore", "ignore", "pipe"],
    env: { ...process.env, LOADWRIGHT_BENCH_RSS_FILE: rssFile },
  });
  let stderr = "";
  child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
  const status = await new Promise<number | null>((resolve) => child.on("close", resolve));
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  if (status !== 0) throw new Error(`loadwright ${args.join(" ")} failed (${status}): ${stderr.split("\n").filter((l) => l.includes("error")).join(" ")}`);
  return { seconds, peakMb: Number(readFileSync(rssFile, "utf8")) / 1024 };
}

async function main(): Promise<void> {
  const sizes = process.argv.slice(2).map(Number).filter((n) => Number.isInteger(n) && n > 0);
  const rowsList = sizes.length > 0 ? sizes : [100_000, 1_000_000];
  const dir = mkdtempSync(join(tmpdir(), "loadwright-bench-"));
  const common = ["--ruleset", "asce7-16-strength", "--param", "SDS=0.5", "--format", "csv"];
  const lines: string[] = [];
  const row = (cells: string[]) => lines.push(cells.map((c, i) => (i === 0 ? c.padEnd(10) : c.padStart(12))).join(" "));
  row(["command", "rows", "file MB", "seconds", "rows/s", "peak MB"]);
  process.stdout.write(`${lines[0]}\n`);
  try {
    for (const rows of rowsList) {
      const file = join(dir, `export-${rows}.csv`);
      await writeExport(file, rows);
      const mb = statSync(file).size / 1e6;
      const runs: [string, string[]][] = [
        ["envelope", ["envelope", file, ...common]],
        ["governing", ["governing", file, ...common, "--criterion", "max [M1 s0 N]", "--criterion", "min [M1 s0 N]"]],
      ];
      for (const [name, args] of runs) {
        const m = await measure(args, dir);
        row([name, rows.toLocaleString("en-US"), mb.toFixed(1), m.seconds.toFixed(1), Math.round(rows / m.seconds).toLocaleString("en-US"), m.peakMb.toFixed(0)]);
        process.stdout.write(`${lines.at(-1)}\n`);
      }
      rmSync(file, { force: true });
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  process.stdout.write(
    `\nInvented exports: ${CASES.length} cases as columns, ruleset asce7-16-strength (SDS = 0.5), output to /dev/null.\n` +
      "governing reads the file twice (choose the rows, then write every result's concurrent values).\n",
  );
}

await main();
