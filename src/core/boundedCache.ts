/**
 * A small map that forgets its least recently used entry beyond a fixed size:
 * what the formulas keep between calls (plans, rulesets typed in cells) must
 * not grow with every distinct argument a workbook has ever passed.
 */
export class BoundedCache<V> {
  private readonly entries = new Map<string, V>();

  constructor(readonly limit: number) {
    if (!(limit >= 1)) throw new Error(`a bounded cache holds at least one entry, not ${limit}`);
  }

  get size(): number {
    return this.entries.size;
  }

  /** The value for key, made by `make` on a miss; a hit becomes the most recently used. */
  getOrMake(key: string, make: () => V): V {
    const found = this.entries.get(key);
    if (found !== undefined || this.entries.has(key)) {
      this.entries.delete(key);
      this.entries.set(key, found as V);
      return found as V;
    }
    const value = make();
    this.entries.set(key, value);
    // Maps keep insertion order: the first key is the least recently used.
    while (this.entries.size > this.limit) this.entries.delete(this.entries.keys().next().value as string);
    return value;
  }

  clear(): void {
    this.entries.clear();
  }
}
