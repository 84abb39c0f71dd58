// Least-recently-used caches of loaded values, over lru-cache's `fetch()` (the loader goes in as its
// context): concurrent gets of one key share one load, a load that fails is not kept (its callers see
// the error, the next get loads again), and the least recently used entry goes first past `max` entries
// or, with `sizeOf`, past `maxSize` in all. A value whose size alone is over `maxSize` is still given to
// its callers but not kept (each later get loads it again). A load still pending when its entry is pushed
// out (more loads at once than `max`) or cleared also still answers its callers, and is not kept.
import { LRUCache } from "lru-cache";

export type PromiseCache<K, V> = {
  /** The kept value for `key`, or the one `load` gives (kept from now on, within the bounds). */
  get(key: K, load: () => Promise<V>): Promise<V>;
  /** Keys of loaded entries, most recently used first. */
  keys(): K[];
  /** Entries, loads in flight included. */
  readonly size: number;
  clear(): void;
};

export function promiseCache<K extends NonNullable<unknown>, V extends NonNullable<unknown>>(opts: { max: number; maxSize?: number; sizeOf?: (v: V) => number }): PromiseCache<K, V> {
  const { max, maxSize, sizeOf } = opts;
  const cache = new LRUCache<K, V, () => Promise<V>>({
    max,
    // lru-cache takes whole sizes of 1 and up (else the set throws and the failed load would stay kept): an empty value weighs 1.
    ...(maxSize ? { maxSize, sizeCalculation: (v: V) => Math.max(1, Math.ceil(sizeOf ? sizeOf(v) : 1)) || 1 } : {}),
    ignoreFetchAbort: true,
    fetchMethod: (_key, _stale, { context }) => context(),
  });
  return {
    // undefined only if a load resolved to undefined, which V (not nullable) rules out
    get: (key, load) => cache.fetch(key, { context: load }) as Promise<V>,
    keys: () => [...cache.keys()],
    get size() {
      return cache.size;
    },
    clear: () => cache.clear(),
  };
}
