/**
 * A plan is a ruleset resolved once for one parameter set and one list of case
 * headers: every combination broken into terms, every term into the options it
 * may take (alternatives, signs, directions, left out), each option a sparse
 * list of factors on cases. Evaluating a component is then only sums over the
 * plan, and the row that gives a value is named by one option per term.
 */
import type { Combination, Ruleset } from "../ruleset/model.js";
import type { ParameterValues } from "../params/resolveParameters.js";

export interface PlanCase {
  header: string;
  symbol: string;
}

/** One factor on one case, with how it came about (for explanations). */
export interface Contribution {
  caseIndex: number;
  factor: number;
  /** e.g. "(1.2 + 0.2 × SDS)", "rho × 0.3 (orthogonal share) × −1 (reversed)" */
  why: string;
}

export interface TermOption {
  contributions: Contribution[];
  /** This option leaves the term out. */
  absent: boolean;
}

export interface PlannedTerm {
  /** The term as written, for "absent: …" in labels. */
  text: string;
  options: TermOption[];
}

/** One assignment of the choices several terms share (which action leads, a repeated symbol's case). */
export interface Branch {
  /** e.g. "Q leading"; empty when nothing is shared. */
  note: string;
  /** The leading symbol of lead(…), if any, and its term index. */
  leader?: { symbol: string; term: number };
  terms: PlannedTerm[];
}

export interface PlannedCombination {
  combination: Combination;
  /** Why the combination gives no rows (a "!" term's symbols not in the table), or null. */
  skipped: string | null;
  /** Symbols the combination uses that the case table does not supply. */
  notSupplied: string[];
  /** Terms that may be left out where that is worse, as written. */
  mayBeAbsent: string[];
  branches: Branch[];
  /** Concrete rows: the sum over branches of the product of option counts. */
  rowCount: number;
}

export interface Plan {
  ruleset: Ruleset;
  parameters: ParameterValues;
  cases: PlanCase[];
  /** Symbol → indices of its cases, in table order. */
  casesOf: ReadonlyMap<string, number[]>;
  combinations: PlannedCombination[];
  rowCount: number;
}

/** A concrete row: one branch of one combination and one option per term. */
export interface RowRef {
  combination: number;
  branch: number;
  choices: number[];
}
