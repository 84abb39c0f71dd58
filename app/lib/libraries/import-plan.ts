// What an import writes, worked out from the analysis of an upload — in the analysis worker for big
// files (app/lib/libraries/upload-analysis.server.ts), so the main thread never parses or validates them. Pure
// (no Node, no database). The plan is compact on purpose: points in one Float64Array (five doubles
// per point: flow, head, efficiency, power, npshr; NaN when absent), curve sets as typed arrays, one
// entry per model; it crosses to the main thread by transfer, not by copying 100 000 objects.
import { curveNameOfKey, type CurveSet, type Mapping } from "../import";
import type { StoredAnalysis } from "./upload-analysis";

export type PlannedModel = {
  name: string;
  type: string;
  size: string;
  notes: string;
  ratedSpeed: number | null;
  impellerMin: number | null;
  impellerMax: number | null;
};

export type ImportPlan = {
  /** The mapping applied (saved on the library with the import). */
  mapping: Mapping;
  models: PlannedModel[];
  /** Per curve set: index into `models`, speed (rpm) and impeller diameter (m), NaN when not given. */
  setModel: Int32Array;
  setSpeed: Float64Array;
  setImpeller: Float64Array;
  /** Where each curve set's points start in `values` (in points; curve sets + 1 entries). */
  starts: Int32Array;
  values: Float64Array;
  points: number;
  /** Curve sets found but not written (flagged, or failing the write check below). */
  skipped: number;
};

/** The typed arrays of a plan (to transfer between threads). */
export const planBuffers = (p: ImportPlan): ArrayBuffer[] =>
  [p.setModel, p.setSpeed, p.setImpeller, p.starts, p.values].map((a) => a.buffer as ArrayBuffer);

const finiteOrAbsent = (x: number | undefined) => x === undefined || (Number.isFinite(x) && x >= 0);

/**
 * Re-check of what is about to be written (finite SI values, ≥ 3 points, rising flow): the same rules
 * as the import core's CurveSetSchema, written out because this runs over every point of big files.
 */
export function writable(c: Pick<CurveSet, "model" | "points">): boolean {
  if (!c.model.trim() || c.points.length < 3) return false;
  let prev = -Infinity;
  for (const p of c.points) {
    if (!(Number.isFinite(p.flow) && p.flow >= 0 && p.flow > prev && Number.isFinite(p.head) && p.head >= 0)) return false;
    if (!finiteOrAbsent(p.efficiency) || (p.efficiency ?? 0) > 1 || !finiteOrAbsent(p.power) || !finiteOrAbsent(p.npshr)) return false;
    prev = p.flow;
  }
  return true;
}

/** The plan for the good curve sets of `analysis`, or null when none is good (nothing to import). */
export function planImport(analysis: Pick<StoredAnalysis, "mapping" | "result">): ImportPlan | null {
  const all = analysis.result.curveSets;
  const good = all.filter((c) => c.ok && writable(c));
  if (good.length === 0) return null;
  const modelIndex = new Map<string, number>();
  const models: PlannedModel[] = [];
  const setModel = new Int32Array(good.length);
  const setSpeed = new Float64Array(good.length);
  const setImpeller = new Float64Array(good.length);
  const starts = new Int32Array(good.length + 1);
  let points = 0;
  for (const c of good) points += c.points.length;
  const values = new Float64Array(points * 5);
  let k = 0;
  good.forEach((c, i) => {
    let m = modelIndex.get(c.model);
    if (m === undefined) {
      m = models.length;
      modelIndex.set(c.model, m);
      // type, size and notes of a model: from its first curve set (as before)
      models.push({ name: c.model, type: c.type ?? "", size: c.size ?? "", notes: c.notes ?? "", ratedSpeed: null, impellerMin: null, impellerMax: null });
    }
    const model = models[m];
    if (c.speed != null) model.ratedSpeed = Math.max(model.ratedSpeed ?? -Infinity, c.speed);
    if (c.impellerDiameter != null) {
      model.impellerMin = Math.min(model.impellerMin ?? Infinity, c.impellerDiameter);
      model.impellerMax = Math.max(model.impellerMax ?? -Infinity, c.impellerDiameter);
    }
    setModel[i] = m;
    setSpeed[i] = c.speed ?? NaN;
    setImpeller[i] = c.impellerDiameter ?? NaN;
    starts[i] = k;
    for (const p of c.points) {
      const o = k * 5;
      values[o] = p.flow;
      values[o + 1] = p.head;
      values[o + 2] = p.efficiency ?? NaN;
      values[o + 3] = p.power ?? NaN;
      values[o + 4] = p.npshr ?? NaN;
      k++;
    }
  });
  starts[good.length] = k;
  return { mapping: analysis.mapping, models, setModel, setSpeed, setImpeller, starts, values, points, skipped: all.length - good.length };
}

/** What the API answers about an upload: the mapping used, what was read, and every problem by line and column. */
export function uploadReport(analysis: StoredAnalysis) {
  return {
    encoding: analysis.decoded.encoding,
    title: analysis.title,
    mapping: analysis.mapping,
    stats: analysis.result.stats,
    problems: analysis.result.problems.map((p) => ({ ...p, curve: p.curveKey ? curveNameOfKey(p.curveKey) : null })),
  };
}
export type UploadReport = ReturnType<typeof uploadReport>;
