/**
 * The prepared index of the duty-point search (search.ts): every curve set validated and
 * interpolated once, packed into a few typed arrays, with an envelope (flow range, largest
 * head) per set. `joinSearchIndexes` joins prepared indexes (e.g. one per library revision)
 * into one without preparing any curve again.
 */
import { EngineInputError, requirePositive } from "./errors.ts";
import { evalCubic, fritschCarlsonTangents, hermiteIn, monotoneCubic, type MonotoneCubic } from "./interp.ts";
import { checkPumpPoints, DEFAULT_POWER_DENSITY, RISE_TOLERANCE_DEFAULT, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { npshrFlow } from "./npshrEnds.ts";
import { G0 } from "./units.ts";

/** A curve set to search: one pump model at one speed and impeller diameter. */
export interface CurveSet {
  /** Id returned with the candidate (e.g. the database id). */
  id: string;
  /** Display label (model, speed, diameter). */
  label?: string;
  curve: PumpCurve | PumpCurveInput;
}

/** Curves of one column for all sets, packed end to end (knots x, values y, tangents m). */
export interface Packed {
  /** Set i's knots are [off[i], off[i+1]); an empty range means the set lacks this column. */
  off: Int32Array;
  x: Float64Array;
  y: Float64Array;
  m: Float64Array;
}

/**
 * Prepared index (reuse it across searches). Curves are packed into a few typed arrays so a
 * large library costs little memory and garbage collection; the per-set scalars below use −1
 * for "not given".
 */
export interface SearchIndex {
  count: number;
  ids: string[];
  labels: string[];
  /** m³/s */
  flowMin: Float64Array;
  /** m³/s */
  flowMax: Float64Array;
  /** m */
  headMax: Float64Array;
  /** m³/s, −1 without BEP */
  bepFlow: Float64Array;
  /** rpm, −1 if not given */
  speed: Float64Array;
  /** m, −1 if not given */
  diameter: Float64Array;
  /** m, −1 if not given */
  minDiameter: Float64Array;
  /** 1 where the head rises above its first head anywhere (PumpCurve `drooping`: a duty may lie on both sides of a hump, search.ts scans for a bracket). */
  drooping: Uint8Array;
  head: Packed;
  /** Efficiency (given, or derived from power at the power column's points). */
  eff: Packed;
  npshr: Packed;
  /** Sets that failed validation, with the reason. */
  rejected: { id: string; reason: string }[];
}

/** Growable Float64Array (doubling), to pack many small curves without per-curve objects. */
class DoubleBuffer {
  buf = new Float64Array(1024);
  length = 0;
  push(v: number) {
    if (this.length === this.buf.length) {
      const next = new Float64Array(this.buf.length * 2);
      next.set(this.buf);
      this.buf = next;
    }
    this.buf[this.length++] = v;
  }
  done(): Float64Array {
    return this.buf.slice(0, this.length);
  }
}

class PackBuilder {
  off: number[] = [0];
  x = new DoubleBuffer();
  y = new DoubleBuffer();
  m = new DoubleBuffer();
  add(c: MonotoneCubic | null) {
    if (c) for (let k = 0; k < c.x.length; k++) { this.x.push(c.x[k]); this.y.push(c.y[k]); this.m.push(c.m[k]); }
    this.off.push(this.x.length);
  }
  /** Start of a curve whose knots are pushed next. */
  begin(): number { return this.x.length; }
  push(x: number, y: number) { this.x.push(x); this.y.push(y); this.m.push(0); }
  /**
   * Ends the curve started at `start`: Fritsch-Carlson tangents in place. Fewer than 2 knots: no curve, as pumpCurve.ts
   * `column` — a single published NPSHr point is judged nowhere, so the search never leaves a pump out, nor passes it, on
   * it, as the workbench does not judge it (decision "npshone").
   */
  end(start: number) {
    const n = this.x.length - start;
    if (n < 2) { this.x.length = start; this.y.length = start; this.m.length = start; }
    else fritschCarlsonTangents(this.x.buf, this.y.buf, this.m.buf, start, n);
    this.off.push(this.x.length);
  }
  build(): Packed {
    return { off: Int32Array.from(this.off), x: this.x.done(), y: this.y.done(), m: this.m.done() };
  }
}

/**
 * Monotone cubic (Fritsch-Carlson, see interp.ts) of set i in a packed column; null outside or absent.
 * @param p packed column (SI: knots m³/s, values in the column's unit)
 * @param i set position in the index (count)
 * @param t flow, m³/s
 */
export function evalPacked(p: Packed, i: number, t: number): number | null {
  const lo = p.off[i];
  const hi = p.off[i + 1] - 1;
  if (hi < lo) return null;
  const x = p.x;
  if (!(t >= x[lo] && t <= x[hi])) return null;
  if (hi === lo) return p.y[lo];
  return hermiteIn(x, p.y, p.m, lo, hi, t);
}

/**
 * NPSHr of set i at a flow, m; null outside its NPSHr column or without one. A flow within 1 part in 10⁸ of the column's
 * first or last published flow reads the NPSHr there: the workbench's rounding allowance (pumpCurve.ts
 * npshrEnds.ts `NPSHR_END_ROUNDING`, pumpCurve.ts `npshrAt`), so the search leaves out, or keeps, a pump at the same flows the workbench judges.
 * @param p the packed NPSHr column (SI: knots m³/s, values m)
 * @param i set position in the index (count)
 * @param t flow, m³/s
 */
export function evalNpshrPacked(p: Packed, i: number, t: number): number | null {
  const lo = p.off[i];
  const hi = p.off[i + 1] - 1;
  if (hi < lo) return null;
  return evalPacked(p, i, npshrFlow(p.x[lo], p.x[hi], t));
}

/** Efficiency cubic from the power column when the curve gives no efficiency (η = ρ·g₀·Q·H/P at its points). */
function derivedEfficiency(c: PumpCurve): MonotoneCubic | null {
  if (c.efficiency) return c.efficiency;
  if (!c.power) return null;
  const xs: number[] = [], ys: number[] = [];
  for (let k = 0; k < c.power.x.length; k++) {
    const q = c.power.x[k];
    const h = evalCubic(c.head, q);
    if (h === null) continue;
    xs.push(q);
    ys.push((c.powerDensity * G0 * q * h) / c.power.y[k]);
  }
  return xs.length >= 2 ? monotoneCubic(xs, ys) : null;
}

/**
 * Prepares curve sets for searching. Invalid sets are listed in `rejected`, not thrown.
 * @param sets curve sets (SI curves)
 */
export function prepareSearchIndex(sets: readonly CurveSet[]): SearchIndex {
  if (!Array.isArray(sets)) throw new EngineInputError("sets", "must be an array of curve sets");
  const ids: string[] = [], labels: string[] = [];
  const flowMin: number[] = [], flowMax: number[] = [], headMax: number[] = [], bepFlow: number[] = [];
  const speed: number[] = [], diameter: number[] = [], minDiameter: number[] = [], drooping: number[] = [];
  const head = new PackBuilder(), eff = new PackBuilder(), npshr = new PackBuilder();
  const rejected: { id: string; reason: string }[] = [];
  const optional = (name: string, v: number | undefined) => (v === undefined || v === null ? -1 : requirePositive(name, v));
  for (const s of sets) {
    const curve = s?.curve;
    if (curve && "head" in curve && (curve as PumpCurve).head && "x" in (curve as PumpCurve).head) {
      // Already prepared: copy its columns.
      const c = curve as PumpCurve;
      ids.push(String(s.id)); labels.push(s.label ?? String(s.id));
      flowMin.push(c.flowMin); flowMax.push(c.flowMax); headMax.push(c.headMax); bepFlow.push(c.bep ? c.bep.flow : -1);
      speed.push(c.speed ?? -1); diameter.push(c.impellerDiameter ?? -1); minDiameter.push(c.minDiameter ?? -1);
      drooping.push(c.drooping ? 1 : 0);
      head.add(c.head); eff.add(derivedEfficiency(c)); npshr.add(c.npshr);
      continue;
    }
    // Raw input: the same checks as createPumpCurve, packed straight into the index (no
    // per-curve objects, so a large library loads quickly and costs little memory).
    let v: { headMax: number; drooping: boolean };
    let sp: number, dia: number, dMin: number, dMax: number, rhoP: number;
    const input = curve as PumpCurveInput;
    try {
      if (!input || typeof input !== "object") throw new EngineInputError("curve", "is required");
      const tol = input.riseTolerance ?? RISE_TOLERANCE_DEFAULT;
      if (!(tol >= 0 && tol <= 1)) throw new EngineInputError("riseTolerance", "must be between 0 and 1");
      v = checkPumpPoints(input.points, tol);
      sp = optional("speed", input.speed); dia = optional("impellerDiameter", input.impellerDiameter);
      dMin = optional("minDiameter", input.minDiameter); dMax = optional("maxDiameter", input.maxDiameter);
      if (dMin > 0 && dMax > 0 && dMin > dMax) throw new EngineInputError("minDiameter", "must not exceed maxDiameter");
      rhoP = requirePositive("powerDensity", input.powerDensity ?? DEFAULT_POWER_DENSITY);
    } catch (e) {
      rejected.push({ id: String(s?.id), reason: e instanceof Error ? e.message : String(e) });
      continue;
    }
    const pts = input.points;
    ids.push(String(s.id)); labels.push(s.label ?? String(s.id));
    flowMin.push(pts[0].flow); flowMax.push(pts[pts.length - 1].flow); headMax.push(v.headMax);
    speed.push(sp); diameter.push(dia); minDiameter.push(dMin); drooping.push(v.drooping ? 1 : 0);
    let st = head.begin();
    for (const p of pts) head.push(p.flow, p.head);
    head.end(st);
    // Efficiency column, or efficiency derived from power at the power column's points; BEP.
    let hasEff = 0;
    for (const p of pts) if (p.efficiency !== undefined && p.efficiency !== null) hasEff++;
    let best = -1, bestQ = -1;
    st = eff.begin();
    for (const p of pts) {
      const e = hasEff >= 2
        ? p.efficiency
        : hasEff < 2 && p.power !== undefined && p.power !== null ? (rhoP * G0 * p.flow * p.head) / p.power : undefined;
      if (e === undefined || e === null) continue;
      eff.push(p.flow, e);
      if (e > 0 && e > best) { best = e; bestQ = p.flow; }
    }
    eff.end(st);
    bepFlow.push(best > 0 && bestQ > 0 ? bestQ : -1);
    st = npshr.begin();
    for (const p of pts) if (p.npshr !== undefined && p.npshr !== null) npshr.push(p.flow, p.npshr);
    npshr.end(st);
  }
  return {
    count: ids.length, ids, labels,
    flowMin: Float64Array.from(flowMin), flowMax: Float64Array.from(flowMax), headMax: Float64Array.from(headMax),
    bepFlow: Float64Array.from(bepFlow), speed: Float64Array.from(speed), diameter: Float64Array.from(diameter),
    minDiameter: Float64Array.from(minDiameter), drooping: Uint8Array.from(drooping),
    head: head.build(), eff: eff.build(), npshr: npshr.build(), rejected,
  };
}


/**
 * Joins prepared indexes into one without preparing any curve again: the sets listed in `picks`
 * (per index, positions in the order wanted; every set, in order, when missing or null), index
 * after index. The result searches exactly like `prepareSearchIndex` over the same curve sets in
 * the same order. `rejected` lists the rejections of the indexes taken whole (a rejected set has
 * no position to pick).
 * @param indexes prepared indexes (SI curves, see {@link SearchIndex})
 * @param picks per index, positions of the sets to keep (whole numbers from 0 to count − 1; a count each), or null for all
 */
export function joinSearchIndexes(indexes: readonly SearchIndex[], picks: readonly (ArrayLike<number> | null | undefined)[] = []): SearchIndex {
  if (!Array.isArray(indexes)) throw new EngineInputError("indexes", "must be an array of prepared indexes");
  if (!Array.isArray(picks)) throw new EngineInputError("picks", "must be an array with one list of positions (or null) per index");
  const chosen: Int32Array[] = indexes.map((idx, k) => {
    if (!idx || typeof idx.count !== "number" || !(idx.flowMin instanceof Float64Array) || !idx.head?.off) throw new EngineInputError(`indexes[${k}]`, "must be a prepared index");
    const pk = picks[k];
    if (pk === undefined || pk === null) return Int32Array.from({ length: idx.count }, (_, j) => j);
    if (typeof pk.length !== "number") throw new EngineInputError(`picks[${k}]`, "must be a list of positions or null");
    const out = new Int32Array(pk.length);
    for (let j = 0; j < pk.length; j++) {
      const p = pk[j];
      if (!Number.isInteger(p) || p < 0 || p >= idx.count) throw new EngineInputError(`picks[${k}][${j}]`, `must be a position in index ${k} (a whole number from 0 to ${idx.count - 1})`);
      out[j] = p;
    }
    return out;
  });
  let count = 0;
  for (const c of chosen) count += c.length;
  const ids: string[] = new Array(count), labels: string[] = new Array(count);
  const flowMin = new Float64Array(count), flowMax = new Float64Array(count), headMax = new Float64Array(count), bepFlow = new Float64Array(count);
  const speed = new Float64Array(count), diameter = new Float64Array(count), minDiameter = new Float64Array(count), drooping = new Uint8Array(count);
  const rejected: { id: string; reason: string }[] = [];
  let n = 0;
  indexes.forEach((idx, k) => {
    for (const p of chosen[k]) {
      ids[n] = idx.ids[p]; labels[n] = idx.labels[p];
      flowMin[n] = idx.flowMin[p]; flowMax[n] = idx.flowMax[p]; headMax[n] = idx.headMax[p]; bepFlow[n] = idx.bepFlow[p];
      speed[n] = idx.speed[p]; diameter[n] = idx.diameter[p]; minDiameter[n] = idx.minDiameter[p]; drooping[n] = idx.drooping[p];
      n++;
    }
    if (picks[k] === undefined || picks[k] === null) rejected.push(...idx.rejected);
  });
  const column = (of: (idx: SearchIndex) => Packed): Packed => {
    let knots = 0;
    indexes.forEach((idx, k) => { const c = of(idx); for (const p of chosen[k]) knots += c.off[p + 1] - c.off[p]; });
    const off = new Int32Array(count + 1), x = new Float64Array(knots), y = new Float64Array(knots), m = new Float64Array(knots);
    let at = 0, i = 0;
    indexes.forEach((idx, k) => {
      const c = of(idx);
      for (const p of chosen[k]) {
        for (let q = c.off[p]; q < c.off[p + 1]; q++, at++) { x[at] = c.x[q]; y[at] = c.y[q]; m[at] = c.m[q]; }
        off[++i] = at;
      }
    });
    return { off, x, y, m };
  };
  return {
    count, ids, labels, flowMin, flowMax, headMax, bepFlow, speed, diameter, minDiameter, drooping,
    head: column((idx) => idx.head), eff: column((idx) => idx.eff), npshr: column((idx) => idx.npshr), rejected,
  };
}
