// The curve a field check compares readings with on the selection's liquid. Pump curves are measured on water; on a
// viscous custom liquid the selection's figures and verdict were judged on the curve corrected per ANSI/HI 9.6.7 (from
// memory; app/engine/viscous.ts), so the check compares with that same correction at the speed it judges at. Where the
// method gives no correction (B above 40, or no water BEP), there is no curve to hold the pump to on that liquid: no
// tolerance verdict, with the reason. Pure (runs on the phone too).
import { correctCurveForViscosity, HI_VISCOSITY_SOURCE, viscosityCorrectionText, type PumpCurve } from "~/engine";
import { fmtNumExact } from "~/engine/quantityText";
import type { SystemInput } from "../projects/hydraulics";

export type LiquidCurve = {
  /** The curve to compare with: corrected when the method applies, else the one given. */
  curve: PumpCurve;
  /** What was done, for the check's warnings; null on water or below B = 1. */
  note: string | null;
  /** Why no tolerance verdict can be given on this liquid, or null. */
  noVerdict: string | null;
};

/**
 * @param curve one pump's water curve at the speed judged (SI)
 * @param fluid the selection's liquid (the system document's)
 * @param kinematicViscosity the liquid's kinematic viscosity at the check's temperature, m²/s
 * @param speed the speed the curve stands for, rpm (null when unknown: B cannot be computed)
 */
export function curveOnLiquid(curve: PumpCurve, fluid: SystemInput["fluid"], kinematicViscosity: number, speed: number | null): LiquidCurve {
  if (fluid.kind === "water") return { curve, note: null, noVerdict: null };
  const name = fluid.name || "the custom liquid";
  if (speed == null)
    return { curve, note: `The curve is for water and was not corrected for ${name}: the curve gives no speed, which the ANSI/HI 9.6.7 parameter B needs.`, noVerdict: null };
  const v = correctCurveForViscosity(curve, { kinematicViscosity, speed });
  if (v.status === "no-correction") return { curve, note: null, noVerdict: null };
  if (v.status === "corrected") return { curve: v.curve, note: `Compared with the ${viscosityCorrectionText(v.b!, false)} (at ${Math.round(speed)} rpm, on ${name}), as the selection's figures were.`, noVerdict: null };
  const why = v.status === "outside-method"
    ? `the ANSI/HI 9.6.7 parameter B for ${name} is ${fmtNumExact(v.b!, [40], 1)}, above 40, outside the method's range`
    : `the curve gives no efficiency, so no water BEP from which ANSI/HI 9.6.7 could correct it for ${name}`;
  return { curve, note: null, noVerdict: `No tolerance verdict: ${why}; the water curve overstates what the pump gives on this liquid, so the readings have no curve to be held to (${HI_VISCOSITY_SOURCE}). Ask the maker for the pump's performance on this liquid.` };
}
