// promiseCache (promise-cache.ts) over lru-cache: one load per key at a time, failed loads not kept,
// least recently used out first past the entry count or the total size. Check values are counted by
// hand from the calls made here (common practice: the behaviours lru-cache documents for fetch()).
import { describe, expect, test } from "vitest";
import { promiseCache } from "./promise-cache";

/** A loader that counts its calls and gives `value` (or fails with `fail`). */
function loader<V>(value: V, fail?: string) {
  const l = {
    calls: 0,
    load: async () => {
      l.calls++;
      await Promise.resolve();
      if (fail) throw new Error(fail);
      return value;
    },
  };
  return l;
}

describe("promiseCache", () => {
  test("a failed load reaches its callers and is not kept: the next get loads again", async () => {
    const c = promiseCache<string, number[]>({ max: 4 });
    const bad = loader([1], "database down");
    await expect(c.get("a", bad.load)).rejects.toThrow("database down");
    expect(c.size).toBe(0);
    const good = loader([2]);
    expect(await c.get("a", good.load)).toEqual([2]);
    expect(await c.get("a", bad.load)).toEqual([2]); // kept now: the failing loader is not called
    expect([bad.calls, good.calls]).toEqual([1, 1]);
  });

  test("concurrent gets of one key share one load; a later get loads nothing", async () => {
    const c = promiseCache<number, { n: number }>({ max: 4 });
    const l = loader({ n: 7 });
    const all = await Promise.all([c.get(1, l.load), c.get(1, l.load), c.get(1, l.load)]);
    expect(all).toEqual([{ n: 7 }, { n: 7 }, { n: 7 }]);
    expect(all[1]).toBe(all[0]);
    expect(await c.get(1, l.load)).toBe(all[0]);
    expect(l.calls).toBe(1);
  });

  test("past `max` entries the least recently used goes first (a get counts as a use)", async () => {
    const c = promiseCache<string, string[]>({ max: 2 });
    await c.get("a", loader(["a"]).load);
    await c.get("b", loader(["b"]).load);
    await c.get("a", loader(["a again"]).load); // a used: b is now the least recent
    await c.get("c", loader(["c"]).load);
    expect(c.keys().sort()).toEqual(["a", "c"]);
    const b = loader(["b2"]);
    expect(await c.get("b", b.load)).toEqual(["b2"]);
    expect(b.calls).toBe(1);
    expect(c.keys().sort()).toEqual(["b", "c"]); // a was the least recent then
  });

  test("past `maxSize` in all the least recently used goes first; one value over maxSize is returned but not kept", async () => {
    const c = promiseCache<string, number[]>({ max: 10, maxSize: 10, sizeOf: (v) => v.length });
    await c.get("a", loader([1, 2, 3, 4]).load);
    await c.get("b", loader([1, 2, 3, 4]).load);
    await c.get("c", loader([1, 2, 3, 4]).load); // 12 > 10: a out
    expect(c.keys().sort()).toEqual(["b", "c"]);
    const big = loader(Array.from({ length: 11 }, (_, i) => i));
    expect((await c.get("big", big.load)).length).toBe(11);
    expect(c.keys().sort()).toEqual(["b", "c"]); // not kept, and nothing pushed out for it
    expect((await c.get("big", big.load)).length).toBe(11);
    expect(big.calls).toBe(2);
  });

  test("an empty value (size 0) is kept too", async () => {
    const c = promiseCache<string, number[]>({ max: 4, maxSize: 10, sizeOf: (v) => v.length });
    const empty = loader<number[]>([]);
    expect(await c.get("none", empty.load)).toEqual([]);
    expect(await c.get("none", empty.load)).toEqual([]);
    expect(empty.calls).toBe(1);
    expect(c.keys()).toEqual(["none"]);
  });

  test("a load pushed out while pending (more loads at once than `max`) still answers its callers, and is not kept", async () => {
    const c = promiseCache<string, string[]>({ max: 2 });
    const got = await Promise.all(["a", "b", "c"].map((k) => c.get(k, loader([k]).load)));
    expect(got).toEqual([["a"], ["b"], ["c"]]);
    expect(c.keys().sort()).toEqual(["b", "c"]);
  });

  test("clear forgets every entry", async () => {
    const c = promiseCache<string, string[]>({ max: 2 });
    const l = loader(["x"]);
    await c.get("x", l.load);
    c.clear();
    expect(c.size).toBe(0);
    await c.get("x", l.load);
    expect(l.calls).toBe(2);
  });
});
