/**
 * The core's count of what each formula spills (core/evaluate/resultSizes.ts),
 * which the task pane lays its starter block out by, held to what the
 * formulas return: any difference would let one spill run into another.
 */
import { beforeAll, describe, expect, test } from "vitest";
import { loadRuleset, planForTable, readCaseTable, resultSizes, shippedRulesets, type Cell, type RulesetFile } from "../../src/core/index.js";
import { FORMULAS_BY_ID } from "../../src/functions/functions.js";
import { SEISMIC_FIXTURE, STRENGTH_FIXTURE } from "./fixtures.js";
import { testWorkbook, value, type TestWorkbook } from "./outcome.js";

let workbook: TestWorkbook;
beforeAll(async () => {
  workbook = testWorkbook();
  expect((await workbook.store.save(STRENGTH_FIXTURE)).ok).toBe(true);
  expect((await workbook.store.save(SEISMIC_FIXTURE)).ok).toBe(true);
});

function sizesFor(file: RulesetFile, table: Cell[][], params: Record<string, number>, criteria: number | null) {
  const ruleset = loadRuleset(file);
  if (!ruleset.ok) throw new Error("does not load");
  const cases = readCaseTable(table, ruleset.value);
  if (!cases.ok) throw new Error("does not read");
  const plan = planForTable(ruleset.value, params, cases.value);
  if (!plan.ok) throw new Error("no plan");
  return resultSizes(plan.value, cases.value, criteria);
}

const shape = (cells: unknown[][]) => ({ rows: cells.length, columns: cells[0].length });

// Each table is invented for the test except the column of the steel design examples (PD = 140, PL = 420 [confirmed]).
const CASES: { name: string; file: RulesetFile; table: Cell[][]; params: Cell[][] | null; given: Record<string, number>; criteria: Cell[][] | null }[] = [
  { name: "the steel column, with loads the table lacks (notes below the numbers)", file: STRENGTH_FIXTURE, table: [["", "P"], ["D", 140], ["L", 420]], params: null, given: {}, criteria: [["max P"], ["min P"]] },
  { name: "a reactions table with wind from two directions, criteria omitted", file: STRENGTH_FIXTURE, table: [["", "P", "V", "M"], ["D", 140, 2, 10], ["L", 420, 5, 12], ["W:N", -50, 10, 30], ["W:E", 20, -8, 25]], params: null, given: {}, criteria: null },
  { name: "cases as columns with a seismic case and SDS given", file: SEISMIC_FIXTURE, table: [["result", "D", "L", "E"], ["C1", 100, 40, 25], ["C2", 80, 30, -35]], params: [["SDS", 1.0], ["rho", 1.3]], given: { SDS: 1.0, rho: 1.3 }, criteria: [["max C1"]] },
];

describe("resultSizes", () => {
  test.each(CASES)("counts what each formula spills: $name", ({ file, table, params, given, criteria }) => {
    const sizes = sizesFor(file, table, given, criteria === null ? null : criteria.length);
    const run = (id: keyof typeof FORMULAS_BY_ID, raws: unknown[]) => shape(value(workbook.evaluateFormula(FORMULAS_BY_ID[id], raws)));
    expect(run("RULESET", [file.id])).toEqual(sizes.ruleset);
    expect(run("ENVELOPE", [table, file.id, params, null])).toEqual(sizes.envelope);
    expect(run("GOVERNING", [table, file.id, criteria, params, null])).toEqual(sizes.governing);
    expect(run("FACTORED", [table, file.id, params, null])).toEqual(sizes.factored);
    expect(run("COMBOS", [file.id, params, table])).toEqual(sizes.combos);
  });

  test("counts by hand for the steel column: stamp, header, one component and three notes", () => {
    // Combinations 4 and 5 of ASCE/SEI 7-16 §2.3.1 need a wind case (W!), so each is a note; Lr, S, R and W have no
    // case, one note more (docs/formulas.md: stamp row, header row, one row per result, a note row per omission).
    const sizes = sizesFor(STRENGTH_FIXTURE, [["", "P"], ["D", 140], ["L", 420]], {}, 2);
    expect(sizes.envelope).toEqual({ rows: 2 + 1 + 3, columns: 5 });
    expect(sizes.governing).toEqual({ rows: 2 + 2 + 3, columns: 3 + 1 });
  });

  test("counts a shipped ruleset's combination list", () => {
    const shipped = shippedRulesets().find((s) => s.id === "asce7-16-strength");
    if (!shipped) throw new Error("not shipped");
    const table: Cell[][] = [["", "P"], ["D", 140], ["L", 420], ["S", 30]];
    const sizes = sizesFor(shipped.ruleset.file, table, {}, null);
    expect(shape(value(workbook.evaluateFormula(FORMULAS_BY_ID.COMBOS, ["asce7-16-strength", null, table])))).toEqual(sizes.combos);
  });
});
