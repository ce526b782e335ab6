/// <reference types="office-js" />
/**
 * The workbook's document settings: stored with the file, per add-in, reachable
 * from the formulas because formulas and task pane share one runtime. A write
 * sets the value, then asks Office to save the settings; it counts only once
 * `saveAsync` succeeds. Any step may fail — `set` or `saveAsync` throwing, or
 * `saveAsync` reporting a failure — and then the previous value is put back
 * (`set` again, or `remove` where there was none), so the runtime does not show
 * what the file does not hold. Where putting it back fails as well, the session
 * keeps the new value whole, unsaved, and the error says so: the key is read
 * back to tell which value it holds (settingsBackend.ts, writeFailure).
 *
 * A `saveAsync` that never calls back would leave the pane waiting for ever: after
 * `saveWaitMs` the write is given up as not confirmed, the session keeps the new
 * value (the save may still land, so nothing is put back) and the error says so;
 * a late answer is then ignored.
 */
import { writeFailure, type SettingsBackend } from "../workbook/settingsBackend.js";

/** How long a save may take before the pane stops waiting for it. */
export const SAVE_WAIT_MS = 30_000;

export function officeSettingsBackend(saveWaitMs = SAVE_WAIT_MS): SettingsBackend {
  const settings = (): Office.Settings | null =>
    typeof Office !== "undefined" && Office.context?.document?.settings ? Office.context.document.settings : null;
  const textOf = (value: unknown): string | null => (typeof value === "string" ? value : null);
  return {
    where: "this workbook (document settings)",
    available: () => settings() !== null,
    read: (key) => {
      const s = settings();
      if (!s) return null;
      return textOf(s.get(key));
    },
    write: (key, value) =>
      new Promise<void>((resolve, reject) => {
        const s = settings();
        if (!s) {
          reject(new Error("the workbook's settings are not available (Office has not started)"));
          return;
        }
        const before = textOf(s.get(key));
        let settled = false;
        let waiting: ReturnType<typeof setTimeout> | undefined;
        const settle = (): boolean => {
          if (settled) return false;
          settled = true;
          clearTimeout(waiting);
          return true;
        };
        const failed = (reason: unknown) => {
          if (!settle()) return;
          try {
            if (before !== null) s.set(key, before);
            else s.remove(key);
          } catch {
            // Putting the value back failed too: the error below says the session holds the new value.
          }
          reject(writeFailure(reason, () => textOf(s.get(key)), before, value));
        };
        try {
          s.set(key, value);
        } catch (e) {
          failed(new Error(`the workbook did not take the new settings: ${e instanceof Error ? e.message : String(e)}`));
          return;
        }
        try {
          waiting = setTimeout(() => {
            if (!settle()) return;
            const seconds = Math.round(saveWaitMs / 1000);
            reject(writeFailure(new Error(`the workbook has not confirmed saving its settings after ${seconds} s (it may still save them; save the workbook to be sure)`), () => textOf(s.get(key)), before, value));
          }, saveWaitMs);
          s.saveAsync((result) => {
            if (result.status === Office.AsyncResultStatus.Succeeded) {
              if (settle()) resolve();
            } else failed(new Error(`the workbook did not save its settings: ${result.error?.message ?? "unknown reason"}`));
          });
        } catch (e) {
          failed(new Error(`the workbook did not save its settings: ${e instanceof Error ? e.message : String(e)}`));
        }
      }),
  };
}
