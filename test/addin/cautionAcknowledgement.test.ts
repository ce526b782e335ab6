import { describe, expect, test } from "vitest";
import { compactCautionLine, fullCautions } from "../../src/core/index.js";
import { CAUTIONS_KEY, CautionAcknowledgement } from "../../src/workbook/cautionAcknowledgement.js";
import { memoryBackend, type SettingsBackend } from "../../src/workbook/settingsBackend.js";

/** A backend whose writes are refused, as a read-only workbook refuses saveAsync. */
function refusingBackend(): SettingsBackend {
  return { ...memoryBackend(), where: "this workbook (read-only)", write: () => Promise.reject(new Error("the document is read-only")) };
}

describe("CautionAcknowledgement", () => {
  test("is not acknowledged in a workbook that has never recorded it", () => {
    expect(new CautionAcknowledgement(memoryBackend()).current()).toBeNull();
  });

  test("keeps the text acknowledged and the date, under its own key beside the stored rulesets", async () => {
    const backend = memoryBackend();
    const record = new CautionAcknowledgement(backend);
    const done = await record.acknowledge("2026-12-03");
    expect(done.ok).toBe(true);
    expect(JSON.parse(backend.read(CAUTIONS_KEY) ?? "null")).toEqual({ format: "loadwright-cautions/1", cautions: fullCautions(), date: "2026-12-03" });
    expect(record.current()?.date).toBe("2026-12-03");
    // A second pane over the same workbook reads the same record.
    expect(new CautionAcknowledgement(backend).current()?.date).toBe("2026-12-03");
  });

  test("shows cautions worded anew in full again: an acknowledgement is of the text it was given", async () => {
    const backend = memoryBackend();
    await new CautionAcknowledgement(backend, ["an earlier wording of the cautions (invented for the test)"]).acknowledge("2026-01-02");
    expect(new CautionAcknowledgement(backend).current()).toBeNull();
  });

  test("takes a value it cannot read as not acknowledged, and leaves it as it was", () => {
    for (const text of ["not JSON", "[]", '{"format":"loadwright-cautions/1","cautions":"all","date":"2026-12-03"}', '{"format":"other","cautions":[],"date":"x"}']) {
      const backend = memoryBackend({ [CAUTIONS_KEY]: text });
      expect(new CautionAcknowledgement(backend).current(), text).toBeNull();
      expect(backend.read(CAUTIONS_KEY)).toBe(text);
    }
  });

  test("says where and why an acknowledgement was not saved, and records nothing", async () => {
    const record = new CautionAcknowledgement(refusingBackend());
    const done = await record.acknowledge("2026-12-03");
    expect(done).toEqual({
      ok: false,
      problems: [
        {
          kind: "settings-write",
          message: "the acknowledgement of the cautions was not saved to this workbook (read-only): the document is read-only; they will be shown in full again next time",
          place: {},
        },
      ],
    });
    expect(record.current()).toBeNull();
  });
});

describe("the compact caution line", () => {
  test("names each caution in a few words, in the catalogue's order", () => {
    // docs/task-pane.md, "The caution line": one line of a few words for each caution of docs/design.md, "Cautions"
    // (review by a qualified, licensed engineer; the adopted edition governs; verify the shipped rulesets).
    expect(compactCautionLine()).toBe("Review by a licensed engineer; adopted code governs; verify rulesets");
  });
});
