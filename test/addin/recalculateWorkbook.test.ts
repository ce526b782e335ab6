/**
 * The store's hook inside Excel: a full recalculation through Excel.run
 * (Excel.Application.calculate with CalculationType.full: "mark all cells as
 * dirty and then recalculate them", learn.microsoft.com/javascript/api/excel/excel.calculationtype),
 * and a sentence for the pane whichever way it goes.
 */
import { afterEach, describe, expect, test, vi } from "vitest";
import { recalculateWorkbook } from "../../src/addin/recalculateWorkbook.js";

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("recalculateWorkbook", () => {
  test("asks for a full calculation and syncs, then says which formulas now use what is stored", async () => {
    const calls: string[] = [];
    const context = {
      workbook: { application: { calculate: (type: string) => calls.push(`calculate ${type}`) } },
      sync: () => {
        calls.push("sync");
        return Promise.resolve();
      },
    };
    vi.stubGlobal("Excel", { CalculationType: { full: "Full" }, run: (batch: (c: typeof context) => Promise<void>) => batch(context) });
    expect(await recalculateWorkbook(["test-strength"])).toBe("Excel recalculated the workbook: formulas naming test-strength now use what is stored.");
    expect(calls).toEqual(["calculate Full", "sync"]);
  });

  test("says how to recalculate by hand where Excel refuses", async () => {
    vi.stubGlobal("Excel", { CalculationType: { full: "Full" }, run: () => Promise.reject(new Error("the workbook is busy")) });
    expect(await recalculateWorkbook(["a", "b"])).toBe("Excel did not recalculate (the workbook is busy): press Ctrl+Alt+F9 so that formulas naming a, b use what is stored.");
  });
});
