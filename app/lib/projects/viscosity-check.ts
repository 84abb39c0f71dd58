// A pump's water curve on the system's liquid: the ANSI/HI 9.6.7 parameter B (app/engine/viscous.ts) and what
// to tell the engineer. Pump curves are measured on clean cold water (the test standards' liquid), so a water
// system is the curve's own liquid and is never checked; a custom liquid is, at the pump's water BEP and speed.
// Pure: used by evaluateCandidate in hydraulics.ts on the server and in the browser.
import { viscosityFactors, viscosityParameterB, HI_VISCOSITY_SOURCE, VISCOSITY_B_NO_CORRECTION, type PumpCurve } from "~/engine";
import { fmtNum, fmtNumExact, fmtPct, qt } from "~/engine/quantityText";

export type ViscosityCheck = {
  /** B (dimensionless) at the pump's water BEP, or null: the liquid is water, or B could not be computed. */
  b: number | null;
  warnings: string[];
};

/**
 * B for one pump of a candidate, as adjusted, and the warnings to show.
 * @param fluid the system's liquid: water (kind) or a custom one, kinematic viscosity m²/s
 * @param curve one pump's curve as adjusted (its BEP, m³/s and m)
 * @param speed the speed in use, rpm, null when the curve names none
 * @param fallback the pump's operating point (m³/s, m), used when the curve has no BEP (no efficiency)
 */
export function viscosityCheck(
  fluid: { kind: "water" | "custom"; name: string; kinematicViscosity: number },
  curve: PumpCurve,
  speed: number | null,
  fallback: { flow: number; head: number } | null,
): ViscosityCheck {
  if (fluid.kind === "water") return { b: null, warnings: [] };
  const cst = fluid.kinematicViscosity * 1e6;
  const liquid = `${fluid.name || "the custom liquid"} (ν ${fmtNum(cst, cst < 10 ? 2 : 0)} cSt)`;
  const ref = curve.bep ?? fallback;
  const where = curve.bep ? "its water BEP" : "its operating point (the curve gives no efficiency, so no BEP)";
  if (speed == null || ref == null || !(ref.flow > 0) || !(ref.head > 0))
    return { b: null, warnings: [`The pump curve is for water and was not checked for ${liquid}: the ANSI/HI 9.6.7 parameter B needs ${speed == null ? "the pump's speed, which the curve does not give" : "a flow and head at the BEP"}. Check with the maker whether its curve needs a viscosity correction.`] };
  const p = viscosityParameterB({ kinematicViscosity: fluid.kinematicViscosity, bepFlow: ref.flow, bepHead: ref.head, speed });
  const warnings = p.warnings.map((w) => w.message);
  if (p.needsCorrection) {
    const f = viscosityFactors(p.b);
    warnings.push(`ANSI/HI 9.6.7 parameter B = ${fmtNumExact(p.b, [VISCOSITY_B_NO_CORRECTION], 2)} (above ${VISCOSITY_B_NO_CORRECTION}: correction needed) for ${liquid} at ${where}, ${qt("flow", ref.flow)} and ${qt("head", ref.head)}, at ${qt("speed", speed)}. The curve is for water and is not corrected for viscosity here: the pump gives less (at the BEP about ${fmtPct(f.head, 0)} of the head and flow, ${fmtPct(f.efficiency, 0)} of the efficiency; ${HI_VISCOSITY_SOURCE}).`);
  }
  return { b: p.b, warnings };
}
