/**
 * Figures at an operating point.
 * - Hydraulic power P_h = ρ·g₀·Q·H; shaft power P = P_h/η (definitions). Efficiency and
 *   shaft power agree whichever of the two the curve gives (pumpCurve.ts).
 * - NPSHa = (p_surface,abs − p_vapour)/(ρg) + z_suction − hf_suction (common practice);
 *   z_suction is the liquid surface above the pump's datum (negative for a suction lift).
 *   Margin ratio NPSHa/NPSHr against a required ratio; ANSI/HI 9.6.1 recommends 1.1–2.5
 *   depending on application and suction energy (from memory) — default 1.1.
 * - Largest shaft power anywhere on the curve, for a non-overloading check against motor
 *   rating × service factor.
 * - Energy per year = input power × hours; cost = energy (kWh) × tariff.
 */
import { EngineInputError, requireFinite, requireFiniteResult, requireNonNegative, requirePositive, type EngineWarning } from "./errors.ts";
import { checkFluid, type Fluid } from "./fluids.ts";
import { evalCubic } from "./interp.ts";
import { efficiencyAt, ensurePumpCurve, npshrAt, shaftPowerAt, type BestEfficiencyPoint, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { G0 } from "./units.ts";
import { limitCovers } from "./motor.ts";
import { leastOn } from "./curveTouch.ts";
import { fmtPctExact, insideEnds, LIMIT_ROUNDING, qt, qtAboveZero, qtExact, qtLimit } from "./quantityText.ts";
import { npshRatioBelow, npshRatioText } from "./npshRatio.ts";
import { npshrStopsText } from "./npshrEnds.ts";

/** Default NPSH margin ratio (lower end of ANSI/HI 9.6.1 range, from memory). */
export const DEFAULT_NPSH_MARGIN = 1.1;

/** NPSH margin guidance as data (from memory: ANSI/HI 9.6.1; check against the standard). */
export const NPSH_MARGIN_GUIDANCE = {
  source: "ANSI/HI 9.6.1, from memory: ratio NPSHa/NPSHr 1.1 to 2.5 by application and suction energy",
  min: 1.1,
  max: 2.5,
} as const;

/**
 * NPSH available, m.
 * @param input.surfacePressure absolute pressure on the suction liquid surface, Pa
 * @param input.vaporPressure vapour pressure of the liquid, Pa (absolute)
 * @param input.density liquid density, kg/m³
 * @param input.staticSuctionHead liquid surface above the pump datum, m (negative = lift)
 * @param input.suctionLoss suction-side head loss at the flow, m
 */
export function npshAvailable(input: {
  surfacePressure: number;
  vaporPressure: number;
  density: number;
  staticSuctionHead: number;
  suctionLoss: number;
}): number {
  const p = requireNonNegative("surfacePressure", input.surfacePressure);
  const pv = requireNonNegative("vaporPressure", input.vaporPressure);
  const rho = requirePositive("density", input.density);
  const z = requireFinite("staticSuctionHead", input.staticSuctionHead);
  const hf = requireNonNegative("suctionLoss", input.suctionLoss);
  return requireFiniteResult("input", (p - pv) / (rho * G0) + z - hf);
}

/** Inputs to {@link operatingFigures}. */
export interface FiguresInput {
  curve: PumpCurve | PumpCurveInput;
  /** Operating flow, m³/s. */
  flow: number;
  /** Operating head, m (default: curve head at the flow). */
  head?: number;
  fluid: Fluid;
  /** Suction conditions for NPSHa (Pa absolute, m). */
  suction?: { surfacePressure: number; staticSuctionHead: number; suctionLoss: number };
  /** Required NPSH margin ratio (dimensionless, default 1.1). */
  requiredMargin?: number;
  /** Motor: rating W, service factor (dimensionless, default 1.0). */
  motor?: { rating: number; serviceFactor?: number };
  /** Energy: hours per year h, tariff currency per kWh, motor and drive efficiencies (fractions, default 1). */
  energy?: { hoursPerYear: number; tariffPerKWh: number; motorEfficiency?: number; driveEfficiency?: number };
}

/** Figures at the operating point (SI). */
export interface OperatingFigures {
  /** m³/s */
  flow: number;
  /** m */
  head: number;
  /** fraction, null when the curve has neither efficiency nor power */
  efficiency: number | null;
  /** W */
  hydraulicPower: number;
  /** W, null when unknown */
  shaftPower: number | null;
  bep: BestEfficiencyPoint | null;
  /** Q/Q_BEP (dimensionless), null without BEP */
  bepRatio: number | null;
  /** Inside the preferred operating region (70–120 % of BEP flow), null without BEP */
  inPor: boolean | null;
  npsh: {
    /** m */
    available: number;
    /** m, null when the curve has no NPSHr here */
    required: number | null;
    /** NPSHa/NPSHr (dimensionless); null without NPSHr (or NPSHr 0) and where NPSHa ≤ 0 (`available` decides there) */
    marginRatio: number | null;
    requiredMargin: number;
    status: NpshStatus;
  } | null;
  /** Largest shaft power on the curve for this fluid: W at flow m³/s, as far as power is known (see MaxShaftPower). */
  maxPower: MaxShaftPower | null;
  motor: { rating: number; serviceFactor: number; limit: number; nonOverloading: boolean | null; loadAtDuty: number | null } | null;
  energy: { inputPower: number; annualEnergy: number; annualEnergyKWh: number; annualCost: number } | null;
  warnings: EngineWarning[];
}

export type NpshStatus = "ok" | "low-margin" | "cavitation-risk" | "unknown";

/**
 * NPSH status from the margin ratio NPSHa/NPSHr (common practice): below 1 a cavitation risk, below the wanted
 * margin a low margin, else ok; unknown without a ratio. "Below" by more than 1 part in 10⁸ (npshRatio.ts `npshRatioBelow`).
 * @param marginRatio NPSHa / NPSHr (dimensionless), null when NPSHr is not known
 * @param requiredMargin the wanted ratio (dimensionless, ≥ 1)
 */
export function npshStatus(marginRatio: number | null, requiredMargin: number): NpshStatus {
  if (marginRatio === null) return "unknown";
  requireFinite("marginRatio", marginRatio);
  requirePositive("requiredMargin", requiredMargin);
  return npshRatioBelow(marginRatio, 1) ? "cavitation-risk" : npshRatioBelow(marginRatio, requiredMargin) ? "low-margin" : "ok";
}

/**
 * The NPSH margin ratio NPSHa / NPSHr, or null where it means nothing: no NPSHr (or NPSHr ≤ 0, or one so small that the
 * ratio is no finite number: 5e-324 m, a cell taken as written), or NPSHa at or below zero (the liquid boils at the inlet
 * whatever the pump: NPSHa alone decides, a cavitation risk; common practice).
 * @param available NPSHa, m
 * @param required NPSHr, m, null when the curve gives none
 */
export function npshMarginRatio(available: number, required: number | null): number | null {
  requireFinite("available", available);
  if (required !== null) requireFinite("required", required);
  const r = available > 0 && required !== null && required > 0 ? available / required : null;
  return r !== null && Number.isFinite(r) ? r : null;
}

/** The largest shaft power found on a curve, and how far along the curve power is known. */
export interface MaxShaftPower {
  /** Largest shaft power, W, at `flow`, m³/s. */
  power: number;
  flow: number;
  /** Largest flow at which the power is known (published power, or head and efficiency), m³/s. */
  upTo: number;
  /** True when power is known to the curve's end flow. */
  toEnd: boolean;
  /** Smallest flow at which the power is known, m³/s. */
  from: number;
  /**
   * True when power is known from the curve's first flow (or, where the efficiency there is zero — shut-off, power 0/0 —
   * from the first sample past it). Only with `toEnd` as well is `power` the largest on the whole curve: a power column
   * that starts past shut-off leaves out the flows where a mixed- or axial-flow pump takes most power.
   */
  fromStart: boolean;
}

/**
 * Largest shaft power on the curve, W, for a fluid density, as far as the power (or efficiency) data reaches; `toEnd`
 * says whether that is the curve's end. Solved, not sampled: the knots and 200 evenly spaced flows find where power is
 * known and bracket each local maximum, and each bracket's peak is found by golden-section search (J. Kiefer, Proc. AMS 4,
 * 1953, as curveTouch.ts). Power from ρ·g·Q·H/η peaks between flows (a non-overloading curve); the samples alone read up to
 * 6 parts in 10⁶ under it, which a motor limit between the two read as "non-overloading" (power-peak.test.ts).
 * @param curve pump curve (prepared or raw; SI)
 * @param density fluid density, kg/m³
 */
export function maxShaftPower(curve: PumpCurve | PumpCurveInput, density: number): MaxShaftPower | null {
  const c = ensurePumpCurve(curve);
  requirePositive("density", density);
  const N = 200;
  const sample = (i: number) => c.flowMin + ((c.flowMax - c.flowMin) * i) / N;
  // The knots and the samples, both rising, merged in order (no sort: this runs for every candidate and band edge).
  const knots = c.head.x, flows: number[] = [];
  for (let i = 0, k = 0; i <= N || k < knots.length; ) {
    const q = k >= knots.length || (i <= N && sample(i) < knots[k]) ? sample(i++) : knots[k++];
    if (flows.length === 0 || q !== flows[flows.length - 1]) flows.push(q);
  }
  const power = (q: number) => {
    const p = shaftPowerAt(c, q, density);
    return p !== null && Number.isFinite(p) ? p : null;
  };
  const ps = flows.map(power);
  let best: { power: number; flow: number } | null = null;
  let upTo = -Infinity, from = Infinity;
  for (let i = 0; i < flows.length; i++) {
    const p = ps[i];
    if (p === null) continue;
    const q = flows[i];
    if (q > upTo) upTo = q;
    if (q < from) from = q;
    if (!best || p > best.power) best = { power: p, flow: q };
  }
  if (!best) return null;
  let found: { power: number; flow: number } = best;
  // Each local maximum of the samples (not a flat run) near the largest holds a peak between its neighbours: solved there.
  // One further below than 1 part in 10³ cannot pass it (the samples read a smooth peak within ~(span / 400)² of its
  // curvature, parts in 10⁶). The flow to 1e-7 of the span puts the power within ~1e-14 of the peak's (flat there).
  const span = c.flowMax - c.flowMin;
  for (let i = 1; i + 1 < flows.length; i++) {
    const a = ps[i - 1], p = ps[i], b = ps[i + 1];
    if (a === null || p === null || b === null || p < a || p < b || (p === a && p === b) || p < found.power * (1 - 1e-3)) continue;
    const peak = leastOn((q) => -(power(q) ?? -Infinity), flows[i - 1], flows[i + 1], 1e-7 * span);
    if (-peak.fx > found.power) found = { power: -peak.fx, flow: peak.x };
  }
  const fromStart = from <= c.flowMin + 1e-9 * span || (efficiencyAt(c, c.flowMin) === 0 && from <= sample(1) + 1e-9 * span);
  return { power: found.power, flow: found.flow, upTo, toEnd: upTo >= c.flowMax * (1 - 1e-9), from, fromStart };
}

/**
 * Whether a motor limit covers the largest power on the curve (`limitCovers`, the suggestion's own rule): false as soon
 * as the power known so far exceeds it; true only when the power is known over the whole curve (from its first flow to
 * its end); otherwise null (not judged), with a warning that says where the power is known. `text` is the verdict with
 * its rule and numbers, for the page.
 * @param max the curve's largest shaft power (W at m³/s) and its reach, or null when no power is known
 * @param limit motor rating × service factor, W
 */
export function overloadCheck(max: MaxShaftPower | null, limit: number): { nonOverloading: boolean | null; warning: string | null; text: string } {
  requirePositive("limit", limit);
  const lim = `motor rating × service factor ${qt("power", limit)}`;
  if (!max) return { nonOverloading: null, warning: null, text: `overload not judged: the curve gives power at no flow (no power or efficiency column of two points or more), ${lim}` };
  const at = `${qtExact("power", max.power, [limit])} at ${qt("flow", max.flow)}`;
  if (!limitCovers(limit, max.power)) {
    const warning = `largest power on the curve ${qtExact("power", max.power, [limit])} exceeds motor rating × service factor ${qtLimit("power", limit, [max.power])}`;
    return { nonOverloading: false, warning, text: `can overload: largest power on the curve ${at} exceeds motor rating × service factor ${qtLimit("power", limit, [max.power])}` };
  }
  if (!max.toEnd || !max.fromStart) {
    const where = max.fromStart ? `only up to ${qt("flow", max.upTo)}, not to the curve's end` : max.toEnd ? `only from ${qt("flow", max.from)}, not from the curve's first flow` : `only from ${qt("flow", max.from)} up to ${qt("flow", max.upTo)}, not over the whole curve`;
    const past = max.fromStart ? "overload past it is not judged" : max.toEnd ? "overload below it is not judged" : "overload outside it is not judged";
    const warning = `power is known ${where}: ${past} (largest power ${max.fromStart ? "up to there" : "where known"} ${qt("power", max.power)}, ${lim})`;
    return { nonOverloading: null, warning, text: `overload not judged: ${warning}` };
  }
  return { nonOverloading: true, warning: null, text: `non-overloading: largest power on the curve ${at} is within motor rating × service factor ${qtLimit("power", limit, [max.power])}` };
}

/**
 * Why the curve gives no efficiency at a flow, in words with the flows: no efficiency or power at all, at one point only,
 * or data that end before (or start after) the flow, with the range where they are known.
 * @param c prepared curve (SI)
 * @param flow the flow, m³/s
 * @param powerKnown whether the shaft power is known there all the same (a power column that covers it) (a flag, unitless)
 */
function noEfficiencyText(c: PumpCurve, flow: number, powerKnown: boolean): string {
  const col = c.efficiency ?? c.power;
  const what = c.efficiency ? "efficiency" : "power";
  if (!col) {
    const one = c.points.find((p) => p.efficiency !== undefined || p.power !== undefined);
    return one ? `curve gives efficiency or power at one point only (${qt("flow", one.flow)}), too few to read it at another flow: power figures unavailable`
      : "curve gives neither efficiency nor power: power figures unavailable";
  }
  const lo = col.x[0], hi = col.x[col.x.length - 1];
  const range = `known from ${qt("flow", lo)} to ${qt("flow", hi)}`;
  const where = flow > hi ? `end at ${qtLimit("flow", hi, [flow])}, before this flow ${qtExact("flow", flow, [hi])}`
    : flow < lo ? `start at ${qtLimit("flow", lo, [flow])}, after this flow ${qtExact("flow", flow, [lo])}` : `give none at ${qt("flow", flow)}`;
  return `the curve's ${what} data ${where} (${range}): ${powerKnown ? "efficiency" : "efficiency and power figures"} unavailable at this flow`;
}

/**
 * All figures at an operating point.
 * @param input curve, flow m³/s, head m, fluid (SI), suction (Pa absolute, m), motor (W), energy (h, currency/kWh, fractions)
 */
export function operatingFigures(input: FiguresInput): OperatingFigures {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const c = ensurePumpCurve(input.curve);
  const fluid = checkFluid(input.fluid);
  const flow = requireNonNegative("flow", input.flow);
  const curveHead = evalCubic(c.head, flow);
  if (curveHead === null) throw new EngineInputError("flow", `is outside the curve (${qt("flow", c.flowMin)}–${qt("flow", c.flowMax)})`);
  const head = input.head === undefined ? curveHead : requireNonNegative("head", input.head);
  const warnings: EngineWarning[] = [];
  const rho = fluid.density;
  const hydraulicPower = rho * G0 * flow * head;
  const efficiency = efficiencyAt(c, flow);
  let shaftPower = shaftPowerAt(c, flow, rho);
  if (shaftPower === null && flow === 0) shaftPower = null;
  if (efficiency === null) warnings.push({ code: "no-efficiency", message: noEfficiencyText(c, flow, shaftPower !== null) });
  // Derived from a power column (ρ·g·Q·H/P, two interpolants), efficiency can pass 100 % between points that imply at most
  // 100 % (the curve's own warning looks at the points only): said at this flow, past 1 part in 10⁸ (LIMIT_ROUNDING).
  if (efficiency !== null && efficiency > 1 + LIMIT_ROUNDING) warnings.push({ code: "efficiency-above-one",
    message: `efficiency at this flow is ${fmtPctExact(efficiency, [1])}, above 100 %: the curve's power column gives less shaft power than the hydraulic power ρ·g·Q·H here; check the power column and its units` });
  if (!c.bep) for (const w of c.warnings) if (w.code === "bep-not-published") warnings.push(w);
  const bep = c.bep;
  const bepRatio = bep ? flow / bep.flow : null;
  const inPor = c.por ? insideEnds(flow, c.por.min, c.por.max) : null; // its ends to 1 part in 10⁸: a flow called outside prints apart
  if (inPor === false) warnings.push({ code: "outside-por", message: `operating at ${fmtPctExact(bepRatio ?? 0, [0.7, 1.2], 0)} of BEP flow, outside the preferred operating region (70–120 %)` });

  let npsh: OperatingFigures["npsh"] = null;
  const requiredMargin = requirePositive("requiredMargin", input.requiredMargin ?? DEFAULT_NPSH_MARGIN);
  if (input.suction) {
    const available = npshAvailable({ surfacePressure: input.suction.surfacePressure, vaporPressure: fluid.vaporPressure,
      density: rho, staticSuctionHead: input.suction.staticSuctionHead, suctionLoss: input.suction.suctionLoss });
    const required = npshrAt(c, flow);
    // NPSHa at or below zero: no ratio (NPSHa / NPSHr ≤ 0 means nothing); NPSHa, given beside it, decides alone.
    const marginRatio = npshMarginRatio(available, required);
    let status: NpshStatus = "unknown";
    if (available <= 0) status = "cavitation-risk";
    // NPSHr with no ratio beside an NPSHa above zero (NPSHr zero, or too small for the ratio to be a number): nothing to judge
    // against, so not judged ("unknown", said with the NPSHr), never a low margin (it read "low-margin" with no ratio).
    else if (required !== null && marginRatio !== null) status = npshStatus(marginRatio, requiredMargin);
    // NPSHa never reads as NPSHr, nor the ratio as 1 or the required margin, beside the status they decide.
    if (status === "cavitation-risk")
      warnings.push({ code: "npsh-cavitation", message: available > 0 && required !== null
        ? `NPSHa ${qtAboveZero("head", available, [required])} is below NPSHr ${qtLimit("head", required, [available])}: cavitation risk`
        // NPSHa at or below zero decides alone, NPSHr known or not (the liquid would boil at the inlet whatever the pump):
        // read by NPSHa, as the band's corners are, never as "below NPSHr".
        : `NPSHa ${qtAboveZero("head", available, [])} is not above zero: cavitation risk whatever the pump${required === null ? ` (no NPSHr at this flow: ${npshrStopsText(c.points, flow)})` : "'s NPSHr"}` });
    else if (status === "low-margin") warnings.push({ code: "npsh-low-margin", message: `NPSH margin ratio ${npshRatioText(marginRatio, requiredMargin)} is below the required ${requiredMargin}` });
    else if (status === "unknown") warnings.push({ code: "npsh-unknown", message: required === null ? `NPSH not judged: no NPSHr at this flow (${npshrStopsText(c.points, flow)})` : `the curve's NPSHr here, ${qt("head", required)}, is too small to judge NPSHa ${qtAboveZero("head", available, [])} against (NPSHa / NPSHr is no finite number): NPSH not judged` });
    npsh = { available, required, marginRatio, requiredMargin, status };
  }

  const maxPower = maxShaftPower(c, rho);
  let motor: OperatingFigures["motor"] = null;
  if (input.motor) {
    const rating = requirePositive("motor.rating", input.motor.rating);
    const serviceFactor = requirePositive("motor.serviceFactor", input.motor.serviceFactor ?? 1);
    const limit = rating * serviceFactor;
    const { nonOverloading, warning } = overloadCheck(maxPower, limit);
    if (warning) warnings.push({ code: nonOverloading === false ? "motor-overload" : "motor-overload-not-judged", message: warning });
    motor = { rating, serviceFactor, limit, nonOverloading, loadAtDuty: shaftPower !== null ? shaftPower / rating : null };
  }

  let energy: OperatingFigures["energy"] = null;
  if (input.energy) {
    const hours = requireNonNegative("energy.hoursPerYear", input.energy.hoursPerYear);
    if (hours > 8784) throw new EngineInputError("energy.hoursPerYear", "cannot exceed 8784 h");
    const tariff = requireNonNegative("energy.tariffPerKWh", input.energy.tariffPerKWh);
    const me = requirePositive("energy.motorEfficiency", input.energy.motorEfficiency ?? 1);
    const de = requirePositive("energy.driveEfficiency", input.energy.driveEfficiency ?? 1);
    if (me > 1 || de > 1) throw new EngineInputError("energy.motorEfficiency", "efficiencies are fractions 0–1");
    if (shaftPower !== null) {
      const inputPower = shaftPower / (me * de);
      const annualEnergy = inputPower * hours * 3600;
      const annualEnergyKWh = annualEnergy / 3.6e6;
      energy = { inputPower, annualEnergy, annualEnergyKWh, annualCost: annualEnergyKWh * tariff };
    }
  }
  return requireFiniteResult("input", { flow, head, efficiency, hydraulicPower, shaftPower, bep, bepRatio, inPor, npsh, maxPower, motor, energy, warnings });
}
