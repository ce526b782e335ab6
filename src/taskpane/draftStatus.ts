/**
 * What the editor says about a draft as it stands: whether it loads (and so can
 * be stored), its verification and approval in the catalogue's words, what is
 * from memory, whether an approval it carries will still apply, and the list of
 * its problems.
 */
import { shortFingerprint, type RulesetStatus } from "../core/index.js";
import { button, el } from "./dom.js";
import type { DraftCheck, EditorProblem } from "./draftCheck.js";
import type { Draft } from "./draftStore.js";
import type { EditorMode, PaneContext } from "./paneContext.js";
import { approvalLine, fromMemoryBox, verificationBadge } from "./statusText.js";

export function renderStatus(ctx: PaneContext, draft: Draft, check: DraftCheck, status: HTMLElement, approvalBox: HTMLElement, localCount: number): void {
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
    status.append(fromMemoryBox(doc, check.ruleset.file));
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

export function renderSummary(doc: Document, summary: HTMLElement, problems: readonly EditorProblem[], local: ReadonlyMap<string, string>, mode: EditorMode, goTo: (p: EditorProblem) => void): void {
  // The list sits in a live region: the same problems again are not rewritten, so not announced again.
  const signature = JSON.stringify([mode, problems.map((p) => [p.full, p.spot?.line, p.spot?.column]), [...local]]);
  if (summary.dataset.signature === signature) return;
  summary.dataset.signature = signature;
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
