// Project sharing with another workspace (the contractor): the owner lists, adds and removes
// shares; a share opens the project's selections for field checks to the other workspace.
import { and, eq, or } from "drizzle-orm";
import { affectedRows, db } from "@db/client.server";
import { projectShares, workspaces } from "@db/schema";
import type { Viewer } from "../libraries";
import { getProject } from "./projects.server";

export async function listShares(viewer: Viewer, projectId: number) {
  const p = await getProject(viewer, projectId);
  const rows = await db()
    .select({ id: projectShares.id, workspaceName: workspaces.name, workspaceSlug: workspaces.slug, createdAt: projectShares.createdAt })
    .from(projectShares)
    .innerJoin(workspaces, eq(workspaces.id, projectShares.workspaceId))
    .where(eq(projectShares.projectId, p.id))
    .orderBy(workspaces.name);
  return { project: { id: p.id, name: p.name }, shares: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })) };
}

/** Shares a project with the workspace of that exact name or slug. Idempotent. */
export async function shareProject(viewer: Viewer, projectId: number, nameOrSlug: string): Promise<{ ok: true; name: string; already: boolean } | { ok: false; error: string }> {
  const p = await getProject(viewer, projectId);
  const key = nameOrSlug.trim();
  if (!key) return { ok: false, error: "Enter the other workspace's exact name or its short name (slug)." };
  const found = await db().select({ id: workspaces.id, name: workspaces.name }).from(workspaces).where(or(eq(workspaces.slug, key.toLowerCase()), eq(workspaces.name, key))).limit(2);
  // Exact match only (the collation ignores case); the answer is the same for "no such workspace" and "ambiguous".
  if (found.length !== 1) return { ok: false, error: "No workspace has exactly that name or short name. Ask them for it (it is shown on their Workspace page)." };
  const w = found[0];
  if (w.id === viewer.workspace.id) return { ok: false, error: "This is your own workspace: its members already see the project." };
  const [have] = await db().select({ id: projectShares.id }).from(projectShares).where(and(eq(projectShares.projectId, p.id), eq(projectShares.workspaceId, w.id)));
  if (have) return { ok: true, name: w.name, already: true };
  await db().insert(projectShares).values({ projectId: p.id, workspaceId: w.id, createdBy: viewer.userId });
  return { ok: true, name: w.name, already: false };
}

export async function unshareProject(viewer: Viewer, projectId: number, shareId: number): Promise<boolean> {
  const p = await getProject(viewer, projectId);
  const r = await db().delete(projectShares).where(and(eq(projectShares.id, shareId), eq(projectShares.projectId, p.id)));
  return affectedRows(r) === 1;
}
