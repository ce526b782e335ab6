/**
 * CSV records found in the bytes of a file, without making a string per field:
 * a record is a list of field ranges in a buffer, and a value field can be read
 * as a number straight from its bytes (decimalAt). An analysis export of a
 * million rows is mostly numbers; making each a string first costs more than
 * everything else the command line does with it.
 *
 * It reads CSV as the general reader (csv-parse, configured in csvRecords.ts)
 * does: a UTF-8 byte order mark skipped; the record delimiter taken from the
 * first line break outside quotes (CRLF, LF or CR) and any other CR or LF kept
 * as field content; fields in double quotes with "" for a quote; an empty line
 * a record of one empty field. What csv-parse would refuse — a quote inside an
 * unquoted field, anything but a delimiter or line break after a closing
 * quote, a quote left open — the scanner does not judge: it says "malformed"
 * and the caller lets csv-parse read the file from there, so the error is
 * csv-parse's own, word for word. Tests hold the two readers to each other on
 * random and hostile files.
 */

export const QUOTE = 0x22;
const CR = 0x0d;
const LF = 0x0a;

/** Field content as it appears: plain bytes, quoted (the quotes excluded), or quoted with "" escapes inside. */
export const PLAIN = 0;
export const QUOTED = 1;
export const ESCAPED = 2;

export type ScanResult = "record" | "more" | "end" | "malformed";

export class CsvScanner {
  /** The bytes being scanned; `pos` … `end` is what is left of them. */
  buf: Uint8Array = new Uint8Array(0);
  pos = 0;
  end = 0;
  /** No more bytes will come after `end`. */
  last = false;

  /** The record found by the last `next()`: field k is buf[fieldStart[k] … fieldEnd[k]). */
  fieldCount = 0;
  fieldStart = new Int32Array(64);
  fieldEnd = new Int32Array(64);
  fieldKind = new Uint8Array(64);
  /**
   * Field k's number where it is a plain decimal that one multiplication or
   * division of exact doubles reads (what decimalAt reads without Number()),
   * read while the field is found; NaN otherwise (quoted, text, blank, or a
   * number that needs decimalAt). An export's values are read in one pass.
   */
  fieldValue = new Float64Array(64);
  /** Line feeds inside the record's fields (the file lines it spans beyond its first). */
  innerLineFeeds = 0;

  /** The record delimiter once found: "\r\n", "\n" or "\r" as byte values, or empty before the first line break. */
  private delimiterBytes: number[] = [];
  private readonly special = new Uint8Array(256);
  /** Numbers are read on the way unless the delimiter could be part of one ("1e5" with "e" as delimiter). */
  private readonly readsNumbers: boolean;

  constructor(readonly delimiter: number) {
    this.readsNumbers = !NUMBER_BYTES.includes(delimiter);
    this.special[delimiter] = 1;
    this.special[QUOTE] = 1;
    this.special[CR] = 1;
    this.special[LF] = 1;
  }

  /** New bytes to scan (what was left unscanned of the previous buffer must be at its start). */
  feed(buf: Uint8Array, end: number, last: boolean): void {
    this.buf = buf;
    this.pos = 0;
    this.end = end;
    this.last = last;
  }

  /** The record delimiter found so far, for handing over to csv-parse. */
  get recordDelimiter(): string | null {
    return this.delimiterBytes.length === 0 ? null : String.fromCharCode(...this.delimiterBytes);
  }

  /**
   * Scan one record from `pos`. "more": the bytes end inside the record (nothing
   * is consumed; feed more and call again); "end": no record is left;
   * "malformed": csv-parse would refuse what follows `pos`.
   */
  next(): ScanResult {
    const { buf, end, special } = this;
    let p = this.pos;
    if (p >= end) return this.last ? "end" : "more";
    let fields = 0;
    let lineFeeds = 0;
    for (;;) {
      if (fields === this.fieldStart.length) this.grow();
      if (p < end && buf[p] === QUOTE) {
        // Quoted: up to the quote that is not doubled, which must be followed by a delimiter, a line break or the end.
        let q = p + 1;
        let kind = QUOTED;
        for (;;) {
          const close = buf.indexOf(QUOTE, q);
          if (close < 0 || close >= end) {
            if (!this.last) return "more";
            return "malformed";
          }
          for (let k = q; k < close; k++) if (buf[k] === LF) lineFeeds++;
          if (close + 1 === end && !this.last) return "more";
          if (close + 1 < end && buf[close + 1] === QUOTE) {
            kind = ESCAPED;
            q = close + 2;
            continue;
          }
          this.fieldStart[fields] = p + 1;
          this.fieldEnd[fields] = close;
          this.fieldKind[fields] = kind;
          this.fieldValue[fields] = NaN;
          fields++;
          p = close + 1;
          break;
        }
        if (p === end) return this.finish(fields, lineFeeds, p);
        const b = buf[p];
        if (b === this.delimiter) {
          p++;
          continue;
        }
        const length = this.lineBreakAt(p);
        if (length < 0) return "more";
        if (length > 0) return this.finish(fields, lineFeeds, p + length);
        return "malformed";
      }
      // Plain: up to a delimiter or the record delimiter; a lone CR or LF that is not the record delimiter is content.
      const start = p;
      let value = NaN;
      let numberEnd = -1;
      if (this.readsNumbers) {
        // Sign, digits, point, digits, exponent: none of them a special byte, so the field goes on from where the number stops.
        let c = p < end ? buf[p] : 0;
        const negative = c === 0x2d;
        if (negative || c === 0x2b) c = ++p < end ? buf[p] : 0;
        let mantissa = 0;
        let digits = 0;
        let fraction = 0;
        while (c >= 0x30 && c <= 0x39) {
          mantissa = mantissa * 10 + (c - 0x30);
          digits++;
          c = ++p < end ? buf[p] : 0;
        }
        if (c === 0x2e) {
          c = ++p < end ? buf[p] : 0;
          while (c >= 0x30 && c <= 0x39) {
            mantissa = mantissa * 10 + (c - 0x30);
            digits++;
            fraction++;
            c = ++p < end ? buf[p] : 0;
          }
        }
        let exponent = 0;
        let exponentDigits = 1;
        if (c === 0x65 || c === 0x45) {
          c = ++p < end ? buf[p] : 0;
          let negativeExponent = false;
          if (c === 0x2d || c === 0x2b) {
            negativeExponent = c === 0x2d;
            c = ++p < end ? buf[p] : 0;
          }
          exponentDigits = 0;
          while (c >= 0x30 && c <= 0x39) {
            if (exponent < 1e6) exponent = exponent * 10 + (c - 0x30);
            exponentDigits++;
            c = ++p < end ? buf[p] : 0;
          }
          if (negativeExponent) exponent = -exponent;
        }
        const scale = exponent - fraction;
        if (digits > 0 && exponentDigits > 0 && mantissa < TWO_53 && scale >= -22 && scale <= 22) {
          const v = scale >= 0 ? mantissa * POW10[scale] : mantissa / POW10[-scale];
          value = negative ? -v : v;
          numberEnd = p;
        }
      }
      for (;;) {
        while (p < end && special[buf[p]] === 0) p++;
        if (p === end) {
          if (!this.last) return "more";
          this.fieldStart[fields] = start;
          this.fieldEnd[fields] = p;
          this.fieldKind[fields] = PLAIN;
          this.fieldValue[fields] = p === numberEnd ? value : NaN;
          fields++;
          return this.finish(fields, lineFeeds, p);
        }
        const b = buf[p];
        if (b === this.delimiter) {
          this.fieldStart[fields] = start;
          this.fieldEnd[fields] = p;
          this.fieldKind[fields] = PLAIN;
          this.fieldValue[fields] = p === numberEnd ? value : NaN;
          fields++;
          p++;
          break;
        }
        if (b === QUOTE) return "malformed";
        const length = this.lineBreakAt(p);
        if (length < 0) return "more";
        if (length > 0) {
          this.fieldStart[fields] = start;
          this.fieldEnd[fields] = p;
          this.fieldKind[fields] = PLAIN;
          this.fieldValue[fields] = p === numberEnd ? value : NaN;
          fields++;
          return this.finish(fields, lineFeeds, p + length);
        }
        if (b === LF) lineFeeds++;
        p++;
      }
    }
  }

  /** The record ends at `next`; an empty last line of the file is no record. */
  private finish(fields: number, lineFeeds: number, next: number): ScanResult {
    this.fieldCount = fields;
    this.innerLineFeeds = lineFeeds;
    this.pos = next;
    return "record";
  }

  /**
   * The length of the record delimiter at p (finding it first, if not yet
   * found), 0 where p holds no record delimiter, −1 where the bytes end before
   * that can be told.
   */
  private lineBreakAt(p: number): number {
    const { buf, end } = this;
    const d = this.delimiterBytes;
    if (d.length === 0) {
      const b = buf[p];
      if (b === LF) d.push(LF);
      else if (b === CR) {
        if (p + 1 === end && !this.last) return -1;
        if (p + 1 < end && buf[p + 1] === LF) d.push(CR, LF);
        else d.push(CR);
      } else return 0;
      return d.length;
    }
    if (buf[p] !== d[0]) return 0;
    if (d.length === 1) return 1;
    if (p + 1 === end) return this.last ? 0 : -1;
    return buf[p + 1] === d[1] ? 2 : 0;
  }

  private grow(): void {
    const n = this.fieldStart.length * 2;
    const start = new Int32Array(n);
    const end = new Int32Array(n);
    const kind = new Uint8Array(n);
    const value = new Float64Array(n);
    start.set(this.fieldStart);
    end.set(this.fieldEnd);
    kind.set(this.fieldKind);
    value.set(this.fieldValue);
    this.fieldStart = start;
    this.fieldEnd = end;
    this.fieldKind = kind;
    this.fieldValue = value;
  }
}

/** Bytes a decimal number is written with: signs, point, exponent marks, digits. */
const NUMBER_BYTES = [0x2b, 0x2d, 0x2e, 0x45, 0x65, 0x30, 0x31, 0x32, 0x33, 0x34, 0x35, 0x36, 0x37, 0x38, 0x39];

/** Exact powers of ten (every one up to 1e22 is a double exactly). */
const POW10 = [1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];
const TWO_53 = 2 ** 53;

/**
 * The number written in buf[start … end) if those bytes are a decimal number
 * exactly as the core's DECIMAL_TEXT reads one (sign, digits, point, exponent;
 * nothing else, no spaces), else NaN: the caller then reads the field as text.
 * The value is exactly Number(text): with less than 2^53 as the digits' integer
 * and a power of ten up to 22, one multiplication or division of two exact
 * doubles rounds correctly (Clinger's fast path); any other number is left to
 * Number() itself.
 */
export function decimalAt(buf: Uint8Array, start: number, end: number): number {
  let p = start;
  if (p === end) return NaN;
  let negative = false;
  let b = buf[p];
  if (b === 0x2b || b === 0x2d) {
    negative = b === 0x2d;
    p++;
  }
  let mantissa = 0;
  let digits = 0;
  let fraction = 0;
  while (p < end && (b = buf[p] - 0x30) >= 0 && b <= 9) {
    mantissa = mantissa * 10 + b;
    digits++;
    p++;
  }
  if (p < end && buf[p] === 0x2e) {
    p++;
    while (p < end && (b = buf[p] - 0x30) >= 0 && b <= 9) {
      mantissa = mantissa * 10 + b;
      digits++;
      fraction++;
      p++;
    }
  }
  if (digits === 0) return NaN;
  let exponent = 0;
  if (p < end && (buf[p] === 0x65 || buf[p] === 0x45)) {
    p++;
    let negativeExponent = false;
    if (p < end && (buf[p] === 0x2b || buf[p] === 0x2d)) {
      negativeExponent = buf[p] === 0x2d;
      p++;
    }
    const first = p;
    while (p < end && (b = buf[p] - 0x30) >= 0 && b <= 9) {
      if (exponent < 1e6) exponent = exponent * 10 + b;
      p++;
    }
    if (p === first) return NaN;
    if (negativeExponent) exponent = -exponent;
  }
  if (p !== end) return NaN;
  const scale = exponent - fraction;
  if (mantissa >= TWO_53 || scale < -22 || scale > 22) return Number(latin1(buf, start, end));
  const value = scale >= 0 ? mantissa * POW10[scale] : mantissa / POW10[-scale];
  return negative ? -value : value;
}

function latin1(buf: Uint8Array, start: number, end: number): string {
  let s = "";
  for (let k = start; k < end; k++) s += String.fromCharCode(buf[k]);
  return s;
}
