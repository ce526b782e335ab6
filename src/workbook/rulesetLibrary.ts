/**
 * The rulesets a formula or the task pane can name by id: those stored with the
 * workbook (a firm's approved copies) and those shipped with Loadwright. A stored
 * ruleset wins over a shipped one with the same id, and says so, so a workbook
 * keeps computing with the copy its firm approved. The add-in's entry makes one
 * library and hands it to the formulas and the pane.
 */
import { describeProblem, rulesetStatus, shippedRulesets, shippedTwin, type Ruleset, type RulesetOrigin, type RulesetStatus } from "../core/index.js";
import type { RulesetStore } from "./rulesetStore.js";

export type RulesetSource = "shipped" | "stored" | "cells";

export interface LibraryEntry {
  id: string;
  source: "shipped" | "stored";
  /** Null for a stored entry that no longer validates; `problem` says why. */
  ruleset: Ruleset | null;
  status: RulesetStatus | null;
  problem: string | null;
  /** For a stored ruleset whose id is also shipped: the shipped one's fingerprint. */
  shippedFingerprint: string | null;
}

export interface Library {
  entries: LibraryEntry[];
  /** Why the stored rulesets could not be read, if they could not. */
  storeProblem: string | null;
}

export class RulesetLibrary {
  /** A stored ruleset's status, computed once per loaded content (the fingerprint hashes the whole file). */
  private readonly statusCache = new WeakMap<Ruleset, RulesetStatus>();

  constructor(private current: RulesetStore) {}

  get store(): RulesetStore {
    return this.current;
  }

  /** Where stored rulesets are kept, in words ("this workbook (document settings)"). */
  get where(): string {
    return this.current.backend.where;
  }

  /** The entry moves stored rulesets elsewhere once it knows where it runs (browser storage outside Excel). */
  useStore(store: RulesetStore): void {
    this.current = store;
  }

  list(): Library {
    const shipped = shippedRulesets();
    const stored = this.current.entries();
    const entries: LibraryEntry[] = [];
    const storedIds = new Set<string>();
    if (stored.ok) {
      for (const e of stored.value) {
        storedIds.add(e.id);
        const twin = shipped.find((s) => s.id === e.id);
        entries.push({
          id: e.id,
          source: "stored",
          ruleset: e.loaded.ok ? e.loaded.value : null,
          status: e.loaded.ok ? this.statusOf(e.loaded.value) : null,
          problem: e.loaded.ok ? null : e.loaded.problems.map((p) => describeProblem(p)).join("; "),
          shippedFingerprint: twin ? twin.status.fingerprint : null,
        });
      }
    }
    for (const s of shipped) {
      if (storedIds.has(s.id)) continue;
      entries.push({ id: s.id, source: "shipped", ruleset: s.ruleset, status: s.status, problem: null, shippedFingerprint: null });
    }
    return {
      entries,
      storeProblem: stored.ok ? null : stored.problems.map((p) => describeProblem(p)).join("; "),
    };
  }

  find(id: string): LibraryEntry | undefined {
    return this.list().entries.find((e) => e.id === id);
  }

  private statusOf(ruleset: Ruleset): RulesetStatus {
    let status = this.statusCache.get(ruleset);
    if (!status) {
      status = rulesetStatus(ruleset);
      this.statusCache.set(ruleset, status);
    }
    return status;
  }
}

/** Where a library entry comes from, for the catalogue's words; `where` names the store ("this workbook", "this browser"). */
export function entryOrigin(entry: Pick<LibraryEntry, "source" | "shippedFingerprint" | "status">, where: string): RulesetOrigin {
  if (entry.source === "shipped") return { kind: "shipped" };
  return { kind: "stored", where, shipped: shippedTwin(entry.shippedFingerprint, entry.status?.fingerprint ?? null) };
}
