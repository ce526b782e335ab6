/** The browser's local storage: for trying the task pane outside Excel. Nothing travels with a workbook. */
import type { SettingsBackend } from "../workbook/settingsBackend.js";

export function browserStorageBackend(storage: Storage): SettingsBackend {
  return {
    where: "this browser's local storage (demo: not saved in any workbook)",
    available: () => true,
    read: (key) => storage.getItem(key),
    // setItem throws (quota, private mode) before changing anything: the old value stays, and the write is refused.
    write: (key, value) =>
      new Promise<void>((resolve) => {
        storage.setItem(key, value);
        resolve();
      }),
  };
}
