// Sign-in with lucia v3 (sessions in MariaDB through Drizzle) and argon2id password hashes.
import { Lucia, TimeSpan, type Session, type User } from "lucia";
import { DrizzleMySQLAdapter } from "@lucia-auth/adapter-drizzle";
import { hash, verify } from "@node-rs/argon2";
import { and, count, eq, gt, max } from "drizzle-orm";
import { affectedRows, db } from "@db/client.server";
import { sessions, signInAttempts, users } from "@db/schema";
import { hashSecret } from "./secrets.server";
import { settings } from "../shared/env.server";
import { oncePerRequest } from "../shared/request-scope.server";
import type { PresetId } from "../shared/units";
import { readStoredUnits } from "./stored-units";
import { CLIENT_IP_HEADER, clientIp } from "../shared/client-address";

let luciaInstance: ReturnType<typeof makeLucia> | null = null;

export function cookieSecure(): boolean {
  return settings().cookieSecure;
}

function makeLucia() {
  const adapter = new DrizzleMySQLAdapter(db() as never, sessions, users);
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(30, "d"),
    sessionCookie: {
      name: "dm_session",
      // The cookie lives exactly as long as the server-side session (30 days, renewed with it), never longer.
      expires: true,
      attributes: { secure: cookieSecure(), sameSite: "lax" },
    },
    getUserAttributes: (a) => {
      const stored = readStoredUnits(a.unitSystem, a.units);
      return {
        email: a.email,
        name: a.name,
        emailVerified: Boolean(a.emailVerified),
        /** The preset as read (SI when the stored one is neither SI nor US: `unitProblems` says so). */
        unitSystem: stored.preset,
        /** The display unit of every quantity: the preset with the user's overrides (the preset's alone when they cannot be read). */
        units: stored.units,
        /** What the user picked per quantity (the account page's selects; the rest follows the preset). */
        unitPicks: stored.picks,
        /** Why the stored settings are not used (empty when they are): the account page's notice (stored-units.ts). */
        unitProblems: stored.problems,
        currentWorkspaceId: a.currentWorkspaceId,
      };
    },
    getSessionAttributes: (a) => ({ createdAt: a.createdAt, userAgent: a.userAgent, ipAddress: a.ipAddress }),
  });
}

export function lucia() {
  if (!luciaInstance) luciaInstance = makeLucia();
  return luciaInstance;
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof makeLucia>;
    DatabaseUserAttributes: {
      email: string;
      name: string;
      emailVerified: boolean | number;
      unitSystem: PresetId;
      units: string;
      currentWorkspaceId: number | null;
    };
    DatabaseSessionAttributes: { createdAt: Date; userAgent: string; ipAddress: string };
  }
}

// argon2id with the library's defaults (m = 19 MiB, t = 2, p = 1: the OWASP minimum, from memory).
export const hashPassword = (password: string) => hash(password);
export const verifyPassword = (stored: string, password: string) => verify(stored, password).catch(() => false);

/** A hash of a random password: unknown e-mails still cost one verify, so timing says nothing. */
let dummyHash: Promise<string> | null = null;
const dummy = () => (dummyHash ??= hash("no-such-account-" + Math.random()));

export { CLIENT_IP_HEADER, clientIp };

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

/**
 * Sign-in throttling (common practice, OWASP Authentication Cheat Sheet): failures are counted per
 * (account, client address) pair within a window; from the `freePerPair`-th failure on, the next try
 * from that pair must wait 2^(n − freePerPair) s after the last failure, capped at `maxDelaySeconds`.
 * The owner at another address is never held up by an attacker's failures, and nobody is locked
 * out for good. An address spraying many accounts is slowed the same way on its own count.
 */
export const THROTTLE = { windowMinutes: 15, freePerPair: 3, perAddress: 30, maxDelaySeconds: 900 };

/** Seconds to wait after the last failure, given n failures in the window. */
export function throttleDelaySeconds(n: number, free: number): number {
  if (n < free) return 0;
  return Math.min(THROTTLE.maxDelaySeconds, 2 ** (n - free));
}

async function failures(where: ReturnType<typeof and>): Promise<{ n: number; last: Date | null }> {
  const since = new Date(Date.now() - THROTTLE.windowMinutes * 60_000);
  const [row] = await db()
    .select({ n: count(), last: max(signInAttempts.createdAt) })
    .from(signInAttempts)
    .where(and(where, eq(signInAttempts.success, false), gt(signInAttempts.createdAt, since)));
  return { n: Number(row?.n ?? 0), last: row?.last ? new Date(row.last) : null };
}

/** Seconds the (account, address) pair, or the address alone, must still wait; 0 when free to try. */
export async function signInWait(email: string, ip: string, now = new Date()): Promise<number> {
  const pair = await failures(and(eq(signInAttempts.emailKey, email), eq(signInAttempts.ipAddress, ip)));
  const byAddress = ip ? await failures(eq(signInAttempts.ipAddress, ip)) : { n: 0, last: null };
  const wait = (f: { n: number; last: Date | null }, free: number) =>
    f.last ? Math.max(0, Math.ceil((f.last.getTime() + throttleDelaySeconds(f.n, free) * 1000 - now.getTime()) / 1000)) : 0;
  return Math.max(wait(pair, THROTTLE.freePerPair), wait(byAddress, THROTTLE.perAddress));
}

export type SignInResult =
  | { ok: true; user: { id: string; emailVerified: boolean } }
  | { ok: false; reason: "invalid" }
  | { ok: false; reason: "throttled"; retryAfter: number };

/**
 * Checks e-mail and password with throttling per (account, address) pair and per address (kept in
 * the database so every app process sees the same counts). The reasons never say whether the
 * e-mail has an account.
 */
export async function checkCredentials(emailRaw: string, password: string, ip: string): Promise<SignInResult> {
  const email = normaliseEmail(emailRaw);
  const retryAfter = await signInWait(email, ip);
  if (retryAfter > 0) return { ok: false, reason: "throttled", retryAfter };
  const [u] = await db()
    .select({ id: users.id, passwordHash: users.passwordHash, emailVerified: users.emailVerified })
    .from(users)
    .where(eq(users.email, email));
  const good = u ? await verifyPassword(u.passwordHash, password) : (await verifyPassword(await dummy(), password), false);
  await db().insert(signInAttempts).values({ emailKey: email, ipAddress: ip, success: good });
  if (!good || !u) return { ok: false, reason: "invalid" };
  return { ok: true, user: { id: u.id, emailVerified: Boolean(u.emailVerified) } };
}

/** A new session on every sign-in (no fixation); returns the Set-Cookie value. */
export async function startSession(userId: string, request: Request): Promise<string> {
  const session = await lucia().createSession(userId, {
    createdAt: new Date(),
    userAgent: (request.headers.get("user-agent") ?? "").slice(0, 300),
    ipAddress: clientIp(request),
  });
  return lucia().createSessionCookie(session.id).serialize();
}

export type Auth = { user: User; session: Session; refreshCookie?: string };

const cache = new WeakMap<Request, Promise<Auth | null>>();

/**
 * The signed-in user of this request, or null. Memoised per request: across the root middleware and
 * every loader of one page through the request scope (they get Request objects of their own), and on
 * the Request itself where no scope is open (loaders called directly, as the tests do).
 */
export function getAuth(request: Request): Promise<Auth | null> {
  let p = cache.get(request);
  if (!p) {
    const sessionId = sessionIdOf(request.headers.get("cookie") ?? "");
    p = sessionId ? oncePerRequest(`auth:${sessionId}`, () => validate(sessionId)) : Promise.resolve(null);
    cache.set(request, p);
  }
  return p;
}

/** The session id in the request's cookie (not yet checked: `getAuth` checks it). */
export function sessionIdOfRequest(request: Request): string | null {
  return sessionIdOf(request.headers.get("cookie") ?? "");
}

/**
 * The session id in a Cookie header. lucia's reader decodes every cookie and throws on a bad %-escape in
 * any of them (a forged one, or another app's on this host): then only our cookie is read, as ids are written.
 */
function sessionIdOf(header: string): string | null {
  try {
    return lucia().readSessionCookie(header);
  } catch {
    return new RegExp(`(?:^|;)\\s*${lucia().sessionCookieName}=([A-Za-z0-9]+)\\s*(?:;|$)`).exec(header)?.[1] ?? null;
  }
}

async function validate(sessionId: string): Promise<Auth | null> {
  const { session, user } = await lucia().validateSession(sessionId);
  if (!session || !user) return null;
  return { session, user, refreshCookie: session.fresh ? lucia().createSessionCookie(session.id).serialize() : undefined };
}

export async function endSession(request: Request): Promise<string> {
  const auth = await getAuth(request);
  if (auth) await lucia().invalidateSession(auth.session.id);
  return lucia().createBlankSessionCookie().serialize();
}

/** The id shown for a session on the account page: a hash, never the session id (which is the cookie's value). */
export function deviceId(sessionId: string): string {
  return hashSecret(`device:${sessionId}`).slice(0, 32);
}

/** Signs out the user's session whose device id is `device`. */
export async function revokeDevice(userId: string, device: string): Promise<boolean> {
  const s = (await listSessions(userId)).find((x) => deviceId(x.id) === device);
  return s ? revokeSession(userId, s.id) : false;
}

export async function listSessions(userId: string) {
  const rows = await db().select().from(sessions).where(eq(sessions.userId, userId));
  return rows.filter((s) => s.expiresAt > new Date()).sort((a, b) => +b.createdAt - +a.createdAt);
}

export async function revokeSession(userId: string, sessionId: string): Promise<boolean> {
  const r = await db()
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), eq(sessions.id, sessionId)));
  return affectedRows(r) > 0;
}
