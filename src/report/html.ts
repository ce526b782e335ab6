/**
 * HTML written as strings, escaped by construction: text is escaped wherever it
 * goes (element content, attribute values, SVG text), and markup passes only as
 * an `Html` value made by `el` or `raw`. Every name a ruleset or a case file
 * gives (a case header, a result id, a clause, a title) is text, never markup.
 */

/** Markup, as opposed to text. */
export interface Html {
  readonly html: string;
}

export type Child = Html | string | number | null | undefined | false | readonly Child[];

const ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Text for element content or a quoted attribute value. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

/** Markup written by the report itself (never anything read from a file). */
export function raw(html: string): Html {
  return { html };
}

function childHtml(child: Child): string {
  if (child === null || child === undefined || child === false) return "";
  if (typeof child === "string") return escapeHtml(child);
  if (typeof child === "number") return escapeHtml(String(child));
  if (Array.isArray(child)) return (child as readonly Child[]).map(childHtml).join("");
  return (child as Html).html;
}

export type Attributes = Record<string, string | number | boolean | null | undefined>;

/** An element: attributes (escaped; false, null and undefined left out) and children (text escaped). */
export function el(tag: string, attributes: Attributes | null, ...children: Child[]): Html {
  let open = `<${tag}`;
  for (const [name, value] of Object.entries(attributes ?? {})) {
    if (value === false || value === null || value === undefined) continue;
    open += value === true ? ` ${name}` : ` ${name}="${escapeHtml(String(value))}"`;
  }
  return { html: `${open}>${children.map(childHtml).join("")}</${tag}>` };
}

/** Children joined into one fragment. */
export function fragment(...children: Child[]): Html {
  return { html: children.map(childHtml).join("") };
}

/** Text inside a CSS string ("…"): every character but letters, digits and spaces as a hex escape. */
export function cssString(text: string): string {
  let out = "";
  for (const c of text) out += /[A-Za-z0-9 ]/.test(c) ? c : `\\${(c.codePointAt(0) ?? 0).toString(16)} `;
  return `"${out}"`;
}
