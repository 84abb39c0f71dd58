/**
 * Traced points → curves as the engine will use them. Pure: no DOM.
 *
 * The engine interpolates a pump curve between its points with the monotone cubic of Fritsch and
 * Carlson (app/engine/interp.ts); `engineSmooth` draws exactly that through the points that will
 * be imported, so the overlay on the picture shows what the selection will see. `resample` turns a
 * dense trace (one point per pixel step, with pixel noise) into a few evenly spaced points by a
 * local straight-line least-squares fit around each target flow (common practice for smoothing).
 */
import { evalCubic, monotoneCubic } from "~/engine";

/** A point in data units (x: flow in the flow axis's unit; y: the panel's quantity in its unit). */
export type XY = { x: number; y: number };

/** Sorted by x, finite only, one point per x (the later one of equal x dropped). */
export function cleanPoints(points: readonly XY[]): XY[] {
  const ps = points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)).sort((a, b) => a.x - b.x);
  const out: XY[] = [];
  for (const p of ps) if (!out.length || p.x > out[out.length - 1].x) out.push(p);
  return out;
}

/**
 * `n` points at evenly spaced flows from the first to the last traced flow, each the value at that
 * flow of a straight line fitted (least squares) to the traced points within ± one spacing.
 */
export function resample(points: readonly XY[], n: number): XY[] {
  const ps = cleanPoints(points);
  if (ps.length <= 2 || n < 2) return ps;
  const x0 = ps[0].x, x1 = ps[ps.length - 1].x;
  const h = (x1 - x0) / (n - 1);
  const out: XY[] = [];
  for (let k = 0; k < n; k++) {
    const x = k === n - 1 ? x1 : x0 + h * k;
    const near = ps.filter((p) => Math.abs(p.x - x) <= h);
    out.push({ x, y: near.length >= 2 ? lineAt(near, x) : valueAt(ps, x) ?? ps[0].y });
  }
  return out;
}

function lineAt(ps: readonly XY[], x: number): number {
  const n = ps.length;
  const mx = ps.reduce((s, p) => s + p.x, 0) / n, my = ps.reduce((s, p) => s + p.y, 0) / n;
  let sxx = 0, sxy = 0;
  for (const p of ps) {
    sxx += (p.x - mx) ** 2;
    sxy += (p.x - mx) * (p.y - my);
  }
  return sxx > 0 ? my + (sxy / sxx) * (x - mx) : my;
}

/** The engine's interpolant through the points at `x`; null outside their flow range. */
export function valueAt(points: readonly XY[], x: number): number | null {
  const ps = cleanPoints(points);
  if (ps.length === 0) return null;
  if (ps.length === 1) return ps[0].x === x ? ps[0].y : null;
  return evalCubic(monotoneCubic(ps.map((p) => p.x), ps.map((p) => p.y)), x);
}

/** The engine's interpolant through the points, sampled at `samples` flows (for drawing). */
export function engineSmooth(points: readonly XY[], samples = 80): XY[] {
  const ps = cleanPoints(points);
  if (ps.length < 2) return ps;
  const c = monotoneCubic(ps.map((p) => p.x), ps.map((p) => p.y));
  const x0 = ps[0].x, x1 = ps[ps.length - 1].x;
  const out: XY[] = [];
  for (let k = 0; k < samples; k++) {
    const x = x0 + ((x1 - x0) * k) / (samples - 1);
    const y = evalCubic(c, x);
    if (y != null) out.push({ x, y });
  }
  return out;
}
