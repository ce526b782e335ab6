/**
 * The views as one line of tabs that holds seven at 320 px: each tab an icon
 * with its name, the name shown beside the icon on the chosen tab and, on the
 * others, kept for assistive technology and shown as a tooltip. The strip
 * follows the usual tab pattern: one tab in the Tab order, the arrow keys move
 * between tabs (and show the view), Home and End go to the ends.
 */
import { el } from "./dom.js";
import { icon, isIconName, type IconName } from "./icons.js";

export interface TabSpec<Name extends string> {
  name: Name;
  label: string;
  /** The tab's icon; a view's own name where it names one, else a plain page. */
  icon?: IconName;
}

export interface TabStrip<Name extends string> {
  render(current: Name): void;
}

export function tabStrip<Name extends string>(doc: Document, strip: HTMLElement, views: readonly TabSpec<Name>[], pick: (name: Name) => void): TabStrip<Name> {
  let current: Name | null = null;
  const tabId = (name: string) => `lw-tab-${name}`;
  strip.addEventListener("keydown", (e) => {
    const i = views.findIndex((v) => v.name === current);
    const n = views.length;
    const to = e.key === "ArrowRight" ? (i + 1) % n : e.key === "ArrowLeft" ? (i + n - 1) % n : e.key === "Home" ? 0 : e.key === "End" ? n - 1 : -1;
    if (to < 0) return;
    e.preventDefault();
    pick(views[to].name);
    doc.getElementById(tabId(views[to].name))?.focus();
  });
  return {
    render(next: Name) {
      current = next;
      strip.replaceChildren(
        ...views.map((v) => {
          const selected = v.name === next;
          const tab = el(
            doc,
            "button",
            { type: "button", role: "tab", id: tabId(v.name), class: "tab", title: v.label, "aria-selected": String(selected), "aria-controls": "lw-view", tabindex: selected ? "0" : "-1" },
            icon(doc, v.icon ?? (isIconName(v.name) ? v.name : "view")),
            el(doc, "span", { class: "tab-label" }, v.label),
          );
          tab.addEventListener("click", () => pick(v.name));
          return tab;
        }),
      );
    },
  };
}
