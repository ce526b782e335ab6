/**
 * Nothing stored is lost to a failed save. The store keeps every ruleset in
 * one value under one key, written in one step; here every step of that write
 * fails in turn, against a stand-in for Office.context.document.settings whose
 * `set`, `remove` and `saveAsync` throw at once, or whose `saveAsync` reports a
 * failure later (in its callback, as Office does: the settings' saveAsync
 * "persists the in-memory copy of the settings property bag into the document",
 * learn.microsoft.com/javascript/api/office/office.settings), and against a
 * browser storage whose setItem throws a QuotaExceededError (HTML Living
 * Standard, Web storage, setItem: "If … the new value couldn't be stored, then
 * throw a QuotaExceededError", and the value is then unchanged) [memory: the
 * standard's wording].
 *
 * For every write (a new ruleset, a replacement, a removal; into a workbook
 * that stored nothing and one that did), whatever step fails: the key holds a
 * whole value — exactly the one from before or exactly the new one, never a
 * mix, never nothing; the document (what saveAsync persisted) keeps the one
 * from before; what the formulas and the pane see (the store's entries) is
 * that value; and the store's words say which it is.
 */
import { afterEach, describe, expect, test, vi } from "vitest";
import { browserStorageBackend } from "../../src/addin/browserStorageBackend.js";
import { officeSettingsBackend } from "../../src/addin/officeSettingsBackend.js";
import { RulesetStore, STORE_FORMAT, STORE_KEY, type WriteResult } from "../../src/workbook/rulesetStore.js";
import { memoryBackend, type SettingsBackend } from "../../src/workbook/settingsBackend.js";
import { unchangedAfterFailure } from "../../src/taskpane/afterWrite.js";
import { RobustnessClass } from "../fuzz/robustness.js";
import { SEISMIC_FIXTURE, STRENGTH_FIXTURE } from "../functions/fixtures.js";

/** A step of a settings write that fails, and how. */
type Failing =
  | "nothing"
  | "set throws"
  | "saveAsync throws"
  | "saveAsync fails later"
  | "saveAsync throws, then set throws"
  | "saveAsync fails later, then set throws"
  | "saveAsync throws, then remove throws"
  | "saveAsync fails later, then remove throws";

const FAILINGS: Failing[] = [
  "nothing",
  "set throws",
  "saveAsync throws",
  "saveAsync fails later",
  "saveAsync throws, then set throws",
  "saveAsync fails later, then set throws",
  "saveAsync throws, then remove throws",
  "saveAsync fails later, then remove throws",
];

/** The stand-in: the session's property bag, the document's copy (what the last successful saveAsync persisted), and the steps to fail. */
function standInOffice(initial: string | null, failing: Failing) {
  const session = new Map<string, unknown>();
  if (initial !== null) session.set(STORE_KEY, initial);
  const document = new Map(session);
  // The steps still to fail, in the order the write meets them.
  const steps = failing === "nothing" ? [] : failing.split(", then ");
  const next = (step: string) => steps[0]?.startsWith(step) === true && (steps.shift() ?? "") !== "";
  const settings = {
    get: (k: string) => session.get(k) ?? null,
    set: (k: string, v: unknown) => {
      if (next("set throws")) throw new Error("the settings cannot be changed now");
      session.set(k, v);
    },
    remove: (k: string) => {
      if (next("remove throws")) throw new Error("the setting cannot be removed now");
      session.delete(k);
    },
    saveAsync: (callback: (r: { status: string; error?: { message: string } }) => void) => {
      if (next("saveAsync throws")) throw new Error("the document is busy");
      if (next("saveAsync fails later")) {
        setTimeout(() => callback({ status: "failed", error: { message: "the document is read-only" } }), 1);
        return;
      }
      setTimeout(() => {
        document.clear();
        for (const [k, v] of session) document.set(k, v);
        callback({ status: "succeeded" });
      }, 1);
    },
  };
  vi.stubGlobal("Office", { context: { document: { settings } }, AsyncResultStatus: { Succeeded: "succeeded", Failed: "failed" } });
  return { session, document };
}

afterEach(() => {
  vi.unstubAllGlobals();
});

const storeValue = (rulesets: unknown[]) => JSON.stringify({ format: STORE_FORMAT, rulesets });
const ids = (text: string | null) => (text === null ? [] : (JSON.parse(text) as { rulesets: { id: string }[] }).rulesets.map((r) => r.id));

interface Write {
  name: string;
  before: string | null;
  /** The value a successful write leaves: the same write into memory, where nothing fails. */
  after: string;
  /** The ids stored after a successful write, in order (hand-listed). */
  afterIds: string[];
  run(store: RulesetStore): Promise<WriteResult<unknown>>;
}

const CHANGED = { ...STRENGTH_FIXTURE, version: "0.0.9-test" };

async function write(name: string, before: string | null, afterIds: string[], run: Write["run"]): Promise<Write> {
  const memory = memoryBackend(before === null ? {} : { [STORE_KEY]: before });
  const done = await run(new RulesetStore(memory));
  if (!done.ok) throw new Error(`${name}: the write fails even in memory`);
  const after = memory.read(STORE_KEY) as string;
  if (JSON.stringify(ids(after)) !== JSON.stringify(afterIds)) throw new Error(`${name}: stores ${ids(after).join(", ")}`);
  return { name, before, after, afterIds, run };
}

const WRITES: Write[] = await Promise.all([
  write("a first ruleset into a workbook that stored nothing", null, ["test-strength"], (s) => s.save(STRENGTH_FIXTURE)),
  write("a second ruleset beside one stored", storeValue([SEISMIC_FIXTURE]), ["test-seismic", "test-strength"], (s) => s.save(STRENGTH_FIXTURE)),
  write("a stored ruleset replaced", storeValue([STRENGTH_FIXTURE, SEISMIC_FIXTURE]), ["test-seismic", "test-strength"], (s) => s.save(CHANGED)),
  write("a stored ruleset removed", storeValue([STRENGTH_FIXTURE, SEISMIC_FIXTURE]), ["test-seismic"], (s) => s.remove("test-strength")),
]);

/** What one write failing at one step left, or the first guarantee it broke. */
async function writeFailingAt(write: Write, failing: Failing): Promise<string | null> {
  const { session, document } = standInOffice(write.before, failing);
  const store = new RulesetStore(officeSettingsBackend());
  const result = await write.run(store);
  const held = session.get(STORE_KEY) ?? null;
  const saved = document.get(STORE_KEY) ?? null;
  if (held !== write.before && held !== write.after) return `the key holds neither the value from before nor the new one: ${String(held)}`;
  if (held === null && write.before !== null) return "the stored rulesets are gone";
  const seen = store.entries();
  if (!seen.ok || JSON.stringify(seen.value.map((e) => e.id)) !== JSON.stringify(ids(held as string | null))) return "what the formulas see is not what the key holds";
  if (failing === "nothing") {
    if (!result.ok || held !== write.after || saved !== write.after) return `a write with no failure did not store: ${JSON.stringify(result)}`;
    return null;
  }
  if (result.ok) return "a failed write reported success";
  if (saved !== write.before) return "the document's copy changed although no save succeeded";
  const message = result.problems[0].message;
  const where = "the ruleset was not saved to this workbook (document settings): ";
  if (!message.startsWith(where)) return `the message does not say where: ${message}`;
  if (held === write.before) {
    if (result.held !== "before" || !message.endsWith("; what was stored before is unchanged")) return `unchanged, but said otherwise: ${message}`;
    if (unchangedAfterFailure(result) !== "; nothing stored changed") return "the pane would not say that nothing stored changed";
    return null;
  }
  if (result.held !== "new-unsaved" || !/this session now uses the new content, which this workbook \(document settings\) does not hold; store it again, or reopen the workbook/.test(message)) {
    return `the new content is held unsaved, but said otherwise: ${message}`;
  }
  if (unchangedAfterFailure(result) !== "") return "the pane would say that nothing stored changed";
  return null;
}

describe("a store write failing at each step (Office document settings)", () => {
  test(`store: a write to the workbook's settings failing at each step: ${WRITES.length * FAILINGS.length} writes`, async () => {
    const tally = new RobustnessClass("store: a write to the workbook's settings failing at each step (set, remove, saveAsync; at once and later)");
    try {
      for (const write of WRITES) {
        for (const failing of FAILINGS) {
          await tally.checkAsync(
            { write, failing },
            async (x) => {
              const wrong = await writeFailingAt(x.write, x.failing);
              return { located: true, wrongOutput: wrong };
            },
            (x) => `${x.write.name}; ${x.failing}`,
          );
        }
      }
    } finally {
      tally.save();
    }
    expect(tally.failures).toEqual([]);
    expect(tally.counts.inputs).toBe(WRITES.length * FAILINGS.length);
  });

  test("keeps what was stored when the save fails, and says so", async () => {
    const before = storeValue([SEISMIC_FIXTURE]);
    const { session, document } = standInOffice(before, "saveAsync fails later");
    const result = await new RulesetStore(officeSettingsBackend()).save(STRENGTH_FIXTURE);
    expect(!result.ok && result.problems[0].message).toBe(
      "the ruleset was not saved to this workbook (document settings): the workbook did not save its settings: the document is read-only; what was stored before is unchanged",
    );
    expect(result.held).toBe("before");
    expect(session.get(STORE_KEY)).toBe(before);
    expect(document.get(STORE_KEY)).toBe(before);
  });

  test("says that the session holds the new content, unsaved, where the earlier value could not be put back", async () => {
    const before = storeValue([SEISMIC_FIXTURE]);
    const { session, document } = standInOffice(before, "saveAsync fails later, then set throws");
    const store = new RulesetStore(officeSettingsBackend());
    const result = await store.save(STRENGTH_FIXTURE);
    expect(!result.ok && result.problems[0].message).toBe(
      "the ruleset was not saved to this workbook (document settings): the workbook did not save its settings: the document is read-only; " +
        "and what was stored before could not be put back: this session now uses the new content, which this workbook (document settings) does not hold; " +
        "store it again, or reopen the workbook to return to what was stored before",
    );
    expect(result.held).toBe("new-unsaved");
    expect(ids(session.get(STORE_KEY) as string)).toEqual(["test-seismic", "test-strength"]);
    expect(document.get(STORE_KEY)).toBe(before);
    // Storing again, once the workbook saves, brings the document up to what the session holds.
    const again = await store.save(STRENGTH_FIXTURE);
    expect(again.ok).toBe(true);
  });
});

/** A browser storage that holds at most `quota` characters in all, and throws a QuotaExceededError beyond it. */
function quotaStorage(quota: number, initial: Record<string, string> = {}): Storage {
  const items = new Map(Object.entries(initial));
  const used = () => [...items].reduce((n, [k, v]) => n + k.length + v.length, 0);
  return {
    get length() {
      return items.size;
    },
    clear: () => items.clear(),
    getItem: (k: string) => items.get(k) ?? null,
    key: (i: number) => [...items.keys()][i] ?? null,
    removeItem: (k: string) => void items.delete(k),
    setItem: (k: string, v: string) => {
      if (used() - (items.get(k)?.length ?? 0) - (items.has(k) ? k.length : 0) + k.length + v.length > quota) {
        throw new DOMException("the quota has been exceeded", "QuotaExceededError");
      }
      items.set(k, v);
    },
  };
}

describe("a store write the browser refuses (quota exceeded)", () => {
  test(`store: browser storage refusing writes for its quota: ${WRITES.length} writes`, async () => {
    const tally = new RobustnessClass("store: browser storage refusing writes for its quota");
    try {
      for (const write of WRITES) {
        await tally.checkAsync(
          write,
          async (w) => {
            // Room for what is stored and ten characters more, not for a larger change (a removal, being smaller, fits).
            const room = (w.before?.length ?? 0) + 10;
            const storage = quotaStorage(STORE_KEY.length + room, w.before === null ? {} : { [STORE_KEY]: w.before });
            const backend: SettingsBackend = browserStorageBackend(storage);
            const store = new RulesetStore(backend);
            const result = await w.run(store);
            const held = storage.getItem(STORE_KEY);
            const fits = w.after.length <= room;
            if (fits) return { located: true, wrongOutput: result.ok && held === w.after ? null : `a write that fits failed: ${JSON.stringify(result)}` };
            if (result.ok) return { located: true, wrongOutput: "a refused write reported success" };
            const said = result.problems[0].message;
            const right = held === w.before && result.held === "before" && said.endsWith(": the quota has been exceeded; what was stored before is unchanged") && said.startsWith("the ruleset was not saved to this browser's local storage");
            return { located: true, wrongOutput: right ? null : `held ${String(held)}; said ${said}` };
          },
          (w) => w.name,
        );
      }
    } finally {
      tally.save();
    }
    expect(tally.failures).toEqual([]);
  });
});
