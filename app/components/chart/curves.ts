/**
 * Curve arithmetic on point lists (any units): cleaning, linear interpolation at a flow, the band
 * between two curves, a slice of a curve, and where two curves cross. Pure; no React, no DOM.
 */
import { firstPointGap, lastPointGap } from "../../engine/operatingPoint.ts";
import { meetingsOf } from "../../engine/meetings.ts";
import type { Pt } from "./types.ts";

/**
 * Keeps finite points only and sorts them by flow (stable), so interpolation and drawing
 * never see NaN or a backwards segment.
 */
export function cleanPoints(points: readonly Pt[] | undefined | null): Pt[] {
  if (!points) return [];
  return points
    .filter((p) => p != null && Number.isFinite(p.flow) && Number.isFinite(p.y))
    .slice()
    .sort((a, b) => a.flow - b.flow);
}

/**
 * Value of a curve at `flow`, interpolated linearly between the neighbouring points;
 * null outside the curve's flow range (no extrapolation) or for an empty curve.
 * Points need not be sorted; non-finite points are ignored.
 */
export function interpolateAt(points: readonly Pt[] | undefined | null, flow: number): number | null {
  if (!Number.isFinite(flow)) return null;
  const pts = isSortedFinite(points) ? (points as Pt[]) : cleanPoints(points);
  const n = pts.length;
  if (n === 0) return null;
  if (flow < pts[0].flow || flow > pts[n - 1].flow) return null;
  // Binary search for the last point with p.flow <= flow.
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (pts[mid].flow <= flow) lo = mid;
    else hi = mid;
  }
  const a = pts[lo];
  const b = pts[hi];
  if (flow === a.flow) return a.y;
  if (flow === b.flow) return b.y;
  const span = b.flow - a.flow;
  if (span === 0) return a.y;
  return a.y + ((b.y - a.y) * (flow - a.flow)) / span;
}

function isSortedFinite(points: readonly Pt[] | undefined | null): boolean {
  if (!points) return false;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    if (!p || !Number.isFinite(p.flow) || !Number.isFinite(p.y)) return false;
    if (i > 0 && p.flow < points[i - 1].flow) return false;
  }
  return true;
}

/** One slice of a band: flow and the lower/upper values there. */
export type BandPt = { flow: number; y0: number; y1: number };

/**
 * The band between two curves, on the union of their flows where both are defined;
 * y0 is the lower of the two values and y1 the upper at every flow.
 */
export function bandBetween(a: readonly Pt[], b: readonly Pt[]): BandPt[] {
  const ca = cleanPoints(a);
  const cb = cleanPoints(b);
  const flows = Array.from(new Set([...ca.map((p) => p.flow), ...cb.map((p) => p.flow)])).sort(
    (x, y) => x - y,
  );
  const out: BandPt[] = [];
  for (const f of flows) {
    const ya = interpolateAt(ca, f);
    const yb = interpolateAt(cb, f);
    if (ya === null || yb === null) continue;
    out.push({ flow: f, y0: Math.min(ya, yb), y1: Math.max(ya, yb) });
  }
  return out;
}

/**
 * The part of a curve between flows a and b, with interpolated end points (for shading a
 * stretch of a curve, e.g. the preferred operating region). Empty if they do not overlap.
 */
export function sliceCurve(points: readonly Pt[], a: number, b: number): Pt[] {
  const pts = cleanPoints(points);
  if (pts.length < 2) return [];
  const lo = Math.max(Math.min(a, b), pts[0].flow);
  const hi = Math.min(Math.max(a, b), pts[pts.length - 1].flow);
  if (!(hi > lo)) return [];
  const out: Pt[] = [{ flow: lo, y: interpolateAt(pts, lo)! }];
  for (const p of pts) if (p.flow > lo && p.flow < hi) out.push(p);
  out.push({ flow: hi, y: interpolateAt(pts, hi)! });
  return out;
}

/**
 * Where a pump curve meets a system curve, both as points (linear between points): the point the pump reaches from rest, by
 * the engine's rule (`crossingFromRest`, as `solveOperatingPoint` decides), judged from the pump curve's first flow as the
 * engine judges it — none when its head there is below the system's (it cannot open its check valve, whatever crossings lie
 * further out), else the first crossing where its head falls below the system's; null when there is none. Null as well
 * where the samples cannot tell: the system's first sampled flow lies above the pump curve's first (its head at the start is
 * not known; before, the start was judged at the first flow both cover, which marked a point on a pump that cannot start),
 * or the pump's head is still above the system's at the last flow both cover (the engine may find a crossing further out).
 * At the pump curve's last point the engine's last-point rule (`lastPointGap`): heads apart by rounding only meet there;
 * at its first point the mirror (`firstPointGap`). The meetings themselves by the engine's rule (meetings.ts `meetingsOf`, on
 * the samples joined by straight lines): a touch within TOUCH_GAP of the head is one point, where a pump flowing up to it
 * stops; curves that coincide (within it over COINCIDE_SHARE of the flows) have none (null), as the engine's `coincident`.
 * Used where only sampled curves are at hand (stored field-check charts).
 */
export function crossingOf(pump: readonly Pt[] | undefined | null, system: readonly Pt[] | undefined | null): Pt | null {
  const p = cleanPoints(pump);
  const s = cleanPoints(system);
  if (p.length < 2 || s.length < 2) return null;
  const lo = p[0].flow; // the engine's start: the pump curve's first flow
  if (s[0].flow > lo) return null; // the system's head there is not sampled: the start cannot be judged
  const hi = Math.min(p[p.length - 1].flow, s[s.length - 1].flow);
  if (!(hi > lo)) return null;
  const flows = Array.from(new Set([lo, hi, ...p.map((q) => q.flow), ...s.map((q) => q.flow)].filter((f) => f >= lo && f <= hi))).sort((a, b) => a - b);
  const gs = flows.map((f) => (interpolateAt(p, f) as number) - (interpolateAt(s, f) as number));
  // At the pump curve's last point, the engine's last-point rule: heads apart by rounding only meet there (a system curve
  // drawn through the last published point computes an ulp or two off it; before, no crossing or one an ulp short).
  const last = flows.length - 1;
  // With it, a crossing past the last point by no more than LIMIT_ROUNDING of its flow, judged on the last sampled slopes.
  if (hi === p[p.length - 1].flow) {
    const pl = p[p.length - 1], pb = p[p.length - 2], prev = flows[last - 1];
    const gains = ((interpolateAt(s, hi) as number) - (interpolateAt(s, prev) as number)) / (hi - prev) - (pl.y - pb.y) / (pl.flow - pb.flow);
    gs[last] = lastPointGap(pl.y, interpolateAt(s, hi) as number, Number.isFinite(gains) ? { flow: hi, gains } : undefined);
  }
  // At its first point, the mirror (firstPointGap): rounding, and a crossing before a first flow above zero by no more than
  // LIMIT_ROUNDING of it, judged on the first sampled slopes, meet there (before, "cannot start": no crossing).
  {
    const p0 = p[0], p1 = p[1], next = flows[1];
    const gains = ((interpolateAt(s, next) as number) - (interpolateAt(s, lo) as number)) / (next - lo) - (p1.y - p0.y) / (p1.flow - p0.flow);
    gs[0] = firstPointGap(p0.y, interpolateAt(s, lo) as number, Number.isFinite(gains) ? { flow: lo, gains } : undefined);
  }
  // The meetings by the engine's own rule (meetings.ts: crossings, touches within TOUCH_GAP of the head, stretches where the
  // heads stay within it over COINCIDE_SHARE of the flows), on g straight between the samples: a touch is one point, where a
  // pump flowing up to it stops, and curves that coincide have none (before, sign changes only: a touch the engine reports
  // was no point here, a rounding-level dip two crossings, and a coincident stretch a crossing at its first sample).
  const g = (q: number) => {
    let k = 1;
    while (k < last && flows[k] < q) k++;
    const f0 = flows[k - 1], f1 = flows[k];
    return q <= f0 ? gs[k - 1] : q >= f1 ? gs[k] : gs[k - 1] + ((gs[k] - gs[k - 1]) * (q - f0)) / (f1 - f0);
  };
  const m = meetingsOf({ g, qs: flows, gs, pumpHead: (q) => interpolateAt(p, q) as number, xtol: 1e-13 * Math.abs(hi), maxIt: 100 });
  if (typeof m.fromRest !== "number") return null;
  const r = m.roots[m.fromRest];
  return r.kind === "stretch" ? null : { flow: r.x, y: interpolateAt(p, r.x) as number };
}
