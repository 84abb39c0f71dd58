// Project shares, the receiving workspace's side: the projects other workspaces offer this one, and its admins' answer.
// Accepting opens the project's selections to every member here for field checks; declining (or stopping an accepted
// share later) closes them. A declined share is final: the owner offers again by sharing again, which makes a new share
// with a new id (shares.server.ts), so an answer given on an old page never reaches the new offer.
// A share id of another workspace's offer answers exactly as an id no share has (404): nobody learns which ids exist.
import { and, count, desc, eq, inArray, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/mysql-core";
import { data } from "react-router";
import { affectedRows, db } from "@db/client.server";
import { projectShares, projects, selections, users, workspaces } from "@db/schema";
import { can } from "../auth/permissions";
import { pageOf } from "../shared/paging";
import type { Viewer } from "../libraries";

/** Offers listed a page at a time (an offer can be made by anyone who knows the workspace's name). */
export const OFFERS_PAGE_ROWS = 50;

export type ShareAnswer = "accept" | "decline";

const NO_SUCH_OFFER = "No such offer to this workspace (it may have been withdrawn by its owner).";

function mayDecide(viewer: Viewer) {
  if (!can(viewer.role, "shares.decide")) throw data(`Your role (${viewer.role}) in ${viewer.workspace.name} does not allow this.`, { status: 403 });
}

/** How many offers to the workspace wait for an answer (the Workspace page's link). */
export async function pendingOfferCount(workspaceId: number): Promise<number> {
  const [r] = await db()
    .select({ n: count() })
    .from(projectShares)
    .where(and(eq(projectShares.workspaceId, workspaceId), eq(projectShares.state, "pending")));
  return Number(r?.n ?? 0);
}

/** The offers to the viewer's workspace, those waiting first, then newest first; with who offered and who here answered. */
export async function offersTo(viewer: Viewer, page?: number | null) {
  mayDecide(viewer);
  const mine = eq(projectShares.workspaceId, viewer.workspace.id);
  const [{ n }] = await db().select({ n: count() }).from(projectShares).where(mine);
  const { first, ...paging } = pageOf(Number(n), OFFERS_PAGE_ROWS, page);
  const offeredBy = alias(users, "offered_by");
  const decidedBy = alias(users, "decided_by_user");
  const rows = await db()
    .select({
      id: projectShares.id,
      state: projectShares.state,
      createdAt: projectShares.createdAt,
      decidedAt: projectShares.decidedAt,
      projectId: projects.id,
      projectName: projects.name,
      fromWorkspace: workspaces.name,
      offeredBy: offeredBy.name,
      decidedBy: decidedBy.name,
      decidedByEmail: decidedBy.email,
    })
    .from(projectShares)
    .innerJoin(projects, eq(projects.id, projectShares.projectId))
    .innerJoin(workspaces, eq(workspaces.id, projects.workspaceId))
    .leftJoin(offeredBy, eq(offeredBy.id, projectShares.createdBy))
    .leftJoin(decidedBy, eq(decidedBy.id, projectShares.decidedBy))
    .where(mine)
    .orderBy(sql`${projectShares.state} = 'pending' DESC`, desc(projectShares.createdAt), desc(projectShares.id))
    .limit(OFFERS_PAGE_ROWS)
    .offset(first);
  const ids = rows.map((r) => r.projectId);
  const counts = ids.length
    ? await db().select({ projectId: selections.projectId, n: count() }).from(selections).where(inArray(selections.projectId, ids)).groupBy(selections.projectId)
    : [];
  const selectionsOf = new Map(counts.map((c) => [c.projectId, Number(c.n)]));
  return {
    paging,
    offers: rows.map(({ projectId, decidedByEmail, ...r }) => ({
      ...r,
      selections: selectionsOf.get(projectId) ?? 0,
      createdAt: r.createdAt.toISOString(),
      decidedAt: r.decidedAt?.toISOString() ?? null,
      decidedBy: r.decidedBy || decidedByEmail || null,
    })),
  };
}

export type DecideOutcome = { ok: true; state: "accepted" | "declined"; already: boolean; projectName: string; fromWorkspace: string } | { ok: false; status: 409; error: string };

/**
 * An admin's answer to an offer to their workspace: accept a pending one (opens it), decline a pending one or stop an
 * accepted one (closes it). Accepting what is accepted, or declining what is declined, changes nothing; a declined
 * share cannot be accepted (409: the owner offers again). 404 for an id that is not an offer to this workspace.
 */
export async function decideShare(viewer: Viewer, shareId: number, answer: ShareAnswer): Promise<DecideOutcome> {
  mayDecide(viewer);
  const read = async () => {
    const [row] = await db()
      .select({ state: projectShares.state, decidedAt: projectShares.decidedAt, projectName: projects.name, fromWorkspace: workspaces.name })
      .from(projectShares)
      .innerJoin(projects, eq(projects.id, projectShares.projectId))
      .innerJoin(workspaces, eq(workspaces.id, projects.workspaceId))
      .where(and(eq(projectShares.id, shareId), eq(projectShares.workspaceId, viewer.workspace.id)));
    if (!row) throw data(NO_SUCH_OFFER, { status: 404 });
    return row;
  };
  const before = await read();
  const to = answer === "accept" ? "accepted" : "declined";
  const from = answer === "accept" ? (["pending"] as const) : (["pending", "accepted"] as const);
  // One conditional UPDATE: the state it leaves is decided by the row as it is now, not as it was read above.
  const r = await db()
    .update(projectShares)
    .set({ state: to, decidedBy: viewer.userId, decidedAt: new Date() })
    .where(and(eq(projectShares.id, shareId), eq(projectShares.workspaceId, viewer.workspace.id), inArray(projectShares.state, [...from])));
  const { projectName, fromWorkspace } = before;
  if (affectedRows(r) === 1) return { ok: true, state: to, already: false, projectName, fromWorkspace };
  const now = await read(); // withdrawn meanwhile: 404
  if (now.state === to) return { ok: true, state: to, already: true, projectName, fromWorkspace };
  return { ok: false, status: 409, error: `This offer of “${projectName}” was declined; it cannot be accepted now. ${fromWorkspace} can offer the project again, as a new offer.` };
}
