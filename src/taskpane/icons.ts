/**
 * The pane's few icons, drawn for Loadwright on a 20-unit grid as strokes in
 * the text colour (so they follow the theme). Each is decoration beside words
 * that say the same: hidden from assistive technology, never the only cue.
 */

const PATHS = {
  /** Three volumes on a shelf. */
  library: "M3.5 3.5h3v13h-3z M8.5 3.5h3v13h-3z M13.4 4.4l2.8-.8 2.6 12-2.8.8z",
  /** A pencil. */
  editor: "M12.5 3.8l3.7 3.7L7.7 16H4v-3.7z M10.6 5.7l3.7 3.7",
  /** Two arrows passing each other. */
  compare: "M3.5 7h12 M12.5 4l3 3-3 3 M16.5 13h-12 M7.5 10l-3 3 3 3",
  /** A check in a ring. */
  approve: "M10 2.8a7.2 7.2 0 1 1 0 14.4a7.2 7.2 0 1 1 0-14.4z M6.8 10.2l2.2 2.2 4.2-4.7",
  /** One arrow down, one up. */
  transfer: "M6.5 3v11 M3.5 11l3 3 3-3 M13.5 17V6 M10.5 9l3-3 3 3",
  /** An office building. */
  firm: "M4 16.5V3.5h8v13 M12 8h4.5v8.5 M2.5 16.5h15 M6.5 6.5h1 M9 6.5h1 M6.5 9.5h1 M9 9.5h1 M6.5 12.5h1 M9 12.5h1",
  /** A grid of cells. */
  sheet: "M3 4h14v12H3z M3 8h14 M3 12h14 M8 4v12",
  /** A plain page, for a view without an icon of its own. */
  view: "M5 3h7l3 3v11H5z M12 3v3h3",
  /** A warning triangle. */
  warning: "M10 3.2l7.6 13.3H2.4z M10 8.2v3.8 M10 14.2v.1",
  /** An arrow head pointing down (a disclosure that is closed). */
  chevron: "M5.5 8l4.5 4.5L14.5 8",
  /** A cross. */
  close: "M5.5 5.5l9 9 M14.5 5.5l-9 9",
} as const;

export type IconName = keyof typeof PATHS;

const SVG = "http://www.w3.org/2000/svg";

/** The named icon as an inline SVG element (built node by node: no markup is parsed). */
export function icon(doc: Document, name: IconName, className = "icon"): SVGSVGElement {
  const svg = doc.createElementNS(SVG, "svg");
  svg.setAttribute("viewBox", "0 0 20 20");
  svg.setAttribute("class", className);
  svg.setAttribute("aria-hidden", "true");
  svg.setAttribute("focusable", "false");
  const path = doc.createElementNS(SVG, "path");
  path.setAttribute("d", PATHS[name]);
  svg.append(path);
  return svg;
}

/** Whether a name is one of the icons (a view's own name usually is). */
export function isIconName(name: string): name is IconName {
  return Object.hasOwn(PATHS, name);
}
