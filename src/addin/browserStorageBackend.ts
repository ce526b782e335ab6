/** The browser's local storage: for trying the task pane outside Excel. Nothing travels with a workbook. */
import { writeFailure, type SettingsBackend } from "../workbook/settingsBackend.js";

export function browserStorageBackend(storage: Storage): SettingsBackend {
  return {
    where: "this browser's local storage (demo: not saved in any workbook)",
    available: () => true,
    read: (key) => storage.getItem(key),
    // setItem throws (a quota exceeded, private mode) before changing anything (HTML Living Standard, Web storage,
    // setItem): the old value stays, which the error confirms by reading the key back.
    write: (key, value) =>
      new Promise<void>((resolve, reject) => {
        const before = storage.getItem(key);
        try {
          storage.setItem(key, value);
          resolve();
        } catch (e) {
          reject(writeFailure(e, () => storage.getItem(key), before, value));
        }
      }),
  };
}
