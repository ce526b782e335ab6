/// <reference types="office-js" />
/**
 * Whether the Office theme is dark, where Office reports its theme
 * (Office.context.officeTheme: Excel on the web, Windows, Mac and iOS). An
 * Office that predates `isDarkTheme` still gives the body background colour,
 * which is dark in the dark themes. Null outside Office: the pane then follows
 * the system's preference.
 */

/** Below this relative luminance (WCAG 2.2, "relative luminance") a background is taken as dark; mid-grey #777777 is about 0.18. */
const DARK_BELOW = 0.18;

export function officeTheme(): "light" | "dark" | null {
  if (typeof Office === "undefined") return null;
  const theme: Office.OfficeTheme | undefined = Office.context?.officeTheme;
  if (!theme) return null;
  if (typeof theme.isDarkTheme === "boolean") return theme.isDarkTheme ? "dark" : "light";
  const luminance = relativeLuminance(theme.bodyBackgroundColor);
  return luminance === null ? null : luminance < DARK_BELOW ? "dark" : "light";
}

/** WCAG 2.2 relative luminance of a "#RRGGBB" colour, or null for anything else. */
export function relativeLuminance(hex: unknown): number | null {
  if (typeof hex !== "string" || !/^#[0-9a-f]{6}$/i.test(hex)) return null;
  const [r, g, b] = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
