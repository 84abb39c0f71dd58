/**
 * Pump curves measured on water, used for a more viscous liquid: the Hydraulic Institute's parameter B,
 * its correction factors and the water curve corrected with them (ANSI/HI 9.6.7, Rotodynamic Pumps —
 * Guideline for Effects of Liquid Viscosity on Performance; all equations from memory: verify against the standard).
 *
 *   B = 26.6 · ν^0.5 · H_BEP-W^0.0625 / (Q_BEP-W^0.375 · N^0.25)            (defined in US units)
 *     ν kinematic viscosity of the pumped liquid, cSt (mm²/s); H_BEP-W head per stage at the water BEP, ft;
 *     Q_BEP-W flow at the water BEP, US gpm; N speed, rpm. Computed here in those units from SI (NIST SP 811 factors).
 *     The standard's SI form, 16.5 with Q in m³/h and H in m, is the same equation with the constant rounded
 *     (26.6 · 3.2808^0.0625 / 4.4029^0.375 = 16.43): it gives B 0.4 % higher.
 *   B ≤ 1: no correction (the water curve holds). 1 < B ≤ 40: the method's range (40 included as its edge).
 *   B > 40: outside the method: no correction is made (the caller must say the curve is not corrected).
 *   C_Q = 2.71^(−0.165 · (log₁₀ B)^3.15)                       flow, every point
 *   C_BEP-H = C_Q                                               head at the BEP
 *   C_H = 1 − (1 − C_BEP-H) · (Q_W / Q_BEP-W)^0.75              head at a point of water flow Q_W (1 at shut-off)
 *   C_η = B^(−(0.0547 · B^0.69))                                efficiency, every point
 *   Q_vis = C_Q · Q_W,  H_vis = C_H · H_W,  η_vis = C_η · η_W,  P_vis = ρ · g · Q_vis · H_vis / η_vis
 *     (ρ the viscous liquid's density, kg/m³; the corrected curve carries η_vis, and shaft power follows from it
 *     at whatever density the caller evaluates: pumpCurve.ts shaftPowerAt).
 * The method is stated for Newtonian liquids and single- or multistage radial centrifugal pumps (head per stage).
 * NPSHr is not corrected: each water point's NPSHr is carried to its corrected flow (at a given flow that reads the
 * water curve further out, so it is not lower than the water curve's there). SI at the public face.
 */
import { EngineInputError, requireFiniteResult, requirePositive, type EngineWarning } from "./errors.ts";
import { createPumpCurve, ensurePumpCurve, type PumpCurve, type PumpCurveInput, type PumpPoint } from "./pumpCurve.ts";
import { fromSI, G0 } from "./units.ts";
import { fmtNumExact } from "./quantityText.ts";

/** Where the equations come from, for messages and docs. */
export const HI_VISCOSITY_SOURCE = "ANSI/HI 9.6.7 (Hydraulic Institute, effects of liquid viscosity on rotodynamic pump performance), from memory: verify against the standard";

/** At or below this B the water curve needs no viscosity correction (dimensionless). */
export const VISCOSITY_B_NO_CORRECTION = 1;

/** Upper end of the method's range of B (dimensionless): above it no correction is made. */
export const VISCOSITY_B_MAX = 40;

/** The HI parameter B and whether the water curve needs correcting. */
export interface ViscosityParameter {
  /** B, dimensionless. */
  b: number;
  /** B > 1: the water curve must be corrected for viscosity. */
  needsCorrection: boolean;
  /** B above the method's range (40), when so. */
  warnings: EngineWarning[];
}

// B never reads as the end it is above ("B = 40.0 is above 40" was B = 40.01).
const outsideMessage = (b: number) => `B = ${fmtNumExact(b, [VISCOSITY_B_MAX], 1)} is above ${VISCOSITY_B_MAX}, the upper end of the ANSI/HI 9.6.7 method's range: outside the method, the water curve cannot be corrected by it`;

/**
 * The Hydraulic Institute's parameter B (ANSI/HI 9.6.7, from memory): how far the pumped liquid's
 * viscosity moves the pump from its water curve. Defined in US units (cSt, ft, gpm, rpm). Stated range 1 < B < 40;
 * B ≤ 1 needs no correction.
 * @param o.kinematicViscosity kinematic viscosity of the pumped liquid, m²/s (converted to cSt = mm²/s)
 * @param o.bepFlow flow at the best efficiency point on water, m³/s (converted to US gpm), per pump
 * @param o.bepHead head at the best efficiency point on water, m (converted to ft), per stage
 * @param o.speed pump speed, rpm
 * @returns B (dimensionless), whether it needs correction (B > 1) and a warning above B = 40
 */
export function viscosityParameterB(o: { kinematicViscosity: number; bepFlow: number; bepHead: number; speed: number }): ViscosityParameter {
  if (!o || typeof o !== "object") throw new EngineInputError("input", "is required");
  const nuCst = requirePositive("kinematicViscosity", o.kinematicViscosity) * 1e6;
  const gpm = fromSI("flow", "gpm", requirePositive("bepFlow", o.bepFlow));
  const ft = fromSI("head", "ft", requirePositive("bepHead", o.bepHead));
  const n = requirePositive("speed", o.speed);
  const b = requireFiniteResult("kinematicViscosity", (26.6 * Math.sqrt(nuCst) * ft ** 0.0625) / (gpm ** 0.375 * n ** 0.25));
  const warnings: EngineWarning[] = b > VISCOSITY_B_MAX ? [{ code: "outside-validity", parameter: "kinematicViscosity", message: outsideMessage(b) }] : [];
  return { b, needsCorrection: b > VISCOSITY_B_NO_CORRECTION, warnings };
}

/** The HI correction factors at the BEP (dimensionless, 1 = as on water). */
export interface ViscosityFactors {
  /** Flow at the BEP, C_Q. */
  flow: number;
  /** Head at the BEP, C_BEP-H (= C_Q). */
  head: number;
  /** Efficiency, C_η. */
  efficiency: number;
  warnings: EngineWarning[];
}

/**
 * ANSI/HI 9.6.7 correction factors at the best efficiency point (from memory): C_Q = 2.71^(−0.165·(log₁₀ B)^3.15),
 * C_BEP-H = C_Q, C_η = B^(−0.0547·B^0.69). All 1 at B ≤ 1 (no correction); above B = 40 the equations' values
 * are outside the method, with a warning (`correctCurveForViscosity` does not apply them there).
 * @param b the parameter B (dimensionless, > 0)
 * @returns C_Q, C_H at the BEP and C_η (dimensionless)
 */
export function viscosityFactors(b: number): ViscosityFactors {
  requirePositive("b", b);
  if (b <= VISCOSITY_B_NO_CORRECTION) return { flow: 1, head: 1, efficiency: 1, warnings: [] };
  const cq = 2.71 ** (-0.165 * Math.log10(b) ** 3.15);
  const ce = b ** (-0.0547 * b ** 0.69);
  const warnings: EngineWarning[] = b > VISCOSITY_B_MAX ? [{ code: "outside-validity", parameter: "b", message: outsideMessage(b) }] : [];
  return requireFiniteResult("b", { flow: cq, head: cq, efficiency: ce, warnings });
}

/**
 * How a water curve stands on a liquid: `no-correction` (B ≤ 1, the water curve holds), `corrected` (1 < B ≤ 40),
 * `outside-method` (B > 40: not corrected), `no-bep` (the curve gives no water BEP to correct from: no efficiency, or its
 * highest at an end of its data — pumpCurve.ts).
 */
export type ViscousCurveStatus = "no-correction" | "corrected" | "outside-method" | "no-bep";

/** A water curve on a viscous liquid. */
export interface ViscousCurve {
  status: ViscousCurveStatus;
  /** B at the water BEP and speed (dimensionless); null with `no-bep`. */
  b: number | null;
  /** C_Q, C_BEP-H and C_η as applied (dimensionless); null unless `corrected`. */
  factors: { flow: number; head: number; efficiency: number } | null;
  /** The water BEP B is taken at (m³/s, m) and the speed, rpm. */
  bep: { flow: number; head: number } | null;
  speed: number;
  /** The curve on the liquid: corrected when `corrected`, else the water curve as given. */
  curve: PumpCurve;
  warnings: EngineWarning[];
}

/**
 * The head factor at a water flow (ANSI/HI 9.6.7, from memory): C_H = 1 − (1 − C_BEP-H)·(Q_W/Q_BEP-W)^0.75.
 * @param cBepH C_BEP-H (dimensionless)
 * @param flowRatio Q_W / Q_BEP-W (dimensionless, ≥ 0)
 */
const headFactor = (cBepH: number, flowRatio: number) => 1 - (1 - cBepH) * flowRatio ** 0.75;

/**
 * A water-performance pump curve corrected for a viscous liquid per ANSI/HI 9.6.7 (from memory; equations at the top
 * of this module). B is taken at the curve's water BEP (highest efficiency) and `speed`. Each water point becomes
 * (C_Q·Q_W, C_H·H_W, C_η·η_W), η_W from the efficiency column or derived from the power column at the curve's test
 * density; NPSHr is carried unchanged to the corrected flow; a point whose corrected head is not above zero is left
 * out (with a warning). B ≤ 1 or B > 40 or no BEP: the water curve is returned unchanged with that status.
 * @param curve the water curve of one pump at the speed and impeller in use (prepared or raw; SI)
 * @param o.kinematicViscosity kinematic viscosity of the pumped liquid, m²/s
 * @param o.speed pump speed in use, rpm
 */
export function correctCurveForViscosity(curve: PumpCurve | PumpCurveInput, o: { kinematicViscosity: number; speed: number }): ViscousCurve {
  if (!o || typeof o !== "object") throw new EngineInputError("input", "is required");
  const c = ensurePumpCurve(curve);
  const nu = requirePositive("kinematicViscosity", o.kinematicViscosity);
  const speed = requirePositive("speed", o.speed);
  const bep = c.bep;
  if (!bep) return { status: "no-bep", b: null, factors: null, bep: null, speed, curve: c, warnings: [] };
  const p = viscosityParameterB({ kinematicViscosity: nu, bepFlow: bep.flow, bepHead: bep.head, speed });
  const at = { flow: bep.flow, head: bep.head };
  if (!p.needsCorrection) return { status: "no-correction", b: p.b, factors: null, bep: at, speed, curve: c, warnings: [] };
  if (p.b > VISCOSITY_B_MAX) return { status: "outside-method", b: p.b, factors: null, bep: at, speed, curve: c, warnings: p.warnings };
  const f = viscosityFactors(p.b);
  const warnings: EngineWarning[] = [];
  const points: PumpPoint[] = [];
  let dropped = 0;
  for (const w of c.points) {
    const ch = headFactor(f.head, w.flow / bep.flow);
    if (!(ch * w.head > 0)) { dropped++; continue; }
    const pt: PumpPoint = { flow: f.flow * w.flow, head: ch * w.head };
    const etaW = w.efficiency ?? (w.power !== undefined ? (c.powerDensity * G0 * w.flow * w.head) / w.power : undefined);
    if (etaW !== undefined && etaW <= 1) pt.efficiency = f.efficiency * etaW;
    if (w.npshr !== undefined) pt.npshr = w.npshr;
    points.push(pt);
  }
  if (dropped) warnings.push({ code: "viscous-head-zero", message: `${dropped} point(s) at the curve's high-flow end left out: the corrected head C_H·H_W there is not above zero (ANSI/HI 9.6.7 head factor, from memory)` });
  if (points.length < 2) throw new EngineInputError("curve", "too few points keep a head above zero once corrected for viscosity");
  const corrected = createPumpCurve({ points, speed: c.speed ?? undefined, impellerDiameter: c.impellerDiameter ?? undefined,
    minDiameter: c.minDiameter ?? undefined, maxDiameter: c.maxDiameter ?? undefined, riseTolerance: 1 });
  return { status: "corrected", b: p.b, factors: { flow: f.flow, head: f.head, efficiency: f.efficiency }, bep: at, speed, curve: corrected, warnings };
}

/** A viscous duty as the water duty to search the water curves at (`equivalentWaterDuty`). */
export interface EquivalentWaterDuty {
  /** `corrected` (1 < B ≤ 40): search at the water duty below; `no-correction` (B ≤ 1) and `outside-method` (B > 40): at the duty itself. */
  status: "no-correction" | "corrected" | "outside-method";
  /** B with the viscous duty taken as the BEP (dimensionless). */
  b: number;
  /** C_Q, C_H at 1.0 × Q_BEP (= C_BEP-H) and C_η (dimensionless); null unless `corrected`. */
  factors: { flow: number; head: number; efficiency: number } | null;
  /** The water duty to search at: Q_W, m³/s; H_W, m (the viscous duty itself unless `corrected`). */
  flow: number;
  head: number;
  warnings: EngineWarning[];
}

/** The rule `equivalentWaterDuty` applies, in words. */
export const EQUIVALENT_WATER_DUTY_RULE = "ANSI/HI 9.6.7 selection for a viscous duty (from memory: verify against the standard): B from the viscous duty taken as the BEP and the pump's speed, C_Q and C_H at 1.0 × Q_BEP (C_H = C_BEP-H = C_Q) and C_η; the water curves are searched at Q_W = Q_vis / C_Q, H_W = H_vis / C_H, and on the liquid a pump's efficiency is C_η × its water efficiency there; B ≤ 1 needs no correction; above B = 40 the method does not apply and the duty itself is searched";

/**
 * The water duty at which to choose a pump for a viscous duty (ANSI/HI 9.6.7, its procedure for selecting a pump for a
 * given viscous duty, from memory): B computed with the viscous duty (Q_vis, H_vis per stage) taken as the BEP at
 * `speed`; C_Q and C_H at 1.0 × Q_BEP (C_H = C_BEP-H = C_Q) and C_η; Q_W = Q_vis / C_Q, H_W = H_vis / C_H. B ≤ 1:
 * the duty itself (no correction). B > 40: outside the method, the duty itself with a warning.
 * @param o.flow viscous duty flow, m³/s
 * @param o.head viscous duty head per stage, m
 * @param o.kinematicViscosity kinematic viscosity of the pumped liquid, m²/s
 * @param o.speed pump speed, rpm
 */
export function equivalentWaterDuty(o: { flow: number; head: number; kinematicViscosity: number; speed: number }): EquivalentWaterDuty {
  if (!o || typeof o !== "object") throw new EngineInputError("input", "is required");
  const flow = requirePositive("flow", o.flow), head = requirePositive("head", o.head);
  const p = viscosityParameterB({ kinematicViscosity: o.kinematicViscosity, bepFlow: flow, bepHead: head, speed: o.speed });
  if (!p.needsCorrection) return { status: "no-correction", b: p.b, factors: null, flow, head, warnings: [] };
  if (p.b > VISCOSITY_B_MAX) return { status: "outside-method", b: p.b, factors: null, flow, head, warnings: p.warnings };
  const f = viscosityFactors(p.b);
  const ch = headFactor(f.head, 1); // at 1.0 × Q_BEP: C_BEP-H
  return requireFiniteResult("flow", { status: "corrected", b: p.b, factors: { flow: f.flow, head: ch, efficiency: f.efficiency }, flow: flow / f.flow, head: head / ch, warnings: [] });
}
