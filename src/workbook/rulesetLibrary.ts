/**
 * The rulesets a formula or the task pane can name by id: those stored with the
 * workbook (a firm's approved copies) and those shipped with Loadwright. A stored
 * ruleset wins over a shipped one with the same id, and says so, so a workbook
 * keeps computing with the copy its firm approved.
 */
import { describeProblem, rulesetStatus, shippedRulesets, type Ruleset, type RulesetStatus } from "../core/index.js";
import { RulesetStore } from "./rulesetStore.js";
import { memoryBackend } from "./settingsBackend.js";

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

let store = new RulesetStore(memoryBackend());

/** A stored ruleset's status, computed once per loaded content (the fingerprint hashes the whole file). */
const statusCache = new WeakMap<Ruleset, RulesetStatus>();
function statusOf(ruleset: Ruleset): RulesetStatus {
  let status = statusCache.get(ruleset);
  if (!status) {
    status = rulesetStatus(ruleset);
    statusCache.set(ruleset, status);
  }
  return status;
}

/** The entry module chooses where stored rulesets live (workbook settings or browser storage). */
export function useRulesetStore(next: RulesetStore): void {
  store = next;
}

export function rulesetStore(): RulesetStore {
  return store;
}

export interface Library {
  entries: LibraryEntry[];
  /** Why the stored rulesets could not be read, if they could not. */
  storeProblem: string | null;
}

export function library(): Library {
  const shipped = shippedRulesets();
  const stored = store.entries();
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
        status: e.loaded.ok ? statusOf(e.loaded.value) : null,
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

export function findInLibrary(id: string): LibraryEntry | undefined {
  return library().entries.find((e) => e.id === id);
}

/** Where stored rulesets are kept, in words. */
export function storeLocation(): string {
  return store.backend.where;
}
