// The e-mail to the receiving workspace's admins when a project is offered to it (through the outbox, after the share is
// written): who offers what, what accepting opens, and the link to the page where they accept or decline. Only admins with
// a confirmed address are written to; the offering side is never told how many there are.
import { and, eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { memberships, users } from "@db/schema";
import { queueMail } from "../mail/outbox.server";
import { shareOfferMail } from "../mail/templates";
import { appUrl } from "../auth/accounts.server";

/** The page where a workspace's admins see the projects offered to it. */
export const OFFERS_PATH = "/workspace/shares";

export async function tellReceivingAdmins(to: { workspaceId: number; workspaceName: string }, from: { workspaceName: string; userId: string }, projectName: string): Promise<number> {
  const admins = await db()
    .select({ email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, to.workspaceId), eq(memberships.role, "admin"), eq(users.emailVerified, true)));
  if (!admins.length) return 0;
  const [by] = await db().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, from.userId));
  for (const a of admins) {
    await queueMail({
      to: a.email,
      ...shareOfferMail({
        adminName: a.name,
        offeredBy: by?.name || null,
        fromWorkspace: from.workspaceName,
        toWorkspace: to.workspaceName,
        projectName,
        link: `${appUrl()}${OFFERS_PATH}`,
      }),
    });
  }
  return admins.length;
}
