/**
 * Formulas keep plans (and rulesets typed in cells) between calls. Excel
 * recalculates many formulas at once, interleaving their calls; whatever the
 * order, each must give what it gives alone with nothing kept, and the cache
 * must stay within its bound. The expected tables here are the formulas' own
 * results computed one by one with every cache cleared first (a consistency
 * check of the cache, not of the numbers); one hand value anchors them: max P
 * = 1.2 × 140 + 1.6 × 420 = 840 under §2.3.1 (2) [confirmed, steel design
 * examples, as in envelope.test.ts].
 */
import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { describe, expect, test } from "vitest";
import { cachedPlanCount, clearPlanCache, clearTypedRulesets, findShippedRuleset, PLAN_CACHE_LIMIT, type RulesetFile } from "../../src/core/index.js";
import { ENVELOPE } from "../../src/functions/formulas/envelopeFormula.js";
import { EXPLAIN } from "../../src/functions/formulas/explainFormula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { GOVERNING } from "../../src/functions/formulas/governingFormula.js";
import type { Formula } from "../../src/functions/formula.js";
import type { Outcome } from "../../src/functions/runFormula.js";
import { COLUMN_TABLE, STRENGTH_FIXTURE, STRENGTH_ROWS } from "./fixtures.js";
import { evaluateFormula, rowOf, testWorkbook, value } from "./outcome.js";

const transpose = <T>(m: T[][]): T[][] => m[0].map((_, c) => m.map((r) => r[c]));

/** Column-table values invented for the test; ASCE 7-16 strength with seismic cases E:x, E:y. */
const EXPORT = [
  ["result", "D", "L", "W:N", "W:E", "E:x", "E:y"],
  ["C1 top", 140, 420, -50, 20, 30, -12],
  ["C1 bottom", 152, 420, -61, 26, 44, 9],
  ["B2 mid", 12, 30, 8, -8, 2, 1],
];

const CALLS: { formula: Formula; args: unknown[] }[] = [
  { formula: ENVELOPE, args: [COLUMN_TABLE, STRENGTH_ROWS, null, null] },
  { formula: ENVELOPE, args: [transpose(COLUMN_TABLE), STRENGTH_ROWS, null, null] },
  { formula: GOVERNING, args: [COLUMN_TABLE, STRENGTH_ROWS, [["max P"], ["min V"]], null, null] },
  { formula: FACTORED, args: [COLUMN_TABLE, STRENGTH_ROWS, null, null] },
  { formula: EXPLAIN, args: [COLUMN_TABLE, STRENGTH_ROWS, "2: 1.2D + 1.6L", "P", null] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=1.0", null] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=0.5; rho=1.0", null] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=1.0", [["E", "orthogonal"]]] },
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=1.0", [["W", "one-way"]]] },
  { formula: GOVERNING, args: [EXPORT, [["asce7-16-strength"]], [["max [C1 top]"], ["min [B2 mid]"]], "SDS=1.0", null] },
  // A parameter refused, and a typed ruleset with a mistake: problems are kept and given alike.
  { formula: ENVELOPE, args: [EXPORT, [["asce7-16-strength"]], "SDS=-1", null] },
  { formula: ENVELOPE, args: [COLUMN_TABLE, [...STRENGTH_ROWS, ["6", "1.2D + * L", "typed"]], null, null] },
];

function alone(call: (typeof CALLS)[number]): Outcome {
  clearPlanCache();
  clearTypedRulesets();
  return evaluateFormula(call.formula, call.args);
}

/** A pause of a few turns of the event loop, as between Excel's calls. */
async function pause(turns: number): Promise<void> {
  for (let k = 0; k < turns; k++) await new Promise((resolve) => setTimeout(resolve, 0));
}

describe("formulas with plans kept between calls", () => {
  test("give, called many at a time in any order, what each gives alone", async () => {
    const expected = CALLS.map(alone);
    expect(rowOf(value(expected[0]), "P")[1]).toBeCloseTo(840, 9);
    expect(expected.map((o) => o.ok)).toEqual([...CALLS.slice(0, -2).map(() => true), false, false]);
    clearPlanCache();
    clearTypedRulesets();
    // Five rounds of every call, started together, each after its own pause: calls of different
    // formulas and arguments interleave, and later rounds meet what earlier ones kept.
    const started: Promise<{ k: number; outcome: Outcome }>[] = [];
    for (let round = 0; round < 5; round++) {
      CALLS.forEach((call, k) => {
        started.push(
          (async () => {
            await pause((k * 7 + round * 3) % 5);
            return { k, outcome: evaluateFormula(call.formula, call.args) };
          })(),
        );
      });
    }
    for (const { k, outcome } of await Promise.all(started)) expect(outcome, `call ${k}`).toEqual(expected[k]);
  });

  test("keep at most the bounded number of plans, and still give the right table for a plan forgotten", () => {
    clearPlanCache();
    const first = evaluateFormula(ENVELOPE, [EXPORT, [["asce7-16-strength"]], "SDS=0.01", null]);
    for (let k = 2; k <= PLAN_CACHE_LIMIT + 20; k++) {
      evaluateFormula(ENVELOPE, [EXPORT, [["asce7-16-strength"]], `SDS=${k / 100}`, null]);
      expect(cachedPlanCount()).toBeLessThanOrEqual(PLAN_CACHE_LIMIT);
    }
    expect(cachedPlanCount()).toBe(PLAN_CACHE_LIMIT);
    expect(evaluateFormula(ENVELOPE, [EXPORT, [["asce7-16-strength"]], "SDS=0.01", null])).toEqual(first);
  });
});

/**
 * What a formula names can change between two calls while plans are kept: the
 * cells of a typed ruleset are edited, or a stored ruleset is replaced, approved
 * or removed from the workbook (the pane then asks Excel to recalculate). The
 * plan cache is keyed by the ruleset's fingerprint (and parameters and case
 * headers), so the next call must plan the new content and give what a fresh
 * workbook gives for it — never a plan made for the old one. Hand values from
 * the column of the steel design examples, PD = 140, PL = 420 [confirmed, steel
 * design examples, as above]: 1.2 × 140 + 1.6 × 420 = 840 under §2.3.1 (2); the
 * edited factor 1.3 gives 1.3 × 140 + 1.6 × 420 = 182 + 672 = 854 (an invented
 * edit, to tell the contents apart).
 */
describe("formulas with plans kept, when what they name changes between calls", () => {
  const EDITED_ROWS = STRENGTH_ROWS.map((r) => (r[0] === "2" ? [r[0], "1.3D + 1.6L + 0.5(Lr or S or R)", r[2]] : r));
  const EDITED = { ...STRENGTH_FIXTURE, combinations: STRENGTH_FIXTURE.combinations.map((c) => (c.id === "2" ? { ...c, expression: "1.3D + 1.6L + 0.5(Lr or S or R)" } : c)) };
  const maxP = (o: Outcome) => rowOf(value(o), "P")[1];

  /** What a fresh workbook, storing `stored` and keeping nothing, gives for `args`. */
  async function fresh(stored: RulesetFile[], formula: Formula, args: unknown[]): Promise<Outcome> {
    clearPlanCache();
    clearTypedRulesets();
    const book = testWorkbook();
    for (const file of stored) expect((await book.store.save(file)).ok).toBe(true);
    return book.evaluateFormula(formula, args);
  }

  test("typed in cells: an edit between calls gives the edited content's table at once, interleaved or not", async () => {
    const before = await fresh([], ENVELOPE, [COLUMN_TABLE, STRENGTH_ROWS, null, null]);
    const after = await fresh([], ENVELOPE, [COLUMN_TABLE, EDITED_ROWS, null, null]);
    expect(maxP(before)).toBeCloseTo(840, 9);
    expect(maxP(after)).toBeCloseTo(854, 9);
    clearPlanCache();
    clearTypedRulesets();
    // The same range edited back and forth, with calls of both contents in flight together.
    const started: Promise<{ edited: boolean; outcome: Outcome }>[] = [];
    for (let k = 0; k < 40; k++) {
      const edited = k % 3 === 1;
      started.push(
        (async () => {
          await pause(k % 4);
          return { edited, outcome: evaluateFormula(ENVELOPE, [COLUMN_TABLE, edited ? EDITED_ROWS : STRENGTH_ROWS, null, null]) };
        })(),
      );
    }
    for (const { edited, outcome } of await Promise.all(started)) expect(outcome).toEqual(edited ? after : before);
  });

  test("stored: a ruleset replaced between calls is used by the next call, stamp and numbers", async () => {
    const book = testWorkbook();
    const args = [COLUMN_TABLE, [["test-strength"]], null, null];
    expect((await book.store.save(STRENGTH_FIXTURE)).ok).toBe(true);
    const first = book.evaluateFormula(ENVELOPE, args);
    expect(maxP(first)).toBeCloseTo(840, 9);
    expect(first).toEqual(await fresh([STRENGTH_FIXTURE], ENVELOPE, args));
    // The plan made for the first content is still kept when the second is stored.
    expect((await book.store.save(EDITED)).ok).toBe(true);
    const second = book.evaluateFormula(ENVELOPE, args);
    expect(maxP(second)).toBeCloseTo(854, 9);
    expect(second).toEqual(await fresh([EDITED], ENVELOPE, args));
    expect(value(second)[0][0]).not.toBe(value(first)[0][0]);
  });

  test("stored: calls in flight while the store changes each give the table of what is stored when they run", async () => {
    const book = testWorkbook();
    const args = [COLUMN_TABLE, [["test-strength"]], null, null];
    const original = await fresh([STRENGTH_FIXTURE], ENVELOPE, args);
    const edited = await fresh([EDITED], ENVELOPE, args);
    expect((await book.store.save(STRENGTH_FIXTURE)).ok).toBe(true);
    const seen: { stored: "original" | "edited"; outcome: Outcome }[] = [];
    let stored: "original" | "edited" = "original";
    const calls: Promise<void>[] = [];
    for (let k = 0; k < 30; k++) {
      calls.push(
        (async () => {
          await pause(k % 5);
          // A formula call is synchronous: it reads the store as it is at that moment.
          seen.push({ stored, outcome: book.evaluateFormula(ENVELOPE, args) });
        })(),
      );
    }
    // The store replaced, and replaced back, while those calls wait their turn.
    const writes = (async () => {
      await pause(1);
      expect((await book.store.save(EDITED)).ok).toBe(true);
      stored = "edited";
      await pause(2);
      expect((await book.store.save(STRENGTH_FIXTURE)).ok).toBe(true);
      stored = "original";
    })();
    await Promise.all([...calls, writes]);
    expect(new Set(seen.map((s) => s.stored))).toEqual(new Set(["original", "edited"]));
    for (const s of seen) expect(s.outcome).toEqual(s.stored === "edited" ? edited : original);
  });

  test("stored: an approval recorded between calls (the same content, the same fingerprint) shows in the next stamp, with the same numbers", async () => {
    const book = testWorkbook();
    const args = [COLUMN_TABLE, [["test-strength"]], null, null];
    expect((await book.store.save(STRENGTH_FIXTURE)).ok).toBe(true);
    const before = book.evaluateFormula(ENVELOPE, args);
    const approved = { ...STRENGTH_FIXTURE, approval: { approvedBy: "A. Checker", date: "2026-01-05", fingerprint: referenceFingerprint(STRENGTH_FIXTURE) } };
    expect((await book.store.save(approved)).ok).toBe(true);
    const after = book.evaluateFormula(ENVELOPE, args);
    expect(value(after).slice(1)).toEqual(value(before).slice(1));
    expect(value(before)[0][0]).toMatch(/not approved/);
    expect(value(after)[0][0]).toMatch(/approved by A\. Checker on 2026-01-05/);
    expect(after).toEqual(await fresh([approved], ENVELOPE, args));
  });

  test("stored: a stored copy of a shipped id removed between calls gives the shipped ruleset's table again", async () => {
    const book = testWorkbook();
    const shipped = findShippedRuleset("asce7-16-strength");
    if (!shipped) throw new Error("asce7-16-strength is not shipped");
    const copy = { ...shipped.ruleset.file, combinations: shipped.ruleset.file.combinations.map((c) => ({ ...c, expression: c.expression.replace(/^1\.2D/, "1.3D") })) };
    const args = [EXPORT, [["asce7-16-strength"]], "SDS=1.0", null];
    expect((await book.store.save(copy)).ok).toBe(true);
    const withCopy = book.evaluateFormula(ENVELOPE, args);
    expect(withCopy).toEqual(await fresh([copy], ENVELOPE, args));
    expect((await book.store.remove("asce7-16-strength")).ok).toBe(true);
    const withShipped = book.evaluateFormula(ENVELOPE, args);
    expect(withShipped).toEqual(await fresh([], ENVELOPE, args));
    expect(withShipped).not.toEqual(withCopy);
  });
});

/** The fingerprint as docs/rulesets.md defines it, with Node's own SHA-256 and the RFC 8785 library (not Loadwright's code). */
function referenceFingerprint(file: RulesetFile): string {
  const { approval: _approval, ...content } = file;
  return createHash("sha256").update(canonicalize(content) ?? "", "utf8").digest("hex");
}
