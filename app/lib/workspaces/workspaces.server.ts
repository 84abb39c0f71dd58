// Workspaces and their members: create, rename, currency, list, change a role, remove. A workspace
// always keeps at least one admin; member changes lock the workspace's row first (`lockMembers`).
// Removal withdraws pending invitations to and from the member; a change to a role that may not invite
// withdraws those the member sent. Membership changes clear the verified-token cache once committed.
import { and, eq, isNull, ne, count } from "drizzle-orm";
import { affectedRows, db, withTransaction, type Db } from "@db/client.server";
import { apiTokens, invitations, memberships, users, workspaces } from "@db/schema";
import { newSecret } from "../auth/secrets.server";
import { forgetTokens } from "../auth/token-cache.server";
import { can, type Role } from "../auth/permissions";

/** Membership and token changes clear the verified-token cache once committed (token-cache.server.ts). */
export const clearingTokens = <T>(work: Promise<T>): Promise<T> => work.finally(forgetTokens);

export function slugify(name: string): string {
  const s = name
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60);
  return s || "workspace";
}

export async function uniqueSlug(tx: Db, name: string): Promise<string> {
  const base = slugify(name);
  for (let i = 0; i < 50; i++) {
    const slug = i === 0 ? base : `${base}-${i + 1}`;
    const found = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.slug, slug));
    if (found.length === 0) return slug;
  }
  return `${base}-${newSecret(4).toLowerCase()}`;
}

export async function createWorkspace(userId: string, name: string): Promise<number> {
  return withTransaction(async (tx) => {
    const slug = await uniqueSlug(tx, name);
    const [{ id }] = await tx.insert(workspaces).values({ name: name.trim(), slug }).$returningId();
    await tx.insert(memberships).values({ workspaceId: id, userId, role: "admin" });
    await tx.update(users).set({ currentWorkspaceId: id }).where(eq(users.id, userId));
    return id;
  });
}

/** ISO 4217 currency code of the workspace's tariffs and energy costs (EUR when unset). */
export async function workspaceCurrency(workspaceId: number): Promise<string> {
  const [w] = await db().select({ currency: workspaces.currency }).from(workspaces).where(eq(workspaces.id, workspaceId));
  return w?.currency ?? "EUR";
}

export async function setWorkspaceCurrency(workspaceId: number, currency: string): Promise<void> {
  await db().update(workspaces).set({ currency: currency.toUpperCase() }).where(eq(workspaces.id, workspaceId));
}

export async function renameWorkspace(workspaceId: number, name: string): Promise<void> {
  await db().update(workspaces).set({ name: name.trim() }).where(eq(workspaces.id, workspaceId));
}

export async function listMembers(workspaceId: number) {
  return db()
    .select({ id: memberships.id, userId: users.id, email: users.email, name: users.name, role: memberships.role, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.workspaceId, workspaceId))
    .orderBy(users.email);
}

/**
 * Every change to a workspace's members (role, removal, an accepted invitation) first locks the workspace's
 * row, so two of them never decide on the same state: two admins demoting or removing each other at the same
 * moment each saw two admins under repeatable read and both went through, leaving none. The second now waits
 * and counts again. Each of them takes this lock before any other, so for one workspace they run one after
 * another and never deadlock each other.
 */
export async function lockMembers(tx: Db, workspaceId: number): Promise<boolean> {
  const rows = await tx.select({ id: workspaces.id }).from(workspaces).where(eq(workspaces.id, workspaceId)).for("update");
  return rows.length === 1;
}

/** The workspace's admins, read as committed now (a locking read), not as the transaction's snapshot saw them. */
async function adminCount(tx: Db, workspaceId: number): Promise<number> {
  const rows = await tx
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, "admin")))
    .for("update");
  return rows.length;
}

/** The member `membershipId` of the workspace, locked, after the workspace's member lock. */
async function lockedMember(tx: Db, workspaceId: number, membershipId: number) {
  if (!(await lockMembers(tx, workspaceId))) return null;
  const [m] = await tx
    .select()
    .from(memberships)
    .where(and(eq(memberships.id, membershipId), eq(memberships.workspaceId, workspaceId)))
    .for("update");
  return m ?? null;
}

export type MemberChange = "ok" | "not-found" | "last-admin";

/** A role change, with the pending invitations it withdrew: those the member had sent, once their new role may not invite. */
export type RoleChange = Exclude<MemberChange, "ok"> | { changed: true; withdrawnSentByThem: number };

/** This workspace's invitations not yet accepted nor withdrawn. */
const pendingIn = (workspaceId: number) => and(eq(invitations.workspaceId, workspaceId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt));

/** Withdraws the pending invitations `userId` sent in the workspace; answers how many. */
async function withdrawSentBy(tx: Db, workspaceId: number, userId: string, now: Date): Promise<number> {
  return affectedRows(await tx.update(invitations).set({ revokedAt: now }).where(and(pendingIn(workspaceId), eq(invitations.invitedBy, userId))));
}

/**
 * Changes a member's role; a workspace always keeps at least one admin. To a role that may not invite
 * (`members.manage`), the member's pending invitations in this workspace are withdrawn in the same transaction, as
 * at a removal: whom they invited is vouched for by a member who may invite only while they may.
 */
export async function changeRole(workspaceId: number, membershipId: number, role: Role): Promise<RoleChange> {
  return clearingTokens(withTransaction(async (tx) => {
    const m = await lockedMember(tx, workspaceId, membershipId);
    if (!m) return "not-found";
    if (m.role === "admin" && role !== "admin" && (await adminCount(tx, workspaceId)) <= 1) return "last-admin";
    await tx.update(memberships).set({ role }).where(eq(memberships.id, m.id));
    const withdrawn = can(role, "members.manage") ? 0 : await withdrawSentBy(tx, workspaceId, m.userId, new Date());
    return { changed: true, withdrawnSentByThem: withdrawn };
  }));
}

/** A removal, with the pending invitations it withdrew: to the member's address, and those the member had sent. */
export type Removal = Exclude<MemberChange, "ok"> | { removed: true; withdrawnToThem: number; withdrawnSentByThem: number };

/**
 * Removes a member (and their API tokens for this workspace); a workspace always keeps at least one admin.
 * In the same transaction every pending invitation of this workspace to the member's address is withdrawn
 * (else a second, unused invitation let them straight back in, with its role), and so is every pending
 * invitation the member had sent (whom a removed admin invited is no longer vouched for; an admin who still
 * wants them invites them again). Invitations already used stay as they are.
 */
export async function removeMember(workspaceId: number, membershipId: number): Promise<Removal> {
  return clearingTokens(withTransaction(async (tx) => {
    const m = await lockedMember(tx, workspaceId, membershipId);
    if (!m) return "not-found";
    if (m.role === "admin" && (await adminCount(tx, workspaceId)) <= 1) return "last-admin";
    const [u] = await tx.select({ email: users.email }).from(users).where(eq(users.id, m.userId));
    const now = new Date();
    const toThem = u ? affectedRows(await tx.update(invitations).set({ revokedAt: now }).where(and(pendingIn(workspaceId), eq(invitations.email, u.email)))) : 0;
    const sentByThem = await withdrawSentBy(tx, workspaceId, m.userId, now);
    await tx.delete(memberships).where(eq(memberships.id, m.id));
    await tx.delete(apiTokens).where(and(eq(apiTokens.userId, m.userId), eq(apiTokens.workspaceId, workspaceId)));
    return { removed: true, withdrawnToThem: toThem, withdrawnSentByThem: sentByThem };
  }));
}

export async function otherMembersCount(workspaceId: number, userId: string) {
  const [r] = await db()
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), ne(memberships.userId, userId)));
  return Number(r?.n ?? 0);
}
