/**
 * The ways one load symbol can act in a row, given its cases in the table:
 *  - sum: all its cases together (several dead load cases);
 *  - each: one case at a time (each wind direction in turn);
 *  - orthogonal: each case leading at 100 % with every other at the share
 *    (30 %, ASCE/SEI 7-16 §12.5.3), with every sign: n·2^n states;
 *  - independent: as sum here; the planner gives each case a term of its own
 *    where the symbol is written once as a term by itself;
 * and, for a reversible symbol under sum or each, every state also reversed
 * (a case map may make a symbol one-way or both ways for one table).
 */
import { fail, ok, problem, type Result } from "../problems.js";
import type { CaseMode, LoadSymbol } from "../ruleset/model.js";
import { formatNumber } from "./factor.js";

export interface StatePart {
  caseIndex: number;
  /** +1, −1, or ± the orthogonal share. */
  sign: number;
  why: string;
}

export interface SymbolState {
  parts: StatePart[];
}

/** More states than this for one symbol is refused: it would be a typing error, not a design case. */
export const MAX_SYMBOL_STATES = 100_000;

export function symbolStates(symbol: LoadSymbol, cases: number[], mode: CaseMode, share: number, reversible: boolean): Result<SymbolState[]> {
  if (cases.length === 0) return ok([{ parts: [] }]);
  const reversed = (parts: StatePart[]): StatePart[] => parts.map((p) => ({ ...p, sign: -p.sign, why: p.why ? `${p.why} × -1 (reversed)` : "-1 (reversed)" }));
  switch (mode) {
    case "sum":
    case "independent": {
      // "independent" splits a term into one term per case in the planner; where it cannot, the cases act together.
      const parts = cases.map((c) => ({ caseIndex: c, sign: 1, why: "" }));
      return ok(reversible ? [{ parts }, { parts: reversed(parts) }] : [{ parts }]);
    }
    case "each": {
      const states: SymbolState[] = [];
      for (const c of cases) {
        const parts = [{ caseIndex: c, sign: 1, why: "" }];
        states.push({ parts });
        if (reversible) states.push({ parts: reversed(parts) });
      }
      return ok(states);
    }
    case "orthogonal": {
      const n = cases.length;
      const count = n * 2 ** n;
      if (n > 16 || count > MAX_SYMBOL_STATES) {
        return fail(
          problem("too-many-rows", `${symbol.name} has ${n} cases; the orthogonal rule would give ${count} ways for it to act, more than ${MAX_SYMBOL_STATES}`, {
            header: symbol.name,
          }),
        );
      }
      const shareText = `${formatNumber(share)} (orthogonal share)`;
      const states: SymbolState[] = [];
      for (let lead = 0; lead < n; lead++) {
        for (let signs = 0; signs < 2 ** n; signs++) {
          const parts = cases.map((c, k) => {
            const negative = (signs >> k) & 1;
            const size = k === lead ? 1 : share;
            const why = [k === lead ? "" : shareText, negative ? "-1 (reversed)" : ""].filter((w) => w !== "").join(" × ");
            return { caseIndex: c, sign: negative ? -size : size, why };
          });
          states.push({ parts });
        }
      }
      return ok(states);
    }
  }
}
