/** A Storage for tests: a map, or one whose writes fail as a full browser store does. */
export class MemoryStorage implements Storage {
  private values = new Map<string, string>();
  constructor(
    initial: Record<string, string> = {},
    private readonly failWrites = false,
  ) {
    for (const [k, v] of Object.entries(initial)) this.values.set(k, v);
  }
  get length(): number {
    return this.values.size;
  }
  clear(): void {
    this.values.clear();
  }
  getItem(key: string): string | null {
    return this.values.get(key) ?? null;
  }
  key(index: number): string | null {
    return [...this.values.keys()][index] ?? null;
  }
  removeItem(key: string): void {
    this.values.delete(key);
  }
  setItem(key: string, value: string): void {
    // Browsers throw a QuotaExceededError before changing anything.
    if (this.failWrites) throw new Error("the quota has been exceeded");
    this.values.set(key, value);
  }
}
