/**
 * A duty-cycle step's flow as the pump's curve reads it. The step's flow is the design flow × the step's fraction, a
 * binary product: where it should land on the curve's last (or first) published flow it can come out a rounding error past
 * it (100 m³/h × 0.55 = 55.000000000000007 m³/h beside a curve published to 55 m³/h), and the curve, which says nothing past
 * its ends, would refuse the step. Within 1 part in 10⁸ of an end (LIMIT_ROUNDING, the words' digits: a flow printed apart
 * from the end is further out) the flow is taken at that end; beyond, it is returned as given (off the curve, said so by
 * the caller). Units: m³/s. Our rule (common practice for numbers read back at their printed digits).
 */
import { LIMIT_ROUNDING } from "./quantityText.ts";

/**
 * The flow taken at the curve's end (first or last flow) where it lies within 1 part in 10⁸ outside it; else as given.
 * @param q the step's flow, m³/s
 * @param lo the curve's first flow at the speed it runs at, m³/s
 * @param hi the curve's last flow at the speed it runs at, m³/s
 */
export function flowOnCurveEnds(q: number, lo: number, hi: number): number {
  if (q > hi && q <= hi * (1 + LIMIT_ROUNDING)) return hi;
  if (q < lo && q >= lo * (1 - LIMIT_ROUNDING)) return lo;
  return q;
}
