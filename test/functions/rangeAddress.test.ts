import { describe, expect, test } from "vitest";
import { cellName, parseRangeAddress } from "../../src/functions/rangeAddress.js";

describe("parseRangeAddress", () => {
  test.each([
    // Excel's address form, Sheet!A1:B2, with and without $ and quotes: common practice (no source).
    ["Loads!B3:F9", { sheet: "Loads", top: 2, left: 1 }],
    ["'Column bases'!$AA$10:$AC$12", { sheet: "'Column bases'", top: 9, left: 26 }],
    ["C7", { sheet: "", top: 6, left: 2 }],
  ])("reads %s", (address, expected) => {
    expect(parseRangeAddress(address)).toEqual(expected);
  });

  test.each([[""], [null], [undefined], ["Loads!#REF!"]])("gives null for %s", (address) => {
    expect(parseRangeAddress(address)).toBeNull();
  });
});

describe("cellName", () => {
  test("offsets a cell of the argument from the range's top-left corner", () => {
    expect(cellName(parseRangeAddress("Loads!B3:F9"), 2, 3)).toBe("Loads!E5");
    expect(cellName(parseRangeAddress("'Column bases'!Z1:AB4"), 0, 2)).toBe("'Column bases'!AB1");
  });

  test("counts within the argument when the range's place is unknown", () => {
    expect(cellName(null, 2, 3)).toBe("cell D3");
  });
});
