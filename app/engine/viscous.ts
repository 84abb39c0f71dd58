/**
 * Pump curves measured on water, used for a more viscous liquid: the Hydraulic Institute's parameter B
 * and its correction factors (ANSI/HI 9.6.7, Rotodynamic Pumps — Guideline for Effects of Liquid
 * Viscosity on Performance; equations from memory).
 *
 *   B = 16.5 · ν^0.5 · H_BEP^0.0625 / (Q_BEP^0.375 · N^0.25)
 *     ν kinematic viscosity of the pumped liquid, cSt (mm²/s); H_BEP head per stage at the water BEP, m;
 *     Q_BEP flow at the water BEP, m³/h; N speed, rpm. (The same equation in US units has the constant
 *     26.6 with Q in US gpm and H in ft: 16.5 is 26.6 × 3.2808^0.0625 / 4.4029^0.375 to the printed digits.)
 *   B ≤ 1: no correction is needed. 1 < B < 40: the method's range.
 *   C_Q = 2.71^(−0.165 · (log₁₀ B)^3.15)        flow at the BEP
 *   C_H = C_Q at the BEP                          head at the BEP
 *   C_η = B^(−0.0547 · B^0.69)                    efficiency
 * The method is stated for Newtonian liquids and single- or multistage radial centrifugal pumps; outside
 * 1 < B < 40 the factors are extrapolated and come with a warning. SI at the public face.
 */
import { EngineInputError, requireFiniteResult, requirePositive, type EngineWarning } from "./errors.ts";

/** Where the equations come from, for messages and docs. */
export const HI_VISCOSITY_SOURCE = "ANSI/HI 9.6.7 (Hydraulic Institute, effects of liquid viscosity on rotodynamic pump performance), from memory";

/** At or below this B the water curve needs no viscosity correction (dimensionless). */
export const VISCOSITY_B_NO_CORRECTION = 1;

/** Upper end of the method's range of B (dimensionless). */
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

/**
 * The Hydraulic Institute's parameter B (ANSI/HI 9.6.7, from memory): how far the pumped liquid's
 * viscosity moves the pump from its water curve. Stated range 1 < B < 40; B ≤ 1 needs no correction.
 * @param o.kinematicViscosity kinematic viscosity of the pumped liquid, m²/s (converted to cSt = mm²/s)
 * @param o.bepFlow flow at the best efficiency point on water, m³/s (converted to m³/h), per pump
 * @param o.bepHead head at the best efficiency point on water, m, per stage
 * @param o.speed pump speed, rpm
 * @returns B (dimensionless), whether it needs correction (B > 1) and a warning above B = 40
 */
export function viscosityParameterB(o: { kinematicViscosity: number; bepFlow: number; bepHead: number; speed: number }): ViscosityParameter {
  if (!o || typeof o !== "object") throw new EngineInputError("input", "is required");
  const nuCst = requirePositive("kinematicViscosity", o.kinematicViscosity) * 1e6;
  const qM3h = requirePositive("bepFlow", o.bepFlow) * 3600;
  const h = requirePositive("bepHead", o.bepHead);
  const n = requirePositive("speed", o.speed);
  const b = requireFiniteResult("kinematicViscosity", (16.5 * Math.sqrt(nuCst) * h ** 0.0625) / (qM3h ** 0.375 * n ** 0.25));
  const warnings: EngineWarning[] = [];
  if (b > VISCOSITY_B_MAX)
    warnings.push({ code: "outside-validity", parameter: "kinematicViscosity", message: `B = ${b.toFixed(1)} is above ${VISCOSITY_B_MAX}, the upper end of the ANSI/HI 9.6.7 method's range: its correction factors are extrapolated there` });
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
 * C_BEP-H = C_Q, C_η = B^(−0.0547·B^0.69). All 1 at B ≤ 1 (no correction); above B = 40 extrapolated, with a warning.
 * @param b the parameter B (dimensionless, > 0)
 * @returns C_Q, C_H at the BEP and C_η (dimensionless)
 */
export function viscosityFactors(b: number): ViscosityFactors {
  requirePositive("b", b);
  if (b <= VISCOSITY_B_NO_CORRECTION) return { flow: 1, head: 1, efficiency: 1, warnings: [] };
  const cq = 2.71 ** (-0.165 * Math.log10(b) ** 3.15);
  const ce = b ** (-0.0547 * b ** 0.69);
  const warnings: EngineWarning[] = b > VISCOSITY_B_MAX
    ? [{ code: "outside-validity", parameter: "b", message: `B = ${b.toFixed(1)} is above ${VISCOSITY_B_MAX}: the ANSI/HI 9.6.7 factors are extrapolated` }]
    : [];
  return requireFiniteResult("b", { flow: cq, head: cq, efficiency: ce, warnings });
}
