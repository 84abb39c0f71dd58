/**
 * Field check maths.
 * TDH from gauges (Bernoulli between the two taps, common practice):
 *   TDH = (p_d − p_s)/(ρ·g₀) + (z_d − z_s) + (V_d² − V_s²)/(2·g₀),
 * with gauge pressures p (Pa, same reference for both), gauge elevations z (m, above a common
 * datum) and V = Q/A at each tap's pipe inner diameter.
 * With a flow meter: deviation of the measured point from the curve, and a verdict against
 * tolerance grades. Without: flow is inferred where the curve meets the measured TDH, and a
 * band from the gauge accuracy (root-sum-square of both gauges, as independent errors)
 * is carried through the curve: flat curves give wide bands.
 * Tolerance grades are data (ISO 9906:2012, from memory — correct them here if needed); a point meets a
 * grade when it meets either arm of the standard's tolerance cross (gradeCross) AND, where a shaft power was
 * measured, the grade's power and efficiency limits (gradePower.ts: how each allowance is applied).
 */
import { EngineInputError, requireFinite, requireFiniteResult, requireInRange, requireNonNegative, requirePositive, type EngineWarning } from "./errors.ts";
import { checkFluid, type Fluid } from "./fluids.ts";
import { evalCubic } from "./interp.ts";
import { gradePower, type GradePowerCheck } from "./gradePower.ts";
import { ensurePumpCurve, shaftPowerAt, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { brent } from "./roots.ts";
import { G0 } from "./units.ts";
import { fmtPctExact, fmtPctLimit, fmtPctSignedExact, gradeAllows } from "./quantityText.ts";

/** An acceptance grade: allowed deviations as fractions, [below, above]. */
export interface ToleranceGrade {
  id: string;
  /** Flow tolerance, fractions: measured may be from (1 − below)·Q to (1 + above)·Q. */
  flow: readonly [number, number];
  /** Head tolerance, fractions. */
  head: readonly [number, number];
  /** Shaft power may exceed the curve's by this fraction of it (ISO 9906 tP; optional; gradePower.ts). */
  powerAbove?: number;
  /** Efficiency may fall short of the curve's by this fraction of it — relative, not percentage points (ISO 9906 tη, our reading from memory; optional; gradePower.ts). */
  efficiencyBelow?: number;
  source: string;
}

/** Half-width of the inferred flow band (fraction of the flow) past which the check says to fit a flow meter (common practice). */
const WIDE_FLOW_BAND = 0.1;

/**
 * The inferred flow band's half-width as a percentage of the flow, "±12 %", with the decimals that keep it apart from
 * `WIDE_FLOW_BAND` ("±10.0001 %", never "±10 %" beside the warning that it is wider than ±10 %): the warning and the
 * check page's band row say the same number.
 * @param low the band's low flow, m³/s
 * @param high the band's high flow, m³/s
 * @param flow the flow inferred from the curve, m³/s (> 0)
 * @throws EngineInputError when a flow is not finite, one below zero, the flow not above zero, or high below low
 */
export function flowBandHalfWidthText(low: number, high: number, flow: number): string {
  const a = requireNonNegative("low", low);
  const b = requireNonNegative("high", high);
  const q = requirePositive("flow", flow);
  if (b < a) throw new EngineInputError("high", "must be at least the band's low flow");
  return `±${fmtPctExact((b - a) / 2 / q, [WIDE_FLOW_BAND], 0)}`;
}
const ISO = "ISO 9906:2012 acceptance grades (from memory; verify against the standard)";

/** Acceptance grades, tightest first. */
export const TOLERANCE_GRADES: readonly ToleranceGrade[] = [
  { id: "1B", flow: [0.05, 0.05], head: [0.03, 0.03], powerAbove: 0.04, efficiencyBelow: 0.03, source: ISO },
  { id: "1E", flow: [0.05, 0.05], head: [0.03, 0.03], powerAbove: 0.04, efficiencyBelow: 0, source: ISO },
  { id: "1U", flow: [0, 0.1], head: [0, 0.06], powerAbove: 0.1, efficiencyBelow: 0, source: ISO },
  { id: "2B", flow: [0.08, 0.08], head: [0.05, 0.05], powerAbove: 0.08, efficiencyBelow: 0.05, source: ISO },
  { id: "2U", flow: [0, 0.16], head: [0, 0.1], powerAbove: 0.16, efficiencyBelow: 0.05, source: ISO },
  { id: "3B", flow: [0.09, 0.09], head: [0.07, 0.07], powerAbove: 0.09, efficiencyBelow: 0.07, source: ISO },
];

/**
 * Throws unless `grade` has flow and head tolerances as pairs of finite fractions in [0, 1].
 * @param grade tolerance grade (fractions)
 * @param name the parameter's name in the error (text, unitless)
 */
export function checkGrade(grade: ToleranceGrade, name = "grade"): void {
  if (!grade || typeof grade !== "object") throw new EngineInputError(name, "must be a tolerance grade");
  for (const key of ["flow", "head"] as const) {
    const pair = grade[key];
    if (!Array.isArray(pair) || pair.length !== 2) throw new EngineInputError(`${name}.${key}`, "must be [below, above] fractions");
    pair.forEach((v, i) => requireInRange(`${name}.${key}[${i}]`, v, 0, 1));
  }
  for (const key of ["powerAbove", "efficiencyBelow"] as const) if (grade[key] !== undefined) requireInRange(`${name}.${key}`, grade[key], 0, 1);
}

/** One pressure gauge. */
export interface GaugeReading {
  /** Gauge pressure, Pa (both gauges on the same reference). */
  pressure: number;
  /** Gauge elevation above a common datum, m. */
  elevation: number;
  /** Pipe inner diameter at the tap, m. */
  pipeDiameter: number;
  /** Gauge accuracy, ± Pa (default 0). */
  accuracy?: number;
}

/** Inputs to {@link fieldCheck}. */
export interface FieldCheckInput {
  curve: PumpCurve | PumpCurveInput;
  fluid: Fluid;
  suction: GaugeReading;
  discharge: GaugeReading;
  /** Measured flow, m³/s (omit when there is no flow meter). */
  measuredFlow?: number;
  /** Measured shaft power, W (optional): a motor's input power × its efficiency, never the input power itself (the curve's power is shaft power). */
  measuredPower?: number;
  /** Grades to judge against (default {@link TOLERANCE_GRADES}). */
  grades?: readonly ToleranceGrade[];
  /** Design duty, flow m³/s and head m (optional): deviation of the delivered point from it. */
  duty?: { flow: number; head: number };
}

/** Outcome of a field check (SI). */
export interface FieldCheckResult {
  /** TDH at the delivered flow, m. */
  tdh: number;
  /** Velocity heads at the taps, m. */
  velocityHead: { suction: number; discharge: number };
  /** Delivered flow, m³/s: measured, or inferred from the curve (null if the curve never meets the TDH). */
  flow: number | null;
  flowSource: "measured" | "inferred-from-curve";
  /** Curve head at the delivered flow, m. */
  curveHead: number | null;
  /** (measured head − curve head)/curve head at the measured flow (fraction). */
  headDeviation: number | null;
  /** (measured flow − curve flow at measured head)/curve flow (fraction). */
  flowDeviation: number | null;
  /** (measured power − curve power)/curve power (fraction). */
  powerDeviation: number | null;
  /** Inferred flow band from gauge accuracy, m³/s (null bound: beyond the curve). */
  flowBand: { low: number | null; high: number | null; headUncertainty: number } | null;
  /**
   * Verdict per grade (measured flow only): met when its tolerance cross is met (null when the head is not above zero)
   * and its power and efficiency limits are not missed (`power`: null when no shaft power was measured — not judged).
   */
  grades: { id: string; pass: boolean; cross?: GradeCross | null; power?: GradePowerCheck | null }[];
  /** Tightest grade met, or null. */
  bestGrade: string | null;
  verdict: "within-tolerance" | "outside-tolerance" | "no-flow-meter" | "off-curve";
  /** Deviation from the design duty (fractions), if a duty was given. */
  dutyDeviation: { flow: number; head: number } | null;
  message: string;
  warnings: EngineWarning[];
}

/**
 * Total dynamic head from two gauges at a flow, m.
 * @param suction suction gauge (Pa gauge, m, m; accuracy ± Pa)
 * @param discharge discharge gauge (Pa gauge, m, m; accuracy ± Pa)
 * @param flow flow, m³/s
 * @param density liquid density, kg/m³
 */
export function gaugeTdh(suction: GaugeReading, discharge: GaugeReading, flow: number, density: number): { tdh: number; vhs: number; vhd: number } {
  const ps = requireFinite("suction.pressure", suction?.pressure);
  const pd = requireFinite("discharge.pressure", discharge?.pressure);
  const zs = requireFinite("suction.elevation", suction.elevation);
  const zd = requireFinite("discharge.elevation", discharge.elevation);
  const ds = requirePositive("suction.pipeDiameter", suction.pipeDiameter);
  const dd = requirePositive("discharge.pipeDiameter", discharge.pipeDiameter);
  const rho = requirePositive("density", density);
  requireNonNegative("flow", flow);
  const vs = flow / ((Math.PI * ds * ds) / 4);
  const vd = flow / ((Math.PI * dd * dd) / 4);
  const vhs = (vs * vs) / (2 * G0);
  const vhd = (vd * vd) / (2 * G0);
  return requireFiniteResult("gauge readings", { tdh: (pd - ps) / (rho * G0) + (zd - zs) + vhd - vhs, vhs, vhd });
}

/** Flow where curve head equals target(Q); prefers the highest-flow crossing. */
function curveFlowFor(c: PumpCurve, target: (q: number) => number): number | null {
  const g = (q: number) => (evalCubic(c.head, q) as number) - target(q);
  const x = c.head.x;
  const N = 8;
  let found: number | null = null;
  let prevQ = x[0], prevG = g(x[0]);
  if (prevG === 0) found = prevQ;
  for (let i = 0; i < x.length - 1; i++) {
    for (let j = 1; j <= N; j++) {
      const q = x[i] + ((x[i + 1] - x[i]) * j) / N;
      const gq = g(q);
      if (gq === 0) found = q;
      else if (prevG * gq < 0) {
        const r = brent(g, prevQ, q, 1e-14 * c.flowMax);
        if (r) found = r.x;
      }
      prevQ = q; prevG = gq;
    }
  }
  return found;
}

/** One arm of the tolerance cross: the curve's value there, the measured deviation from it, and the grade's allowance. */
export interface GradeArm {
  /** Head arm: curve head at the measured flow, m. Flow arm: curve flow at the measured head, m³/s. Null off the curve. */
  curveValue: number | null;
  /** (measured − curve)/curve (fraction), null off the curve. */
  deviation: number | null;
  /** Allowed [below, above] (fractions). */
  allowed: readonly [number, number];
  pass: boolean;
  /** Fraction points inside the allowance (negative: outside), null off the curve. */
  margin: number | null;
}

/** The tolerance cross of a grade at a measured point: head arm, flow arm, and whether either is met. */
export interface GradeCross {
  head: GradeArm;
  flow: GradeArm;
  /** Met when either arm is met. */
  pass: boolean;
}

/**
 * Tolerance cross of a grade (ISO 9906:2012, 6.4.2, from memory: the H(Q) curve must meet the
 * vertical or the horizontal arm of the cross ±tQ·Q, ±tH·H around the guarantee point). With
 * one measured point against a published curve the arms read: head arm — the measured head
 * within the grade's head tolerance of the curve's head at the measured flow; flow arm — the
 * measured flow within the flow tolerance of the curve's flow at the measured head (highest-flow
 * crossing, as fieldCheck's flowDeviation). Either arm met: the grade is met.
 * @param curve pump curve (prepared or raw; SI)
 * @param flow measured flow, m³/s
 * @param head measured head, m
 * @param grade tolerance grade (fractions)
 */
export function gradeCross(curve: PumpCurve | PumpCurveInput, flow: number, head: number, grade: ToleranceGrade): GradeCross {
  const c = ensurePumpCurve(curve);
  requireNonNegative("flow", flow);
  requirePositive("head", head);
  checkGrade(grade);
  const arm = (curveValue: number | null, measured: number, allowed: readonly [number, number]): GradeArm => {
    const deviation = curveValue !== null && curveValue > 0 ? measured / curveValue - 1 : null;
    const margin = deviation === null ? null : Math.min(deviation + allowed[0], allowed[1] - deviation);
    // Each end to limitText.ts `gradeSlack` (1 part in 10⁸ of it, of the curve's value at a 0 % side): one judged past prints apart.
    return { curveValue, deviation, allowed, pass: deviation !== null && gradeAllows(deviation, allowed[0], allowed[1]), margin };
  };
  const headArm = arm(evalCubic(c.head, flow), head, grade.head);
  const flowArm = arm(curveFlowFor(c, () => head), flow, grade.flow);
  return { head: headArm, flow: flowArm, pass: headArm.pass || flowArm.pass };
}

/**
 * Whether a measured point meets a grade: either arm of the tolerance cross ({@link gradeCross}).
 * @param curve pump curve (prepared or raw; SI)
 * @param flow measured flow, m³/s
 * @param head measured head, m
 * @param grade tolerance grade (fractions)
 */
export function withinGrade(curve: PumpCurve | PumpCurveInput, flow: number, head: number, grade: ToleranceGrade): boolean {
  return gradeCross(curve, flow, head, grade).pass;
}

/** What a grade met on flow and head says of power and efficiency: judged, or not and why. */
function powerClause(measured: boolean, p: GradePowerCheck | null): string {
  if (!measured) return " on flow and head; power and efficiency not judged (no shaft power measured)";
  if (!p || p.pass === null) return " on flow and head; power and efficiency not judged (the curve gives neither at this flow)";
  return `, power and efficiency included`;
}

/** The limits a grade misses, with their numbers: "power limit (+12.0 % against +4 % allowed)". */
function missedLimits(p: GradePowerCheck): string {
  const said: string[] = [];
  const pct = (x: number, a: number) => fmtPctSignedExact(x, [a], true);
  if (p.power?.pass === false) said.push(`power limit (${pct(p.power.deviation!, p.power.allowed)} against +${fmtPctLimit(p.power.allowed)} allowed)`);
  if (p.efficiency?.pass === false) said.push(`efficiency limit (${pct(p.efficiency.deviation!, p.efficiency.allowed)} against ${p.efficiency.allowed === 0 ? "0 %" : `−${fmtPctLimit(p.efficiency.allowed)}`} allowed)`);
  return said.join(" and ");
}

/**
 * Field check: delivered duty, deviation from the curve, and a verdict.
 * @param input curve (SI), fluid (SI), gauges (Pa, m, m, ± Pa), measuredFlow m³/s, measuredPower W, grades (fractions), duty (m³/s, m)
 */
export function fieldCheck(input: FieldCheckInput): FieldCheckResult {
  return requireFiniteResult("input", fieldCheckInner(input));
}

function fieldCheckInner(input: FieldCheckInput): FieldCheckResult {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const c = ensurePumpCurve(input.curve);
  const fluid = checkFluid(input.fluid);
  const rho = fluid.density;
  const grades = input.grades ?? TOLERANCE_GRADES;
  const warnings: EngineWarning[] = [];
  const accS = requireNonNegative("suction.accuracy", input.suction?.accuracy ?? 0);
  const accD = requireNonNegative("discharge.accuracy", input.discharge?.accuracy ?? 0);
  const dH = Math.hypot(accS, accD) / (rho * G0);
  const tdhAt = (q: number) => gaugeTdh(input.suction, input.discharge, q, rho).tdh;
  let dutyDeviation: FieldCheckResult["dutyDeviation"];
  const dutyDev = (q: number, h: number) => {
    if (!input.duty) return null;
    const qd = requirePositive("duty.flow", input.duty.flow);
    const hd = requirePositive("duty.head", input.duty.head);
    return { flow: q / qd - 1, head: h / hd - 1 };
  };

  if (input.measuredFlow !== undefined) {
    const q = requireNonNegative("measuredFlow", input.measuredFlow);
    const t = gaugeTdh(input.suction, input.discharge, q, rho);
    const curveHead = evalCubic(c.head, q);
    const headDeviation = curveHead !== null && curveHead > 0 ? t.tdh / curveHead - 1 : null;
    const qAtH = t.tdh > 0 ? curveFlowFor(c, () => t.tdh) : null;
    const flowDeviation = qAtH !== null && qAtH > 0 ? q / qAtH - 1 : null;
    let powerDeviation: number | null = null;
    if (input.measuredPower !== undefined) {
      const pm = requirePositive("measuredPower", input.measuredPower);
      const pc = shaftPowerAt(c, q, rho);
      powerDeviation = pc !== null && pc > 0 ? pm / pc - 1 : null;
    }
    const verdicts = grades.map((g) => {
      const cross = t.tdh > 0 ? gradeCross(c, q, t.tdh, g) : null;
      const power = input.measuredPower !== undefined ? gradePower(c, q, t.tdh, rho, input.measuredPower, g) : null;
      return { id: g.id, pass: cross !== null && cross.pass && power?.pass !== false, cross, power };
    });
    const best = verdicts.find((v) => v.pass)?.id ?? null;
    const bestPower = verdicts.find((v) => v.pass)?.power ?? null;
    const missedOnPower = verdicts.find((v) => v.cross?.pass && v.power?.pass === false) ?? null;
    if (curveHead === null) warnings.push({ code: "flow-off-curve", message: "measured flow lies outside the published curve" });
    dutyDeviation = dutyDev(q, t.tdh);
    const verdict = best ? "within-tolerance" : curveHead === null && qAtH === null ? "off-curve" : "outside-tolerance";
    return { tdh: t.tdh, velocityHead: { suction: t.vhs, discharge: t.vhd }, flow: q, flowSource: "measured", curveHead,
      headDeviation, flowDeviation, powerDeviation, flowBand: null, grades: verdicts, bestGrade: best, verdict, dutyDeviation,
      message: best ? `Delivered point is within grade ${best} of the curve${powerClause(input.measuredPower !== undefined, bestPower)}`
        : missedOnPower ? `Delivered point meets grade ${missedOnPower.id} on flow and head but misses its ${missedLimits(missedOnPower.power!)}`
        : `Delivered point is outside every grade checked${headDeviation !== null ? ` (head ${fmtPctSignedExact(headDeviation, grades.flatMap((g) => [g.head[0], g.head[1]]), true)} from curve)` : ""}`,
      warnings };
  }

  // No flow meter: infer flow where the curve meets the measured TDH (velocity heads depend on flow).
  const q = curveFlowFor(c, tdhAt);
  const qLow = curveFlowFor(c, (x) => tdhAt(x) + dH);
  const qHigh = curveFlowFor(c, (x) => tdhAt(x) - dH);
  const t = gaugeTdh(input.suction, input.discharge, q ?? 0, rho);
  if (q === null) {
    warnings.push({ code: "tdh-off-curve", message: "measured TDH is outside the curve's head range: flow cannot be inferred" });
    return { tdh: t.tdh, velocityHead: { suction: t.vhs, discharge: t.vhd }, flow: null, flowSource: "inferred-from-curve",
      curveHead: null, headDeviation: null, flowDeviation: null, powerDeviation: null,
      flowBand: { low: qLow, high: qHigh, headUncertainty: dH }, grades: [], bestGrade: null, verdict: "off-curve",
      dutyDeviation: null, message: "Measured head is not on the curve: the pump is not performing to its curve, or a reading is wrong", warnings };
  }
  if (qLow === null || qHigh === null) warnings.push({ code: "band-beyond-curve", message: "the flow band from gauge accuracy runs past the end of the curve" });
  const low = qLow === null ? null : Math.min(qLow, qHigh ?? qLow, q);
  const high = qHigh === null ? null : Math.max(qHigh, qLow ?? qHigh, q);
  let powerDeviation: number | null = null;
  if (input.measuredPower !== undefined) {
    const pm = requirePositive("measuredPower", input.measuredPower);
    const pc = shaftPowerAt(c, q, rho);
    powerDeviation = pc !== null && pc > 0 ? pm / pc - 1 : null;
  }
  if (low !== null && high !== null && q > 0 && (high - low) / q > 2 * WIDE_FLOW_BAND) {
    // The half-width never reads as the limit it is past ("±10 %" for 10.00001 %), and the rule is said.
    warnings.push({ code: "wide-flow-band", message: `flat curve: gauge accuracy gives a flow band of ${flowBandHalfWidthText(low, high, q)}, wider than ±${fmtPctLimit(WIDE_FLOW_BAND)}; fit a flow meter for a verdict` });
  }
  dutyDeviation = dutyDev(q, t.tdh);
  return { tdh: t.tdh, velocityHead: { suction: t.vhs, discharge: t.vhd }, flow: q, flowSource: "inferred-from-curve",
    curveHead: evalCubic(c.head, q), headDeviation: null, flowDeviation: null, powerDeviation,
    flowBand: { low, high, headUncertainty: dH }, grades: [], bestGrade: null, verdict: "no-flow-meter", dutyDeviation,
    message: "Flow inferred from the curve (assumes the pump is on its curve); no tolerance verdict without a flow meter", warnings };
}
