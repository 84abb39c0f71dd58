/**
 * Speed change and impeller trim.
 *
 * Speed (affinity laws, common practice; hold well for modest speed changes):
 *   Q ∝ N, H ∝ N², P ∝ N³, efficiency unchanged; NPSHr taken ∝ N² (approximate).
 * Impeller trim — APPROXIMATE, real trimmed impellers deviate, and lose some efficiency:
 *   `linear` law (default, constant-efficiency approximation): Q ∝ D, H ∝ D², P ∝ D³;
 *   `square` law (constant outlet width):                      Q ∝ D², H ∝ D², P ∝ D⁴.
 *   Efficiency is kept unchanged and NPSHr values are carried to the scaled flows unchanged.
 *   Trims of more than ~20 % of the curve's diameter, or below the model's minimum
 *   diameter, are flagged.
 */
import { EngineInputError, requireFinite, requireFiniteResult, requirePositive, type EngineWarning } from "./errors.ts";
import { evalCubic, type MonotoneCubic } from "./interp.ts";
import { createPumpCurve, ensurePumpCurve, type PumpCurve, type PumpCurveInput, type PumpPoint } from "./pumpCurve.ts";
import { brent } from "./roots.ts";
import { LIMIT_ROUNDING } from "./limitText.ts";
import { fmtNumExact, fmtPct, fmtPctExact, fmtPctLimit, qt, qtPair } from "./quantityText.ts";

/** Impeller trim law. */
export type TrimLaw = "linear" | "square";

/** Largest trim, as a fraction of the curve's diameter, before a flag (common practice). */
export const MAX_TRIM_FRACTION = 0.2;

/**
 * Relative allowance for solver round-off wherever a ratio or diameter is held to a limit (dimensionless, 1 part in 10⁶):
 * the trim and diameter flags here and every comparison of the verdict (verdict.ts) use this one value, so a pump the
 * verdict finds inside the catalogue is never flagged outside it by its own curve's warnings, nor the other way round.
 */
export const LIMIT_ROUNDOFF = 1e-6;

/** Speed or trim ratios the engine scales a curve by (dimensionless): beyond them head (∝ r²) and power (∝ r³) leave
 * every real pump by factors of 10⁶ and 10⁹, and the scaled values underflow or overflow; the catalogue's own limits
 * (verdict.ts) judge the ratios that make sense. Engine bound, not a rule of practice. */
export const SCALE_RATIO_RANGE = { min: 1e-3, max: 1e3 } as const;

function checkRatio(ratio: number): number {
  const r = requirePositive("ratio", ratio);
  if (r < SCALE_RATIO_RANGE.min || r > SCALE_RATIO_RANGE.max)
    throw new EngineInputError("ratio", `must be between ${SCALE_RATIO_RANGE.min} and ${SCALE_RATIO_RANGE.max} (got ${r})`);
  return r;
}

/** The scaled curve, or the refusal of its points named as the ratio's (a valid curve scaled by a valid ratio). */
function scaledCurve(input: PumpCurveInput, r: number): PumpCurve {
  try {
    return createPumpCurve(input);
  } catch (e) {
    if (e instanceof EngineInputError) throw new EngineInputError("ratio", `scales the curve out of range (${e.parameter} ${e.reason}; got ${r})`);
    throw e;
  }
}

/** A curve scaled by speed or trim. */
export interface ScaledCurve {
  /** The scaled, prepared curve. */
  curve: PumpCurve;
  /** Speed ratio N₂/N₁ or diameter ratio D₂/D₁ (dimensionless). */
  ratio: number;
  warnings: EngineWarning[];
}

function inputOf(c: PumpCurve): PumpCurveInput {
  return {
    points: c.points,
    speed: c.speed ?? undefined,
    impellerDiameter: c.impellerDiameter ?? undefined,
    minDiameter: c.minDiameter ?? undefined,
    maxDiameter: c.maxDiameter ?? undefined,
    powerDensity: c.powerDensity,
  };
}

function scalePoints(points: readonly PumpPoint[], q: number, h: number, p: number, n: number): PumpPoint[] {
  return points.map((pt) => {
    const out: PumpPoint = { flow: pt.flow * q, head: pt.head * h };
    if (pt.efficiency !== undefined) out.efficiency = pt.efficiency;
    if (pt.power !== undefined) out.power = pt.power * p;
    if (pt.npshr !== undefined) out.npshr = pt.npshr * n;
    return out;
  });
}

/**
 * Curve at another speed by the affinity laws (Q ∝ N, H ∝ N², P ∝ N³).
 * @param curve pump curve (prepared or raw; SI)
 * @param ratio speed ratio N₂/N₁ (dimensionless, > 0)
 */
export function scaleBySpeed(curve: PumpCurve | PumpCurveInput, ratio: number): ScaledCurve {
  const c = ensurePumpCurve(curve);
  const r = checkRatio(ratio);
  const warnings = scaleWarningsSpeed(r);
  const input = inputOf(c);
  const scaled = scaledCurve({ ...input, points: scalePoints(c.points, r, r * r, r * r * r, r * r),
    speed: c.speed !== null ? c.speed * r : undefined, riseTolerance: 1 }, r);
  return { curve: scaled, ratio: r, warnings };
}

function trimExponents(law: TrimLaw): { q: number; p: number } {
  if (law === "linear") return { q: 1, p: 3 };
  if (law === "square") return { q: 2, p: 4 };
  throw new EngineInputError("law", "must be 'linear' or 'square'");
}

function trimWarnings(c: PumpCurve, ratio: number): EngineWarning[] {
  const w: EngineWarning[] = [{ code: "trim-approximate", message: "impeller trim scaling is approximate; confirm with the manufacturer's trimmed curve" }];
  const eps = LIMIT_ROUNDOFF;
  if (ratio < (1 - MAX_TRIM_FRACTION) * (1 - eps)) w.push({ code: "large-trim", parameter: "ratio",
    message: `trim of ${fmtPctExact(1 - ratio, [MAX_TRIM_FRACTION])} exceeds ${fmtPctLimit(MAX_TRIM_FRACTION)}: prediction unreliable` });
  if (ratio > 1 + eps) w.push({ code: "diameter-increase", parameter: "ratio", message: "diameter above the curve's impeller: check the model's maximum" });
  if (c.impellerDiameter !== null) {
    const d = c.impellerDiameter * ratio;
    if (c.minDiameter !== null && d < c.minDiameter * (1 - eps)) w.push({ code: "below-min-diameter", parameter: "ratio",
      message: `trimmed diameter ${qtPair("diameter", d, c.minDiameter).join(" is below the model's minimum ")}` });
    if (c.maxDiameter !== null && d > c.maxDiameter * (1 + eps)) w.push({ code: "above-max-diameter", parameter: "ratio",
      message: `diameter ${qtPair("diameter", d, c.maxDiameter).join(" is above the model's maximum ")}` });
  }
  return w;
}

/**
 * Curve for a trimmed impeller (approximate; see module comment for the laws).
 * @param curve pump curve (prepared or raw; SI)
 * @param ratio diameter ratio D₂/D₁ (dimensionless, > 0)
 * @param law trim law, "linear" (default) or "square" (unitless)
 */
export function scaleByTrim(curve: PumpCurve | PumpCurveInput, ratio: number, law: TrimLaw = "linear"): ScaledCurve {
  const c = ensurePumpCurve(curve);
  const r = checkRatio(ratio);
  const e = trimExponents(law);
  const rq = Math.pow(r, e.q);
  const scaled = scaledCurve({ ...inputOf(c), points: scalePoints(c.points, rq, r * r, Math.pow(r, e.p), 1),
    impellerDiameter: c.impellerDiameter !== null ? c.impellerDiameter * r : undefined, riseTolerance: 1 }, r);
  return { curve: scaled, ratio: r, warnings: trimWarnings(c, r) };
}

/** Result of solving for the speed or trim that meets a duty. */
export interface RatioSolution {
  /** `ok`, or why no ratio in the limits meets the duty. */
  status: "ok" | "duty-above-curve" | "duty-below-limit" | "outside-curve";
  /** The ratio (speed N₂/N₁ or diameter D₂/D₁), dimensionless; null unless ok. */
  ratio: number | null;
  /** New speed, rpm, when the curve has one (speed solve). */
  speed: number | null;
  /** New impeller diameter, m, when the curve has one (trim solve). */
  diameter: number | null;
  /** Efficiency at the duty on the scaled curve (fraction; constant-efficiency assumption), or null. */
  efficiency: number | null;
  message: string;
  warnings: EngineWarning[];
  /**
   * With `outside-curve`: where the duty's flow leaves the curve (its `end` or `start`), the ratio at which it reaches it
   * and the head the scaled curve gives there, m. A drive may run the pump at that end's ratio, throttled (dutyCycle.ts).
   */
  edge?: CurveEdge;
}

/** Relative slack on a curve's flow range for rounding in Qd/s^k (dimensionless; common practice: a few ulps). */
const FLOW_ROUNDING = 1e-9;

/**
 * Interpolant value at t, with t pulled back onto [x₀, x_last] when it lies outside by no more
 * than a rounding step (FLOW_ROUNDING of the range's end); null when truly outside.
 */
function evalAtEnds(c: MonotoneCubic, t: number): number | null {
  const x0 = c.x[0], x1 = c.x[c.x.length - 1];
  const slack = FLOW_ROUNDING * Math.max(Math.abs(x1), Number.MIN_VALUE);
  if (t > x1 && t <= x1 + slack) return evalCubic(c, x1);
  if (t < x0 && t >= x0 - slack) return evalCubic(c, x0);
  return evalCubic(c, t);
}

/** Where the duty's flow leaves the curve when no ratio meets it: the ratio at that end and the head there (m). */
export interface CurveEdge {
  at: "end" | "start";
  ratio: number;
  head: number;
}
type Solved =
  | { status: "ok"; ratio: number }
  | { status: "duty-above-curve" | "duty-below-limit"; ratio: null }
  | { status: "outside-curve"; ratio: null; edge: CurveEdge | null };

/**
 * Solves s such that the scaled curve passes through (Qd, Hd): s²·H(Qd/s^k) = Hd, for
 * k = 1 (speed, linear trim) or 2 (square trim). Returns the largest root in [lo, hi].
 * The scan runs from the highest ratio down to exactly the lowest one whose flow still lies on
 * the curve (Qd/s^k at the curve's end, rounding absorbed by evalAtEnds), so duties in the last
 * interval of the curve are found; an end within 1e-9 of the duty head counts as a root.
 * Without a root the duty lies on one side of the curve at every ratio where its flow is on it. The answer
 * names what bounds that range: the ratio limit (`duty-below-limit` at lo, `duty-above-curve` at hi), or
 * the curve's own end (`outside-curve` with the edge: below the ratio at which Qd reaches the curve's last
 * flow, Qd lies past the curve's end and the curve says nothing there; likewise past its first flow).
 */
function solveRatio(c: PumpCurve, qd: number, hd: number, k: number, lo: number, hi: number): Solved {
  const f = (s: number) => {
    const h = evalAtEnds(c.head, qd / Math.pow(s, k));
    return h === null ? NaN : s * s * h - hd;
  };
  // Ratios for which Qd/s^k lies on the curve: from the one at the curve's last flow to the one at its first.
  const sEnd = Math.pow(qd / c.flowMax, 1 / k);
  const sStart = c.flowMin > 0 ? Math.pow(qd / c.flowMin, 1 / k) : Infinity;
  const sMin = Math.max(lo, sEnd);
  const sMax = Math.min(hi, sStart);
  if (!(sMin <= sMax)) return { status: "outside-curve", ratio: null, edge: null };
  const atRoot = (v: number) => Math.abs(v) <= 1e-9 * hd;
  const N = 48;
  let prevS = sMax, prevF = f(sMax);
  // At the highest ratio (full speed or impeller) within LIMIT_ROUNDING (1 part in 10⁸) of the duty head: that ratio, the
  // search's direct fit's allowance (search.ts); was 1e-9, so a curve 5e-9 under the head "could not be solved".
  if (Math.abs(prevF) <= LIMIT_ROUNDING * hd) return { status: "ok", ratio: sMax };
  for (let i = 1; i <= N; i++) {
    const s = i === N ? sMin : sMax - ((sMax - sMin) * i) / N;
    const fs = f(s);
    if (prevF * fs < 0) {
      const r = brent(f, s, prevS, 1e-14);
      if (r) return { status: "ok", ratio: r.x };
    }
    if (atRoot(fs)) return { status: "ok", ratio: s };
    prevS = s; prevF = fs;
  }
  const fMax = f(sMax);
  // Below `hi` the range ends where Qd meets the curve's first flow (sMax = sStart), above `lo` where it meets its last
  // (sMin = sEnd): the pump's head there is the curve's end point scaled, s²·H(end), read at the end itself (not at
  // Qd/s^k, which rounding can put a hair past it, where the curve says nothing).
  const edge = (at: "start" | "end", s: number, q: number): CurveEdge | null => {
    const h = evalAtEnds(c.head, q);
    return h !== null && Number.isFinite(s * s * h) ? { at, ratio: s, head: s * s * h } : null;
  };
  if (fMax < 0) return sMax < hi ? { status: "outside-curve", ratio: null, edge: edge("start", sMax, c.flowMin) } : { status: "duty-above-curve", ratio: null };
  return sMin > lo ? { status: "outside-curve", ratio: null, edge: edge("end", sMin, c.flowMax) } : { status: "duty-below-limit", ratio: null };
}

function checkDuty(duty: { flow: number; head: number }) {
  if (!duty || typeof duty !== "object") throw new EngineInputError("duty", "is required");
  return { qd: requirePositive("duty.flow", duty.flow), hd: requirePositive("duty.head", duty.head) };
}

type NoRatio = Exclude<RatioSolution["status"], "ok">;

/** The answer when no ratio in the limits meets the duty, with the message for its reason. */
function noRatio(status: NoRatio, message: string, edge?: CurveEdge | null): RatioSolution {
  return { status, ratio: null, speed: null, diameter: null, efficiency: null, warnings: [], message, ...(edge ? { edge } : {}) };
}

/**
 * Why no ratio meets the duty when its flow is off the curve at every ratio that would: the ratio at which the flow
 * reaches the curve's end (or first point) and the head the scaled curve gives there, both heads kept apart (qtPair).
 * `ratioWords(s)` names a ratio ("65.5 % speed", "a diameter ratio of 80.0 %").
 */
function edgeMessage(c: PumpCurve, duty: { qd: number; hd: number }, edge: CurveEdge, ratioWords: (s: number) => string): string {
  const [gives, needs] = qtPair("head", edge.head, duty.hd);
  const at = ratioWords(edge.ratio);
  return edge.at === "end"
    ? `the duty flow ${qt("flow", duty.qd)} reaches the curve's end (${qt("flow", c.flowMax)} as published) only at ${at}, where the pump gives ${gives}, more than the duty's ${needs}; below that the flow lies past the curve's end, where the curve gives no data`
    : `the duty flow ${qt("flow", duty.qd)} leaves the curve's first point (${qt("flow", c.flowMin)} as published) at ${at}, where the pump gives ${gives}, less than the duty's ${needs}; above that the flow lies before the curve's first point, where the curve gives no data`;
}

/** How a solve names its ratio limits in {@link limitMessage}: the speed solve's allowed speeds, the trim solve's diameters searched. */
interface LimitWords {
  /** The highest ratio, before its value: "the highest allowed speed", "the full diameter". */
  highest: string;
  /** The highest in the flow-range sentence ("at the highest, 100 %"). */
  highestShort: string;
  /** What a duty below the lowest ratio needs: "a speed below the lowest allowed", "a diameter below the smallest searched". */
  below: string;
  /** The lowest in the flow-range sentence ("at the lowest, 30 %"). */
  lowestShort: string;
  /** Each ratio in the limits, after "every" and "any": "allowed speed", "diameter searched". */
  each: string;
  /** Said after a duty head above the curve at the highest ratio ("" or "; trimming cannot help"). */
  aboveTail: string;
}

const SPEED_WORDS: LimitWords = { highest: "the highest allowed speed", highestShort: "the highest", below: "a speed below the lowest allowed",
  lowestShort: "the lowest", each: "allowed speed", aboveTail: "" };
const TRIM_WORDS: LimitWords = { highest: "the full diameter", highestShort: "the full diameter", below: "a diameter below the smallest searched",
  lowestShort: "the smallest searched", each: "diameter searched", aboveTail: "; trimming cannot help" };

/**
 * Why no ratio within the limits meets the duty where a ratio limit bounds it (or the flow is off the curve at every
 * ratio in them): the duty, the pump's head at the duty flow at the limit that binds (or the curve's flow range there) and
 * the limit, each head or flow kept apart from the duty's (qtPair), the limit as given (fmtPctLimit). The curve at ratio s
 * has Q ∝ s^k (k = 1: speed or linear trim; 2: square trim) and H ∝ s².
 */
function limitMessage(c: PumpCurve, duty: { qd: number; hd: number }, status: NoRatio, k: number, lo: number, hi: number, words: LimitWords): string {
  const flow = qt("flow", duty.qd);
  const headAtRatio = (s: number) => {
    const h = evalAtEnds(c.head, duty.qd / Math.pow(s, k));
    return h === null ? null : s * s * h;
  };
  if (status === "duty-above-curve" || status === "duty-below-limit") {
    const above = status === "duty-above-curve";
    const h = headAtRatio(above ? hi : lo);
    if (h !== null) {
      const [gives, needs] = qtPair("head", h, duty.hd);
      return above
        ? `the duty head ${needs} at ${flow} is above the curve even at ${words.highest}, ${fmtPctLimit(hi)}: there the pump gives ${gives} at this flow${words.aboveTail}`
        : `the duty head ${needs} at ${flow} needs ${words.below}, ${fmtPctLimit(lo)}: there the pump gives ${gives} at this flow, more than the duty's`;
    }
  } else if (duty.qd / c.flowMax > Math.pow(hi, k)) {
    const [q, end] = qtPair("flow", duty.qd, c.flowMax * Math.pow(hi, k));
    return `the duty flow ${q} lies past the curve's end at every ${words.each}: at ${words.highestShort}, ${fmtPctLimit(hi)}, the curve spans ${qt("flow", c.flowMin * Math.pow(hi, k))}–${end}${hi === 1 ? "" : ` (${qt("flow", c.flowMax)} as published at 100 %)`}`;
  } else if (c.flowMin > 0 && duty.qd / c.flowMin < Math.pow(lo, k)) {
    const [q, start] = qtPair("flow", duty.qd, c.flowMin * Math.pow(lo, k));
    return `the duty flow ${q} lies before the curve's first point at every ${words.each}: at ${words.lowestShort}, ${fmtPctLimit(lo)}, the curve spans ${start}–${qt("flow", c.flowMax * Math.pow(lo, k))}${lo === 1 ? "" : ` (${qt("flow", c.flowMin)} as published at 100 %)`}`;
  }
  return `the duty ${flow} at ${qt("head", duty.hd)} is not met at any ${words.each}, ${fmtPctLimit(lo)}–${fmtPctLimit(hi)}`;
}

/**
 * Speed ratio that puts the curve through the duty point (flow, head on the system curve).
 * @param curve pump curve (prepared or raw; SI)
 * @param duty.flow duty flow, m³/s
 * @param duty.head head the system needs at the duty flow, m
 * @param limits.min smallest speed ratio allowed (dimensionless; default 0.3)
 * @param limits.max largest speed ratio allowed (dimensionless; default 1.0)
 */
export function speedForDuty(curve: PumpCurve | PumpCurveInput, duty: { flow: number; head: number }, limits: { min?: number; max?: number } = {}): RatioSolution {
  const c = ensurePumpCurve(curve);
  const { qd, hd } = checkDuty(duty);
  const lo = requirePositive("limits.min", limits.min ?? 0.3);
  const hi = requirePositive("limits.max", limits.max ?? 1);
  if (lo > hi) throw new EngineInputError("limits.min", "must not exceed limits.max");
  const r = solveRatio(c, qd, hd, 1, lo, hi);
  if (r.status !== "ok") {
    return noRatio(r.status, r.status === "outside-curve" && r.edge ? edgeMessage(c, { qd, hd }, r.edge, (s) => `${fmtPct(s)} speed`) : limitMessage(c, { qd, hd }, r.status, 1, lo, hi, SPEED_WORDS), r.status === "outside-curve" ? r.edge : null);
  }
  const e = c.efficiency ? evalAtEnds(c.efficiency, qd / r.ratio) : null;
  const warnings = scaleWarningsSpeed(r.ratio);
  return requireFiniteResult("duty", { status: "ok", ratio: r.ratio, speed: c.speed !== null ? c.speed * r.ratio : null, diameter: c.impellerDiameter,
    efficiency: e, warnings, message: `speed ratio ${r.ratio.toFixed(4)}` });
}

/**
 * Speed ratios N₂/N₁ within which the affinity laws translate a curve closely enough to judge by it (dimensionless):
 * about 50–120 % (common practice; ISO 9906 lets a test be translated from within this range, from memory). Outside,
 * `large-speed-change`; a field check gives no tolerance verdict (lib/fieldchecks/evaluate.ts).
 */
export const AFFINITY_SPEED_RANGE = [0.5, 1.2] as const;

function scaleWarningsSpeed(r: number): EngineWarning[] {
  return r < AFFINITY_SPEED_RANGE[0] || r > AFFINITY_SPEED_RANGE[1] ? [{ code: "large-speed-change", parameter: "ratio",
    message: `speed ratio ${fmtNumExact(r, AFFINITY_SPEED_RANGE, 3)}, outside ${AFFINITY_SPEED_RANGE[0]}–${AFFINITY_SPEED_RANGE[1]}: affinity laws are less reliable far from the tested speed` }] : []; // never "0.500" for 0.49996
}

/**
 * Trimmed diameter ratio that puts the curve through the duty point (approximate).
 * @param curve pump curve (prepared or raw; SI)
 * @param duty.flow duty flow, m³/s
 * @param duty.head head the system needs at the duty flow, m
 * @param options.law trim law "linear" | "square" (unitless; default "linear")
 * @param options.minRatio smallest diameter ratio searched (dimensionless; default 0.5)
 */
export function trimForDuty(curve: PumpCurve | PumpCurveInput, duty: { flow: number; head: number }, options: { law?: TrimLaw; minRatio?: number } = {}): RatioSolution {
  const c = ensurePumpCurve(curve);
  const { qd, hd } = checkDuty(duty);
  const law = options.law ?? "linear";
  const k = trimExponents(law).q;
  const lo = requirePositive("options.minRatio", options.minRatio ?? 0.5);
  const r = solveRatio(c, qd, hd, k, Math.min(lo, 1), 1);
  if (r.status !== "ok") {
    return noRatio(r.status, r.status === "outside-curve" && r.edge ? edgeMessage(c, { qd, hd }, r.edge, (s) => `a diameter ratio of ${fmtPct(s)}`) : limitMessage(c, { qd, hd }, r.status, k, Math.min(lo, 1), 1, TRIM_WORDS), r.status === "outside-curve" ? r.edge : null);
  }
  const e = c.efficiency ? evalAtEnds(c.efficiency, qd / Math.pow(r.ratio, k)) : null;
  return requireFiniteResult("duty", { status: "ok", ratio: r.ratio, speed: c.speed, diameter: c.impellerDiameter !== null ? c.impellerDiameter * r.ratio : null,
    efficiency: e, warnings: trimWarnings(c, r.ratio), message: `diameter ratio ${r.ratio.toFixed(4)} (${law} law, approximate)` });
}

/**
 * Affinity-law conversion of one point between speeds (Q ∝ N, H ∝ N², P ∝ N³).
 * @param point.flow flow, m³/s
 * @param point.head head, m
 * @param point.power shaft power, W (optional)
 * @param ratio speed ratio N₂/N₁ (dimensionless)
 */
export function affinityPoint(point: { flow: number; head: number; power?: number }, ratio: number): { flow: number; head: number; power?: number } {
  const r = requirePositive("ratio", ratio);
  const out: { flow: number; head: number; power?: number } = {
    flow: requireFinite("point.flow", point.flow) * r,
    head: requireFinite("point.head", point.head) * r * r,
  };
  if (point.power !== undefined) out.power = requireFinite("point.power", point.power) * r * r * r;
  return out;
}
