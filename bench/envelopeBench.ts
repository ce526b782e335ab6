/**
 * `npm run bench` (first part): the engine's envelope found term by term
 * against the same envelope by listing every concrete row, on the shipped
 * ASCE/SEI 7-16 strength ruleset with 12 wind directions each way and two
 * seismic directions under the orthogonal rule. Case values are INVENTED
 * (a deterministic generator); only the timings matter.
 */
import { enumerateRows, envelopeOf, findShippedRuleset, planForTable, readCaseMap, readCaseTable, rowValue, type Cell } from "../src/core/index.js";

const HEADERS = ["D", "L", "Lr", "S", "R", "H", ...Array.from({ length: 12 }, (_, k) => `W:${k * 30}`), "E:x", "E:y"];
const RESULTS = 2000;

function main(): void {
  const shipped = findShippedRuleset("asce7-16-strength");
  if (!shipped) throw new Error("asce7-16-strength is not shipped");
  const ruleset = shipped.ruleset;
  let seed = 12345;
  const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 200 - 100;
  const matrix: Cell[][] = [["result", ...HEADERS], ...Array.from({ length: RESULTS }, (_, r) => [`R${r + 1}`, ...HEADERS.map(() => Math.round(random() * 10) / 10)])];
  const map = readCaseMap([["E", "orthogonal"]], ruleset);
  if (!map.ok) throw new Error("case map refused");
  const table = readCaseTable(matrix, ruleset, { map: map.value });
  if (!table.ok) throw new Error("table refused");
  const plan = planForTable(ruleset, { SDS: 1.0, rho: 1.3 }, table.value);
  if (!plan.ok) throw new Error("plan refused");
  const p = plan.value;

  let t0 = performance.now();
  let fastCheck = 0;
  for (let r = 0; r < RESULTS; r++) fastCheck += envelopeOf(p, table.value.components[r], table.value.values[r])?.max.value ?? 0;
  const fast = performance.now() - t0;

  t0 = performance.now();
  const rows = [...enumerateRows(p)];
  let bruteCheck = 0;
  for (let r = 0; r < RESULTS; r++) {
    let max = -Infinity;
    for (const ref of rows) max = Math.max(max, rowValue(p, ref, table.value.values[r]));
    bruteCheck += max;
  }
  const brute = performance.now() - t0;

  const same = Math.abs(fastCheck - bruteCheck) <= 1e-6 * Math.abs(bruteCheck);
  const out = [
    `envelope, asce7-16-strength, ${HEADERS.length} cases, ${p.rowCount} concrete rows, ${RESULTS} results (invented values)`,
    `  term by term : ${fast.toFixed(0)} ms (${((RESULTS / fast) * 1000).toFixed(0)} results/s)`,
    `  every row    : ${brute.toFixed(0)} ms (${((RESULTS / brute) * 1000).toFixed(0)} results/s)`,
    `  ratio        : ${(brute / fast).toFixed(1)}× faster, maxima ${same ? "identical" : "DIFFERENT"}`,
  ];
  process.stdout.write(`${out.join("\n")}\n`);
  if (!same) process.exitCode = 1;
}

main();
