// Pump libraries: listing through the plan gate (plans.ts), library and revision records, atomic
// imports of an analysed upload into a new revision, curves for charts and the search.
import { and, asc, count, desc, eq, inArray, isNull, or } from "drizzle-orm";
import { data } from "react-router";
import type { PoolConnection } from "mariadb";
import * as v from "valibot";
import { db } from "@db/client.server";
import { curvePoints, curveSets, libraries, libraryRevisions, pumpModels, selections, uploads, workspaces, type Visibility } from "@db/schema";
import { MappingSchema } from "../import";
import { analyseForImport } from "./upload-analysis.server";
import { runImport } from "./import-run.server";
import { can } from "../auth/permissions";
import type { Viewer } from "../auth/viewer.server";
import { accessTo } from "./plans";
import { UploadRejected } from "./uploads.server";
import { promiseCache } from "../shared/promise-cache";
import { pageOf } from "../shared/paging";

/** The libraries `viewer` may see, with their access (one query; shared by the listing and the search). */
async function visibleLibraries(viewer: Viewer) {
  const rows = await db()
    .select({
      lib: libraries,
      ownerName: workspaces.name,
      revisionNumber: libraryRevisions.number,
      modelCount: libraryRevisions.modelCount,
      curveCount: libraryRevisions.curveCount,
      pointCount: libraryRevisions.pointCount,
      importedAt: libraryRevisions.createdAt,
    })
    .from(libraries)
    .innerJoin(workspaces, eq(workspaces.id, libraries.workspaceId))
    .leftJoin(libraryRevisions, eq(libraryRevisions.id, libraries.currentRevisionId))
    .where(and(or(eq(libraries.workspaceId, viewer.workspace.id), eq(libraries.visibility, "shared")), isNull(libraries.archivedAt)))
    .orderBy(asc(libraries.name));
  return rows.flatMap((r) => {
    const access = accessTo(viewer, r.lib);
    return access ? [{ ...r, access }] : [];
  });
}

const listItem = (r: Awaited<ReturnType<typeof visibleLibraries>>[number]) => ({
  id: r.lib.id,
  name: r.lib.name,
  description: r.lib.description,
  visibility: r.lib.visibility,
  owner: r.ownerName,
  access: r.access,
  revision: r.revisionNumber ?? null,
  modelCount: r.modelCount ?? 0,
  curveCount: r.curveCount ?? 0,
  importedAt: r.importedAt?.toISOString() ?? null,
});

export async function listLibraries(viewer: Viewer) {
  return (await visibleLibraries(viewer)).map(listItem);
}

/** The library if `viewer` may see it at all; 404 otherwise (never says whether it exists). */
export async function getLibrary(viewer: Viewer, libraryId: number) {
  const [row] = await db()
    .select({ lib: libraries, ownerName: workspaces.name })
    .from(libraries)
    .innerJoin(workspaces, eq(workspaces.id, libraries.workspaceId))
    .where(eq(libraries.id, libraryId));
  const access = row && !row.lib.archivedAt ? accessTo(viewer, row.lib) : null;
  if (!row || !access) throw data("No such library in your reach.", { status: 404 });
  return { ...row.lib, ownerName: row.ownerName, access };
}

/** For writes: the library must belong to the viewer's workspace and the role must allow `library.write`. */
export async function getOwnLibraryForWrite(viewer: Viewer, libraryId: number) {
  const lib = await getLibrary(viewer, libraryId);
  if (lib.access !== "owner") throw data("No such library in your reach.", { status: 404 });
  if (!can(viewer.role, "library.write")) throw data(`Your role (${viewer.role}) cannot change libraries.`, { status: 403 });
  return lib;
}

export async function createLibrary(viewer: Viewer, input: { name: string; description: string }) {
  const [{ id }] = await db()
    .insert(libraries)
    .values({ workspaceId: viewer.workspace.id, name: input.name, description: input.description, createdBy: viewer.userId || null })
    .$returningId();
  return id;
}

export async function updateLibrary(viewer: Viewer, libraryId: number, input: { name: string; description: string; visibility: Visibility }) {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  if (input.visibility !== lib.visibility && !can(viewer.role, "library.publish")) {
    throw data("Your role cannot change who sees this library.", { status: 403 });
  }
  await db().update(libraries).set(input).where(eq(libraries.id, lib.id));
}

export async function listRevisions(libraryId: number) {
  return db()
    .select()
    .from(libraryRevisions)
    .where(eq(libraryRevisions.libraryId, libraryId))
    .orderBy(desc(libraryRevisions.number));
}

// The analysis of a stored upload is pure and also runs in the mapping page's worker thread: it
// lives in upload-analysis.ts; the server and scripts reach it from here as before.
export { analyseStored, encodingOf, savedMappingFor, type StoredAnalysis } from "./upload-analysis";

const POINT_BATCH = 5000; // insertPoints (kept for the benchmark's comparison rows)

/**
 * Checks the mapping, analyses the upload (in the analysis worker when it is big: the main thread
 * never parses or validates a big file) and plans the import of its good curve sets. A mapping that
 * MappingSchema refuses throws v.ValiError; nothing to import throws UploadRejected.
 */
export async function prepareImport(viewer: Viewer, libraryId: number, uploadId: number, mapping: unknown) {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  if (mapping !== undefined) v.parse(MappingSchema, mapping);
  const [u] = await db()
    .select({ id: uploads.id, sizeBytes: uploads.sizeBytes })
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.libraryId, lib.id)));
  if (!u) throw data("No such upload in this library.", { status: 404 });
  const a = await analyseForImport(u, { mappingJson: lib.mappingJson, mapping });
  if (a.mappingRefused) throw new UploadRejected(`This mapping cannot be imported with: ${a.mappingRefused}.`);
  if (!a.plan) throw new UploadRejected("No curve in this file passed the checks; nothing to import.");
  return { lib, uploadId: u.id, plan: a.plan };
}

/**
 * Imports the good curve sets of an upload as a new revision, in one transaction: all of it or
 * none. Bad curve sets are skipped (counted). The mapping used is saved on the library. The import's
 * progress and end state are kept in `imports` (app/lib/libraries/import-progress.server.ts).
 */
export async function importUpload(
  viewer: Viewer,
  libraryId: number,
  uploadId: number,
  mapping: unknown,
  note = "",
  hooks: { beforeCommit?: () => Promise<void> } = {},
) {
  const { lib, plan } = await prepareImport(viewer, libraryId, uploadId, mapping);
  return runImport({ libraryId: lib.id, uploadId, userId: viewer.userId || null, plan, note }, hooks);
}

/** Multi-row INSERTs of curve points in batches on the transaction's connection. */
export async function insertPoints(conn: PoolConnection, rows: (number | null)[][]) {
  for (let i = 0; i < rows.length; i += POINT_BATCH) {
    const chunk = rows.slice(i, i + POINT_BATCH);
    const placeholders = chunk.map(() => "(?,?,?,?,?,?,?)").join(",");
    await conn.query(
      `INSERT INTO curve_points (curve_set_id, seq, flow, head, efficiency, power, npshr) VALUES ${placeholders}`,
      chunk.flat(),
    );
  }
}

export type LibraryCurveSet = {
  id: number;
  modelId: number;
  model: string;
  type: string;
  nominalSize: string;
  speed: number | null;
  impellerDiameter: number | null;
  /** What the model publishes across its curve sets (m, m, rpm; null when not given): the catalogue limits of the verdict. */
  impellerMin: number | null;
  impellerMax: number | null;
  ratedSpeed: number | null;
  /** The maker's minimum continuous flow of this curve set, m³/s, as imported (null: none recorded). */
  minFlow: number | null;
  points: { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null }[];
};

/**
 * The revision of a library whose curves `viewer` may read: the one asked for, else the current one; null
 * when the library has none yet. Refuses locked libraries (403: listed, never their curves) and a revision
 * of another library (404).
 */
async function readableRevision(viewer: Viewer, libraryId: number, revisionId?: number): Promise<number | null> {
  const lib = await getLibrary(viewer, libraryId);
  if (lib.access === "locked") throw data("This shared library opens with the Network plan.", { status: 403 });
  const rev = revisionId ?? lib.currentRevisionId;
  if (!rev) return null;
  const [r] = await db()
    .select({ id: libraryRevisions.id })
    .from(libraryRevisions)
    .where(and(eq(libraryRevisions.id, rev), eq(libraryRevisions.libraryId, lib.id)));
  if (!r) throw data("No such revision of this library.", { status: 404 });
  return rev;
}

/** Curves of a revision (default: current), every set with its points. Refuses locked libraries: listed, never their curves. */
export async function libraryCurves(viewer: Viewer, libraryId: number, revisionId?: number): Promise<LibraryCurveSet[]> {
  const rev = await readableRevision(viewer, libraryId, revisionId);
  return rev ? curvesOfRevisions([rev]) : [];
}

/**
 * Curve sets a page of GET /api/v1/libraries/:id/curves. Each set comes with its points: the invented
 * catalogue of app/test/big-library.ts (8 points a set) measures ~0.9 KB of JSON a set (api-paging.test.ts),
 * so a page is ~90 KB where a 10 000-set library was ~9 MB in one answer; published curves of up to ~30
 * points stay near 0.3 MB a page. A model has a handful to a dozen sets, so a page holds several whole
 * models, and a 10 000-set library is read in 100 requests. The models list (no points) keeps 50 models a page.
 */
export const CURVE_PAGE_SETS = 100;

/**
 * One page of a revision's curve sets with their points, in libraryCurves' order (model name, speed,
 * impeller largest first; id on a tie): only that page's sets and points are read. `revisionId` is the
 * revision answered (null: the library has none yet, one empty page).
 */
export async function libraryCurvesPage(viewer: Viewer, libraryId: number, opts: { revisionId?: number; page?: number | null; pageSize?: number } = {}) {
  const pageSize = opts.pageSize ?? CURVE_PAGE_SETS;
  const rev = await readableRevision(viewer, libraryId, opts.revisionId);
  const [{ total }] = rev ? await db().select({ total: count() }).from(curveSets).where(eq(curveSets.revisionId, rev)) : [{ total: 0 }];
  const { first, ...paging } = pageOf(total, pageSize, opts.page);
  const sets = rev && total > 0 ? await loadCurves([rev], { slice: { offset: first, limit: pageSize } }) : [];
  return { revisionId: rev, paging, curveSets: sets };
}

/**
 * Revisions never change once written, so each app process may keep the curves of recently used
 * revisions (a cache of immutable data: any other process rebuilds the same from the database): the 24
 * most recently used, one read per revision at a time, a failed read not kept.
 */
const revisionCache = promiseCache<number, LibraryCurveSet[]>({ max: 24 });
const cachedRevision = (revisionId: number) => revisionCache.get(revisionId, () => loadCurves([revisionId]));

export async function curvesOfRevisions(revisionIds: number[], curveSetIds?: number[]): Promise<LibraryCurveSet[]> {
  if (revisionIds.length === 0) return [];
  if (!curveSetIds) return (await Promise.all([...new Set(revisionIds)].map(cachedRevision))).flat();
  return loadCurves(revisionIds, { curveSetIds });
}

/** The curve sets of one model of a revision with their points (read afresh: a few rows, no need to keep the whole revision). */
export function modelCurves(revisionId: number, modelId: number): Promise<LibraryCurveSet[]> {
  return loadCurves([revisionId], { modelId });
}

/** Curve sets with their points, in one order everywhere (id last, so a page of `slice` is stable); `slice`: that part of the order only. */
async function loadCurves(
  revisionIds: number[],
  { curveSetIds, modelId, slice }: { curveSetIds?: number[]; modelId?: number; slice?: { offset: number; limit: number } } = {},
): Promise<LibraryCurveSet[]> {
  const query = db()
    .select({ set: curveSets, model: pumpModels })
    .from(curveSets)
    .innerJoin(pumpModels, eq(pumpModels.id, curveSets.modelId))
    .where(
      and(
        inArray(curveSets.revisionId, revisionIds),
        curveSetIds ? inArray(curveSets.id, curveSetIds) : undefined,
        modelId === undefined ? undefined : eq(curveSets.modelId, modelId),
      ),
    )
    .orderBy(asc(pumpModels.name), asc(curveSets.speed), desc(curveSets.impellerDiameter), asc(curveSets.id));
  const sets = await (slice ? query.limit(slice.limit).offset(slice.offset) : query);
  if (sets.length === 0) return [];
  const byId = new Map<number, LibraryCurveSet>();
  for (const s of sets) {
    byId.set(s.set.id, {
      id: s.set.id,
      modelId: s.model.id,
      model: s.model.name,
      type: s.model.type,
      nominalSize: s.model.nominalSize,
      speed: s.set.speed,
      impellerDiameter: s.set.impellerDiameter,
      impellerMin: s.model.impellerMin,
      impellerMax: s.model.impellerMax,
      ratedSpeed: s.model.ratedSpeed,
      minFlow: s.set.minFlow,
      points: [],
    });
  }
  const ids = [...byId.keys()];
  for (let i = 0; i < ids.length; i += 2000) {
    const pts = await db()
      .select()
      .from(curvePoints)
      .where(inArray(curvePoints.curveSetId, ids.slice(i, i + 2000)))
      .orderBy(asc(curvePoints.curveSetId), asc(curvePoints.seq));
    for (const p of pts) byId.get(p.curveSetId)!.points.push({ flow: p.flow, head: p.head, efficiency: p.efficiency, power: p.power, npshr: p.npshr });
  }
  return [...byId.values()];
}

/** Libraries whose curves `viewer` may search: own (as allowed) and shared ones the plan opens. */
export async function searchableRevisions(viewer: Viewer) {
  const list = await visibleLibraries(viewer);
  const open = list.filter((r) => r.access !== "locked" && r.lib.currentRevisionId != null).sort((a, b) => a.lib.id - b.lib.id);
  return {
    // own: the viewer's workspace's library (search prefers it when two libraries carry the same curve).
    open: open.map((r) => ({ libraryId: r.lib.id, name: r.lib.name, revisionId: r.lib.currentRevisionId!, own: r.access === "owner" })),
    locked: list.filter((r) => r.access === "locked").map(listItem),
  };
}

/** Deletes a library, or archives it when selections still refer to its curves (they keep their frozen copies). */
export async function deleteLibrary(viewer: Viewer, libraryId: number): Promise<"deleted" | "archived"> {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  if (!can(viewer.role, "library.publish")) throw data("Your role cannot delete libraries.", { status: 403 });
  const revs = (await db().select({ id: libraryRevisions.id }).from(libraryRevisions).where(eq(libraryRevisions.libraryId, lib.id))).map((r) => r.id);
  const used = revs.length ? await db().select({ id: selections.id }).from(selections).where(inArray(selections.revisionId, revs)).limit(1) : [];
  if (used.length) {
    await db().update(libraries).set({ archivedAt: new Date(), visibility: "private" }).where(eq(libraries.id, lib.id));
    return "archived";
  }
  await db().delete(libraries).where(eq(libraries.id, lib.id));
  return "deleted";
}

