import { describe, expect, test } from "vitest";
import { DEMO_RULESET } from "../../src/addin/demoRuleset.js";
import { checkDraft, EMPTY_APPROVAL } from "../../src/taskpane/draftCheck.js";
import { rulesetText } from "../../src/taskpane/openDraft.js";

/** The invented demo ruleset with one expression replaced. */
function withExpression(index: number, expression: string): string {
  const file = structuredClone(DEMO_RULESET);
  file.combinations[index].expression = expression;
  return rulesetText(file);
}

describe("checkDraft", () => {
  test("takes a draft that loads, with its status", () => {
    const check = checkDraft(rulesetText(DEMO_RULESET), EMPTY_APPROVAL);
    expect(check.problems).toEqual([]);
    expect(check.ruleset?.file.id).toBe("demo-invented");
    // The demo's provenance is marked from memory (it is invented), so it must show as UNVERIFIED.
    expect(check.status?.verification).toBe("unverified");
  });

  test("places an unknown name in an expression at its field, its character and its line in the text", () => {
    const expression = "1.2D + kL*L + 0.5(S or Wx)";
    const text = withExpression(1, expression);
    const check = checkDraft(text, EMPTY_APPROVAL);
    expect(check.ruleset).toBeNull();
    expect(check.problems).toHaveLength(1);
    const [p] = check.problems;
    expect(p.field).toBe("combinations[1].expression");
    // Hand count: "Wx" starts at the 24th character of the expression.
    expect(p.position).toBe(expression.indexOf("Wx") + 1);
    expect(p.position).toBe(24);
    expect(p.local).toMatch(/^combination "B", character 24: unknown name "Wx"/);
    const lines = text.split("\n");
    const line = lines.findIndex((l) => l.includes("Wx")) + 1;
    expect(p.spot).toMatchObject({ line, column: lines[line - 1].indexOf("Wx") + 1 });
  });

  test("says where the JSON text breaks when it is not JSON", () => {
    const check = checkDraft('{\n  "format": "loadwright-ruleset/1",\n  "id": "x"\n  "title": "t"\n}', EMPTY_APPROVAL);
    expect(check.data).toBeUndefined();
    expect(check.problems).toHaveLength(1);
    expect(check.problems[0].full).toMatch(/not valid JSON: a "," is expected at line 4, column 3/);
    expect(check.problems[0].spot).toMatchObject({ line: 4, column: 3 });
  });

  test("refuses a field written twice in the text, though the engine alone would keep the last", () => {
    const text = rulesetText(DEMO_RULESET).replace('"symbols": {', '"symbols": {\n    "L": { "description": "live load", "permanence": "permanent" },');
    const check = checkDraft(text, EMPTY_APPROVAL);
    expect(check.ruleset).toBeNull();
    expect(check.problems.map((p) => p.field)).toContain("symbols.L");
  });

  test("refuses an approval block typed by hand, and accepts it as it was or cleared", () => {
    const approved = { approvedBy: "A. Checker", date: "2026-01-15", fingerprint: "0".repeat(64) };
    const forged = rulesetText({ ...DEMO_RULESET, approval: approved });
    const refused = checkDraft(forged, EMPTY_APPROVAL);
    expect(refused.ruleset).toBeNull();
    expect(refused.problems.map((p) => p.field)).toEqual(["approval"]);
    expect(checkDraft(forged, approved).problems).toEqual([]);
    expect(checkDraft(rulesetText(DEMO_RULESET), approved).problems).toEqual([]);
  });
});
