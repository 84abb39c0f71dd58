// Pump models of a library's current revision: the filtered list (library page, API) and one model
// with its curves, both through the library's access rules.
import { asc, desc, eq } from "drizzle-orm";
import { data } from "react-router";
import { db } from "@db/client.server";
import { curveSets, libraryRevisions, pumpModels } from "@db/schema";
import type { Viewer } from "../auth/viewer.server";
import { getLibrary, modelCurves } from "./libraries.server";
import { promiseCache } from "../shared/promise-cache";

/** Models listed per page on a library's page (a catalogue-sized library has thousands). */
export const MODEL_PAGE_ROWS = 50;

export type ModelFilters = { q?: string; type?: string; size?: string; speed?: number; flow?: number; head?: number; sort?: "name" | "flow" | "head" };

export type ListedModel = Readonly<{
  id: number;
  name: string;
  type: string;
  size: string;
  curves: readonly Readonly<{ id: number; speed: number | null; impellerDiameter: number | null; flowMax: number; headMax: number; points: number }>[];
}>;

/** A revision's models with their curve sets (no points), by name, fastest and largest first: read once. */
async function readRevisionModels(revisionId: number): Promise<readonly ListedModel[]> {
  const rows = await db()
    .select({
      m: { id: pumpModels.id, name: pumpModels.name, type: pumpModels.type, nominalSize: pumpModels.nominalSize },
      s: { id: curveSets.id, speed: curveSets.speed, impellerDiameter: curveSets.impellerDiameter, flowMax: curveSets.flowMax, headMax: curveSets.headMax, pointCount: curveSets.pointCount },
    })
    .from(pumpModels)
    .innerJoin(curveSets, eq(curveSets.modelId, pumpModels.id))
    .where(eq(pumpModels.revisionId, revisionId))
    .orderBy(asc(pumpModels.name), desc(curveSets.speed), desc(curveSets.impellerDiameter));
  const byModel = new Map<number, { id: number; name: string; type: string; size: string; curves: ListedModel["curves"][number][] }>();
  for (const r of rows) {
    const m = byModel.get(r.m.id) ?? { id: r.m.id, name: r.m.name, type: r.m.type, size: r.m.nominalSize, curves: [] };
    m.curves.push(Object.freeze({ id: r.s.id, speed: r.s.speed, impellerDiameter: r.s.impellerDiameter, flowMax: r.s.flowMax, headMax: r.s.headMax, points: r.s.pointCount }));
    byModel.set(r.m.id, m);
  }
  // Frozen: the same objects serve every request until the revision is dropped from the cache.
  return Object.freeze([...byModel.values()].map((m) => Object.freeze({ ...m, curves: Object.freeze(m.curves) })));
}

/**
 * Revisions never change once written, so the listed models of recently viewed revisions are kept
 * (a catalogue of 10 000 curve sets took ~70 ms a view to read and group; any other process reads
 * the same from the database). Least recently used dropped first past 32 revisions or 200 000 curve
 * sets in all; a failed read is not kept.
 */
const revisionModels = promiseCache<number, readonly ListedModel[]>({ max: 32, maxSize: 200_000, sizeOf: (list) => list.reduce((n, m) => n + m.curves.length, 0) });

/** Models of a library's current revision with their curve sets (no points), filtered and sorted. */
export async function listModels(viewer: Viewer, libraryId: number, f: ModelFilters = {}): Promise<ListedModel[]> {
  const lib = await getLibrary(viewer, libraryId);
  if (lib.access === "locked") throw data("This shared library opens with the Network plan.", { status: 403 });
  return lib.currentRevisionId ? revisionModelList(lib.currentRevisionId, f) : [];
}

/** The models of a revision, filtered and sorted: for a caller that has already opened its library for the viewer. */
export async function revisionModelList(revisionId: number, f: ModelFilters = {}): Promise<ListedModel[]> {
  const all = await revisionModels.get(revisionId, () => readRevisionModels(revisionId));
  const has = (a: string, b?: string) => !b || a.toLowerCase().includes(b.toLowerCase());
  let list = all.filter(
    (m) =>
      has(m.name, f.q) &&
      has(m.type, f.type) &&
      has(m.size, f.size) &&
      (!f.speed || m.curves.some((c) => c.speed != null && Math.abs(c.speed - f.speed!) / f.speed! < 0.1)) &&
      // "Covers the duty": some curve reaches the flow, and its shutoff head is above the head asked.
      (!f.flow || m.curves.some((c) => c.flowMax >= f.flow!)) &&
      (!f.head || m.curves.some((c) => c.headMax >= f.head! && (!f.flow || c.flowMax >= f.flow))),
  );
  const maxOf = (m: (typeof list)[number], k: "flowMax" | "headMax") => Math.max(...m.curves.map((c) => c[k]));
  if (f.sort === "flow") list = list.sort((a, b) => maxOf(b, "flowMax") - maxOf(a, "flowMax"));
  if (f.sort === "head") list = list.sort((a, b) => maxOf(b, "headMax") - maxOf(a, "headMax"));
  return list;
}

/** One model with its curves (points included), through the same access rules as its library. */
export async function getModel(viewer: Viewer, modelId: number) {
  const [row] = await db()
    .select({ m: pumpModels, libraryId: libraryRevisions.libraryId, revision: libraryRevisions.number })
    .from(pumpModels)
    .innerJoin(libraryRevisions, eq(libraryRevisions.id, pumpModels.revisionId))
    .where(eq(pumpModels.id, modelId));
  if (!row) throw data("No such pump model in your reach.", { status: 404 });
  const lib = await getLibrary(viewer, row.libraryId);
  if (lib.access === "locked") throw data("This shared library opens with the Network plan.", { status: 403 });
  const curves = await modelCurves(row.m.revisionId, row.m.id);
  return { model: row.m, library: { id: lib.id, name: lib.name, owner: lib.ownerName }, revision: row.revision, curves };
}
