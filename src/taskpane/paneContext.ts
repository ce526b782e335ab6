/**
 * What the pane's views share: the document, the ruleset library the add-in's
 * entry hands over, the drafts, the library selection and the open draft, how
 * each draft's editor was left (form or text, which sections open), a notice
 * line, and the way to switch views. Each view renders from this state when shown.
 */
import type { Library, RulesetLibrary } from "../workbook/rulesetLibrary.js";
import type { RulesetStore } from "../workbook/rulesetStore.js";
import type { DraftStore } from "./draftStore.js";

export type ViewName = "library" | "editor" | "compare" | "approve" | "transfer" | "firm-library" | "sheet";

export interface ComparePair {
  before: string;
  after: string;
}

export type EditorMode = "form" | "text";

/** How the editor of one draft was left, kept while the pane is open so that coming back finds it so. */
export interface EditorState {
  mode: EditorMode;
  /** The form sections unfolded. */
  openSections: Set<string>;
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
  /** Draft key → how its editor was left. */
  editors: Map<string, EditorState>;
  library(): Library;
  store(): RulesetStore;
  /** A line under the tabs: what just happened, or what went wrong. */
  notice(text: string, kind?: "done" | "problem"): void;
  show(view: ViewName): void;
}

/** The library's listing and store, read afresh each time a view asks (a save may have changed them). */
export function libraryFunctions(library: RulesetLibrary): Pick<PaneContext, "library" | "store"> {
  return { library: () => library.list(), store: () => library.store };
}

/** The editor state of a draft, made on first opening: the form, with identity and combinations unfolded. */
export function editorState(ctx: PaneContext, key: string): EditorState {
  let state = ctx.editors.get(key);
  if (!state) {
    state = { mode: "form", openSections: new Set(["identity", "combinations"]) };
    ctx.editors.set(key, state);
  }
  return state;
}
