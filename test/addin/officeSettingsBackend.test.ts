import { afterEach, describe, expect, test, vi } from "vitest";
import { officeSettingsBackend, SAVE_WAIT_MS } from "../../src/addin/officeSettingsBackend.js";
import { SettingsWriteError } from "../../src/workbook/settingsBackend.js";

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

/** A stand-in whose saveAsync keeps its callback and answers only when the test says. */
function silentOffice() {
  const values = new Map<string, unknown>();
  const pending: ((r: { status: string; error?: { message: string } }) => void)[] = [];
  const settings = {
    get: (k: string) => values.get(k) ?? null,
    set: (k: string, v: unknown) => void values.set(k, v),
    remove: (k: string) => void values.delete(k),
    saveAsync: (callback: (r: { status: string; error?: { message: string } }) => void) => void pending.push(callback),
  };
  vi.stubGlobal("Office", { context: { document: { settings } }, AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" } });
  return { values, pending };
}

afterEach(() => {
  vi.unstubAllGlobals();
  vi.useRealTimers();
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

  // A save Office never answers must not leave the pane waiting for ever (docs/reliability.md, nothing lost):
  // the session keeps the new value, says it is not confirmed, and a late answer changes nothing.
  test("stops waiting for a save that never answers, keeping the new value and saying it is unconfirmed", async () => {
    vi.useFakeTimers();
    const { values, pending } = silentOffice();
    values.set("k", "earlier");
    const backend = officeSettingsBackend();
    const write = backend.write("k", "later");
    const outcome = write.then(
      () => null,
      (e: unknown) => e,
    );
    await vi.advanceTimersByTimeAsync(SAVE_WAIT_MS - 1);
    expect(pending).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(1);
    const error = await outcome;
    expect(error).toBeInstanceOf(SettingsWriteError);
    expect((error as SettingsWriteError).message).toBe("the workbook has not confirmed saving its settings after 30 s (it may still save them; save the workbook to be sure)");
    expect((error as SettingsWriteError).holds).toBe("new-unsaved");
    pending[0]({ status: "failed", error: { message: "too late" } });
    expect(backend.read("k")).toBe("later");
  });

  test("a save answered in time is not also given up later", async () => {
    vi.useFakeTimers();
    const { pending } = silentOffice();
    const backend = officeSettingsBackend();
    const write = backend.write("k", "v");
    pending[0]({ status: "succeeded" });
    await expect(write).resolves.toBeUndefined();
    await vi.advanceTimersByTimeAsync(SAVE_WAIT_MS * 2);
    expect(backend.read("k")).toBe("v");
  });
});
