/**
 * The task pane's shell: the caution line, always in view, the strip of views
 * over the rulesets a formula can name — Library (status, approval, source,
 * fingerprint, combination list), Editor (drafts kept apart from the stored
 * copies), Compare, Approve, and Import / export — a notice line, and the
 * theme. Views are plain DOM, built from the shared state each time they are shown.
 */
import type { CautionAcknowledgement } from "../workbook/cautionAcknowledgement.js";
import type { RulesetLibrary } from "../workbook/rulesetLibrary.js";
import { approveView } from "./approveView.js";
import { renderCautionLine } from "./cautionLine.js";
import { compareView } from "./compareView.js";
import { trackHeight } from "./dom.js";
import { DraftStore } from "./draftStore.js";
import { editorView } from "./editorView.js";
import { firmLibraryView } from "./firmLibraryView.js";
import { libraryView } from "./libraryView.js";
import { libraryFunctions, type PaneContext, type ViewName } from "./paneContext.js";
import { sheetView } from "./sheetView.js";
import { tabStrip, type TabSpec } from "./tabStrip.js";
import { applyTheme, type PaneTheme } from "./theme.js";
import { transferView } from "./transferView.js";

export interface PaneOptions {
  inExcel: boolean;
  /** The rulesets formulas can name: the pane lists, stores and approves them here. */
  library: RulesetLibrary;
  /** Whether the cautions were read for this workbook, kept with it. */
  cautions: CautionAcknowledgement;
  /** The host's theme where it reports one; null follows the system's preference. */
  theme: PaneTheme | null;
  /** Where drafts are kept; the browser's local storage unless given. */
  draftStorage?: Storage | null;
}

/**
 * The views, in the order of the strip. The strip holds seven at 320 px; Import / export stays
 * last (End goes there). A view's icon is the one of its name in icons.ts unless `icon` names another.
 */
const VIEWS: (TabSpec<ViewName> & { render: (ctx: PaneContext) => HTMLElement })[] = [
  { name: "library", label: "Library", render: libraryView },
  { name: "editor", label: "Editor", render: editorView },
  { name: "compare", label: "Compare", render: compareView },
  { name: "approve", label: "Approve", render: approveView },
  { name: "firm-library", label: "Firm library", icon: "firm", render: firmLibraryView },
  { name: "sheet", label: "Sheet", icon: "sheet", render: sheetView },
  { name: "transfer", label: "Import / export", render: transferView },
];

export function startTaskPane(doc: Document, options: PaneOptions): void {
  const $ = (id: string): HTMLElement => {
    const found = doc.getElementById(id);
    if (!found) throw new Error(`taskpane.html has no #${id}`);
    return found;
  };
  applyTheme(doc, options.theme);
  const storedWhere = options.inExcel ? "this workbook" : "this browser";
  $("lw-mode").textContent = options.inExcel
    ? `In Excel: formulas LW.* are available; stored rulesets live in ${options.library.where}.`
    : `In a browser (demo, no Excel): stored rulesets live in ${options.library.where}.`;
  renderCautionLine(doc, $("lw-cautions"), { record: options.cautions, keptIn: storedWhere });
  trackHeight($("lw-top"), "--lw-top-height");

  const storage = options.draftStorage !== undefined ? options.draftStorage : safeLocalStorage(doc);
  const notice = $("lw-notice");
  const panel = $("lw-view");
  let current: ViewName = "library";
  // A notice given just before a view is switched to (after storing, say) is shown there; older ones go.
  let noticeFresh = false;

  const ctx: PaneContext = {
    doc,
    inExcel: options.inExcel,
    storedWhere,
    drafts: new DraftStore(storage),
    selected: null,
    openDraft: null,
    comparePair: null,
    editors: new Map(),
    ...libraryFunctions(options.library),
    notice: (text, kind = "done") => {
      notice.textContent = text;
      notice.className = kind === "problem" ? "notice notice-problem" : "notice";
      notice.hidden = false;
      noticeFresh = true;
    },
    show: (view) => {
      const same = view === current;
      const scroll = same ? (doc.defaultView?.scrollY ?? 0) : 0;
      if (!same && !noticeFresh) notice.hidden = true;
      noticeFresh = false;
      current = view;
      tabs.render(view);
      panel.setAttribute("aria-labelledby", `lw-tab-${view}`);
      panel.setAttribute("data-view", view);
      panel.replaceChildren(viewNamed(view).render(ctx));
      doc.defaultView?.scrollTo({ top: scroll });
    },
  };
  const tabs = tabStrip(doc, $("lw-tabs"), VIEWS, (view) => ctx.show(view));
  ctx.show("library");
}

function viewNamed(name: ViewName): (typeof VIEWS)[number] {
  const view = VIEWS.find((v) => v.name === name);
  if (!view) throw new Error(`no view ${name}`);
  return view;
}

function safeLocalStorage(doc: Document): Storage | null {
  try {
    return doc.defaultView?.localStorage ?? null;
  } catch {
    return null;
  }
}
