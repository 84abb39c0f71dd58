// Fixed-window rate limits in the `rate_limits` table, shared by every app process.
// One statement per hit: INSERT … ON DUPLICATE KEY UPDATE hits = LAST_INSERT_ID(hits + 1).
// The row lock taken by the upsert makes the increment atomic, and LAST_INSERT_ID(expr) hands
// the new count back in the same OK packet (insertId), so concurrent callers each see their own
// count (1, 2, 3, …) with no read-after-write race. A new row (first hit of a window) reports
// insertId 0 — the table has no AUTO_INCREMENT column — which means hits = 1.
import { and, like, lt, sql } from "drizzle-orm";
import { affectedRows, db, retryOnConflict } from "@db/client.server";
import { rateLimits } from "@db/schema";

export type RateLimitRule = {
  /** Hits allowed per window (count). */
  limit: number;
  /** Window length, s. Windows start at multiples of this since the Unix epoch (UTC). */
  windowSeconds: number;
};

export type RateLimitResult = {
  allowed: boolean;
  /** Hits in this window including this one (count). */
  hits: number;
  limit: number;
  /** Hits left in this window after this one (count, ≥ 0). */
  remaining: number;
  /** Start of the current window. */
  windowStart: Date;
  /** Whole seconds until the window ends (≥ 1): the Retry-After value when refused. */
  resetSeconds: number;
};

/** Old windows are pruned now and then (on roughly this fraction of new-window inserts). */
const PRUNE_PROBABILITY = 0.02;
/** Rows older than this are pruned, s. */
const PRUNE_AGE_SECONDS = 3600;

/** Start of the fixed window containing `now`. */
export function windowStartOf(now: Date, windowSeconds: number): Date {
  const ms = windowSeconds * 1000;
  return new Date(Math.floor(now.getTime() / ms) * ms);
}

/**
 * Counts one hit against `bucket` and says whether it is within the rule. Every hit counts,
 * refused ones included (a caller hammering past the limit keeps its window full).
 * @param bucket key, ≤ 120 characters, e.g. "calc:203.0.113.7"
 * @param rule limit and window length
 * @param now clock (tests pass a fixed instant)
 */
export async function hitRateLimit(bucket: string, rule: RateLimitRule, now: Date = new Date()): Promise<RateLimitResult> {
  const key = bucket.slice(0, 120);
  const windowStart = windowStartOf(now, rule.windowSeconds);
  // On a Galera cluster two nodes may raise the same row at once: one commit fails certification
  // (errno 1213) and the whole upsert runs again on the new count.
  const [res] = (await retryOnConflict(() =>
    db()
      .insert(rateLimits)
      .values({ bucket: key, windowStart, hits: 1 })
      .onDuplicateKeyUpdate({ set: { hits: sql`LAST_INSERT_ID(${rateLimits.hits} + 1)` } }),
  )) as unknown as [{ affectedRows: number; insertId: number }];
  const inserted = !res?.insertId;
  const hits = inserted ? 1 : Number(res.insertId);
  if (inserted && Math.random() < PRUNE_PROBABILITY) {
    await pruneRateLimits(new Date(now.getTime() - PRUNE_AGE_SECONDS * 1000)).catch(() => {});
  }
  const windowEnd = windowStart.getTime() + rule.windowSeconds * 1000;
  return {
    allowed: hits <= rule.limit,
    hits,
    limit: rule.limit,
    remaining: Math.max(0, rule.limit - hits),
    windowStart,
    resetSeconds: Math.max(1, Math.ceil((windowEnd - now.getTime()) / 1000)),
  };
}

/**
 * Deletes windows that started before `before` (only buckets starting with `bucketPrefix` when
 * given). Returns the number of rows removed.
 */
export async function pruneRateLimits(before: Date, bucketPrefix?: string): Promise<number> {
  const old = lt(rateLimits.windowStart, before);
  const where = bucketPrefix ? and(old, like(rateLimits.bucket, `${bucketPrefix.replace(/[\\%_]/g, "\\$&")}%`)) : old;
  return affectedRows(await db().delete(rateLimits).where(where));
}
