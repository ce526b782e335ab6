/**
 * The id table that refuses a result id given twice is held to a JavaScript
 * Map (ECMA-262, "Map Objects", https://tc39.es/ecma262/#sec-map-objects):
 * for any sequence of ids — many of them sharing a hash bucket, some given
 * again — it reports the same first row for every id seen before, and says
 * "not seen" exactly where the Map has no entry.
 */
import fc from "fast-check";
import { expect, test } from "vitest";
import { idTable } from "../../../src/core/cases/idTable.js";

/**
 * Short ids from a few characters (so that ids repeat), longer ones, characters beyond Latin-1, and the code
 * units next to the one the table's bytes mark a wide code unit with (0xff), which must not make two ids alike.
 */
const id = fc.oneof(
  fc.string({ unit: fc.constantFrom("a", "b", "1", " ", "/"), maxLength: 4 }),
  fc.string({ maxLength: 20 }),
  fc.string({ unit: "grapheme", maxLength: 6 }),
  fc.string({ unit: fc.constantFrom("\u00ff", "\u00fe", "\u0100", "\uff00", "\uffff", "\u0000", "a"), maxLength: 5 }),
);

test("says where an id was first seen exactly as a Map would, through every growth of the table", () => {
  fc.assert(
    fc.property(fc.array(id, { maxLength: 3000 }), (ids) => {
      const table = idTable();
      const reference = new Map<string, number>();
      ids.forEach((x, row) => {
        const first = reference.get(x);
        if (first === undefined) reference.set(x, row);
        expect(table.claim(x, row)).toBe(first ?? -1);
      });
      expect(table.size).toBe(reference.size);
    }),
    { numRuns: 200, seed: 20261203 },
  );
});

test("keeps ids whose hashes collide apart: a million distinct ids, each found again at its own row", () => {
  // 1,000,000 ids over 2^32 hash values: by the birthday bound about 116 pairs share a hash, and every one must still be told apart.
  const table = idTable();
  const ids = Array.from({ length: 1_000_000 }, (_, i) => `M${Math.floor(i / 30) + 1} s${Math.floor(i / 6) % 5} c${i % 6}`);
  let seen = 0;
  ids.forEach((x, row) => (seen += table.claim(x, row) === -1 ? 0 : 1));
  expect(seen).toBe(0);
  expect(table.size).toBe(1_000_000);
  for (let row = 0; row < ids.length; row += 997) expect(table.claim(ids[row], -5)).toBe(row);
});
