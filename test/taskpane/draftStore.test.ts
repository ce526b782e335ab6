import { describe, expect, test } from "vitest";
import { DRAFTS_KEY, DraftStore, type Draft } from "../../src/taskpane/draftStore.js";
import { EMPTY_APPROVAL } from "../../src/taskpane/draftCheck.js";
import { MemoryStorage } from "./memoryStorage.js";

const draft = (key: string, text: string): Draft => ({
  key,
  text,
  base: { kind: "new", id: null, fingerprint: null, approval: EMPTY_APPROVAL },
  opened: "2026-01-01T00:00:00.000Z",
  changed: "2026-01-01T00:00:00.000Z",
});

describe("DraftStore", () => {
  test("keeps drafts, even ones that are not JSON yet, for the next visit", () => {
    const storage = new MemoryStorage();
    const first = new DraftStore(storage);
    expect(first.put(draft("a", '{"id": "half-typed'))).toBe(true);
    expect(first.put(draft("b", "{}"))).toBe(true);
    const later = new DraftStore(storage);
    expect(later.list().map((d) => [d.key, d.text])).toEqual([
      ["a", '{"id": "half-typed'],
      ["b", "{}"],
    ]);
  });

  test("replaces a draft kept under the same key and removes one", () => {
    const store = new DraftStore(new MemoryStorage());
    store.put(draft("a", "1"));
    store.put(draft("a", "2"));
    expect(store.list().map((d) => d.text)).toEqual(["2"]);
    store.remove("a");
    expect(store.list()).toEqual([]);
  });

  test("leaves an unreadable drafts value untouched and says so", () => {
    const storage = new MemoryStorage({ [DRAFTS_KEY]: "{not json" });
    const store = new DraftStore(storage);
    expect(store.problem).toMatch(/cannot be read and are left untouched/);
    expect(store.put(draft("a", "{}"))).toBe(false);
    expect(storage.getItem(DRAFTS_KEY)).toBe("{not json");
    expect(store.list().map((d) => d.key)).toEqual(["a"]);
  });

  test("reports a browser store that refuses the write, and keeps the draft open", () => {
    const store = new DraftStore(new MemoryStorage({}, true));
    expect(store.put(draft("a", "{}"))).toBe(false);
    expect(store.problem).toMatch(/could not be kept in browser storage \(the quota has been exceeded\)/);
    expect(store.get("a")?.text).toBe("{}");
  });
});
