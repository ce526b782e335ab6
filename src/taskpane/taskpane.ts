/**
 * The task pane: the cautions, always in view, and five views over the
 * rulesets a formula can name — Library (status, approval, source,
 * fingerprint, combination list), Editor (drafts kept apart from the stored
 * copies), Compare, Approve, and Import / export. Views are plain DOM, built
 * from the shared state each time they are shown.
 */
import { fullCautions } from "../core/index.js";
import type { RulesetLibrary } from "../workbook/rulesetLibrary.js";
import { approveView } from "./approveView.js";
import { compareView } from "./compareView.js";
import { el } from "./dom.js";
import { DraftStore } from "./draftStore.js";
import { editorView } from "./editorView.js";
import { firmLibraryView } from "./firmLibraryView.js";
import { libraryView } from "./libraryView.js";
import { libraryFunctions, type PaneContext, type ViewName } from "./paneContext.js";
import { sheetView } from "./sheetView.js";
import { transferView } from "./transferView.js";

export interface PaneOptions {
  inExcel: boolean;
  /** The rulesets formulas can name: the pane lists, stores and approves them here. */
  library: RulesetLibrary;
  /** Where drafts are kept; the browser's local storage unless given. */
  draftStorage?: Storage | null;
}

const VIEWS: { name: ViewName; label: string; render: (ctx: PaneContext) => HTMLElement }[] = [
  { name: "library", label: "Library", render: libraryView },
  { name: "editor", label: "Editor", render: editorView },
  { name: "compare", label: "Compare", render: compareView },
  { name: "approve", label: "Approve", render: approveView },
  { name: "firm-library", label: "Firm library", render: firmLibraryView },
  { name: "sheet", label: "Sheet", render: sheetView },
  { name: "transfer", label: "Import / export", render: transferView },
];

export function startTaskPane(doc: Document, options: PaneOptions): void {
  const $ = (id: string): HTMLElement => {
    const found = doc.getElementById(id);
    if (!found) throw new Error(`taskpane.html has no #${id}`);
    return found;
  };
  $("lw-mode").textContent = options.inExcel
    ? `In Excel: formulas LW.* are available; stored rulesets live in ${options.library.where}.`
    : `In a browser (demo, no Excel): stored rulesets live in ${options.library.where}.`;
  $("lw-cautions").replaceChildren(...fullCautions().map((text) => el(doc, "p", {}, text)));

  const storage = options.draftStorage !== undefined ? options.draftStorage : safeLocalStorage(doc);
  const notice = $("lw-notice");
  const tabs = $("lw-tabs");
  const panel = $("lw-view");
  let current: ViewName = "library";
  // A notice given just before a view is switched to (after storing, say) is shown there; older ones go.
  let noticeFresh = false;

  const ctx: PaneContext = {
    doc,
    inExcel: options.inExcel,
    storedWhere: options.inExcel ? "this workbook" : "this browser",
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
      renderTabs();
      panel.setAttribute("aria-labelledby", `lw-tab-${view}`);
      panel.setAttribute("data-view", view);
      panel.replaceChildren(viewNamed(view).render(ctx));
      doc.defaultView?.scrollTo({ top: scroll });
    },
  };

  const renderTabs = () => {
    tabs.replaceChildren(
      ...VIEWS.map((v) => {
        const selected = v.name === current;
        const tab = el(doc, "button", { type: "button", role: "tab", id: `lw-tab-${v.name}`, "aria-selected": String(selected), "aria-controls": "lw-view", tabindex: selected ? "0" : "-1" }, v.label);
        tab.addEventListener("click", () => ctx.show(v.name));
        return tab;
      }),
    );
  };
  // Tabs follow the usual keyboard pattern: arrows move between them, Home and End to the ends.
  tabs.addEventListener("keydown", (e) => {
    const i = VIEWS.findIndex((v) => v.name === current);
    const to = e.key === "ArrowRight" ? (i + 1) % VIEWS.length : e.key === "ArrowLeft" ? (i + VIEWS.length - 1) % VIEWS.length : e.key === "Home" ? 0 : e.key === "End" ? VIEWS.length - 1 : -1;
    if (to < 0) return;
    e.preventDefault();
    ctx.show(VIEWS[to].name);
    doc.getElementById(`lw-tab-${VIEWS[to].name}`)?.focus();
  });
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
