import { describe, expect, test } from "vitest";
import { RulesetStore, STORE_FORMAT, STORE_KEY } from "../../src/workbook/rulesetStore.js";
import { memoryBackend, type SettingsBackend } from "../../src/workbook/settingsBackend.js";
import { SEISMIC_FIXTURE, STRENGTH_FIXTURE } from "../functions/fixtures.js";

/** A backend whose writes fail, as a workbook that cannot save its settings. */
function failingBackend(initial: string | null): SettingsBackend {
  return {
    where: "a workbook that cannot save",
    available: () => true,
    read: () => initial,
    write: async () => {
      throw new Error("saving is not possible");
    },
  };
}

describe("RulesetStore", () => {
  test("keeps a ruleset that loads and gives it back by id", async () => {
    const store = new RulesetStore(memoryBackend());
    expect((await store.save(STRENGTH_FIXTURE)).ok).toBe(true);
    const found = store.find("test-strength");
    expect(found?.loaded.ok).toBe(true);
    expect(found?.file).toEqual(STRENGTH_FIXTURE);
  });

  test("replaces a ruleset saved again under the same id and keeps the others", async () => {
    const store = new RulesetStore(memoryBackend());
    await store.save(STRENGTH_FIXTURE);
    await store.save(SEISMIC_FIXTURE);
    await store.save({ ...STRENGTH_FIXTURE, version: "0.0.2-test" });
    const entries = store.entries();
    expect(entries.ok && entries.value.map((e) => e.id)).toEqual(["test-seismic", "test-strength"]);
    expect((store.find("test-strength")?.file as { version: string }).version).toBe("0.0.2-test");
  });

  test("refuses a ruleset that does not load and leaves what was stored unchanged", async () => {
    const backend = memoryBackend();
    const store = new RulesetStore(backend);
    await store.save(STRENGTH_FIXTURE);
    const before = backend.read(STORE_KEY);
    const bad = { ...STRENGTH_FIXTURE, combinations: [{ id: "1", expression: "1.4D + (", clause: "§2.3.1 (1)" }] };
    const result = await store.save(bad);
    expect(result.ok).toBe(false);
    expect(backend.read(STORE_KEY)).toBe(before);
  });

  test("never overwrites a stored value it cannot read", async () => {
    const backend = memoryBackend({ [STORE_KEY]: "{not json" });
    const store = new RulesetStore(backend);
    const result = await store.save(STRENGTH_FIXTURE);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.problems[0].message).toMatch(/not readable JSON; they are left untouched/);
    expect(backend.read(STORE_KEY)).toBe("{not json");
  });

  test("reports a failed save and keeps the earlier content", async () => {
    const earlier = JSON.stringify({ format: STORE_FORMAT, rulesets: [SEISMIC_FIXTURE] });
    const store = new RulesetStore(failingBackend(earlier));
    const result = await store.save(STRENGTH_FIXTURE);
    expect(!result.ok && result.problems[0].message).toBe(
      "the ruleset was not saved to a workbook that cannot save: saving is not possible; what was stored before is unchanged",
    );
    const entries = store.entries();
    expect(entries.ok && entries.value.map((e) => e.id)).toEqual(["test-seismic"]);
  });

  test("removes a ruleset by id and says when there is none", async () => {
    const store = new RulesetStore(memoryBackend());
    await store.save(STRENGTH_FIXTURE);
    expect((await store.remove("test-strength")).ok).toBe(true);
    expect(store.find("test-strength")).toBeUndefined();
    const again = await store.remove("test-strength");
    expect(!again.ok && again.problems[0].message).toBe('no ruleset "test-strength" is stored in memory (not saved)');
  });

  test("keeps an entry that no longer loads, with the reason", () => {
    const broken = { ...STRENGTH_FIXTURE, combinations: [{ id: "1", expression: "1.4X", clause: "§2.3.1 (1)" }] };
    const store = new RulesetStore(memoryBackend({ [STORE_KEY]: JSON.stringify({ format: STORE_FORMAT, rulesets: [broken] }) }));
    const entry = store.find("test-strength");
    expect(entry?.loaded.ok).toBe(false);
  });
});

describe("RulesetStore's hook after a write", () => {
  /** A hook that notes what it was given and what the store held when it ran. */
  function noting(backend: SettingsBackend) {
    const calls: { ids: readonly string[]; stored: string | null }[] = [];
    const afterWrite = (ids: readonly string[]) => {
      calls.push({ ids, stored: backend.read(STORE_KEY) });
      return Promise.resolve(`recalculated for ${ids.join(", ")}`);
    };
    return { calls, afterWrite };
  }

  test("runs after a save and a removal, once the value is written, and its sentence comes with the result", async () => {
    const backend = memoryBackend();
    const hook = noting(backend);
    const store = new RulesetStore(backend, { afterWrite: hook.afterWrite });
    const saved = await store.save(STRENGTH_FIXTURE);
    expect(saved.ok && saved.afterWrite).toBe("recalculated for test-strength");
    expect(hook.calls[0].stored).toContain('"test-strength"');
    const removed = await store.remove("test-strength");
    expect(removed.ok && removed.afterWrite).toBe("recalculated for test-strength");
    expect(hook.calls[1].stored).not.toContain('"test-strength"');
    expect(hook.calls.map((c) => c.ids)).toEqual([["test-strength"], ["test-strength"]]);
  });

  test("does not run when nothing was written: a ruleset that does not load, a failed save, an id not stored", async () => {
    const bad = { ...STRENGTH_FIXTURE, combinations: [{ id: "1", expression: "1.4D + (", clause: "§2.3.1 (1)" }] };
    const memory = memoryBackend();
    const first = noting(memory);
    const store = new RulesetStore(memory, { afterWrite: first.afterWrite });
    expect((await store.save(bad)).ok).toBe(false);
    expect((await store.remove("test-strength")).ok).toBe(false);
    const failing = failingBackend(null);
    const second = noting(failing);
    expect((await new RulesetStore(failing, { afterWrite: second.afterWrite }).save(STRENGTH_FIXTURE)).ok).toBe(false);
    expect([...first.calls, ...second.calls]).toEqual([]);
  });

  test("keeps the write where the hook throws, and says that what follows a store did not run", async () => {
    const backend = memoryBackend();
    const store = new RulesetStore(backend, { afterWrite: () => Promise.reject(new Error("no calculation engine")) });
    const saved = await store.save(STRENGTH_FIXTURE);
    expect(saved.ok).toBe(true);
    expect(saved.afterWrite).toBe("The change is stored, but what follows a store did not run (no calculation engine).");
    expect(store.find("test-strength")).toBeDefined();
  });
});
