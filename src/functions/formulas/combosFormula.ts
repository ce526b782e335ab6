/**
 * LW.COMBOS: the concrete combination rows a checker reads — label, clause and
 * the factor on every load symbol, or on every case when a case table or its
 * header row is given.
 */
import { comboRows, planCombinations, resolveParameters } from "../../core/index.js";
import { given, type Formula } from "../formula.js";
import { labelBytes, tableResult } from "./planning.js";

export const COMBOS: Formula = {
  name: "LW.COMBOS",
  parameters: [
    { name: "ruleset", kind: "ruleset" },
    { name: "params", kind: "params", optional: true },
    { name: "cases", kind: "caseHeaders", optional: true },
  ],
  evaluate(args) {
    const resolved = given(args.ruleset, "ruleset");
    const values = resolveParameters(resolved.ruleset, args.params.input);
    const plan = values.ok ? planCombinations(resolved.ruleset, values.value, { cases: args.cases }) : values;
    return tableResult(
      "LW.COMBOS",
      args,
      plan,
      (p) => ({ rows: p.rowCount, numberColumns: p.cases.length, textBytesPerRow: labelBytes(p) + 24 }),
      (p) => {
        const rows = comboRows(p);
        if (!rows.ok) return rows;
        return { ok: true, value: { header: ["combination row", "clause", ...p.cases.map((c) => c.header)], body: rows.value.map((r) => [r.label, r.clause, ...r.factors]) } };
      },
    );
  },
};
