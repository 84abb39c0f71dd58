// The field checks read back as lists: the field home's selections and recent checks, a selection's checks (the
// contractor's history, the engineer's list, the CSV), each readable one with its stored record read against its schemas.
import { desc, eq, inArray, or, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { fieldChecks, projects, selections, systems, users, workspaces } from "@db/schema";
import { readStoredSelection } from "../projects/stored-selection";
import { judgedToday } from "./judged-today";
import type { Viewer } from "../libraries";
import { readStoredCheck } from "./stored-check";
import { MAX_PROBLEMS_LISTED } from "../projects/stored-doc";
import { checkTimes } from "./taken-at";
import { fieldSelection, fieldSelectionRecord, sharedProjectIds } from "./access.server";

/**
 * Selections open to the viewer (shared with their workspace, and their own workspace's) and their 30 latest checks,
 * newest first by the time their readings were taken (else recorded), each with both times (taken-at.ts), as the history.
 */
export async function fieldHome(viewer: Viewer) {
  const shared = await sharedProjectIds(viewer);
  const where = shared.length ? or(eq(selections.workspaceId, viewer.workspace.id), inArray(selections.projectId, shared)) : eq(selections.workspaceId, viewer.workspace.id);
  const sels = await db()
    .select({ id: selections.id, title: selections.title, projectName: projects.name, systemName: systems.name, ownerName: workspaces.name, workspaceId: selections.workspaceId, createdAt: selections.createdAt })
    .from(selections)
    .innerJoin(projects, eq(projects.id, selections.projectId))
    .innerJoin(systems, eq(systems.id, selections.systemId))
    .innerJoin(workspaces, eq(workspaces.id, selections.workspaceId))
    .where(where)
    .orderBy(desc(selections.id))
    .limit(200);
  const ids = sels.map((s) => s.id);
  const checks = ids.length
    ? await db()
        .select({ id: fieldChecks.id, selectionId: fieldChecks.selectionId, version: fieldChecks.version, verdict: fieldChecks.verdict, grade: fieldChecks.grade, takenAt: fieldChecks.takenAt, createdAt: fieldChecks.createdAt, byName: users.name, byWorkspace: workspaces.name })
        .from(fieldChecks)
        .leftJoin(users, eq(users.id, fieldChecks.createdBy))
        .innerJoin(workspaces, eq(workspaces.id, fieldChecks.workspaceId))
        .where(inArray(fieldChecks.selectionId, ids))
        .orderBy(desc(sql`COALESCE(${fieldChecks.takenAt}, ${fieldChecks.createdAt})`), desc(fieldChecks.id))
        .limit(30)
    : [];
  const titleOf = new Map(sels.map((s) => [s.id, `${s.title} · ${s.projectName}`]));
  const madeAt = new Map(sels.map((s) => [s.id, s.createdAt]));
  return {
    selections: sels.map((s) => ({ id: s.id, title: s.title, projectName: s.projectName, systemName: s.systemName, ownerName: s.ownerName, own: s.workspaceId === viewer.workspace.id })),
    checks: checks.map(({ takenAt, ...c }) => ({
      ...c,
      createdAt: c.createdAt.toISOString(),
      times: checkTimes(takenAt, c.createdAt, madeAt.get(c.selectionId) ?? c.createdAt),
      selection: titleOf.get(c.selectionId) ?? "",
    })),
  };
}

/** Every check of a selection, newest first, with the selection's frozen document (the check page; 409 when it cannot be read). */
export async function checkHistory(viewer: Viewer, selectionId: number) {
  const sel = await fieldSelection(viewer, selectionId);
  return { selection: sel, checks: await checksOf(sel.id) };
}

/**
 * Every check of a selection, newest first (the checks' CSV: each check carries its own result), each with `verdictToday`:
 * its readings judged under today's rules against the frozen document where that differs from the stored verdict, else null
 * (agreeing, not judgeable today, or a frozen document that does not read: the stored verdict stands alone).
 */
export async function checkRecords(viewer: Viewer, selectionId: number) {
  const { record, ...sel } = await fieldSelectionRecord(viewer, selectionId);
  const frozen = readStoredSelection(record.frozenJson);
  const today = (c: Awaited<ReturnType<typeof checksOf>>[number]) => (c.readable && frozen.ok ? (judgedToday(frozen.frozen, c.readings, c.grade, c.verdict)?.verdict ?? null) : null);
  return { selection: sel, checks: (await checksOf(sel.id)).map((c) => ({ ...c, verdictToday: today(c) })) };
}

/**
 * The checks recorded against a selection, newest first by the time their readings were taken (the phone's clock where
 * it was sent, else the server's when recorded), each with both times (taken-at.ts) and marked when a later version exists. A check whose
 * stored readings or result fail their schemas (stored-check.ts) is listed as unreadable (`readable: false`: who, when
 * and what is wrong, no numbers) and the others as before: one damaged row never takes the list down.
 * No access rule: callers pass a selection they have already opened for the viewer.
 */
export async function checksOf(selectionId: number) {
  const rows = await db()
    .select({ c: fieldChecks, byName: users.name, byWorkspace: workspaces.name, selectionMade: selections.createdAt })
    .from(fieldChecks)
    .innerJoin(selections, eq(selections.id, fieldChecks.selectionId))
    .leftJoin(users, eq(users.id, fieldChecks.createdBy))
    .innerJoin(workspaces, eq(workspaces.id, fieldChecks.workspaceId))
    .where(eq(fieldChecks.selectionId, selectionId))
    .orderBy(desc(sql`COALESCE(${fieldChecks.takenAt}, ${fieldChecks.createdAt})`), desc(fieldChecks.id));
  const latestOfChain = new Map<number, number>();
  for (const r of rows) {
    const chain = r.c.chainId ?? r.c.id;
    if (!latestOfChain.has(chain) || latestOfChain.get(chain)! < r.c.version) latestOfChain.set(chain, r.c.version);
  }
  return rows.map((r) => {
    const base = {
      id: r.c.id,
      chainId: r.c.chainId ?? r.c.id,
      version: r.c.version,
      superseded: latestOfChain.get(r.c.chainId ?? r.c.id)! > r.c.version,
      verdict: r.c.verdict,
      grade: r.c.grade,
      notes: r.c.notes,
      createdAt: r.c.createdAt.toISOString(),
      times: checkTimes(r.c.takenAt, r.c.createdAt, r.selectionMade),
      byName: r.byName ?? "",
      byWorkspace: r.byWorkspace,
    };
    const stored = readStoredCheck(r.c);
    return stored.ok
      ? { ...base, readable: true as const, result: stored.result, readings: stored.readings }
      : { ...base, readable: false as const, problems: stored.problems.slice(0, MAX_PROBLEMS_LISTED), problemCount: stored.problems.length };
  });
}

export type ListedCheck = Awaited<ReturnType<typeof checksOf>>[number];

export type CheckHistory = Awaited<ReturnType<typeof checkHistory>>;
