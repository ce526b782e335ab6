import { afterEach, describe, expect, test, vi } from "vitest";
import { officeSettingsBackend } from "../../src/addin/officeSettingsBackend.js";

/** A stand-in for Office.context.document.settings whose saveAsync succeeds or fails as told. */
function standInOffice(saves: boolean) {
  const values = new Map<string, unknown>();
  const saved = new Map<string, unknown>();
  const settings = {
    get: (k: string) => values.get(k) ?? null,
    set: (k: string, v: unknown) => void values.set(k, v),
    remove: (k: string) => void values.delete(k),
    saveAsync: (callback: (r: { status: string; error?: { message: string } }) => void) => {
      if (saves) {
        saved.clear();
        for (const [k, v] of values) saved.set(k, v);
        callback({ status: "succeeded" });
      } else {
        callback({ status: "failed", error: { message: "the document is read-only" } });
      }
    },
  };
  vi.stubGlobal("Office", { context: { document: { settings } }, AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" } });
  return { values, saved };
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("officeSettingsBackend", () => {
  test("is unavailable until Office has started", () => {
    expect(officeSettingsBackend().available()).toBe(false);
  });

  test("writes through the workbook's settings and saves them", async () => {
    const { saved } = standInOffice(true);
    const backend = officeSettingsBackend();
    await backend.write("k", "v1");
    expect(backend.read("k")).toBe("v1");
    expect(saved.get("k")).toBe("v1");
  });

  test("puts the earlier value back when the workbook does not save", async () => {
    const { values } = standInOffice(false);
    values.set("k", "earlier");
    const backend = officeSettingsBackend();
    await expect(backend.write("k", "later")).rejects.toThrow("the workbook did not save its settings: the document is read-only");
    expect(backend.read("k")).toBe("earlier");
  });

  test("removes a value that was not there before when the save fails", async () => {
    standInOffice(false);
    const backend = officeSettingsBackend();
    await expect(backend.write("k", "later")).rejects.toThrow();
    expect(backend.read("k")).toBeNull();
  });
});
