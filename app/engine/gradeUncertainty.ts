/**
 * Whether a field reading could meet a tolerance grade within its own uncertainty: some point of the box
 * [flow ± meter accuracy] × [head ± gauge uncertainty] inside either arm of the grade's tolerance cross
 * ({@link gradeCross}; ISO 9906 grades, `TOLERANCE_GRADES`). Solved, not sampled: a grid over the box misses
 * a band narrower than its spacing (a low-head circulator, ±3 % of 4 m = ±0.12 m, read with gauges worth
 * ±0.7 m). The engine's head curve is a Fritsch–Carlson interpolant (interp.ts), monotone between knots, so
 * over a flow interval its head spans exactly the values at the interval's ends and at the knots inside it.
 * Units SI: flow m³/s, head m; grades as fractions.
 */
import { EngineInputError, requireFinite } from "./errors.ts";
import { checkGrade, gradeCross, type ToleranceGrade } from "./fieldCheck.ts";
import { evalCubic } from "./interp.ts";
import { ensurePumpCurve, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";

/** The box of readings the instruments cannot tell apart: flow [low, high] m³/s, head [low, high] m. */
export interface ReadingBox {
  flow: readonly [number, number];
  head: readonly [number, number];
}

/** A point of the box that meets the grade, and the arm of the cross it meets it by. */
export interface GradeWitness {
  flow: number;
  head: number;
  arm: "head" | "flow";
}

/** The curve's head over [a, b] ∩ its flow range: lowest and highest, with a flow giving each; null if they do not overlap. */
function headSpan(c: PumpCurve, a: number, b: number) {
  const lo = Math.max(a, c.flowMin);
  const hi = Math.min(b, c.flowMax);
  if (!(lo <= hi)) return null;
  const xs = [lo, ...c.head.x.filter((x) => x > lo && x < hi), hi];
  let min = { x: lo, y: Infinity };
  let max = { x: lo, y: -Infinity };
  for (const x of xs) {
    const y = evalCubic(c.head, x) as number;
    if (y < min.y) min = { x, y };
    if (y > max.y) max = { x, y };
  }
  return { min, max };
}

/** A flow between xa and xb where the head is `target` (it lies between the heads there): bisection, 200 steps at most. */
function flowAtHead(c: PumpCurve, target: number, xa: number, xb: number): number {
  let fa = (evalCubic(c.head, xa) as number) - target;
  if (fa === 0) return xa;
  if ((evalCubic(c.head, xb) as number) - target === 0) return xb;
  for (let i = 0; i < 200 && xa !== xb; i++) {
    const xm = (xa + xb) / 2;
    if (xm === xa || xm === xb) break;
    const fm = (evalCubic(c.head, xm) as number) - target;
    if (fm === 0) return xm;
    if ((fm < 0) === (fa < 0)) {
      xa = xm;
      fa = fm;
    } else xb = xm;
  }
  return (xa + xb) / 2;
}

/** The middle of [max(a, c), min(b, d)], or null when that is empty. */
function midOverlap(a: number, b: number, c: number, d: number): number | null {
  const lo = Math.max(a, c);
  const hi = Math.min(b, d);
  return lo <= hi ? (lo + hi) / 2 : null;
}

/**
 * A point of `box` that meets `grade` on `curve` (checked with {@link gradeCross}), or null when none does.
 * Flows and heads at or below zero are left out of the box (a reading there meets nothing).
 * @param curve pump curve (prepared or raw; SI)
 * @param box the readings' uncertainty: flow [low, high] m³/s, head [low, high] m
 * @param grade tolerance grade (fractions)
 */
export function gradeWithinUncertainty(curve: PumpCurve | PumpCurveInput, box: ReadingBox, grade: ToleranceGrade): GradeWitness | null {
  const c = ensurePumpCurve(curve);
  checkGrade(grade);
  if (!box || !Array.isArray(box.flow) || !Array.isArray(box.head)) throw new EngineInputError("box", "must have flow and head ranges [low, high]");
  const [q1, q2] = box.flow.map((x, i) => requireFinite(`box.flow[${i}]`, x));
  const [h1, h2] = box.head.map((x, i) => requireFinite(`box.head[${i}]`, x));
  if (!(q1 <= q2)) throw new EngineInputError("box.flow", `must be [low, high] (got [${q1}, ${q2}])`);
  if (!(h1 <= h2)) throw new EngineInputError("box.head", `must be [low, high] (got [${h1}, ${h2}])`);
  const tiny = Number.MIN_VALUE;
  const qa = Math.max(q1, tiny);
  const ha = Math.max(h1, tiny);
  if (qa > q2 || ha > h2) return null;
  const [fBelow, fAbove] = grade.flow;
  const [hBelow, hAbove] = grade.head;
  const meets = (w: GradeWitness) => (gradeCross(c, w.flow, w.head, grade).pass ? w : null);

  // Head arm: H(q)(1 − below) ≤ h ≤ H(q)(1 + above) for some q, h of the box ⇔ H over the box's flows reaches
  // [h_low / (1 + above), h_high / (1 − below)].
  const span = headSpan(c, qa, q2);
  if (span) {
    const target = midOverlap(span.min.y, span.max.y, Math.max(ha / (1 + hAbove), tiny), hBelow < 1 ? h2 / (1 - hBelow) : Infinity);
    if (target !== null) {
      const q = flowAtHead(c, target, span.min.x, span.max.x);
      const h = midOverlap(ha, h2, target * (1 - hBelow), target * (1 + hAbove));
      const w = h !== null ? meets({ flow: q, head: h, arm: "head" }) : null;
      if (w) return w;
    }
  }
  // Flow arm: Q(h)(1 − below) ≤ q ≤ Q(h)(1 + above), Q(h) the curve's flow at head h ⇔ the curve reaches a head of
  // the box at a flow in [q_low / (1 + above), q_high / (1 − below)].
  const reach = headSpan(c, qa / (1 + fAbove), fBelow < 1 ? q2 / (1 - fBelow) : c.flowMax);
  if (reach) {
    const h = midOverlap(reach.min.y, reach.max.y, ha, h2);
    if (h !== null) {
      const x = flowAtHead(c, h, reach.min.x, reach.max.x);
      const q = midOverlap(qa, q2, x * (1 - fBelow), x * (1 + fAbove));
      // On a drooping curve gradeCross reads the flow at this head on one branch only: the check below keeps the answer true.
      const w = q !== null ? meets({ flow: q, head: h, arm: "flow" }) : null;
      if (w) return w;
    }
  }
  return null;
}
