/**
 * The engine's public API, used by the formulas, the task pane and the command
 * line alike. The flow: load a ruleset → resolve parameters → read a case table
 * → plan → envelope / governing / factored / combos / explain.
 */
export type { Cell } from "./cells.js";
export { isBlank, cellText } from "./cells.js";
export {
  columnLetters,
  describePlace,
  describeProblem,
  formatPath,
  type DescribeOptions,
  type Place,
  type Problem,
  type ProblemKind,
  type Result,
} from "./problems.js";

// Rulesets
export { loadRuleset } from "./ruleset/loadRuleset.js";
export { duplicateKeys, type DuplicateKey } from "./ruleset/jsonSyntax.js";
export { jsonTextProblem, jsonValueProblems } from "./ruleset/jsonLimits.js";
export { LIMITS, FORBIDDEN_KEYS } from "./limits.js";
export { rulesetFromRows } from "./ruleset/rulesetFromRows.js";
export { SYMBOL_CATALOGUE } from "./ruleset/catalogue.js";
export { fingerprintOf, shortFingerprint } from "./ruleset/fingerprint.js";
export { rulesetStatus, combinationCoverage, VERIFICATION_TEXT, type RulesetStatus, type CombinationCoverage, type Verification, type Approval } from "./ruleset/status.js";
export { NAME_PATTERN, RULESET_FORMAT, RULESET_ID_PATTERN, rulesetSchema, type RulesetFile } from "./ruleset/schema.js";
export type { Ruleset, LoadSymbol, Parameter, Combination, CaseMode } from "./ruleset/model.js";
export { compareRulesets, rowsById, type CompareOptions, type RulesetComparison, type EntryDifference, type CombinationDifference, type FieldDifference } from "./ruleset/compareRulesets.js";
export { approveRuleset, withoutApproval } from "./ruleset/approveRuleset.js";

// Parameters
export { parseParameterText, parameterPairs, type ParameterInput } from "./params/parameterInput.js";
export { resolveParameters, type ParameterValues } from "./params/resolveParameters.js";

// Case tables
export { readCaseTable, readValue, type CaseTable, type CaseTableOptions, type Orientation } from "./cases/readCaseTable.js";
export { readCaseHeaders, readCaseMap, symbolOfHeader, EMPTY_CASE_MAP, type CaseMap, type LoadCase } from "./cases/caseHeaders.js";

// Planning
export { planCombinations, MAX_BRANCHES, type PlanInput } from "./plan/planCombinations.js";
export { formatNumber } from "./plan/factor.js";
export type { Plan, PlanCase, PlannedCombination, RowRef } from "./plan/types.js";

// Evaluation
export { envelope, envelopeOf, type EnvelopeEntry, type EnvelopeValue } from "./evaluate/envelope.js";
export { extremes, type Extreme, type Extremes } from "./evaluate/extremes.js";
export { governing, defaultCriteria, type GoverningRow, type GoverningOptions } from "./evaluate/governing.js";
export { parseCriterion, criterionNames, type Criterion } from "./evaluate/criteria.js";
export { factored, type FactoredRow } from "./evaluate/factored.js";
export { comboRows, type ComboRow } from "./evaluate/combos.js";
export { explain, findRow, type Explanation, type ExplanationLine } from "./evaluate/explain.js";
export { DEFAULT_ROW_LIMIT, enumerateRows, listRows, rowLabel, rowValue, rowValues } from "./evaluate/rows.js";
export { planForTable } from "./planForTable.js";

// Shipped rulesets
export { shippedRulesets, findShippedRuleset, type ShippedRuleset } from "./library/shippedRulesets.js";
