// A small least-recently-used map of promises, bounded by a total weight (e.g. curve sets held) and a
// number of entries; the entry just used is never dropped, so one value heavier than the bound still
// works (alone). A promise that fails is forgotten, so the next caller tries again.

export class WeightedLru<V> {
  private entries = new Map<string, { value: Promise<V>; weight: number }>();
  private total = 0;

  constructor(
    private readonly maxWeight: number,
    private readonly maxEntries: number,
    private readonly weightOf: (v: V) => number,
  ) {}

  /** The kept value for `key`, or the one `make` gives (kept from now on). */
  get(key: string, make: () => Promise<V>): Promise<V> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit.value;
    }
    const entry = { value: make(), weight: 0 };
    this.entries.set(key, entry);
    entry.value.then(
      (v) => {
        if (this.entries.get(key) !== entry) return;
        entry.weight = this.weightOf(v);
        this.total += entry.weight;
        this.trim(key);
      },
      () => this.drop(key, entry),
    );
    this.trim(key);
    return entry.value;
  }

  keys(): string[] {
    return [...this.entries.keys()];
  }

  get size(): number {
    return this.entries.size;
  }

  clear(): void {
    this.entries.clear();
    this.total = 0;
  }

  private drop(key: string, entry: { weight: number }) {
    if (this.entries.get(key) !== entry) return;
    this.entries.delete(key);
    this.total -= entry.weight;
  }

  /** Drops least recently used entries (never `keep`) while over either bound. */
  private trim(keep: string) {
    for (const [k, e] of this.entries) {
      if (this.total <= this.maxWeight && this.entries.size <= this.maxEntries) return;
      if (k !== keep) this.drop(k, e);
    }
  }
}
