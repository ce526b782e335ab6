/**
 * Compare: any two rulesets — drafts, stored, shipped — side by side in what
 * differs: identity, symbols, parameters, notes, and per combination the
 * concrete rows only in one or the other, so a checker sees what the numbers
 * will do and not only how the text changed.
 */
import { describeProblem, shippedRulesets, type Ruleset, type RulesetStatus } from "../core/index.js";
import { compareForPane, type CombinationChange } from "./concreteRows.js";
import { button, el } from "./dom.js";
import { checkDraft } from "./draftCheck.js";
import { draftId } from "./draftLabel.js";
import type { PaneContext } from "./paneContext.js";
import { approvalBadge, unverifiedSuffix, verificationBadge } from "./statusText.js";

interface Candidate {
  value: string;
  label: string;
  group: "Drafts" | "Stored" | "Shipped";
  ruleset: Ruleset | null;
  status: RulesetStatus | null;
  why: string | null;
}

function candidates(ctx: PaneContext): Candidate[] {
  const out: Candidate[] = [];
  for (const d of ctx.drafts.list()) {
    const check = checkDraft(d.text, d.base.approval);
    out.push({ value: `draft:${d.key}`, label: `draft ${draftId(d)}${check.ruleset ? unverifiedSuffix(check.status) : " (does not load)"}`, group: "Drafts", ruleset: check.ruleset, status: check.status, why: check.ruleset ? null : "the draft does not load yet" });
  }
  for (const e of ctx.library().entries.filter((x) => x.source === "stored")) {
    out.push({ value: `stored:${e.id}`, label: `${e.id} (stored)${e.ruleset ? unverifiedSuffix(e.status) : " (does not load)"}`, group: "Stored", ruleset: e.ruleset, status: e.status, why: e.problem });
  }
  for (const s of shippedRulesets()) out.push({ value: `shipped:${s.id}`, label: `${s.id} (shipped)${unverifiedSuffix(s.status)}`, group: "Shipped", ruleset: s.ruleset, status: s.status, why: null });
  return out;
}

function defaultPair(ctx: PaneContext, all: Candidate[]): { before: string; after: string } {
  const has = (v: string) => all.some((c) => c.value === v);
  if (ctx.comparePair && has(ctx.comparePair.before) && has(ctx.comparePair.after)) return ctx.comparePair;
  const draft = ctx.drafts.list().find((d) => d.key === ctx.openDraft) ?? ctx.drafts.list()[0];
  if (draft && draft.base.id) {
    const base = draft.base.kind === "stored" ? `stored:${draft.base.id}` : `shipped:${draft.base.id}`;
    if (has(base)) return { before: base, after: `draft:${draft.key}` };
  }
  const first = all[0]?.value ?? "";
  return { before: first, after: first };
}

export function compareView(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const all = candidates(ctx);
  const pair = defaultPair(ctx, all);
  ctx.comparePair = pair;
  const select = (id: string, value: string) => {
    const s = el(
      doc,
      "select",
      { id },
      ...(["Drafts", "Stored", "Shipped"] as const).map((g) =>
        el(doc, "optgroup", { label: g }, ...all.filter((c) => c.group === g).map((c) => el(doc, "option", { value: c.value }, c.label))),
      ),
    );
    s.value = value;
    return s;
  };
  const before = select("lw-compare-before", pair.before);
  const after = select("lw-compare-after", pair.after);
  const params = el(doc, "input", { id: "lw-compare-params", type: "text", autocomplete: "off", spellcheck: "false", "aria-describedby": "lw-compare-params-hint" });
  const result = el(doc, "div", { id: "lw-compare-result", "aria-live": "polite" });
  // Under each list, the chosen ruleset in full: a narrow list may cut its label, never its UNVERIFIED or approval.
  const beforeSide = el(doc, "div", { id: "lw-compare-before-side" });
  const afterSide = el(doc, "div", { id: "lw-compare-after-side" });
  before.setAttribute("aria-describedby", "lw-compare-before-side");
  after.setAttribute("aria-describedby", "lw-compare-after-side");
  const render = () => {
    ctx.comparePair = { before: before.value, after: after.value };
    const a = all.find((c) => c.value === before.value);
    const b = all.find((c) => c.value === after.value);
    beforeSide.replaceChildren(...(a ? [comparedSide(doc, a)] : []));
    afterSide.replaceChildren(...(b ? [comparedSide(doc, b)] : []));
    result.replaceChildren(...comparison(ctx, a, b, params.value));
  };
  before.addEventListener("change", render);
  after.addEventListener("change", render);
  params.addEventListener("change", render);
  const root = el(
    doc,
    "div",
    { id: "lw-compare" },
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-compare-before" }, "Before"), before, beforeSide),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-compare-after" }, "After"), after, afterSide),
    el(
      doc,
      "div",
      { class: "actions" },
      button(doc, "Swap", () => {
        const b = before.value;
        before.value = after.value;
        after.value = b;
        render();
      }),
    ),
    el(doc, "div", { class: "field" }, el(doc, "label", { for: "lw-compare-params" }, "Parameters for the concrete rows"), params, el(doc, "p", { id: "lw-compare-params-hint", class: "hint" }, "e.g. SDS=1.0 — a parameter without a default must be given to form the rows of the combinations that read it. Empty: the defaults. Enter to apply.")),
    result,
  );
  render();
  return root;
}

/** What a comparison needs of each side (the Firm library view compares a stored copy with the library's version). */
export type Compared = Pick<Candidate, "label" | "ruleset" | "status" | "why">;

/** One side of a comparison in full: label, title, UNVERIFIED, approval, fingerprint. */
export function comparedSide(doc: Document, c: Compared): HTMLElement {
  const f = c.ruleset?.file;
  return el(
    doc,
    "div",
    { class: "compare-side" },
    el(doc, "p", {}, c.label, f ? ` — ${f.title}` : ""),
    c.status && f ? el(doc, "p", { class: "badges" }, verificationBadge(doc, c.status), " ", approvalBadge(doc, f, c.status), " ", el(doc, "span", { class: "fingerprint" }, c.status.shortFingerprint)) : null,
  );
}

export function comparison(ctx: PaneContext, a: Compared | undefined, b: Compared | undefined, paramsText: string): HTMLElement[] {
  const { doc } = ctx;
  if (!a || !b) return [el(doc, "p", {}, "Choose two rulesets.")];
  if (!a.ruleset || !b.ruleset) {
    return [el(doc, "p", { class: "problem" }, `${!a.ruleset ? `Before: ${a.why ?? "does not load"}` : `After: ${b.why ?? "does not load"}`}; only rulesets that load can be compared.`)];
  }
  const compared = compareForPane(a.ruleset, b.ruleset, paramsText);
  if (!compared.ok) return [el(doc, "p", { class: "problem", id: "lw-compare-problem" }, compared.problems.map((p) => `parameters, ${describeProblem(p)}`).join("\n"))];
  const { comparison: c, combinations, rowProblems, notUsed } = compared.value;
  const out: HTMLElement[] = [];
  if (c.same) {
    out.push(el(doc, "p", { class: "ok-box", id: "lw-compare-same" }, "Same content: the fingerprints are equal (approval records aside)."));
    return out;
  }
  const count = c.identity.length + c.symbols.length + c.parameters.length + combinations.length + c.notes.length;
  out.push(el(doc, "p", { id: "lw-compare-summary" }, `${count} ${count === 1 ? "difference" : "differences"} (fingerprints ${c.fingerprints.before.slice(0, 12)} → ${c.fingerprints.after.slice(0, 12)}).`));
  for (const [which, list] of [["Before", notUsed.before], ["After", notUsed.after]] as const) {
    if (list.length > 0) out.push(el(doc, "p", { class: "hint" }, `${which} has no parameter ${list.join(", ")}; its rows are formed without it.`));
  }
  const same = rowProblems.before.join("\n") === rowProblems.after.join("\n");
  for (const [which, list] of (same ? [["Before and after", rowProblems.before]] : [["Before", rowProblems.before], ["After", rowProblems.after]]) as [string, string[]][]) {
    if (list.length > 0) out.push(el(doc, "p", { class: "problem", "data-rows-problem": which }, `${which}: the concrete rows cannot be formed — ${list.join("; ")}. Give the parameter above to see them.`));
  }
  if (c.identity.length > 0) out.push(group(doc, "Identity", c.identity.map((d) => `${d.field}: ${d.before} → ${d.after}`)));
  if (combinations.length > 0) out.push(el(doc, "h3", {}, `Combinations (${combinations.length})`), el(doc, "ul", { class: "compare-list", id: "lw-compare-combinations" }, ...combinations.map((x) => combinationItem(doc, x))));
  if (c.symbols.length > 0) out.push(group(doc, "Load symbols", c.symbols.map((d) => `${d.name} ${d.change}: ${d.details.join("; ")}`)));
  if (c.parameters.length > 0) out.push(group(doc, "Parameters", c.parameters.map((d) => `${d.name} ${d.change}: ${d.details.join("; ")}`)));
  if (c.notes.length > 0) out.push(notesDifference(doc, a.ruleset.file.notes ?? [], b.ruleset.file.notes ?? []));
  return out;
}

/** Notes are free text: which notes one side has and the other lacks, rather than the whole list twice. */
function notesDifference(doc: Document, before: readonly string[], after: readonly string[]): HTMLElement {
  const onlyBefore = before.filter((n) => !after.includes(n));
  const onlyAfter = after.filter((n) => !before.includes(n));
  const lines = [...onlyBefore.map((n) => `only before: ${n}`), ...onlyAfter.map((n) => `only after: ${n}`)];
  return group(doc, "Notes", lines.length > 0 ? lines : ["the same notes, in another order or written twice"]);
}

function group(doc: Document, title: string, lines: string[]): HTMLElement {
  return el(doc, "section", {}, el(doc, "h3", {}, title), el(doc, "ul", { class: "compare-list" }, ...lines.map((l) => el(doc, "li", {}, l))));
}

function combinationItem(doc: Document, x: CombinationChange): HTMLElement {
  const rows = (word: string, list: string[] | null, cls: string) =>
    list === null
      ? el(doc, "p", { class: "hint" }, `${word}: not formed (see above)`)
      : el(doc, "div", { class: cls }, el(doc, "p", {}, `${word} (${list.length})`), list.length > 0 ? el(doc, "ul", { class: "rows mono" }, ...list.map((r) => el(doc, "li", {}, r))) : null);
  return el(
    doc,
    "li",
    { "data-combination": x.name, "data-change": x.change },
    el(doc, "p", {}, el(doc, "strong", {}, `Combination ${x.name}`), ` — ${x.change}`),
    ...x.details.map((d) => el(doc, "p", { class: "detail" }, d)),
    rows("Rows only before", x.rowsOnlyBefore, "rows-before"),
    rows("Rows only after", x.rowsOnlyAfter, "rows-after"),
  );
}
