/**
 * The engine's public API, used by the formulas, the task pane and the command
 * line alike. The flow: load a ruleset → resolve parameters → read a case table
 * → plan → envelope / governing / factored / combos / explain.
 */
export type { Cell } from "./cells.js";
export { isBlank, cellText, DECIMAL_TEXT, trimTrailingEmpty, widthOf } from "./cells.js";
export {
  columnLetters,
  describePlace,
  describeProblem,
  formatPath,
  problem,
  type DescribeOptions,
  type Place,
  type Problem,
  type ProblemKind,
  type Result,
} from "./problems.js";

// Rulesets
export { loadRuleset } from "./ruleset/loadRuleset.js";
export { duplicateKeys, jsonSyntaxError, type DuplicateKey } from "./ruleset/jsonSyntax.js";
export { jsonTextProblem, jsonValueProblems } from "./ruleset/jsonLimits.js";
export { LIMITS, FORBIDDEN_KEYS, countText } from "./limits.js";
export { rulesetFromRows } from "./ruleset/rulesetFromRows.js";
export { typedRuleset, clearTypedRulesets, TYPED_RULESET_LIMIT, type TypedRuleset } from "./ruleset/typedRulesets.js";
export { SYMBOL_CATALOGUE } from "./ruleset/catalogue.js";
export { fingerprintOf, shortFingerprint } from "./ruleset/fingerprint.js";
export { rulesetStatus, combinationCoverage, type RulesetStatus, type CombinationCoverage, type Verification, type Approval } from "./ruleset/status.js";
export {
  caseModeSchema,
  DEFAULT_ORTHOGONAL_SHARE,
  NAME_PATTERN,
  PARAMETER_TYPES,
  permanenceSchema,
  provenanceStatusSchema,
  RULESET_FORMAT,
  RULESET_ID_PATTERN,
  rulesetSchema,
  SYMBOL_DEFAULTS,
  type Permanence,
  type ProvenanceFile,
  type RulesetFile,
} from "./ruleset/schema.js";
export { STORE_FORMAT, STORE_KEY } from "./ruleset/storeFormat.js";
export { verificationOf, type RulesetVerification, type CombinationVerification, type NumberedSource } from "./ruleset/verification.js";
export type { Ruleset, LoadSymbol, Parameter, Combination, CaseMode } from "./ruleset/model.js";
export { compareRulesets, rowsById, type CompareOptions, type RulesetComparison, type EntryDifference, type CombinationDifference, type FieldDifference } from "./ruleset/compareRulesets.js";
export { approveRuleset, withoutApproval } from "./ruleset/approveRuleset.js";

// Parameters
export { parseParameterText, parameterPairs, type ParameterInput } from "./params/parameterInput.js";
export { resolveParameters, type ParameterValues } from "./params/resolveParameters.js";

// Case tables
export { readCaseTable, type CaseTable, type CaseTableOptions, type Orientation } from "./cases/readCaseTable.js";
export { readValue, type ValueOptions } from "./cases/readValue.js";
export { resultRowReader, type ResultRow, type ResultRowOptions, type ResultRowReader } from "./cases/resultRows.js";
export { namesLoadSymbol, readCaseHeaders, readCaseMap, symbolOfHeader, EMPTY_CASE_MAP, type CaseMap, type LoadCase } from "./cases/caseHeaders.js";

// Planning
export { planCombinations, MAX_BRANCHES, type PlanInput } from "./plan/planCombinations.js";
export { formatNumber } from "./plan/factor.js";
export type { Plan, PlanCase, PlannedCombination, RowRef } from "./plan/types.js";

// Evaluation
export { envelope, envelopeOf, type EnvelopeEntry, type EnvelopeValue } from "./evaluate/envelope.js";
export { notFiniteProblem, type ComponentPlace } from "./evaluate/notFinite.js";
export { extremes, extremesEvaluator, type Extreme, type Extremes, type ExtremesEvaluator, type RowExtremes } from "./evaluate/extremes.js";
export { compiledPlanOf, type CompiledPlan } from "./plan/compiledPlan.js";
export { blockExtremesEvaluator, extremesBlock, type BlockExtremesEvaluator, type ExtremesBlock } from "./evaluate/blockExtremes.js";
export { governing, defaultCriteria, type GoverningRow, type GoverningOptions } from "./evaluate/governing.js";
export { parseCriterion, criterionNames, type Criterion } from "./evaluate/criteria.js";
export type { Arith } from "./expression/ast.js";
export { factored, type FactoredRow } from "./evaluate/factored.js";
export { comboRows, type ComboRow } from "./evaluate/combos.js";
export { explain, findRow, type Explanation, type ExplanationLine } from "./evaluate/explain.js";
export { DEFAULT_ROW_LIMIT, enumerateRows, labelOf, listRows, rowLabel, rowValue, rowValues } from "./evaluate/rows.js";
export { planForTable } from "./planForTable.js";
export { cachedPlanForTable, cachedPlanCount, clearPlanCache, PLAN_CACHE_LIMIT } from "./plan/planCache.js";
export { resultSizes, RULESET_FIELDS, type ResultSize, type ResultSizes } from "./evaluate/resultSizes.js";

// What every surface says (one vocabulary)
export { statusText, approvalWords, approvedByText, VERIFICATION_WORDS, type ApprovalRecord, type ApprovalWords, type StatusText } from "./text/statusText.js";
export { CAUTIONS, cautionLine, compactCautionLine, fullCautions, shortCautions, type Caution } from "./text/cautions.js";
export { sourceText, shippedTwin, type RulesetOrigin } from "./text/sourceText.js";
export { coverageText, fromMemoryText, fromMemoryTexts, FROM_MEMORY_LEAD } from "./text/coverage.js";
export { planOmissions, omissionTexts, type PlanOmissions, type SkippedCombination } from "./text/omissions.js";
export { identityText, stampLine } from "./text/stamp.js";
export { didYouMean, nearest, NearestName, suggestionLimit } from "./text/nearest.js";

// Shipped rulesets
export { shippedRulesets, findShippedRuleset, type ShippedRuleset } from "./library/shippedRulesets.js";

// Firm library: one approved list for many workbooks
export { FIRM_LIBRARY_FORMAT, MAX_FIRM_LIBRARY_CHARACTERS, firmLibrarySchema, type FirmLibraryFile } from "./library/firmLibrarySchema.js";
export { loadFirmLibrary, type FirmLibrary, type FirmLibraryEntry } from "./library/loadFirmLibrary.js";
export { STANDINGS, currentVersion, isLibraryApproved, standingOf, type RulesetStanding, type Standing } from "./library/rulesetStanding.js";
export { STANDING_WORDS, standingSentence, type StandingWords } from "./text/standing.js";
