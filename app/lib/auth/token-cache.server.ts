// Verified API tokens, remembered for a few seconds per process, so a client calling the calculators
// many times a second costs one token lookup per TOKEN_CACHE_MS instead of one per request.
// What it means for revocation: in THIS process a revoked token, a reset password or a changed role
// takes effect at once (the cache is cleared); in another app process behind the same database it
// takes effect within TOKEN_CACHE_MS. Only successful lookups are kept: an unknown token is looked up
// every time (and answered 401).
// A lookup in flight when the cache is cleared (it read the token before a revocation and would cache it
// after) is not remembered: forgetTokens() moves the cache to a new generation, and rememberToken keeps
// an answer only when the generation read before its lookup (tokenGeneration()) is still the current one.
import type { ApiCaller } from "./guards.server";

/** How long a verified token is trusted without asking the database again, ms. */
export const TOKEN_CACHE_MS = 5_000;
const MAX_ENTRIES = 10_000;

type Entry = { caller: ApiCaller; tokenId: number; lastUsedAt: number | null; until: number };
const entries = new Map<string, Entry>();
/** Moved on by every forgetTokens(): answers looked up before then are not kept. */
let generation = 0;

/** The cache's generation now: read it before looking a token up, and hand it to rememberToken. */
export function tokenGeneration(): number {
  return generation;
}

export function cachedToken(tokenHash: string, now = Date.now()): Entry | null {
  const e = entries.get(tokenHash);
  if (!e) return null;
  if (e.until <= now) {
    entries.delete(tokenHash);
    return null;
  }
  return e;
}

/** Keeps a verified token's answer, unless the cache was cleared since `since` (tokenGeneration() before the lookup). */
export function rememberToken(tokenHash: string, entry: Omit<Entry, "until">, since: number, now = Date.now()): boolean {
  if (since !== generation) return false;
  if (entries.size >= MAX_ENTRIES) entries.clear(); // crude but bounded; refills within one window
  entries.set(tokenHash, { ...entry, until: now + TOKEN_CACHE_MS });
  return true;
}

/** After a revocation, a password reset, or a role or membership change: trust nothing remembered. */
export function forgetTokens(): void {
  generation++;
  entries.clear();
}
