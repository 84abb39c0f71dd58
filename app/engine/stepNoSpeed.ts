/**
 * Why no drive speed meets a duty-cycle step (dutyCycle.ts), in words with the pump's numbers: moved out of dutyCycle.ts
 * to keep it one concept a file. Speeds by the affinity laws (Q ∝ N, H ∝ N²). Units: SI (m³/s, m; speeds as ratios).
 */
import { headAt, type PumpCurve } from "./pumpCurve.ts";
import { fmtPctExact, fmtPctLimit, qt, qtPair } from "./quantityText.ts";

/**
 * Why no drive speed from the lowest to full meets a VFD step, with the pump's numbers where it falls short: a flow past
 * the curve's end at full speed, a flow before the curve's first point at the lowest speed, or a head the pump does not
 * reach at full speed (`asks`: whose head it is; `pumpGives`: whose curve, one pump or the duty pumps together). Null where
 * none of these holds (the solver's own words then).
 * @param curve the curve at the speed the ratios are fractions of (SI: m³/s, m)
 * @param q the step's flow, m³/s
 * @param head the head asked at it, m
 * @param minSpeed the drive's lowest speed ratio (dimensionless)
 * @param maxSpeed its highest speed ratio (dimensionless, 1–1.2)
 * @param asks whose head it is, in words (unitless)
 * @param pumpGives whose curve it is, in words (unitless)
 */
export function noSpeedMeets(curve: PumpCurve, q: number, head: number, minSpeed: number, maxSpeed: number, asks: string, pumpGives: string): string | null {
  // The drive's highest speed: the curve's full speed, or the candidate's set speed above it (maxSpeedRatio).
  const set = maxSpeed > 1;
  const top = set ? `${fmtPctLimit(maxSpeed)} speed (the candidate's set speed)` : "full speed (100 %)"; // a limit, as given
  const upTo = `no speed up to ${fmtPctLimit(maxSpeed)}`;
  const noOverspeed = `(the drive does not run the pump above ${set ? "the candidate's set speed" : "its full speed"})`;
  if (q > curve.flowMax * maxSpeed) {
    const [flow, end] = qtPair("flow", q, curve.flowMax * maxSpeed);
    return set
      ? `${flow} is past the curve's end at ${top} (${end} there; ${qt("flow", curve.flowMax)} as published at 100 %): ${upTo} puts it on the curve ${noOverspeed}`
      : `${flow} is past the curve's end at full speed (${end} as published, 100 %): ${upTo} puts it on the curve ${noOverspeed}`;
  }
  const lowStart = curve.flowMin * minSpeed; // the first point on the lowest-speed curve (Q ∝ N)
  if (q < lowStart) {
    const [flow, start] = qtPair("flow", q, lowStart);
    return `${flow} lies before the curve's first point at every speed from the drive's lowest, ${fmtPctLimit(minSpeed)}, to 100 %: at ${fmtPctLimit(minSpeed)} speed the curve starts at ${start} (${qt("flow", curve.flowMin)} as published at full speed); below it the curve gives no data`;
  }
  const h1 = q / maxSpeed >= curve.flowMin ? headAt(curve, q / maxSpeed) : null; // at the highest speed (affinity laws)
  if (h1 === null) return null;
  const hp = h1 * maxSpeed * maxSpeed;
  if (!(hp < head)) return null;
  const [gives, needs] = qtPair("head", hp, head);
  return `at ${qt("flow", q)} ${pumpGives} ${gives} at ${top}, ${fmtPctExact(1 - hp / head)} below the ${needs} ${asks} there: ${upTo} meets this step ${noOverspeed}`;
}
