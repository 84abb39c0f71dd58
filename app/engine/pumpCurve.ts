/**
 * Pump curves from points, for one speed and impeller diameter. Points are validated
 * (finite; flow ≥ 0 strictly increasing; head ≥ 0 and not rising with flow by more than a
 * tolerance, or drooping — rising from its first point to one peak at most 25 % above it, then falling
 * (headShape.ts) —, accepted and flagged), then interpolated with
 * monotone cubics (Fritsch & Carlson 1980, see interp.ts): no oscillation, defined only from
 * the first to the last point (outside → null).
 *
 * Efficiency is a fraction (0–1). Power on a curve is shaft power measured with a test
 * liquid of density `powerDensity` (default 1000 kg/m³, water); shaft power for another
 * fluid scales with density. Whichever of efficiency or power is given, the other is derived
 * from P = ρ·g₀·Q·H/η (definition), so both paths give the same figures.
 * BEP = the point of highest efficiency (data point; the interpolant peaks there), known only where it is an interior
 * maximum of the points with efficiency: at the first or last of them (or with one only) the peak may lie past the data,
 * so no BEP or POR is given (warning `bep-not-published`; common practice).
 * POR = 70–120 % of BEP flow (ANSI/HI 9.6.3, from memory).
 */
import { EngineInputError, requireFinite, requirePositive, type EngineWarning } from "./errors.ts";
import { evalCubic, monotoneCubic, type MonotoneCubic } from "./interp.ts";
import { brent } from "./roots.ts";
import { G0 } from "./units.ts";
import { qt } from "./quantityText.ts";
import { npshrFlow } from "./npshrEnds.ts";
import { checkPumpPoints } from "./pumpPoints.ts";

export { checkPumpPoints };

/** The density a curve's power column refers to unless said otherwise, kg/m³: water, 1000 (common practice for test data). The importer judges powers at it (import/point-rules.ts). */
export const DEFAULT_POWER_DENSITY = 1000;

/** One point of a published curve (SI). */
export interface PumpPoint {
  /** Flow, m³/s. */
  flow: number;
  /** Head, m. */
  head: number;
  /** Efficiency, fraction 0–1 (optional). */
  efficiency?: number;
  /** Shaft power, W (optional). */
  power?: number;
  /** NPSH required, m (optional). */
  npshr?: number;
}

/** A curve set as given. */
export interface PumpCurveInput {
  points: readonly PumpPoint[];
  /** Rotational speed, rpm (optional). */
  speed?: number;
  /** Impeller diameter of this curve, m (optional). */
  impellerDiameter?: number;
  /** Smallest impeller diameter the model allows, m (optional). */
  minDiameter?: number;
  /** Largest impeller diameter the model allows, m (optional). */
  maxDiameter?: number;
  /** Density the power column refers to, kg/m³ (default 1000). */
  powerDensity?: number;
  /** Allowed rise of head with flow, as a fraction of the first point's head (default 0.10); a drooping curve may rise to one peak up to 25 % above it (headShape.ts). */
  riseTolerance?: number;
}

/** Preferred operating region as a fraction of BEP flow (ANSI/HI 9.6.3, from memory). */
export const POR_FRACTION = { min: 0.7, max: 1.2 } as const;

/** Best efficiency point. */
export interface BestEfficiencyPoint {
  /** m³/s */
  flow: number;
  /** m */
  head: number;
  /** fraction 0–1 */
  efficiency: number;
}

/** A validated, interpolated curve. */
export interface PumpCurve {
  points: readonly PumpPoint[];
  /** First and last flow, m³/s. */
  flowMin: number;
  flowMax: number;
  /** Largest head on the curve, m. */
  headMax: number;
  /** Head at the last point, m. */
  headAtMaxFlow: number;
  head: MonotoneCubic;
  efficiency: MonotoneCubic | null;
  power: MonotoneCubic | null;
  npshr: MonotoneCubic | null;
  speed: number | null;
  impellerDiameter: number | null;
  minDiameter: number | null;
  maxDiameter: number | null;
  powerDensity: number;
  /**
   * A drooping curve: a head above its first point's anywhere, compared exactly (pumpPoints.ts) — the rule of the solver's
   * start from rest, the `drooping-curve` warning and the duty cycle's step notes. Deliberately wider than the importer's
   * `drooping-curve` warning (past its 5 % rounding rise, a plausibility judgement of published data): a 4.75 % hump is
   * imported without a warning, and the engine's verdicts on it (no point from rest above 40 m) still need the words.
   */
  drooping: boolean;
  /** Head at zero flow, m, when the curve starts at zero flow; else null. */
  shutoffHead: number | null;
  bep: BestEfficiencyPoint | null;
  /** Preferred operating region, m³/s. */
  por: { min: number; max: number } | null;
  warnings: EngineWarning[];
}

/**
 * One optional column's interpolant over the points that give it; null from fewer than two. One point is no curve: a
 * value at one flow says nothing of another (the efficiency or power "at one point only" note, figures.ts), and a single
 * published NPSHr point is judged nowhere, not even at its own flow — the search's index builds none from it either
 * (searchIndex.ts `PackBuilder.end`; decision "npshone", app/lib/projects/npshr-reach.ts).
 */
function column(points: readonly PumpPoint[], key: "efficiency" | "power" | "npshr"): MonotoneCubic | null {
  const xs: number[] = [], ys: number[] = [];
  for (const p of points) {
    const v = p[key];
    if (v !== undefined && v !== null) { xs.push(p.flow); ys.push(v); }
  }
  return xs.length >= 2 ? monotoneCubic(xs, ys) : null;
}

/** The rise allowance where a curve's input gives none, a fraction of its first head (headShape.ts: rounding of published heads; ours). */
export const RISE_TOLERANCE_DEFAULT = 0.1;

/**
 * Validates points and builds the interpolated curve.
 * @param input points (flow m³/s, head m, efficiency fraction, power W, NPSHr m), speed rpm, diameters m, powerDensity kg/m³
 */
export function createPumpCurve(input: PumpCurveInput): PumpCurve {
  if (!input || typeof input !== "object") throw new EngineInputError("curve", "is required");
  const pts = input.points;
  if (!Array.isArray(pts) || pts.length === 0) throw new EngineInputError("points", "the curve has no points");
  if (pts.length < 2) throw new EngineInputError("points", "a curve needs at least two points");
  const riseTol = requireFinite("riseTolerance", input.riseTolerance ?? RISE_TOLERANCE_DEFAULT);
  if (riseTol < 0 || riseTol > 1) throw new EngineInputError("riseTolerance", "must be between 0 and 1");
  const warnings: EngineWarning[] = [];
  const { headMax, drooping } = checkPumpPoints(pts, riseTol);
  const clean: PumpPoint[] = pts.map((p) => {
    const q: PumpPoint = { flow: p.flow, head: p.head };
    if (p.efficiency !== undefined && p.efficiency !== null) q.efficiency = p.efficiency;
    if (p.power !== undefined && p.power !== null) q.power = p.power;
    if (p.npshr !== undefined && p.npshr !== null) q.npshr = p.npshr;
    return q;
  });
  const h0 = clean[0].head;

  // True beside every verdict (common practice, from memory: a pump starts against a closed check valve): a system may
  // cross a drooping curve twice, but the point judged is the one reached from rest, and a system head above the
  // curve's head at its first flow leaves no point at all (operatingPoint.ts `crossingFromRest`).
  if (drooping) {
    const first = clean[0].flow === 0 ? `its shut-off head ${qt("head", h0)}` : `its head at its first published flow, ${qt("head", h0)} (its shut-off head is not published)`;
    warnings.push({ code: "drooping-curve", message: `head rises from ${first} before falling (drooping curve): a system curve may cross it twice, and the point judged is the one the pump reaches from rest, started against its closed check valve (the first crossing where its head falls below the system's); a system head above ${qt("head", h0)} there leaves it unable to start` });
  }
  const opt = (name: string, v: number | undefined) => (v === undefined || v === null ? null : requirePositive(name, v));
  const powerDensity = requirePositive("powerDensity", input.powerDensity ?? DEFAULT_POWER_DENSITY);
  const curve: PumpCurve = {
    points: clean,
    flowMin: clean[0].flow,
    flowMax: clean[clean.length - 1].flow,
    headMax,
    headAtMaxFlow: clean[clean.length - 1].head,
    head: monotoneCubic(clean.map((p) => p.flow), clean.map((p) => p.head)),
    efficiency: column(clean, "efficiency"),
    power: column(clean, "power"),
    npshr: column(clean, "npshr"),
    speed: opt("speed", input.speed),
    impellerDiameter: opt("impellerDiameter", input.impellerDiameter),
    minDiameter: opt("minDiameter", input.minDiameter),
    maxDiameter: opt("maxDiameter", input.maxDiameter),
    powerDensity,
    drooping,
    shutoffHead: clean[0].flow === 0 ? h0 : null,
    bep: null,
    por: null,
    warnings,
  };
  if (curve.minDiameter !== null && curve.maxDiameter !== null && curve.minDiameter > curve.maxDiameter) {
    throw new EngineInputError("minDiameter", "must not exceed maxDiameter");
  }
  // BEP: highest efficiency among the points (given, or derived from power), known only where it is an interior
  // maximum of those points (common practice: a peak at the first or last efficiency point may lie past it).
  const known: BestEfficiencyPoint[] = [];
  let best = -1;
  for (const p of clean) {
    const e = p.efficiency ?? (p.power !== undefined && p.flow > 0 ? (powerDensity * G0 * p.flow * p.head) / p.power : undefined);
    if (e === undefined || !(e > 0)) continue;
    known.push({ flow: p.flow, head: p.head, efficiency: e });
    if (best < 0 || e > known[best].efficiency) best = known.length - 1;
  }
  if (best >= 0 && known[best].efficiency > 1) {
    warnings.push({ code: "efficiency-above-one", message: "power column implies efficiency above 100 %: check power units" });
  }
  if (best > 0 && best < known.length - 1) {
    curve.bep = known[best];
    curve.por = { min: POR_FRACTION.min * known[best].flow, max: POR_FRACTION.max * known[best].flow };
  } else if (best >= 0) {
    warnings.push({ code: "bep-not-published", message: bepUnknownText(known, best, curve.flowMin, curve.flowMax) });
  }
  if (!curve.efficiency && !curve.power) {
    const given = clean.find((p) => p.efficiency !== undefined || p.power !== undefined);
    warnings.push({ code: "no-efficiency", message: given
      ? `curve gives efficiency or power at one point only (${qt("flow", given.flow)}), too few to read it at another flow: power figures unavailable`
      : "curve gives neither efficiency nor power: power figures unavailable" }); // the words figures.ts uses: a candidate says it once
  }
  return curve;
}

/**
 * Why a curve with efficiency has no BEP, in words with the flows: one efficiency point only, or the highest at the
 * first or last of them (the efficiency still rising at the curve's end, or falling from its start): no BEP or POR verdict.
 */
function bepUnknownText(known: readonly BestEfficiencyPoint[], best: number, flowMin: number, flowMax: number): string {
  const head = "BEP not published";
  const tail = ": no BEP position or preferred operating region is judged";
  if (known.length === 1) return `${head} (efficiency given at one point only, ${qt("flow", known[0].flow)})${tail}`;
  const at = known[best].flow;
  if (best === known.length - 1) {
    return at >= flowMax ? `${head} (efficiency still rising at the curve's end, ${qt("flow", at)})${tail}`
      : `${head} (efficiency highest at its last value, ${qt("flow", at)}, where its data end before the curve's end ${qt("flow", flowMax)}: the peak may lie past it)${tail}`;
  }
  return at <= flowMin ? `${head} (efficiency highest at the curve's first point, ${qt("flow", at)}: the peak may lie below the curve's flows)${tail}`
    : `${head} (efficiency highest at its first value, ${qt("flow", at)}, where its data start after the curve's first flow ${qt("flow", flowMin)}: the peak may lie before it)${tail}`;
}

function asCurve(c: PumpCurve | PumpCurveInput): PumpCurve {
  // Anything but an object is no curve: createPumpCurve refuses it by name ("curve: is required"), where `in` threw a TypeError.
  if (!c || typeof c !== "object") return createPumpCurve(c);
  const h = (c as PumpCurve).head;
  return "head" in c && h && typeof h === "object" && "x" in h ? (c as PumpCurve) : createPumpCurve(c as PumpCurveInput);
}

/**
 * Head at a flow; null outside the curve.
 * @param curve the curve (prepared or raw; SI: flow m³/s, head m)
 * @param flow flow, m³/s
 */
export function headAt(curve: PumpCurve | PumpCurveInput, flow: number): number | null {
  return evalCubic(asCurve(curve).head, requireFinite("flow", flow));
}

/**
 * Efficiency (fraction) at a flow: from the efficiency column, else derived from power.
 * Null outside the curve, or where neither column covers the flow.
 * @param curve the curve (prepared or raw; SI: flow m³/s, head m)
 * @param flow flow, m³/s
 */
export function efficiencyAt(curve: PumpCurve | PumpCurveInput, flow: number): number | null {
  const c = asCurve(curve);
  requireFinite("flow", flow);
  if (c.efficiency) return evalCubic(c.efficiency, flow);
  if (c.power) {
    const p = evalCubic(c.power, flow);
    const h = evalCubic(c.head, flow);
    if (p === null || h === null || p <= 0) return null;
    return (c.powerDensity * G0 * flow * h) / p;
  }
  return null;
}

/**
 * Shaft power at a flow for a fluid of this density, W: from the power column scaled by
 * density, else ρ·g₀·Q·H/η. Null outside the curve or where η = 0 and no power column.
 * @param curve the curve (prepared or raw; SI: flow m³/s, head m)
 * @param flow flow, m³/s
 * @param density fluid density, kg/m³
 */
export function shaftPowerAt(curve: PumpCurve | PumpCurveInput, flow: number, density: number): number | null {
  const c = asCurve(curve);
  requireFinite("flow", flow);
  requirePositive("density", density);
  if (c.power) {
    const p = evalCubic(c.power, flow);
    return p === null ? null : (p * density) / c.powerDensity;
  }
  if (c.efficiency) {
    const e = evalCubic(c.efficiency, flow);
    const h = evalCubic(c.head, flow);
    if (e === null || h === null || !(e > 0)) return null;
    return (density * G0 * flow * h) / e;
  }
  return null;
}

/**
 * NPSH required at a flow, m; null where the NPSHr column does not cover the flow (a flow a rounding error outside its
 * first or last published flow reads the NPSHr there: {@link NPSHR_END_ROUNDING}).
 * @param curve the curve (prepared or raw; SI: flow m³/s, head m)
 * @param flow flow, m³/s
 */
export function npshrAt(curve: PumpCurve | PumpCurveInput, flow: number): number | null {
  const c = asCurve(curve);
  const n = c.npshr;
  if (!n) return null;
  return evalCubic(n, npshrFlow(n.x[0], n.x[n.x.length - 1], requireFinite("flow", flow)));
}

/**
 * Flows at which the curve delivers a head (all of them, for drooping curves), m³/s.
 * @param curve the curve (prepared or raw; SI: flow m³/s, head m)
 * @param head head, m
 */
export function flowsAtHead(curve: PumpCurve | PumpCurveInput, head: number): number[] {
  const c = asCurve(curve);
  requireFinite("head", head);
  const g = (q: number) => (evalCubic(c.head, q) as number) - head;
  const out: number[] = [];
  const x = c.head.x;
  for (let i = 0; i < x.length - 1; i++) {
    // Each Fritsch-Carlson interval is monotone: at most one root inside it.
    const r = brent(g, x[i], x[i + 1], 1e-14 * Math.max(x[i + 1], 1e-12));
    if (r && (out.length === 0 || Math.abs(out[out.length - 1] - r.x) > 1e-12 * x[x.length - 1])) out.push(r.x);
  }
  return out;
}

/** A sampled curve for charts (SI arrays, null where a column is missing). */
export interface SampledCurve {
  flows: number[];
  head: number[];
  efficiency: (number | null)[];
  power: (number | null)[];
  npshr: (number | null)[];
}

/**
 * Samples the curve at evenly spaced flows from the first to the last point.
 * @param curve the curve (prepared or raw; SI: flow m³/s, head m)
 * @param points number of samples (count, dimensionless; default 61)
 * @param density fluid density for the power column, kg/m³ (default the curve's powerDensity)
 */
export function sampleCurve(curve: PumpCurve | PumpCurveInput, points = 61, density?: number): SampledCurve {
  const c = asCurve(curve);
  const n = Math.round(requireFinite("points", points));
  if (n < 2 || n > 10_000) throw new EngineInputError("points", "must be between 2 and 10000");
  const rho = density ?? c.powerDensity;
  const out: SampledCurve = { flows: [], head: [], efficiency: [], power: [], npshr: [] };
  for (let i = 0; i < n; i++) {
    const q = i === n - 1 ? c.flowMax : c.flowMin + ((c.flowMax - c.flowMin) * i) / (n - 1);
    out.flows.push(q);
    out.head.push(evalCubic(c.head, q) as number);
    out.efficiency.push(efficiencyAt(c, q));
    out.power.push(shaftPowerAt(c, q, rho));
    out.npshr.push(npshrAt(c, q));
  }
  return out;
}

/** Prepares a curve if it is raw; returns it unchanged if already prepared.
 * @param curve the curve (prepared or raw; SI)
 */
export function ensurePumpCurve(curve: PumpCurve | PumpCurveInput): PumpCurve {
  return asCurve(curve);
}
