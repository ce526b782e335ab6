/**
 * Random rulesets and case tables for the property tests: expressions are
 * generated as text (so the parser is exercised too) from every construct of
 * the language — alternatives, factor pairs, parameters, attributes, signs,
 * both-ways terms, marks, lead/others, functions and powers — over symbols of every kind.
 */
import fc from "fast-check";
import { loadRuleset, planForTable, readCaseTable, RULESET_FORMAT, type CaseTable, type Plan, type RulesetFile } from "../../../src/core/index.js";

/** The symbol pool: one of each kind the engine distinguishes (numbers invented for testing). */
export const SYMBOLS: RulesetFile["symbols"] = {
  D: { description: "permanent, cases summed", permanence: "permanent" },
  G: { description: "permanent, reversible, cases one at a time", permanence: "permanent", reversible: true, cases: "each" },
  L: { description: "transient, one case at a time", permanence: "transient", attributes: { psi0: 0.7 } },
  S: { description: "transient that must act when written", permanence: "transient", canBeAbsent: false, attributes: { psi0: "pS" } },
  W: { description: "transient, reversible, one case at a time", permanence: "transient", reversible: true, attributes: { psi0: 0.6 } },
  E: { description: "transient, directions by the orthogonal rule", permanence: "transient", reversible: true, cases: "orthogonal", orthogonalShare: "q", attributes: { psi0: 0 } },
  T: { description: "transient, cases summed", permanence: "transient", cases: "sum", attributes: { psi0: 0.5 } },
  P: { description: "permanent, cases from independent sources", permanence: "permanent", cases: "independent" },
};

const VARIABLE = ["L", "S", "W", "E", "T"];
const ALL = Object.keys(SYMBOLS);

const factorText = fc.constantFrom("", "", "1.2", "0.9*", "a*", "(1.35 or 0.9)", "(a + 0.2*b)", "(1 - b)", "0.5a ", "(a or 2.5)*", "max(a, 0.9*b)*", "0.5sqrt(a)", "b^2 ");
const variableFactor = fc.constantFrom("", "1.5*", "1.5*psi0*", "psi0*", "(1 or psi0)*");
const mark = fc.constantFrom("", "", "", "!", "?");
const sign = fc.constantFrom(" + ", " + ", " - ", " ± ");

/** A term without lead/others: a symbol, or a bracketed group of alternatives (one level deep). */
const simpleTerm: fc.Arbitrary<string> = fc.oneof(
  { weight: 3, arbitrary: fc.tuple(factorText, fc.constantFrom(...ALL), mark).map(([f, s, m]) => `${f}${s}${m}`) },
  {
    weight: 1,
    arbitrary: fc
      .tuple(
        factorText,
        fc.array(
          fc.array(fc.tuple(fc.constantFrom("", "0.5", "2*", "b*"), fc.constantFrom(...ALL), fc.constantFrom("", "", "?", "!")), { minLength: 1, maxLength: 2 }),
          { minLength: 1, maxLength: 3 },
        ),
        mark,
      )
      .map(([f, alternatives, m]) => `${f}(${alternatives.map((terms) => terms.map(([tf, s, tm]) => `${tf}${s}${tm}`).join(" + ")).join(" or ")})${m}`),
  },
);

const leadPart: fc.Arbitrary<string> = fc
  .tuple(fc.subarray(VARIABLE, { minLength: 1, maxLength: 3 }), variableFactor, variableFactor, fc.boolean())
  .map(([symbols, lf, of, withOthers]) => `${lf}lead(${symbols.join(", ")})${withOthers ? ` + ${of}others` : ""}`);

export const expression: fc.Arbitrary<string> = fc
  .tuple(fc.constantFrom("", "", "-", "± "), simpleTerm, fc.array(fc.tuple(sign, simpleTerm), { maxLength: 2 }), fc.option(leadPart, { nil: undefined }))
  .map(([first, head, rest, lead]) => `${first}${head}${rest.map(([s, t]) => `${s}${t}`).join("")}${lead ? ` + ${lead}` : ""}`);

export const rulesetFile: fc.Arbitrary<RulesetFile> = fc.array(expression, { minLength: 1, maxLength: 3 }).map((expressions) => ({
  format: RULESET_FORMAT,
  id: "random",
  title: "random ruleset for property tests (invented)",
  standard: { name: "none", edition: "-" },
  version: "0",
  symbols: SYMBOLS,
  parameters: {
    a: { type: "number", description: "a factor", default: 1.3 },
    b: { type: "number", description: "another factor", default: 0.4 },
    q: { type: "number", description: "orthogonal share", default: 0.3 },
    pS: { type: "number", description: "psi0 of S", default: 0.5 },
  },
  combinations: expressions.map((expression, i) => ({ id: `C${i + 1}`, expression, clause: "invented" })),
  provenance: [{ source: "invented for property tests", status: "confirmed", covers: "all" }],
  approval: { approvedBy: null, date: null, fingerprint: null },
}));

/** Case headers: 0–2 cases per symbol (W up to 3), written SYMBOL or SYMBOL:n. */
export const caseHeaders: fc.Arbitrary<string[]> = fc
  .record(Object.fromEntries(ALL.map((s) => [s, fc.integer({ min: 0, max: s === "W" ? 3 : 2 })])) as Record<string, fc.Arbitrary<number>>)
  .map((counts) => ALL.flatMap((s) => Array.from({ length: counts[s] }, (_, k) => (counts[s] === 1 && k === 0 ? s : `${s}:${k + 1}`))))
  .filter((headers) => headers.length > 0);

/** A cases-as-rows table for the given headers with 1–3 components of small integer values. */
export function caseTable(headers: string[]): fc.Arbitrary<(string | number | null)[][]> {
  return fc.integer({ min: 1, max: 3 }).chain((components) =>
    fc
      .array(fc.array(fc.oneof({ weight: 9, arbitrary: fc.integer({ min: -40, max: 40 }) }, { weight: 1, arbitrary: fc.constant(null) }), { minLength: components, maxLength: components }), {
        minLength: headers.length,
        maxLength: headers.length,
      })
      .map((values) => [["", ...Array.from({ length: components }, (_, c) => `V${c + 1}`)], ...headers.map((h, r) => [h, ...values[r]])]),
  );
}

/** A random ruleset with a case table for it, read and planned (a pair the engine refuses is a defect of these generators). */
export const plannedTable: fc.Arbitrary<{ table: CaseTable; plan: Plan }> = fc
  .tuple(rulesetFile, caseHeaders)
  .chain(([file, headers]) => caseTable(headers).map((matrix) => ({ file, matrix })))
  .map(({ file, matrix }) => {
    const ruleset = loadRuleset(file);
    if (!ruleset.ok) throw new Error("generated ruleset refused");
    const table = readCaseTable(matrix, ruleset.value, { orientation: "rows" });
    if (!table.ok) throw new Error("generated table refused");
    const plan = planForTable(ruleset.value, {}, table.value);
    if (!plan.ok) throw new Error("plan refused");
    return { table: table.value, plan: plan.value };
  });
