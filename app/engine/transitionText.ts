/**
 * The laminar–turbulent transition in words: at one Reynolds number (a pipe's loss at one flow, headLoss.ts), and
 * over a system curve's flows, judged from the band's own flows Q = Re·ν·π·D/4 at Re 2000 and 4000 (Re = 4Q/(π·D·ν)),
 * never from the flows a curve happens to be sampled at (system.ts). Engine-internal: not on the public face.
 */
import type { EngineWarning } from "./errors.ts";
import { churchill, colebrook, laminar } from "./friction.ts";
import type { DarcyCorrelation } from "./registry.ts";
import { fmtNumExact, fmtPctExact, fmtPctLimit, qt, qtExact, qtLimit } from "./quantityText.ts";

/** Upper Reynolds number of laminar flow, and lower of fully turbulent (common practice). */
export const LAMINAR_MAX_RE = 2000;
export const TURBULENT_MIN_RE = 4000;
/**
 * With a duty, the transition is warned only where it reaches this fraction of the duty flow (our rule): the flows a
 * selection is judged at (the band's operating points, the usual part-load steps down to half flow) lie above it, and
 * below it the friction head is under a quarter of the duty's (∝ Q²), so an uncertain f there moves little. Nearly every
 * curve starts at zero flow and so crosses the transition somewhere; warning of that on every system says nothing.
 */
export const TRANSITION_DUTY_FRACTION = 0.5;

const f3 = (x: number) => x.toPrecision(3);
/** A Reynolds number as read: whole (as the warning at one flow writes it). */
const reText = (re: number) => String(Math.round(re));

/**
 * What the correlation used gives in the transition, in words true of it. A turbulent correlation (Colebrook,
 * Swamee-Jain, Haaland) carried below Re 4000 gives an f above the laminar 64/Re: the higher, conservative side of
 * the uncertain range. Churchill's one formula passes from the laminar value at Re 2000 to the turbulent one by
 * Re 4000, so near Re 2000 it gives about 64/Re, well below Colebrook's (0.0320 against 0.0494 at Re 2001, smooth
 * pipe): it is called conservative only where it is at least Colebrook's value.
 * @param corr correlation used (unitless descriptor)
 * @param reynolds Reynolds number (dimensionless, 2000–4000)
 * @param relativeRoughness ε/D (dimensionless)
 * @param f friction factor it gave (dimensionless)
 */
export function transitionMethodNote(corr: DarcyCorrelation, reynolds: number, relativeRoughness: number, f: number): string {
  const lam = laminar(reynolds);
  const vsLaminar = `${f >= lam ? "above" : "below"} the laminar 64/Re = ${f3(lam)}`;
  if (corr.id !== "churchill") {
    return `${corr.name} used, a turbulent correlation carried below its range: f = ${f3(f)}, ${vsLaminar}${f >= lam ? ", the higher, conservative side" : ""}`;
  }
  const turb = colebrook(reynolds, relativeRoughness);
  const blend = `${corr.name} used, one formula passing from the laminar value to the turbulent one across it: f = ${f3(f)}, against the laminar 64/Re = ${f3(lam)}`;
  if (!Number.isFinite(turb)) return `${blend}; it may be below a turbulent correlation's value, not the conservative side`;
  return f >= turb
    ? `${blend} and Colebrook's turbulent ${f3(turb)}: at or above the turbulent value, the conservative side`
    : `${blend} and Colebrook's turbulent ${f3(turb)}: below the turbulent value, so not the conservative side (a turbulent correlation such as Colebrook gives the higher f)`;
}

/**
 * The transition warning at one Reynolds number (a pipe's loss at one flow).
 * @param corr correlation used (unitless descriptor)
 * @param reynolds Reynolds number (dimensionless, 2000–4000)
 * @param relativeRoughness ε/D (dimensionless)
 * @param f friction factor it gave (dimensionless)
 */
export function transitionMessage(corr: DarcyCorrelation, reynolds: number, relativeRoughness: number, f: number): string {
  // Re never reads as an end of the band it is inside ("4000" for 3999.6: turbulent from 4000).
  return `Re = ${fmtNumExact(reynolds, [LAMINAR_MAX_RE, TURBULENT_MIN_RE], 0)} is in the laminar–turbulent transition (${LAMINAR_MAX_RE}–${TURBULENT_MIN_RE}); friction is uncertain there. ${transitionMethodNote(corr, reynolds, relativeRoughness, f)}`;
}

/**
 * The flows of one pipe in the transition: Q = Re·ν·π·D/4 at Re 2000 and 4000, m³/s.
 * @param diameter inner diameter, m
 * @param kinematicViscosity ν, m²/s
 */
export function transitionFlows(diameter: number, kinematicViscosity: number): { low: number; high: number } {
  const q = (re: number) => (re * kinematicViscosity * Math.PI * diameter) / 4;
  return { low: q(LAMINAR_MAX_RE), high: q(TURBULENT_MIN_RE) };
}

/**
 * The transition warning of one run over a curve's flows [flowMin, flowMax]: given when the band's flows
 * (Q at Re 2000 to 4000) overlap them and, with a duty, reach {@link TRANSITION_DUTY_FRACTION} of its flow; the same
 * whatever the curve's sampling. Names the band's flows, where the duty
 * flow is against them with its Re, and what the correlation gives at the duty's Re when it is in the band, else at
 * the band's lowest Re on the curve (for Churchill, the least conservative point). Null when no flow drawn is in it.
 * @param run.diameter inner diameter, m
 * @param run.roughness absolute roughness, m
 * @param kinematicViscosity ν, m²/s
 * @param corr the Darcy correlation chosen (unitless descriptor)
 * @param range.flowMin, range.flowMax the curve's flows, m³/s
 * @param duty the duty flow, m³/s (optional)
 */
export function transitionBandWarning(
  run: { diameter: number; roughness: number },
  kinematicViscosity: number,
  corr: DarcyCorrelation,
  range: { flowMin: number; flowMax: number },
  duty?: number | null,
): EngineWarning | null {
  const { low, high } = transitionFlows(run.diameter, kinematicViscosity);
  if (!(low < range.flowMax && high > range.flowMin)) return null;
  if (duty != null && duty > 0 && high < TRANSITION_DUTY_FRACTION * duty) return null;
  const reAt = (q: number) => (4 * q) / (Math.PI * run.diameter * kinematicViscosity);
  const eD = run.roughness / run.diameter;
  const dutyIn = duty != null && duty > low && duty < high;
  const re = dutyIn ? reAt(duty) : Math.max(LAMINAR_MAX_RE, reAt(range.flowMin));
  const f0 = corr.fn(re, eD);
  const failed = !(Number.isFinite(f0) && f0 > 0);
  const f = failed ? churchill(re, eD) : f0;
  const method = `At Re = ${reText(re)}${dutyIn ? " (the duty)" : ""}: ${transitionMethodNote(corr, re, eD, f)}${failed ? ` (${corr.name} failed there; Churchill's value)` : ""}.`;
  // The duty flow and its Re read apart from the band's ends they are judged against (1.13 m³/h "above" a band "to 1.13 m³/h", Re = 4000 above 4000).
  const dutyShown = duty != null && duty > 0 ? [duty] : [];
  const band = `flows from ${qtLimit("flow", low, dutyShown)} to ${qtLimit("flow", high, dutyShown)} (Re ${LAMINAR_MAX_RE}–${TURBULENT_MIN_RE}, Q = Re·ν·π·D/4 with D = ${qt("diameter", run.diameter)}) are in the laminar–turbulent transition; friction is uncertain there`;
  let where = "";
  if (duty != null && duty > 0) {
    const d = `the duty flow ${qtExact("flow", duty, [low, high])} (Re = ${fmtNumExact(reAt(duty), [LAMINAR_MAX_RE, TURBULENT_MIN_RE], 0)})`;
    where = dutyIn ? `; ${d} is in it`
      // At an end exactly: Re 4000 is turbulent, Re 2000 laminar (headLoss.ts), so the duty is at the band's end, not past it.
      : duty >= high ? `; ${d} is ${duty === high ? "at its top end" : "above it"}, turbulent: only the curve below ${qtLimit("flow", high, dutyShown)} (${fmtPctExact(high / duty, [TRANSITION_DUTY_FRACTION, 1])} of the duty flow; warned from ${fmtPctLimit(TRANSITION_DUTY_FRACTION)} of it) is affected`
      : `; ${d} is ${duty === low ? "at its bottom end" : "below it"}, laminar (64/Re)`;
  }
  return { code: "transition-flow", parameter: "reynolds", message: `${band}${where}. ${method}` };
}
