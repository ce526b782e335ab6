/**
 * The ids of result rows seen so far, each with the row it was first seen on:
 * what refuses an id given twice in a streamed file of a million rows.
 *
 * An open-addressing table of 32-bit hashes (FNV-1a over the id's UTF-16 code
 * units) in typed arrays, the ids themselves kept once as bytes: a hash that
 * matches is confirmed by comparing the id with its bytes, so two different
 * ids are never taken for one. A JavaScript Map of a million strings does the
 * same about three times slower here (its buckets are objects the garbage
 * collector walks and grows by copying); a list of the strings would hold a
 * million objects the collector marks again and again, in twice the memory.
 *
 * The bytes of an id: each UTF-16 code unit below 0xff as one byte, any other
 * as 0xff and its two bytes — one byte a character for the ids of an export,
 * and two ids have the same bytes only if they are the same id.
 */
export interface IdTable {
  /** The row the id was first seen on, or −1 where it was not seen (it is then kept, with `row`). */
  claim(id: string, row: number): number;
  readonly size: number;
}

const EMPTY = -1;
const WIDE = 0xff;

export function idTable(): IdTable {
  let mask = (1 << 10) - 1;
  // slots[p]: index of the id kept there, or EMPTY. At most half full, so a probe ends soon.
  let slots = new Int32Array(mask + 1).fill(EMPTY);
  let hashes = new Int32Array(512);
  let rows = new Float64Array(512);
  // Id k is bytes[starts[k] … starts[k + 1]).
  let starts = new Int32Array(513);
  let bytes = new Uint8Array(1 << 13);
  let size = 0;

  function grow(): void {
    const wider = new Int32Array(hashes.length * 2);
    wider.set(hashes);
    hashes = wider;
    const longer = new Float64Array(rows.length * 2);
    longer.set(rows);
    rows = longer;
    const moreStarts = new Int32Array(hashes.length + 1);
    moreStarts.set(starts);
    starts = moreStarts;
    mask = mask * 2 + 1;
    slots = new Int32Array(mask + 1).fill(EMPTY);
    for (let k = 0; k < size; k++) {
      let p = hashes[k] & mask;
      while (slots[p] !== EMPTY) p = (p + 1) & mask;
      slots[p] = k;
    }
  }

  /** Whether id k's bytes are those of `id`. */
  function same(k: number, id: string): boolean {
    let b = starts[k];
    const end = starts[k + 1];
    for (let i = 0; i < id.length; i++) {
      const c = id.charCodeAt(i);
      if (c < WIDE) {
        if (b >= end || bytes[b] !== c) return false;
        b++;
      } else {
        if (b + 3 > end || bytes[b] !== WIDE || bytes[b + 1] !== c >> 8 || bytes[b + 2] !== (c & 0xff)) return false;
        b += 3;
      }
    }
    return b === end;
  }

  function keep(k: number, id: string): void {
    let b = starts[k];
    if (b + 3 * id.length > bytes.length) {
      const larger = new Uint8Array(Math.max(bytes.length * 2, b + 3 * id.length));
      larger.set(bytes.subarray(0, b));
      bytes = larger;
    }
    for (let i = 0; i < id.length; i++) {
      const c = id.charCodeAt(i);
      if (c < WIDE) bytes[b++] = c;
      else {
        bytes[b] = WIDE;
        bytes[b + 1] = c >> 8;
        bytes[b + 2] = c & 0xff;
        b += 3;
      }
    }
    starts[k + 1] = b;
  }

  return {
    claim(id, row) {
      let h = 0x811c9dc5 | 0;
      for (let i = 0; i < id.length; i++) h = Math.imul(h ^ id.charCodeAt(i), 0x01000193);
      let p = h & mask;
      for (let k = slots[p]; k !== EMPTY; k = slots[p]) {
        if (hashes[k] === h && same(k, id)) return rows[k];
        p = (p + 1) & mask;
      }
      const k = size++;
      keep(k, id);
      hashes[k] = h;
      rows[k] = row;
      slots[p] = k;
      if (size === hashes.length) grow();
      return EMPTY;
    },
    get size() {
      return size;
    },
  };
}
