// Field-check records: the selections open to a workspace for field checks, recording a check
// (or an amendment: a new version of its chain) with its photos, exactly once per device-made id,
// reading checks back, and the engineer's notice by e-mail. The check itself is worked out by the
// pure `evaluate.ts` (which the phone also runs offline).
//
// Who sees what: a selection is open for field checks to its own workspace and to every workspace
// its project is shared with and whose admins accepted the share (`openShareTo`: a pending or declined
// share opens nothing); its checks are open to the same workspaces. Ids from elsewhere
// answer 404, never data. A check is never edited: an amendment is a new version of its chain.
import { createHash } from "node:crypto";
import { and, desc, eq, inArray, or, sql } from "drizzle-orm";
import { data } from "react-router";
import { db, withTransaction } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks, projects, projectShares, selections, systems, users, workspaces } from "@db/schema";
import { frozenOf } from "../projects/selections.server";
import { readStoredSelection } from "../projects/stored-selection";
import { judgedToday } from "./judged-today";
import { openShareTo } from "../projects/shares.server";
import type { Viewer } from "../libraries";
import { evaluateCheck } from "./evaluate";
import type { CheckFields, Readings } from "./form";
import { readStoredCheck } from "./stored-check";
import { MAX_PROBLEMS_LISTED } from "../projects/stored-doc";
import { PhotoRejected, type PhotoIn } from "./photos.server";
import { photoProblem } from "./photo-limits";
import { checkTimes } from "./taken-at";
import { notifyEngineer } from "./notify.server";
import { fmtUtc } from "../shared/format";

const notFound = (what: string) => data(`No such ${what} open to this workspace.`, { status: 404 });

// ── Access ─────────────────────────────────────────────────────────────────────────────────
/** Ids of the projects shared with the viewer's workspace, the shares its admins accepted. */
async function sharedProjectIds(viewer: Viewer): Promise<number[]> {
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

type CheckRow = typeof fieldChecks.$inferSelect;

/** A check open to the viewer (through its selection), with its selection. */
export async function getFieldCheck(viewer: Viewer, checkId: number) {
  const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, checkId));
  if (!row) throw notFound("field check");
  // The check carries its own stored result: its page does not read the selection's frozen document.
  let sel: Omit<Awaited<ReturnType<typeof fieldSelectionRecord>>, "record">;
  let frozenJson: string;
  try {
    const { record, ...rest } = await fieldSelectionRecord(viewer, row.selectionId);
    sel = rest;
    frozenJson = record.frozenJson;
  } catch {
    throw notFound("field check");
  }
  const [by] = row.createdBy ? await db().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, row.createdBy)) : [];
  const [ws] = await db().select({ name: workspaces.name }).from(workspaces).where(eq(workspaces.id, row.workspaceId));
  const photos = await db()
    .select({ id: fieldCheckPhotos.id, filename: fieldCheckPhotos.filename, contentType: fieldCheckPhotos.contentType, sizeBytes: fieldCheckPhotos.sizeBytes })
    .from(fieldCheckPhotos)
    .where(eq(fieldCheckPhotos.fieldCheckId, row.id))
    .orderBy(fieldCheckPhotos.id);
  const chain = await db()
    .select({ id: fieldChecks.id, version: fieldChecks.version, verdict: fieldChecks.verdict, createdAt: fieldChecks.createdAt })
    .from(fieldChecks)
    .where(eq(fieldChecks.chainId, row.chainId ?? row.id))
    .orderBy(fieldChecks.version);
  // Its stored documents are read against their schemas: one that fails is said, never shown with numbers (no 500 either).
  const stored = readStoredCheck(row);
  // The same readings judged under today's rules (judged-today.ts), said beside the stored verdict where they differ; only
  // where the selection's frozen document reads (the page shows the check from its own record either way).
  const frozen = stored.ok ? readStoredSelection(frozenJson) : null;
  const today = stored.ok && frozen?.ok ? judgedToday(frozen.frozen, stored.readings as Readings, row.grade, row.verdict) : null;
  return {
    check: row,
    judgedToday: today,
    selection: sel,
    ...(stored.ok
      ? { readable: true as const, readings: stored.readings, fields: stored.fields, result: stored.result }
      : { readable: false as const, problems: stored.problems.slice(0, MAX_PROBLEMS_LISTED), problemCount: stored.problems.length }),
    recordedBy: by?.name || by?.email || "a former member",
    recordedIn: ws?.name ?? "",
    mayAmend: row.workspaceId === viewer.workspace.id,
    photos,
    versions: chain.map((c) => ({ ...c, createdAt: c.createdAt.toISOString() })),
    latest: chain.length ? chain[chain.length - 1].id === row.id : true,
    times: checkTimes(row.takenAt, row.createdAt, sel.createdAt),
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

// ── Recording ──────────────────────────────────────────────────────────────────────────────
export type NewCheck = {
  readings: Readings;
  fields: CheckFields;
  notes: string;
  gradeId: string;
  amends?: number | null;
  /** Id made on the device (e.g. a UUID): the same id recorded twice gives the first check back. */
  clientId?: string | null;
  /** The selection's fingerprint the device worked against; a different one now is a conflict. */
  basedOn?: string | null;
  /** The phone's clock when the readings were taken (kept beside the server's time of recording); null when not sent. */
  takenAt?: Date | null;
};

/**
 * The selection changed since the device opened it (`current`: its fingerprint now), or the version being amended was
 * amended meanwhile (`latest`: the chain's latest version, which the user may amend instead): shown, never merged.
 */
export class CheckConflict extends Error {
  constructor(
    message: string,
    readonly current: string,
    readonly latest: { id: number; version: number } | null = null,
  ) {
    super(message);
  }
}

/** A device-made id: 8 to 64 letters, digits, `-` or `_` (a UUID fits). */
export const CLIENT_ID = /^[A-Za-z0-9_-]{8,64}$/;

/**
 * The check already recorded under this device id, if any: the same user's, in the same workspace and selection only.
 * Anyone else's is a 409 (`code: "client-id-taken"`, the phone sends again under a new id) that never names that check:
 * answered as a duplicate, the other phone would delete readings that were never recorded. A retry needs only its id:
 * its stored documents are not read here, so a damaged one (its own page says so) never turns the phone's retry into a
 * 500 that the queue would send again and again.
 */
async function checkByClientId(viewer: Viewer, selectionId: number, clientId: string) {
  const [row] = await db()
    .select({ id: fieldChecks.id, workspaceId: fieldChecks.workspaceId, selectionId: fieldChecks.selectionId, createdBy: fieldChecks.createdBy })
    .from(fieldChecks)
    .where(eq(fieldChecks.clientId, clientId));
  if (!row) return null;
  if (row.workspaceId !== viewer.workspace.id || row.selectionId !== selectionId || row.createdBy !== viewer.userId)
    throw data({ detail: "That check id is already used by another check: this one was not recorded under it. Send it again under a new id.", code: "client-id-taken" }, { status: 409 });
  return { id: row.id, result: null, mail: null, duplicate: true as const };
}

function isDuplicateKey(e: unknown): boolean {
  for (let x = e as { errno?: number; code?: string; cause?: unknown } | undefined, i = 0; x && i < 4; x = x.cause as typeof x, i++) {
    if (x.errno === 1062 || x.code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

/**
 * Records a check (or an amendment: a new version of the amended check's chain) with its photos,
 * in one transaction, then tells the engineer of the selection by e-mail. With a device id the
 * check is recorded exactly once: a retry (even one racing the first) answers the first check
 * with `duplicate: true`, no second row, no second e-mail.
 */
export async function recordFieldCheck(
  viewer: Viewer,
  selectionId: number,
  input: NewCheck,
  photos: PhotoIn[] = [],
  opts: { notify?: boolean; /** The selection as `fieldSelection` read it for this viewer (the form read it first). */ selection?: Awaited<ReturnType<typeof fieldSelection>> } = {},
) {
  const sel = opts.selection?.id === selectionId ? opts.selection : await fieldSelection(viewer, selectionId);
  const clientId = input.clientId ?? null;
  if (clientId !== null && !CLIENT_ID.test(clientId)) throw data("The check id made on the device is not valid.", { status: 400 });
  if (clientId !== null) {
    const earlier = await checkByClientId(viewer, sel.id, clientId);
    if (earlier) return earlier;
  }
  if (input.basedOn && input.basedOn !== sel.fingerprint)
    throw new CheckConflict("The selection changed after this phone opened it: the readings were not recorded against the new one. Open the selection again, look at what changed and enter the check again if it still applies.", sel.fingerprint);
  let amended: CheckRow | null = null;
  if (input.amends) {
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, input.amends));
    if (!row || row.selectionId !== sel.id) throw notFound("field check");
    if (row.workspaceId !== viewer.workspace.id) throw data("Only the workspace that recorded a check may amend it.", { status: 403 });
    amended = row;
  }
  const result = evaluateCheck(sel.frozen, input.readings, input.gradeId);
  const id = await withTransaction(async (tx) => {
    let chainId: number | null = null;
    let version = 1;
    let carried: (typeof fieldCheckPhotos.$inferSelect)[] = [];
    if (amended) {
      chainId = amended.chainId ?? amended.id;
      // Lock the chain's first version so two amendments cannot take the same number, then read its latest (locking: the
      // newest committed row). Only the latest may be amended: a new version built from an older one would drop the
      // readings and photos of the versions after it from the chain's latest record (a phone that opened it offline).
      await tx.select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.id, chainId)).for("update");
      const [latest] = await tx
        .select({ id: fieldChecks.id, version: fieldChecks.version, createdAt: fieldChecks.createdAt })
        .from(fieldChecks)
        .where(eq(fieldChecks.chainId, chainId))
        .orderBy(desc(fieldChecks.version))
        .limit(1)
        .for("update");
      if (latest && latest.id !== amended.id) throw amendedMeanwhile(amended, latest);
      version = (latest?.version ?? amended.version) + 1;
      carried = await tx.select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, amended.id));
      const tooMany = photoProblem(photos.map((p) => ({ name: p.filename, size: p.bytes.length })), carried.length);
      if (tooMany) throw new PhotoRejected(tooMany);
    }
    const [{ id }] = await tx
      .insert(fieldChecks)
      .values({
        selectionId: sel.id,
        chainId,
        version,
        workspaceId: viewer.workspace.id,
        createdBy: viewer.userId,
        readingsJson: JSON.stringify({ readings: input.readings, fields: input.fields }),
        resultJson: JSON.stringify(result),
        verdict: result.verdict,
        grade: result.grade.id,
        notes: input.notes,
        clientId,
        takenAt: input.takenAt ?? null,
      })
      .$returningId();
    if (!chainId) await tx.update(fieldChecks).set({ chainId: id }).where(eq(fieldChecks.id, id));
    for (const p of carried) await tx.insert(fieldCheckPhotos).values({ fieldCheckId: id, filename: p.filename, contentType: p.contentType, sizeBytes: p.sizeBytes, sha256: p.sha256, content: p.content });
    for (const p of photos)
      await tx.insert(fieldCheckPhotos).values({ fieldCheckId: id, filename: p.filename, contentType: p.contentType, sizeBytes: p.bytes.length, sha256: createHash("sha256").update(p.bytes).digest("hex"), content: p.bytes });
    return id;
  }).catch(async (e) => {
    // Two copies of one device's check raced: the other one won; answer with it.
    if (clientId !== null && isDuplicateKey(e)) return null;
    throw e;
  });
  if (id === null) {
    const winner = await checkByClientId(viewer, sel.id, clientId!);
    if (winner) return winner;
    throw new Error("duplicate device id but no check found");
  }
  let mail = null;
  if (opts.notify !== false) {
    const [{ createdAt }] = await db().select({ createdAt: fieldChecks.createdAt }).from(fieldChecks).where(eq(fieldChecks.id, id));
    mail = await notifyEngineer(viewer, sel, id, result, amended ? "amended" : "new", checkTimes(input.takenAt ?? null, createdAt, sel.createdAt));
  }
  return { id, result, mail, duplicate: false as const };
}

/** The amended version is no longer the chain's latest: the conflict, naming both versions, with the latest to amend instead. */
function amendedMeanwhile(amended: CheckRow, latest: { id: number; version: number; createdAt: Date }): CheckConflict {
  return new CheckConflict(
    `Not recorded: check ${amended.id} (version ${amended.version}) was amended meanwhile: version ${latest.version} (check ${latest.id}), recorded ${fmtUtc(latest.createdAt)}. ` +
      `Recorded as an amendment of version ${amended.version}, these readings would have replaced version ${latest.version}'s, and its photos, as the latest record. ` +
      `Look at version ${latest.version}; if these readings still apply, record them as its amendment (version ${latest.version + 1}).`,
    "",
    { id: latest.id, version: latest.version },
  );
}
