/**
 * Editor: a draft opened from the library, an import or a new ruleset, edited
 * as a form or as JSON text, validated as the user types (debounced) with
 * every problem beside its field, kept in browser storage apart from the
 * stored copies, and stored only when it loads — after confirming anything it
 * would replace. Shows when an approval will stop applying.
 */
import { formatPath, shortFingerprint, type RulesetStatus } from "../core/index.js";
import { comboListOfDraft } from "./comboList.js";
import { isObject, type JsonObject } from "./dataPath.js";
import { button, el, uniqueId } from "./dom.js";
import { checkDraft, type DraftCheck, type EditorProblem } from "./draftCheck.js";
import type { Draft } from "./draftStore.js";
import type { FormContext } from "./formFields.js";
import { syntaxErrorSpot, type TextSpot } from "./jsonLocate.js";
import { newIdField } from "./newIdField.js";
import { draftOfNew } from "./openDraft.js";
import type { PaneContext } from "./paneContext.js";
import { placeProblems } from "./problemPlacement.js";
import { rulesetForm } from "./rulesetForm.js";
import { approvalLine, fromMemoryList, verificationBadge } from "./statusText.js";
import { storeConflicts } from "./storeConflicts.js";

/** How long typing must pause before the draft is validated. */
export const VALIDATE_AFTER_MS = 250;

type Mode = "form" | "text";
const modes = new Map<string, Mode>();
const openSectionsByDraft = new Map<string, Set<string>>();

export function editorView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const drafts = ctx.drafts.list();
  if (ctx.openDraft === null || !drafts.some((d) => d.key === ctx.openDraft)) ctx.openDraft = drafts[0]?.key ?? null;
  const root = el(doc, "div", { id: "lw-editor" });
  if (ctx.drafts.problem) root.append(el(doc, "p", { class: "problem", role: "alert", id: "lw-drafts-problem" }, ctx.drafts.problem));
  const current = drafts.find((d) => d.key === ctx.openDraft);
  if (!current) {
    root.append(
      el(doc, "p", {}, "No draft is open. Open one from the Library (Edit as a draft, or Open a copy of a shipped or stored ruleset), import one, or start a new ruleset."),
      newRulesetControl(ctx, true),
    );
    return root;
  }
  if (drafts.length > 1) root.append(draftPicker(ctx, drafts));
  root.append(draftEditor(ctx, current), newRulesetControl(ctx, false));
  return root;
}

export function draftId(d: Draft): string {
  try {
    const id = (JSON.parse(d.text) as { id?: unknown } | null)?.id;
    return typeof id === "string" && id !== "" ? id : "(no id)";
  } catch {
    return "(not JSON yet)";
  }
}

export function baseText(d: Draft): string {
  const b = d.base;
  const print = b.fingerprint ? `, fingerprint ${shortFingerprint(b.fingerprint)}` : "";
  switch (b.kind) {
    case "shipped":
      return `copy of the shipped ${b.id}${print}`;
    case "stored":
      return draftId(d) === b.id ? `stored ${b.id}, being edited${print}` : `from the stored ${b.id}${print}`;
    case "imported":
      return "imported";
    case "new":
      return "new";
  }
}

function draftPicker(ctx: PaneContext, drafts: readonly Draft[]): HTMLElement {
  const { doc } = ctx;
  const select = el(doc, "select", { id: "lw-draft-pick" }, ...drafts.map((d) => el(doc, "option", { value: d.key }, `${draftId(d)} — ${baseText(d)}`))) as HTMLSelectElement;
  select.value = ctx.openDraft ?? "";
  select.addEventListener("change", () => {
    ctx.openDraft = select.value;
    ctx.show("editor");
  });
  return el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-draft-pick" }, `Open drafts (${drafts.length})`), select);
}

function newRulesetControl(ctx: PaneContext, open: boolean): HTMLElement {
  const { doc } = ctx;
  const { input, problem, submit: start } = newIdField(ctx, { input: "lw-new-id", problem: "lw-new-problem" }, { class: "mono" }, draftOfNew);
  const details = el(
    doc,
    "details",
    { class: "new-ruleset" },
    el(doc, "summary", {}, "Start a new ruleset"),
    el(doc, "label", { for: "lw-new-id" }, "Id of the new ruleset"),
    input,
    problem,
    button(doc, "Start", start),
  ) as HTMLDetailsElement;
  details.open = open;
  return details;
}

function draftEditor(ctx: PaneContext, draft: Draft): HTMLElement {
  const { doc } = ctx;
  let text = draft.text;
  let mode: Mode = modes.get(draft.key) ?? "form";
  let data: JsonObject | null = null;
  let check: DraftCheck | null = null;
  let timer: number | undefined;
  const localProblems = new Map<string, string>();
  const view = doc.defaultView!;

  const root = el(doc, "section", { class: "draft", "aria-labelledby": "lw-draft-title" });
  const title = el(doc, "h2", { id: "lw-draft-title" });
  const status = el(doc, "div", { id: "lw-draft-status", "aria-live": "polite" });
  const approvalBox = el(doc, "div", { id: "lw-draft-approval" });
  const storeBar = el(doc, "div", { id: "lw-store-bar", class: "store-bar" });
  const modeProblem = el(doc, "p", { class: "problem", role: "alert", id: "lw-mode-problem" });
  modeProblem.hidden = true;
  const summary = el(doc, "div", { id: "lw-draft-problems" });
  const body = el(doc, "div", { id: "lw-draft-body" });
  const keptProblem = el(doc, "p", { class: "problem", role: "alert" });
  keptProblem.hidden = true;

  const keep = () => {
    draft.text = text;
    draft.changed = new Date().toISOString();
    const kept = ctx.drafts.put(draft);
    keptProblem.hidden = kept;
    keptProblem.textContent = kept ? "" : (ctx.drafts.problem ?? "the draft could not be kept in browser storage");
  };
  const validateSoon = () => {
    if (timer !== undefined) view.clearTimeout(timer);
    status.setAttribute("data-state", "checking");
    timer = view.setTimeout(validate, VALIDATE_AFTER_MS);
  };
  const openSections = openSectionsByDraft.get(draft.key) ?? new Set(["identity", "combinations"]);
  openSectionsByDraft.set(draft.key, openSections);
  const fc: FormContext = {
    doc,
    data: {},
    localProblems,
    openSections,
    changed: () => {
      text = `${JSON.stringify(fc.data, null, 2)}\n`;
      keep();
      validateSoon();
    },
    rebuild: (focus) => {
      text = `${JSON.stringify(fc.data, null, 2)}\n`;
      keep();
      renderBody();
      validate();
      if (focus) focusOrNear(body.querySelector<HTMLElement>(focus));
    },
  };

  const modeButtons = {
    form: button(doc, "Form", () => switchMode("form"), { id: "lw-mode-form" }),
    text: button(doc, "JSON text", () => switchMode("text"), { id: "lw-mode-text" }),
  };
  const switchMode = (next: Mode) => {
    if (next === mode) return;
    if (next === "form") {
      let parsed: unknown;
      try {
        parsed = JSON.parse(text);
      } catch {
        const spot = syntaxErrorSpot(text);
        modeProblem.hidden = false;
        modeProblem.textContent = `The text is not JSON yet${spot ? ` (line ${spot.line}, column ${spot.column})` : ""}: mend it here before switching to the form.`;
        return;
      }
      if (!isObject(parsed)) {
        modeProblem.hidden = false;
        modeProblem.textContent = "The text is not a JSON object ({ … }): mend it here before switching to the form.";
        return;
      }
    }
    modeProblem.hidden = true;
    mode = next;
    modes.set(draft.key, mode);
    renderBody();
    validate();
  };

  const renderBody = () => {
    modeButtons.form.setAttribute("aria-pressed", String(mode === "form"));
    modeButtons.text.setAttribute("aria-pressed", String(mode === "text"));
    if (mode === "form") {
      let parsed: unknown;
      try {
        parsed = JSON.parse(text);
      } catch {
        parsed = undefined;
      }
      if (!isObject(parsed)) {
        mode = "text";
        return renderBody();
      }
      data = parsed;
      fc.data = data;
      body.replaceChildren(rulesetForm(fc));
    } else {
      data = null;
      localProblems.clear();
      const area = el(doc, "textarea", { id: "lw-json", class: "mono json-text", rows: "24", wrap: "off", spellcheck: "false", "aria-label": "The draft as JSON text", "aria-describedby": "lw-draft-problems" }) as HTMLTextAreaElement;
      area.value = text;
      area.addEventListener("input", () => {
        text = area.value;
        keep();
        validateSoon();
      });
      body.replaceChildren(area);
    }
  };

  const goTo = (p: EditorProblem) => {
    if (mode === "text") {
      const area = body.querySelector<HTMLTextAreaElement>("#lw-json");
      if (area && p.spot) selectSpot(area, p.spot);
      return;
    }
    for (let n = p.path.length; n >= 0; n--) {
      const key = p.path.slice(0, n);
      const slot = body.querySelector<HTMLElement>(`[data-path="${CSS.escape(formatPath(key))}"]`);
      const control = slot?.matches("input, textarea, select") ? slot : slot?.querySelector<HTMLElement>("input, textarea, select");
      if (control) {
        control.focus();
        return;
      }
    }
  };

  const validate = () => {
    if (timer !== undefined) view.clearTimeout(timer);
    timer = undefined;
    check = checkDraft(text, draft.base.approval);
    status.setAttribute("data-state", check.ruleset ? "loads" : "problems");
    renderStatus(ctx, draft, check, status, approvalBox, localProblems.size);
    renderSummary(doc, summary, check.problems, localProblems, mode, goTo);
    if (mode === "form") placeProblems(body, check.problems, localProblems);
    renderStoreBar(ctx, draft, check, localProblems.size, storeBar);
    title.textContent = `Draft: ${draftId(draft)}`;
  };

  const discardConfirm = button(
    doc,
    "Yes, discard this draft (nothing stored changes)",
    () => {
      ctx.drafts.remove(draft.key);
      ctx.openDraft = null;
      ctx.notice(`Discarded the draft ${draftId(draft)}; nothing stored changed.`, "done");
      ctx.show("editor");
    },
    { class: "danger", id: "lw-discard-yes" },
  );
  discardConfirm.hidden = true;
  const paramsInput = el(doc, "input", { id: "lw-draft-params", type: "text", autocomplete: "off", spellcheck: "false" }) as HTMLInputElement;
  const combos = el(doc, "div", { id: "lw-draft-combos" });
  const renderCombos = () => {
    const ruleset = check?.ruleset;
    combos.replaceChildren(...(ruleset ? comboListOfDraft(doc, ruleset, paramsInput.value) : [el(doc, "p", {}, "The draft does not load yet: mend its problems to see its combination list.")]));
  };
  paramsInput.addEventListener("change", renderCombos);
  const comboDetails = el(
    doc,
    "details",
    { class: "draft-combos" },
    el(doc, "summary", {}, "Combination list of this draft"),
    el(doc, "label", { for: "lw-draft-params" }, "Parameters (e.g. SDS=1.2; empty: defaults; Enter to apply)"),
    paramsInput,
    combos,
  );
  comboDetails.addEventListener("toggle", renderCombos);

  root.append(
    title,
    el(doc, "p", { class: "muted" }, `Opened ${draft.opened.slice(0, 16).replace("T", " ")} UTC as ${baseText(draft)}. A draft is kept in this browser, apart from the stored rulesets, until you store it.`),
    keptProblem,
    status,
    approvalBox,
    el(doc, "div", { class: "mode-switch", role: "group", "aria-label": "Edit as" }, modeButtons.form, modeButtons.text),
    modeProblem,
    summary,
    body,
    storeBar,
    comboDetails,
    el(doc, "div", { class: "actions" }, button(doc, "Discard this draft…", () => {
      discardConfirm.hidden = false;
      discardConfirm.focus();
    }), discardConfirm),
  );
  renderBody();
  validate();
  return root;
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

function renderStatus(ctx: PaneContext, draft: Draft, check: DraftCheck, status: HTMLElement, approvalBox: HTMLElement, localCount: number): void {
  const { doc } = ctx;
  const count = check.problems.length + localCount;
  const s: RulesetStatus | null = check.status;
  const validity =
    count === 0 && check.ruleset
      ? el(doc, "span", { class: "badge badge-ok", id: "lw-draft-validity" }, "Loads: can be stored")
      : el(doc, "span", { class: "badge badge-alarm", id: "lw-draft-validity" }, `${count} ${count === 1 ? "problem" : "problems"}: cannot be stored until mended`);
  const unchanged = s && draft.base.fingerprint === s.fingerprint;
  status.replaceChildren();
  status.append(
    el(
      doc,
      "p",
      { class: "badges" },
      validity,
      " ",
      s ? verificationBadge(doc, s) : null,
      " ",
      s && check.ruleset ? el(doc, "span", { class: s.approval === "changed-since-approval" ? "badge badge-alarm" : "badge", "data-approval": s.approval }, approvalLine(check.ruleset.file, s)) : null,
    ),
  );
  if (s) status.append(el(doc, "p", {}, "Fingerprint of this draft ", el(doc, "span", { class: "fingerprint", id: "lw-draft-fingerprint" }, s.shortFingerprint), unchanged ? " — the same content as it was opened from" : ""));
  if (s && s.verification === "unverified" && check.ruleset) {
    status.append(el(doc, "div", { class: "alarm-box" }, el(doc, "p", {}, "UNVERIFIED: its provenance marks these sources as from memory — verify against the standard:"), fromMemoryList(doc, check.ruleset.file)));
  }
  const approved = draft.base.approval;
  approvalBox.replaceChildren();
  if (approved.fingerprint) {
    const who = `${approved.approvedBy ?? "(no name)"} on ${approved.date ?? "(no date)"}`;
    if (s && s.fingerprint === approved.fingerprint) {
      approvalBox.append(el(doc, "p", { class: "ok-box" }, `The approval by ${who} applies to this content as long as it is unchanged (fingerprint ${shortFingerprint(approved.fingerprint)}).`));
    } else {
      approvalBox.append(
        el(
          doc,
          "p",
          { class: "alarm-box", id: "lw-approval-void" },
          `The approval by ${who} will no longer apply: this draft's content differs from what was approved (fingerprint ${shortFingerprint(approved.fingerprint)} approved, ${s ? s.shortFingerprint : "— (the draft does not load)"} now). Once stored it shows as CHANGED since approval until it is approved again.`,
        ),
      );
    }
  }
}

function renderSummary(doc: Document, summary: HTMLElement, problems: readonly EditorProblem[], local: ReadonlyMap<string, string>, mode: Mode, goTo: (p: EditorProblem) => void): void {
  if (problems.length === 0 && local.size === 0) {
    summary.replaceChildren();
    return;
  }
  const items = problems.map((p) => {
    const where = mode === "text" && p.spot ? ` (line ${p.spot.line}, column ${p.spot.column})` : "";
    return el(doc, "li", {}, button(doc, `${p.full}${where}`, () => goTo(p), { class: "link problem-link" }));
  });
  for (const [path, message] of local) items.push(el(doc, "li", {}, `${path}: ${message}`));
  const how = mode === "text" ? "click one to select it in the text" : "each is also shown beside its field; click one to go there";
  summary.replaceChildren(el(doc, "p", { class: "problem" }, `Problems (${items.length}) — ${how}:`), el(doc, "ol", { class: "problem-list" }, ...items));
}

function renderStoreBar(ctx: PaneContext, draft: Draft, check: DraftCheck, localCount: number, bar: HTMLElement): void {
  const { doc } = ctx;
  const store = button(doc, `Store in ${ctx.storedWhere}`, () => undefined, { id: "lw-store", class: "primary" });
  const reason = el(doc, "p", { class: "hint", id: "lw-store-reason" });
  bar.replaceChildren();
  const ruleset = check.ruleset;
  if (!ruleset || localCount > 0) {
    store.disabled = true;
    reason.textContent = "Storing is possible once the draft loads without problems; what is stored now stays as it is.";
    bar.append(store, reason);
    return;
  }
  const conflicts = storeConflicts(draft.base, ruleset, ctx.library(), ctx.storedWhere);
  for (const line of conflicts.info) bar.append(el(doc, "p", { class: "hint" }, line));
  let confirm: HTMLInputElement | null = null;
  if (conflicts.confirm.length > 0) {
    const id = uniqueId("lw-store-confirm");
    confirm = el(doc, "input", { type: "checkbox", id }) as HTMLInputElement;
    bar.append(
      el(doc, "div", { class: "alarm-box" }, ...conflicts.confirm.map((c) => el(doc, "p", {}, c)), el(doc, "label", { for: id, class: "check" }, confirm, " I mean to store it anyway")),
    );
    store.disabled = true;
    confirm.addEventListener("change", () => {
      store.disabled = !confirm?.checked;
    });
  }
  store.addEventListener("click", () => {
    if (confirm && !confirm.checked) return;
    store.disabled = true;
    void ctx
      .store()
      .save(ruleset.file)
      .then((result) => {
        if (!result.ok) {
          store.disabled = false;
          const text = result.problems.map((p) => p.message).join("; ");
          reason.textContent = `Not stored: ${text}. The draft is kept.`;
          reason.className = "problem";
          ctx.notice(`Not stored: ${text}. The draft is kept; nothing stored changed.`, "problem");
          return;
        }
        ctx.drafts.remove(draft.key);
        ctx.openDraft = null;
        ctx.selected = ruleset.file.id;
        ctx.notice(`Stored ${ruleset.file.id} ${ruleset.file.version} in ${ctx.storedWhere} (fingerprint ${check.status?.shortFingerprint ?? ""}); the draft is closed.`, "done");
        ctx.show("library");
      });
  });
  reason.textContent = "Stores exactly this content; the draft is then closed.";
  bar.append(store, reason);
}
