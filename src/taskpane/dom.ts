/** Small DOM builders shared by the pane's views: no framework, just elements with attributes and children. */

export type Child = string | Node | null | undefined | false;

/** An element of the tag's own type (`el(doc, "input")` is an HTMLInputElement), with attributes and children. */
export function el<K extends keyof HTMLElementTagNameMap>(doc: Document, tag: K, attributes: Record<string, string | undefined> = {}, ...children: Child[]): HTMLElementTagNameMap[K] {
  const node = doc.createElement(tag);
  for (const [k, v] of Object.entries(attributes)) if (v !== undefined && v !== "") node.setAttribute(k, v);
  for (const c of children) if (c !== null && c !== undefined && c !== false) node.append(c);
  return node;
}

export function button(doc: Document, label: string, onClick: () => void, attributes: Record<string, string | undefined> = {}): HTMLButtonElement {
  const b = el(doc, "button", { type: "button", ...attributes }, label);
  b.addEventListener("click", onClick);
  return b;
}

/** A unique element id for label/description links. */
let counter = 0;
export function uniqueId(prefix: string): string {
  counter += 1;
  return `${prefix}-${counter}`;
}

/**
 * Keeps a CSS variable on the root element equal to an element's height, for a bar that sticks to an edge
 * of the pane: the stylesheet pads scrolling by it, so what scrolls into view (a focused field) is not under the bar.
 */
export function trackHeight(element: HTMLElement, variable: string): void {
  const doc = element.ownerDocument;
  const update = () => doc.documentElement.style.setProperty(variable, `${Math.ceil(element.getBoundingClientRect().height)}px`);
  const view = doc.defaultView;
  if (view && "ResizeObserver" in view) new view.ResizeObserver(update).observe(element);
  update();
}

/** The local date as YYYY-MM-DD (what an approval records as "today"). */
export function todayText(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
