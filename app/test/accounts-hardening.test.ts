// Accounts and sessions (issue 14): nobody keeps an account they do not own. Real route modules and
// services against MariaDB; mail is read from the outbox table.
import net from "node:net";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, desc, eq, isNull } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { apiTokens, memberships, outbox, sessions, signInAttempts, users } from "@db/schema";
import { FORGOT_LIMITS, requestPasswordReset, resetPassword } from "~/lib/auth/accounts.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { acceptInvitation, invite } from "~/lib/workspaces";
import { checkCredentials, deviceId, THROTTLE, throttleDelaySeconds } from "~/lib/auth/session.server";
import { flushOutbox } from "~/lib/mail/outbox.server";
import { requireApi } from "~/lib/auth/guards.server";
import * as signupRoute from "~/routes/signup";
import * as forgotRoute from "~/routes/forgot";
import * as accountRoute from "~/routes/account";
import * as workspaceRoute from "~/routes/workspace";
import * as verifyRoute from "~/routes/verify";
import * as resetRoute from "~/routes/reset";
import { BASE, call, makeMember } from "./harness";

afterAll(() => closeDb());

const uniqEmail = (p: string) => `${p}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.test`;
const mailsTo = (email: string) => db().select().from(outbox).where(eq(outbox.toAddress, email)).orderBy(desc(outbox.id));
const linkIn = (text: string, path: string) => new RegExp(`https?://[^\\s"<>]*${path}[^\\s"<>]*`).exec(text)![0];
const tokenOf = (link: string) => new URL(link).searchParams.get("token")!;

describe("an attacker who signs up with someone else's address", () => {
  test("cannot mint an API token or send invitations before the address is confirmed", async () => {
    const victim = uniqEmail("victim");
    // The attacker signs up; the route says the same as for any address and starts no session.
    const r = await call(signupRoute.action as never, { path: "/signup", form: { email: victim, name: "Mallory", password: "attacker password" } });
    expect(r.status).toBe(200);
    expect(r.headers.get("set-cookie")).toBeNull();
    const [u] = await db().select().from(users).where(eq(users.email, victim));
    expect(u.emailVerified).toBe(false);
    const [ms] = await db().select().from(memberships).where(eq(memberships.userId, u.id));
    // Even signed in (a session made by hand), neither the route nor the service hands out a token.
    const { startSession } = await import("~/lib/auth/session.server");
    const cookie = (await startSession(u.id, new Request(BASE))).split(";")[0];
    const t = await call(accountRoute.action as never, { path: "/account", cookie, form: { intent: "create-token", name: "door", scope: "write", pageWorkspaceId: String(ms.workspaceId) } });
    expect(t.status).toBe(403);
    await expect(createApiToken({ userId: u.id, workspaceId: ms.workspaceId, name: "door", scope: "write" })).rejects.toMatchObject({ init: { status: 403 } });
    expect(await db().select().from(apiTokens).where(eq(apiTokens.userId, u.id))).toEqual([]);
    const inv = await call(workspaceRoute.action as never, { path: "/workspace", cookie, form: { intent: "invite", email: uniqEmail("friend"), role: "admin", pageWorkspaceId: String(ms.workspaceId) } });
    expect(inv.status).toBe(403);
    await expect(invite({ workspaceId: ms.workspaceId, workspaceName: "W", inviterId: u.id, inviterName: "M", email: uniqEmail("f"), role: "admin" })).rejects.toMatchObject({ init: { status: 403 } });
  });

  test("a password reset revokes every session and every API token, and the owner is told by mail", async () => {
    const m = await makeMember("admin");
    const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "old", scope: "write" });
    expect((await requireApi(new Request(BASE, { headers: { authorization: `Bearer ${token}` } }), "library.read")).userId).toBe(m.userId);
    await requestPasswordReset(m.email);
    const secret = tokenOf(linkIn((await mailsTo(m.email))[0].textBody, "/reset"));
    expect(await resetPassword(secret, "a brand new password")).toBe(true);
    expect(await db().select().from(sessions).where(eq(sessions.userId, m.userId))).toEqual([]);
    expect(await db().select().from(apiTokens).where(and(eq(apiTokens.userId, m.userId), isNull(apiTokens.revokedAt)))).toEqual([]);
    const refused = await requireApi(new Request(BASE, { headers: { authorization: `Bearer ${token}` } }), "library.read").catch((e) => e as Response);
    expect((refused as Response).status).toBe(401);
    const [notice] = await mailsTo(m.email);
    expect(notice.subject).toBe("Your Dutymark password was changed");
    expect(notice.textBody).toContain("API token was revoked");
  });
});

describe("reset links and /forgot", () => {
  test("only the newest reset link works; using one retires the rest", async () => {
    const m = await makeMember("engineer");
    await requestPasswordReset(m.email);
    const first = tokenOf(linkIn((await mailsTo(m.email))[0].textBody, "/reset"));
    await requestPasswordReset(m.email);
    const second = tokenOf(linkIn((await mailsTo(m.email))[0].textBody, "/reset"));
    expect(second).not.toBe(first);
    expect(await resetPassword(first, "older link password")).toBe(false);
    expect(await resetPassword(second, "newer link password")).toBe(true);
    expect((await checkCredentials(m.email, "newer link password", "10.20.0.1")).ok).toBe(true);
  });

  test(`/forgot: at most ${FORGOT_LIMITS.perAccount} mails per address an hour and ${FORGOT_LIMITS.perAddress} requests per client address; the answer never changes`, async () => {
    const m = await makeMember("viewer");
    const ask = (email: string, ip: string) => call(forgotRoute.action as never, { path: "/forgot", form: { email }, headers: { "x-dutymark-client-ip": ip } });
    for (let i = 0; i < FORGOT_LIMITS.perAccount + 2; i++) expect((await ask(m.email, `10.21.0.${i}`)).body).toEqual({ sent: true });
    expect(await mailsTo(m.email)).toHaveLength(FORGOT_LIMITS.perAccount);
    const ip = `10.22.${Math.floor(Math.random() * 250)}.7`;
    const other = await makeMember("viewer");
    for (let i = 0; i < FORGOT_LIMITS.perAddress; i++) await ask(uniqEmail(`spray${i}`), ip);
    expect((await ask(other.email, ip)).body).toEqual({ sent: true });
    expect(await mailsTo(other.email)).toHaveLength(0); // that address used up its requests
  });
});

describe("same words, and no SMTP on the request path", () => {
  let server: net.Server;
  let connections = 0;
  const prev = process.env.SMTP_URL;
  beforeAll(async () => {
    // A mail server that counts connections and never answers: an inline send would connect here.
    server = net.createServer((s) => {
      connections++;
      s.on("error", () => {});
      setTimeout(() => s.destroy(), 50);
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
    process.env.SMTP_URL = `smtp://127.0.0.1:${(server.address() as net.AddressInfo).port}`;
  });
  afterAll(async () => {
    if (prev === undefined) delete process.env.SMTP_URL;
    else process.env.SMTP_URL = prev;
    await new Promise((r) => server.close(r));
  });

  test("/forgot and /signup answer the same words for a known and an unknown address; mail waits in the outbox", async () => {
    const known = await makeMember("engineer");
    const unknown = uniqEmail("nobody");
    const f1 = await call(forgotRoute.action as never, { path: "/forgot", form: { email: known.email } });
    const f2 = await call(forgotRoute.action as never, { path: "/forgot", form: { email: unknown } });
    expect(f1).toEqual(f2);
    const s1 = await call(signupRoute.action as never, { path: "/signup", form: { email: known.email, name: "Again", password: "long enough pw" } });
    const s2 = await call(signupRoute.action as never, { path: "/signup", form: { email: uniqEmail("fresh"), name: "Fresh", password: "long enough pw" } });
    expect(s1.status).toBe(s2.status);
    expect(s1.body).toEqual(s2.body);
    expect(s1.headers.get("set-cookie")).toBe(s2.headers.get("set-cookie"));
    const rows = await mailsTo(known.email);
    expect(rows.length).toBe(2); // the reset link and the "you already have an account" note
    expect(rows.every((r) => r.attempts === 0 && r.sentAt === null)).toBe(true);
    expect(connections).toBe(0);
    // The flusher is what talks to SMTP (this test's server would be reached — proof the count works).
    await flushOutbox({ only: rows.map((r) => r.id) });
    expect(connections).toBeGreaterThan(0);
  }, 60_000);
});

describe("sign-in throttling", () => {
  test("an attacker's failures from one address never lock the owner out elsewhere, and a reset clears them", async () => {
    const m = await makeMember("engineer");
    const attacker = "10.30.0.1";
    for (let i = 0; i < 8; i++) await checkCredentials(m.email, `guess-${i}`, attacker);
    expect(await checkCredentials(m.email, "correct horse battery", attacker)).toMatchObject({ ok: false, reason: "throttled" });
    expect((await checkCredentials(m.email, "correct horse battery", "10.30.0.2")).ok).toBe(true);
    await requestPasswordReset(m.email);
    await resetPassword(tokenOf(linkIn((await mailsTo(m.email))[0].textBody, "/reset")), "another new password");
    expect((await checkCredentials(m.email, "another new password", attacker)).ok).toBe(true); // same address, after the reset
  });

  test("the delay grows with each failure and then runs out (no hard lock)", async () => {
    // 2^(n − free) s from the free-th failure on, capped (rule in auth.server.ts).
    expect(throttleDelaySeconds(THROTTLE.freePerPair - 1, THROTTLE.freePerPair)).toBe(0);
    expect(throttleDelaySeconds(THROTTLE.freePerPair, THROTTLE.freePerPair)).toBe(1);
    expect(throttleDelaySeconds(THROTTLE.freePerPair + 3, THROTTLE.freePerPair)).toBe(8);
    expect(throttleDelaySeconds(1000, THROTTLE.freePerPair)).toBe(THROTTLE.maxDelaySeconds);
    const m = await makeMember("engineer");
    const ip = "10.31.0.1";
    for (let i = 0; i < THROTTLE.freePerPair + 3; i++) await checkCredentials(m.email, `bad-${i}`, ip);
    expect(await checkCredentials(m.email, "correct horse battery", ip)).toMatchObject({ reason: "throttled" });
    // Move the failures 9 s into the past: the 8 s wait is over, the owner gets in from the same address.
    const rows = await db().select().from(signInAttempts).where(and(eq(signInAttempts.emailKey, m.email), eq(signInAttempts.ipAddress, ip)));
    for (const r of rows) await db().update(signInAttempts).set({ createdAt: new Date(r.createdAt.getTime() - 9_000) }).where(eq(signInAttempts.id, r.id));
    expect((await checkCredentials(m.email, "correct horse battery", ip)).ok).toBe(true);
  });
});

describe("sessions and devices", () => {
  test("the account page shows opaque device ids, never a session id; revoking by device id works, by session id does not", async () => {
    const m = await makeMember("engineer");
    const { startSession } = await import("~/lib/auth/session.server");
    const other = (await startSession(m.userId, new Request(BASE))).split(";")[0];
    const otherId = other.split("=")[1];
    const page = await call(accountRoute.loader as never, { path: "/account", cookie: m.cookie });
    const html = JSON.stringify(page.body);
    expect(html).not.toContain(otherId);
    expect(html).not.toContain(m.cookie.split("=")[1]);
    expect(html).toContain(deviceId(otherId));
    const bySession = await call(accountRoute.action as never, { path: "/account", cookie: m.cookie, form: { intent: "revoke-device", sessionId: otherId } });
    expect(bySession.status).toBe(404);
    const byDevice = await call(accountRoute.action as never, { path: "/account", cookie: m.cookie, form: { intent: "revoke-device", sessionId: deviceId(otherId) } });
    expect(byDevice.status).toBe(200);
    expect(await db().select().from(sessions).where(eq(sessions.id, otherId))).toEqual([]);
  });

  test("the session cookie lives as long as the session (30 days), not 400", async () => {
    const { startSession } = await import("~/lib/auth/session.server");
    const m = await makeMember("viewer");
    const cookie = await startSession(m.userId, new Request(BASE));
    expect(cookie).toMatch(/Max-Age=2592000/i); // 30 d × 86 400 s
  });

  test("the confirmation link signs the new account in and goes on to where sign-up was headed", async () => {
    const email = uniqEmail("joiner");
    await call(signupRoute.action as never, { path: "/signup", form: { email, name: "Jo", password: "long enough pw", next: "/invite/abc" } });
    const link = linkIn((await mailsTo(email))[0].textBody, "/verify");
    const r = await call(verifyRoute.action as never, { path: "/verify", form: { token: tokenOf(link), next: new URL(link).searchParams.get("next")! } });
    expect(r.status).toBe(302);
    expect(r.location).toBe("/invite/abc");
    expect(r.headers.get("set-cookie")).toMatch(/^dm_session=/);
  });
});

describe("invitations", () => {
  test("only the invited address can accept", async () => {
    const admin = await makeMember("admin");
    const invited = await makeMember("viewer");
    const stranger = await makeMember("viewer");
    const secret = await invite({ workspaceId: admin.workspaceId, workspaceName: "W", inviterId: admin.userId, inviterName: "A", email: invited.email, role: "engineer" });
    expect(await acceptInvitation(secret, stranger.userId)).toEqual({ ok: false, reason: "wrong-address", email: invited.email });
    expect(await db().select().from(memberships).where(and(eq(memberships.userId, stranger.userId), eq(memberships.workspaceId, admin.workspaceId)))).toEqual([]);
    expect(await acceptInvitation(secret, invited.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId });
  });

  test("accepting a lower-role invitation does not demote the workspace's only admin", async () => {
    const admin = await makeMember("admin");
    const secret = await invite({ workspaceId: admin.workspaceId, workspaceName: "W", inviterId: admin.userId, inviterName: "A", email: admin.email, role: "viewer" });
    expect(await acceptInvitation(secret, admin.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId });
    const [m] = await db().select().from(memberships).where(and(eq(memberships.userId, admin.userId), eq(memberships.workspaceId, admin.workspaceId)));
    expect(m.role).toBe("admin");
  });
});

test("reset route: a forged token is still a 400 (unchanged)", async () => {
  const r = await call(resetRoute.action as never, { path: "/reset", form: { token: "forged", password: "a long new password" } });
  expect(r.status).toBe(400);
});
