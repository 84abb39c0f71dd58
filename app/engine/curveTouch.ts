/**
 * Where two curves touch between the operating-point solver's samples (used by operatingPoint.ts): the least of a
 * difference g(Q) = pump head − system head (or of −g) near a dip the samples show without a sign change, or between two
 * crossings that a dip a rounding-level deep makes. Within TOUCH_GAP of the pump's head of zero it is one touch; below
 * it, two crossings; above it, the curves part. The least is found by golden-section search (J. Kiefer, "Sequential
 * minimax search for a maximum", Proc. AMS 4, 1953), which needs no derivative: the pump's interpolant is only C¹ at its
 * knots.
 */
import { LIMIT_ROUNDING } from "./limitText.ts";

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
