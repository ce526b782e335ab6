/**
 * The firm library in the Library view: each stored ruleset's standing as a
 * badge beside its status (the words of core/text/standing.ts), and one line
 * above the list saying how the workbook stands against the library — BEHIND
 * where a stored ruleset is a version the library has superseded. The line is
 * also what starts the check made when the pane opens; when that check ends,
 * the badges and the line are redrawn in place (nothing typed is lost).
 */
import { STANDING_WORDS, STANDINGS, type RulesetStanding, type Standing } from "../core/index.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { button, el } from "./dom.js";
import { checkOnOpening, firmLibraryState, keptLink, readingTime, standingAgainst, type HeldLibrary } from "./firmLibraryState.js";
import type { PaneContext } from "./paneContext.js";

/** The badge's class: alarm where the standing asks for action, ok where it is the library's current version. */
export function standingClass(standing: Standing): string {
  switch (standing) {
    case "same":
      return "badge badge-ok";
    case "library-newer":
    case "changed-locally":
      return "badge badge-alarm";
    case "not-in-library":
      return "badge";
  }
}

export function standingBadgeOf(doc: Document, s: RulesetStanding): HTMLElement {
  const words = STANDING_WORDS[s.standing];
  return el(doc, "span", { class: standingClass(s.standing), "data-standing": s.standing, title: words.long }, words.short);
}

/** Beside a stored ruleset's status: its standing against the firm library held, if one is. */
export function standingBadge(ctx: PaneContext, entry: LibraryEntry): HTMLElement | null {
  if (entry.source !== "stored") return null;
  const s = standingAgainst(firmLibraryState(ctx).held, entry);
  const badge = s ? standingBadgeOf(ctx.doc, s) : el(ctx.doc, "span", {});
  badge.setAttribute("data-firm-standing-for", entry.id);
  badge.hidden = s === null;
  return badge;
}

/** Stored rulesets the library has superseded: the workbook is behind. */
export function behind(ctx: PaneContext, held: HeldLibrary): string[] {
  return ctx
    .library()
    .entries.filter((e) => standingAgainst(held, e)?.standing === "library-newer")
    .map((e) => e.id);
}

/** The line above the Library view's list; the first one drawn starts the check on opening. */
export function firmLibraryLine(ctx: PaneContext): HTMLElement {
  checkOnOpening(ctx, () => refreshLibraryView(ctx));
  return lineContent(ctx);
}

function lineContent(ctx: PaneContext): HTMLElement {
  const { doc } = ctx;
  const state = firmLibraryState(ctx);
  const root = el(doc, "div", { id: "lw-firm-line" });
  const open = () => button(doc, "Firm library", () => ctx.show("firm-library"), { class: "link" });
  if (state.held) {
    const { library, read, onOpening } = state.held;
    const ids = behind(ctx, state.held);
    const whence = `${onOpening ? "checked on opening" : "read"} ${readingTime(read.at)}`;
    if (ids.length > 0) {
      root.append(
        el(
          doc,
          "p",
          { class: "alarm-box", id: "lw-firm-behind", role: "alert", "data-behind": ids.join(" ") },
          `This workbook is BEHIND the firm library "${library.title}" of ${library.date} (${whence}): ${STANDING_WORDS["library-newer"].short} for ${ids.join(", ")}. Nothing was changed; compare and take the library's version in `,
          open(),
          ".",
        ),
      );
    }
    root.append(el(doc, "p", { class: "hint", id: "lw-firm-summary" }, `Against the firm library "${library.title}" of ${library.date} (${whence}): ${counts(ctx, state.held)}.`));
    return root;
  }
  if (state.opening === "running" && state.reading) root.append(el(doc, "p", { class: "hint" }, `Checking the firm library at ${state.reading}…`));
  if (state.failure?.onOpening) {
    root.append(
      el(doc, "p", { class: "problem", id: "lw-firm-check-failed" }, `The firm library at ${state.failure.from} could not be checked on opening: ${state.failure.problems.join("; ")}. Nothing was changed. See `, open(), "."),
    );
  }
  const { link, problem } = keptLink(ctx);
  if (problem) root.append(el(doc, "p", { class: "problem" }, problem));
  else if (link.address === null && link.lastRead) {
    root.append(el(doc, "p", { class: "hint" }, `The firm library was last read from the file ${link.lastRead.name} on ${readingTime(link.lastRead.at)}; open it again in `, open(), " to see where this workbook stands."));
  }
  return root;
}

/** "2 same as library, 1 LIBRARY HAS NEWER": the stored rulesets by standing, in the standings' order. */
function counts(ctx: PaneContext, held: HeldLibrary): string {
  const found = ctx
    .library()
    .entries.map((e) => standingAgainst(held, e))
    .filter((s): s is RulesetStanding => s !== null);
  if (found.length === 0) return "no ruleset is stored in this workbook";
  return STANDINGS.map((s) => [s, found.filter((f) => f.standing === s).length] as const)
    .filter(([, n]) => n > 0)
    .map(([s, n]) => `${n} ${STANDING_WORDS[s].short}`)
    .join(", ");
}

/** After the check on opening: the Library view's badges and line, redrawn where they are shown. */
function refreshLibraryView(ctx: PaneContext): void {
  const { doc } = ctx;
  const line = doc.getElementById("lw-firm-line");
  if (line) line.replaceWith(lineContent(ctx));
  for (const old of doc.querySelectorAll<HTMLElement>("[data-firm-standing-for]")) {
    const entry = ctx.library().entries.find((e) => e.id === old.getAttribute("data-firm-standing-for"));
    const fresh = entry ? standingBadge(ctx, entry) : null;
    if (fresh) old.replaceWith(fresh);
  }
  if (doc.getElementById("lw-firm-library")) ctx.show("firm-library");
}
