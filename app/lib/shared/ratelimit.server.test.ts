// Fixed-window counter against the real MariaDB (npm test's own database). Check values are
// our own product rule (fixed windows aligned to the epoch, every hit counted) — common practice.
import { afterAll, describe, expect, test } from "vitest";
import { eq, like } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { rateLimits } from "@db/schema";
import { hitRateLimit, pruneRateLimits, windowStartOf } from "./ratelimit.server";

const PREFIX = `rltest:${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
let n = 0;
const bucket = () => `${PREFIX}:${n++}`;
// A fixed instant 12.5 s into a minute: windows and Retry-After are deterministic.
const T0 = new Date(Date.UTC(2026, 11, 1, 10, 30, 12, 500));
const RULE = { limit: 5, windowSeconds: 60 };

afterAll(async () => {
  await db().delete(rateLimits).where(like(rateLimits.bucket, `${PREFIX}%`));
  await closeDb();
});

describe("hitRateLimit", () => {
  test("windows start at multiples of the window length (UTC)", () => {
    expect(windowStartOf(T0, 60).toISOString()).toBe("2026-12-01T10:30:00.000Z"); // definition: floor to the minute
    expect(windowStartOf(T0, 3600).toISOString()).toBe("2026-12-01T10:00:00.000Z"); // definition: floor to the hour
  });

  test("counts 1, 2, 3… in a window, refuses past the limit, and says when the window ends", async () => {
    const b = bucket();
    const seen = [];
    for (let i = 0; i < 7; i++) seen.push(await hitRateLimit(b, RULE, T0));
    expect(seen.map((r) => r.hits)).toEqual([1, 2, 3, 4, 5, 6, 7]); // one increment per hit
    expect(seen.map((r) => r.allowed)).toEqual([true, true, true, true, true, false, false]); // limit 5 (the rule above)
    expect(seen.map((r) => r.remaining)).toEqual([4, 3, 2, 1, 0, 0, 0]);
    expect(seen[6].resetSeconds).toBe(48); // 60 − 12.5 s, rounded up (window end minus now)
    const [row] = await db().select().from(rateLimits).where(eq(rateLimits.bucket, b));
    expect(row.hits).toBe(7); // refused hits count too (our rule)
  });

  test("the next window starts again from one; other buckets are separate", async () => {
    const b = bucket();
    for (let i = 0; i < 6; i++) await hitRateLimit(b, RULE, T0);
    const next = await hitRateLimit(b, RULE, new Date(T0.getTime() + 60_000));
    expect(next.hits).toBe(1); // fixed window: a new window, a new count
    expect(next.allowed).toBe(true);
    expect((await hitRateLimit(bucket(), RULE, T0)).hits).toBe(1);
  });

  test("concurrent hits are counted atomically: each caller sees a distinct count", async () => {
    const b = bucket();
    const results = await Promise.all(Array.from({ length: 40 }, () => hitRateLimit(b, RULE, T0)));
    const counts = results.map((r) => r.hits).sort((a, c) => a - c);
    expect(counts).toEqual(Array.from({ length: 40 }, (_, i) => i + 1)); // INSERT … ON DUPLICATE KEY UPDATE under the row lock
    expect(results.filter((r) => r.allowed)).toHaveLength(5); // exactly the limit gets through
    const [row] = await db().select().from(rateLimits).where(eq(rateLimits.bucket, b));
    expect(row.hits).toBe(40);
  });

  test("pruning removes windows older than the cut-off only", async () => {
    const b = bucket();
    const old = new Date(T0.getTime() - 3 * 3600_000);
    await hitRateLimit(b, RULE, old);
    await hitRateLimit(b, RULE, T0);
    await pruneRateLimits(new Date(T0.getTime() - 3600_000), PREFIX);
    const rows = await db().select().from(rateLimits).where(eq(rateLimits.bucket, b));
    expect(rows).toHaveLength(1);
    expect(rows[0].windowStart.toISOString()).toBe("2026-12-01T10:30:00.000Z");
  });
});
