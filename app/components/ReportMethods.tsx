// The selection report's "Methods and assumptions": what the frozen figures rest on, said for this selection — the
// liquid's properties (IAPWS for water; as entered for a custom liquid), the ANSI/HI 9.6.7 viscosity status frozen with
// the result (corrected with B and the factors, no correction needed, outside the method, not correctable, not checked,
// or not recorded in a selection frozen before it), pumps in parallel or series and what each figure is for, and where
// the curve data came from (a traced curve's source and caution), how NPSH and the verdict were judged (a selection frozen
// before the band's corners, NPSH over the band or verdicts says what it was judged on). Frozen text is already in the reader's units.
import { HI_VISCOSITY_SOURCE, VISCOSITY_B_MAX, VISCOSITY_B_NO_CORRECTION } from "~/engine";
import type { FrozenSelection } from "~/lib/projects/stored-selection";
import { pumpsBasis, STAGED_BASIS } from "~/lib/projects/power-basis";
import { fmtNumExact, fmtPressure, fmtQ, type UnitChoice } from "~/lib/shared/units";
import { fmtUtc } from "~/lib/shared/format";

type Viscosity = { status: string; b: number | null; factors: { flow: number; head: number; efficiency: number } | null };

/** B beside its limits, never "1.00" for 1.004 nor "40.0" for 40.04 (as the engine's warning prints it). */
const bText = (b: number) => fmtNumExact(b, [VISCOSITY_B_NO_CORRECTION, VISCOSITY_B_MAX], 2);

/** The liquid's properties: IAPWS for water, as entered for a custom liquid. */
export function liquidLine(f: FrozenSelection, units: UnitChoice): string {
  const fluid = f.system.input.fluid;
  if (fluid.kind === "water") return `Water properties: IAPWS-IF97 (density, saturation pressure) and IAPWS R12-08 (viscosity) at ${fmtPressure(units, 101325)}.`;
  return `Liquid properties: ${fluid.name || "the custom liquid"} as entered — density, dynamic viscosity and vapour pressure taken as given at every temperature (kinematic viscosity = dynamic viscosity ÷ density); no property correlation.`;
}

/**
 * How the pump's water curve stands on the liquid (`result.viscosity`, viscosity-check.ts), or null for water. Absent in
 * selections frozen before the check was kept: said so, never read as "no correction needed".
 */
export function viscosityLine(f: FrozenSelection): string | null {
  if (f.system.input.fluid.kind === "water") return null;
  const v = (f.result as { viscosity?: Viscosity | null }).viscosity;
  const at = "at one pump's water BEP and the speed in use";
  if (v === undefined || v === null)
    return "Pump curve on the liquid: no ANSI/HI 9.6.7 viscosity check was recorded with this selection (frozen before it was kept); its figures are the water curve's — check with the maker whether the curve needs a viscosity correction.";
  if (v.status === "corrected" && v.b != null && v.factors)
    return `Pump curve corrected for viscosity per ANSI/HI 9.6.7: B = ${bText(v.b)} ${at} (above ${VISCOSITY_B_NO_CORRECTION}: correction needed); C_Q ${v.factors.flow.toFixed(3)}, C_H at the BEP ${v.factors.head.toFixed(3)}, C_η ${v.factors.efficiency.toFixed(3)} (C_Q on every flow, C_H = 1 − (1 − C_BEP-H)·(Q_W/Q_BEP-W)^0.75 along the curve, C_η on every efficiency); shaft power ρgQH/η at the liquid's density; NPSHr is the water curve's, carried to the corrected flows. ${HI_VISCOSITY_SOURCE}.`;
  if (v.status === "no-correction" && v.b != null)
    return `ANSI/HI 9.6.7 parameter B = ${bText(v.b)}: at or below ${VISCOSITY_B_NO_CORRECTION}, no correction needed; the water curve is used as published (B ${at}; ${HI_VISCOSITY_SOURCE}).`;
  if (v.status === "outside-method" && v.b != null)
    return `ANSI/HI 9.6.7 parameter B = ${bText(v.b)}: above ${VISCOSITY_B_MAX}, outside the method's range; the curve is not corrected: its figures are the water curve's and overstate head, flow and efficiency on this liquid — ask the maker for the pump's performance on it (B ${at}; ${HI_VISCOSITY_SOURCE}).`;
  if (v.status === "no-bep" && v.b != null)
    return `ANSI/HI 9.6.7 parameter B = ${bText(v.b)} at the operating point (above ${VISCOSITY_B_NO_CORRECTION}: correction needed), but the curve gives no water BEP (no efficiency, or none peaking inside its data): the method cannot correct it and the figures are the water curve's (${HI_VISCOSITY_SOURCE}).`;
  return `Pump curve not checked for viscosity: the ANSI/HI 9.6.7 parameter B needs the pump's speed and a flow and head at its BEP, which the curve does not give; the figures are the water curve's — check with the maker (${HI_VISCOSITY_SOURCE}).`;
}

/** Pumps in parallel or series: how they are combined and which figures are one pump's; null for a single pump. */
export function arrangementLine(f: FrozenSelection): string | null {
  const b = pumpsBasis(f.adjustment);
  if (!b) return null;
  const how = f.adjustment.arrangement === "parallel" ? "flows added at equal head" : "heads added at equal flow";
  // A duty cycle staged by demand runs fewer pumps at its low steps: its energy is theirs (power-basis.ts STAGED_BASIS), as the table says.
  const staged = !!f.energy?.cycle?.steps.some((st) => st.pumpsRunning != null);
  const energy = staged ? `shaft power, electrical input and energy at the operating point are for the ${b.together} and over the duty cycle for ${STAGED_BASIS} (staged by demand)` : `shaft power, electrical input and energy are for the ${b.together}`;
  return `${b.arrangement}: one curve for the duty pumps (${how}); efficiency, NPSH, the position against BEP, the largest power on the curve and the motor (rating, overload check, load) are one pump's, each pump having its own motor; ${energy}, identical pumps sharing the duty equally (common practice); standby pumps do not run.`;
}

/** Where the frozen curve data came from, with a traced curve's source and caution. */
export function curveDataLine(f: FrozenSelection): string {
  const lib = f.pump.library;
  const traced = lib.traced ? ` The revision's curves were ${lib.traced.source} — ${lib.traced.caution}` : "";
  return `Curve data frozen from ${lib.name} revision ${lib.revision} at ${fmtUtc(f.frozenAt)}; later library changes do not alter this report.${traced}`;
}

/**
 * The POR and NPSH rule as this selection was judged: at the design point and each corner of the band; in a selection frozen
 * before the corners were kept, at the band's two edges; before NPSH was judged over the band, at the design point only.
 */
export function npshMethodLine(f: FrozenSelection): string {
  const n = f.result.npsh;
  const where = !n
    ? "judged at the design point only (selected before NPSH was judged over the band)"
    : !n.judgedAt
      ? "judged at the design point and at the band's two edges (selected before its four corners were judged), the lowest deciding"
      : "judged at the design point and at each corner of the band (least and most lift × new and aged pipe; suction level as entered at each), the lowest deciding";
  return `Preferred operating region 70–120 % of BEP flow (ANSI/HI 9.6.3); NPSH margin ratio as set above (ANSI/HI 9.6.1 guidance 1.1–2.5), ${where}; NPSHa at or below zero is a cavitation risk whatever the pump.`;
}

/** How the verdict is judged; a selection frozen before verdicts has none, said so (the headline says the same). */
export function verdictMethodLine(f: FrozenSelection): string {
  if (f.result.verdict === undefined) return "Verdict: none was frozen with this selection (selected before Dutymark judged candidates); its figures are at the design operating point.";
  return "Verdict: judged at the band's demanding edge (most lift, aged pipe), where the pump delivers least; meets within the duty flow tolerance, short below it, oversized above it; outside the catalogue when a trim or speed goes beyond what the model publishes (speed 30–100 % of rated unless the model says otherwise); speed and trim solved against the system's head at the duty flow at that edge.";
}

/** Every line of the section, in order. */
export function methodLines(f: FrozenSelection, units: UnitChoice): string[] {
  return [
    "Friction: Darcy-Weisbach with the Colebrook (1939) friction factor solved to machine precision (Clamond 2009); 64/Re below Re 2000; 2000–4000 flagged as transition.",
    "Fittings: K = n·fT after Crane Technical Paper No. 410, 2009 edition (fT for clean commercial steel at full turbulence; butterfly valves by size, tee branch 1.69 or more where editions differ); entrance 0.5 and exit 1.0 (common practice).",
    liquidLine(f, units),
    "System band: least and most static lift × new and aged pipe roughness.",
    "Pump curve: monotone cubic interpolation between published points (Fritsch–Carlson 1980), defined only between the first and last point; operating point by Brent's method.",
    viscosityLine(f),
    "Speed changes and impeller trims: affinity laws (Q ∝ N, H ∝ N², P ∝ N³; trim Q ∝ D, H ∝ D², approximate).",
    arrangementLine(f),
    npshMethodLine(f),
    verdictMethodLine(f),
    `Motor: smallest IEC 60034 standard rating (from memory) whose rating × service factor covers the largest shaft power on the curve; non-overloading only where that power is known at every flow the pump can run at (run-out, one parallel pump alone), else not judged; a duty-cycle step above it is warned of; efficiency by IE class after IEC 60034-30-1 (from memory; from ${fmtQ(units, "power", 120)}, the lower entry between sizes, warned); drive 97 % when a speed is set (common practice); energy from the electrical input.`,
    curveDataLine(f),
  ].filter((l): l is string => l !== null);
}

export function ReportMethods({ f, unitSystem }: { f: FrozenSelection; unitSystem: UnitChoice }) {
  return (
    <section className="panel break-inside-avoid text-sm print:text-xs">
      <h2 className="font-semibold">Methods and assumptions</h2>
      <ul className="mt-2 list-disc space-y-1 pl-5 print:space-y-0.5">
        {methodLines(f, unitSystem).map((l) => (
          <li key={l}>{l}</li>
        ))}
      </ul>
    </section>
  );
}
