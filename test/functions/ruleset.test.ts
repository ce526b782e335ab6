import { createHash } from "node:crypto";
import canonicalize from "canonicalize";
import { beforeEach, describe, expect, test } from "vitest";
import { RulesetStore, STORE_FORMAT, STORE_KEY } from "../../src/workbook/rulesetStore.js";
import { memoryBackend } from "../../src/workbook/settingsBackend.js";
import { shippedRulesets, type RulesetFile } from "../../src/core/index.js";
import { RULESET } from "../../src/functions/formulas/rulesetFormula.js";
import { SEISMIC_FIXTURE, STRENGTH_FIXTURE, STRENGTH_ROWS } from "./fixtures.js";
import { message, rowOf, testWorkbook, type TestWorkbook, value } from "./outcome.js";

/**
 * The fingerprint as docs/rulesets.md, "Rulesets" defines it, computed here with Node's own
 * SHA-256 and the RFC 8785 canonicalization library, not with Loadwright's code.
 */
function referenceFingerprint(file: RulesetFile): string {
  const { approval: _approval, ...content } = file;
  return createHash("sha256").update(canonicalize(content) ?? "", "utf8").digest("hex");
}

let workbook: TestWorkbook = testWorkbook();
/** The formulas and the store of this test's own workbook. */
const evaluateFormula: TestWorkbook["evaluateFormula"] = (...a) => workbook.evaluateFormula(...a);
const rulesetStore = () => workbook.store;
/** Opens the workbook over another store (one holding what a test wrote there). */
const useRulesetStore = (store: RulesetStore) => (workbook = testWorkbook(store));
beforeEach(() => {
  workbook = testWorkbook();
});

const field = (table: ReturnType<typeof value>, name: string) => rowOf(table, name)[1];

describe("LW.RULESET", () => {
  test("stamps a stored ruleset with its identity, fingerprint and status", async () => {
    await rulesetStore().save(STRENGTH_FIXTURE);
    const table = value(evaluateFormula(RULESET, [[["test-strength"]]]));
    expect(table[1]).toEqual(["field", "value"]);
    expect(field(table, "id")).toBe("test-strength");
    expect(field(table, "standard")).toBe("ASCE/SEI 7 2016, §2.3.1");
    expect(field(table, "version")).toBe("0.0.1-test");
    expect(field(table, "fingerprint")).toBe(referenceFingerprint(STRENGTH_FIXTURE));
    expect(field(table, "source")).toBe("stored in this workbook");
    expect(field(table, "verification")).toBe("factors checked against the sources named in its provenance");
    expect(field(table, "approval")).toBe("not approved");
    expect(field(table, "combinations")).toBe(5);
    expect(String(field(table, "caution"))).toMatch(/qualified, licensed engineer/);
  });

  test("shows UNVERIFIED in the stamp and the verification row when a source is from memory", async () => {
    await rulesetStore().save(SEISMIC_FIXTURE);
    const table = value(evaluateFormula(RULESET, [[["test-seismic"]]]));
    expect(String(table[0][0])).toMatch(/^UNVERIFIED · /);
    expect(String(field(table, "verification"))).toMatch(/^UNVERIFIED: /);
    expect(String(field(table, "from memory"))).toBe("ASCE/SEI 7-16 §2.3.6 (numbering, Eh = rho*QE, the allowed values of rho)");
    expect(field(table, "parameters")).toBe("SDS (no default: must be given); rho (no default: must be given)");
  });

  test("shows an approval that matches the content, and voids it once the content changes", async () => {
    const approved: RulesetFile = {
      ...STRENGTH_FIXTURE,
      approval: { approvedBy: "A. Checker (invented for the test)", date: "2026-01-15", fingerprint: referenceFingerprint(STRENGTH_FIXTURE) },
    };
    await rulesetStore().save(approved);
    expect(field(value(evaluateFormula(RULESET, [[["test-strength"]]])), "approval")).toBe(
      "approved by A. Checker (invented for the test) on 2026-01-15",
    );
    await rulesetStore().save({ ...approved, combinations: approved.combinations.slice(0, 4) });
    const changed = value(evaluateFormula(RULESET, [[["test-strength"]]]));
    expect(String(field(changed, "approval"))).toMatch(/^APPROVAL VOID: CHANGED since approval by A\. Checker/);
    expect(String(changed[0][0])).toMatch(/^Checked · APPROVAL VOID/);
  });

  test("marks every shipped ruleset UNVERIFIED exactly when its provenance has a source from memory", () => {
    for (const shipped of shippedRulesets()) {
      const file = shipped.ruleset.file;
      const table = value(evaluateFormula(RULESET, [[[file.id]]]));
      expect(field(table, "id")).toBe(file.id);
      expect(field(table, "source")).toBe("shipped with Loadwright");
      expect(field(table, "fingerprint")).toBe(referenceFingerprint(file));
      const fromMemory = file.provenance.some((p) => p.status === "from-memory");
      expect(String(table[0][0]).startsWith(fromMemory ? "UNVERIFIED · " : "Checked · "), file.id).toBe(true);
    }
  });

  test("uses a stored copy of a shipped ruleset and says that it differs from the shipped one", async () => {
    const [first] = shippedRulesets();
    expect(first, "a shipped ruleset").toBeDefined();
    await rulesetStore().save({ ...first.ruleset.file, version: `${first.ruleset.file.version}-firm` });
    const table = value(evaluateFormula(RULESET, [[[first.id]]]));
    expect(field(table, "source")).toBe("stored in this workbook (differs from the shipped ruleset of the same id)");
    expect(field(table, "version")).toBe(`${first.ruleset.file.version}-firm`);
  });

  test("says a typed ruleset is not checked", () => {
    const table = value(evaluateFormula(RULESET, [STRENGTH_ROWS]));
    expect(field(table, "id")).toBe("(typed in cells)");
    expect(field(table, "verification")).toBe("typed in the workbook: not checked by Loadwright");
  });

  test("suggests the likely id for one it does not know", async () => {
    await rulesetStore().save(STRENGTH_FIXTURE);
    const text = message(evaluateFormula(RULESET, [[["test-strenght"]]], ["Calc!B1"]));
    expect(text).toMatch(/^ruleset, Calc!B1: no ruleset "test-strenght" is shipped or stored in memory \(not saved\); did you mean "test-strength"\?/);
  });

  test("says why a stored ruleset no longer loads", async () => {
    const broken = { ...STRENGTH_FIXTURE, combinations: [{ id: "1", expression: "1.4D +", clause: "§2.3.1 (1)" }] };
    const backend = memoryBackend({ [STORE_KEY]: JSON.stringify({ format: STORE_FORMAT, rulesets: [broken] }) });
    useRulesetStore(new RulesetStore(backend));
    const text = message(evaluateFormula(RULESET, [[["test-strength"]]]));
    expect(text).toMatch(/^ruleset: the ruleset "test-strength" stored in memory \(not saved\) no longer loads: combinations\[0\]\.expression/);
  });
});
