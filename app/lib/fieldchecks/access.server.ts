// Who may see a selection for field checks: its own workspace, and every workspace its project is shared with and whose
// admins accepted the share (`openShareTo`: a pending or declined share opens nothing); its checks are open to the same
// workspaces. Ids from elsewhere answer 404, never data.
import { createHash } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { data } from "react-router";
import { db } from "@db/client.server";
import { projects, projectShares, selections, systems, workspaces } from "@db/schema";
import { frozenOf } from "../projects/selections.server";
import { openShareTo } from "../projects/shares.server";
import type { Viewer } from "../libraries";

export const notFound = (what: string) => data(`No such ${what} open to this workspace.`, { status: 404 });

/** Ids of the projects shared with the viewer's workspace, the shares its admins accepted. */
export async function sharedProjectIds(viewer: Viewer): Promise<number[]> {
  const rows = await db().select({ projectId: projectShares.projectId }).from(projectShares).where(openShareTo(viewer.workspace.id));
  return rows.map((r) => r.projectId);
}

/**
 * A selection open to the viewer for field checks (its own workspace's, or one of a project shared with it and accepted), without
 * reading its frozen document: what a recorded check's page needs (the check carries its own stored result).
 */
export async function fieldSelectionRecord(viewer: Viewer, selectionId: number) {
  const [row] = await db()
    .select({ s: selections, projectName: projects.name, projectCreatedBy: projects.createdBy, systemName: systems.name, ownerName: workspaces.name, shareId: projectShares.id })
    .from(selections)
    .innerJoin(projects, eq(projects.id, selections.projectId))
    .innerJoin(systems, eq(systems.id, selections.systemId))
    .innerJoin(workspaces, eq(workspaces.id, selections.workspaceId))
    .leftJoin(projectShares, and(eq(projectShares.projectId, selections.projectId), openShareTo(viewer.workspace.id)))
    .where(eq(selections.id, selectionId));
  if (!row || (row.s.workspaceId !== viewer.workspace.id && row.shareId == null)) throw notFound("selection");
  return {
    record: row.s,
    id: row.s.id,
    title: row.s.title,
    projectId: row.s.projectId,
    projectName: row.projectName,
    systemName: row.systemName,
    ownerWorkspace: row.ownerName,
    own: row.s.workspaceId === viewer.workspace.id,
    createdBy: row.s.createdBy,
    projectCreatedBy: row.projectCreatedBy,
    /** When the selection was made: readings the phone's clock dates before it are flagged (taken-at.ts). */
    createdAt: row.s.createdAt,
  };
}

/**
 * A selection open to the viewer for field checks with its frozen document, which a check is worked out against;
 * refuses (409, `storedSelectionRefusal`) when that document cannot be read — never a check against half a record.
 */
export async function fieldSelection(viewer: Viewer, selectionId: number) {
  const { record, ...sel } = await fieldSelectionRecord(viewer, selectionId);
  return {
    ...sel,
    frozen: frozenOf(record),
    /** What the phone worked against: a change of the frozen document or title is a conflict on sync. */
    fingerprint: createHash("sha256").update(record.title).update("\n").update(record.frozenJson).digest("hex").slice(0, 32),
  };
}
