/**
 * What the pane's views share: the document, where stored rulesets live, the
 * drafts, the library selection and the open draft, a notice line, and the
 * way to switch views. Each view renders from this state when shown.
 */
import { library, rulesetStore, type Library } from "../addin/rulesetLibrary.js";
import type { RulesetStore } from "../addin/rulesetStore.js";
import type { DraftStore } from "./draftStore.js";

export type ViewName = "library" | "editor" | "compare" | "approve" | "transfer";

export interface ComparePair {
  before: string;
  after: string;
}

export interface PaneContext {
  doc: Document;
  inExcel: boolean;
  /** Short words for where stored rulesets live: "this workbook" or "this browser". */
  storedWhere: string;
  drafts: DraftStore;
  /** The library entry selected (by id), shared by Library, Approve and Export. */
  selected: string | null;
  /** The draft open in the editor. */
  openDraft: string | null;
  /** The pair Compare shows, as option values ("shipped:id", "stored:id", "draft:key"). */
  comparePair: ComparePair | null;
  library(): Library;
  store(): RulesetStore;
  /** A line under the tabs: what just happened, or what went wrong. */
  notice(text: string, kind?: "done" | "problem"): void;
  show(view: ViewName): void;
}

export function storeFunctions(): Pick<PaneContext, "library" | "store"> {
  return { library, store: rulesetStore };
}
