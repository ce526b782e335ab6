/**
 * Firm library: the firm's approved rulesets (loadwright-library/1), opened
 * from a file or read from the HTTPS address the workbook keeps, validated
 * whole before anything in it is used. For every ruleset stored in the
 * workbook it shows the standing in full (core/text/standing.ts); a library
 * version is stored only after its comparison and a confirmation naming what
 * it replaces (libraryUpdate.ts). A reading that fails changes nothing and
 * says why, each problem with its place.
 */
import { rulesetStatus, standingSentence, STANDING_WORDS, type FirmLibraryEntry } from "../core/index.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { button, el } from "./dom.js";
import { firmLibraryState, keptLink, readFirmLibrary, readingTime, standingAgainst, type FirmLibraryState, type LibrarySource } from "./firmLibraryState.js";
import { FIRM_LIBRARY_LIMITS } from "./firmLibrarySource.js";
import { standingBadgeOf } from "./firmStanding.js";
import { updateSection } from "./libraryUpdate.js";
import type { PaneContext } from "./paneContext.js";
import { approvalBadge, verificationBadge } from "./statusText.js";

export function firmLibraryView(ctx: PaneContext): HTMLElement {
  const state = firmLibraryState(ctx);
  const root = el(ctx.doc, "div", { id: "lw-firm-library" }, sourceSection(ctx, state));
  if (state.held) {
    root.append(heldSection(ctx, state));
    const updating = state.updating === null ? undefined : state.held.library.entries.find((e) => e.current && e.ruleset.file.id === state.updating);
    if (updating) root.append(updateSection(ctx, updating));
  }
  return root;
}

/** Where the library is read from: the address kept with the workbook, a new address, or a file; and how the last attempt ended. */
function sourceSection(ctx: PaneContext, state: FirmLibraryState): HTMLElement {
  const { doc } = ctx;
  const { link, problem } = keptLink(ctx);
  const address = el(doc, "input", { id: "lw-firm-address", type: "text", inputmode: "url", autocomplete: "off", spellcheck: "false", "aria-describedby": "lw-firm-limits" });
  address.value = state.typedAddress ?? link.address ?? "";
  address.addEventListener("input", () => {
    state.typedAddress = address.value;
  });
  const file = el(doc, "input", { id: "lw-firm-file", type: "file", accept: ".json,application/json" });
  const busy = state.reading !== null;
  const fetchButton = button(doc, "Read from the address", () => read(ctx, { kind: "address", text: address.value }), { id: "lw-firm-fetch" });
  fetchButton.disabled = busy;
  file.disabled = busy;
  address.addEventListener("keydown", (e) => {
    if (e.key === "Enter" && !busy) read(ctx, { kind: "address", text: address.value });
  });
  file.addEventListener("change", () => {
    const chosen = file.files?.[0];
    if (chosen) read(ctx, { kind: "file", file: chosen });
  });
  const last = link.lastRead;
  const kept = last
    ? `Kept with ${ctx.storedWhere}: ${link.address ? `the address ${link.address}, checked each time the pane opens` : "no address (the library was opened from a file)"}; last read ${readingTime(last.at)}${last.name === link.address ? "" : ` from ${last.name}`} ("${last.title}" of ${last.date}).`
    : `No firm library is kept with ${ctx.storedWhere} yet: read one from its address or open its file.`;
  return el(
    doc,
    "section",
    { "aria-labelledby": "lw-firm-source-title" },
    el(doc, "h2", { id: "lw-firm-source-title" }, "Firm library"),
    el(doc, "p", { class: "hint" }, "The firm's approved rulesets in one file (loadwright-library/1). Reading it changes nothing stored: it shows where each stored ruleset stands, and a library version is stored only after its comparison and your confirmation."),
    el(doc, "p", { id: "lw-firm-kept" }, kept),
    problem ? el(doc, "p", { class: "problem", id: "lw-firm-link-problem" }, problem) : null,
    state.linkProblem ? el(doc, "p", { class: "problem" }, state.linkProblem) : null,
    el(doc, "label", { for: "lw-firm-address" }, "The library's HTTPS address"),
    address,
    el(
      doc,
      "p",
      { id: "lw-firm-limits", class: "hint" },
      `Only https:// is read: a plain HTTP address is refused before any request. At most ${FIRM_LIBRARY_LIMITS.bytes.toLocaleString("en-US")} bytes, read as they arrive and stopped at the limit; the whole reading must end within ${FIRM_LIBRARY_LIMITS.seconds} s. The server must let the add-in read the file (CORS) without signing in; redirects are not followed.`,
    ),
    el(doc, "div", { class: "actions" }, fetchButton),
    el(doc, "label", { for: "lw-firm-file" }, "or open a library file (.json)"),
    file,
    attempt(ctx, state),
  );
}

function read(ctx: PaneContext, source: LibrarySource): void {
  const state = firmLibraryState(ctx);
  if (source.kind === "address") state.typedAddress = source.text;
  const reading = readFirmLibrary(ctx, source);
  ctx.show("firm-library");
  void reading.then((done) => {
    const s = firmLibraryState(ctx);
    if (done && s.held) {
      const { library, read: r } = s.held;
      const current = library.entries.filter((e) => e.current).length;
      ctx.notice(`Read the firm library "${library.title}" of ${library.date} from ${r.name}: ${library.entries.length} approved ${library.entries.length === 1 ? "version" : "versions"} of ${current} ${current === 1 ? "ruleset" : "rulesets"}; nothing stored changed.`, "done");
    } else if (s.failure) {
      ctx.notice(`${s.failure.from} ${s.failure.invalid ? "does not load as a firm library" : "could not be read"}; nothing changed (the reasons are below).`, "problem");
    }
    ctx.show("firm-library");
  });
}

/** A reading in progress, or the last one that failed, with every problem and its place. */
function attempt(ctx: PaneContext, state: FirmLibraryState): HTMLElement {
  const { doc } = ctx;
  const box = el(doc, "div", { id: "lw-firm-result", "aria-live": "polite" });
  if (state.reading !== null) {
    box.append(el(doc, "p", { id: "lw-firm-reading" }, `Reading ${state.reading}…`));
  } else if (state.failure) {
    const f = state.failure;
    const kept = state.held ? ` The library read before ("${state.held.library.title}" of ${state.held.library.date}) is still the one shown.` : "";
    box.append(
      el(
        doc,
        "p",
        { class: "problem", id: "lw-firm-refused", role: "alert" },
        `${f.from} ${f.invalid ? "does not load as a firm library" : "was not read"}${f.onOpening ? " (the check on opening)" : ""}; nothing stored changed and the workbook keeps its library address as it was.${kept}`,
      ),
      el(doc, "ol", { class: "problem-list", id: "lw-firm-problems" }, ...f.problems.map((p) => el(doc, "li", { class: "problem" }, p))),
    );
  }
  return box;
}

/** The library held: what it is, every stored ruleset's standing in full, and its rulesets the workbook does not store. */
function heldSection(ctx: PaneContext, state: FirmLibraryState): HTMLElement {
  const { doc } = ctx;
  const held = state.held!;
  const { library, read, onOpening } = held;
  const entries = ctx.library().entries;
  const stored = entries.filter((e) => e.source === "stored");
  const storedIds = new Set(stored.map((e) => e.id));
  const missing = library.entries.filter((e) => e.current && !storedIds.has(e.ruleset.file.id));
  return el(
    doc,
    "section",
    { id: "lw-firm-held", "aria-labelledby": "lw-firm-title" },
    el(doc, "h2", { id: "lw-firm-title" }, library.title),
    el(doc, "p", {}, `Published by ${library.owner}, dated ${library.date}; ${onOpening ? "checked on opening" : "read"} ${readingTime(read.at)} from ${read.name}.`),
    ...library.notes.map((n) => el(doc, "p", { class: "note" }, n)),
    el(doc, "h3", {}, `Stored in ${ctx.storedWhere}`),
    stored.length > 0
      ? el(doc, "ul", { id: "lw-firm-stored", class: "entries", "aria-label": "Stored rulesets and their standing" }, ...stored.map((e) => storedItem(ctx, state, e)))
      : el(doc, "p", { id: "lw-firm-none-stored" }, `No ruleset is stored in ${ctx.storedWhere}; formulas use the shipped rulesets.`),
    el(doc, "h3", {}, "In the library, not stored here"),
    missing.length > 0
      ? el(doc, "ul", { id: "lw-firm-missing", class: "entries", "aria-label": "Library rulesets not stored here" }, ...missing.map((e) => missingItem(ctx, state, e)))
      : el(doc, "p", {}, "Every ruleset of the library is stored here."),
  );
}

function compareButton(ctx: PaneContext, state: FirmLibraryState, id: string, label: string): HTMLElement {
  return button(
    ctx.doc,
    label,
    () => {
      state.updating = id;
      ctx.show("firm-library");
      ctx.doc.getElementById("lw-firm-update-title")?.scrollIntoView();
    },
    { "data-take": id },
  );
}

function storedItem(ctx: PaneContext, state: FirmLibraryState, entry: LibraryEntry): HTMLElement {
  const { doc } = ctx;
  const held = state.held!;
  const s = standingAgainst(held, entry);
  const f = entry.ruleset?.file;
  const head = el(
    doc,
    "div",
    { class: "entry-line" },
    el(doc, "strong", {}, entry.id),
    f ? el(doc, "span", { class: "muted" }, ` ${f.version}`) : null,
    " ",
    verificationBadge(doc, entry.status),
    " ",
    s ? standingBadgeOf(doc, s) : null,
  );
  if (!s || !f || !entry.status) {
    const inLibrary = held.library.entries.some((e) => e.current && e.ruleset.file.id === entry.id);
    return el(
      doc,
      "li",
      { "data-ruleset-id": entry.id, "data-standing": "does-not-load", class: "entry" },
      head,
      el(doc, "p", { class: "problem" }, `This stored ruleset no longer loads (${entry.problem ?? "unknown problem"}), so its standing cannot be judged.`),
      inLibrary ? el(doc, "div", { class: "actions" }, compareButton(ctx, state, entry.id, "Take the library's version…")) : null,
    );
  }
  const needsAction = s.standing === "library-newer" || s.standing === "changed-locally";
  return el(
    doc,
    "li",
    { "data-ruleset-id": entry.id, "data-standing": s.standing, class: state.updating === entry.id ? "entry selected" : "entry" },
    head,
    el(doc, "div", { class: "entry-meta" }, approvalBadge(doc, f, entry.status), el(doc, "span", { class: "fingerprint" }, entry.status.shortFingerprint)),
    el(doc, "p", { class: "standing-sentence" }, standingSentence(s)),
    el(doc, "p", { class: "hint" }, STANDING_WORDS[s.standing].long),
    needsAction ? el(doc, "div", { class: "actions" }, compareButton(ctx, state, entry.id, "Compare with the library's version…")) : null,
  );
}

function missingItem(ctx: PaneContext, state: FirmLibraryState, entry: FirmLibraryEntry): HTMLElement {
  const { doc } = ctx;
  const f = entry.ruleset.file;
  return el(
    doc,
    "li",
    { "data-ruleset-id": f.id, class: state.updating === f.id ? "entry selected" : "entry" },
    el(doc, "div", { class: "entry-line" }, el(doc, "strong", {}, f.id), el(doc, "span", { class: "muted" }, ` ${f.version}`), " ", verificationBadge(doc, rulesetStatus(entry.ruleset))),
    el(doc, "div", { class: "entry-title" }, f.title),
    el(doc, "p", { class: "hint" }, `approved by ${entry.approvedBy} on ${entry.date}`),
    el(doc, "div", { class: "actions" }, compareButton(ctx, state, f.id, "Compare and store…")),
  );
}
