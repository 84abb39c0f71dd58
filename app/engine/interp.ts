/**
 * Monotone piecewise cubic Hermite interpolation after F. N. Fritsch and R. E. Carlson,
 * "Monotone piecewise cubic interpolation", SIAM J. Numer. Anal. 17(2) (1980) 238–246.
 * Between data points the interpolant is monotone wherever the data are, so it never
 * overshoots or oscillates; at a local extremum of the data the slope is set to zero.
 * Defined only on [x₀, x_last]; outside, evaluation returns null.
 */
import { EngineInputError } from "./errors.ts";

/** A prepared monotone cubic: knots, values and tangents. */
export interface MonotoneCubic {
  x: number[];
  y: number[];
  m: number[];
}

/**
 * Fritsch-Carlson tangents for knots x[off..off+n) with values y[off..off+n), written to
 * m[off..off+n). Arrays may hold several curves end to end (the search index packs them).
 * @param x knots (any unit, strictly increasing within the range)
 * @param y values at the knots (any unit)
 * @param m output tangents (unit of y per unit of x)
 * @param off first index of this curve (count, dimensionless)
 * @param n number of knots (count, dimensionless)
 */
export function fritschCarlsonTangents(x: ArrayLike<number>, y: ArrayLike<number>, m: number[] | Float64Array, off: number, n: number): void {
  if (n < 2) {
    if (n === 1) m[off] = 0;
    return;
  }
  const last = off + n - 1;
  // Step 1: initial tangents (three-point average inside, one-sided at the ends).
  let dPrev = (y[off + 1] - y[off]) / (x[off + 1] - x[off]);
  m[off] = dPrev;
  for (let k = off + 1; k < last; k++) {
    const d = (y[k + 1] - y[k]) / (x[k + 1] - x[k]);
    m[k] = dPrev * d <= 0 ? 0 : (dPrev + d) / 2;
    dPrev = d;
  }
  m[last] = dPrev;
  // Steps 2–5: make each interval monotone (α² + β² ≤ 9).
  for (let k = off; k < last; k++) {
    const d = (y[k + 1] - y[k]) / (x[k + 1] - x[k]);
    if (d === 0) {
      m[k] = 0;
      m[k + 1] = 0;
      continue;
    }
    const a = m[k] / d;
    const b = m[k + 1] / d;
    const s = a * a + b * b;
    if (s > 9) {
      const t = 3 / Math.sqrt(s);
      // α or β past the largest double (a tangent over a step of some 1e-321, values a maker's cell of 1e-323 m apart)
      // made t 0 and 0 × Infinity a NaN tangent, and every value read in the interval NaN (the search threw): there the
      // limit of t·α·d, 3·m/√(α² + β²), is 0 — a flat tangent, which keeps the interval monotone.
      if (Number.isFinite(a) && Number.isFinite(b)) {
        m[k] = t * a * d;
        m[k + 1] = t * b * d;
      } else {
        const r = Math.hypot(a, b);
        m[k] = 3 * m[k] / r;
        m[k + 1] = 3 * m[k + 1] / r;
      }
    }
  }
}

/**
 * Builds the interpolant. Knots must be strictly increasing (checked by callers).
 * @param xs knots (any unit, strictly increasing)
 * @param ys values at the knots (any unit)
 */
export function monotoneCubic(xs: readonly number[], ys: readonly number[]): MonotoneCubic {
  if (!Array.isArray(xs) || xs.length === 0) throw new EngineInputError("xs", "must be a non-empty array of knots");
  if (!Array.isArray(ys) || ys.length !== xs.length) throw new EngineInputError("ys", "must have one value per knot");
  const n = xs.length;
  for (let k = 0; k < n; k++) {
    if (!Number.isFinite(xs[k])) throw new EngineInputError(`xs[${k}]`, `must be a finite number (got ${xs[k]})`);
    if (!Number.isFinite(ys[k])) throw new EngineInputError(`ys[${k}]`, `must be a finite number (got ${ys[k]})`);
    if (k > 0 && !(xs[k] > xs[k - 1])) throw new EngineInputError(`xs[${k}]`, "knots must be strictly increasing");
  }
  // Plain arrays: cheaper to allocate and to keep alive than typed arrays for a few knots.
  const x = xs.slice();
  const y = ys.slice();
  const m: number[] = [];
  for (let k = 0; k < n; k++) m.push(0.5); // packed double array, values set below
  fritschCarlsonTangents(x, y, m, 0, n);
  return { x, y, m };
}

/**
 * Evaluates the interpolant; null outside [x₀, x_last].
 * @param c the interpolant (unitless descriptor)
 * @param t abscissa (unit of the knots)
 */
export function evalCubic(c: MonotoneCubic, t: number): number | null {
  if (!(t > -Infinity && t < Infinity)) throw new EngineInputError("t", `must be a finite number (got ${t})`);
  if (!c || !c.x || !(c.x.length > 0)) throw new EngineInputError("c", "must be an interpolant from monotoneCubic");
  const x = c.x;
  const n = x.length;
  if (!(t >= x[0] && t <= x[n - 1])) return null;
  if (n === 1) return c.y[0];
  return hermiteIn(x, c.y, c.m, 0, n - 1, t);
}

/**
 * Cubic Hermite value at t between knots lo and hi of (x, y, m) arrays, with x[lo] ≤ t ≤ x[hi] and
 * lo < hi (bisection finds the interval). Shared by evalCubic and the search's packed columns.
 * @param x knots (any unit)
 * @param y values at the knots (any unit)
 * @param m tangents at the knots (unit of y per unit of x)
 * @param lo first knot index (count, dimensionless)
 * @param hi last knot index (count, dimensionless)
 * @param t abscissa (unit of the knots)
 */
export function hermiteIn(x: ArrayLike<number>, y: ArrayLike<number>, m: ArrayLike<number>, lo: number, hi: number, t: number): number {
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid] <= t) lo = mid; else hi = mid;
  }
  const h = x[hi] - x[lo];
  const s = (t - x[lo]) / h;
  const s2 = s * s, s3 = s2 * s;
  return (2 * s3 - 3 * s2 + 1) * y[lo] + (s3 - 2 * s2 + s) * h * m[lo] + (-2 * s3 + 3 * s2) * y[hi] + (s3 - s2) * h * m[hi];
}
