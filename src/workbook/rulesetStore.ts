/**
 * Rulesets a firm keeps with a workbook (or, outside Excel, in the browser):
 * one JSON value holding every stored ruleset file exactly as validated. A save
 * checks the new file first and writes only if it loads; a stored value that
 * cannot be read is never overwritten, so nothing stored is lost to a failed
 * import or a bad edit. After every successful write the store runs its one
 * hook (inside Excel: recalculate the workbook, so that formulas naming a
 * ruleset use what is now stored) and hands on the sentence it returns.
 */
import { loadRuleset, problem, STORE_FORMAT, STORE_KEY, type Problem, type Result, type Ruleset } from "../core/index.js";
import { SettingsWriteError, type HeldAfterFailure, type SettingsBackend } from "./settingsBackend.js";

export { STORE_FORMAT, STORE_KEY };

export interface StoredRuleset {
  id: string;
  /** The file as stored; `loaded` says whether it still validates (the format may have moved on). */
  file: unknown;
  loaded: Result<Ruleset>;
}

interface StoreValue {
  format: typeof STORE_FORMAT;
  rulesets: unknown[];
}

const storeProblem = (message: string): Problem => problem("ruleset-store", message);

/**
 * What runs after each successful write, given the ids written (saved or
 * removed). It says in one sentence what it did, for the pane to show; it
 * must not throw (a failure is a sentence too), and the write stands either way.
 */
export type AfterWrite = (ids: readonly string[]) => Promise<string>;

/**
 * A write's result, with what the hook said after it (absent when the write
 * failed or there is no hook); after a failed write, which whole value is
 * stored now (`held`): what was stored before, or — where the backend could
 * not put it back — the new one, held by this session but not saved.
 */
export type WriteResult<T> = Result<T> & { afterWrite?: string; held?: HeldAfterFailure };

export interface RulesetStoreOptions {
  afterWrite?: AfterWrite;
}

export class RulesetStore {
  private cache: { text: string; entries: Result<StoredRuleset[]> } | null = null;

  private readonly afterWrite: AfterWrite | null;

  constructor(
    readonly backend: SettingsBackend,
    options: RulesetStoreOptions = {},
  ) {
    this.afterWrite = options.afterWrite ?? null;
  }

  /** Every stored ruleset, or a problem if the stored value cannot be read at all. */
  entries(): Result<StoredRuleset[]> {
    if (!this.backend.available()) return { ok: true, value: [] };
    const text = this.backend.read(STORE_KEY);
    if (text === null) return { ok: true, value: [] };
    if (this.cache?.text === text) return this.cache.entries;
    const entries = parseStore(text, this.backend.where);
    this.cache = { text, entries };
    return entries;
  }

  find(id: string): StoredRuleset | undefined {
    const all = this.entries();
    return all.ok ? all.value.find((e) => e.id === id) : undefined;
  }

  /**
   * Validates, then adds or replaces the ruleset with the same id. Nothing is written unless it loads.
   * `input`: JSON text or a parsed ruleset file, checked before anything is written.
   */
  async save(input: unknown): Promise<WriteResult<Ruleset>> {
    const loaded = loadRuleset(input);
    if (!loaded.ok) return loaded;
    const current = this.entries();
    if (!current.ok) return current;
    const file = loaded.value.file;
    const kept = current.value.filter((e) => e.id !== file.id).map((e) => e.file);
    const written = await this.write([...kept, file]);
    return written.ok ? this.after([file.id], loaded) : written;
  }

  async remove(id: string): Promise<WriteResult<true>> {
    const current = this.entries();
    if (!current.ok) return current;
    if (!current.value.some((e) => e.id === id)) {
      return { ok: false, problems: [storeProblem(`no ruleset "${id}" is stored in ${this.backend.where}`)] };
    }
    const written = await this.write(current.value.filter((e) => e.id !== id).map((e) => e.file));
    return written.ok ? this.after([id], { ok: true, value: true }) : written;
  }

  /** Runs the hook after a successful write; what it says travels with the result. */
  private async after<T>(ids: string[], result: Result<T>): Promise<WriteResult<T>> {
    if (!this.afterWrite) return result;
    try {
      return { ...result, afterWrite: await this.afterWrite(ids) };
    } catch (e) {
      // A hook is not meant to throw; if it does, the write still stands and the user hears why nothing followed.
      const reason = e instanceof Error ? e.message : String(e);
      return { ...result, afterWrite: `The change is stored, but what follows a store did not run (${reason}).` };
    }
  }

  /**
   * Every stored ruleset is one value under one key, written in one step: a
   * failure leaves the whole value from before or, where the backend could not
   * put it back, the whole new one unsaved — never a mix, never nothing — and
   * the problem says which.
   */
  private async write(rulesets: unknown[]): Promise<WriteResult<true>> {
    const value: StoreValue = { format: STORE_FORMAT, rulesets };
    try {
      await this.backend.write(STORE_KEY, JSON.stringify(value));
      return { ok: true, value: true };
    } catch (e) {
      const reason = e instanceof Error ? e.message : String(e);
      const held: HeldAfterFailure = e instanceof SettingsWriteError ? e.holds : "before";
      const what =
        held === "before"
          ? "what was stored before is unchanged"
          : `and what was stored before could not be put back: this session now uses the new content, which ${this.backend.where} does not hold; store it again, or reopen the workbook to return to what was stored before`;
      return { ok: false, problems: [storeProblem(`the ruleset was not saved to ${this.backend.where}: ${reason}; ${what}`)], held };
    }
  }
}

function parseStore(text: string, where: string): Result<StoredRuleset[]> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    return { ok: false, problems: [storeProblem(`the rulesets stored in ${where} are not readable JSON; they are left untouched`)] };
  }
  const value = data as Partial<StoreValue> | null;
  if (!value || value.format !== STORE_FORMAT || !Array.isArray(value.rulesets)) {
    return {
      ok: false,
      problems: [storeProblem(`the rulesets stored in ${where} are not in the ${STORE_FORMAT} format; they are left untouched`)],
    };
  }
  return {
    ok: true,
    value: value.rulesets.map((file, index) => {
      const id = typeof (file as { id?: unknown })?.id === "string" ? (file as { id: string }).id : `(entry ${index + 1} without an id)`;
      return { id, file, loaded: loadRuleset(file) };
    }),
  };
}
