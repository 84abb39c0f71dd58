// Accounts against the real MariaDB (npm test's own database). Check values are our own product
// rules (single-use, expiring tokens; throttling thresholds in auth.server.ts) — common practice.
import { afterAll, describe, expect, test } from "vitest";
import { and, desc, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { emailTokens, invitations, memberships, outbox, sessions, signInAttempts, users } from "@db/schema";
import { requestPasswordReset, resetPassword, signUp, verifyEmail } from "./accounts.server";
import { createApiToken, revokeApiToken } from "./api-tokens.server";
import { acceptInvitation, changeRole, invite, removeMember, revokeInvitation } from "../workspaces";
import { checkCredentials, THROTTLE } from "./session.server";
import { requireApi, requireMember } from "./guards.server";
import { csrfRefusal } from "./csrf.server";
import { BASE, makeMember, makeWorkspace, userRow } from "~/test/harness";

afterAll(() => closeDb());

const uniqEmail = (p: string) => `${p}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.test`;

async function lastMailTo(email: string) {
  const [m] = await db().select().from(outbox).where(eq(outbox.toAddress, email)).orderBy(desc(outbox.id)).limit(1);
  return m ?? null;
}
function linkIn(text: string, path: string): string {
  const m = new RegExp(`https?://[^\\s"<>]*${path}[^\\s"<>]*`).exec(text);
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[0];
}
const tokenOf = (link: string) => new URL(link).searchParams.get("token") ?? link.split("/").pop()!;

describe("sign-up and address verification", () => {
  test("sign-up makes the user admin of a new workspace and mails a single-use verification link", async () => {
    const email = uniqEmail("new");
    const r = await signUp({ email, password: "long enough pw", name: "Nia New", workspaceName: "Nia's Works" });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const [m] = await db().select().from(memberships).where(eq(memberships.userId, r.userId));
    expect(m.role).toBe("admin");
    expect((await userRow(r.userId)).emailVerified).toBe(false);
    const mail = await lastMailTo(email);
    expect(mail).not.toBeNull();
    const token = tokenOf(linkIn(mail!.textBody, "/verify"));
    // Only a hash is stored.
    const stored = await db().select().from(emailTokens).where(eq(emailTokens.userId, r.userId));
    expect(stored[0].tokenHash).not.toContain(token);
    expect(await verifyEmail(token)).toBe(true);
    expect((await userRow(r.userId)).emailVerified).toBe(true);
    expect(await verifyEmail(token)).toBe(false); // single use
  });

  test("an existing address gets a mail, the form learns nothing, no second account", async () => {
    const email = uniqEmail("dup");
    await signUp({ email, password: "long enough pw", name: "First" });
    const again = await signUp({ email, password: "another long pw", name: "Second" });
    expect(again).toEqual({ ok: false, reason: "exists" });
    const rows = await db().select().from(users).where(eq(users.email, email));
    expect(rows).toHaveLength(1);
    expect((await lastMailTo(email))!.subject).not.toMatch(/confirm/i);
  });

  test("an expired verification link is refused", async () => {
    const email = uniqEmail("exp");
    const r = await signUp({ email, password: "long enough pw", name: "Ex" });
    if (!r.ok) throw new Error("sign-up failed");
    const token = tokenOf(linkIn((await lastMailTo(email))!.textBody, "/verify"));
    await db().update(emailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(emailTokens.userId, r.userId));
    expect(await verifyEmail(token)).toBe(false);
    expect(await verifyEmail("not-a-token")).toBe(false);
  });
});

describe("password reset", () => {
  test("unknown address: same behaviour, no mail", async () => {
    const email = uniqEmail("nobody");
    await expect(requestPasswordReset(email)).resolves.toBeUndefined();
    expect(await lastMailTo(email)).toBeNull();
  });

  test("reset works once, signs out every device, and the new password signs in", async () => {
    const m = await makeMember("engineer");
    await requestPasswordReset(m.email.toUpperCase());
    const token = tokenOf(linkIn((await lastMailTo(m.email))!.textBody, "/reset"));
    expect(await resetPassword(token, "brand new password")).toBe(true);
    expect(await db().select().from(sessions).where(eq(sessions.userId, m.userId))).toHaveLength(0);
    expect(await resetPassword(token, "yet another password")).toBe(false); // reused
    expect((await checkCredentials(m.email, "brand new password", "10.9.9.1")).ok).toBe(true);
  });

  test("an expired reset link is refused and the password is unchanged", async () => {
    const m = await makeMember("viewer");
    await requestPasswordReset(m.email);
    const token = tokenOf(linkIn((await lastMailTo(m.email))!.textBody, "/reset"));
    await db().update(emailTokens).set({ expiresAt: new Date(Date.now() - 1) }).where(eq(emailTokens.userId, m.userId));
    expect(await resetPassword(token, "should not apply")).toBe(false);
    expect((await checkCredentials(m.email, "correct horse battery", "10.9.9.2")).ok).toBe(true);
  });
});

describe("sign-in checks and throttling", () => {
  test("wrong password and unknown e-mail give the same answer", async () => {
    const m = await makeMember("engineer");
    const wrong = await checkCredentials(m.email, "wrong password!", "10.1.1.1");
    const unknown = await checkCredentials(uniqEmail("ghost"), "whatever pw", "10.1.1.1");
    expect(wrong).toEqual({ ok: false, reason: "invalid" });
    expect(unknown).toEqual({ ok: false, reason: "invalid" });
  });

  test(`after ${THROTTLE.freePerPair} failures from one address that pair waits a growing delay; the owner elsewhere signs in`, async () => {
    const m = await makeMember("engineer");
    for (let i = 0; i < THROTTLE.freePerPair + 2; i++) await checkCredentials(m.email, `bad-${i}`, "10.2.0.1");
    // 5 failures, 3 free → 2^(5−3) = 4 s after the last one (the rule in auth.server.ts).
    const held = await checkCredentials(m.email, "correct horse battery", "10.2.0.1");
    expect(held).toMatchObject({ ok: false, reason: "throttled" });
    expect((held as { retryAfter: number }).retryAfter).toBeGreaterThan(0);
    expect((held as { retryAfter: number }).retryAfter).toBeLessThanOrEqual(4);
    expect((await checkCredentials(m.email, "correct horse battery", "10.2.99.1")).ok).toBe(true); // another address: not held
  });

  test(`after ${THROTTLE.perAddress} failures from one address, that address is throttled`, async () => {
    const ip = `10.3.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;
    for (let i = 0; i < THROTTLE.perAddress; i++) await checkCredentials(uniqEmail(`spray${i}`), "bad password", ip);
    const m = await makeMember("engineer");
    expect(await checkCredentials(m.email, "correct horse battery", ip)).toMatchObject({ ok: false, reason: "throttled" });
    expect((await checkCredentials(m.email, "correct horse battery", "10.4.0.1")).ok).toBe(true);
  });

  const someAddress = (prefix: string) => `${prefix}.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}`;

  test(`30 wrong passwords at once for one account from one address: at most ${THROTTLE.freePerPair} are checked, the rest throttled`, async () => {
    const m = await makeMember("engineer");
    const ip = someAddress("10.6");
    // 30: a burst the review sent (every one answered "invalid" when the wait was read before any failure was written).
    const answers = await Promise.all(Array.from({ length: 30 }, (_, i) => checkCredentials(m.email, `guess-${i}`, ip)));
    const reasons = answers.map((a) => (a.ok ? "ok" : a.reason));
    const checked = reasons.filter((r) => r === "invalid").length;
    expect(checked).toBeLessThanOrEqual(THROTTLE.freePerPair); // the free failures per pair (THROTTLE, session rule)
    expect(checked).toBeGreaterThan(0); // the first in turn finds no failure
    expect(reasons.filter((r) => r === "throttled").length).toBe(30 - checked);
    // The failures counted are the guesses checked; a throttled one counts nothing.
    const failed = await db().select().from(signInAttempts).where(and(eq(signInAttempts.emailKey, m.email), eq(signInAttempts.ipAddress, ip)));
    expect(failed.map((r) => r.success)).toEqual(Array(checked).fill(false));
    // The owner elsewhere is not held up.
    expect((await checkCredentials(m.email, "correct horse battery", someAddress("10.7"))).ok).toBe(true);
  }, 60_000);

  test("two sign-ins at once with the right password (a double click) both succeed and count as no failure", async () => {
    const m = await makeMember("engineer");
    const ip = someAddress("10.8");
    const answers = await Promise.all([0, 1].map(() => checkCredentials(m.email, "correct horse battery", ip)));
    expect(answers.map((a) => a.ok)).toEqual([true, true]);
    const rows = await db().select().from(signInAttempts).where(and(eq(signInAttempts.emailKey, m.email), eq(signInAttempts.ipAddress, ip)));
    expect(rows.map((r) => r.success)).toEqual([true, true]);
  });
});

describe("invitations and members", () => {
  test("an invitation is accepted once with its role", async () => {
    const admin = await makeMember("admin");
    const guest = await makeMember("viewer");
    const secret = await invite({ workspaceId: admin.workspaceId, workspaceName: "X", inviterId: admin.userId, inviterName: "A", email: guest.email, role: "contractor" });
    const mail = await lastMailTo(guest.email);
    expect(mail!.textBody).toContain(`/invite/${secret}`);
    expect(await acceptInvitation(secret, guest.userId)).toEqual({ ok: true, workspaceId: admin.workspaceId });
    const [m] = await db()
      .select()
      .from(memberships)
      .where(and(eq(memberships.userId, guest.userId), eq(memberships.workspaceId, admin.workspaceId)));
    expect(m.role).toBe("contractor");
    expect(await acceptInvitation(secret, guest.userId)).toEqual({ ok: false, reason: "unusable" });
  });

  test("a withdrawn or expired invitation cannot be accepted", async () => {
    const admin = await makeMember("admin");
    const guest = await makeMember("viewer");
    const s1 = await invite({ workspaceId: admin.workspaceId, workspaceName: "X", inviterId: admin.userId, inviterName: "A", email: guest.email, role: "engineer" });
    const [inv] = await db().select().from(invitations).where(eq(invitations.workspaceId, admin.workspaceId));
    expect(await revokeInvitation(admin.workspaceId, inv.id)).toBe(true);
    expect(await acceptInvitation(s1, guest.userId)).toEqual({ ok: false, reason: "unusable" });
    const s2 = await invite({ workspaceId: admin.workspaceId, workspaceName: "X", inviterId: admin.userId, inviterName: "A", email: guest.email, role: "engineer" });
    await db().update(invitations).set({ expiresAt: new Date(Date.now() - 1) }).where(eq(invitations.workspaceId, admin.workspaceId));
    expect(await acceptInvitation(s2, guest.userId)).toEqual({ ok: false, reason: "unusable" });
  });

  test("the last admin can be neither demoted nor removed", async () => {
    const admin = await makeMember("admin");
    const [m] = await db().select().from(memberships).where(eq(memberships.userId, admin.userId));
    expect(await changeRole(admin.workspaceId, m.id, "viewer")).toBe("last-admin");
    expect(await removeMember(admin.workspaceId, m.id)).toBe("last-admin");
    const other = await makeWorkspace();
    expect(await changeRole(other.id, m.id, "viewer")).toBe("not-found"); // id from another workspace
  });
});

describe("guards", () => {
  test("no session → redirect to sign-in with the return path", async () => {
    const thrown = await requireMember(new Request(`${BASE}/projects?x=1`)).catch((e) => e);
    expect(thrown).toBeInstanceOf(Response);
    expect(thrown.status).toBe(302);
    expect(thrown.headers.get("location")).toBe(`/signin?next=${encodeURIComponent("/projects?x=1")}`);
  });

  test("lacking a permission → 403; holding it → the member", async () => {
    const v = await makeMember("viewer");
    const req = () => new Request(`${BASE}/x`, { headers: { cookie: v.cookie } });
    const thrown = await requireMember(req(), "project.write").catch((e) => e);
    expect(thrown?.init?.status).toBe(403);
    const ok = await requireMember(req(), "project.read");
    expect(ok.workspace.id).toBe(v.workspaceId);
    expect(ok.role).toBe("viewer");
  });

  test("API: no credentials 401, read token on a write call 403, revoked 401, problem+json throughout", async () => {
    const e = await makeMember("engineer");
    const api = (auth?: string) => new Request(`${BASE}/api/v1/x`, { headers: auth ? { authorization: auth } : {} });
    const none = await requireApi(api(), "project.read").catch((x) => x);
    expect(none.status).toBe(401);
    expect(none.headers.get("content-type")).toBe("application/problem+json");
    const { id, token } = await createApiToken({ userId: e.userId, workspaceId: e.workspaceId, name: "t", scope: "read" });
    expect((await requireApi(api(`Bearer ${token}`), "project.read")).role).toBe("engineer");
    const w = await requireApi(api(`Bearer ${token}`), "project.write").catch((x) => x);
    expect(w.status).toBe(403);
    expect(await revokeApiToken(e.userId, id)).toBe(true);
    expect((await requireApi(api(`Bearer ${token}`), "project.read").catch((x) => x)).status).toBe(401);
    expect((await requireApi(api("Bearer nonsense-token-value"), "project.read").catch((x) => x)).status).toBe(401);
  });

  test("a write token still obeys the role", async () => {
    const c = await makeMember("contractor");
    const { token } = await createApiToken({ userId: c.userId, workspaceId: c.workspaceId, name: "t", scope: "write" });
    const r = await requireApi(new Request(`${BASE}/api`, { headers: { authorization: `Bearer ${token}` } }), "library.write").catch((x) => x);
    expect(r.status).toBe(403);
  });
});

describe("CSRF origin check", () => {
  const post = (headers: Record<string, string>, path = "/workspace") => new Request(`${BASE}${path}`, { method: "POST", headers });
  test("same origin passes; another origin, a cross-site fetch or no origin at all is refused", () => {
    expect(csrfRefusal(post({ origin: BASE }))).toBeNull();
    expect(csrfRefusal(post({ origin: "http://evil.example" }))).toMatch(/refused/);
    expect(csrfRefusal(post({ "sec-fetch-site": "cross-site" }))).toMatch(/refused/);
    expect(csrfRefusal(post({}))).toMatch(/refused/);
    expect(csrfRefusal(new Request(`${BASE}/workspace`))).toBeNull(); // GET
    expect(csrfRefusal(post({ authorization: "Bearer abc" }))).toBeNull(); // no ambient credentials
    // A session cookie is ambient: with it, a Bearer header no longer exempts the request (issue 14).
    expect(csrfRefusal(post({ authorization: "Bearer abc", cookie: "dm_session=abc123" }))).toMatch(/refused/);
    expect(csrfRefusal(post({ authorization: "Bearer abc", cookie: "theme=dark; dm_session=abc123", origin: "http://evil.example" }))).toMatch(/refused/);
    expect(csrfRefusal(post({ authorization: "Bearer abc", cookie: "dm_session=abc123", origin: BASE }))).toBeNull();
  });
});
