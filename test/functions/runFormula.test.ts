import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import type { Formula } from "../../src/functions/formula.js";
import { FACTORED } from "../../src/functions/formulas/factoredFormula.js";
import { STRENGTH_ROWS } from "./fixtures.js";
import { evaluateFormula, runFormula } from "./outcome.js";

/** A stand-in for Excel's CustomFunctions global (the Office mock package does not cover it). */
class StandInError {
  constructor(
    readonly code: string,
    readonly message?: string,
  ) {}
}

beforeEach(() => {
  vi.stubGlobal("CustomFunctions", { Error: StandInError, ErrorCode: { invalidValue: "#VALUE!" } });
});
afterEach(() => {
  vi.unstubAllGlobals();
});

describe("runFormula", () => {
  test("returns the result matrix as is", () => {
    const result = runFormula(FACTORED, [[["", "P"], ["D", 140]], [["1", "1.4D"]], null, null]);
    // ASCE/SEI 7-16 §2.3.1 (1) [confirmed]: 1.4 × 140 = 196.
    expect(result[2]).toEqual(["1: 1.4D", expect.closeTo(196, 9)]);
  });

  test("returns a one-cell #VALUE! error with the message, and names the cell from Excel's parameter addresses", () => {
    const invocation = { parameterAddresses: ["Sheet1!B2:C3", "Sheet1!E2"] } as CustomFunctions.Invocation;
    const result = runFormula(FACTORED, [[["", "P"], ["D", "x"]], STRENGTH_ROWS, null, null], invocation);
    expect(result).toHaveLength(1);
    const error = result[0][0] as StandInError;
    expect(error).toBeInstanceOf(StandInError);
    expect(error.code).toBe("#VALUE!");
    expect(error.message).toBe('cases, Sheet1!C3 (D / P): "x" is not a number');
  });

  test("turns an unexpected failure into a message instead of throwing", () => {
    const broken: Formula = {
      name: "LW.BROKEN",
      parameters: [],
      evaluate: () => {
        throw new Error("boom");
      },
    };
    const outcome = evaluateFormula(broken, []);
    expect(outcome).toEqual({ ok: false, message: "LW.BROKEN stopped on an internal error (boom); this is a defect in Loadwright, please report it with the inputs" });
    expect(() => runFormula(broken, [])).not.toThrow();
  });
});
