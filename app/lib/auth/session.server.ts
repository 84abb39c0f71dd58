// Sign-in with lucia v3 (sessions in MariaDB through Drizzle) and argon2id password hashes.
import { Lucia, TimeSpan, type Session, type User } from "lucia";
import { DrizzleMySQLAdapter } from "@lucia-auth/adapter-drizzle";
import { hash, verify } from "@node-rs/argon2";
import { and, eq } from "drizzle-orm";
import { affectedRows, db } from "@db/client.server";
import { sessions, users } from "@db/schema";
import { hashSecret } from "./secrets.server";
import { settings } from "../shared/env.server";
import { oncePerRequest } from "../shared/request-scope.server";
import type { PresetId } from "../shared/units";
import { readStoredUnits } from "./stored-units";
import { CLIENT_IP_HEADER, clientIp } from "../shared/client-address";
import { admitAttempt, attemptSucceeded } from "./sign-in-throttle.server";

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

export { THROTTLE, throttleDelaySeconds } from "./sign-in-throttle.server";

export type SignInResult =
  | { ok: true; user: { id: string; emailVerified: boolean } }
  | { ok: false; reason: "invalid" }
  | { ok: false; reason: "throttled"; retryAfter: number };

/**
 * Checks e-mail and password with throttling per (account, address) pair and per address (kept in
 * the database so every app process sees the same counts; sign-in-throttle.server.ts), the attempt
 * counted before the password is checked. The reasons never say whether the e-mail has an account.
 */
export async function checkCredentials(emailRaw: string, password: string, ip: string): Promise<SignInResult> {
  const email = normaliseEmail(emailRaw);
  const turn = await admitAttempt(email, ip);
  if ("retryAfter" in turn) return { ok: false, reason: "throttled", retryAfter: turn.retryAfter };
  const [u] = await db()
    .select({ id: users.id, passwordHash: users.passwordHash, emailVerified: users.emailVerified })
    .from(users)
    .where(eq(users.email, email));
  const good = u ? await verifyPassword(u.passwordHash, password) : (await verifyPassword(await dummy(), password), false);
  if (!good || !u) return { ok: false, reason: "invalid" };
  await attemptSucceeded(turn.attempt);
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
