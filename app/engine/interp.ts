/**
 * Monotone piecewise cubic Hermite interpolation after F. N. Fritsch and R. E. Carlson,
 * "Monotone piecewise cubic interpolation", SIAM J. Numer. Anal. 17(2) (1980) 238–246.
 * Between data points the interpolant is monotone wherever the data are, so it never
 * overshoots or oscillates; at a local extremum of the data the slope is set to zero.
 * Defined only on [x₀, x_last]; outside, evaluation returns null.
 */

/** A prepared monotone cubic: knots, values and tangents. */
export interface MonotoneCubic {
  x: Float64Array;
  y: Float64Array;
  m: Float64Array;
}

/**
 * Builds the interpolant. Knots must be strictly increasing (checked by callers).
 * @param xs knots (any unit, strictly increasing)
 * @param ys values at the knots (any unit)
 */
export function monotoneCubic(xs: readonly number[], ys: readonly number[]): MonotoneCubic {
  const n = xs.length;
  const x = Float64Array.from(xs);
  const y = Float64Array.from(ys);
  const m = new Float64Array(n);
  if (n === 1) return { x, y, m };
  const d = new Float64Array(n - 1);
  for (let k = 0; k < n - 1; k++) d[k] = (y[k + 1] - y[k]) / (x[k + 1] - x[k]);
  // Step 1: initial tangents (three-point average inside, one-sided at the ends).
  m[0] = d[0];
  m[n - 1] = d[n - 2];
  for (let k = 1; k < n - 1; k++) m[k] = d[k - 1] * d[k] <= 0 ? 0 : (d[k - 1] + d[k]) / 2;
  // Steps 2–5: make each interval monotone (α² + β² ≤ 9).
  for (let k = 0; k < n - 1; k++) {
    if (d[k] === 0) {
      m[k] = 0;
      m[k + 1] = 0;
      continue;
    }
    const a = m[k] / d[k];
    const b = m[k + 1] / d[k];
    const s = a * a + b * b;
    if (s > 9) {
      const t = 3 / Math.sqrt(s);
      m[k] = t * a * d[k];
      m[k + 1] = t * b * d[k];
    }
  }
  return { x, y, m };
}

/**
 * Evaluates the interpolant; null outside [x₀, x_last].
 * @param c the interpolant (unitless descriptor)
 * @param t abscissa (unit of the knots)
 */
export function evalCubic(c: MonotoneCubic, t: number): number | null {
  const x = c.x;
  const n = x.length;
  if (!(t >= x[0] && t <= x[n - 1])) return null;
  if (n === 1) return c.y[0];
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid] <= t) lo = mid; else hi = mid;
  }
  const h = x[hi] - x[lo];
  const s = (t - x[lo]) / h;
  const s2 = s * s, s3 = s2 * s;
  return (2 * s3 - 3 * s2 + 1) * c.y[lo] + (s3 - 2 * s2 + s) * h * c.m[lo] + (-2 * s3 + 3 * s2) * c.y[hi] + (s3 - s2) * h * c.m[hi];
}
