/**
 * The compiled plan finds an option or a term met before by a hash of its
 * content, confirmed by comparing it. It is held here to the plain way of
 * doing the same — a key text per option (every case and factor written out)
 * and per term (its options' numbers), looked up in a JavaScript Map
 * (ECMA-262, "Map Objects", https://tc39.es/ecma262/#sec-map-objects) — on
 * random rulesets and tables: the same distinct options and terms, numbered in
 * the same order, and the same terms in every branch.
 */
import fc from "fast-check";
import { expect, test } from "vitest";
import type { Plan } from "../../../src/core/index.js";
import { compilePlan } from "../../../src/core/plan/compiledPlan.js";
import { plannedTable } from "./randomRulesets.js";

/** Options and terms numbered by key texts, in the order they are first met. */
function byKeyText(plan: Plan): { options: string[]; terms: string[]; branches: number[][] } {
  const options = new Map<string, number>();
  const terms = new Map<string, number>();
  const branches: number[][] = [];
  for (const planned of plan.combinations) {
    for (const branch of planned.branches) {
      branches.push(
        branch.terms.map((term) => {
          const ids = term.options.map((o) => {
            const key = o.contributions.map((x) => `${x.caseIndex}:${x.factor}`).join(",");
            if (!options.has(key)) options.set(key, options.size);
            return options.get(key) as number;
          });
          const key = ids.join(",");
          if (!terms.has(key)) terms.set(key, terms.size);
          return terms.get(key) as number;
        }),
      );
    }
  }
  return { options: [...options.keys()], terms: [...terms.keys()], branches };
}

test("the compiled plan's distinct options and terms are those key texts find, in the same order", () => {
  fc.assert(
    fc.property(plannedTable, ({ plan }) => {
      const compiled = compilePlan(plan);
      const expected = byKeyText(plan);
      const options: string[] = [];
      for (let o = 0; o < compiled.optionCount; o++) {
        const parts: string[] = [];
        for (let k = compiled.optionStart[o]; k < compiled.optionStart[o + 1]; k++) parts.push(`${compiled.optionCase[k]}:${compiled.optionFactor[k]}`);
        options.push(parts.join(","));
      }
      expect(options).toEqual(expected.options);
      const terms: string[] = [];
      for (let t = 0; t < compiled.termCount; t++) terms.push(Array.from(compiled.termOptions.subarray(compiled.termStart[t], compiled.termStart[t + 1])).join(","));
      expect(terms).toEqual(expected.terms);
      const branches: number[][] = [];
      for (let b = 0; b < compiled.branchCount; b++) branches.push(Array.from(compiled.branchTerms.subarray(compiled.branchStart[b], compiled.branchStart[b + 1])));
      expect(branches).toEqual(expected.branches);
    }),
    { numRuns: 500, seed: 20261206 },
  );
});
