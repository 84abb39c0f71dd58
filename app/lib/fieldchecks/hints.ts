// The usual causes to check beside a check that misses (or whose readings cannot be right), worded as things to check,
// never a diagnosis. Pure.
import type { FieldCheckResult } from "~/engine";
import { fmtNumExact, qt } from "~/engine/quantityText";
import type { Verdict } from "./form";
import type { CheckResult } from "./result";
import { measuredRpmText } from "./speed-range";

/** A head deviation from the curve (fraction) within which the head is on it: the tolerance cross's allowance for rounding. */
const ON_CURVE = 1e-12;

/** Usual causes, worded as things to check — never a diagnosis. */
export function hintsFor(r: { verdict: Verdict; deviation: CheckResult["deviation"]; speed: CheckResult["speed"]; engine: FieldCheckResult; delivered: CheckResult["delivered"] }): string[] {
  const hints: string[] = [];
  // A pump adds head: a total head at or below zero means the readings are the wrong way round or misread (common practice).
  if (r.delivered.head <= 0)
    hints.push(`The pump's total head comes out at ${qt("head", r.delivered.head)}, ${r.delivered.head < 0 ? "below" : "at"} zero, but a running pump adds head: check that the suction and discharge readings are not swapped, each gauge's reference (gauge or absolute) and unit, and the gauge elevations.`);
  const { dutyFlow, dutyHead, curveHead } = r.deviation;
  const offDuty = dutyFlow !== null && Math.abs(dutyFlow) > 0.05;
  if (offDuty && dutyFlow! < 0 && (dutyHead ?? 0) > 0)
    hints.push("Less flow and more head than the design duty usually means the system is more resistant than designed: look for throttled or closed valves, a clogged strainer or filter, a fouled coil or a stuck check valve.");
  if (offDuty && dutyFlow! > 0 && (dutyHead ?? 0) < 0)
    hints.push("More flow and less head than the design duty usually means the system is less resistant than designed: look for an open bypass, a balancing valve left wide open, or a branch open that should be closed.");
  if (r.speed.measured !== null && r.speed.design !== null && Math.abs(r.speed.measured / r.speed.design - 1) > 0.03)
    hints.push(`The measured speed differs from the selection's speed (${measuredRpmText(r.speed.measured, r.speed.rated, [r.speed.design])} rpm against ${fmtNumExact(r.speed.design, [Math.round(r.speed.design)], 0)} rpm): check the drive's set point and limits, the motor's poles and the nameplate.`);
  // A head on the curve within the rounding the tolerance cross allows (1e-12, the engine's gradeCross) is neither below nor above it.
  // (Not where the head is at or below zero: the readings are misread, not the pump worn.)
  if ((r.verdict === "fail" || r.verdict === "marginal") && curveHead !== null && curveHead < -ON_CURVE && r.delivered.head > 0)
    hints.push("The pump is delivering less head than its curve at this flow. Usual causes to check: air in the pump or suction (entrained or trapped), cavitation (noise, low suction pressure), reverse rotation, a partly blocked impeller, or wear of the impeller and wear rings.");
  if ((r.verdict === "fail" || r.verdict === "marginal") && curveHead !== null && curveHead > ON_CURVE)
    hints.push("The readings sit above the pump's curve: check the gauges' zero and calibration, the gauge elevations, the pipe diameters entered, and the flow meter's range and installation.");
  if (r.engine.verdict === "off-curve")
    hints.push("The measured head is not on the curve at all: check the readings first (gauge reference, units, elevations), then the speed and whether the valve is shut.");
  if (hints.length) hints.unshift("Usual causes to check — these are possibilities, not a diagnosis:");
  return hints;
}
