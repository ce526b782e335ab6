/// <reference types="office-js" />
/**
 * The workbook's document settings: stored with the file, per add-in, reachable
 * from the formulas because formulas and task pane share one runtime. A value is
 * only kept once `saveAsync` succeeds; on failure the previous value is put back
 * so the runtime never shows what the file does not hold.
 */
import type { SettingsBackend } from "../workbook/settingsBackend.js";

export function officeSettingsBackend(): SettingsBackend {
  const settings = (): Office.Settings | null =>
    typeof Office !== "undefined" && Office.context?.document?.settings ? Office.context.document.settings : null;
  return {
    where: "this workbook (document settings)",
    available: () => settings() !== null,
    read: (key) => {
      const s = settings();
      if (!s) return null;
      const value: unknown = s.get(key);
      return typeof value === "string" ? value : null;
    },
    write: (key, value) =>
      new Promise<void>((resolve, reject) => {
        const s = settings();
        if (!s) {
          reject(new Error("the workbook's settings are not available (Office has not started)"));
          return;
        }
        const before: unknown = s.get(key);
        s.set(key, value);
        s.saveAsync((result) => {
          if (result.status === Office.AsyncResultStatus.Succeeded) {
            resolve();
            return;
          }
          if (typeof before === "string") s.set(key, before);
          else s.remove(key);
          reject(new Error(`the workbook did not save its settings: ${result.error?.message ?? "unknown reason"}`));
        });
      }),
  };
}
