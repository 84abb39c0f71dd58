/**
 * Bracketed root finding: R. P. Brent, "Algorithms for Minimization without Derivatives"
 * (Prentice-Hall, 1973), ch. 4 (zero finder combining bisection, secant and inverse
 * quadratic interpolation), with an iteration cap and bisection as the named fallback.
 */
import { EngineInputError } from "./errors.ts";

/** Throws unless f is a function, a and b finite, tol (if given) finite and ≥ 0, and the cap a whole number ≥ 1. */
function checkBracket(f: unknown, a: number, b: number, tol: number | undefined, maxIterations: number): void {
  if (typeof f !== "function") throw new EngineInputError("f", "must be a function");
  if (!(a > -Infinity && a < Infinity)) throw new EngineInputError("a", `must be a finite number (got ${a})`);
  if (!(b > -Infinity && b < Infinity)) throw new EngineInputError("b", `must be a finite number (got ${b})`);
  if (tol !== undefined && !(tol >= 0 && tol < Infinity)) throw new EngineInputError("tol", `must be a finite number ≥ 0 (got ${tol})`);
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1)) throw new EngineInputError("maxIterations", `must be a whole number ≥ 1 (got ${maxIterations})`);
}

/** Result of a bracketed solve. */
export interface RootResult {
  /** The root (unit of the bracket). */
  x: number;
  /** Function value there (unit of f). */
  fx: number;
  iterations: number;
  /** `brent`, or `bisection` when Brent hit its cap and bisection finished the job. */
  method: "brent" | "bisection";
  converged: boolean;
}

/**
 * Brent's zero finder on [a, b] with f(a)·f(b) ≤ 0; falls back to bisection after
 * `maxIterations`. Returns null if the bracket does not straddle a sign change.
 * @param f function of one variable (any units)
 * @param a lower end of the bracket (unit of x)
 * @param b upper end of the bracket (unit of x)
 * @param tol absolute tolerance on x (unit of x; default 1e-12·max(|a|,|b|,1e-300))
 * @param maxIterations iteration cap for Brent (count, dimensionless; default 100)
 */
export function brent(
  f: (x: number) => number,
  a: number,
  b: number,
  tol?: number,
  maxIterations = 100,
): RootResult | null {
  checkBracket(f, a, b, tol, maxIterations);
  let fa = f(a), fb = f(b);
  if (fa === 0) return { x: a, fx: 0, iterations: 0, method: "brent", converged: true };
  if (fb === 0) return { x: b, fx: 0, iterations: 0, method: "brent", converged: true };
  if (!(fa * fb < 0)) return null;
  const xtol = tol ?? 1e-12 * Math.max(Math.abs(a), Math.abs(b), 1e-300);
  let c = a, fc = fa, d = b - a, e = d;
  for (let it = 1; it <= maxIterations; it++) {
    if (fb * fc > 0) { c = a; fc = fa; d = b - a; e = d; }
    if (Math.abs(fc) < Math.abs(fb)) { a = b; b = c; c = a; fa = fb; fb = fc; fc = fa; }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return { x: b, fx: fb, iterations: it, method: "brent", converged: true };
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number, q: number;
      if (a === c) {
        p = 2 * xm * s; q = 1 - s;
      } else {
        const qq = fa / fc, r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q; else p = -p;
      if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) { e = d; d = p / q; }
      else { d = xm; e = d; }
    } else { d = xm; e = d; }
    a = b; fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  // Fallback: bisection on the current bracket (b with c, or with a when b and c share a sign).
  if (fb * fc > 0) c = a;
  return bisection(f, Math.min(b, c), Math.max(b, c), xtol, 200, maxIterations);
}

/**
 * Plain bisection on [a, b] with f(a)·f(b) ≤ 0.
 * @param f function of one variable (any units)
 * @param a lower end (unit of x)
 * @param b upper end (unit of x)
 * @param tol absolute tolerance on x (unit of x)
 * @param maxIterations cap (count, dimensionless)
 * @param startCount iterations already spent, added to the count (count, dimensionless)
 */
export function bisection(
  f: (x: number) => number,
  a: number,
  b: number,
  tol: number,
  maxIterations = 200,
  startCount = 0,
): RootResult | null {
  checkBracket(f, a, b, tol, maxIterations);
  let fa = f(a);
  const fb = f(b);
  if (fa === 0) return { x: a, fx: 0, iterations: startCount, method: "bisection", converged: true };
  if (fb === 0) return { x: b, fx: 0, iterations: startCount, method: "bisection", converged: true };
  if (!(fa * fb < 0)) return null;
  let lo = a, hi = b, it = 0;
  while (it < maxIterations) {
    it++;
    const mid = 0.5 * (lo + hi);
    const fm = f(mid);
    if (fm === 0 || hi - lo <= tol) return { x: mid, fx: fm, iterations: startCount + it, method: "bisection", converged: true };
    if (fa * fm < 0) hi = mid; else { lo = mid; fa = fm; }
  }
  const mid = 0.5 * (lo + hi);
  return { x: mid, fx: f(mid), iterations: startCount + it, method: "bisection", converged: false };
}
