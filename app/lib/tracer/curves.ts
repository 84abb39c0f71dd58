/**
 * Traced points → curves as the engine will use them. Pure: no DOM.
 *
 * The engine interpolates a pump curve between its points with the monotone cubic of Fritsch and
 * Carlson (app/engine/interp.ts); `engineSmooth` draws exactly that through the points that will
 * be imported, so the overlay on the picture shows what the selection will see. `resample` turns a
 * dense trace (one point per pixel step, with pixel noise) into a few evenly spaced points by a
 * local least-squares parabola around each target flow (local polynomial smoothing, common
 * practice; a parabola has no bias on a pump's near-quadratic head curve, even at the curve ends).
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
 * flow of a parabola fitted (least squares) to the traced points within ± one spacing.
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
    out.push({ x, y: near.length >= 2 ? localFit(near, x) : valueAt(ps, x) ?? ps[0].y });
  }
  return out;
}

/** Value at x of the least-squares parabola through the points (x centred; a line when 2 points or degenerate). */
function localFit(ps: readonly XY[], x: number): number {
  const n = ps.length;
  const S = [0, 0, 0, 0, 0], T = [0, 0, 0];
  for (const p of ps) {
    const d = p.x - x;
    let dk = 1;
    for (let k = 0; k < 5; k++) {
      S[k] += dk;
      if (k < 3) T[k] += dk * p.y;
      dk *= d;
    }
  }
  if (n >= 3) {
    // Normal equations for y ≈ c0 + c1·d + c2·d²; the value at x is c0 (Cramer's rule).
    const det3 = (m: number[][]) => m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
    const M = [[S[0], S[1], S[2]], [S[1], S[2], S[3]], [S[2], S[3], S[4]]];
    const D = det3(M);
    if (Math.abs(D) > 1e-12 * Math.abs(S[0] * S[2] * S[4])) return det3([[T[0], S[1], S[2]], [T[1], S[2], S[3]], [T[2], S[3], S[4]]]) / D;
  }
  const den = S[0] * S[2] - S[1] * S[1];
  return den > 0 ? (S[2] * T[0] - S[1] * T[1]) / den : T[0] / S[0];
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
