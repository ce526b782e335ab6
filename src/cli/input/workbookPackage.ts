/**
 * A saved workbook as the zip package it is (ISO/IEC 29500-2, Open Packaging
 * Conventions): its parts, their content types and their relationships, read
 * with the zip library already used to write the demo workbook. Every part is
 * read with a size limit, counted as it is inflated, so that a hostile package
 * (a "zip bomb") is refused before it fills the memory; every failure names
 * the file and the part.
 */
import { readFileSync } from "node:fs";
import { Readable } from "node:stream";
import JSZip from "jszip";
import { CliError } from "../cliError.js";
import { checkReadable, fileErrorText } from "./fileAccess.js";
import { attributeOf, readXmlTree, XmlPartError, type XmlElement } from "./xmlPart.js";

/** Workbooks larger than this on disk are refused (a calculation workbook is a few MB). */
export const MAX_WORKBOOK_BYTES = 200 * 1024 * 1024;
/** One part, inflated. */
export const MAX_PART_BYTES = 256 * 1024 * 1024;
/** All parts read in one audit, inflated. */
export const MAX_READ_BYTES = 1024 * 1024 * 1024;

/** The sizes a package is refused beyond, and what it is read for (in the messages). */
export interface PackageLimits {
  /** On disk. */
  workbookBytes: number;
  /** One part, inflated. */
  partBytes: number;
  /** All parts read, inflated. */
  readBytes: number;
  /** "the audit", "a case file": what the file is read for, in the refusals. */
  use: string;
}

export const AUDIT_LIMITS: PackageLimits = { workbookBytes: MAX_WORKBOOK_BYTES, partBytes: MAX_PART_BYTES, readBytes: MAX_READ_BYTES, use: "the audit" };

const PACKAGE_RELATIONSHIPS = "http://schemas.openxmlformats.org/package/2006/relationships";
const CONTENT_TYPES = "http://schemas.openxmlformats.org/package/2006/content-types";
export const OFFICE_DOCUMENT = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument";
/** Strict Open XML names the main part's relationship with another URI. */
const STRICT_OFFICE_DOCUMENT = "http://purl.oclc.org/ooxml/officeDocument/relationships/officeDocument";

export interface Relationship {
  id: string;
  type: string;
  /** The target part's name (no leading "/"), or the raw target for an external one. */
  target: string;
  external: boolean;
}

export class WorkbookPackage {
  private read = 0;

  private constructor(
    /** The file as the user named it, for messages. */
    readonly file: string,
    private readonly zip: JSZip,
    private readonly defaults: Map<string, string>,
    private readonly overrides: Map<string, string>,
    private readonly limits: PackageLimits,
  ) {}

  static async open(file: string, limits: PackageLimits = AUDIT_LIMITS): Promise<WorkbookPackage> {
    const size = checkReadable(file, "workbook");
    if (size > limits.workbookBytes) throw new CliError(`${file}: the file is ${megabytes(size)}, larger than the ${megabytes(limits.workbookBytes)} a workbook may be for ${limits.use}`);
    let bytes: Buffer;
    try {
      bytes = readFileSync(file);
    } catch (e) {
      throw new CliError(`${file}: ${fileErrorText(e)}`);
    }
    if (bytes.length >= 8 && bytes.readUInt32BE(0) === 0xd0cf11e0 && bytes.readUInt32BE(4) === 0xa1b11ae1) {
      throw new CliError(
        `${file}: an Excel 97-2003 workbook (.xls) or a password-protected workbook (both are compound files, not zip packages); Loadwright reads .xlsx workbooks: save it as .xlsx without a password`,
      );
    }
    let zip: JSZip;
    try {
      zip = await JSZip.loadAsync(bytes);
    } catch (e) {
      const reason = e instanceof Error ? e.message.replace(/ If it is, see .*$/, "") : String(e);
      throw new CliError(`${file}: not a zip package, so not an .xlsx workbook (${reason.replace(/\s*\.?$/, "")})`);
    }
    const pkg = new WorkbookPackage(file, zip, new Map(), new Map(), limits);
    if (!pkg.has("[Content_Types].xml")) throw new CliError(`${file}: a zip file without [Content_Types].xml, so not an Office document; is this an .xlsx workbook?`);
    const types = await pkg.xml("[Content_Types].xml");
    if (types.local !== "Types" || types.uri !== CONTENT_TYPES) throw pkg.partError("[Content_Types].xml", types, `is not a content types part (its root element is <${types.local}>)`);
    for (const entry of types.children) {
      const contentType = attributeOf(entry, "ContentType") ?? "";
      if (entry.local === "Default") pkg.defaults.set((attributeOf(entry, "Extension") ?? "").toLowerCase(), contentType);
      if (entry.local === "Override") pkg.overrides.set(partName(attributeOf(entry, "PartName") ?? ""), contentType);
    }
    return pkg;
  }

  /** Part names as the zip holds them ("xl/workbook.xml"), folders left out. */
  parts(): string[] {
    return Object.keys(this.zip.files).filter((name) => !this.zip.files[name].dir);
  }

  has(part: string): boolean {
    return this.zipEntry(part) !== null;
  }

  /** The part's content type: its override, or the default for its extension. */
  contentType(part: string): string | undefined {
    const name = partName(part);
    const override = [...this.overrides].find(([n]) => n.toLowerCase() === name.toLowerCase());
    if (override) return override[1];
    const extension = name.includes(".") ? name.slice(name.lastIndexOf(".") + 1).toLowerCase() : "";
    return this.defaults.get(extension);
  }

  /** Parts whose content type is the one given. */
  partsOfType(contentType: string): string[] {
    return this.parts().filter((p) => this.contentType(p) === contentType);
  }

  /** The part's text (UTF-8, or UTF-16 with its byte order mark), refused past the size limits. */
  async text(part: string): Promise<string> {
    const entry = this.zipEntry(part);
    if (!entry) throw new CliError(`${this.file}: the part ${part} is missing from the package`);
    const bytes = await this.inflate(part, entry);
    if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder("utf-16le").decode(bytes.subarray(2));
    if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder("utf-16be").decode(bytes.subarray(2));
    try {
      return new TextDecoder("utf-8", { fatal: true }).decode(bytes).replace(/^\uFEFF/, "");
    } catch {
      throw new CliError(`${this.file}: ${part}: the part is not text in UTF-8 or UTF-16; the package is damaged`);
    }
  }

  /**
   * The part's text given piece by piece as it is inflated, never held whole
   * (UTF-8; a worksheet of a million cells is read in flat memory). An error
   * thrown by `onText` stops the reading and is passed on.
   */
  async streamText(part: string, onText: (chunk: string) => void): Promise<void> {
    const entry = this.zipEntry(part);
    if (!entry) throw new CliError(`${this.file}: the part ${part} is missing from the package`);
    let decoder: TextDecoder | null = null;
    let first = true;
    const decode = (bytes: Uint8Array, end: boolean) => {
      // The byte order mark of the first bytes says UTF-16; without one the part is UTF-8.
      if (!decoder) decoder = new TextDecoder(bytes[0] === 0xff && bytes[1] === 0xfe ? "utf-16le" : bytes[0] === 0xfe && bytes[1] === 0xff ? "utf-16be" : "utf-8", { fatal: true });
      let text: string;
      try {
        text = decoder.decode(bytes, { stream: !end });
      } catch {
        throw new CliError(`${this.file}: ${part}: the part is not text in UTF-8 or UTF-16; the package is damaged`);
      }
      if (first && text !== "") {
        text = text.replace(/^\uFEFF/, "");
        first = false;
      }
      if (text !== "") onText(text);
    };
    await this.inflate(part, entry, (chunk) => decode(chunk, false));
    decode(new Uint8Array(0), true);
  }

  /** The part read as an XML tree; a part that is not well-formed XML is refused with its line and column. */
  async xml(part: string): Promise<XmlElement> {
    const text = await this.text(part);
    try {
      return readXmlTree(text);
    } catch (e) {
      if (e instanceof XmlPartError) throw new CliError(`${this.file}: ${part} line ${e.line}, column ${e.column}: not well-formed XML: ${e.message}`);
      throw e;
    }
  }

  /** The relationships of a part ("" for the package itself); none if it has no relationships part. */
  async relationships(source: string): Promise<Relationship[]> {
    const folder = source.includes("/") ? source.slice(0, source.lastIndexOf("/") + 1) : "";
    const relsPart = `${folder}_rels/${source.slice(folder.length)}.rels`;
    if (!this.has(relsPart)) return [];
    const root = await this.xml(relsPart);
    if (root.local !== "Relationships" || root.uri !== PACKAGE_RELATIONSHIPS) throw this.partError(relsPart, root, `is not a relationships part (its root element is <${root.local}>)`);
    return root.children
      .filter((c) => c.local === "Relationship")
      .map((c) => {
        const target = attributeOf(c, "Target") ?? "";
        const external = (attributeOf(c, "TargetMode") ?? "") === "External";
        return { id: attributeOf(c, "Id") ?? "", type: attributeOf(c, "Type") ?? "", target: external ? target : resolveTarget(folder, target), external };
      });
  }

  /** The package's main part: the workbook part its officeDocument relationship names. */
  async mainPart(): Promise<string> {
    const rels = await this.relationships("");
    const main = rels.find((r) => !r.external && (r.type === OFFICE_DOCUMENT || r.type === STRICT_OFFICE_DOCUMENT));
    if (!main) throw new CliError(`${this.file}: the package names no main document (no officeDocument relationship in _rels/.rels); is this an .xlsx workbook?`);
    if (!this.has(main.target)) throw new CliError(`${this.file}: the main document ${main.target} named in _rels/.rels is missing from the package`);
    return main.target;
  }

  partError(part: string, at: XmlElement, message: string): CliError {
    return new CliError(`${this.file}: ${part} line ${at.line}, column ${at.column}: ${message}`);
  }

  /**
   * The part's text piece by piece, pulled by the reader: the part is inflated
   * only as fast as the pieces are taken, so a worksheet of a million rows is
   * read in flat memory however slowly its rows are used (UTF-8 only, as
   * SpreadsheetML parts are written).
   */
  async *textPieces(part: string): AsyncGenerator<string> {
    const entry = this.zipEntry(part);
    if (!entry) throw new CliError(`${this.file}: the part ${part} is missing from the package`);
    // JSZip's stream is an old-style Readable; wrapping it gives back-pressure and async iteration.
    const source = entry.nodeStream("nodebuffer");
    const stream = new Readable().wrap(source);
    const decoder = new TextDecoder("utf-8", { fatal: true });
    let length = 0;
    let first = true;
    try {
      for await (const chunk of stream as AsyncIterable<Buffer>) {
        length += chunk.length;
        this.read += chunk.length;
        const beyond = this.beyondLimits(part, length);
        if (beyond) throw beyond;
        let text: string;
        try {
          text = decoder.decode(chunk, { stream: true });
        } catch {
          throw new CliError(`${this.file}: ${part}: the part is not text in UTF-8; the package is damaged`);
        }
        if (first && text !== "") {
          text = text.replace(/^\uFEFF/, "");
          first = false;
        }
        if (text !== "") yield text;
      }
    } catch (e) {
      if (e instanceof CliError) throw e;
      throw new CliError(`${this.file}: ${part}: the part cannot be inflated from the zip package, which is damaged (${e instanceof Error ? e.message : String(e)})`);
    } finally {
      stream.destroy();
    }
  }

  /** The part's size inflated, as the zip's directory declares it (0 where it is not known): for a progress bar only. */
  partSize(part: string): number {
    // JSZip keeps the directory's figure on an internal field its types do not name.
    const entry = this.zipEntry(part);
    const data: unknown = entry ? Reflect.get(entry, "_data") : undefined;
    const size: unknown = typeof data === "object" && data !== null ? Reflect.get(data, "uncompressedSize") : undefined;
    return typeof size === "number" && Number.isFinite(size) ? size : 0;
  }

  /** The refusal of a part that inflates beyond the limits, or null. */
  private beyondLimits(part: string, length: number): CliError | null {
    const { partBytes, readBytes, use } = this.limits;
    if (length > partBytes) return new CliError(`${this.file}: ${part}: the part inflates to more than ${megabytes(partBytes)}; ${use} refuses it (a damaged or hostile package?)`);
    if (this.read > readBytes) return new CliError(`${this.file}: ${part}: the parts read so far inflate to more than ${megabytes(readBytes)}; ${use} refuses the package (a damaged or hostile package?)`);
    return null;
  }

  private zipEntry(part: string): JSZip.JSZipObject | null {
    const name = partName(part);
    const exact = this.zip.file(name);
    if (exact) return exact;
    // Part names are compared without regard to ASCII case (ISO/IEC 29500-2 §9.1.1.1 [memory]).
    const lower = name.toLowerCase();
    const found = Object.keys(this.zip.files).find((n) => n.toLowerCase() === lower && !this.zip.files[n].dir);
    return found ? this.zip.files[found] : null;
  }

  /** The part's bytes, whole, or given chunk by chunk to `onChunk` (then the promise resolves to no bytes). */
  private inflate(part: string, entry: JSZip.JSZipObject, onChunk?: (chunk: Buffer) => void): Promise<Uint8Array> {
    return new Promise((resolve, reject) => {
      const chunks: Buffer[] = [];
      let length = 0;
      let stopped = false;
      const stream = entry.nodeStream("nodebuffer") as NodeJS.ReadableStream & { destroy(): void };
      const stop = (error: unknown) => {
        stopped = true;
        stream.destroy();
        reject(error instanceof Error ? error : new Error(String(error)));
      };
      stream.on("data", (chunk: Buffer) => {
        if (stopped) return;
        length += chunk.length;
        this.read += chunk.length;
        const beyond = this.beyondLimits(part, length);
        if (beyond) return stop(beyond);
        if (!onChunk) {
          chunks.push(chunk);
          return;
        }
        try {
          onChunk(chunk);
        } catch (e) {
          stop(e);
        }
      });
      stream.on("error", (e: Error) => {
        if (!stopped) reject(new CliError(`${this.file}: ${part}: the part cannot be inflated from the zip package, which is damaged (${e.message})`));
      });
      stream.on("end", () => {
        if (!stopped) resolve(onChunk ? new Uint8Array(0) : Buffer.concat(chunks, length));
      });
    });
  }
}

/** "/xl/workbook.xml" → "xl/workbook.xml". */
function partName(name: string): string {
  return name.replace(/^\/+/, "");
}

/** A relationship's target, relative to its source's folder unless it starts with "/". */
function resolveTarget(folder: string, target: string): string {
  const path = target.startsWith("/") ? target.slice(1) : folder + target;
  const out: string[] = [];
  for (const segment of path.split("/")) {
    if (segment === "..") out.pop();
    else if (segment !== "." && segment !== "") out.push(segment);
  }
  return out.join("/");
}

function megabytes(bytes: number): string {
  return `${Math.round(bytes / (1024 * 1024))} MB`;
}
