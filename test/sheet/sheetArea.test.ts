/**
 * A1 addresses as a formula writes them. Sheet names that need quotes follow
 * the spreadsheet's reference syntax (common practice (no source): a name with
 * spaces or other characters is quoted, a quote inside doubled; a name that
 * reads as a cell is quoted so it is not taken for one).
 */
import { describe, expect, test } from "vitest";
import { areaAddress, areaName, areaReference, cellInArea, parseReference, sheetPrefix } from "../../src/sheet/sheetArea.js";

describe("sheet areas", () => {
  test("quotes a sheet name only where a formula needs it", () => {
    expect(sheetPrefix("Loads")).toBe("Loads!");
    expect(sheetPrefix("Column bases")).toBe("'Column bases'!");
    expect(sheetPrefix("Engineer's")).toBe("'Engineer''s'!");
    expect(sheetPrefix("2024")).toBe("'2024'!");
    expect(sheetPrefix("AB12")).toBe("'AB12'!");
    expect(sheetPrefix("R1C1")).toBe("'R1C1'!");
  });

  test("writes an area as a range, one cell as a cell, absolute where asked", () => {
    const area = { sheet: "Loads", top: 0, left: 0, rows: 5, columns: 4 };
    expect(areaAddress(area)).toBe("A1:D5");
    expect(areaAddress(area, true)).toBe("$A$1:$D$5");
    expect(areaAddress({ ...area, rows: 1, columns: 1 })).toBe("A1");
    expect(areaName({ ...area, sheet: "Column bases", left: 26 })).toBe("'Column bases'!AA1:AD5");
  });

  test("names the sheet in a reference only when the formula sits on another", () => {
    const area = { sheet: "Loads", top: 1, left: 1, rows: 3, columns: 2 };
    expect(areaReference(area, "Loads")).toBe("$B$2:$C$4");
    expect(areaReference(area, "Calc")).toBe("Loads!$B$2:$C$4");
  });

  test("names a cell of an area by its place on the sheet", () => {
    expect(cellInArea({ sheet: "Loads", top: 9, left: 0, rows: 3, columns: 3 }, 1, 1)).toBe("Loads!B11");
  });

  test("reads the references a user types, and nothing else", () => {
    expect(parseReference("Loads!A1:D5")).toEqual({ sheet: "Loads", top: 0, left: 0, rows: 5, columns: 4 });
    expect(parseReference("'Column bases'!$B$2")).toEqual({ sheet: "Column bases", top: 1, left: 1, rows: 1, columns: 1 });
    expect(parseReference(" D5:A1 ")).toEqual({ sheet: null, top: 0, left: 0, rows: 5, columns: 4 });
    expect(parseReference("'Engineer''s'!A1")?.sheet).toBe("Engineer's");
    expect(parseReference("Reactions")).toBeNull();
    expect(parseReference("A0")).toBeNull();
    // The grid's last cell is XFD1048576 (Office Open XML, as Excel uses it); one past it is no cell.
    expect(parseReference("XFD1048576")).not.toBeNull();
    expect(parseReference("XFE1")).toBeNull();
    expect(parseReference("A1048577")).toBeNull();
  });
});
