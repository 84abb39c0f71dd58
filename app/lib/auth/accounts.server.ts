// Accounts: sign-up, address verification, password reset, profile. Workspaces and invitations are in
// app/lib/workspaces/, API tokens in api-tokens.server.ts.
// Every multi-row write runs in one transaction (withTransaction).
import { and, eq, isNull } from "drizzle-orm";
import { affectedRows, db, withTransaction, type Db } from "@db/client.server";
import { apiTokens, emailTokens, memberships, sessions, signInAttempts, users, workspaces } from "@db/schema";
import { data } from "react-router";
import { getAuth, hashPassword, normaliseEmail, startSession } from "./session.server";
import { hashSecret, newSecret } from "./secrets.server";
import { queueMail } from "../mail/outbox.server";
import { hitRateLimit } from "../shared/ratelimit.server";
import { passwordResetMail, verifyAddressMail, escapeHtml } from "../mail/templates";
import { uniqueSlug } from "../workspaces/workspaces.server";

import { EMAIL_TOKEN_TTL, INVITE_TTL_DAYS } from "../shared/constants";
import { settings } from "../shared/env.server";
import type { PresetId } from "../shared/units";
import type { Quantity } from "~/engine";
import { forgetTokens } from "./token-cache.server";
export { EMAIL_TOKEN_TTL, INVITE_TTL_DAYS };

export function appUrl(): string {
  return settings().appUrl ?? "http://127.0.0.1:3000";
}

/** Sent to the owner of an address when someone tries to sign up with it again. */
function accountExistsMail(signInUrl: string, resetUrl: string) {
  const text = `Hello,\n\nSomeone tried to create a Dutymark account with this address, which already has one.\nSign in: ${signInUrl}\nForgot the password? ${resetUrl}\n\nIf it was not you, nothing has changed and you can ignore this message.\n`;
  const html = `<p>Hello,</p><p>Someone tried to create a Dutymark account with this address, which already has one.</p><p><a href="${escapeHtml(signInUrl)}">Sign in</a> · <a href="${escapeHtml(resetUrl)}">Choose a new password</a></p><p>If it was not you, nothing has changed and you can ignore this message.</p>`;
  return { subject: "You already have a Dutymark account", text, html };
}

/** Sent after a password reset: every device is signed out and every API token revoked. */
function passwordChangedMail(tokens: number, forgotUrl: string) {
  const what = `Every device was signed out${tokens ? ` and your ${tokens} API token${tokens === 1 ? " was" : "s were"} revoked` : ""}.`;
  const text = `Hello,\n\nThe password of your Dutymark account was just changed with a reset link. ${what}\n\nIf it was not you, choose a new password now: ${forgotUrl}\n`;
  const html = `<p>Hello,</p><p>The password of your Dutymark account was just changed with a reset link. ${escapeHtml(what)}</p><p>If it was not you, <a href="${escapeHtml(forgotUrl)}">choose a new password now</a>.</p>`;
  return { subject: "Your Dutymark password was changed", text, html };
}

export function newUserId(): string {
  return `u_${newSecret(15)}`;
}

export type SignUpResult = { ok: true; userId: string } | { ok: false; reason: "exists" };

/** Creates the user and, when a name is given, a workspace they administer; sends the verification mail. */
export async function signUp(input: { email: string; password: string; name: string; workspaceName?: string; next?: string }): Promise<SignUpResult> {
  const email = normaliseEmail(input.email);
  const passwordHash = await hashPassword(input.password);
  const userId = newUserId();
  const created = await withTransaction(async (tx) => {
    const exists = await tx.select({ id: users.id }).from(users).where(eq(users.email, email));
    if (exists.length) return false;
    await tx.insert(users).values({ id: userId, email, name: input.name.trim(), passwordHash });
    if (input.workspaceName?.trim()) {
      const slug = await uniqueSlug(tx, input.workspaceName);
      const [{ id: wsId }] = await tx.insert(workspaces).values({ name: input.workspaceName.trim(), slug }).$returningId();
      await tx.insert(memberships).values({ workspaceId: wsId, userId, role: "admin" });
      await tx.update(users).set({ currentWorkspaceId: wsId }).where(eq(users.id, userId));
    }
    return true;
  });
  if (!created) {
    // Tell the owner of the address, not the person at the form.
    await queueMail({ to: email, ...accountExistsMail(`${appUrl()}/signin`, `${appUrl()}/forgot`) });
    return { ok: false, reason: "exists" };
  }
  await sendVerification(userId, input.next ?? "");
  return { ok: true, userId };
}

async function issueEmailToken(userId: string, purpose: "verify" | "reset"): Promise<string> {
  const secret = newSecret();
  // One link of each kind is valid at a time: a new one retires the older ones.
  await db()
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, purpose), isNull(emailTokens.usedAt)));
  await db()
    .insert(emailTokens)
    .values({
      userId,
      purpose,
      tokenHash: hashSecret(secret),
      expiresAt: new Date(Date.now() + EMAIL_TOKEN_TTL[purpose] * 60_000),
    });
  return secret;
}

export async function sendVerification(userId: string, next = ""): Promise<void> {
  const [u] = await db().select().from(users).where(eq(users.id, userId));
  if (!u || u.emailVerified) return;
  const secret = await issueEmailToken(userId, "verify");
  const after = next ? `&next=${encodeURIComponent(next)}` : "";
  await queueMail({
    to: u.email,
    ...verifyAddressMail({ name: u.name, link: `${appUrl()}/verify?token=${secret}${after}`, expiresInHours: EMAIL_TOKEN_TTL.verify / 60 }),
  });
}

/** Consumes a single-use, unexpired token of `purpose`; returns its user id or null. */
async function consumeEmailToken(tx: Db, secret: string, purpose: "verify" | "reset"): Promise<string | null> {
  if (!secret || secret.length > 200) return null;
  const [t] = await tx
    .select()
    .from(emailTokens)
    .where(and(eq(emailTokens.tokenHash, hashSecret(secret)), eq(emailTokens.purpose, purpose)));
  if (!t || t.usedAt || t.expiresAt <= new Date()) return null;
  const r = await tx
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(and(eq(emailTokens.id, t.id), isNull(emailTokens.usedAt)));
  return affectedRows(r) === 1 ? t.userId : null;
}

/** Confirms the address of the link's user; returns that user's id and address, or null. */
export async function verifyEmailUser(secret: string): Promise<{ id: string; email: string } | null> {
  return withTransaction(async (tx) => {
    const userId = await consumeEmailToken(tx, secret, "verify");
    if (!userId) return null;
    await tx.update(users).set({ emailVerified: true }).where(eq(users.id, userId));
    const [u] = await tx.select({ email: users.email }).from(users).where(eq(users.id, userId));
    return { id: userId, email: u?.email ?? "" };
  });
}

export async function verifyEmail(secret: string): Promise<boolean> {
  return (await verifyEmailUser(secret)) !== null;
}

export type LinkConfirmation =
  | { kind: "unusable" }
  /** Nobody was signed in: the link proves the mailbox and signs its account in (sign-up starts no session). */
  | { kind: "signed-in"; cookie: string }
  /** Its own account was signed in already: nothing more to do. */
  | { kind: "same-account" }
  /** Another account is signed in and stays so: the link's address is confirmed, nobody is signed in as it. */
  | { kind: "other-account"; signedInAs: string; confirmed: string };

/**
 * The confirmation link's button (/verify). A signed-in session is never replaced by the link's account: an
 * attacker's own unused link, opened by someone signed in, would sign them in as the attacker (login CSRF).
 */
export async function confirmAddressLink(secret: string, request: Request): Promise<LinkConfirmation> {
  const auth = await getAuth(request);
  const confirmed = await verifyEmailUser(secret);
  if (!confirmed) return { kind: "unusable" };
  if (!auth) return { kind: "signed-in", cookie: await startSession(confirmed.id, request) };
  if (auth.user.id === confirmed.id) return { kind: "same-account" };
  return { kind: "other-account", signedInAs: auth.user.email, confirmed: confirmed.email };
}

/** /forgot: at most this many reset mails per account, and requests per client address, per hour. */
export const FORGOT_LIMITS = { perAccount: 3, perAddress: 10, windowSeconds: 3600 };

/**
 * Always behaves the same whether or not the address has an account: the mail (if any) goes
 * through the outbox, never inline. Throttled per address asked about and per client address;
 * a throttled request also answers the same and sends nothing.
 */
export async function requestPasswordReset(emailRaw: string, ip = ""): Promise<void> {
  const email = normaliseEmail(emailRaw);
  const rule = { limit: FORGOT_LIMITS.perAccount, windowSeconds: FORGOT_LIMITS.windowSeconds };
  const perAccount = await hitRateLimit(`forgot:acct:${email}`, rule);
  const perAddress = ip ? await hitRateLimit(`forgot:ip:${ip}`, { ...rule, limit: FORGOT_LIMITS.perAddress }) : null;
  if (!perAccount.allowed || (perAddress && !perAddress.allowed)) return;
  const [u] = await db().select({ id: users.id, email: users.email }).from(users).where(eq(users.email, email));
  if (!u) return;
  const secret = await issueEmailToken(u.id, "reset");
  await queueMail({
    to: u.email,
    ...passwordResetMail({ link: `${appUrl()}/reset?token=${secret}`, expiresInMinutes: EMAIL_TOKEN_TTL.reset }),
  });
}

/**
 * Sets the new password. Everything that kept access with the old one goes: every session, every
 * API token, every other reset link, and the failed sign-ins counted against the account; the
 * owner is told by mail.
 */
export async function resetPassword(secret: string, password: string): Promise<boolean> {
  const passwordHash = await hashPassword(password);
  const done = await withTransaction(async (tx) => {
    const userId = await consumeEmailToken(tx, secret, "reset");
    if (!userId) return null;
    const [u] = await tx.select({ email: users.email }).from(users).where(eq(users.id, userId));
    await tx.update(users).set({ passwordHash, emailVerified: true }).where(eq(users.id, userId));
    await tx.delete(sessions).where(eq(sessions.userId, userId));
    const revoked = affectedRows(await tx.update(apiTokens).set({ revokedAt: new Date() }).where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt))));
    await tx.update(emailTokens).set({ usedAt: new Date() }).where(and(eq(emailTokens.userId, userId), eq(emailTokens.purpose, "reset"), isNull(emailTokens.usedAt)));
    if (u) await tx.delete(signInAttempts).where(and(eq(signInAttempts.emailKey, u.email), eq(signInAttempts.success, false)));
    return { email: u?.email, revoked };
  });
  forgetTokens();
  if (!done) return false;
  if (done.email) await queueMail({ to: done.email, ...passwordChangedMail(done.revoked, `${appUrl()}/forgot`) });
  return true;
}

/** Tokens and invitations need a confirmed address (else anyone could sign up with someone's address and keep a door open). */
export async function requireVerified(userId: string, what: string): Promise<void> {
  const [u] = await db().select({ v: users.emailVerified }).from(users).where(eq(users.id, userId));
  if (!u?.v) throw data(`Confirm your e-mail address before ${what}.`, { status: 403 });
}

/** Name and units: the preset and the per-quantity overrides (ids already checked against the engine's units). */
export async function updateProfile(userId: string, input: { name: string; unitSystem: PresetId; units?: Partial<Record<Quantity, string>> }) {
  await db().update(users).set({ name: input.name, unitSystem: input.unitSystem, units: JSON.stringify(input.units ?? {}) }).where(eq(users.id, userId));
}

