/**
 * The ruleset file format (`loadwright-ruleset/1`), as a zod schema. Objects are
 * strict: a field we do not know is an error, never silently ignored, because a
 * misspelt field in a load combination file is a wrong number waiting to happen.
 */
import { z } from "zod";

export const RULESET_FORMAT = "loadwright-ruleset/1";

/** Load symbols, parameters and values: a letter, then letters, digits or "_" (D, Lr, SDS, psi0, Ω0). */
export const NAME_PATTERN = /^[\p{L}_][\p{L}\p{N}_]*$/u;

/** A ruleset id: lower-case letters, digits, ".", "_", "-" (asce7-16-strength). */
export const RULESET_ID_PATTERN = /^[a-z0-9][a-z0-9._-]*$/;

const name = z.string().regex(NAME_PATTERN, "must start with a letter and hold only letters, digits and _");
const text = z.string().trim().min(1, "must not be empty");

export const permanenceSchema = z.enum(["permanent", "transient"]);
export type Permanence = z.infer<typeof permanenceSchema>;

/**
 * How several cases of one load symbol in a table combine: "sum" (all act
 * together), "each" (one at a time, in turn), "orthogonal" (each direction
 * leading at full value with the others at `orthogonalShare`, all signs),
 * "independent" (all act, each taking its term's factor options on its own:
 * permanent actions from different sources).
 */
export const caseModeSchema = z.enum(["sum", "each", "orthogonal", "independent"]);
export type CaseMode = z.infer<typeof caseModeSchema>;

/** ASCE/SEI 7-16 §12.5.3: 100 % in one direction plus 30 % in the perpendicular one [confirmed for the 7-10 text]. */
export const DEFAULT_ORTHOGONAL_SHARE = 0.3;

/** What a symbol's unwritten optional fields mean, by its permanence (docs/rulesets.md, "Rulesets"). */
export const SYMBOL_DEFAULTS: Readonly<Record<Permanence, { reversible: boolean; cases: CaseMode; canBeAbsent: boolean }>> = {
  permanent: { reversible: false, cases: "sum", canBeAbsent: false },
  transient: { reversible: false, cases: "each", canBeAbsent: true },
};

export const provenanceStatusSchema = z.enum(["confirmed", "from-memory"]);

export const symbolSchema = z.strictObject({
  description: text,
  permanence: permanenceSchema,
  /** Acts in both directions: every case of the symbol is taken with + and − sign. */
  reversible: z.boolean().optional(),
  /** How several cases of this symbol in one table combine; unwritten: SYMBOL_DEFAULTS by permanence. */
  cases: caseModeSchema.optional(),
  /** The share of the non-leading directions under "orthogonal": a number or a value name; unwritten: DEFAULT_ORTHOGONAL_SHARE. */
  orthogonalShare: z.union([z.number(), name]).optional(),
  /** May a term of this symbol be left out where that is worse? Default: transient yes, permanent no. */
  canBeAbsent: z.boolean().optional(),
  /** Per-symbol values used in factors, e.g. psi0: 0.7 or psi0: "psi0_Q". */
  attributes: z.record(name, z.union([z.number(), name])).optional(),
});

export const numberParameterSchema = z.strictObject({
  type: z.literal("number"),
  description: text,
  unit: z.string().optional(),
  /** Omitted: the user must give a value. */
  default: z.number().optional(),
  min: z.number().optional(),
  max: z.number().optional(),
  /** Only these values are allowed (e.g. 0.5 or 1.0 for the live load factor). */
  allowed: z.array(z.number()).min(1).optional(),
});

export const choiceParameterSchema = z.strictObject({
  type: z.literal("choice"),
  description: text,
  default: text,
  /** Each choice sets the same named values, e.g. category "B": {psi0_Q: 0.7, psi1_Q: 0.5, psi2_Q: 0.3}. */
  choices: z.record(text, z.record(name, z.number())),
});

export const parameterSchema = z.discriminatedUnion("type", [numberParameterSchema, choiceParameterSchema]);

export const combinationSchema = z.strictObject({
  id: text,
  expression: text,
  /** Clause, equation or table row of the standard this combination comes from. */
  clause: text,
  description: z.string().optional(),
});

export const provenanceSchema = z.strictObject({
  /** The published source, with edition and clause or page. */
  source: text,
  /**
   * Where a checker finds it: title, issuing body, web address or document
   * number, and the clause it quotes. Every shipped "confirmed" entry has one.
   */
  locator: text.optional(),
  /** The web address a checker opens first; the locator names any further pages. */
  address: z
    .string()
    .regex(/^https?:\/\/[^\s<>"]+$/, "must be a web address (https://…) without spaces, quotes or angle brackets")
    .optional(),
  /** A number a checker can look a document up by (ISBN, report, permit or document number). */
  document: text.optional(),
  /** "confirmed": checked against the source; "from-memory": recalled, to be verified. */
  status: provenanceStatusSchema,
  /** Which parts of the ruleset this source covers, in words. */
  covers: text,
  /** The ids of the combinations this source vouches for (or, if from memory, leaves open). */
  combinations: z.array(text).optional(),
  note: z.string().optional(),
});

export const approvalSchema = z.strictObject({
  approvedBy: z.string().nullable(),
  /** ISO date, e.g. 2026-11-30. */
  date: z.string().nullable(),
  /** The ruleset fingerprint that was approved; a later change no longer matches it. */
  fingerprint: z.string().nullable(),
  note: z.string().optional(),
});

export const rulesetSchema = z.strictObject({
  format: z.literal(RULESET_FORMAT),
  id: z.string().regex(RULESET_ID_PATTERN, "must be lower-case letters, digits, '.', '_' or '-'"),
  title: text,
  standard: z.strictObject({ name: text, edition: text, clauses: z.string().optional() }),
  /** Design basis, e.g. "strength design (LRFD)". */
  basis: z.string().optional(),
  version: text,
  symbols: z.record(name, symbolSchema),
  parameters: z.record(name, parameterSchema).optional(),
  combinations: z.array(combinationSchema).min(1, "must list at least one combination"),
  notes: z.array(z.string()).optional(),
  provenance: z.array(provenanceSchema).min(1, "must name at least one source"),
  approval: approvalSchema,
});

/** The kinds of parameter ("number", "choice"), read off the schema's discriminated union. */
export const PARAMETER_TYPES: readonly string[] = parameterSchema.options.map((o) => o.shape.type.value);

export type RulesetFile = z.infer<typeof rulesetSchema>;
export type SymbolFile = z.infer<typeof symbolSchema>;
export type ProvenanceFile = z.infer<typeof provenanceSchema>;
