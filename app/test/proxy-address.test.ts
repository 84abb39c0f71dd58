// The client address behind a proxy, through the built server (app/serve.mjs on the build, as npm start runs it):
// TRUST_PROXY says how many proxies (hops) are ours, or which addresses are. A proxy appends the address it saw
// to X-Forwarded-For after whatever the client sent, so only the entries our proxies wrote can be believed: the
// right-most ones. With `trust proxy` = true (TRUST_PROXY=1 before) Express took the left-most entry, which the
// client writes itself. The address feeds the sign-in throttle, the /forgot and calculator limits and the
// devices list: here it is read back from the sign-in attempt and the session a sign-in records.
// Check values: X-Forwarded-For is appended to by each proxy (common practice; Express's "trust proxy" docs, from memory).
import { existsSync } from "node:fs";
import path from "node:path";
import { afterAll, describe, expect, test } from "vitest";
import { and, desc, eq, ne } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { sessions, signInAttempts } from "@db/schema";
import { makeMember, ROOT, startBuiltApp } from "./harness";

const built = existsSync(path.join(ROOT, "build/server/index.js"));

afterAll(() => closeDb());

/** A member signs in through the server with `forwardedFor` as X-Forwarded-For: the address their attempt and session recorded. */
async function addressSeen(base: string, forwardedFor?: string) {
  const m = await makeMember("engineer");
  const r = await fetch(`${base}/signin`, {
    method: "POST",
    redirect: "manual",
    headers: { origin: base, "content-type": "application/x-www-form-urlencoded", ...(forwardedFor ? { "x-forwarded-for": forwardedFor } : {}) },
    body: new URLSearchParams({ email: m.email, password: "correct horse battery" }), // makeMember's password (harness.ts)
  });
  expect(r.status).toBe(302);
  const [attempt] = await db().select().from(signInAttempts).where(eq(signInAttempts.emailKey, m.email)).orderBy(desc(signInAttempts.id)).limit(1);
  // The session this sign-in started (makeMember's own, made without a client address, left out).
  const [session] = await db().select().from(sessions).where(and(eq(sessions.userId, m.userId), ne(sessions.id, m.cookie.split("=")[1])));
  return { attempt: attempt?.ipAddress, session: session?.ipAddress };
}

describe.skipIf(!built)("the client address behind a proxy (TRUST_PROXY)", () => {
  test("TRUST_PROXY=1 (one proxy hop): the address our proxy appended, not the one the client wrote first", async () => {
    const app = await startBuiltApp({ TRUST_PROXY: "1" });
    try {
      // The client sent "X-Forwarded-For: 6.6.6.6"; our proxy, reached from 10.0.0.5, appended that address.
      expect(await addressSeen(app.base, "6.6.6.6, 10.0.0.5")).toEqual({ attempt: "10.0.0.5", session: "10.0.0.5" });
      // Through the proxy with nothing forged: the proxy's one entry.
      expect(await addressSeen(app.base, "10.0.0.7")).toEqual({ attempt: "10.0.0.7", session: "10.0.0.7" });
    } finally {
      app.stop();
    }
  }, 60_000);

  test("TRUST_PROXY as our proxies' addresses: every trusted hop is skipped, the first one from the right that is not ours is the client", async () => {
    const app = await startBuiltApp({ TRUST_PROXY: "loopback, 10.0.0.0/8" });
    try {
      // Loopback (the socket) and 10.0.0.5 are ours: 6.6.6.6 is the client they saw.
      expect(await addressSeen(app.base, "6.6.6.6, 10.0.0.5")).toEqual({ attempt: "6.6.6.6", session: "6.6.6.6" });
      // A forged entry before an address that is not ours stays unread: 203.0.113.9 reached our proxy.
      expect(await addressSeen(app.base, "6.6.6.6, 203.0.113.9, 10.0.0.5")).toEqual({ attempt: "203.0.113.9", session: "203.0.113.9" });
    } finally {
      app.stop();
    }
  }, 60_000);

  test("no TRUST_PROXY: the socket's address whatever X-Forwarded-For says", async () => {
    const app = await startBuiltApp({ TRUST_PROXY: "" });
    try {
      const seen = await addressSeen(app.base, "6.6.6.6, 10.0.0.5");
      expect(seen.attempt).toMatch(/^(::ffff:)?127\.0\.0\.1$/);
      expect(seen.session).toBe(seen.attempt);
    } finally {
      app.stop();
    }
  }, 60_000);
});
