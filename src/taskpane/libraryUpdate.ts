/**
 * Taking the firm library's version of a ruleset into the workbook: first the
 * comparison Compare shows (the concrete rows that change, for the parameters
 * the user gives), then a confirmation that names what storing replaces — a
 * stored copy, a shipped ruleset it would stand in for, or nothing — and only
 * then the library's file, exactly as approved, goes through the store. The
 * store is checked again at that moment: if the stored copy changed since the
 * comparison was drawn, nothing is stored and the user compares again.
 */
import { rulesetStatus, shippedRulesets, shortFingerprint, type FirmLibraryEntry } from "../core/index.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { unchangedAfterFailure, withAfterWrite } from "./afterWrite.js";
import { comparison, type Compared } from "./compareView.js";
import { button, el } from "./dom.js";
import { firmLibraryState } from "./firmLibraryState.js";
import type { PaneContext } from "./paneContext.js";
import { approvalLine, fromMemoryBox } from "./statusText.js";

/** The library's version in words: "version 1.0.1 approved by B. Name on 2026-02-27 (fingerprint 4c1e…)". */
export function libraryVersionText(entry: FirmLibraryEntry): string {
  return `version ${entry.ruleset.file.version} approved by ${entry.approvedBy} on ${entry.date} (fingerprint ${shortFingerprint(entry.fingerprint)})`;
}

/** What storing the library's version replaces, in the words of the confirmation. */
export function replacementText(ctx: PaneContext, entry: FirmLibraryEntry, stored: LibraryEntry | undefined): string {
  const id = entry.ruleset.file.id;
  const theirs = `the firm library's ${libraryVersionText(entry)}`;
  if (stored?.ruleset && stored.status) {
    return `Replace the stored "${id}" version ${stored.ruleset.file.version} (fingerprint ${stored.status.shortFingerprint}; ${approvalLine(stored.ruleset.file, stored.status)}) in ${ctx.storedWhere} with ${theirs}`;
  }
  if (stored) return `Replace the stored "${id}", which no longer loads (${stored.problem ?? "unknown problem"}), in ${ctx.storedWhere} with ${theirs}`;
  const shipped = shippedRulesets().find((s) => s.id === id);
  if (shipped) {
    return `Store ${theirs} in ${ctx.storedWhere}; formulas naming "${id}" then use it instead of the shipped version ${shipped.ruleset.file.version} (fingerprint ${shipped.status.shortFingerprint})`;
  }
  return `Store ${theirs} in ${ctx.storedWhere}; no ruleset "${id}" is stored or shipped, so it replaces nothing`;
}

/** After storing, what was replaced, in a phrase. */
function replacedPhrase(stored: LibraryEntry | undefined, shippedVersion: string | null): string {
  if (stored?.ruleset && stored.status) return `replacing version ${stored.ruleset.file.version} (fingerprint ${stored.status.shortFingerprint})`;
  if (stored) return "replacing a stored copy that no longer loaded";
  if (shippedVersion !== null) return `standing in for the shipped version ${shippedVersion}`;
  return "where none was stored before";
}

export function updateSection(ctx: PaneContext, entry: FirmLibraryEntry): HTMLElement {
  const { doc } = ctx;
  const id = entry.ruleset.file.id;
  const stored = ctx.library().entries.find((e) => e.source === "stored" && e.id === id);
  const storedPrint = stored?.status?.fingerprint ?? null;
  const shipped = shippedRulesets().find((s) => s.id === id);
  const before: Compared | null = stored
    ? { label: `${id} ${stored.ruleset?.file.version ?? ""} (stored in ${ctx.storedWhere})`, ruleset: stored.ruleset, status: stored.status, why: stored.problem }
    : shipped
      ? { label: `${id} ${shipped.ruleset.file.version} (shipped with Loadwright)`, ruleset: shipped.ruleset, status: shipped.status, why: null }
      : null;
  const after: Compared = { label: `${id} ${entry.ruleset.file.version} (firm library)`, ruleset: entry.ruleset, status: rulesetStatus(entry.ruleset), why: null };

  const params = el(doc, "input", { id: "lw-firm-params", type: "text", autocomplete: "off", spellcheck: "false", "aria-describedby": "lw-firm-params-hint" });
  const compared = el(doc, "div", { id: "lw-firm-compare", "aria-live": "polite" });
  const render = () =>
    compared.replaceChildren(
      ...(before
        ? comparison(ctx, before, after, params.value)
        : [el(doc, "p", { id: "lw-firm-nothing-to-compare" }, `No ruleset "${id}" is stored in ${ctx.storedWhere} or shipped with Loadwright: there is nothing to compare it with.`)]),
    );
  params.addEventListener("change", render);
  render();

  const confirm = el(doc, "input", { type: "checkbox", id: "lw-firm-confirm" });
  const store = button(doc, "Store the library's version", () => void storeIt(), { id: "lw-firm-store", class: "primary" });
  store.disabled = true;
  confirm.addEventListener("change", () => {
    store.disabled = !confirm.checked;
  });
  const replaces = replacementText(ctx, entry, stored);
  const storeIt = async () => {
    if (!confirm.checked) return;
    store.disabled = true;
    const now = ctx.library().entries.find((e) => e.source === "stored" && e.id === id);
    if ((now?.status?.fingerprint ?? null) !== storedPrint || (now === undefined) !== (stored === undefined)) {
      ctx.notice(`Not stored: the stored "${id}" changed after the comparison was shown; compare again. Nothing stored changed.`, "problem");
      ctx.show("firm-library");
      return;
    }
    const saved = await ctx.store().save(entry.ruleset.file);
    if (!saved.ok) {
      store.disabled = false;
      ctx.notice(`Not stored: ${saved.problems.map((p) => p.message).join("; ")}.${unchangedAfterFailure(saved, " Nothing stored changed.")}`, "problem");
      return;
    }
    firmLibraryState(ctx).updating = null;
    ctx.selected = id;
    // What the store's hook did after the write (in Excel: the recalculation, or why it did not happen).
    const storedText = `Stored the firm library's "${id}" ${libraryVersionText(entry)} in ${ctx.storedWhere}, ${replacedPhrase(stored, shipped?.ruleset.file.version ?? null)}`;
    ctx.notice(saved.afterWrite ? withAfterWrite(`${storedText}.`, saved) : `${storedText}; formulas naming "${id}" use it.`, "done");
    ctx.show("firm-library");
  };

  return el(
    doc,
    "section",
    { id: "lw-firm-update", "aria-labelledby": "lw-firm-update-title", "data-ruleset-id": id },
    el(doc, "h2", { id: "lw-firm-update-title" }, `Take the library's version of ${id}`),
    el(doc, "p", {}, `What changes if the firm library's ${libraryVersionText(entry)} is stored: the concrete rows only before (what is used now) and only after (the library's), for the parameters you give.`),
    el(doc, "label", { for: "lw-firm-params" }, "Parameters for the concrete rows"),
    params,
    el(doc, "p", { id: "lw-firm-params-hint", class: "hint" }, "e.g. SDS=1.0 — a parameter without a default must be given to form the rows of the combinations that read it. Empty: the defaults. Enter to apply."),
    compared,
    // An approval does not make a ruleset Checked: what the library's version holds from memory is said before storing.
    after.status?.verification === "unverified" ? fromMemoryBox(doc, entry.ruleset.file) : null,
    el(doc, "div", { class: "alarm-box" }, el(doc, "label", { for: "lw-firm-confirm", class: "check" }, confirm, ` ${replaces}.`)),
    el(
      doc,
      "div",
      { class: "actions" },
      store,
      button(
        doc,
        "Cancel",
        () => {
          firmLibraryState(ctx).updating = null;
          ctx.show("firm-library");
        },
        { id: "lw-firm-cancel" },
      ),
    ),
  );
}
