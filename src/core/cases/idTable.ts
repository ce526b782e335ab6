/**
 * The ids of result rows seen so far, each with the row it was first seen on:
 * what refuses an id given twice in a streamed file of a million rows.
 *
 * An open-addressing table of 32-bit hashes (FNV-1a over the id's UTF-16 code
 * units) in typed arrays, the ids themselves kept once in a list: a hash that
 * matches is confirmed by comparing the ids, so two different ids are never
 * taken for one. A JavaScript Map of a million strings does the same about
 * three times slower here (its buckets are objects the garbage collector
 * walks and grows by copying).
 */
export interface IdTable {
  /** The row the id was first seen on, or −1 where it was not seen (it is then kept, with `row`). */
  claim(id: string, row: number): number;
  readonly size: number;
}

const EMPTY = -1;

export function idTable(): IdTable {
  let mask = (1 << 10) - 1;
  // slots[p]: index of the id kept there, or EMPTY. At most half full, so a probe ends soon.
  let slots = new Int32Array(mask + 1).fill(EMPTY);
  let hashes = new Int32Array(512);
  let rows = new Float64Array(512);
  const ids: string[] = [];

  function grow(): void {
    const wider = new Int32Array(hashes.length * 2);
    wider.set(hashes);
    hashes = wider;
    const longer = new Float64Array(rows.length * 2);
    longer.set(rows);
    rows = longer;
    mask = mask * 2 + 1;
    slots = new Int32Array(mask + 1).fill(EMPTY);
    for (let k = 0; k < ids.length; k++) {
      let p = hashes[k] & mask;
      while (slots[p] !== EMPTY) p = (p + 1) & mask;
      slots[p] = k;
    }
  }

  return {
    claim(id, row) {
      let h = 0x811c9dc5 | 0;
      for (let i = 0; i < id.length; i++) h = Math.imul(h ^ id.charCodeAt(i), 0x01000193);
      let p = h & mask;
      for (let k = slots[p]; k !== EMPTY; k = slots[p]) {
        if (hashes[k] === h && ids[k] === id) return rows[k];
        p = (p + 1) & mask;
      }
      const k = ids.length;
      ids.push(id);
      hashes[k] = h;
      rows[k] = row;
      slots[p] = k;
      if (ids.length === hashes.length) grow();
      return EMPTY;
    },
    get size() {
      return ids.length;
    },
  };
}
