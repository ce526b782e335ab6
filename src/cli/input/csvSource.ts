/**
 * A CSV file read in large chunks and scanned for records in its bytes
 * (csvScanner.ts), with each record's file line. Where the scanner meets what
 * csv-parse would refuse, or a file it does not read (a UTF-16 byte order mark,
 * a delimiter that is not one ASCII byte), the general reader (csvRecords.ts)
 * reads the file instead from that record on, so every error is csv-parse's
 * own. Records come from `next()` without waiting while bytes are at hand:
 * "wait" asks the caller to `await refill()` first.
 */
import { open, stat, type FileHandle } from "node:fs/promises";
import { CliError } from "../cliError.js";
import { readCsv, type CsvReader, type CsvRecord } from "./csvRecords.js";
import { CsvScanner, ESCAPED } from "./csvScanner.js";
import { fileErrorText } from "./fileAccess.js";

/** Bytes read at a time: large reads keep the file system's cost per byte small. */
const CHUNK = 4 << 20;
/** The least buffer a file is read into. */
const SMALL_BUFFER = 64 << 10;

export type SourceStep = "record" | "end" | "wait";

export class CsvSource {
  /** The record `next()` found: in the scanner's fields (bytes), or as cells (read by csv-parse). */
  fromBytes = true;
  cells: string[] = [];
  /** 1-based file line the current record starts on. */
  line = 0;

  private buffer: Buffer;
  private filled = 0;
  private bytesDone = 0;
  /** The file's size when it was opened: a read that ends short of it means the file was cut while it was read. */
  private sizeAtOpen = 0;
  private atEnd = false;
  private nextLine = 1;
  private delivered = 0;
  private handOver = false;
  private general: CsvReader | null = null;
  private pending: CsvRecord | null = null;
  private generalDone = false;
  readonly scanner: CsvScanner;

  private constructor(
    readonly path: string,
    readonly delimiter: string,
    private file: FileHandle | null,
    chunkBytes: number,
  ) {
    this.buffer = Buffer.alloc(chunkBytes);
    const code = Buffer.from(delimiter, "utf8");
    this.scanner = new CsvScanner(code.length === 1 ? code[0] : 0);
  }

  /** `chunkBytes`: how much is read at a time (small sizes test records split across reads). */
  static async open(path: string, delimiter: string, reader: "bytes" | "csv-parse" = "bytes", chunkBytes = CHUNK): Promise<CsvSource> {
    let file: FileHandle;
    try {
      file = await open(path, "r");
    } catch (e) {
      throw new CliError(`${path}: ${fileErrorText(e)}`);
    }
    let size: number;
    try {
      size = (await file.stat()).size;
    } catch (e) {
      await file.close();
      throw new CliError(`${path}: ${fileErrorText(e)}`);
    }
    // A small file needs no buffer of a full chunk (allocating 4 MB costs more than reading a few lines); one that grows is read in larger parts.
    const source = new CsvSource(path, delimiter, file, Math.min(chunkBytes, Math.max(SMALL_BUFFER, size + 1)));
    source.sizeAtOpen = size;
    await source.read();
    const b = source.buffer;
    const oneByte = Buffer.byteLength(delimiter, "utf8") === 1 && !/[\d+\-.eE\s]/.test(delimiter);
    // csv-parse looks for a byte order mark in the first three bytes only.
    const utf16 = source.filled >= 3 && b[0] === 0xff && b[1] === 0xfe;
    if (reader === "csv-parse" || !oneByte || utf16 || source.filled < 3) source.handOver = true;
    else {
      const skip = b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf ? 3 : 0;
      source.scanner.feed(source.buffer, source.filled, source.atEnd);
      source.scanner.pos = skip;
    }
    return source;
  }

  /** Bytes of the file read so far (for the progress bar). */
  bytesRead(): number {
    return this.general ? this.general.bytesRead() : this.bytesDone;
  }

  next(): SourceStep {
    if (this.handOver) return "wait";
    if (this.general) {
      if (this.pending) {
        this.fromBytes = false;
        this.cells = this.pending.cells;
        this.line = this.pending.line;
        this.pending = null;
        return "record";
      }
      return this.generalDone ? "end" : "wait";
    }
    const found = this.scanner.next();
    switch (found) {
      case "record":
        this.fromBytes = true;
        this.line = this.nextLine;
        this.nextLine += 1 + this.scanner.innerLineFeeds;
        this.delivered++;
        return "record";
      case "end":
        return "end";
      case "more":
        return "wait";
      case "malformed":
        this.handOver = true;
        return "wait";
    }
  }

  /** Make `next()` able to go on: read more bytes, or start or continue the general reader. */
  async refill(): Promise<void> {
    if (this.handOver) {
      this.handOver = false;
      await this.closeFile();
      // csv-parse reads the file from its start; the records already given are the same and are skipped.
      this.general = readCsv(this.path, { delimiter: this.delimiter });
      for (let k = 0; k < this.delivered; k++) if ((await this.general.records.next()).done) break;
    }
    if (this.general) {
      const next = await this.general.records.next();
      if (next.done) {
        this.generalDone = true;
        this.checkWhole(this.general.bytesRead());
      } else this.pending = next.value;
      return;
    }
    // Keep what is left of the record being scanned, then read after it.
    const left = this.scanner.end - this.scanner.pos;
    if (left > 0 && this.scanner.pos > 0) this.buffer.copy(this.buffer, 0, this.scanner.pos, this.scanner.end);
    this.filled = left;
    if (this.filled === this.buffer.length) {
      const larger = Buffer.alloc(this.buffer.length * 2);
      this.buffer.copy(larger, 0, 0, this.filled);
      this.buffer = larger;
    }
    await this.read();
    this.scanner.feed(this.buffer, this.filled, this.atEnd);
  }

  /** The current record's field k as text (decoded as UTF-8, "" unescaped), as csv-parse gives it. */
  text(k: number): string {
    if (!this.fromBytes) return this.cells[k] ?? "";
    const s = this.scanner;
    const text = this.buffer.toString("utf8", s.fieldStart[k], s.fieldEnd[k]);
    return s.fieldKind[k] === ESCAPED ? text.replace(/""/g, '"') : text;
  }

  /** Fields of the current record. */
  get fieldCount(): number {
    return this.fromBytes ? this.scanner.fieldCount : this.cells.length;
  }

  /** The current record as cells. */
  record(): CsvRecord {
    if (!this.fromBytes) return { cells: this.cells, line: this.line };
    const cells: string[] = [];
    for (let k = 0; k < this.scanner.fieldCount; k++) cells.push(this.text(k));
    return { cells, line: this.line };
  }

  async close(): Promise<void> {
    await this.closeFile();
    if (this.general) await this.general.records.return(undefined);
  }

  private async read(): Promise<void> {
    if (!this.file) return;
    while (this.filled < this.buffer.length && !this.atEnd) {
      let n: number;
      try {
        ({ bytesRead: n } = await this.file.read(this.buffer, this.filled, this.buffer.length - this.filled, null));
      } catch (e) {
        throw new CliError(`${this.path}: ${fileErrorText(e)}`);
      }
      if (n === 0) this.atEnd = true;
      this.filled += n;
      this.bytesDone += n;
      // One read per refill is enough unless the buffer is nearly empty.
      if (this.filled > this.buffer.length / 2) break;
    }
    if (this.atEnd) {
      await this.closeFile();
      this.checkWhole(this.bytesDone);
    }
  }

  /**
   * Where reading stopped on a problem (a ragged row, a quote left open): if the
   * file is now shorter than when it was opened, that problem is most likely the
   * cut itself, and saying so is what the user can act on. Null otherwise.
   */
  async shrinkError(): Promise<CliError | null> {
    try {
      const now = (await stat(this.path)).size;
      if (now >= this.sizeAtOpen) return null;
      const n = (x: number) => x.toLocaleString("en-US");
      return new CliError(`${this.path}: the file shrank while it was read (it holds ${n(now)} of the ${n(this.sizeAtOpen)} bytes it held when opened); another program changed it meanwhile: run again once it is complete`);
    } catch {
      return null;
    }
  }

  /**
   * The end came after `read` bytes: fewer than the file held when it was opened
   * means another program cut it meanwhile (an export being rewritten), and the
   * rows read would be silently fewer. A file that grows is read to its end.
   */
  private checkWhole(read: number): void {
    if (read >= this.sizeAtOpen) return;
    const n = (x: number) => x.toLocaleString("en-US");
    throw new CliError(`${this.path}: the file shrank while it was read (it ended after ${n(read)} of the ${n(this.sizeAtOpen)} bytes it held when opened); another program changed it meanwhile: run again once it is complete`);
  }

  private async closeFile(): Promise<void> {
    const file = this.file;
    this.file = null;
    if (file) await file.close();
  }
}
