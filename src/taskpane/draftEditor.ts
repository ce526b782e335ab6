/**
 * The editor of one draft: its status (validity, verification, approval), the
 * form or the JSON text, every problem beside its field and in a list, the
 * store bar, the draft's own combination list, and discarding it. The draft is
 * kept as the user types and validated once typing pauses.
 */
import { formatPath } from "../core/index.js";
import { comboList } from "./comboList.js";
import { isObject, parseJson, type JsonObject } from "./dataPath.js";
import { button, el, trackHeight } from "./dom.js";
import { checkDraft, type DraftCheck, type EditorProblem } from "./draftCheck.js";
import { draftId } from "./draftLabel.js";
import { renderStatus, renderSummary } from "./draftStatus.js";
import type { Draft } from "./draftStore.js";
import type { FormContext } from "./formFields.js";
import { syntaxErrorSpot, type TextSpot } from "./jsonLocate.js";
import { baseText } from "./draftLabel.js";
import { editorState, type EditorMode, type EditorState, type PaneContext } from "./paneContext.js";
import { placeProblems } from "./problemPlacement.js";
import { rulesetForm } from "./rulesetForm.js";
import { renderStoreBar } from "./storeBar.js";

/** How long typing must pause before the draft is validated. */
export const VALIDATE_AFTER_MS = 250;

export function draftEditor(ctx: PaneContext, draft: Draft): HTMLElement {
  return new DraftEditor(ctx, draft).root;
}

class DraftEditor {
  readonly root: HTMLElement;
  private text: string;
  /** The mode shown now; a text that is not a JSON object is shown as text whatever was chosen. */
  private mode: EditorMode;
  private check: DraftCheck | null = null;
  private timer: number | undefined;
  private readonly state: EditorState;
  /** What the form itself refuses, by field path. */
  private readonly localProblems = new Map<string, string>();
  private readonly form: FormContext;
  private readonly view: Window;
  private readonly doc: Document;

  private readonly title: HTMLElement;
  private readonly status: HTMLElement;
  private readonly approvalBox: HTMLElement;
  private readonly storeBar: HTMLElement;
  private readonly modeProblem: HTMLElement;
  private readonly summary: HTMLElement;
  private readonly body: HTMLElement;
  private readonly keptProblem: HTMLElement;
  private readonly modeButtons: Record<EditorMode, HTMLButtonElement>;

  constructor(
    private readonly ctx: PaneContext,
    private readonly draft: Draft,
  ) {
    const doc = (this.doc = ctx.doc);
    const view = doc.defaultView;
    if (!view) throw new Error("the pane's document has no window");
    this.view = view;
    this.text = draft.text;
    this.state = editorState(ctx, draft.key);
    this.mode = this.state.mode;
    this.title = el(doc, "h2", { id: "lw-draft-title" });
    this.status = el(doc, "div", { id: "lw-draft-status", "aria-live": "polite" });
    this.approvalBox = el(doc, "div", { id: "lw-draft-approval" });
    this.storeBar = el(doc, "div", { id: "lw-store-bar", class: "store-bar" });
    this.modeProblem = el(doc, "p", { class: "problem", role: "alert", id: "lw-mode-problem" });
    this.modeProblem.hidden = true;
    // The problem list is announced as it changes (it is rewritten only when it does).
    this.summary = el(doc, "div", { id: "lw-draft-problems", "aria-live": "polite" });
    this.body = el(doc, "div", { id: "lw-draft-body" });
    this.keptProblem = el(doc, "p", { class: "problem", role: "alert" });
    this.keptProblem.hidden = true;
    this.modeButtons = {
      form: button(doc, "Form", () => this.switchMode("form"), { id: "lw-mode-form" }),
      text: button(doc, "JSON text", () => this.switchMode("text"), { id: "lw-mode-text" }),
    };
    this.form = {
      doc,
      data: {},
      localProblems: this.localProblems,
      openSections: this.state.openSections,
      changed: () => {
        this.text = `${JSON.stringify(this.form.data, null, 2)}\n`;
        this.keep();
        this.validateSoon();
      },
      rebuild: (focus) => {
        this.text = `${JSON.stringify(this.form.data, null, 2)}\n`;
        this.keep();
        this.renderBody();
        this.validate();
        if (focus) focusOrNear(this.body.querySelector<HTMLElement>(focus));
      },
    };
    this.root = el(
      doc,
      "section",
      { class: "draft", "aria-labelledby": "lw-draft-title" },
      this.title,
      el(doc, "p", { class: "muted" }, `Opened ${draft.opened.slice(0, 16).replace("T", " ")} UTC as ${baseText(draft)}. A draft is kept in this browser, apart from the stored rulesets, until you store it.`),
      this.keptProblem,
      this.status,
      this.approvalBox,
      el(doc, "div", { class: "mode-switch", role: "group", "aria-label": "Edit as" }, this.modeButtons.form, this.modeButtons.text),
      this.modeProblem,
      this.summary,
      this.body,
      this.storeBar,
      this.comboDetails(),
      this.discardControl(),
    );
    this.renderBody();
    this.validate();
    trackHeight(this.storeBar, "--lw-bottom-height");
  }

  /** Keeps the text in browser storage, and says so where storage refused it. */
  private keep(): void {
    this.draft.text = this.text;
    this.draft.changed = new Date().toISOString();
    const kept = this.ctx.drafts.put(this.draft);
    this.keptProblem.hidden = kept;
    this.keptProblem.textContent = kept ? "" : (this.ctx.drafts.problem ?? "the draft could not be kept in browser storage");
  }

  private validateSoon(): void {
    if (this.timer !== undefined) this.view.clearTimeout(this.timer);
    this.status.setAttribute("data-state", "checking");
    this.timer = this.view.setTimeout(() => this.validate(), VALIDATE_AFTER_MS);
  }

  /** The form needs a JSON object; the text view takes anything. */
  private switchMode(next: EditorMode): void {
    if (next === this.mode) return;
    if (next === "form") {
      const why = notAnObject(this.text);
      if (why) {
        this.modeProblem.hidden = false;
        this.modeProblem.textContent = why;
        return;
      }
    }
    this.modeProblem.hidden = true;
    this.mode = next;
    this.state.mode = next;
    this.renderBody();
    this.validate();
  }

  private renderBody(): void {
    this.modeButtons.form.setAttribute("aria-pressed", String(this.mode === "form"));
    this.modeButtons.text.setAttribute("aria-pressed", String(this.mode === "text"));
    const parsed = this.mode === "form" ? parsedObject(this.text) : null;
    if (this.mode === "form" && !parsed) {
      this.mode = "text";
      this.renderBody();
      return;
    }
    if (parsed) {
      this.form.data = parsed;
      this.body.replaceChildren(rulesetForm(this.form));
      return;
    }
    this.localProblems.clear();
    const area = el(this.doc, "textarea", { id: "lw-json", class: "mono json-text", rows: "24", wrap: "off", spellcheck: "false", "aria-label": "The draft as JSON text", "aria-describedby": "lw-draft-problems" });
    area.value = this.text;
    area.addEventListener("input", () => {
      this.text = area.value;
      this.keep();
      this.validateSoon();
    });
    this.body.replaceChildren(area);
  }

  /** To a problem: its spot in the text, or the nearest field of the form. */
  private goTo(p: EditorProblem): void {
    if (this.mode === "text") {
      const area = this.body.querySelector<HTMLTextAreaElement>("#lw-json");
      if (area && p.spot) selectSpot(area, p.spot);
      return;
    }
    for (let n = p.path.length; n >= 0; n--) {
      const slot = this.body.querySelector<HTMLElement>(`[data-path="${CSS.escape(formatPath(p.path.slice(0, n)))}"]`);
      const control = slot?.matches("input, textarea, select") ? slot : slot?.querySelector<HTMLElement>("input, textarea, select");
      if (control) {
        control.focus();
        return;
      }
    }
  }

  private validate(): void {
    if (this.timer !== undefined) this.view.clearTimeout(this.timer);
    this.timer = undefined;
    const check = (this.check = checkDraft(this.text, this.draft.base.approval));
    this.status.setAttribute("data-state", check.ruleset ? "loads" : "problems");
    renderStatus(this.ctx, this.draft, check, this.status, this.approvalBox, this.localProblems.size);
    renderSummary(this.doc, this.summary, check.problems, this.localProblems, this.mode, (p) => this.goTo(p));
    if (this.mode === "form") placeProblems(this.body, check.problems, this.localProblems);
    renderStoreBar(this.ctx, this.draft, check, this.localProblems.size, this.storeBar);
    this.title.textContent = `Draft: ${draftId(this.draft)}`;
  }

  /** The draft's own combination list, formed on request for the parameters typed. */
  private comboDetails(): HTMLElement {
    const { doc } = this;
    const paramsInput = el(doc, "input", { id: "lw-draft-params", type: "text", autocomplete: "off", spellcheck: "false" });
    const combos = el(doc, "div", { id: "lw-draft-combos" });
    const render = () => {
      const ruleset = this.check?.ruleset;
      combos.replaceChildren(
        ...(ruleset
          ? comboList(doc, ruleset, paramsInput.value, { tableId: "lw-draft-combo-table", stamp: null })
          : [el(doc, "p", {}, "The draft does not load yet: mend its problems to see its combination list.")]),
      );
    };
    paramsInput.addEventListener("change", render);
    const details = el(
      doc,
      "details",
      { class: "draft-combos" },
      el(doc, "summary", {}, "Combination list of this draft"),
      el(doc, "label", { for: "lw-draft-params" }, "Parameters (e.g. SDS=1.2; empty: defaults; Enter to apply)"),
      paramsInput,
      combos,
    );
    details.addEventListener("toggle", render);
    return details;
  }

  /** Discarding takes a second click that says nothing stored changes. */
  private discardControl(): HTMLElement {
    const { doc, ctx, draft } = this;
    const confirm = button(
      doc,
      "Yes, discard this draft (nothing stored changes)",
      () => {
        ctx.drafts.remove(draft.key);
        ctx.editors.delete(draft.key);
        ctx.openDraft = null;
        ctx.notice(`Discarded the draft ${draftId(draft)}; nothing stored changed.`, "done");
        ctx.show("editor");
      },
      { class: "danger", id: "lw-discard-yes" },
    );
    confirm.hidden = true;
    const ask = button(doc, "Discard this draft…", () => {
      confirm.hidden = false;
      confirm.focus();
    });
    return el(doc, "div", { class: "actions" }, ask, confirm);
  }
}

function parsedObject(text: string): JsonObject | null {
  const parsed = parseJson(text);
  return parsed.ok && isObject(parsed.value) ? parsed.value : null;
}

/** Why the text cannot be shown as a form, or null when it can. */
function notAnObject(text: string): string | null {
  const parsed = parseJson(text);
  if (parsed.ok) return isObject(parsed.value) ? null : "The text is not a JSON object ({ … }): mend it here before switching to the form.";
  const spot = syntaxErrorSpot(text);
  return `The text is not JSON yet${spot ? ` (line ${spot.line}, column ${spot.column})` : ""}: mend it here before switching to the form.`;
}

/** Focus an element; a disabled button hands the focus to the next enabled one beside it. */
function focusOrNear(target: HTMLElement | null): void {
  if (target instanceof HTMLButtonElement && target.disabled) {
    target.parentElement?.querySelector<HTMLButtonElement>("button:not(:disabled)")?.focus();
    return;
  }
  target?.focus();
}

function selectSpot(area: HTMLTextAreaElement, spot: TextSpot): void {
  area.focus();
  area.setSelectionRange(spot.offset, spot.offset + spot.length);
  const lineHeight = parseFloat(area.ownerDocument.defaultView?.getComputedStyle(area).lineHeight ?? "") || 16;
  area.scrollTop = Math.max(0, (spot.line - 3) * lineHeight);
}
