/**
 * Where stored rulesets live: one text value under one key. Inside Excel that is
 * the workbook's document settings (they travel with the file); in a plain
 * browser it is the browser's local storage; in tests, memory.
 *
 * A value is written in one step (one key, one text), so a write that fails
 * leaves one whole value, never a mix of the old and the new nor nothing: the
 * value from before, or — where putting it back failed too — the new one, held
 * by this session but not saved. The backend reads the key back after a failure
 * and says which (SettingsWriteError), so that the user is told the truth.
 */
export interface SettingsBackend {
  /** Shown to the user: where a saved ruleset goes. */
  readonly where: string;
  /** Whether values can be read now (Office settings exist only once Office has started). */
  available(): boolean;
  read(key: string): string | null;
  /** Resolves once the value is durably written; rejects with a SettingsWriteError saying which value the key holds otherwise. */
  write(key: string, value: string): Promise<void>;
}

/** Which whole value a key holds after a write failed: the one from before, or the new one, held by this session but not saved. */
export type HeldAfterFailure = "before" | "new-unsaved";

export class SettingsWriteError extends Error {
  constructor(
    message: string,
    readonly holds: HeldAfterFailure,
  ) {
    super(message);
  }
}

/** A failed write's error, naming what the key holds now: read back, compared with the value meant and the one from before. */
export function writeFailure(reason: unknown, read: () => string | null, before: string | null, meant: string): SettingsWriteError {
  const message = reason instanceof Error ? reason.message : String(reason);
  let now: string | null;
  try {
    now = read();
  } catch {
    // Where the value cannot even be read back, nothing says the new one took: the one from before is what the file holds.
    now = before;
  }
  return new SettingsWriteError(message, now === meant && meant !== before ? "new-unsaved" : "before");
}

/** For tests and for the pane before any storage is reachable. */
export function memoryBackend(initial: Record<string, string> = {}): SettingsBackend {
  const values = new Map(Object.entries(initial));
  return {
    where: "memory (not saved)",
    available: () => true,
    read: (key) => values.get(key) ?? null,
    write: (key, value) => {
      values.set(key, value);
      return Promise.resolve();
    },
  };
}
