// A pump's water curve on the system's liquid: the ANSI/HI 9.6.7 parameter B and, where the method allows
// (1 < B ≤ 40), the curve corrected for viscosity (app/engine/viscous.ts) that every figure and the verdict then
// use; and what to tell the engineer. Pump curves are measured on clean cold water (the test standards' liquid), so
// a water system is the curve's own liquid and is never checked; a custom liquid is, at the pump's water BEP and speed.
// Pure: used by evaluateCandidate in hydraulics.ts on the server and in the browser.
import { correctCurveForViscosity, maxShaftPower, viscosityParameterB, HI_VISCOSITY_SOURCE, VISCOSITY_B_MAX, VISCOSITY_B_NO_CORRECTION, type PumpCurve, type ViscousCurveStatus } from "~/engine";
import { fmtNum, fmtNumExact, fmtPct, qt, qtPair } from "~/engine/quantityText";

/** The system's liquid as the check needs it: water (kind) or a custom one, kinematic viscosity m²/s, density kg/m³. */
export type Liquid = { kind: "water" | "custom"; name: string; kinematicViscosity: number; density: number };

export type ViscosityCheck = {
  /** B (dimensionless) at the pump's water BEP (its operating point when the curve has no BEP), or null: the liquid is water, or B could not be computed. */
  b: number | null;
  /** `water`: the curve's own liquid; `not-checked`: no speed (or no point) to compute B at; else the engine's status. */
  status: "water" | "not-checked" | ViscousCurveStatus;
  /** C_Q, C_BEP-H, C_η as applied (dimensionless), when corrected. */
  factors: { flow: number; head: number; efficiency: number } | null;
  /** One pump's curve on the liquid: corrected when `corrected`, else the water curve as given. */
  curve: PumpCurve;
  warnings: string[];
};

/** What the verdict needs (engine verdict.ts): B and whether the figures are on the corrected curve. */
export const verdictViscosity = (c: ViscosityCheck) => (c.b == null ? null : { b: c.b, corrected: c.status === "corrected" });

/** The stored summary of a check (a candidate's result): status, B and the factors; null for water. */
export const viscositySummary = (c: ViscosityCheck) => (c.status === "water" ? null : { status: c.status, b: c.b, factors: c.factors });

/** Why a water curve has no BEP, in words: no efficiency at all, or none peaking inside its data (pumpCurve.ts). */
const noBepWhy = (curve: PumpCurve) => (curve.warnings.some((w) => w.code === "bep-not-published")
  ? "The curve's efficiency has no peak inside its data (BEP not published), so no water BEP"
  : "The curve gives no efficiency, so no water BEP");

/**
 * One pump of a candidate, as adjusted, on the system's liquid: B, the curve to judge with, and the warnings to show.
 * @param fluid the system's liquid (kinematic viscosity m²/s, density kg/m³)
 * @param curve one pump's water curve as adjusted (speed or trim)
 * @param speed the speed in use, rpm, null when the curve names none
 * @param fallback the pump's operating point on the water curve (m³/s, m), asked for only when the curve has no BEP
 */
export function viscosityCheck(fluid: Liquid, curve: PumpCurve, speed: number | null, fallback: () => { flow: number; head: number } | null): ViscosityCheck {
  const as = (status: ViscosityCheck["status"], b: number | null, warnings: string[]): ViscosityCheck => ({ b, status, factors: null, curve, warnings });
  if (fluid.kind === "water") return as("water", null, []);
  const cst = fluid.kinematicViscosity * 1e6;
  const liquid = `${fluid.name || "the custom liquid"} (ν ${fmtNum(cst, cst < 10 ? 2 : 0)} cSt)`;
  const notChecked = (needs: string) => as("not-checked", null, [`The pump curve is for water and was not checked for ${liquid}: the ANSI/HI 9.6.7 parameter B needs ${needs}. Check with the maker whether its curve needs a viscosity correction.`]);
  if (speed == null) return notChecked("the pump's speed, which the curve does not give");
  const v = correctCurveForViscosity(curve, { kinematicViscosity: fluid.kinematicViscosity, speed });
  const at = `at ${qt("speed", speed)}`;
  if (v.status === "no-bep") {
    const op = fallback();
    if (op == null || !(op.flow > 0) || !(op.head > 0)) return notChecked("a flow and head at the BEP");
    const p = viscosityParameterB({ kinematicViscosity: fluid.kinematicViscosity, bepFlow: op.flow, bepHead: op.head, speed });
    if (!p.needsCorrection) return as("no-correction", p.b, []);
    return as("no-bep", p.b, [`ANSI/HI 9.6.7 parameter B = ${bText(p.b)} (above ${VISCOSITY_B_NO_CORRECTION}: correction needed) for ${liquid} at its operating point ${qt("flow", op.flow)} and ${qt("head", op.head)}, ${at}. ${noBepWhy(curve)}: the method cannot correct it, and the figures are the water curve's (${HI_VISCOSITY_SOURCE}).`]);
  }
  const b = v.b as number;
  const where = `at its water BEP ${qt("flow", v.bep!.flow)} and ${qt("head", v.bep!.head)}, ${at}`;
  if (v.status === "no-correction") return as("no-correction", b, []);
  if (v.status === "outside-method")
    return as("outside-method", b, [`ANSI/HI 9.6.7 parameter B = ${bText(b)} for ${liquid} ${where}: above ${VISCOSITY_B_MAX}, outside the method's range, so the curve cannot be corrected by it; the figures are the water curve's and overstate head, flow and efficiency on this liquid. Ask the maker for the pump's performance on it (${HI_VISCOSITY_SOURCE}).`]);
  const f = v.factors!;
  const warnings = [`ANSI/HI 9.6.7 parameter B = ${bText(b)} (above ${VISCOSITY_B_NO_CORRECTION}: correction needed) for ${liquid} ${where}. The curve is corrected for viscosity: C_Q ${f.flow.toFixed(3)}, C_H at the BEP ${f.head.toFixed(3)}, C_η ${f.efficiency.toFixed(3)} (flow ${fmtPct(f.flow, 0)}, head at the BEP ${fmtPct(f.head, 0)}, efficiency ${fmtPct(f.efficiency, 0)} of water's); the operating point, efficiency, shaft power, motor check and BEP position are on the corrected curve. NPSHr is the water curve's, carried to the corrected flows. ${HI_VISCOSITY_SOURCE}.`,
    ...v.warnings.map((w) => w.message)];
  const water = maxShaftPower(curve, fluid.density), liquidMax = maxShaftPower(v.curve, fluid.density);
  if (water && liquidMax) warnings.push(`Largest shaft power on the curve with ${liquid}: ${qtPair("power", liquidMax.power, water.power).join(" corrected for viscosity, against ")} on the water curve at the liquid's density: size the motor on the corrected figure.`);
  return { b, status: "corrected", factors: f, curve: v.curve, warnings };
}

/** B as printed beside its limits: never "1.00 > 1" nor "40.0 > 40". */
const bText = (b: number) => fmtNumExact(b, [VISCOSITY_B_NO_CORRECTION, VISCOSITY_B_MAX], 2);
