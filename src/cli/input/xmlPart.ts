/**
 * The XML parts of a workbook package, read with saxes: a strict, namespace-aware
 * XML 1.0 parser (the one the spreadsheet library already uses to read
 * workbooks). It refuses text that is not well-formed and reports where, does not
 * expand entities it does not know (so no entity expansion attack), and keeps
 * names by namespace, so that a part written with other prefixes reads the same.
 * Stops at the first error, with its line and column.
 */
import { SaxesParser } from "saxes";

export interface XmlAttribute {
  local: string;
  uri: string;
  value: string;
}

export interface XmlElement {
  local: string;
  uri: string;
  attributes: XmlAttribute[];
  /** Kept only when the whole tree is read. */
  children: XmlElement[];
  /** The element's own text (not its children's), complete once it is closed. */
  text: string;
  /** Where its start tag ends (1-based line and column). */
  line: number;
  column: number;
}

export class XmlPartError extends Error {
  constructor(
    readonly line: number,
    readonly column: number,
    message: string,
  ) {
    super(message);
  }
}

export interface XmlHandlers {
  open?(element: XmlElement, depth: number): void;
  close?(element: XmlElement, depth: number): void;
}

export interface XmlReader {
  /** Feeds the next piece of text; the handlers run as elements open and close. */
  write(chunk: string): void;
  /** Ends the text; refuses it if an element is left open. Returns the root element. */
  close(): XmlElement | null;
}

/** Reads text piece by piece, event by event; `keepTree` also links every element to its parent's children. */
export function xmlReader(handlers: XmlHandlers, keepTree = false): XmlReader {
  const parser = new SaxesParser({ xmlns: true, position: true });
  const stack: XmlElement[] = [];
  let root: XmlElement | null = null;
  parser.on("error", (e) => {
    throw new XmlPartError(parser.line, parser.column + 1, e.message.replace(/^\d+:\d+: /, ""));
  });
  parser.on("opentag", (tag) => {
    const element: XmlElement = {
      local: tag.local,
      uri: tag.uri,
      attributes: Object.values(tag.attributes).map((a) => ({ local: a.local, uri: a.uri, value: a.value })),
      children: [],
      text: "",
      line: parser.line,
      column: parser.column + 1,
    };
    const parent = stack[stack.length - 1];
    if (keepTree && parent) parent.children.push(element);
    if (!root) root = element;
    stack.push(element);
    handlers.open?.(element, stack.length - 1);
  });
  const addText = (t: string) => {
    const top = stack[stack.length - 1];
    if (top) top.text += t;
  };
  parser.on("text", addText);
  parser.on("cdata", addText);
  parser.on("closetag", () => {
    const element = stack.pop();
    if (element) handlers.close?.(element, stack.length);
  });
  return {
    write: (chunk) => {
      parser.write(chunk);
    },
    close: () => {
      parser.close();
      return root;
    },
  };
}

/** Reads a whole text event by event. */
export function parseXml(text: string, handlers: XmlHandlers, keepTree = false): XmlElement | null {
  const reader = xmlReader(handlers, keepTree);
  reader.write(text);
  return reader.close();
}

/** The whole part as a tree of elements. */
export function readXmlTree(text: string): XmlElement {
  const root = parseXml(text, {}, true);
  if (!root) throw new XmlPartError(1, 1, "the part holds no XML element");
  return root;
}

/** An attribute by local name (and namespace; none for plain attributes). */
export function attributeOf(element: XmlElement, local: string, uri = ""): string | undefined {
  return element.attributes.find((a) => a.local === local && a.uri === uri)?.value;
}

export function childrenNamed(element: XmlElement, local: string, uri: string): XmlElement[] {
  return element.children.filter((c) => c.local === local && c.uri === uri);
}
