/**
 * A duty-cycle step of a drooping curve (head rising from shut-off to one peak, then falling: headShape.ts) run on a
 * drive, or at fixed speed throttled (n its set speed, 1 at the curve's), judged against the curve at the step's speed n
 * (affinity laws: Q ∝ N, H ∝ N²):
 * - `step-rising-branch`: the step's flow q lies left of the slowed peak, q < n · Q_peak (the full-speed point on its
 *   affinity parabola, q / n, left of the peak's flow Q_peak): on the rising (unstable) branch, where the pump gives the
 *   same head at two flows and may hunt between them (common practice: run a drooping curve right of its peak);
 * - `step-no-start`: the slowed shut-off head n² · H0 lies below the system's head at zero flow (its static head and
 *   pressure difference): started from rest at that speed against its closed check valve, the pump could not open it
 *   (common practice: a pump starts against its closed check valve; a drive's minimum speed is set so the shut-off
 *   head at it exceeds the system's head at zero flow). H0 is the head at the curve's first point: its shut-off head
 *   where that point is at zero flow, else its head at its first published flow (said so).
 * Each judged to 1 part in 10⁸ of its limit (limitText.ts `pastBelow`), so a value judged past prints apart from it.
 * Notes at the step, never failures: the step's energy is as computed. A falling curve gets neither: it has no rising
 * branch, and at a met step its slowed shut-off head is at least the step's head, itself at least the system's head
 * at zero flow. Units: SI (m³/s, m).
 */
import type { EngineWarning } from "./errors.ts";
import type { PumpCurve } from "./pumpCurve.ts";
import { fmtPct, pastBelow, qt, qtPair } from "./quantityText.ts";

/** The codes of the two notes (see the module). */
export const STEP_RISING_BRANCH = "step-rising-branch";
export const STEP_NO_START = "step-no-start";

export interface StepDroopInput {
  /** The curve the cycle runs on, at the speed its speed ratios are fractions of. */
  curve: PumpCurve;
  /** The step's index in the profile (the notes' `parameter`, "profile[i]"), its flow fraction and flow, m³/s. */
  index: number;
  flowFraction: number;
  flow: number;
  /** The speed ratio the step runs at (dimensionless). */
  speed: number;
  /** The system's head at zero flow, m (static head and pressure difference). */
  zeroFlowHead: number;
  /** Pumps counted in the curve (count; absent: 1): the notes say "the k pumps". */
  units?: number;
  /** At fixed speed, throttled (its speed the curve's, or a candidate's set speed): the notes say so, not "at this speed". */
  fixed?: boolean;
}

/**
 * The notes at a drive's step of a drooping curve (none for a curve that is not drooping).
 * @param input.curve the pump curve (SI)
 * @param input.index the step's index in the profile (count)
 * @param input.flowFraction the step's share of the design flow (fraction)
 * @param input.flow the step's flow, m³/s
 * @param input.speed the step's speed ratio (dimensionless)
 * @param input.zeroFlowHead the system's head at zero flow, m
 * @param input.units pumps counted in the curve (count)
 * @param input.fixed true at fixed speed, throttled (unitless; words only)
 */
export function stepDroopWarnings(input: StepDroopInput): EngineWarning[] {
  const { curve, index, flowFraction, flow: q, speed: n, zeroFlowHead, units = 1, fixed = false } = input;
  if (!curve.drooping || !(n > 0)) return [];
  const out: EngineWarning[] = [];
  const speedWords = fixed ? (n === 1 ? "at fixed speed, throttled" : `at its set speed ${fmtPct(n)}, throttled`) : `at ${fmtPct(n)} speed`;
  const at = `at ${Math.round(flowFraction * 100)} % flow ${units === 1 ? "the pump runs" : `the ${units} pumps run`} ${speedWords}`;
  const first = curve.points[0];
  const peak = curve.points.find((p) => p.head === curve.headMax)!; // the interpolant peaks at a point (monotone cubic)
  const peakFlow = n * peak.flow;
  if (pastBelow(q, peakFlow)) {
    const [flow, slowed] = qtPair("flow", q, peakFlow);
    const where = n === 1 ? `the drooping curve's peak, ${qt("head", peak.head)} at ${slowed}` : `the drooping curve's peak at this speed, ${qt("head", n * n * peak.head)} at ${slowed} (${qt("head", peak.head)} at ${qt("flow", peak.flow)} at full speed)`;
    out.push({ code: STEP_RISING_BRANCH, parameter: `profile[${index}]`, message: `${at}, ${flow}: left of ${where}, on the rising branch, where the pump gives one head at two flows and may hunt between them (common practice: run a drooping curve right of its peak)` });
  }
  const h0 = n * n * first.head;
  if (pastBelow(h0, zeroFlowHead)) {
    const [slowed, system] = qtPair("head", h0, zeroFlowHead);
    const what = first.flow === 0 ? `its shut-off head ${qt("head", first.head)}` : `its head at its first published flow, ${qt("head", first.head)} (its shut-off head is not published)`;
    const head = n !== 1 ? `${what} slows to ${slowed} (× ${fmtPct(n)} squared, affinity laws),`
      : first.flow === 0 ? `its shut-off head ${slowed} is` : `its head at its first published flow, ${slowed} (its shut-off head is not published), is`;
    const fix = fixed ? "" : "; set the drive's lowest speed so that its shut-off head there exceeds the system's head at zero flow";
    out.push({ code: STEP_NO_START, parameter: `profile[${index}]`, message: `${at}, where ${head} below the system's head at zero flow, ${system} (static head and pressure difference): started from rest at this speed against its closed check valve it could not open it (common practice: a pump starts against its closed check valve${fix})` });
  }
  return out;
}
