/**
 * Drafts: rulesets being edited, kept apart from the stored copies in the
 * browser's storage so that a reload (or Excel closing the pane) does not lose
 * them. A draft is its JSON text exactly as the user left it — valid or not —
 * with what it was opened from. Nothing here touches the stored rulesets.
 */
import { parseJson } from "./dataPath.js";
import type { ApprovalBlock } from "./draftCheck.js";

export const DRAFTS_KEY = "loadwright.drafts";
export const DRAFTS_FORMAT = "loadwright-drafts/1";

export interface DraftBase {
  /** What the draft was opened from. */
  kind: "shipped" | "stored" | "imported" | "new";
  /** The id it was opened from (a shipped or stored ruleset), null for an import or a new one. */
  id: string | null;
  /** The fingerprint of that ruleset when the draft was opened, to notice a stored copy changing meanwhile. */
  fingerprint: string | null;
  /** The approval block at opening: the only one the draft may keep (Approve writes approvals). */
  approval: ApprovalBlock;
}

export interface Draft {
  key: string;
  text: string;
  base: DraftBase;
  /** ISO times. */
  opened: string;
  changed: string;
}

interface DraftsValue {
  format: typeof DRAFTS_FORMAT;
  drafts: Draft[];
}

export class DraftStore {
  private drafts: Draft[] = [];
  /** Why the drafts cannot be kept in storage (unreadable value, storage refused), if so. */
  problem: string | null = null;
  private readOnly = false;

  constructor(private readonly storage: Storage | null) {
    if (!storage) {
      this.problem = "browser storage is not available: drafts last only while this pane is open";
      return;
    }
    const text = storage.getItem(DRAFTS_KEY);
    if (text === null) return;
    const value = parse(text);
    if (value) {
      this.drafts = value.drafts;
    } else {
      this.readOnly = true;
      this.problem = `the drafts kept in this browser (${DRAFTS_KEY}) cannot be read and are left untouched; new drafts last only while this pane is open`;
    }
  }

  list(): readonly Draft[] {
    return this.drafts;
  }

  get(key: string): Draft | undefined {
    return this.drafts.find((d) => d.key === key);
  }

  /** Adds or replaces a draft and keeps all of them; false (with `problem` set) when storage refused. */
  put(draft: Draft): boolean {
    const i = this.drafts.findIndex((d) => d.key === draft.key);
    if (i >= 0) this.drafts[i] = draft;
    else this.drafts.push(draft);
    return this.persist();
  }

  remove(key: string): boolean {
    this.drafts = this.drafts.filter((d) => d.key !== key);
    return this.persist();
  }

  private persist(): boolean {
    if (!this.storage || this.readOnly) return false;
    try {
      const value: DraftsValue = { format: DRAFTS_FORMAT, drafts: this.drafts };
      this.storage.setItem(DRAFTS_KEY, JSON.stringify(value));
      if (this.problem?.startsWith("the drafts could not be kept")) this.problem = null;
      return true;
    } catch (e) {
      this.problem = `the drafts could not be kept in browser storage (${e instanceof Error ? e.message : String(e)}); they last only while this pane is open — store or export what you need`;
      return false;
    }
  }
}

function parse(text: string): DraftsValue | null {
  const parsed = parseJson(text);
  if (!parsed.ok) return null;
  const value = parsed.value as Partial<DraftsValue> | null;
  if (!value || value.format !== DRAFTS_FORMAT || !Array.isArray(value.drafts)) return null;
  const ok = value.drafts.every(
    (d) => d && typeof d.key === "string" && typeof d.text === "string" && d.base && typeof d.base.kind === "string" && typeof d.opened === "string",
  );
  return ok ? (value as DraftsValue) : null;
}

/** A key for a new draft, unique in this browser. */
export function newDraftKey(): string {
  const random = typeof crypto !== "undefined" && "randomUUID" in crypto ? crypto.randomUUID() : `${Date.now()}-${Math.random().toString(36).slice(2)}`;
  return `draft-${random}`;
}
