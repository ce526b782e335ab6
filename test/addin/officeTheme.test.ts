import { afterEach, describe, expect, test, vi } from "vitest";
import { officeTheme, relativeLuminance } from "../../src/addin/officeTheme.js";

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("relativeLuminance", () => {
  test("is the WCAG 2.2 relative luminance", () => {
    // WCAG 2.2, definition of "relative luminance" (w3.org/TR/WCAG22/#dfn-relative-luminance): white 1, black 0.
    expect(relativeLuminance("#FFFFFF")).toBe(1);
    expect(relativeLuminance("#000000")).toBe(0);
    // Hand calculation from the same definition: 0x77 / 255 = 0.46667 → ((0.46667 + 0.055) / 1.055)^2.4 = 0.18447 on each channel.
    expect(relativeLuminance("#777777")).toBeCloseTo(0.18447, 4);
    // Pure green carries the 0.7152 weight of the definition.
    expect(relativeLuminance("#00ff00")).toBeCloseTo(0.7152, 10);
  });

  test("reads only a #RRGGBB colour", () => {
    for (const text of ["", "#fff", "red", "#12345g", 12, null]) expect(relativeLuminance(text), String(text)).toBeNull();
  });
});

describe("officeTheme", () => {
  test("is unknown outside Office", () => {
    expect(officeTheme()).toBeNull();
  });

  test("follows isDarkTheme where Office gives it", () => {
    vi.stubGlobal("Office", { context: { officeTheme: { isDarkTheme: true, bodyBackgroundColor: "#FFFFFF" } } });
    expect(officeTheme()).toBe("dark");
    vi.stubGlobal("Office", { context: { officeTheme: { isDarkTheme: false, bodyBackgroundColor: "#262626" } } });
    expect(officeTheme()).toBe("light");
  });

  test("reads the body background where isDarkTheme is missing", () => {
    // Background colours invented for the test: a near-black and a near-white body.
    vi.stubGlobal("Office", { context: { officeTheme: { bodyBackgroundColor: "#262626" } } });
    expect(officeTheme()).toBe("dark");
    vi.stubGlobal("Office", { context: { officeTheme: { bodyBackgroundColor: "#F3F3F3" } } });
    expect(officeTheme()).toBe("light");
    vi.stubGlobal("Office", { context: { officeTheme: { bodyBackgroundColor: "not a colour" } } });
    expect(officeTheme()).toBeNull();
  });

  test("is unknown where Office has no theme", () => {
    vi.stubGlobal("Office", { context: {} });
    expect(officeTheme()).toBeNull();
  });
});
