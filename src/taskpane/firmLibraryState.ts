/**
 * The firm library as the pane holds it while open: the library last read
 * (from an HTTPS address or a file, validated whole by the core's loader), the
 * last attempt that failed and why, and the check made on opening. A reading
 * that fails changes none of it but the failure shown; one that succeeds
 * replaces the library held and keeps its address and time with the workbook.
 * The check on opening reads the address the workbook keeps and writes
 * nothing: what it finds is only shown.
 */
import { describeProblem, loadFirmLibrary, standingOf, type FirmLibrary, type Problem, type RulesetStanding } from "../core/index.js";
import { FirmLibraryLinkStore, NO_LINK, type FirmLibraryLink, type LastLibraryRead } from "../workbook/firmLibraryLink.js";
import type { LibraryEntry } from "../workbook/rulesetLibrary.js";
import { fetchLibraryText, fileLibraryText, libraryAddress } from "./firmLibrarySource.js";
import { locatePath } from "./jsonLocate.js";
import type { PaneContext } from "./paneContext.js";

export interface HeldLibrary {
  library: FirmLibrary;
  read: LastLibraryRead;
  /** Read by the check on opening rather than at the user's request. */
  onOpening: boolean;
}

export interface FailedReading {
  /** The address or file name. */
  from: string;
  /** Whether the library's text arrived and was refused by the loader (so the problems are placed in it). */
  invalid: boolean;
  /** Each problem on one line, with its place (JSON path, ruleset, character, line and column). */
  problems: string[];
  onOpening: boolean;
}

export interface FirmLibraryState {
  held: HeldLibrary | null;
  failure: FailedReading | null;
  opening: "not-started" | "running" | "done";
  /** A reading in progress (its address or file name). */
  reading: string | null;
  /** The address typed but not read yet, kept across renders. */
  typedAddress: string | null;
  /** The ruleset whose library version is being compared before storing. */
  updating: string | null;
  /** What keeping the address with the workbook said, when it failed. */
  linkProblem: string | null;
  /** Only the latest reading started may change the state. */
  attempt: number;
}

const states = new WeakMap<PaneContext, FirmLibraryState>();

export function firmLibraryState(ctx: PaneContext): FirmLibraryState {
  let state = states.get(ctx);
  if (!state) {
    state = { held: null, failure: null, opening: "not-started", reading: null, typedAddress: null, updating: null, linkProblem: null, attempt: 0 };
    states.set(ctx, state);
  }
  return state;
}

/** Where the workbook keeps its library's address: beside its stored rulesets. */
export function linkStore(ctx: PaneContext): FirmLibraryLinkStore {
  return new FirmLibraryLinkStore(ctx.store().backend);
}

export function keptLink(ctx: PaneContext): { link: FirmLibraryLink; problem: string | null } {
  const read = linkStore(ctx).read();
  return read.ok ? { link: read.value, problem: null } : { link: NO_LINK, problem: read.problems.map((p) => p.message).join("; ") };
}

export type LibrarySource = { kind: "address"; text: string } | { kind: "file"; file: Blob & { name: string } };

/**
 * Reads, validates and (on success) holds the library and keeps where it came
 * from with the workbook. Resolves, once the state says what happened, to
 * whether the library was read.
 */
export async function readFirmLibrary(ctx: PaneContext, source: LibrarySource, onOpening = false): Promise<boolean> {
  const state = firmLibraryState(ctx);
  const attempt = ++state.attempt;
  let name = source.kind === "address" ? source.text.trim() : source.file.name;
  const failed = (problems: string[], invalid: boolean) => {
    if (attempt !== state.attempt) return false;
    state.reading = null;
    state.failure = { from: name, invalid, problems, onOpening };
    return false;
  };
  let text: string;
  if (source.kind === "address") {
    const url = libraryAddress(source.text);
    if (!url.ok) return failed(url.problems.map((p) => p.message), false);
    name = url.value.href;
    state.reading = name;
    const fetcher = ctx.doc.defaultView?.fetch.bind(ctx.doc.defaultView) ?? fetch;
    const fetched = await fetchLibraryText(url.value, fetcher);
    if (!fetched.ok) return failed(fetched.problems.map((p) => p.message), false);
    text = fetched.value;
  } else {
    state.reading = name;
    const got = await fileLibraryText(source.file);
    if (!got.ok) return failed(got.problems.map((p) => p.message), false);
    text = got.value;
  }
  const loaded = loadFirmLibrary(text);
  if (!loaded.ok) return failed(placedProblems(text, loaded.problems), true);
  if (attempt !== state.attempt) return false;
  const library = loaded.value;
  const read: LastLibraryRead = { from: source.kind, name, at: new Date().toISOString(), title: library.title, date: library.date };
  state.reading = null;
  state.failure = null;
  state.held = { library, read, onOpening };
  state.updating = null;
  state.linkProblem = null;
  if (!onOpening) {
    const kept = await linkStore(ctx).recordReading(read);
    if (!kept.ok) state.linkProblem = kept.problems.map((p) => p.message).join("; ");
  }
  return true;
}

/**
 * The check made when the pane opens: once, where the workbook keeps an HTTPS
 * address; `done` runs when it has finished (to show what it found).
 */
export function checkOnOpening(ctx: PaneContext, done: () => void): void {
  const state = firmLibraryState(ctx);
  if (state.opening !== "not-started") return;
  const { link } = keptLink(ctx);
  if (link.address === null) {
    state.opening = "done";
    return;
  }
  state.opening = "running";
  void readFirmLibrary(ctx, { kind: "address", text: link.address }, true).then(() => {
    state.opening = "done";
    done();
  });
}

/** A stored ruleset's standing against the library held, or null where none is held or the stored copy does not load. */
export function standingAgainst(held: HeldLibrary | null, entry: LibraryEntry): RulesetStanding | null {
  if (!held || entry.source !== "stored" || !entry.status) return null;
  return standingOf(held.library, entry.id, entry.status.fingerprint);
}

/** A loader problem with its place in words and, where it can be found, its line and column in the library's text. */
export function placedProblems(text: string, problems: Problem[]): string[] {
  return problems.map((p) => {
    const line = describeProblem(p);
    if (/line \d+, column \d+/.test(line)) return line;
    const spot = p.place.path ? locatePath(text, p.place.path, p.place.position) : null;
    return spot ? `${line} (line ${spot.line}, column ${spot.column})` : line;
  });
}

/** A reading's time as the pane shows it: the local day and time to the minute. */
export function readingTime(iso: string): string {
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
