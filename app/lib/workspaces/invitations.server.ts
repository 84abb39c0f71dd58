// Invitations to a workspace: sent by mail (hashed, single use, INVITE_TTL_DAYS), bound to the invited
// address, and only from an account whose address is confirmed.
import { and, eq, gt, isNull } from "drizzle-orm";
import { affectedRows, db, withTransaction } from "@db/client.server";
import { invitations, memberships, users, workspaces } from "@db/schema";
import { hashSecret, newSecret } from "../auth/secrets.server";
import { appUrl, requireVerified } from "../auth/accounts.server";
import { normaliseEmail } from "../auth/session.server";
import { queueMail } from "../mail/outbox.server";
import { workspaceInviteMail } from "../mail/templates";
import type { Role } from "../auth/permissions";
import { INVITE_TTL_DAYS } from "../shared/constants";
import { clearingTokens, lockMembers } from "./workspaces.server";

export async function listInvitations(workspaceId: number) {
  return db()
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.workspaceId, workspaceId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())));
}

export async function invite(input: { workspaceId: number; workspaceName: string; inviterId: string; inviterName: string; email: string; role: Role }) {
  await requireVerified(input.inviterId, "inviting people");
  const secret = newSecret();
  const email = normaliseEmail(input.email);
  await db()
    .insert(invitations)
    .values({
      workspaceId: input.workspaceId,
      email,
      role: input.role,
      tokenHash: hashSecret(secret),
      invitedBy: input.inviterId,
      expiresAt: new Date(Date.now() + INVITE_TTL_DAYS * 86_400_000),
    });
  await queueMail({
    to: email,
    ...workspaceInviteMail({
      inviterName: input.inviterName || "A colleague",
      workspaceName: input.workspaceName,
      role: input.role,
      link: `${appUrl()}/invite/${secret}`,
      expiresInDays: INVITE_TTL_DAYS,
    }),
  });
  return secret;
}

export async function revokeInvitation(workspaceId: number, invitationId: number): Promise<boolean> {
  const r = await db()
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(and(eq(invitations.id, invitationId), eq(invitations.workspaceId, workspaceId)));
  return affectedRows(r) === 1;
}

/** Not accepted, not withdrawn, not expired. */
const usable = (inv: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }) => !inv.acceptedAt && !inv.revokedAt && inv.expiresAt > new Date();

export async function findInvitation(secret: string) {
  if (!secret || secret.length > 200) return null;
  const [row] = await db()
    .select({ inv: invitations, workspaceName: workspaces.name })
    .from(invitations)
    .innerJoin(workspaces, eq(workspaces.id, invitations.workspaceId))
    .where(eq(invitations.tokenHash, hashSecret(secret)));
  if (!row || !usable(row.inv)) return null;
  return row;
}

/** Accepted, or why not: expired, withdrawn or used (`unusable`), or usable but for another address. */
export type Acceptance =
  | { ok: true; workspaceId: number }
  | { ok: false; reason: "unusable" }
  | { ok: false; reason: "wrong-address"; /** the invited address, which the invitation page already shows */ email: string };

/**
 * The signed-in user joins with the invited role; the invitation is used up. Only the account with
 * the invited address may accept: another account is told so (`wrong-address`), but only about an
 * invitation that could still be used — of one that cannot, nothing more is said than of a made-up link.
 * Someone already a member keeps their role (role changes are the admins' job), so no invitation can
 * demote anyone — least of all a workspace's only admin. The workspace's members are locked first
 * (`lockMembers`), and the invitation is used only if it is still pending once they are: a removal that
 * withdrew it meanwhile wins.
 */
export async function acceptInvitation(secret: string, userId: string): Promise<Acceptance> {
  const unusable = { ok: false, reason: "unusable" } as const;
  if (!secret || secret.length > 200) return unusable;
  return clearingTokens(withTransaction(async (tx): Promise<Acceptance> => {
    const [inv] = await tx.select().from(invitations).where(eq(invitations.tokenHash, hashSecret(secret)));
    if (!inv || !usable(inv)) return unusable;
    const [u] = await tx.select({ email: users.email }).from(users).where(eq(users.id, userId));
    if (!u || u.email !== inv.email) return { ok: false, reason: "wrong-address", email: inv.email };
    if (!(await lockMembers(tx, inv.workspaceId))) return unusable;
    const r = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invitations.id, inv.id), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())));
    if (affectedRows(r) !== 1) return unusable;
    const existing = await tx
      .select({ id: memberships.id })
      .from(memberships)
      .where(and(eq(memberships.workspaceId, inv.workspaceId), eq(memberships.userId, userId)))
      .for("update");
    if (!existing.length) await tx.insert(memberships).values({ workspaceId: inv.workspaceId, userId, role: inv.role });
    // Whoever opened the link from their mailbox has shown they read that address.
    await tx.update(users).set({ emailVerified: true }).where(eq(users.id, userId));
    await tx.update(users).set({ currentWorkspaceId: inv.workspaceId }).where(eq(users.id, userId));
    return { ok: true, workspaceId: inv.workspaceId };
  }));
}
