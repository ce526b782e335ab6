/**
 * What a comparison needs to show what the numbers will do: the engine's
 * comparison with each combination's concrete rows formed for the parameter
 * values the checker types ("SDS=1.0"), so that a ruleset with a parameter
 * without default (SDS in the ASCE/SEI 7 rulesets) can still be compared row by row.
 */
import {
  compareRulesets,
  describeProblem,
  parseParameterText,
  problem,
  type CombinationDifference,
  type Problem,
  type Result,
  type Ruleset,
  type RulesetComparison,
} from "../core/index.js";

export type CombinationChange = CombinationDifference;

export interface PaneComparison {
  comparison: RulesetComparison;
  combinations: CombinationChange[];
  /** Why one side's rows could not be formed (a parameter without default not given, say). */
  rowProblems: { before: string[]; after: string[] };
  /** Parameters given that one side does not declare (used only for the other). */
  notUsed: { before: string[]; after: string[] };
}

/** One line per distinct message, naming every combination it was found in: "… (combinations 6, 7)". */
function grouped(problems: readonly Problem[]): string[] {
  const byMessage = new Map<string, string[]>();
  const other: string[] = [];
  for (const p of problems) {
    if (p.place.entry === undefined) {
      other.push(describeProblem(p));
      continue;
    }
    const list = byMessage.get(p.message) ?? [];
    list.push(p.place.entry);
    byMessage.set(p.message, list);
  }
  return [...[...byMessage].map(([message, entries]) => `${message} (${entries.length === 1 ? "combination" : "combinations"} ${entries.join(", ")})`), ...other];
}

/** compareRulesets, with the concrete rows formed for the parameters in `paramsText` ("SDS=1.0; rho=1.3"). */
export function compareForPane(before: Ruleset, after: Ruleset, paramsText: string): Result<PaneComparison> {
  const given = parseParameterText(paramsText);
  if (!given.ok) return given;
  const declared = (r: Ruleset) => new Set(r.parameters.map((p) => p.name));
  const inBefore = declared(before);
  const inAfter = declared(after);
  const unknown = Object.keys(given.value).filter((n) => !inBefore.has(n) && !inAfter.has(n));
  if (unknown.length > 0) {
    return {
      ok: false,
      problems: unknown.map((n) =>
        problem("parameter-unknown", `${n} is not a parameter of either ruleset (before: ${[...inBefore].join(", ") || "none"}; after: ${[...inAfter].join(", ") || "none"})`, {
          header: n,
          position: paramsText.indexOf(n) + 1,
        }),
      ),
    };
  }
  const comparison = compareRulesets(before, after, { parameters: given.value });
  // The pane says "rows are the same" by showing none; the engine's sentence for it is left out.
  const combinations = comparison.combinations.map((c) => ({ ...c, details: c.details.filter((d) => d !== "the concrete rows are the same") }));
  return {
    ok: true,
    value: {
      comparison,
      combinations,
      rowProblems: { before: grouped(comparison.rowProblems.before), after: grouped(comparison.rowProblems.after) },
      notUsed: {
        before: Object.keys(given.value).filter((n) => !inBefore.has(n)),
        after: Object.keys(given.value).filter((n) => !inAfter.has(n)),
      },
    },
  };
}
