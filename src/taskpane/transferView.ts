/**
 * Import and export. An import is checked first; if it does not load, its
 * problems are listed with their place (JSON path, line and column) and
 * nothing stored changes. One that loads is stored only on request — after a
 * confirmation where it would replace a stored ruleset — or opened as a draft.
 * Export gives any shipped or stored ruleset (or a draft that loads) as a
 * .json download, or as text to copy where the host blocks downloads.
 */
import { compareRulesets, shippedRulesets, type RulesetFile, type RulesetStatus } from "../core/index.js";
import { unchangedAfterFailure, withAfterWrite } from "./afterWrite.js";
import { button, el } from "./dom.js";
import { checkDraft } from "./draftCheck.js";
import { draftId } from "./draftLabel.js";
import { downloadRuleset, exportFileName } from "./exportRuleset.js";
import { approvalIn, draftOfImport, rulesetText } from "./openDraft.js";
import type { PaneContext } from "./paneContext.js";
import { approvalBadge, sourceLine, unverifiedSuffix, verificationBadge } from "./statusText.js";

export function transferView(ctx: PaneContext): HTMLElement {
  return el(ctx.doc, "div", { id: "lw-transfer" }, importSection(ctx), exportSection(ctx));
}

function importSection(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const file = el(doc, "input", { id: "lw-import-file", type: "file", accept: ".json,application/json" });
  const text = el(doc, "textarea", { id: "lw-import-text", class: "mono", rows: "8", spellcheck: "false", wrap: "off" });
  const result = el(doc, "div", { id: "lw-import-result", "aria-live": "polite" });
  let source = "pasted text";
  const check = () => result.replaceChildren(...importResult(ctx, text.value, source));
  file.addEventListener("change", () => {
    const chosen = file.files?.[0];
    if (!chosen) return;
    source = chosen.name;
    void chosen.text().then(
      (content) => {
        text.value = content;
        check();
      },
      (e: unknown) => result.replaceChildren(el(doc, "p", { class: "problem" }, `${chosen.name} could not be read: ${e instanceof Error ? e.message : String(e)}; nothing stored changed.`)),
    );
  });
  text.addEventListener("input", () => {
    source = "pasted text";
  });
  return el(
    doc,
    "section",
    { "aria-labelledby": "lw-import-title" },
    el(doc, "h2", { id: "lw-import-title" }, "Import"),
    el(doc, "p", { class: "hint" }, "A ruleset file (loadwright-ruleset/1) is checked first; nothing is stored until you ask, and nothing stored changes if it does not load."),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-import-file" }, "A .json file"), file),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-import-text" }, "or paste its text"), text),
    button(doc, "Check", check, { id: "lw-import-check" }),
    result,
  );
}

function importResult(ctx: PaneContext, text: string, source: string): HTMLElement[] {
  const { doc } = ctx;
  const checked = checkDraft(text, approvalIn(text));
  const openAsDraft = button(doc, "Open in the editor as a draft", () => {
    const draft = draftOfImport(text);
    ctx.drafts.put(draft);
    ctx.openDraft = draft.key;
    ctx.show("editor");
  }, { id: "lw-import-draft" });
  if (!checked.ruleset) {
    return [
      el(doc, "p", { class: "problem", id: "lw-import-refused", role: "alert" }, `${source} does not load as a ruleset; nothing was stored and nothing stored changed.`),
      el(
        doc,
        "ol",
        { class: "problem-list", id: "lw-import-problems" },
        ...checked.problems.map((p) => el(doc, "li", { class: "problem" }, p.full, p.spot && !/at line \d+/.test(p.full) ? ` (line ${p.spot.line}, column ${p.spot.column})` : "")),
      ),
      el(doc, "p", { class: "hint" }, "Mend the file and check it again, or open it as a draft and mend it there (the draft is kept apart from the stored rulesets)."),
      openAsDraft,
    ];
  }
  const r = checked.ruleset;
  const f = r.file;
  const status = checked.status!;
  const lib = ctx.library();
  const stored = lib.entries.find((e) => e.source === "stored" && e.id === f.id);
  const shipped = shippedRulesets().find((s) => s.id === f.id);
  const out: HTMLElement[] = [
    el(doc, "p", { class: "ok-box", id: "lw-import-ok" }, `${source} loads: ${f.id} ${f.version}, ${f.title}.`),
    el(doc, "p", { class: "badges" }, verificationBadge(doc, status), " ", approvalBadge(doc, f, status), " ", el(doc, "span", { class: "fingerprint" }, status.shortFingerprint)),
  ];
  const warnings: string[] = [];
  if (stored) {
    const same = stored.status?.fingerprint === status.fingerprint;
    const diff = stored.ruleset ? compareRulesets(stored.ruleset, r) : null;
    const changes = diff ? diff.identity.length + diff.symbols.length + diff.parameters.length + diff.combinations.length + diff.notes.length : null;
    warnings.push(
      `"${f.id}" is already ${sourceLine(stored, ctx.storedWhere)} (fingerprint ${stored.status?.shortFingerprint ?? "—"}${stored.ruleset?.file.approval.approvedBy ? `, approved by ${stored.ruleset.file.approval.approvedBy}` : ""}): ` +
        (same ? "the same content; storing replaces only its approval record." : `storing replaces it${changes !== null ? ` (${changes} differences: see Compare after opening it as a draft)` : ""}.`),
    );
  } else if (shipped) {
    warnings.push(`"${f.id}" is the id of a shipped ruleset; once stored, formulas naming it in this workbook use the imported copy${shipped.status.fingerprint === status.fingerprint ? " (the same content as shipped)" : ", which DIFFERS from the shipped one"}.`);
  }
  const storeButton = button(doc, `Store in ${ctx.storedWhere}`, () => {
    if (confirm && !confirm.checked) return;
    storeButton.disabled = true;
    void ctx
      .store()
      .save(f)
      .then((saved) => {
        if (!saved.ok) {
          storeButton.disabled = false;
          ctx.notice(`Not stored: ${saved.problems.map((p) => p.message).join("; ")}${unchangedAfterFailure(saved)}.`, "problem");
          return;
        }
        ctx.selected = f.id;
        ctx.notice(withAfterWrite(`Imported and stored ${f.id} ${f.version} in ${ctx.storedWhere} (fingerprint ${status.shortFingerprint}).`, saved), "done");
        ctx.show("library");
      });
  }, { id: "lw-import-store", class: "primary" });
  let confirm: HTMLInputElement | null = null;
  if (warnings.length > 0) {
    confirm = el(doc, "input", { type: "checkbox", id: "lw-import-confirm" });
    storeButton.disabled = true;
    confirm.addEventListener("change", () => {
      storeButton.disabled = !confirm?.checked;
    });
    out.push(el(doc, "div", { class: "alarm-box" }, ...warnings.map((w) => el(doc, "p", {}, w)), el(doc, "label", { for: "lw-import-confirm", class: "check" }, confirm, " I mean to store it anyway")));
  }
  out.push(el(doc, "div", { class: "actions" }, storeButton, openAsDraft));
  return out;
}

function exportSection(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const files = new Map<string, { file: RulesetFile; status: RulesetStatus | null }>();
  const options: HTMLElement[] = [];
  for (const e of ctx.library().entries) {
    if (!e.ruleset) continue;
    const key = `${e.source}:${e.id}`;
    files.set(key, { file: e.ruleset.file, status: e.status });
    options.push(el(doc, "option", { value: key }, `${e.id} (${e.source})${unverifiedSuffix(e.status)}`));
  }
  for (const d of ctx.drafts.list()) {
    const checked = checkDraft(d.text, d.base.approval);
    if (!checked.ruleset) continue;
    files.set(`draft:${d.key}`, { file: checked.ruleset.file, status: checked.status });
    options.push(el(doc, "option", { value: `draft:${d.key}` }, `draft ${draftId(d)} (not stored)${unverifiedSuffix(checked.status)}`));
  }
  const pick = el(doc, "select", { id: "lw-export-pick", "aria-describedby": "lw-export-standing" }, ...options);
  const selectedKey = [...files.keys()].find((k) => k.endsWith(`:${ctx.selected ?? ""}`) && !k.startsWith("draft:"));
  if (selectedKey) pick.value = selectedKey;
  const shown = el(doc, "textarea", { id: "lw-export-text", class: "mono", rows: "10", readonly: "", wrap: "off", "aria-label": "The ruleset as JSON text, to copy" });
  shown.hidden = true;
  // A choice in a narrow list may be cut short: its verification and approval are said in full under it.
  const standing = el(doc, "p", { class: "badges", id: "lw-export-standing" });
  const current = () => files.get(pick.value)?.file;
  const showStanding = () => {
    const chosen = files.get(pick.value);
    standing.replaceChildren(...(chosen?.status ? [verificationBadge(doc, chosen.status), approvalBadge(doc, chosen.file, chosen.status)] : []));
  };
  pick.addEventListener("change", () => {
    showStanding();
    if (!shown.hidden) shown.value = rulesetText(current());
  });
  showStanding();
  return el(
    doc,
    "section",
    { "aria-labelledby": "lw-export-title" },
    el(doc, "h2", { id: "lw-export-title" }, "Export"),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-export-pick" }, "Ruleset"), pick, standing),
    el(
      doc,
      "div",
      { class: "actions" },
      button(doc, "Download .json", () => {
        const f = current();
        if (!f) return;
        downloadRuleset(doc, f);
        ctx.notice(`Exported ${exportFileName(f)} (a download).`, "done");
      }, { id: "lw-export-download" }),
      button(doc, "Show the JSON", () => {
        const f = current();
        if (!f) return;
        shown.hidden = false;
        shown.value = rulesetText(f);
        shown.focus();
        shown.select();
      }, { id: "lw-export-show" }),
    ),
    shown,
  );
}
