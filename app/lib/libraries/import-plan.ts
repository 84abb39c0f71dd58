// What an import writes, worked out from the analysis of an upload — in the analysis worker for big
// files (app/lib/libraries/upload-analysis.server.ts), so the main thread never parses or validates them. Pure
// (no Node, no database). The plan is compact on purpose: points in one Float64Array (five doubles
// per point: flow, head, efficiency, power, npshr; NaN when absent), curve sets as typed arrays, one
// entry per model; it crosses to the main thread by transfer, not by copying 100 000 objects.
import { curveNameOfKey, type CurveSet, type Mapping } from "../import";
import { packedOf, POINT_WIDTH, PointStore } from "../import/packed";
import { minFlowFits } from "../import/min-flow";
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
  /** Per curve set: index into `models`, speed (rpm), impeller diameter (m) and the maker's minimum flow (m³/s), NaN when not given. */
  setModel: Int32Array;
  setSpeed: Float64Array;
  setImpeller: Float64Array;
  setMinFlow: Float64Array;
  /** Where each curve set's points start in `values` (in points; curve sets + 1 entries). */
  starts: Int32Array;
  values: Float64Array;
  points: number;
  /** Curve sets found but not written (flagged, or failing the write check below). */
  skipped: number;
  /**
   * The LOAD DATA lines of the curve sets and of the points (without the ids in front, see Lines),
   * when the analysis worker makes them: after it has sent the plan, so while the import's
   * transaction writes what comes before them; null when it could not. Absent: the writer makes
   * the same lines itself, a piece at a time (import-write.server.ts linesHere).
   */
  lines?: { sets: Promise<Lines | null>; points: Promise<Lines | null> };
};

/**
 * LOAD DATA lines as ASCII bytes without the ids that only the transaction knows, and where each line
 * ends (lines + 1 offsets, the first 0). The writer puts the ids in front (import-write.server.ts
 * withIds): a copy, not a number formatted, on the main thread.
 * - curve sets: "\tspeed\timpeller\tflow_min\tflow_max\thead_max\thead_min\tpoint_count\tmin_flow\n" (model id and revision id go in front);
 * - points: "\tseq\tflow\thead\tefficiency\tpower\tnpshr\n" (the curve set's id goes in front); \N when absent.
 */
export type Lines = { bytes: Uint8Array; ends: Int32Array };

/** Longest field: String() of a double has at most 24 characters ("-2.2250738585072014e-308"). */
const MAX_FIELD = 25;

/** Lines of `fields` numbers each (values: lines × fields, NaN for \N), each number after a tab, as bytes. */
function writeLines(values: Float64Array, fields: number): Lines {
  const count = values.length / fields;
  const ends = new Int32Array(count + 1);
  let bytes = new Uint8Array(Math.max(1024, values.length * 12));
  let o = 0;
  // the characters of each number straight into the bytes (no line strings to join and encode)
  for (let k = 0, at = 0; k < count; k++) {
    if (o + fields * MAX_FIELD + 1 > bytes.length) {
      const grown = new Uint8Array(bytes.length * 2);
      grown.set(bytes.subarray(0, o));
      bytes = grown;
    }
    for (let f = 0; f < fields; f++, at++) {
      const x = values[at];
      bytes[o++] = 9; // tab
      if (x === x) {
        const text = String(x);
        for (let j = 0; j < text.length; j++) bytes[o++] = text.charCodeAt(j);
      } else {
        bytes[o++] = 92; // \N: NULL
        bytes[o++] = 78;
      }
    }
    bytes[o++] = 10; // newline
    ends[k + 1] = o;
  }
  return { bytes: bytes.slice(0, o), ends };
}

/** The curve sets' lines: speed, impeller, flow range, head range (max, min) of the points as planned, point count, the maker's minimum flow. */
export function setLines(plan: Pick<ImportPlan, "starts" | "values" | "setSpeed" | "setImpeller" | "setMinFlow">): Lines {
  const sets = plan.starts.length - 1;
  const v = plan.values;
  const fields = new Float64Array(sets * SET_FIELDS);
  for (let i = 0; i < sets; i++) {
    const a = plan.starts[i], b = plan.starts[i + 1];
    let lo = Infinity, hi = -Infinity;
    for (let k = a; k < b; k++) {
      const h = v[k * POINT_WIDTH + 1];
      if (h < lo) lo = h;
      if (h > hi) hi = h;
    }
    const o = i * SET_FIELDS;
    fields[o] = plan.setSpeed[i];
    fields[o + 1] = plan.setImpeller[i];
    fields[o + 2] = v[a * POINT_WIDTH];
    fields[o + 3] = v[(b - 1) * POINT_WIDTH];
    fields[o + 4] = hi;
    fields[o + 5] = lo;
    fields[o + 6] = b - a;
    fields[o + 7] = plan.setMinFlow[i];
  }
  return writeLines(fields, SET_FIELDS);
}

/** Numbers per curve set line (setLines). */
const SET_FIELDS = 8;

/** The points' lines: seq within the curve set, then the five values. */
export function pointLines(plan: Pick<ImportPlan, "starts" | "values">): Lines {
  const v = plan.values;
  const starts = plan.starts;
  const points = starts[starts.length - 1];
  const fields = new Float64Array(points * 6);
  for (let i = 0; i < starts.length - 1; i++)
    for (let k = starts[i]; k < starts[i + 1]; k++) {
      const o = k * 6;
      const at = k * POINT_WIDTH;
      fields[o] = k - starts[i];
      for (let f = 0; f < POINT_WIDTH; f++) fields[o + 1 + f] = v[at + f];
    }
  return writeLines(fields, 6);
}

/** Curve sets g to h − 1 of a plan as a plan of their own (starts from 0; the arrays are views, not copies): their lines alone. */
export function planPart(plan: PlanPart, g: number, h: number): PlanPart {
  const a = plan.starts[g];
  return {
    starts: plan.starts.slice(g, h + 1).map((k) => k - a),
    values: plan.values.subarray(a * POINT_WIDTH, plan.starts[h] * POINT_WIDTH),
    setSpeed: plan.setSpeed.subarray(g, h),
    setImpeller: plan.setImpeller.subarray(g, h),
    setMinFlow: plan.setMinFlow.subarray(g, h),
  };
}

/** What the LOAD DATA lines are made from. */
export type PlanPart = Pick<ImportPlan, "starts" | "values" | "setSpeed" | "setImpeller" | "setMinFlow">;

/** The typed arrays of a plan (to transfer between threads). */
export const planBuffers = (p: ImportPlan): ArrayBuffer[] =>
  [p.setModel, p.setSpeed, p.setImpeller, p.setMinFlow, p.starts, p.values].map((a) => a.buffer as ArrayBuffer);

const finiteOrAbsent = (x: number | undefined) => x === undefined || (Number.isFinite(x) && x >= 0);

/**
 * Re-check of what is about to be written (finite SI values, ≥ 3 points, rising flow, a maker's minimum flow below the last): the same rules
 * as the import core's CurveSetSchema, written out because this runs over every point of big files.
 */
export function writable(c: Pick<CurveSet, "model" | "points" | "minFlow">): boolean {
  if (!c.model.trim() || c.points.length < 3) return false;
  let prev = -Infinity;
  for (const p of c.points) {
    if (!(Number.isFinite(p.flow) && p.flow >= 0 && p.flow > prev && Number.isFinite(p.head) && p.head >= 0)) return false;
    if (!finiteOrAbsent(p.efficiency) || (p.efficiency ?? 0) > 1 || !finiteOrAbsent(p.power) || !finiteOrAbsent(p.npshr)) return false;
    prev = p.flow;
  }
  return c.minFlow === undefined || minFlowFits(c.minFlow, prev); // the maker's minimum flow below the last flow (min-flow.ts)
}

/** writable() on curve set `s` of a point store (POINT_WIDTH doubles per point, NaN when absent). */
function writableInStore(store: PointStore, s: number): boolean {
  const a = store.starts[s], b = store.end(s);
  if (!store.sets[s].model.trim() || b - a < 3) return false;
  const v = store.values;
  let prev = -Infinity;
  for (let k = a; k < b; k++) {
    const o = k * POINT_WIDTH;
    const flow = v[o], head = v[o + 1], eff = v[o + 2], power = v[o + 3], npshr = v[o + 4];
    if (!(Number.isFinite(flow) && flow >= 0 && flow > prev && Number.isFinite(head) && head >= 0)) return false;
    if (eff === eff && !(Number.isFinite(eff) && eff >= 0 && eff <= 1)) return false;
    if ((power === power && !(Number.isFinite(power) && power >= 0)) || (npshr === npshr && !(Number.isFinite(npshr) && npshr >= 0))) return false;
    prev = flow;
  }
  const min = store.sets[s].minFlow;
  return min === undefined || minFlowFits(min, prev);
}

/** The ok and writable curve sets of a full-path result in a point store (the fast path's results come with one). */
function storeOfGood(curveSets: CurveSet[]): PointStore {
  const ok = curveSets.filter((c) => c.ok && writable(c));
  const store = new PointStore(ok.reduce((n, c) => n + c.points.length, 0));
  for (const c of ok) {
    store.open(c);
    for (const p of c.points) store.add(p.flow, p.head, p.efficiency ?? NaN, p.power ?? NaN, p.npshr ?? NaN);
  }
  return store;
}

/** The plan for the good curve sets of `analysis`, or null when none is good (nothing to import). */
export function planImport(analysis: Pick<StoredAnalysis, "mapping" | "result">): ImportPlan | null {
  // fast path: every curve set ok, its points already in typed arrays (never built as objects)
  const packed = packedOf(analysis.result);
  const store = packed ?? storeOfGood(analysis.result.curveSets);
  const total = packed ? packed.sets.length : analysis.result.curveSets.length;
  // storeOfGood keeps only writable sets; a fast-path store is checked here, on its typed arrays
  const good: number[] = [];
  for (let s = 0; s < store.sets.length; s++) if (!packed || writableInStore(store, s)) good.push(s);
  if (good.length === 0) return null;
  const modelIndex = new Map<string, number>();
  const models: PlannedModel[] = [];
  const setModel = new Int32Array(good.length);
  const setSpeed = new Float64Array(good.length);
  const setImpeller = new Float64Array(good.length);
  const setMinFlow = new Float64Array(good.length);
  const starts = new Int32Array(good.length + 1);
  let points = 0;
  for (const s of good) points += store.end(s) - store.starts[s];
  // the plan's own copy (its buffer is moved to the main thread): the store's values at once when all are kept
  const all = points === store.count;
  const values = all ? store.values.slice(0, points * POINT_WIDTH) : new Float64Array(points * POINT_WIDTH);
  let k = 0;
  good.forEach((s, i) => {
    const c = store.sets[s];
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
    setMinFlow[i] = c.minFlow ?? NaN;
    starts[i] = k;
    const a = store.starts[s], b = store.end(s);
    if (!all) values.set(store.values.subarray(a * POINT_WIDTH, b * POINT_WIDTH), k * POINT_WIDTH);
    k += b - a;
  });
  starts[good.length] = k;
  return { mapping: analysis.mapping, models, setModel, setSpeed, setImpeller, setMinFlow, starts, values, points, skipped: total - good.length };
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
