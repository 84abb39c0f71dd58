/**
 * What the fast path (fast.ts) keeps of a clean file: the points in typed arrays (five doubles per
 * point: flow, head, efficiency, power, npshr in SI, NaN when absent; and its source line), one small
 * head per curve set, no object per point. Its result is an ordinary ValidationResult to every
 * reader: `curveSets` (with their points and source rows) is built on first read — the mapping page
 * previews a dozen curves and lists problems, the import plan (app/lib/libraries/import-plan.ts)
 * reads the arrays through packedOf() and never builds it. Pure.
 */
import type { CurvePoint, CurveSet, ValidationResult, ValidationStats } from "./validate";

/** Doubles per point in `values`: flow, head, efficiency, power, npshr. */
export const POINT_WIDTH = 5;

/** A curve set without its points. */
export type SetHead = Omit<CurveSet, "points" | "sourceRows" | "ok">;

/** Growable store of points; curve set i holds points [starts[i], starts[i + 1]) (the last one up to `count`). */
export class PointStore {
  values: Float64Array;
  lines: Int32Array;
  count = 0;
  readonly starts: number[] = [];
  readonly sets: SetHead[] = [];

  /** `capacity`: the points expected (more fit; the arrays grow). */
  constructor(capacity = 1024) {
    this.values = new Float64Array(POINT_WIDTH * Math.max(capacity, 16));
    this.lines = new Int32Array(Math.max(capacity, 16));
  }

  /** Starts a new curve set (call before its first point). */
  open(head: SetHead): SetHead {
    this.starts.push(this.count);
    this.sets.push(head);
    return head;
  }

  /** Room for one more point; returns its index. */
  next(): number {
    if (this.count === this.lines.length) {
      const values = new Float64Array(this.values.length * 2);
      values.set(this.values);
      this.values = values;
      const lines = new Int32Array(this.lines.length * 2);
      lines.set(this.lines);
      this.lines = lines;
    }
    return this.count++;
  }

  /** Appends one point (NaN for an absent efficiency, power or NPSHr); returns its index. */
  add(flow: number, head: number, efficiency: number, power: number, npshr: number): number {
    const n = this.next();
    const o = n * POINT_WIDTH;
    const v = this.values;
    v[o] = flow;
    v[o + 1] = head;
    v[o + 2] = efficiency;
    v[o + 3] = power;
    v[o + 4] = npshr;
    return n;
  }

  end(set: number): number {
    return set + 1 < this.starts.length ? this.starts[set + 1] : this.count;
  }

  /** Drops the spare room (the values may then be moved to another thread as they are). */
  trim(): void {
    if (this.lines.length === this.count) return;
    this.values = this.values.slice(0, this.count * POINT_WIDTH);
    this.lines = this.lines.slice(0, this.count);
  }
}

function curveSetOf(store: PointStore, set: number): CurveSet {
  const v = store.values;
  const points: CurvePoint[] = [];
  const a = store.starts[set], b = store.end(set);
  for (let k = a; k < b; k++) {
    const o = k * POINT_WIDTH;
    const p: CurvePoint = { flow: v[o], head: v[o + 1] };
    if (v[o + 2] === v[o + 2]) p.efficiency = v[o + 2];
    if (v[o + 3] === v[o + 3]) p.power = v[o + 3];
    if (v[o + 4] === v[o + 4]) p.npshr = v[o + 4];
    points.push(p);
  }
  return { ...store.sets[set], points, sourceRows: Array.from(store.lines.subarray(a, b)), ok: true };
}

const stores = new WeakMap<ValidationResult, PointStore>();

/** The result of a clean file whose every curve set is ok: `curveSets` built on first read. */
export function packedResult(store: PointStore, stats: ValidationStats): ValidationResult {
  store.trim();
  let curveSets: CurveSet[] | undefined;
  const result: ValidationResult = {
    get curveSets() {
      return (curveSets ??= store.sets.map((_, i) => curveSetOf(store, i)));
    },
    problems: [],
    stats,
  };
  stores.set(result, store);
  return result;
}

/** The first `n` curve sets of a result; of a fast-path result only those are made into objects (a preview needs no more). */
export function firstCurveSets(result: ValidationResult, n: number): CurveSet[] {
  return curveSetsFrom(result, 0, n);
}

/** The curve sets `from` (0-based, in file order) to `from + n` of either path's result; only those are built from a fast-path result. */
export function curveSetsFrom(result: ValidationResult, from: number, n: number): CurveSet[] {
  const store = stores.get(result);
  if (!store) return result.curveSets.slice(from, from + n);
  const end = Math.min(from + n, store.sets.length);
  return Array.from({ length: Math.max(0, end - from) }, (_, i) => curveSetOf(store, from + i));
}

/** The point store behind a fast-path result (every curve set ok), or null for any other result. */
export function packedOf(result: ValidationResult): PointStore | null {
  return stores.get(result) ?? null;
}
