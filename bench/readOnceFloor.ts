/**
 * The read-once floor: the least any program must do with an export — read
 * every byte once and turn every value into a double — written as tightly as
 * Node allows, on one thread: large synchronous reads, one pass over the
 * bytes, digits accumulated in place. It reads only what the bench's exports
 * hold (an id, then plain decimals). It checks nothing and keeps nothing but the values: the command
 * line is measured against it.
 */
import { closeSync, openSync, readSync } from "node:fs";

export interface FloorResult {
  rows: number;
  /** Sum of every value read, so that the work cannot be skipped. */
  checksum: number;
}

const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10];

export function readOnceFloor(path: string, values?: Float64Array): FloorResult {
  const fd = openSync(path, "r");
  const buf = Buffer.alloc(4 << 20);
  let filled = 0;
  let rows = -1; // the header line is not a row
  let checksum = 0;
  let stored = 0;
  try {
    for (;;) {
      const n = readSync(fd, buf, filled, buf.length - filled, null);
      const end = filled + n;
      // Parse every complete line; keep the incomplete last one for the next read.
      let lineEnd = n === 0 ? end : buf.lastIndexOf(0x0a, end - 1) + 1;
      if (lineEnd <= 0) lineEnd = end;
      let p = 0;
      while (p < lineEnd) {
        // Skip the id (first field); the header line has no numbers worth reading.
        while (p < lineEnd && buf[p] !== 0x2c && buf[p] !== 0x0a) p++;
        if (rows < 0) {
          while (p < lineEnd && buf[p] !== 0x0a) p++;
          p++;
          rows = 0;
          continue;
        }
        while (p < lineEnd && buf[p] === 0x2c) {
          p++;
          let negative = false;
          if (buf[p] === 0x2d) {
            negative = true;
            p++;
          }
          let mantissa = 0;
          let fraction = -1;
          for (;;) {
            const b = buf[p];
            if (b >= 0x30 && b <= 0x39) {
              mantissa = mantissa * 10 + (b - 0x30);
              if (fraction >= 0) fraction++;
            } else if (b === 0x2e) fraction = 0;
            else break;
            p++;
          }
          // One division by an exact power of ten rounds correctly: the same double the command line reads.
          let v = fraction > 0 ? mantissa / POW10[fraction] : mantissa;
          if (negative) v = -v;
          checksum += v;
          if (values) values[stored++] = v;
        }
        p++; // the line feed
        rows++;
      }
      if (n === 0) break;
      buf.copy(buf, 0, lineEnd, end);
      filled = end - lineEnd;
    }
  } finally {
    closeSync(fd);
  }
  return { rows, checksum };
}
