/**
 * What rests on what: for every combination of a ruleset, the provenance
 * entries that confirm it and those that leave part of it open from memory.
 * This is what a checker reads to audit a ruleset against its sources, one
 * combination at a time; the counts agree with `combinationCoverage`.
 */
import type { Ruleset } from "./model.js";
import type { ProvenanceFile } from "./schema.js";

/** A provenance entry with its place in the ruleset's provenance list (0-based). */
export interface NumberedSource {
  index: number;
  entry: ProvenanceFile;
}

export interface CombinationVerification {
  id: string;
  clause: string;
  /** The confirmed entries that name this combination. */
  confirmedBy: NumberedSource[];
  /** The from-memory entries that name this combination: what is still open in it. */
  openBy: NumberedSource[];
  /** Named by a confirmed entry and by no from-memory one (never for a ruleset typed in cells). */
  confirmed: boolean;
}

export interface RulesetVerification {
  combinations: CombinationVerification[];
  /** Every confirmed entry, in provenance order. */
  sources: NumberedSource[];
  /** Every from-memory entry, in provenance order. */
  fromMemory: NumberedSource[];
}

export function verificationOf(ruleset: Ruleset): RulesetVerification {
  const numbered = ruleset.file.provenance.map((entry, index) => ({ index, entry }));
  const sources = numbered.filter((s) => s.entry.status === "confirmed");
  const fromMemory = numbered.filter((s) => s.entry.status === "from-memory");
  const naming = (list: NumberedSource[], id: string) => list.filter((s) => (s.entry.combinations ?? []).includes(id));
  const combinations = ruleset.file.combinations.map((c) => {
    const confirmedBy = naming(sources, c.id);
    const openBy = naming(fromMemory, c.id);
    return { id: c.id, clause: c.clause, confirmedBy, openBy, confirmed: ruleset.origin !== "cells" && confirmedBy.length > 0 && openBy.length === 0 };
  });
  return { combinations, sources, fromMemory };
}
