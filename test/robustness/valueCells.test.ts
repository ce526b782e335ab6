/**
 * Robustness classes: every kind of value cell, through every reader that
 * takes one — worksheet cells given to the formulas, CSV fields streamed by the
 * command line, CSV read whole (cases as rows), JSON case files — and on to
 * every output (envelope, factored rows, governing rows). For every input: a
 * defined result of finite numbers, or located problems; never NaN or Infinity
 * in an output, never an exception. The command line runs in this process
 * (cliInProcess.ts); cliRepresentative.test.ts runs a few of each as a child.
 */
import fc from "fast-check";
import { describe } from "vitest";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { GOVERNING } from "../../src/functions/formulas/governingFormula.js";
import { fuzzClass, fuzzClassAsync } from "../fuzz/fuzzClass.js";
import { shown, type Verdict } from "../fuzz/robustness.js";
import { evaluateFormula } from "../functions/outcome.js";
import { numberText } from "../../src/cli/output/cells.js";
import { parse } from "csv-parse/sync";
import { columnsTable, csvText, csvValue, finiteNumber, nearLimit, numberLikeText, RULESET, tableRows, wordText, worksheetTable, worksheetValue, type TableSpec } from "./caseGenerators.js";
import { cliInProcess, errorLines, scratch } from "./cliInProcess.js";
import { plainEnvelopes, shippedRuleset } from "./plainEnvelope.js";
import { cliVerdict, envelopeCsvOutput, formulaVerdict } from "./verdicts.js";

const files = scratch("values");
const RULESET_CELL = [[RULESET]];

/** A range's address at Loads!A1 for its size, as Excel hands it to a formula. */
function address(rows: number, columns: number): string {
  let n = columns;
  let letters = "";
  while (n > 0) {
    letters = String.fromCharCode(65 + ((n - 1) % 26)) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return `Loads!A1:${letters}${rows}`;
}

const combine = (...verdicts: Verdict[]): Verdict => ({
  located: verdicts.every((v) => v.located),
  wrongOutput: verdicts.map((v) => v.wrongOutput).find((w) => w) ?? null,
});

describe("value cells in a worksheet", () => {
  fuzzClass(
    "value cells: worksheet cells of every kind (LW.ENVELOPE, LW.FACTORED, LW.GOVERNING)",
    0.03,
    worksheetTable(worksheetValue),
    (table) => {
      const where = [address(table.length, table[0].length), "Loads!H1"];
      return combine(
        formulaVerdict(evaluateFormula(ENVELOPE, [table, RULESET_CELL, null, null], where), "Loads"),
        formulaVerdict(evaluateFormula(FACTORED, [table, RULESET_CELL, null, null], where), "Loads"),
        formulaVerdict(evaluateFormula(GOVERNING, [table, RULESET_CELL, [[`max [${String(table[1][0] ?? "").trim() || "row 2"}]`]], null, null], [...where, "Loads!J1"]), "Loads"),
      );
    },
    (t) => JSON.stringify(t),
  );
});

/** A cases-as-columns CSV file of value fields, run through `envelope` (streamed). */
async function streamed(t: TableSpec): Promise<Verdict> {
  const file = files.file("csv", csvText(tableRows(t)));
  const run = await cliInProcess(["envelope", file, "--ruleset", RULESET, "--format", "csv", "--threads", "1"]);
  return cliVerdict(run, file, envelopeCsvOutput);
}

/** The same values with cases as rows (a reactions table), read whole: `factored` and `envelope`. */
async function whole(t: TableSpec): Promise<Verdict> {
  const rows = tableRows(t);
  const width = Math.max(...rows.map((r) => r.length));
  const transposed = Array.from({ length: width }, (_, c) => rows.map((r) => r[c] ?? ""));
  transposed[0][0] = "";
  const file = files.file("csv", csvText(transposed));
  const factored = await cliInProcess(["factored", file, "--ruleset", RULESET, "--format", "csv", "--layout", "rows"]);
  const envelope = await cliInProcess(["envelope", file, "--ruleset", RULESET, "--format", "csv", "--layout", "rows"]);
  return combine(cliVerdict(factored, file), cliVerdict(envelope, file, envelopeCsvOutput));
}

/** A JSON value for a cell: numbers written as the text a file holds (1e400, -0, 5e-324), strings, booleans, null. */
const jsonCell: fc.Arbitrary<string> = fc.oneof(
  { weight: 6, arbitrary: finiteNumber.map((n) => (Object.is(n, -0) ? "-0" : JSON.stringify(n))) },
  { weight: 1, arbitrary: fc.constantFrom("1e400", "-1e400", "1e-400", "5e-324", "-0", "1.7976931348623157e308", "1E308") },
  { weight: 1, arbitrary: fc.oneof(numberLikeText, wordText).map((s) => JSON.stringify(s)) },
  { weight: 1, arbitrary: fc.constantFrom("true", "false", "null", "[]", "{}", '{"__proto__": 1}', "[1, 2]") },
);

async function jsonFile(t: TableSpec): Promise<Verdict> {
  const rows = [
    ["result", ...t.headers].map((h) => JSON.stringify(h)),
    ...t.ids.map((id, r) => [JSON.stringify(id), ...t.values[r]]),
  ];
  const file = files.file("json", `[\n${rows.map((r) => `  [${r.join(", ")}]`).join(",\n")}\n]\n`);
  const run = await cliInProcess(["envelope", file, "--ruleset", RULESET, "--format", "csv"]);
  return cliVerdict(run, file, envelopeCsvOutput);
}

const describeTable = (t: TableSpec) => shown(csvText(tableRows(t)));

describe("value cells in files", () => {
  fuzzClassAsync("value cells: CSV fields of every kind, streamed (envelope)", 0.02, columnsTable(csvValue), streamed, describeTable);
  fuzzClassAsync("value cells: CSV fields of every kind, cases as rows read whole (factored, envelope)", 0.02, columnsTable(csvValue), whole, describeTable);
  fuzzClassAsync("value cells: JSON case files of every kind (envelope)", 0.02, columnsTable(jsonCell), jsonFile, describeTable);
});

/**
 * Numbers only, near the largest double: the envelope must be the plain one
 * (every row summed on its own) wherever every row is finite, and refused —
 * naming the first result that has a row without a finite value — otherwise.
 */
describe("numbers near the largest double", () => {
  const ruleset = shippedRuleset(RULESET);

  fuzzClass(
    "value cells: numbers near the largest double in a worksheet (LW.ENVELOPE against every row summed)",
    0.02,
    worksheetTable(nearLimit),
    (table) => {
      const verdict = formulaVerdict(evaluateFormula(ENVELOPE, [table, RULESET_CELL, null, null], [address(table.length, table[0].length), "Loads!H1"]), "Loads");
      const outcome = evaluateFormula(ENVELOPE, [table, RULESET_CELL, null, null]);
      const plain = plainEnvelopes(ruleset, table, false);
      if (!plain) return { located: verdict.located, wrongOutput: outcome.ok ? "a table the core refuses gave a result" : null };
      const firstBad = plain.find((p) => p.envelope.notFinite);
      if (firstBad) {
        const said = outcome.ok ? "" : outcome.message;
        return { located: verdict.located, wrongOutput: said.includes(`${JSON.stringify(firstBad.id)} has no finite value in row`) ? null : `not refused for ${firstBad.id}: ${said || "a result"}` };
      }
      if (!outcome.ok) return { located: verdict.located, wrongOutput: `refused: ${outcome.message}` };
      const rows = outcome.value.slice(2);
      const wrong = plain.find((p, k) => p.envelope.notFinite || rows[k][1] !== p.envelope.max || rows[k][3] !== p.envelope.min);
      return { located: verdict.located, wrongOutput: wrong ? `${wrong.id}: ${JSON.stringify(rows)} against ${JSON.stringify(wrong.envelope)}` : null };
    },
    (t) => JSON.stringify(t),
  );

  fuzzClassAsync(
    "value cells: numbers near the largest double in a CSV file, streamed (envelope against every row summed)",
    0.02,
    columnsTable(nearLimit.map((n) => String(n)), { oddHeaders: false }),
    async (t) => {
      const file = files.file("csv", csvText(tableRows(t)));
      // Cases as columns, said: a result id that happens to be a load symbol ("S") would make the layout a guess.
      const run = await cliInProcess(["envelope", file, "--ruleset", RULESET, "--format", "csv", "--threads", "1", "--layout", "columns"]);
      const verdict = cliVerdict(run, file, envelopeCsvOutput);
      if (verdict.wrongOutput) return verdict;
      const plain = plainEnvelopes(ruleset, parse(csvText(tableRows(t))) as string[][], true);
      if (!plain) return verdict;
      const written = (parse(run.stdout || "x") as string[][]).slice(1);
      // Rows before the first refused one are written as the plain envelope gives them; then the refusal names that row.
      for (let k = 0; k < plain.length; k++) {
        const p = plain[k];
        if (p.envelope.notFinite) {
          const said = errorLines(run.stderr)[0] ?? "";
          const ok = run.status === 1 && written.length === k && said.includes(`: ${JSON.stringify(p.id)} has no finite value in row`);
          return { ...verdict, wrongOutput: ok ? null : `not refused at ${p.id} (row ${k + 1}): ${said || "no error"}` };
        }
        const w = written[k];
        if (!w || w[1] !== numberText(p.envelope.max) || w[3] !== numberText(p.envelope.min)) return { ...verdict, wrongOutput: `${p.id}: wrote ${JSON.stringify(w)} against ${JSON.stringify(p.envelope)}` };
      }
      return run.status === 0 ? verdict : { ...verdict, wrongOutput: `refused a table whose every row is finite: ${run.stderr}` };
    },
    describeTable,
  );
});
