/**
 * Where stored rulesets live: one text value under one key. Inside Excel that is
 * the workbook's document settings (they travel with the file); in a plain
 * browser it is the browser's local storage; in tests, memory.
 */
export interface SettingsBackend {
  /** Shown to the user: where a saved ruleset goes. */
  readonly where: string;
  /** Whether values can be read now (Office settings exist only once Office has started). */
  available(): boolean;
  read(key: string): string | null;
  /** Resolves once the value is durably written; rejects (and keeps the old value) otherwise. */
  write(key: string, value: string): Promise<void>;
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
