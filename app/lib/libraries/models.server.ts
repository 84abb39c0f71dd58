// Pump models of a library's current revision: the filtered list (library page, API) and one model
// with its curves, both through the library's access rules.
import { asc, desc, eq } from "drizzle-orm";
import { data } from "react-router";
import { db } from "@db/client.server";
import { curveSets, libraryRevisions, pumpModels } from "@db/schema";
import type { Viewer } from "../auth/viewer.server";
import { curvesOfRevisions, getLibrary } from "./libraries.server";

export type ModelFilters = { q?: string; type?: string; size?: string; speed?: number; flow?: number; head?: number; sort?: "name" | "flow" | "head" };

/** Models of a library's current revision with their curve sets (no points), filtered and sorted. */
export async function listModels(viewer: Viewer, libraryId: number, f: ModelFilters = {}) {
  const lib = await getLibrary(viewer, libraryId);
  if (lib.access === "locked") throw data("This shared library opens with the Network plan.", { status: 403 });
  if (!lib.currentRevisionId) return [];
  const rows = await db()
    .select({ m: pumpModels, s: curveSets })
    .from(pumpModels)
    .innerJoin(curveSets, eq(curveSets.modelId, pumpModels.id))
    .where(eq(pumpModels.revisionId, lib.currentRevisionId))
    .orderBy(asc(pumpModels.name), desc(curveSets.speed), desc(curveSets.impellerDiameter));
  const byModel = new Map<number, { id: number; name: string; type: string; size: string; curves: { id: number; speed: number | null; impellerDiameter: number | null; flowMax: number; headMax: number; points: number }[] }>();
  for (const r of rows) {
    const m = byModel.get(r.m.id) ?? { id: r.m.id, name: r.m.name, type: r.m.type, size: r.m.nominalSize, curves: [] };
    m.curves.push({ id: r.s.id, speed: r.s.speed, impellerDiameter: r.s.impellerDiameter, flowMax: r.s.flowMax, headMax: r.s.headMax, points: r.s.pointCount });
    byModel.set(r.m.id, m);
  }
  const has = (a: string, b?: string) => !b || a.toLowerCase().includes(b.toLowerCase());
  let list = [...byModel.values()].filter(
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
  const curves = (await curvesOfRevisions([row.m.revisionId])).filter((c) => c.modelId === row.m.id);
  return { model: row.m, library: { id: lib.id, name: lib.name, owner: lib.ownerName }, revision: row.revision, curves };
}
