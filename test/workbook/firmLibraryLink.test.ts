/**
 * Where a workbook keeps its firm library's address and last reading: one
 * settings value beside the stored rulesets (docs/firm-library.md, "How an
 * engineer's pane follows the library"). A reading from a file keeps the
 * address checked on opening; a value that cannot be read is reported, never
 * taken for "no library".
 */
import { describe, expect, test } from "vitest";
import { FIRM_LIBRARY_LINK_FORMAT, FIRM_LIBRARY_LINK_KEY, FirmLibraryLinkStore, NO_LINK, type LastLibraryRead } from "../../src/workbook/firmLibraryLink.js";
import { memoryBackend, type SettingsBackend } from "../../src/workbook/settingsBackend.js";

const ADDRESS = "https://library.invented.example/approved.json";
/** Invented readings. */
const FROM_ADDRESS: LastLibraryRead = { from: "address", name: ADDRESS, at: "2026-03-02T09:15:00.000Z", title: "Invented library", date: "2026-03-02" };
const FROM_FILE: LastLibraryRead = { from: "file", name: "approved.json", at: "2026-03-03T10:00:00.000Z", title: "Invented library", date: "2026-03-02" };

describe("FirmLibraryLinkStore", () => {
  test("has no link in a workbook that never read a library", () => {
    const read = new FirmLibraryLinkStore(memoryBackend()).read();
    expect(read).toEqual({ ok: true, value: NO_LINK });
  });

  test("keeps the address and the reading, under its own key beside the stored rulesets", async () => {
    const backend = memoryBackend({ "loadwright.rulesets": "kept as it is" });
    const links = new FirmLibraryLinkStore(backend);
    expect(await links.recordReading(FROM_ADDRESS)).toEqual({ ok: true, value: { address: ADDRESS, lastRead: FROM_ADDRESS } });
    expect(JSON.parse(backend.read(FIRM_LIBRARY_LINK_KEY) ?? "null")).toEqual({ format: FIRM_LIBRARY_LINK_FORMAT, address: ADDRESS, lastRead: FROM_ADDRESS });
    expect(backend.read("loadwright.rulesets")).toBe("kept as it is");
  });

  test("keeps the address checked on opening when the library is then opened from a file", async () => {
    const links = new FirmLibraryLinkStore(memoryBackend());
    await links.recordReading(FROM_ADDRESS);
    await links.recordReading(FROM_FILE);
    expect(links.read()).toEqual({ ok: true, value: { address: ADDRESS, lastRead: FROM_FILE } });
  });

  test("reports a kept value that cannot be read, naming the setting", () => {
    for (const value of ["{not json", JSON.stringify({ format: "something-else", address: null, lastRead: null })]) {
      const read = new FirmLibraryLinkStore(memoryBackend({ [FIRM_LIBRARY_LINK_KEY]: value })).read();
      expect(read.ok).toBe(false);
      if (!read.ok) expect(read.problems[0]).toMatchObject({ kind: "library-link", message: expect.stringContaining(`setting "${FIRM_LIBRARY_LINK_KEY}"`) as string });
    }
  });

  test("says so when the workbook refuses the write, and the value kept before stays", async () => {
    const before = JSON.stringify({ format: FIRM_LIBRARY_LINK_FORMAT, address: ADDRESS, lastRead: FROM_ADDRESS });
    const refusing: SettingsBackend = {
      where: "a workbook that cannot save",
      available: () => true,
      read: () => before,
      write: () => Promise.reject(new Error("saving is not possible")),
    };
    const links = new FirmLibraryLinkStore(refusing);
    const written = await links.recordReading(FROM_FILE);
    expect(written.ok).toBe(false);
    if (!written.ok) expect(written.problems[0].message).toBe("the firm library's address and reading time were not kept in a workbook that cannot save: saving is not possible; what was kept before is unchanged");
    expect(links.read()).toEqual({ ok: true, value: { address: ADDRESS, lastRead: FROM_ADDRESS } });
  });
});
