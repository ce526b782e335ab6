/**
 * The rulesets the Sheet view can work with: the drafts that load (for the
 * preview only: a formula cannot name a draft) and every ruleset a formula
 * can name, as the library lists them (stored first, then shipped). The one
 * chosen first is the ruleset being edited, else the library's selection.
 */
import type { Ruleset, RulesetStatus } from "../core/index.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { checkDraft } from "./draftCheck.js";
import { draftId } from "./draftLabel.js";
import type { PaneContext } from "./paneContext.js";
import { unverifiedSuffix } from "./statusText.js";

export interface SheetChoice {
  /** "draft:<key>" or "entry:<id>". */
  value: string;
  label: string;
  group: "Drafts" | "Stored" | "Shipped";
  ruleset: Ruleset | null;
  status: RulesetStatus | null;
  /** The library entry a formula would name, or null for a draft. */
  entry: LibraryEntry | null;
  /** Why it cannot be used, where it does not load. */
  why: string | null;
}

export function sheetChoices(ctx: PaneContext): SheetChoice[] {
  const out: SheetChoice[] = [];
  for (const d of ctx.drafts.list()) {
    const check = checkDraft(d.text, d.base.approval);
    out.push({
      value: `draft:${d.key}`,
      label: `draft ${draftId(d)}${check.ruleset ? unverifiedSuffix(check.status) : " (does not load)"}`,
      group: "Drafts",
      ruleset: check.ruleset,
      status: check.status,
      entry: null,
      why: check.ruleset ? null : `the draft ${draftId(d)} does not load yet (see the Editor)`,
    });
  }
  for (const e of ctx.library().entries) {
    const stored = e.source === "stored";
    out.push({
      value: `entry:${e.id}`,
      label: `${e.id} (${stored ? "stored" : "shipped"})${e.ruleset ? unverifiedSuffix(e.status) : " (does not load)"}`,
      group: stored ? "Stored" : "Shipped",
      ruleset: e.ruleset,
      status: e.status,
      entry: e,
      why: e.ruleset ? null : `the stored ruleset ${e.id} does not load: ${e.problem ?? "unknown problem"}`,
    });
  }
  return out;
}

/** The draft open in the editor where it loads, else the library's selection, else the first ruleset a formula can name. */
export function defaultChoice(ctx: PaneContext, choices: readonly SheetChoice[]): string {
  const has = (v: string) => choices.some((c) => c.value === v && c.ruleset !== null);
  if (ctx.openDraft && has(`draft:${ctx.openDraft}`)) return `draft:${ctx.openDraft}`;
  if (ctx.selected && has(`entry:${ctx.selected}`)) return `entry:${ctx.selected}`;
  return choices.find((c) => c.entry !== null && c.ruleset !== null)?.value ?? choices[0]?.value ?? "";
}
