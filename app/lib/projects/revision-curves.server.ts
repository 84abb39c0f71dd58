// The curve sets of one library revision as the search keeps them. Revisions never change once
// written, so each is read from the database once per process (while kept) and held compactly:
// names in arrays, numbers and points in typed arrays (no object per point or set, so a catalogue of
// 100 000 curve sets costs little heap and little garbage-collection time), with the engine's
// prepared index over them. The few sets a search judges and shows are made back into ordinary
// `LibraryCurveSet` objects on demand, equal to what `curvesOfRevisions` reads.
import { asc, desc, eq } from "drizzle-orm";
import { db, getPool } from "@db/client.server";
import { curveSets, pumpModels } from "@db/schema";
import { prepareSearchIndex, type CurveSet as EngineCurveSet, type SearchIndex } from "~/engine";
import { toPumpPoints } from "./hydraulics";
import type { LibraryCurveSet } from "../libraries";
import { promiseCache } from "../shared/promise-cache";

/** NaN stands for a missing value (MariaDB never stores NaN). */
export type RevisionCurves = {
  revisionId: number;
  count: number;
  id: Float64Array;
  modelId: Float64Array;
  model: string[];
  type: string[];
  nominalSize: string[];
  speed: Float64Array;
  impellerDiameter: Float64Array;
  impellerMin: Float64Array;
  impellerMax: Float64Array;
  ratedSpeed: Float64Array;
  /** The maker's minimum continuous flow, m³/s (NaN: none recorded). */
  minFlow: Float64Array;
  /** Set i's points are [off[i], off[i+1]) of the point columns, in their stored order. */
  off: Int32Array;
  flow: Float64Array;
  head: Float64Array;
  efficiency: Float64Array;
  power: Float64Array;
  npshr: Float64Array;
  /** Curve set id → position. */
  position: Map<number, number>;
  /** The engine's index over the sets in this order (it leaves out sets it rejects)… */
  index: SearchIndex;
  /** …so for each index position, the set's position here. */
  indexed: Int32Array;
};

/** The engine's view of a stored curve set (the same for the kept and the freshly read path). */
export function toEngineSet(s: LibraryCurveSet): EngineCurveSet {
  return {
    id: String(s.id),
    label: s.model,
    curve: { points: toPumpPoints(s.points), speed: s.speed ?? undefined, impellerDiameter: s.impellerDiameter ?? undefined, riseTolerance: 1 },
  };
}

const orNull = (x: number) => (Number.isNaN(x) ? null : x);
const orNaN = (x: number | null | undefined) => (x == null ? NaN : x);

/** Set i of a kept revision as an ordinary curve set. */
export function curveSetAt(r: RevisionCurves, i: number): LibraryCurveSet {
  const points: LibraryCurveSet["points"] = [];
  for (let k = r.off[i]; k < r.off[i + 1]; k++) {
    points.push({ flow: r.flow[k], head: r.head[k], efficiency: orNull(r.efficiency[k]), power: orNull(r.power[k]), npshr: orNull(r.npshr[k]) });
  }
  return {
    id: r.id[i],
    modelId: r.modelId[i],
    model: r.model[i],
    type: r.type[i],
    nominalSize: r.nominalSize[i],
    speed: orNull(r.speed[i]),
    impellerDiameter: orNull(r.impellerDiameter[i]),
    impellerMin: orNull(r.impellerMin[i]),
    impellerMax: orNull(r.impellerMax[i]),
    ratedSpeed: orNull(r.ratedSpeed[i]),
    minFlow: orNull(r.minFlow[i]),
    points,
  };
}

/** Reads one revision: its sets in `curvesOfRevisions`' order (model name, speed, largest impeller first), then every point. */
export async function readRevisionCurves(revisionId: number): Promise<RevisionCurves> {
  const sets = await db()
    .select({
      id: curveSets.id, modelId: pumpModels.id, model: pumpModels.name, type: pumpModels.type, nominalSize: pumpModels.nominalSize,
      speed: curveSets.speed, impellerDiameter: curveSets.impellerDiameter, impellerMin: pumpModels.impellerMin, impellerMax: pumpModels.impellerMax,
      ratedSpeed: pumpModels.ratedSpeed, pointCount: curveSets.pointCount, minFlow: curveSets.minFlow,
    })
    .from(curveSets)
    .innerJoin(pumpModels, eq(pumpModels.id, curveSets.modelId))
    .where(eq(curveSets.revisionId, revisionId))
    .orderBy(asc(pumpModels.name), asc(curveSets.speed), desc(curveSets.impellerDiameter));
  const n = sets.length;
  const names = new Map<string, string>(); // one string per distinct name, type and size
  const intern = (s: string) => names.get(s) ?? (names.set(s, s), s);
  const r: Omit<RevisionCurves, "off" | "flow" | "head" | "efficiency" | "power" | "npshr" | "index" | "indexed"> = {
    revisionId, count: n, id: new Float64Array(n), modelId: new Float64Array(n), model: new Array(n), type: new Array(n), nominalSize: new Array(n),
    speed: new Float64Array(n), impellerDiameter: new Float64Array(n), impellerMin: new Float64Array(n), impellerMax: new Float64Array(n), ratedSpeed: new Float64Array(n),
    minFlow: new Float64Array(n), position: new Map(),
  };
  sets.forEach((s, i) => {
    r.id[i] = s.id; r.modelId[i] = s.modelId; r.model[i] = intern(s.model); r.type[i] = intern(s.type); r.nominalSize[i] = intern(s.nominalSize);
    r.speed[i] = orNaN(s.speed); r.impellerDiameter[i] = orNaN(s.impellerDiameter); r.impellerMin[i] = orNaN(s.impellerMin); r.impellerMax[i] = orNaN(s.impellerMax);
    r.ratedSpeed[i] = orNaN(s.ratedSpeed); r.minFlow[i] = orNaN(s.minFlow);
    r.position.set(s.id, i);
  });
  // Points straight from the pool as arrays (hundreds of thousands of rows: no object per row), in set and seq order.
  const rows = (await getPool().query(
    {
      sql: "SELECT p.curve_set_id, p.flow, p.head, p.efficiency, p.power, p.npshr FROM curve_points p JOIN curve_sets s ON s.id = p.curve_set_id WHERE s.revision_id = ? ORDER BY p.curve_set_id, p.seq",
      rowsAsArray: true,
    },
    [revisionId],
  )) as [number, number, number, number | null, number | null, number | null][];
  const counts = new Int32Array(n);
  for (const row of rows) counts[r.position.get(row[0])!]++;
  const off = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) off[i + 1] = off[i] + counts[i];
  const m = rows.length;
  const flow = new Float64Array(m), head = new Float64Array(m), efficiency = new Float64Array(m), power = new Float64Array(m), npshr = new Float64Array(m);
  const at = off.slice(0, n);
  for (const row of rows) {
    const k = at[r.position.get(row[0])!]++;
    flow[k] = row[1]; head[k] = row[2]; efficiency[k] = orNaN(row[3]); power[k] = orNaN(row[4]); npshr[k] = orNaN(row[5]);
  }
  const kept = { ...r, off, flow, head, efficiency, power, npshr, index: undefined as unknown as SearchIndex, indexed: new Int32Array(0) };
  // The engine's index, prepared from the same objects the freshly read path gives it.
  const index = prepareSearchIndex(Array.from({ length: n }, (_, i) => toEngineSet(curveSetAt(kept, i))));
  kept.index = index;
  kept.indexed = Int32Array.from(index.ids, (id) => r.position.get(Number(id))!);
  return kept;
}

/**
 * Kept revisions, least recently used dropped first past 300 000 curve sets in all or 64 revisions (a revision in
 * use stays reachable from its search). 100 000 sets open (10 revisions of 10 000) fit with room to spare; a single
 * revision of more than 300 000 sets is still read and searched, but not kept: each search reads it again.
 */
const revisions = promiseCache<number, RevisionCurves>({ max: 64, maxSize: 300_000, sizeOf: (r) => r.count });

export function revisionCurves(revisionId: number): Promise<RevisionCurves> {
  return revisions.get(revisionId, () => readRevisionCurves(revisionId));
}

export const keptRevisions = () => revisions.keys();
export const clearKeptRevisions = () => revisions.clear();
