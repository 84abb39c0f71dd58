/**
 * Iso-efficiency contours ("islands") against impeller curves. Pure: no DOM.
 *
 * A datasheet with a family of impeller curves prints efficiency as contours of equal efficiency in
 * the flow–head plane. Where a contour of level η crosses an impeller's head curve, that impeller
 * runs at efficiency η at that flow. The crossings are found segment by segment (straight-line
 * intersection of two segments, common practice); the impeller's efficiency curve is then the
 * crossings in order of flow, read between them with the engine's interpolation (curves.ts).
 * Between two consecutive crossings of the same level the contours say only that the efficiency is
 * above (or below) that level, not what it is: inside the innermost contour a curve crosses lies its
 * peak, which no contour traces; a curve that crosses it once ends inside it, with its peak between that
 * crossing and its end (or past the end), or starts inside it, with its peak between its start (or before
 * it) and that crossing. There the efficiency is not read (`contourGaps`; null from
 * `efficiencyFromContours`), never a flat plateau at the level (the engine's BEP, the first point of
 * highest efficiency, would land at the plateau's left end).
 * A contour is a closed loop only when it says so (`closed`: the island tracer's outline, or the
 * user's choice); an arm of a line clicked by hand is open, and no chord joins its ends.
 * Coordinates: give both in the same plane (axis space of the calibration: linear, or log10 for a
 * logarithmic axis) so that straight pixel segments stay straight.
 */
import { cleanPoints, valueAt, type XY } from "./curves";

export type Contour = { level: number; points: XY[]; closed: boolean };
/**
 * `touch`: the curve meets the level's contour there but stays on the same side (tangent, or grazing a vertex): a known
 * efficiency (the level) that is no crossing, so inside and outside do not alternate there (`contourGaps`).
 */
export type Crossing = { x: number; y: number; level: number; touch?: true; along?: true };
// `along` (with `touch`): the level's contour runs along the curve from the level's previous meeting to here, so the
// efficiency is the level all the way (no gap between them) and the two ends of the run are one crossing, or a touch, not two.

/** Intersection of segments p1→p2 and q1→q2, or null. */
function cross(p1: XY, p2: XY, q1: XY, q2: XY): XY | null {
  const rx = p2.x - p1.x, ry = p2.y - p1.y, sx = q2.x - q1.x, sy = q2.y - q1.y;
  const den = rx * sy - ry * sx;
  if (den === 0) return null;
  const t = ((q1.x - p1.x) * sy - (q1.y - p1.y) * sx) / den;
  const u = ((q1.x - p1.x) * ry - (q1.y - p1.y) * rx) / den;
  // Written so that NaN (a point that is not finite) meets nothing.
  if (!(t >= 0 && t <= 1 && u >= 0 && u <= 1)) return null;
  return { x: p1.x + t * rx, y: p1.y + t * ry };
}

/** The polyline's y at flow x, straight between its points (the plane's segments are straight), or null outside it. */
function lineAt(c: readonly XY[], x: number): number | null {
  for (let i = 0; i + 1 < c.length; i++) {
    if (x >= c[i].x && x <= c[i + 1].x) return c[i].y + ((x - c[i].x) / (c[i + 1].x - c[i].x)) * (c[i + 1].y - c[i].y);
  }
  return null;
}

/** A meeting as found: which contour (index) and where along it (segment index + fraction: its arc parameter). */
type Meeting = Crossing & { k: number; s: number };

/** The contour's point at arc parameter t (segment index + fraction; a closed ring's wraps round). */
function pointAt(ring: readonly XY[], closed: boolean, t: number): XY {
  const n = ring.length - 1;
  const w = closed ? ((t % n) + n) % n : Math.min(Math.max(t, 0), n);
  const j = Math.min(Math.floor(w), n - 1), f = w - j;
  return { x: ring[j].x + f * (ring[j + 1].x - ring[j].x), y: ring[j].y + f * (ring[j + 1].y - ring[j].y) };
}

/**
 * Whether one contour stays on one side of the curve through a meeting (a touch), read from that contour alone: the sign of
 * (contour's y − curve's y at the contour's flow) just before and just after the meeting along the contour, halfway to its
 * neighbouring meetings with the curve (closer in, halving, where halfway lies past the curve's flows). The curve is a line
 * of flow, so its two sides are above and below: a contour that crosses it changes sides, one that touches it does not. A
 * meeting at an open contour's end (the line stops on the curve), or where a side is not found, stays a crossing.
 */
function touchesLocally(c: readonly XY[], ring: readonly XY[], closed: boolean, s: number, ss: readonly number[], sEnd = s): boolean {
  const n = ring.length - 1, eps = 1e-9;
  if (!closed && (Math.min(s, sEnd) <= eps || Math.max(s, sEnd) >= n - eps)) return false;
  // On a closed ring the parameter n is 0 again: one meeting at its first vertex is found at both.
  const norm = (t: number) => (closed && t >= n - eps ? t - n : t);
  // A run along the curve (sEnd): read the side before its lower end and after its higher end.
  const hiS = Math.max(norm(s), norm(sEnd));
  s = Math.min(norm(s), norm(sEnd));
  const ts = ss.map(norm);
  const lower = ts.filter((t) => t < s - eps).sort((u, v) => u - v), higher = ts.filter((t) => t > hiS + eps).sort((u, v) => u - v);
  const prev = lower.length ? lower[lower.length - 1] : closed ? (higher.length ? higher[higher.length - 1] - n : s - n) : 0;
  const next = higher.length ? higher[0] : closed ? (lower.length ? lower[0] + n : s + n) : n;
  const x0 = c[0].x, x1 = c[c.length - 1].x;
  const inFlows = (t: number) => {
    const x = pointAt(ring, closed, t).x;
    return x >= x0 && x <= x1;
  };
  // The way from the meeting to s + d stays over the curve's flows (the contour's vertices on it and its end), so no side is lost past an end.
  const over = (d: number) => {
    if (!inFlows(s + d)) return false;
    for (let t = d > 0 ? Math.floor(s) + 1 : Math.ceil(s) - 1; d > 0 ? t < s + d : t > s + d; t += d > 0 ? 1 : -1) if (!inFlows(t)) return false;
    return true;
  };
  const side = (to: number, from = s) => {
    for (let d = (to - from) / 2, m = 0; m < 30; m++, d /= 2) {
      if (!over(from - s + d)) continue;
      const p = pointAt(ring, closed, from + d);
      const y = lineAt(c, p.x);
      if (y !== null && Math.abs(p.y - y) > 1e-12 * (1 + Math.abs(y))) return Math.sign(p.y - y);
    }
    return null;
  };
  const a = side(prev), b = side(next, hiS);
  return a !== null && a === b;
}

/**
 * The crossings that are touches (`touch`): where the level's contours are all closed (insideLevel), the curve's sides
 * just before and after are read halfway to the neighbouring meeting with that level (or the curve's start or end),
 * where no other meeting with it lies between; the same side both ways is a touch. Where the level has an open contour
 * (no inside to tell), the meeting's own contour is read instead (touchesLocally: it stays above or below the curve
 * through the meeting). A meeting at the curve's first or last flow stays a crossing.
 */
function markTouches(c: readonly XY[], xs: readonly Meeting[], all: readonly Meeting[], contours: readonly Contour[], rings: readonly XY[][]): Crossing[] {
  if (c.length < 2) return xs.map(({ k: _k, s: _s, ...p }) => p);
  const x0 = c[0].x, x1 = c[c.length - 1].x;
  const runs = alongRuns(c, xs, contours, rings);
  const runEnds = new Set(runs.values());
  return xs.map((m) => {
    const { k, s, ...p } = m;
    if (runEnds.has(m)) return { ...p, touch: true as const, along: true as const }; // the run's far end: no crossing of its own
    const end = runs.get(m); // the contour runs along the curve from here to `end`: one meeting, its sides read past both ends
    const same = xs.filter((q) => q.level === p.level);
    const i = same.findIndex((q) => q.k === k && q.s === s);
    const j = end ? same.indexOf(end) : i;
    const before = ((i > 0 ? same[i - 1].x : x0) + p.x) / 2, after = ((end ?? p).x + (j + 1 < same.length ? same[j + 1].x : x1)) / 2;
    if (!(before < p.x && after > (end ?? p).x)) return p;
    const side = (x: number) => {
      const y = lineAt(c, x);
      return y === null ? null : insideLevel({ x, y }, contours, p.level);
    };
    const a = side(before), b = side(after);
    const touch = a !== null && b !== null ? a === b
      : touchesLocally(c, rings[k], contours[k].closed && contours[k].points.length > 2, s, all.filter((q) => q.k === k).map((q) => q.s).sort((u, v) => u - v), end?.s);
    return touch ? { ...p, touch: true as const } : p;
  });
}

/**
 * Where a contour runs along the curve: two meetings in a row of one contour, in order of flow, with the contour between
 * them on the curve (its vertices there and its midway point within 1 part in 10⁹ of the curve's head, a drawing's
 * rounding). Before, each end of such a run was a crossing: a contour that runs along the curve and leaves on the side it
 * came from was two crossings, and the span between them a gap, where the efficiency is the level all along.
 * @returns the run's first meeting → its last
 */
function alongRuns(c: readonly XY[], xs: readonly Meeting[], contours: readonly Contour[], rings: readonly XY[][]): Map<Meeting, Meeting> {
  const out = new Map<Meeting, Meeting>();
  const onCurve = (p: XY) => {
    const y = lineAt(c, p.x);
    return y !== null && Math.abs(p.y - y) <= 1e-9 * (1 + Math.abs(y));
  };
  for (let i = 0; i < xs.length; i++) {
    const p = xs[i];
    if (out.has(p)) continue;
    const q = xs.slice(i + 1).find((m) => m.level === p.level);
    if (!q || q.k !== p.k || !(q.x > p.x)) continue;
    const ring = rings[p.k], closed = contours[p.k].closed && contours[p.k].points.length > 2;
    const n = ring.length - 1, norm = (t: number) => (closed && t >= n - 1e-9 ? t - n : t); // a closed ring's n is its 0
    const lo = Math.min(norm(p.s), norm(q.s)), hi = Math.max(norm(p.s), norm(q.s));
    // The contour between them: its midway point and its vertices from a to b along the ring.
    const on = (a: number, b: number) => {
      const between = [(a + b) / 2];
      for (let t = Math.floor(a) + 1; t < b; t++) between.push(t);
      return between.every((t) => onCurve(pointAt(ring, closed, t)));
    };
    // A closed ring's run may go the other way round, across the array's end (hi → lo + n): before, only lo → hi was read,
    // and an island listed from a vertex off its run along the curve gave two crossings and a gap there.
    if (on(lo, hi) || (closed && on(hi, lo + n))) out.set(p, q);
  }
  return out;
}

/** Every meeting of the curve (a polyline in flow order) with the contours, in order of flow: crossings, and touches marked `touch`. */
export function crossings(curve: readonly XY[], contours: readonly Contour[]): Crossing[] {
  const c = cleanPoints(curve);
  const out: Meeting[] = [];
  const rings = contours.map((k) => (k.closed && k.points.length > 2 ? [...k.points, k.points[0]] : [...k.points]));
  contours.forEach((k, ki) => {
    const ring = rings[ki];
    for (let i = 0; i + 1 < c.length; i++) {
      for (let j = 0; j + 1 < ring.length; j++) {
        const p = cross(c[i], c[i + 1], ring[j], ring[j + 1]);
        if (p) out.push({ x: p.x, y: p.y, level: k.level, k: ki, s: j + uAlong(ring[j], ring[j + 1], p) });
      }
    }
  });
  out.sort((a, b) => a.x - b.x);
  // A contour passing through a shared vertex is found twice (a touch there too): keep one.
  const once = out.filter((p, i) => i === 0 || !(p.level === out[i - 1].level && Math.abs(p.x - out[i - 1].x) < 1e-9 * (1 + Math.abs(p.x))));
  return markTouches(c, once, out, contours, rings);
}

/** Where p lies along the segment a→b, 0 to 1. */
function uAlong(a: XY, b: XY, p: XY): number {
  const dx = b.x - a.x, dy = b.y - a.y;
  const d = dx * dx + dy * dy;
  return d === 0 ? 0 : Math.min(1, Math.max(0, ((p.x - a.x) * dx + (p.y - a.y) * dy) / d));
}

/**
 * Where two contours of different levels cross each other, one point per pair (the first found), as index pairs into
 * `contours`. Lines of equal efficiency at different levels never meet on a chart (a point has one efficiency): a
 * crossing is a drawing error, two lines clicked too coarsely where they run close. Any plane affine to the picture.
 */
export function contoursCrossing(contours: readonly Contour[]): { a: number; b: number; at: XY }[] {
  const rings = contours.map((k) => (k.closed && k.points.length > 2 ? [...k.points, k.points[0]] : [...k.points]));
  const out: { a: number; b: number; at: XY }[] = [];
  for (let a = 0; a < contours.length; a++) {
    for (let b = a + 1; b < contours.length; b++) {
      if (contours[a].level === contours[b].level) continue;
      const at = firstMeeting(rings[a], rings[b]);
      if (at) out.push({ a, b, at });
    }
  }
  return out;
}

/** The first point where two polylines meet, or null; segments whose boxes do not overlap are skipped (the page runs this on every change). */
function firstMeeting(p: readonly XY[], q: readonly XY[]): XY | null {
  for (let i = 0; i + 1 < p.length; i++) {
    const ax0 = Math.min(p[i].x, p[i + 1].x), ax1 = Math.max(p[i].x, p[i + 1].x), ay0 = Math.min(p[i].y, p[i + 1].y), ay1 = Math.max(p[i].y, p[i + 1].y);
    for (let j = 0; j + 1 < q.length; j++) {
      if (Math.max(q[j].x, q[j + 1].x) < ax0 || Math.min(q[j].x, q[j + 1].x) > ax1 || Math.max(q[j].y, q[j + 1].y) < ay0 || Math.min(q[j].y, q[j + 1].y) > ay1) continue;
      const at = cross(p[i], p[i + 1], q[j], q[j + 1]);
      if (at) return at;
    }
  }
  return null;
}

/**
 * A flow span where the contours do not say the efficiency: between two consecutive crossings of one
 * level, or (`toEnd`) from the last crossing to the curve's end when the curve ends inside the
 * innermost contour it crosses, or (`fromStart`) from the curve's start to the first crossing when it
 * starts inside it. `innermost`: the level is the highest the curve crosses and the curve is inside its
 * contour there (its peak lies in such a span, or for `toEnd` there or past the curve's end, for
 * `fromStart` there or before its start). `outside`: between two crossings of a level the curve is outside
 * that level's contour (it left it and comes back in): the efficiency dips below the level there.
 */
export type ContourGap = {
  from: number; to: number; level: number; innermost: boolean; toEnd?: true; fromStart?: true; outside?: true;
  /** The span starts (`fromTouch`) or ends (`toTouch`) where the curve touches the level's contour without crossing it. */
  fromTouch?: true; toTouch?: true;
  /**
   * An innermost span between two meetings whose first is the curve's first flow (`onStart`: the curve starts on the contour and goes
   * in) or whose second is its last (`onEnd`: it ends on the contour): that end's row is at the level, the curve's first or last.
   */
  onStart?: true; onEnd?: true;
};

/**
 * Whether a point lies inside the contours of one level (even–odd rule over its closed loops: two islands
 * of one level, or a ring, count right); null when that level has an open contour or none closed (an arm
 * that leaves the chart has no inside the tracer can tell), or a loop with a point that is not finite.
 */
export function insideLevel(p: XY, contours: readonly Contour[], level: number): boolean | null {
  const of = contours.filter((k) => k.level === level);
  if (!of.length || of.some((k) => !k.closed || k.points.length < 3 || !k.points.every((q) => Number.isFinite(q.x) && Number.isFinite(q.y)))) return null;
  let inside = false;
  for (const k of of) {
    const r = k.points;
    for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
      if (r[i].y > p.y !== r[j].y > p.y && p.x < r[j].x + ((p.y - r[j].y) * (r[i].x - r[j].x)) / (r[i].y - r[j].y)) inside = !inside;
    }
  }
  return inside;
}

/**
 * The spans between consecutive crossings (in order of flow) of the same level, each inside or `outside`
 * that level's contour: inside and outside alternate along the curve at each crossing of the level, not at a
 * touch (`touch`: the curve stays on its side; the touch still ends one span and starts the next),
 * starting from whether the curve's first point is inside (`startInside(level)`: the contour geometry,
 * insideLevel). Where that is not known (no `startInside`, or null: an open contour) the curve starts
 * outside every level but the highest, and inside that only as before (helper "tracerone"): its first
 * crossing is of that level, crossed an odd number of times, with another crossing after it and the last
 * not of that level (a lone crossing says nothing of which side is inside; an odd count leaves the curve
 * inside at one end only, and with the first and the last crossing both of that level the end is kept).
 * With `end` (the curve's last flow, same plane), also the span from the last crossing to it when that
 * crossing is of the highest level and the curve is inside it after: the curve went into that contour
 * and did not come out. With `start` (the curve's first flow), the mirror: the span from it to the first
 * crossing when that crossing is of the highest level and the curve starts inside it.
 */
export function contourGaps(xs: readonly Crossing[], end?: number, start?: number, startInside?: (level: number) => boolean | null): ContourGap[] {
  const past = (a: number | undefined, b: number) => a !== undefined && a > b + 1e-9 * (1 + Math.abs(b));
  const top = Math.max(...xs.map((p) => p.level));
  const first = xs[0], last = xs[xs.length - 1];
  // A meeting at the curve's first flow (the curve starts on the line) is no crossing either: the curve begins on one side there.
  const flips = (p: Crossing) => !p.touch && (start === undefined || past(p.x, start));
  const topCount = xs.filter((p) => p.level === top && flips(p)).length;
  // The guess reads the crossings only: a touch leaves the curve on its side.
  const xc = xs.filter(flips);
  const guessed = (level: number) =>
    level === top && topCount % 2 === 1 && xc.length >= 2 && xc[0].level === top && !(xc[xc.length - 1].level === top && past(end, xc[xc.length - 1].x));
  const at0 = new Map<number, boolean>();
  const inAtStart = (level: number) => {
    if (!at0.has(level)) at0.set(level, startInside?.(level) ?? guessed(level));
    return at0.get(level)!;
  };
  const seen = new Map<number, number>();
  const out: ContourGap[] = [];
  for (let i = 0; i < xs.length; i++) {
    const L = xs[i].level;
    if (flips(xs[i])) seen.set(L, (seen.get(L) ?? 0) + 1);
    if (i + 1 < xs.length && xs[i + 1].level === L && xs[i + 1].x > xs[i].x && !xs[i + 1].along) { // along a run: the level, no gap
      const inside = inAtStart(L) !== ((seen.get(L) ?? 0) % 2 === 1);
      const onStart = inside && L === top && start !== undefined && !past(xs[i].x, start), onEnd = inside && L === top && end !== undefined && !past(end, xs[i + 1].x);
      out.push({
        from: xs[i].x, to: xs[i + 1].x, level: L, innermost: inside && L === top, ...(inside ? {} : { outside: true as const }),
        ...(xs[i].touch ? { fromTouch: true as const } : {}), ...(xs[i + 1].touch ? { toTouch: true as const } : {}),
        ...(onStart ? { onStart: true as const } : {}), ...(onEnd ? { onEnd: true as const } : {}),
      });
    }
  }
  if (last && last.level === top && inAtStart(top) !== (topCount % 2 === 1) && past(end, last.x)) {
    out.push({ from: last.x, to: end!, level: top, innermost: true, toEnd: true, ...(last.touch ? { fromTouch: true as const } : {}) });
  }
  if (start !== undefined && first && first.level === top && inAtStart(top) && past(first.x, start)) {
    out.unshift({ from: start, to: first.x, level: top, innermost: true, fromStart: true, ...(first.touch ? { toTouch: true as const } : {}) });
  }
  return out;
}

/**
 * Whether the curve starts inside the contours of one level (insideLevel), read where it is clear of them: halfway from its
 * first point to its next meeting with that level (or its end). Its first point itself may lie on a contour (a curve clicked
 * from where it meets one), where the even–odd rule answers either way. Null as insideLevel.
 */
export function startsInside(curve: readonly XY[], xs: readonly Crossing[], contours: readonly Contour[], level: number): boolean | null {
  const c = cleanPoints(curve);
  if (!c.length) return null;
  const x0 = c[0].x, x1 = c[c.length - 1].x;
  const next = xs.find((p) => p.level === level && p.x > x0 + 1e-9 * (1 + Math.abs(x0)))?.x ?? x1;
  const x = (x0 + next) / 2;
  const y = c.length > 1 ? lineAt(c, x) : c[0].y;
  return y === null ? null : insideLevel({ x, y }, contours, level);
}

/** The impeller's efficiency at flow x read from the crossings (null outside their range and inside a gap). */
export function efficiencyFromContours(xs: readonly Crossing[], x: number): number | null {
  if (contourGaps(xs).some((g) => x > g.from && x < g.to)) return null;
  return valueAt(xs.map((p) => ({ x: p.x, y: p.level })), x);
}
