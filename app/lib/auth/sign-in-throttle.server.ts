// Sign-in throttling (common practice, OWASP Authentication Cheat Sheet): failures are counted per
// (account, client address) pair within a window; from the `freePerPair`-th failure on, the next try
// from that pair must wait 2^(n − freePerPair) s after the last failure, capped at `maxDelaySeconds`.
// The owner at another address is never held up by an attacker's failures, and nobody is locked
// out for good. An address spraying many accounts is slowed the same way on its own count.
//
// Counted before the password is checked, one attempt per address at a time: an attempt takes its
// address's turn (a row lock), reads the failures, and — when free to try — writes itself as a failure
// before the turn ends; a correct password then marks it a success. So guesses sent at once are counted
// as if sent one after another: at most `freePerPair` of them reach the password check (before, the
// wait was read before any failure was written, and 30 guesses at once were all checked).
import { and, count, eq, gt, max, sql } from "drizzle-orm";
import { db, retryOnConflict, withTransaction, type Db } from "@db/client.server";
import { rateLimits, signInAttempts } from "@db/schema";

export const THROTTLE = { windowMinutes: 15, freePerPair: 3, perAddress: 30, maxDelaySeconds: 900 };

/** Seconds to wait after the last failure, given n failures in the window. */
export function throttleDelaySeconds(n: number, free: number): number {
  if (n < free) return 0;
  return Math.min(THROTTLE.maxDelaySeconds, 2 ** (n - free));
}

async function failures(tx: Db, where: ReturnType<typeof and>, now: Date): Promise<{ n: number; last: Date | null }> {
  const since = new Date(now.getTime() - THROTTLE.windowMinutes * 60_000);
  const [row] = await tx
    .select({ n: count(), last: max(signInAttempts.createdAt) })
    .from(signInAttempts)
    .where(and(where, eq(signInAttempts.success, false), gt(signInAttempts.createdAt, since)));
  return { n: Number(row?.n ?? 0), last: row?.last ? new Date(row.last) : null };
}

/** Seconds the (account, address) pair, or the address alone, must still wait; 0 when free to try. */
async function signInWait(tx: Db, email: string, ip: string, now: Date): Promise<number> {
  const pair = await failures(tx, and(eq(signInAttempts.emailKey, email), eq(signInAttempts.ipAddress, ip)), now);
  const byAddress = ip ? await failures(tx, eq(signInAttempts.ipAddress, ip), now) : { n: 0, last: null };
  const wait = (f: { n: number; last: Date | null }, free: number) =>
    f.last ? Math.max(0, Math.ceil((f.last.getTime() + throttleDelaySeconds(f.n, free) * 1000 - now.getTime()) / 1000)) : 0;
  return Math.max(wait(pair, THROTTLE.freePerPair), wait(byAddress, THROTTLE.perAddress));
}

/**
 * The address's turn: a row of `rate_limits` (bucket `signin-turn:<address>`, window start 1970-01-01: a lock,
 * not a count), written first in the transaction so that its row lock holds every other attempt from the
 * address until this one has counted and recorded itself. Pruned with old windows; written again when needed.
 */
async function takeTurn(tx: Db, ip: string): Promise<void> {
  await tx
    .insert(rateLimits)
    .values({ bucket: `signin-turn:${ip}`.slice(0, 120), windowStart: new Date(0), hits: 1 })
    .onDuplicateKeyUpdate({ set: { hits: sql`${rateLimits.hits} + 1` } });
}

/**
 * One sign-in attempt, counted before its password is checked: `{ attempt }` (the id of its row, recorded as a
 * failure until `attemptSucceeded`) when the pair and the address may try now, else `{ retryAfter }` in seconds
 * (nothing recorded: a throttled attempt does not lengthen the wait).
 */
export async function admitAttempt(email: string, ip: string): Promise<{ attempt: number } | { retryAfter: number }> {
  // A conflict (a deadlock, or a Galera certification failure) rolls all of it back: safe to run again.
  return retryOnConflict(() =>
    withTransaction(async (tx) => {
      await takeTurn(tx, ip);
      // Read after the turn is taken: the transaction's snapshot starts here and sees every attempt recorded before.
      const now = new Date();
      const retryAfter = await signInWait(tx, email, ip, now);
      if (retryAfter > 0) return { retryAfter };
      const [{ id }] = await tx.insert(signInAttempts).values({ emailKey: email, ipAddress: ip, success: false }).$returningId();
      return { attempt: id };
    }),
  );
}

/** The attempt's password was right: it no longer counts as a failure. */
export async function attemptSucceeded(attempt: number): Promise<void> {
  await db().update(signInAttempts).set({ success: true }).where(eq(signInAttempts.id, attempt));
}
