// The field checks read back as lists: the field home's selections and recent checks, a selection's checks (the
// contractor's history, the engineer's list, the CSV), each readable one with its stored record read against its schemas.
import { desc, eq, inArray, or, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { fieldChecks, projects, selections, systems, users, workspaces } from "@db/schema";
import { readStoredSelection } from "../projects/stored-selection";
import type { Viewer } from "../libraries";
import { readStoredCheck, readStoredReadings } from "./stored-check";
import { listedVerdict } from "./listed-verdict";
import { frozenForToday, ruledTodayKept, type FrozenForToday } from "./today.server";
import { MAX_PROBLEMS_LISTED } from "../projects/stored-doc";
import { checkTimes } from "./taken-at";
import { fieldSelection, fieldSelectionRecord, sharedProjectIds } from "./access.server";

/**
 * Selections open to the viewer (shared with their workspace, and their own workspace's) and their 30 latest checks,
 * newest first by the time their readings were taken (else recorded), each with both times (taken-at.ts), as the history,
 * and the verdict the list shows (`shown`, listed-verdict.ts): today's with its rule and numbers, the stored one beside it
 * where they differ; a check whose stored readings do not read, its stored verdict said as saved.
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
        .select({ id: fieldChecks.id, selectionId: fieldChecks.selectionId, version: fieldChecks.version, verdict: fieldChecks.verdict, grade: fieldChecks.grade, takenAt: fieldChecks.takenAt, createdAt: fieldChecks.createdAt, byName: users.name, byWorkspace: workspaces.name, readingsJson: fieldChecks.readingsJson, resultJson: fieldChecks.resultJson })
        .from(fieldChecks)
        .leftJoin(users, eq(users.id, fieldChecks.createdBy))
        .innerJoin(workspaces, eq(workspaces.id, fieldChecks.workspaceId))
        .where(inArray(fieldChecks.selectionId, ids))
        .orderBy(desc(sql`COALESCE(${fieldChecks.takenAt}, ${fieldChecks.createdAt})`), desc(fieldChecks.id))
        .limit(30)
    : [];
  const titleOf = new Map(sels.map((s) => [s.id, `${s.title} · ${s.projectName}`]));
  const madeAt = new Map(sels.map((s) => [s.id, s.createdAt]));
  // The frozen documents of the selections these checks were recorded against (30 checks: a few documents), read once each.
  const frozenIds = [...new Set(checks.map((c) => c.selectionId))];
  const docs = frozenIds.length ? await db().select({ id: selections.id, frozenJson: selections.frozenJson }).from(selections).where(inArray(selections.id, frozenIds)) : [];
  const frozenOf = new Map(docs.map((d) => {
    const read = readStoredSelection(d.frozenJson);
    return [d.id, read.ok ? frozenForToday(d.frozenJson, read.frozen) : null] as const;
  }));
  return {
    selections: sels.map((s) => ({ id: s.id, title: s.title, projectName: s.projectName, systemName: s.systemName, ownerName: s.ownerName, own: s.workspaceId === viewer.workspace.id })),
    checks: await Promise.all(checks.map(async ({ takenAt, readingsJson, resultJson, ...c }) => {
      const today = await ruledTodayKept(frozenOf.get(c.selectionId) ?? null, readingsJson, c.grade, () => readStoredReadings(readingsJson));
      // Only where today's rules cannot judge: the stored result, for the stored verdict's rule (null where it does not read).
      const stored = today ? null : readStoredCheck({ readingsJson, resultJson });
      return {
        ...c,
        createdAt: c.createdAt.toISOString(),
        times: checkTimes(takenAt, c.createdAt, madeAt.get(c.selectionId) ?? c.createdAt),
        selection: titleOf.get(c.selectionId) ?? "",
        shown: listedVerdict({ verdict: c.verdict, grade: c.grade, savedAt: c.createdAt.toISOString(), result: stored?.ok ? stored.result : null }, today),
      };
    })),
  };
}

/** Every check of a selection, newest first, with the selection's frozen document (the check page; 409 when it cannot be read). */
export async function checkHistory(viewer: Viewer, selectionId: number) {
  const sel = await fieldSelection(viewer, selectionId);
  // The fingerprint digests the frozen document as stored (and the title): the key today's verdicts are kept under.
  return { selection: sel, checks: await checksOf(sel.id, { key: sel.fingerprint, doc: sel.frozen }) };
}

/**
 * Every check of a selection, newest first (the checks' CSV: each check carries its own result), each with `verdictToday`
 * and `verdictTodayRule`: its readings judged under today's rules against the frozen document where that differs from the
 * stored verdict, with its rule and numbers, else null (agreeing, not judgeable today, or a frozen document that does not
 * read: the stored verdict stands alone).
 */
export async function checkRecords(viewer: Viewer, selectionId: number) {
  const { record, ...sel } = await fieldSelectionRecord(viewer, selectionId);
  const frozen = readStoredSelection(record.frozenJson);
  const checks = await checksOf(sel.id, frozen.ok ? frozenForToday(record.frozenJson, frozen.frozen) : null);
  const differs = (c: (typeof checks)[number]) => (c.readable && c.shown.today !== null ? c.shown : null);
  return { selection: sel, checks: checks.map((c) => ({ ...c, verdictToday: differs(c)?.today ?? null, verdictTodayRule: differs(c)?.rule ?? null })) };
}

/**
 * The checks recorded against a selection, newest first by the time their readings were taken (the phone's clock where
 * it was sent, else the server's when recorded), each with both times (taken-at.ts) and marked when a later version exists. A check whose
 * stored readings or result fail their schemas (stored-check.ts) is listed as unreadable (`readable: false`: who, when
 * and what is wrong, no numbers) and the others as before: one damaged row never takes the list down. Each readable one
 * with the verdict a list shows (`shown`, listed-verdict.ts): its readings judged with today's engine against `frozen`
 * (kept per process, today.server.ts), the stored verdict beside it where they differ; with `frozen` null (a document that
 * does not read), the stored verdict said as saved.
 * No access rule: callers pass a selection they have already opened for the viewer.
 * @param selectionId the selection, opened for the viewer
 * @param frozen its frozen document with its key, or null where it does not read
 */
export async function checksOf(selectionId: number, frozen: FrozenForToday | null) {
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
  return Promise.all(rows.map(async (r) => {
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
    if (!stored.ok) return { ...base, readable: false as const, problems: stored.problems.slice(0, MAX_PROBLEMS_LISTED), problemCount: stored.problems.length };
    const today = await ruledTodayKept(frozen, r.c.readingsJson, r.c.grade, () => stored.readings);
    const shown = listedVerdict({ verdict: r.c.verdict, grade: r.c.grade, savedAt: base.createdAt, result: stored.result }, today);
    return { ...base, readable: true as const, result: stored.result, readings: stored.readings, shown };
  }));
}

export type ListedCheck = Awaited<ReturnType<typeof checksOf>>[number];

export type CheckHistory = Awaited<ReturnType<typeof checkHistory>>;
