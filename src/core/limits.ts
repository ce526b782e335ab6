/**
 * The stated limits on what Loadwright reads. Each is far above any real
 * ruleset or criterion, and low enough that hostile input is refused at once,
 * with its place, instead of exhausting the stack, the memory or the user's
 * patience. docs/rulesets.md and docs/reliability.md state them; change both
 * with these numbers.
 */
export const LIMITS = {
  /** Characters in one combination expression or criterion (the longest shipped expression has about 110). */
  expressionCharacters: 2_000,
  /** Brackets, |…| bars, function calls, signs and powers inside one another in one expression or criterion (shipped: 2). */
  expressionNesting: 32,
  /** Ways the "(a or b)" choices of one expression's factors can be taken together (shipped: at most 4). */
  factorChoices: 1_000,
  /** Characters in one ruleset file (the largest shipped file has about 8,200). */
  rulesetCharacters: 262_144,
  /** Objects and lists inside one another in a JSON file (a shipped ruleset nests 5 deep, a case file 2). */
  jsonNesting: 64,
  /** Members of one object or list in a ruleset: symbols, parameters, combinations, notes… (shipped: at most 13). */
  rulesetMembers: 200,
} as const;

/** Field names that reach an object's prototype when a program copies fields by name. */
export const FORBIDDEN_KEYS: readonly string[] = ["__proto__", "constructor", "prototype"];

/** 1,048,576 → "1,048,576" (stable on every platform, unlike toLocaleString). */
export function countText(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
}
