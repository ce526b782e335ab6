/**
 * Every surface says a ruleset's standing, the cautions and what a plan leaves
 * out in the catalogue's words (docs/design.md, "One vocabulary"): for each
 * verification and approval state, the formula stamp and LW.RULESET, the
 * command line's preamble, the task pane's badges and the core's status
 * summary are held to the one function that words them, statusText.
 */
import { describe, expect, test } from "vitest";
import {
  cautionLine,
  coverageText,
  fingerprintOf,
  loadRuleset,
  omissionTexts,
  planForTable,
  planOmissions,
  rulesetFromRows,
  rulesetStatus,
  shortCautions,
  stampLine,
  statusText,
  type Approval,
  type Ruleset,
  type RulesetFile,
  type Verification,
} from "../../src/core/index.js";
import { RULESET } from "../../src/functions/formulas/rulesetFormula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { CAUTIONS, identityLines, preambleLines, statusWord } from "../../src/cli/output/preamble.js";
import { approvalLine, unverifiedSuffix, verificationBadgeText } from "../../src/taskpane/statusText.js";
import { STRENGTH_FIXTURE, STRENGTH_ROWS } from "../functions/fixtures.js";
import { NOTE_PREFIX } from "../../src/functions/outputTable.js";
import { rowOf, testWorkbook, value } from "../functions/outcome.js";

const APPROVER = { approvedBy: "A. Checker (invented)", date: "2026-11-30" };

/** The fixture in each state: from-memory provenance makes it UNVERIFIED (docs/rulesets.md); an approval of its own fingerprint applies, of another does not. */
function fileIn(verification: Exclude<Verification, "user">, approval: Approval): RulesetFile {
  const file: RulesetFile = structuredClone(STRENGTH_FIXTURE);
  if (verification === "unverified") file.provenance = [...file.provenance, { source: "the numbering", status: "from-memory", covers: "which number each combination has" }];
  if (approval === "approved") file.approval = { ...APPROVER, fingerprint: fingerprintOf(file) };
  if (approval === "changed-since-approval") file.approval = { ...APPROVER, fingerprint: "0".repeat(64) };
  return file;
}

function loaded(file: RulesetFile): Ruleset {
  const r = loadRuleset(file);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

const STATES: [Exclude<Verification, "user">, Approval][] = (["checked", "unverified"] as const).flatMap((v) =>
  (["approved", "changed-since-approval", "not-approved"] as const).map((a): [Exclude<Verification, "user">, Approval] => [v, a]),
);

describe.each(STATES)("a %s ruleset, %s", (verification, approval) => {
  const file = fileIn(verification, approval);
  const ruleset = loaded(file);
  const status = rulesetStatus(ruleset);
  const words = statusText({ verification, approval }, file.approval);

  test("is in this state", () => {
    expect([status.verification, status.approval]).toEqual([verification, approval]);
  });

  test("has the catalogue's summary in its status", () => {
    expect(status.summary).toBe(words.summary);
  });

  test("is stamped and described by the formulas in the catalogue's words", async () => {
    const workbook = testWorkbook();
    expect((await workbook.store.save(file)).ok).toBe(true);
    const table = value(workbook.evaluateFormula(RULESET, [[[file.id]]]));
    expect(table[0][0]).toBe(stampLine(file, status, { kind: "stored", where: "this workbook", shipped: "none" }));
    expect(String(table[0][0]).startsWith(`${words.word} · ${words.approval.cell} · `)).toBe(true);
    expect(rowOf(table, "verification")[1]).toBe(words.sentence);
    expect(rowOf(table, "approval")[1]).toBe(words.approval.cell);
    expect(rowOf(table, "combinations confirmed")[1]).toBe(coverageText(status.combinations));
    expect(rowOf(table, "caution")[1]).toBe(cautionLine());
  });

  test("is introduced by the command line in the catalogue's words", () => {
    const lines = identityLines({ ruleset, status, source: "rules.json" }, null);
    expect(lines).toContain(`Status: ${words.summary}`);
    expect(lines[0] === words.banner).toBe(words.banner !== null);
    expect(statusWord(status)).toBe(words.word);
  });

  test("is shown by the task pane in the catalogue's words", () => {
    expect(verificationBadgeText(status)).toBe(words.badge);
    expect(approvalLine(file, status)).toBe(words.approval.badge);
    expect(unverifiedSuffix(status)).toBe(words.listMark);
  });
});

describe("a ruleset typed in cells", () => {
  const typed = rulesetFromRows(STRENGTH_ROWS);
  if (!typed.ok) throw new Error("typed ruleset");
  const status = rulesetStatus(typed.value);
  const words = statusText(status, typed.value.file.approval);

  test("is NOT CHECKED on every surface that shows it", () => {
    expect(status.verification).toBe("user");
    const table = value(testWorkbook().evaluateFormula(RULESET, [STRENGTH_ROWS]));
    expect(String(table[0][0]).startsWith(`${words.word} · `)).toBe(true);
    expect(rowOf(table, "verification")[1]).toBe(words.sentence);
    expect(verificationBadgeText(status)).toBe(words.badge);
  });
});

describe("the cautions and what a plan leaves out", () => {
  test("are the catalogue's on the command line and under a formula's numbers", () => {
    expect(CAUTIONS).toEqual(shortCautions());
    for (const caution of shortCautions()) expect(preambleLines(null, null, "table")).toContain(`Caution: ${caution}`);
    // A table without R or S: the fixture's combinations name them, so they are noted (ASCE/SEI 7-16 §2.3.1 (2)–(4)).
    const cases = [["", "P"], ["D", 140], ["L", 420], ["W", -50]];
    const formula = value(testWorkbook().evaluateFormula(FACTORED, [cases, STRENGTH_ROWS, null, null]));
    const ruleset = loaded(STRENGTH_FIXTURE);
    const plan = planForTable(ruleset, {}, { orientation: "rows", cases: [{ header: "D", symbol: "D" }, { header: "L", symbol: "L" }, { header: "W", symbol: "W" }], components: ["P"], values: [new Float64Array(3)], map: { symbolOf: new Map(), modes: new Map(), reversible: new Map() } });
    if (!plan.ok) throw new Error("plan");
    const expected = omissionTexts(planOmissions(plan.value));
    expect(expected.length).toBeGreaterThan(0);
    expect(formula.filter((r) => String(r[0]).startsWith(NOTE_PREFIX)).map((r) => r[0])).toEqual(expected.map((t) => `${NOTE_PREFIX}${t}`));
    const lines = identityLines({ ruleset, status: rulesetStatus(ruleset), source: "rules.json" }, plan.value);
    for (const text of expected) expect(lines).toContain(`Note: ${text}`);
  });
});
