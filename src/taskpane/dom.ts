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

/** The local date as YYYY-MM-DD (what an approval records as "today"). */
export function todayText(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
