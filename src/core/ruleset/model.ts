/** The validated, parsed form of a ruleset that the planner works from. */
import type { Sum } from "../expression/ast.js";
import type { CaseMode, RulesetFile } from "./schema.js";

export type { CaseMode } from "./schema.js";

export interface LoadSymbol {
  name: string;
  description: string;
  permanent: boolean;
  reversible: boolean;
  cases: CaseMode;
  /** A number or the name of a value. */
  orthogonalShare: number | string;
  canBeAbsent: boolean;
  /** Attribute name → a number or the name of a value. */
  attributes: ReadonlyMap<string, number | string>;
}

export interface NumberParameter {
  kind: "number";
  name: string;
  description: string;
  unit?: string;
  default?: number;
  min?: number;
  max?: number;
  allowed?: number[];
}

export interface ChoiceParameter {
  kind: "choice";
  name: string;
  description: string;
  default: string;
  /** Choice → value name → number. Every choice sets the same value names. */
  choices: ReadonlyMap<string, ReadonlyMap<string, number>>;
  valueNames: string[];
}

export type Parameter = NumberParameter | ChoiceParameter;

export interface Combination {
  index: number;
  id: string;
  /** For a ruleset typed in cells: the 0-based row of the range it was typed on. */
  sourceRow?: number;
  clause: string;
  expression: string;
  description?: string;
  sum: Sum;
}

/** What a name in a factor stands for. */
export type ValueKind = "parameter" | "choice-value" | "attribute";

export interface Ruleset {
  /** The file content exactly as validated: what the fingerprint hashes and what is stored. */
  file: RulesetFile;
  /** "file": a ruleset file; "cells": combinations typed into a worksheet range. */
  origin: "file" | "cells";
  symbols: LoadSymbol[];
  symbolByName: ReadonlyMap<string, LoadSymbol>;
  parameters: Parameter[];
  parameterByName: ReadonlyMap<string, Parameter>;
  /** Every name a factor may use, and what it is. */
  values: ReadonlyMap<string, ValueKind>;
  combinations: Combination[];
}

/** How messages name a ruleset: its id, or "the typed ruleset" for one typed in cells. */
export function rulesetName(ruleset: Ruleset): string {
  return ruleset.origin === "cells" ? "the typed ruleset" : ruleset.file.id;
}
