/**
 * What every output says before its numbers: which ruleset (id, version,
 * fingerprint), whether it is verified (UNVERIFIED up front), the parameters
 * in force, and the cautions. People's formats print it on standard output;
 * csv and json print it on standard error, so standard output stays parseable.
 */
import type { Plan, RulesetStatus } from "../../core/index.js";
import type { ChosenRuleset } from "../input/rulesetOption.js";
import { jsonNumber, numberText } from "./cells.js";
import type { Format } from "./format.js";

export const CAUTIONS: readonly string[] = [
  "Results must be reviewed by a qualified, licensed engineer before they are used in a design.",
  "The adopted code edition and its local amendments govern; a ruleset does not replace them.",
  "Shipped rulesets must be verified against the standard before use; an UNVERIFIED ruleset's factors are from memory.",
];

export function statusWord(status: RulesetStatus): string {
  switch (status.verification) {
    case "checked":
      return "checked";
    case "unverified":
      return "UNVERIFIED";
    case "user":
      return "user";
  }
}

export interface ParameterInForce {
  name: string;
  value: number | string;
  given: boolean;
}

export function parametersInForce(plan: Plan): ParameterInForce[] {
  return plan.ruleset.parameters.map((p) => ({
    name: p.name,
    value: p.kind === "choice" ? (plan.parameters.choices.get(p.name) ?? p.default) : (plan.parameters.numbers.get(p.name) ?? NaN),
    given: plan.parameters.given.has(p.name),
  }));
}

/** Lines naming the ruleset, its status, the parameters and what the case table leaves out. */
export function identityLines(chosen: ChosenRuleset, plan: Plan | null): string[] {
  const { file } = chosen.ruleset;
  const standard = `${file.standard.name} ${file.standard.edition}${file.standard.clauses ? ` ${file.standard.clauses}` : ""}`;
  const lines = [
    `Ruleset: ${file.id} ${file.version} (${chosen.source === "shipped" ? "shipped" : `file ${chosen.source}`}), "${file.title}", ${standard}, fingerprint ${chosen.status.shortFingerprint}`,
    `Status: ${chosen.status.summary}`,
  ];
  if (chosen.status.verification === "unverified") {
    lines.unshift("*** UNVERIFIED RULESET: its factors are from memory and have not been checked against the standard ***");
  }
  if (plan) {
    const params = parametersInForce(plan);
    if (params.length > 0) {
      lines.push(`Parameters: ${params.map((p) => `${p.name} = ${typeof p.value === "number" ? numberText(p.value) : p.value} (${p.given ? "given" : "default"})`).join(", ")}`);
    }
    const skipped = plan.combinations.filter((c) => c.skipped !== null).map((c) => `${c.combination.id} (${c.skipped})`);
    if (skipped.length > 0) lines.push(`Skipped combinations: ${skipped.join("; ")}`);
    const missing = [...new Set(plan.combinations.filter((c) => c.skipped === null).flatMap((c) => c.notSupplied))];
    if (missing.length > 0) lines.push(`Not in the case table (taken as zero): ${missing.join(", ")}`);
  }
  return lines;
}

/** Identity (where a ruleset is in use) and cautions, shaped for the format. */
export function preambleLines(chosen: ChosenRuleset | null, plan: Plan | null, format: Format): string[] {
  const identity = chosen ? identityLines(chosen, plan) : [];
  const cautions = CAUTIONS.map((c) => `Caution: ${c}`);
  if (format === "md") return [...identity.map((l) => `> ${l}  `), ...(identity.length > 0 ? [">"] : []), ...cautions.map((l) => `> ${l}  `), ""];
  if (format === "table") return [...identity, ...cautions, ""];
  return [...identity, ...cautions].map((l) => `loadwright: ${l}`);
}

/** The `ruleset` object of every JSON output (docs/command-line.md, "JSON output"). */
export function rulesetJson(chosen: ChosenRuleset) {
  const { file } = chosen.ruleset;
  return {
    id: file.id,
    title: file.title,
    standard: { name: file.standard.name, edition: file.standard.edition },
    version: file.version,
    fingerprint: chosen.status.fingerprint,
    status: chosen.status.verification,
    approval: chosen.status.approval,
    summary: chosen.status.summary,
    source: chosen.source,
  };
}

export function parametersJson(plan: Plan) {
  return parametersInForce(plan).map((p) => ({ name: p.name, value: typeof p.value === "number" ? jsonNumber(p.value) : p.value, given: p.given }));
}

/** What opens every JSON output of a command on a case table: the ruleset, the parameters in force, the cautions. */
export function jsonHeader(chosen: ChosenRuleset, plan: Plan) {
  return { ruleset: rulesetJson(chosen), parameters: parametersJson(plan), cautions: CAUTIONS };
}

/** The same header opening a streamed JSON document, up to the named list that follows: `{"ruleset":…,"rows":[`. */
export function streamedJsonStart(chosen: ChosenRuleset, plan: Plan, list: string): string {
  return `${JSON.stringify(jsonHeader(chosen, plan)).slice(0, -1)},${JSON.stringify(list)}:[`;
}
