/**
 * A tolerance grade's power and efficiency limits at a measured point (the other half of a grade, beside the
 * flow/head tolerance cross of fieldCheck.ts). ISO 9906:2012 acceptance grades, from memory — verify against the
 * standard: each grade has a power tolerance tP (the measured power may exceed the guaranteed power by at most tP)
 * and an efficiency tolerance tη (the measured efficiency may fall short of the guaranteed efficiency by at most
 * |tη|; 0 for 1E and 1U). How they are applied here:
 *  - power: P_measured ≤ (1 + powerAbove) · P_curve, both shaft power at the measured flow on the curve (the curve as
 *    given: translate it to the measured speed first);
 *  - efficiency: η = ρ·g₀·Q·H / P (hydraulic power over shaft power, common practice), and
 *    η_measured ≥ (1 − efficiencyBelow) · η_curve at the measured flow — the allowance read as a fraction of the
 *    curve's efficiency (relative: 3 % of 70 % is 2.1 points), as the standard's tolerances are percentages of the
 *    guaranteed values (our reading, from memory). If the standard means percentage points instead, the bound
 *    becomes η_curve − efficiencyBelow: verify against ISO 9906:2012 before relying on a verdict near the limit.
 * Where the standard reads the guarantee at the point where the measured curve meets the line through the origin and
 * the guarantee point, one field reading against a published curve is judged at the measured flow.
 * Units SI: flow m³/s, head m, density kg/m³, power W; allowances and efficiencies as fractions.
 */
import { EngineInputError, requireFinite, requireInRange, requireNonNegative, requirePositive } from "./errors.ts";
import type { ToleranceGrade } from "./fieldCheck.ts";
import { efficiencyAt, ensurePumpCurve, shaftPowerAt, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { G0 } from "./units.ts";
import { gradeAllows } from "./limitText.ts";

/** One of a grade's power or efficiency limits at the measured point. */
export interface GradeLimitCheck {
  /** Measured: shaft power, W; or the pump's efficiency (fraction). */
  measured: number;
  /** The curve's value at the measured flow (W, or fraction); null where the curve gives none. */
  curve: number | null;
  /** (measured − curve)/curve, fraction; null without a curve value. */
  deviation: number | null;
  /** The grade's allowance as a fraction of the curve's value: power may be above it by this, efficiency below it by this. */
  allowed: number;
  /** True: met; false: missed; null: not judged (no curve value at this flow). */
  pass: boolean | null;
}

/** A grade's power and efficiency limits at a measured point. */
export interface GradePowerCheck {
  /** Null when the grade sets no power limit. */
  power: GradeLimitCheck | null;
  /** Null when the grade sets no efficiency limit, or the head is not above zero (no hydraulic power). */
  efficiency: GradeLimitCheck | null;
  /** False: a judged limit is missed; true: every judged limit is met (at least one judged); null: none judged. */
  pass: boolean | null;
}

function limit(measured: number, curve: number | null, allowed: number, side: "above" | "below"): GradeLimitCheck {
  const deviation = curve !== null && curve > 0 ? measured / curve - 1 : null;
  const pass = deviation === null ? null : side === "above" ? gradeAllows(deviation, Infinity, allowed) : gradeAllows(deviation, allowed, Infinity);
  return { measured, curve, deviation, allowed, pass };
}

/**
 * A grade's power and efficiency limits at a measured point (module comment: how each allowance is applied).
 * @param curve pump curve at the speed judged (prepared or raw; SI)
 * @param flow measured flow, m³/s
 * @param head measured head, m
 * @param density liquid density, kg/m³
 * @param shaftPower measured shaft power, W (a motor's input power × its efficiency; never the input power itself)
 * @param grade tolerance grade (fractions; `powerAbove` and `efficiencyBelow` each in [0, 1] when set)
 */
export function gradePower(curve: PumpCurve | PumpCurveInput, flow: number, head: number, density: number, shaftPower: number, grade: ToleranceGrade): GradePowerCheck {
  const c = ensurePumpCurve(curve);
  const q = requireNonNegative("flow", flow);
  const h = requireFinite("head", head);
  const rho = requirePositive("density", density);
  const p = requirePositive("shaftPower", shaftPower);
  const powerAbove = grade?.powerAbove === undefined ? null : requireInRange("grade.powerAbove", grade.powerAbove, 0, 1);
  const efficiencyBelow = grade?.efficiencyBelow === undefined ? null : requireInRange("grade.efficiencyBelow", grade.efficiencyBelow, 0, 1);
  const power = powerAbove === null ? null : limit(p, shaftPowerAt(c, q, rho), powerAbove, "above");
  const efficiency = efficiencyBelow === null || !(h > 0) ? null : limit((rho * G0 * q * h) / p, efficiencyAt(c, q), efficiencyBelow, "below");
  const judged = [power, efficiency].filter((x): x is GradeLimitCheck => x !== null && x.pass !== null);
  return { power, efficiency, pass: judged.length ? judged.every((x) => x.pass) : null };
}

/** A shaft power within a power reading's accuracy that meets a grade's power and efficiency limits, and those limits judged there. */
export interface GradePowerWitness {
  /** The shaft power, W. */
  shaft: number;
  check: GradePowerCheck;
}

/**
 * Whether a shaft power read to ± `accuracy` (a fraction of the reading) could meet a grade's power and efficiency limits
 * at the measured flow and head. The true power lies in [P(1 − a), P(1 + a)]. Both limits bound it from above: power
 * P ≤ (1 + tP)·P_curve, and efficiency ρ·g₀·Q·H / P ≥ (1 − tη)·η_curve (efficiency moves inversely with power), so some
 * power of the band meets them exactly when its low end P(1 − a) does — judged there by {@link gradePower}. Only the
 * power reading's accuracy is allowed for here; flow and head are taken as read.
 * Why not at a corner of the flow/head uncertainty box (gradeUncertainty.ts) — decided 2026-12-03, our policy, not a
 * standard's (ISO 9906's own uncertainty rules from memory only, not checked): the box is used one way only, for benefit
 * of the doubt ("marginal" when SOME point of it meets the cross); a reading met as read is never marked down for its
 * uncertainty, so the worst corner would contradict it. The consistent counterpart, the most favourable (q, h) of the box
 * for power too, is not a small change: P_curve(q) = ρ·g₀·q·H(q)/η(q) and the efficiency bound are not monotone between
 * knots, so it could only be sampled (which that module was written to avoid), and an honest witness would have to meet
 * the cross, power and efficiency at one point. So flow and head stay as read here, and the check says so.
 * @returns null when the limits are missed even at P(1 − a) (or none is judged); else a power that meets them: the reading
 *   itself when it does, otherwise the middle of [P(1 − a), the highest power meeting them] (P(1 − a) if rounding misses there)
 * @param curve pump curve at the speed judged (prepared or raw; SI)
 * @param flow measured flow, m³/s
 * @param head measured head, m
 * @param density liquid density, kg/m³
 * @param shaftPower measured shaft power, W (as read)
 * @param grade tolerance grade (fractions)
 * @param accuracy the power reading's accuracy, ± fraction of reading, in [0, 1)
 */
export function gradePowerWithinAccuracy(curve: PumpCurve | PumpCurveInput, flow: number, head: number, density: number, shaftPower: number, grade: ToleranceGrade, accuracy: number): GradePowerWitness | null {
  const c = ensurePumpCurve(curve);
  const a = requireInRange("accuracy", accuracy, 0, 1);
  if (!(a < 1)) throw new EngineInputError("accuracy", `must be below 1 (got ${a})`);
  const p = requirePositive("shaftPower", shaftPower);
  const asRead = gradePower(c, flow, head, density, p, grade);
  if (asRead.pass === null) return null;
  if (asRead.pass) return { shaft: p, check: asRead };
  const low = p * (1 - a);
  const atLow = gradePower(c, flow, head, density, low, grade);
  if (atLow.pass !== true) return null;
  // The highest power meeting both limits: each bound read back from the check at the reading (η·P = ρ·g₀·Q·H is fixed).
  const pw = asRead.power;
  const ef = asRead.efficiency;
  const byPower = pw && pw.curve !== null && pw.pass !== null ? (1 + pw.allowed) * pw.curve : Infinity;
  const byEfficiency = ef && ef.curve !== null && ef.pass !== null && (1 - ef.allowed) * ef.curve > 0 ? (ef.measured * p) / ((1 - ef.allowed) * ef.curve) : Infinity;
  const mid = (low + Math.min(p, byPower, byEfficiency)) / 2;
  const atMid = gradePower(c, flow, head, density, mid, grade);
  return atMid.pass === true ? { shaft: mid, check: atMid } : { shaft: low, check: atLow };
}
