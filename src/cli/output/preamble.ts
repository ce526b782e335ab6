/**
 * What every output says before its numbers: which ruleset (id, version,
 * fingerprint), whether it is verified (UNVERIFIED up front), the parameters
 * in force, what the case table leaves out, and the cautions — in the
 * catalogue's words (core/text). People's formats print it on standard output;
 * csv and json print it on standard error, so standard output stays parseable.
 */
import { coverageText, FROM_MEMORY_LEAD, fromMemoryTexts, omissionTexts, planOmissions, shortCautions, statusText, type Plan, type RulesetStatus } from "../../core/index.js";
import type { ChosenRuleset } from "../input/rulesetOption.js";
import { jsonNumber, numberText } from "./cells.js";
import type { Format } from "./format.js";

/** The cautions in their short form, one a line (the JSON outputs carry the same). */
export const CAUTIONS: readonly string[] = shortCautions();

/** The verification word a stamp starts with: UNVERIFIED, NOT CHECKED, Checked. */
export function statusWord(status: RulesetStatus): string {
  return statusText(status, { approvedBy: null, date: null }).word;
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
  const words = statusText(chosen.status, file.approval);
  const lines = [
    ...(words.banner ? [words.banner] : []),
    `Ruleset: ${file.id} ${file.version} (${chosen.source === "shipped" ? "shipped" : `file ${chosen.source}`}), "${file.title}", ${standard}, fingerprint ${chosen.status.shortFingerprint}`,
    `Status: ${words.summary}`,
  ];
  if (chosen.status.verification === "unverified") {
    // What exactly is unverified: the combinations no public source confirms, and each from-memory part.
    lines.push(`Sources: ${coverageText(chosen.status.combinations)}`, FROM_MEMORY_LEAD, ...fromMemoryTexts(file).map((t) => `- ${t}`));
  }
  if (plan) {
    const params = parametersInForce(plan);
    if (params.length > 0) {
      lines.push(`Parameters: ${params.map((p) => `${p.name} = ${typeof p.value === "number" ? numberText(p.value) : p.value} (${p.given ? "given" : "default"})`).join(", ")}`);
    }
    for (const note of omissionTexts(planOmissions(plan))) lines.push(`Note: ${note}`);
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
    // How many combinations a public source confirms, and what is from memory: what exactly is unverified.
    confirmed: chosen.status.combinations.confirmed,
    combinations: chosen.status.combinations.total,
    fromMemory: file.provenance.filter((p) => p.status === "from-memory").map((p) => ({ source: p.source, covers: p.covers, combinations: p.combinations ?? [] })),
  };
}

export function parametersJson(plan: Plan) {
  return parametersInForce(plan).map((p) => ({ name: p.name, value: typeof p.value === "number" ? jsonNumber(p.value) : p.value, given: p.given }));
}

/** What opens every JSON output of a command on a case table: the ruleset, the parameters in force, the cautions. */
export function jsonHeader(chosen: ChosenRuleset, plan: Plan) {
  return { ruleset: rulesetJson(chosen), parameters: parametersJson(plan), cautions: [...CAUTIONS] };
}

/** The same header opening a streamed JSON document, up to the named list that follows: `{"ruleset":…,"rows":[`. */
export function streamedJsonStart(chosen: ChosenRuleset, plan: Plan, list: string): string {
  return `${JSON.stringify(jsonHeader(chosen, plan)).slice(0, -1)},${JSON.stringify(list)}:[`;
}
