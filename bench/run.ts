/**
 * `npm run bench`: the engine's speed on analysis exports, as ratios measured in
 * one run (the machine is shared; absolute times vary with its load). For each
 * ruleset — asce7-16-strength (wind one-way, seismic x and y orthogonal) and
 * en1990-str-6.10 (four variable actions) — on generated exports of 200,000
 * and 1,000,000 rows with 16 cases (values INVENTED, fixed seed):
 *
 *   1. the compiled engine's envelope over values already in typed arrays;
 *   2. a plain reference that lists every concrete row and reduces (results checked);
 *   3. the read-once floor: parsing every value of the file, as tightly as Node allows;
 *   4. the whole command line on the CSV file, as a child process, with peak memory;
 * then (5) one formula call (LW.ENVELOPE) for a 20-case × 12-component table with the
 * largest shipped ruleset, cold and with its plan kept, and the memory of the ids a
 * streamed file of 1,000,000 rows keeps. Each figure is the median of several runs.
 *
 *   npm run bench                 200,000 and 1,000,000 rows
 *   npm run bench -- 50000        other sizes (the first is used for 1 and 2)
 */
import { spawn } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import {
  blockExtremesEvaluator,
  compiledPlanOf,
  EMPTY_CASE_MAP,
  extremesBlock,
  extremesEvaluator,
  type BlockExtremesEvaluator,
  findShippedRuleset,
  planForTable,
  readCaseMap,
  resultRowReader,
  type CaseTable,
  type Plan,
} from "../src/core/index.js";
import { ASCE_CASES, EN1990_CASES, writeExport } from "./exports.js";
import { formulaTimes } from "./formulaCall.js";
import { parserTimes } from "./parsers.js";
import { factorMatrix, plainEnvelope } from "./plainReference.js";
import { readOnceFloor } from "./readOnceFloor.js";

const BIN = fileURLToPath(new URL("../../../bin/loadwright.js", import.meta.url));
const PEAK = pathToFileURL(fileURLToPath(new URL("./peakMemory.js", import.meta.url))).href;

interface RulesetSet {
  ruleset: string;
  cases: readonly string[];
  params: Record<string, number>;
  map: string[][];
  note: string;
}

const SETS: RulesetSet[] = [
  { ruleset: "asce7-16-strength", cases: ASCE_CASES, params: { SDS: 1.0 }, map: [["W", "one-way"], ["E", "orthogonal"]], note: "SDS = 1.0; wind one-way, E:x/E:y orthogonal" },
  { ruleset: "en1990-str-6.10", cases: EN1990_CASES, params: {}, map: [], note: "four variable actions Q, S, T, W" },
];

/** Result rows evaluated at a time, as the command line's batches give them. */
const BLOCK_ROWS = 1024;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Median milliseconds of `runs` calls of f. */
function timed(runs: number, f: () => void): number {
  const times: number[] = [];
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    f();
    times.push(performance.now() - t0);
  }
  return median(times);
}

const out = (line = "") => process.stdout.write(`${line}\n`);
const ms = (t: number) => (t >= 100 ? t.toFixed(0) : t >= 1 ? t.toFixed(1) : t.toFixed(3));
const ratio = (a: number, b: number) => `${(a / b).toFixed(a / b >= 10 ? 0 : 2)}×`;

function planFor(set: RulesetSet): Plan {
  const shipped = findShippedRuleset(set.ruleset);
  if (!shipped) throw new Error(`${set.ruleset} is not shipped`);
  const map = set.map.length > 0 ? readCaseMap(set.map, shipped.ruleset) : { ok: true as const, value: EMPTY_CASE_MAP };
  if (!map.ok) throw new Error("case map refused");
  const cases = set.cases.map((header) => ({ header, symbol: header.split(":")[0] }));
  const shape: CaseTable = { orientation: "columns", cases, components: [], values: [], map: map.value };
  const plan = planForTable(shipped.ruleset, set.params, shape);
  if (!plan.ok) throw new Error(`plan refused: ${JSON.stringify(plan.problems)}`);
  return plan.value;
}

/** The command line as a child process: seconds, CPU seconds (user and system) and peak resident memory (MB). */
async function commandLine(args: string[], dir: string): Promise<{ seconds: number; cpu: number; peakMb: number }> {
  const rssFile = join(dir, "rss.txt");
  rmSync(rssFile, { force: true });
  const started = process.hrtime.bigint();
  const child = spawn(process.execPath, ["--import", PEAK, BIN, ...args], { stdio: ["ignore", "ignore", "pipe"], env: { ...process.env, LOADWRIGHT_BENCH_RSS_FILE: rssFile } });
  let stderr = "";
  child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
  const status = await new Promise<number | null>((resolve) => child.on("close", resolve));
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  if (status !== 0) throw new Error(`loadwright ${args.join(" ")} failed (${status}): ${stderr.split("\n").filter((l) => l.includes("error")).join(" ")}`);
  const usage = JSON.parse(readFileSync(rssFile, "utf8")) as { maxRss: number; cpu: number };
  return { seconds, cpu: usage.cpu / 1e6, peakMb: usage.maxRss / 1024 };
}

async function main(): Promise<void> {
  const sizes = process.argv.slice(2).map(Number).filter((n) => Number.isInteger(n) && n > 0);
  const [small, large] = sizes.length >= 2 ? sizes : sizes.length === 1 ? [sizes[0], sizes[0]] : [200_000, 1_000_000];
  const dir = mkdtempSync(join(tmpdir(), "loadwright-bench-"));
  const summary: string[] = [];
  try {
    for (const set of SETS) {
      const plan = planFor(set);
      const compiled = compiledPlanOf(plan);
      out(`== ${set.ruleset} (${set.note}): ${set.cases.length} cases, ${plan.rowCount.toLocaleString("en-US")} concrete rows; compiled: ${compiled.optionCount} distinct options, ${compiled.termCount} distinct terms, ${compiled.branchCount} branches`);
      const mapFile = join(dir, `${set.ruleset}-map.csv`);
      writeFileSync(mapFile, set.map.map((r) => r.join(",")).join("\n") + "\n");
      const files = new Map<number, string>();
      for (const rows of new Set([small, large])) {
        const file = join(dir, `${set.ruleset}-${rows}.csv`);
        await writeExport(file, set.cases, rows);
        files.set(rows, file);
      }
      const smallFile = files.get(small) as string;
      const largeFile = files.get(large) as string;

      // 3. The read-once floor, and the values in a typed array for 1 and 2.
      const values = new Float64Array(small * set.cases.length);
      readOnceFloor(smallFile, values);
      const floorSmall = timed(5, () => readOnceFloor(smallFile));
      const floorLarge = timed(3, () => readOnceFloor(largeFile));

      // 1. The engine over typed arrays: the block evaluator as the command line calls it (rows named), the same
      //    without naming rows, and the compiled plan's row-by-row evaluator it replaced there.
      const cases = set.cases.length;
      const block = blockExtremesEvaluator(compiled);
      const found = extremesBlock(compiled, BLOCK_ROWS);
      let sink = 0;
      const blockRun = (rows: boolean) => () => {
        for (let i = 0; i < small; i += BLOCK_ROWS) {
          const n = Math.min(BLOCK_ROWS, small - i);
          if (block.evaluate(values.subarray(i * cases, (i + n) * cases), n, found, rows) !== n) throw new Error("a row of the export is not finite");
          sink += found.maxValue[0] + found.maxRow[0];
        }
      };
      const engine = timed(7, blockRun(true));
      const engineBare = timed(7, blockRun(false));
      const evaluator = extremesEvaluator(compiled);
      const rowByRow = timed(7, () => {
        for (let i = 0; i < small; i++) sink += (evaluator.evaluateAt(values, i * cases) as { maxValue: number }).maxValue;
      });

      // 2. The plain reference, on a sample of rows where the full file would take long; checked against the engine.
      const matrix = factorMatrix(plan);
      const sample = Math.min(small, Math.max(2000, Math.floor(4e8 / (matrix.rows * set.cases.length))));
      const reference = plainEnvelope(matrix, values, sample);
      const referenceTime = (timed(3, () => plainEnvelope(matrix, values, sample)) * small) / sample;
      const check = compareWithReference(block, reference, matrix, values, sample);

      // 4. The whole command line.
      const args = (file: string) => ["envelope", file, "--ruleset", set.ruleset, ...Object.entries(set.params).flatMap(([k, v]) => ["--param", `${k}=${v}`]), ...(set.map.length > 0 ? ["--map", mapFile] : []), "--format", "csv"];
      const cliRuns = async (file: string, runs: number, threads = "1") => {
        const measured = [];
        for (let k = 0; k < runs; k++) measured.push(await commandLine([...args(file), "--threads", threads], dir));
        return { seconds: median(measured.map((m) => m.seconds)), cpu: median(measured.map((m) => m.cpu)), peakMb: Math.max(...measured.map((m) => m.peakMb)) };
      };
      const cliSmall = await cliRuns(smallFile, 3);
      const cliLarge = large === small ? cliSmall : await cliRuns(largeFile, 3);
      const cliLargeTwo = await cliRuns(largeFile, 3, "2");

      // CSV readers on the same file: the general one (csv-parse), the byte scanner, and candidates if installed.
      const parsers = await parserTimes(smallFile, set.cases.length);

      const mb = (f: string) => (statSync(f).size / 1e6).toFixed(1);
      out(`  1. engine envelope, typed arrays   ${small.toLocaleString("en-US")} rows: ${ms(engine)} ms (${((engine / small) * 1e6).toFixed(0)} ns a row)`);
      out(`     without naming the rows          ${ms(engineBare)} ms (${ratio(referenceTime, engineBare)} faster than the plain reference)`);
      out(`     row by row (the compiled plan)   ${ms(rowByRow)} ms (${ratio(referenceTime, rowByRow)} faster than the plain reference; the block evaluator ${ratio(rowByRow, engine)} as fast)`);
      out(`  2. plain reference (every row)     ${small.toLocaleString("en-US")} rows: ${ms(referenceTime)} ms (from ${sample.toLocaleString("en-US")} rows; ${check})`);
      out(`  3. read-once floor                 ${small.toLocaleString("en-US")} rows (${mb(smallFile)} MB): ${ms(floorSmall)} ms; ${large.toLocaleString("en-US")} rows (${mb(largeFile)} MB): ${ms(floorLarge)} ms`);
      const cliText = (m: typeof cliSmall) => `${m.seconds.toFixed(2)} s (CPU ${m.cpu.toFixed(2)} s), peak ${m.peakMb.toFixed(0)} MB`;
      out(`  4. command line, envelope (csv)    ${small.toLocaleString("en-US")} rows: ${cliText(cliSmall)}; ${large.toLocaleString("en-US")} rows: ${cliText(cliLarge)}`);
      out(`     on two threads (--threads 2)    ${large.toLocaleString("en-US")} rows: ${cliText(cliLargeTwo)}; ${ratio(cliLarge.seconds, cliLargeTwo.seconds)} faster than one`);
      out(`     CSV readers on ${small.toLocaleString("en-US")} rows, every value to a double:`);
      for (const p of parsers) out(`       ${p.name.padEnd(34)} ${p.ms === null ? p.note : `${ms(p.ms)} ms (${ratio(p.ms, floorSmall)} the floor)${p.note ? `; ${p.note}` : ""}`}`);
      out(`  ratios: engine ${ratio(referenceTime, engine)} faster than the plain reference (target ≥ 20×); engine ${ratio(engine, floorSmall)} the floor (target ≤ 3×);`);
      out(`          command line ${ratio(cliLarge.seconds * 1000, floorLarge)} the floor on ${large.toLocaleString("en-US")} rows, ${ratio(cliLargeTwo.seconds * 1000, floorLarge)} on two threads (target ≤ 1.5×; in CPU time ${ratio(cliLarge.cpu * 1000, floorLarge)}), peak ${Math.max(cliLarge.peakMb, cliLargeTwo.peakMb).toFixed(0)} MB (target < 300 MB)`);
      out();
      summary.push(
        `${set.ruleset}: engine ${ratio(referenceTime, engine)} the reference's speed, ${ratio(engine, floorSmall)} the floor; command line ${ratio(cliLarge.seconds * 1000, floorLarge)} the floor (CPU ${ratio(cliLarge.cpu * 1000, floorLarge)}), on two threads ${ratio(cliLargeTwo.seconds * 1000, floorLarge)}; ${Math.max(cliLarge.peakMb, cliLargeTwo.peakMb).toFixed(0)} MB`,
      );
      if (sink === 42) out(); // keep the engine's work observable
      for (const f of files.values()) rmSync(f, { force: true });
    }

    // 5. One formula call.
    const formula = formulaTimes();
    out(`== one formula call: LW.ENVELOPE, ${formula.table}, ${formula.ruleset} (${formula.rows} concrete rows)`);
    out(`  cold (nothing kept): ${ms(formula.cold)} ms (target < 2 ms); plan kept: ${ms(formula.cached)} ms (target < 0.2 ms); ${ratio(formula.cold, formula.cached)}`);
    out();

    // The ids a streamed file keeps to refuse a repeated one.
    const ids = await idMemory(large);
    out(`== ids kept while streaming ${large.toLocaleString("en-US")} rows (to refuse an id given twice): ${ids.toFixed(0)} MB of heap and typed arrays`);
    out();
    out("Summary (ratios of medians in this run):");
    for (const line of summary) out(`  ${line}`);
    out(`  formula call: cold ${ms(formula.cold)} ms, plan kept ${ms(formula.cached)} ms`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Engine against reference on the sample: max and min within 1e-12 (the reference sums each row
 * in case order, the engine term by term), and the same rows named — or, where a different row is
 * named, one whose value (as the reference sums it) ties with the reference's within 1e-12.
 */
function compareWithReference(
  evaluator: BlockExtremesEvaluator,
  reference: ReturnType<typeof plainEnvelope>,
  matrix: ReturnType<typeof factorMatrix>,
  values: Float64Array,
  sample: number,
): string {
  const found = extremesBlock(evaluator.compiled, sample);
  if (evaluator.evaluate(values, sample, found, true) !== sample) throw new Error("a row of the export is not finite");
  const cases = matrix.cases;
  const close = (a: number, b: number) => Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(a), Math.abs(b));
  const rowValue = (row: number, i: number) => {
    let v = 0;
    for (let k = 0; k < cases; k++) v += matrix.factors[row * cases + k] * values[i * cases + k];
    return v;
  };
  let sameRows = 0;
  let tied = 0;
  for (let i = 0; i < sample; i++) {
    if (!close(found.maxValue[i], reference.max[i]) || !close(found.minValue[i], reference.min[i])) throw new Error(`engine and reference differ on result row ${i + 1}`);
    const maxRow = found.maxRow[i];
    const minRow = found.minRow[i];
    if (maxRow === reference.maxRow[i] && minRow === reference.minRow[i]) sameRows++;
    else if (close(rowValue(maxRow, i), reference.max[i]) && close(rowValue(minRow, i), reference.min[i])) tied++;
    else throw new Error(`engine names a row that does not give the extreme on result row ${i + 1}`);
  }
  return `max and min equal to 1e-12 on every row; the same rows named on ${sameRows.toLocaleString("en-US")} of ${sample.toLocaleString("en-US")}, ties within 1e-12 on ${tied.toLocaleString("en-US")}`;
}

/** Memory (heap and typed arrays' buffers) held by a result-row reader after claiming `rows` ids like the exports' ("M1234 s3 Vz"). */
async function idMemory(rows: number): Promise<number> {
  const gc = (globalThis as { gc?: () => void }).gc;
  // What the earlier measurements left is let go first (buffers outside the heap are freed after a collection, a turn later).
  for (let k = 0; k < 3; k++) {
    gc?.();
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
  const held = () => {
    const m = process.memoryUsage();
    return m.heapUsed + m.arrayBuffers;
  };
  const before = held();
  const reader = resultRowReader([{ header: "D", symbol: "D" }]);
  const components = ["N", "Vy", "Vz", "T", "My", "Mz"];
  for (let i = 0; i < rows; i++) reader.claim(`M${Math.floor(i / 30) + 1} s${Math.floor(i / 6) % 5} ${components[i % 6]}`, i + 1);
  gc?.();
  const kept = (held() - before) / 1e6;
  if (reader.idCount !== rows) throw new Error("ids lost");
  return kept;
}

await main();
