// Project sharing with another workspace (the contractor), the owner's side: the owner offers a project to a workspace
// by its exact name or short name, sees each share's state (pending, accepted, declined) and withdraws it. An offer
// opens nothing until an admin of the receiving workspace accepts it (share-offers.server.ts); only an accepted share
// opens the project's selections for field checks (`openShareTo`, the one rule fieldchecks/records.server.ts reads).
//
// What a stranger learns by offering (decision "shareconsent" in DEVELOPERS.md): a name or short name no workspace has,
// or that two have, is one refusal; one that a workspace has becomes a share on the owner's list with that workspace's
// name and short name and, later, its answer and the day of it — never who answered or how many admins it has. That a
// workspace exists under a name is unavoidable once the owner must see where an offer went; guessing is bounded by
// SHARE_OFFER_LIMIT (unknown names and new offers count, per account) and every hit is an offer its admins see.
import { and, eq, or, type SQL } from "drizzle-orm";
import { affectedRows, db, withTransaction } from "@db/client.server";
import { projectShares, workspaces } from "@db/schema";
import type { ShareState } from "../shared/constants";
import { hitRateLimit, type RateLimitRule } from "../shared/ratelimit.server";
import type { Viewer } from "../libraries";
import { getProject } from "./projects.server";
import { tellReceivingAdmins } from "./share-notice.server";

/** The shares that open a project to workspace `workspaceId`: accepted ones only (pending or declined open nothing). */
export const openShareTo = (workspaceId: number): SQL => and(eq(projectShares.workspaceId, workspaceId), eq(projectShares.state, "accepted"))!;

/** Unknown names and new offers an account may try per hour (a guess at a name costs one; answers about its own shares cost none). */
export const SHARE_OFFER_LIMIT: RateLimitRule = { limit: 20, windowSeconds: 3600 };

export const NO_SUCH_WORKSPACE = "No workspace has exactly that name or short name. Ask them for it (it is shown on their Workspace page).";

export async function listShares(viewer: Viewer, projectId: number) {
  const p = await getProject(viewer, projectId);
  const rows = await db()
    .select({
      id: projectShares.id,
      workspaceName: workspaces.name,
      workspaceSlug: workspaces.slug,
      createdAt: projectShares.createdAt,
      state: projectShares.state,
      decidedAt: projectShares.decidedAt,
    })
    .from(projectShares)
    .innerJoin(workspaces, eq(workspaces.id, projectShares.workspaceId))
    .where(eq(projectShares.projectId, p.id))
    .orderBy(workspaces.name);
  return {
    project: { id: p.id, name: p.name },
    shares: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), decidedAt: r.decidedAt?.toISOString() ?? null })),
  };
}

export type ShareOutcome =
  | {
      ok: true;
      name: string;
      /** offered: a new share, pending; again: a new share replacing a declined one; pending / accepted: the share there already. */
      outcome: "offered" | "again" | "pending" | "accepted";
      /** When the replaced share was declined (outcome "again"). */
      declinedAt?: string | null;
    }
  | { ok: false; status: 422 | 429; error: string };

/** One guess or offer counted against the account's hour; the refusal when past SHARE_OFFER_LIMIT, else null. */
async function overLimit(viewer: Viewer): Promise<ShareOutcome | null> {
  const r = await hitRateLimit(`share-offer:${viewer.userId}`, SHARE_OFFER_LIMIT);
  if (r.allowed) return null;
  const minutes = Math.ceil(r.resetSeconds / 60);
  return {
    ok: false,
    status: 429,
    error: `Too many offers and unknown names from your account this hour (${r.limit} at most). Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`,
  };
}

function isDuplicateKey(e: unknown): boolean {
  for (let x = e as { errno?: number; code?: string; cause?: unknown } | undefined, i = 0; x && i < 4; x = x.cause as typeof x, i++) {
    if (x.errno === 1062 || x.code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

/**
 * Offers a project to the workspace of that exact name or slug: a new share, pending until one of its admins accepts.
 * Asking again while one is pending or accepted changes nothing. A declined share is final: asking again is a new offer,
 * made as a new share (a new id) in place of the declined one, in one transaction.
 */
export async function shareProject(viewer: Viewer, projectId: number, nameOrSlug: string): Promise<ShareOutcome> {
  const p = await getProject(viewer, projectId);
  const key = nameOrSlug.trim();
  if (!key) return { ok: false, status: 422, error: "Enter the other workspace's exact name or its short name (slug)." };
  const found = await db()
    .select({ id: workspaces.id, name: workspaces.name })
    .from(workspaces)
    .where(or(eq(workspaces.slug, key.toLowerCase()), eq(workspaces.name, key)))
    .limit(2);
  // Exact match only (the collation ignores case); the answer is the same for "no such workspace" and "ambiguous".
  if (found.length !== 1) return (await overLimit(viewer)) ?? { ok: false, status: 422, error: NO_SUCH_WORKSPACE };
  const w = found[0];
  if (w.id === viewer.workspace.id) return { ok: false, status: 422, error: "This is your own workspace: its members already see the project." };
  const [have] = await db()
    .select({ id: projectShares.id, state: projectShares.state, decidedAt: projectShares.decidedAt })
    .from(projectShares)
    .where(and(eq(projectShares.projectId, p.id), eq(projectShares.workspaceId, w.id)));
  if (have && have.state !== "declined") return { ok: true, name: w.name, outcome: have.state };
  const limited = await overLimit(viewer);
  if (limited) return limited;
  try {
    await withTransaction(async (tx) => {
      if (have) await tx.delete(projectShares).where(and(eq(projectShares.id, have.id), eq(projectShares.state, "declined")));
      await tx.insert(projectShares).values({ projectId: p.id, workspaceId: w.id, createdBy: viewer.userId }); // state: pending (the column's default)
    });
  } catch (e) {
    if (!isDuplicateKey(e)) throw e;
    return { ok: true, name: w.name, outcome: "pending" }; // offered at the same moment by another request
  }
  await tellReceivingAdmins({ workspaceId: w.id, workspaceName: w.name }, { workspaceName: viewer.workspace.name, userId: viewer.userId }, p.name);
  return have ? { ok: true, name: w.name, outcome: "again", declinedAt: have.decidedAt?.toISOString() ?? null } : { ok: true, name: w.name, outcome: "offered" };
}

/** Withdraws an offer or stops a share (any state) of the owner's project: the state it had, or null when there is no such share. */
export async function unshareProject(viewer: Viewer, projectId: number, shareId: number): Promise<ShareState | null> {
  const p = await getProject(viewer, projectId);
  const [row] = await db()
    .select({ state: projectShares.state })
    .from(projectShares)
    .where(and(eq(projectShares.id, shareId), eq(projectShares.projectId, p.id)));
  if (!row) return null;
  const r = await db().delete(projectShares).where(and(eq(projectShares.id, shareId), eq(projectShares.projectId, p.id)));
  return affectedRows(r) === 1 ? row.state : null;
}
