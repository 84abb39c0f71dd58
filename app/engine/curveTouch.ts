/**
 * Where two curves touch between the operating-point solver's samples (used by operatingPoint.ts): the least of a
 * difference g(Q) = pump head − system head (or of −g) near a dip the samples show without a sign change, or between two
 * crossings that a dip a rounding-level deep makes. Within TOUCH_GAP of the pump's head of zero it is one touch; below
 * it, two crossings; above it, the curves part. The least is found by golden-section search (J. Kiefer, "Sequential
 * minimax search for a maximum", Proc. AMS 4, 1953), which needs no derivative: the pump's interpolant is only C¹ at its
 * knots.
 */
import { LIMIT_ROUNDING } from "./limitText.ts";
import { brent } from "./roots.ts";

/**
 * How close to zero (a share of the pump's head there, dimensionless) the least of the heads' difference over a dip may
 * be for the curves to touch there: LIMIT_ROUNDING, 1 part in 10⁸ (limitText.ts: within it a value is at its limit and
 * prints as it). A dip that deep below the system's head, or a gap that small above it, is a touch; further either way,
 * two crossings or no meeting.
 */
export const TOUCH_GAP = LIMIT_ROUNDING;

const GOLD = (Math.sqrt(5) - 1) / 2; // 0.618…, the golden section's ratio (dimensionless)

/**
 * The least of f on [a, b] (golden-section search; f taken as having one least inside, the ends compared too).
 * @param f a function of flow (m³/s → m)
 * @param a first flow, m³/s
 * @param b last flow, m³/s (b > a)
 * @param xtol flow tolerance, m³/s
 * @returns the flow where f is least (m³/s) and f there (m)
 */
export function leastOn(f: (x: number) => number, a: number, b: number, xtol: number): { x: number; fx: number } {
  let lo = a, hi = b;
  let x1 = hi - GOLD * (hi - lo), x2 = lo + GOLD * (hi - lo);
  let f1 = f(x1), f2 = f(x2);
  for (let it = 0; it < 200 && hi - lo > xtol; it++) {
    if (f1 <= f2) {
      hi = x2; x2 = x1; f2 = f1;
      x1 = hi - GOLD * (hi - lo); f1 = f(x1);
    } else {
      lo = x1; x1 = x2; f1 = f2;
      x2 = lo + GOLD * (hi - lo); f2 = f(x2);
    }
  }
  let best = f1 <= f2 ? { x: x1, fx: f1 } : { x: x2, fx: f2 };
  for (const x of [a, b]) {
    const fx = f(x);
    if (fx < best.fx) best = { x, fx };
  }
  return best;
}

/**
 * A meeting of the curves: a crossing, a touch (g keeps its sign on both sides), or a stretch where they coincide; `after`,
 * where known, the sign of g just past it (a crossing or touch between two samples, which the samples cannot tell).
 */
export type Root = { x: number; xEnd?: number; fx: number; method: "brent" | "bisection"; iterations: number; kind: "cross" | "touch" | "stretch"; side: number; after?: number;
  /** A touch's or stretch's flows where the heads stay within TOUCH_GAP of the pump's head (`lo`–`hi`), and their share of the published flows (meetings.ts). */
  lo?: number; hi?: number; share?: number };

/**
 * Touches the samples miss or split (TOUCH_GAP, curveTouch.ts), into `roots` (sorted by flow on return): (1) a dip of
 * g (or a hump) between samples of one sign: its least within TOUCH_GAP of the pump's head of zero is one touch, deeper two
 * crossings (before, missed: no sign change at the samples); (2) two crossings in a row, into and back out of a dip no
 * deeper than TOUCH_GAP of the head: one touch at its least (before, two crossings).
 * @param roots the meetings found at the samples' sign changes and stretches (flows m³/s, g in m); touches and the
 *   crossings either side of a deeper dip are added, and two crossings around a rounding-level dip become one touch
 * @param s the solver's samples: g(Q) = pump head − system head (m³/s → m), the sample flows `qs` (m³/s) and g there
 *   `gs` (m), `near(i)` (sample i at equal heads to rounding), the flow tolerance `xtol` (m³/s), Brent's iteration cap
 *   `maxIt` (count) and the pump's head (m³/s → m)
 */
export function findTouches(roots: Root[], s: { g: (q: number) => number; qs: number[]; gs: number[]; near: (i: number) => boolean;
  xtol: number; maxIt: number; pumpHead: (q: number) => number }): void {
  const { g, qs, gs, near, xtol, maxIt } = s;
  const gap = (q: number) => TOUCH_GAP * Math.abs(s.pumpHead(q)); // m
  for (let j = 1; j < qs.length - 1; j++) {
    if (near(j - 1) || near(j) || near(j + 1)) continue;
    const sg = Math.sign(gs[j]);
    if (sg === 0 || Math.sign(gs[j - 1]) !== sg || Math.sign(gs[j + 1]) !== sg) continue;
    if (!(sg * gs[j - 1] > sg * gs[j] && sg * gs[j + 1] >= sg * gs[j])) continue; // not the samples' least of sg·g
    const m = leastOn((q) => sg * g(q), qs[j - 1], qs[j + 1], xtol);
    if (m.fx > gap(m.x)) continue; // the curves part
    if (m.fx >= -gap(m.x)) {
      roots.push({ x: m.x, fx: sg * m.fx, method: "brent", iterations: 0, kind: "touch", side: sg, after: sg });
      continue;
    }
    for (const [a, b, after] of [[qs[j - 1], m.x, -sg], [m.x, qs[j + 1], sg]]) {
      const r = brent(g, a, b, xtol, maxIt);
      if (r) roots.push({ x: r.x, fx: r.fx, method: r.method, iterations: r.iterations, kind: "cross", side: -after, after });
    }
  }
  roots.sort((a, b) => a.x - b.x);
  for (let k = 0; k + 1 < roots.length; k++) {
    const r1 = roots[k], r2 = roots[k + 1];
    if (r1.kind !== "cross" || r2.kind !== "cross" || r1.side === 0 || r2.side !== -r1.side) continue;
    const sg = r1.side;
    const m = leastOn((q) => sg * g(q), r1.x, r2.x, xtol);
    let least = m.fx;
    for (let i = 0; i < qs.length; i++) if (qs[i] > r1.x && qs[i] < r2.x) least = Math.min(least, sg * gs[i]);
    if (least < -gap(m.x)) continue; // a real dip: two crossings
    roots.splice(k, 2, { x: m.x, fx: sg * m.fx, method: r1.method, iterations: r1.iterations + r2.iterations, kind: "touch", side: sg, after: sg });
  }
}
