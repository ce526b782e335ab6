/**
 * One formula call as Excel makes it: LW.ENVELOPE on a case table of 20 cases
 * (as rows) × 12 components with the largest shipped ruleset (the most concrete
 * rows for one case per symbol), timed cold (no plan kept) and with its plan
 * kept from an earlier call. Values INVENTED (fixed seed).
 */
import { clearPlanCache, planCombinations, resolveParameters, shippedRulesets, type Ruleset } from "../src/core/index.js";
import { ENVELOPE } from "../src/functions/formulas/envelopeFormula.js";
import { evaluateFormula } from "../src/functions/runFormula.js";
import { RulesetLibrary } from "../src/workbook/rulesetLibrary.js";
import { RulesetStore } from "../src/workbook/rulesetStore.js";
import { memoryBackend } from "../src/workbook/settingsBackend.js";
import { generator } from "./exports.js";

export interface FormulaTimes {
  ruleset: string;
  table: string;
  rows: number;
  cold: number;
  cached: number;
}

/** Numbers for parameters that have no default: the allowed value or lower bound, else 1. */
function parametersOf(ruleset: Ruleset): Record<string, number> {
  const out: Record<string, number> = {};
  for (const p of ruleset.parameters) if (p.kind === "number" && p.default === undefined) out[p.name] = p.allowed?.[0] ?? Math.max(p.min ?? 1, 1);
  return out;
}

export function formulaTimes(): FormulaTimes {
  let largest: { ruleset: Ruleset; rows: number } | null = null;
  for (const s of shippedRulesets()) {
    const values = resolveParameters(s.ruleset, parametersOf(s.ruleset));
    if (!values.ok) continue;
    const plan = planCombinations(s.ruleset, values.value, { cases: null });
    if (plan.ok && (!largest || plan.value.rowCount > largest.rows)) largest = { ruleset: s.ruleset, rows: plan.value.rowCount };
  }
  if (!largest) throw new Error("no shipped ruleset plans");
  const ruleset = largest.ruleset;
  // One case per symbol, then more cases of the most varied symbol (wind directions) up to 20.
  const headers = ruleset.symbols.map((s) => s.name);
  const extra = ruleset.symbolByName.has("W") ? "W" : (ruleset.symbols.find((s) => !s.permanent)?.name ?? ruleset.symbols[0].name);
  for (let k = 1; headers.length < 20; k++) headers.push(`${extra}:${k}`);
  if (headers.includes(extra)) headers[headers.indexOf(extra)] = `${extra}:0`;
  const random = generator(7);
  const components = Array.from({ length: 12 }, (_, c) => `C${c + 1}`);
  const table = [["", ...components], ...headers.map((h) => [h, ...components.map(() => Math.round((random() - 0.3) * 2000) / 10)])];
  const params = Object.entries(parametersOf(ruleset))
    .map(([k, v]) => `${k}=${v}`)
    .join("; ");
  const args = [table, [[ruleset.file.id]], params || null, null];

  // A workbook that stores nothing: the formula names a shipped ruleset.
  const context = { library: new RulesetLibrary(new RulesetStore(memoryBackend())) };
  const call = () => {
    const result = evaluateFormula(ENVELOPE, args, context);
    if (!result.ok) throw new Error(`LW.ENVELOPE refused: ${result.message}`);
  };
  call(); // load and compile everything once
  const cold: number[] = [];
  for (let k = 0; k < 60; k++) {
    clearPlanCache();
    const t0 = performance.now();
    call();
    cold.push(performance.now() - t0);
  }
  const cached: number[] = [];
  for (let k = 0; k < 2000; k++) {
    const t0 = performance.now();
    call();
    cached.push(performance.now() - t0);
  }
  const median = (xs: number[]) => xs.sort((a, b) => a - b)[xs.length >> 1];
  return { ruleset: ruleset.file.id, table: `${headers.length} cases × ${components.length} components`, rows: largest.rows, cold: median(cold), cached: median(cached) };
}
