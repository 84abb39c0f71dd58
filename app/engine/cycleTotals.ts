/**
 * A duty cycle's totals: which steps count, whether the cycle is complete, its energy per year. Steps whose energy is in
 * the total: computed (`ok`, `throttled-at-min-on-curve-speed`) or no pumping needed (`gravity-flow`, 0 kWh) or no demand (`no-demand`, 0 % flow, 0 kWh); the others
 * (not met, or not computed for want of power data) leave the cycle incomplete and their energy out of the total, said
 * with their count (`cycle-incomplete`). Shared by dutyCycle.ts and dutyStaging.ts. Units: kWh per year.
 */
import type { EngineWarning } from "./errors.ts";
import type { StepResult, StepStatus } from "./dutyCycle.ts";

/**
 * The mark on every note at a step of 0 h a year (decision "npshzero"): such a step never runs, so what is said at it — a
 * motor into its service factor or overloading, the BEP, a staged step's NPSH — is shown with its figures but is no finding
 * about the pump as it will run (it qualifies no verdict and leaves no cycle incomplete). The two functions below are text
 * helpers, not part of the engine's public face (index.ts exports the mark only): the app imports them by path.
 */
export const NEVER_RUN_NOTE = "(0 h a year: information only)";

/**
 * A note at a step as shown: marked with {@link NEVER_RUN_NOTE} at the end when the step has 0 h (once, wherever an earlier
 * mark stood: staging adds its words after the step's note), else as given.
 * @param message the note (unitless text)
 * @param hours the step's hours a year, h
 */
export function neverRunMarked(message: string, hours: number | null | undefined): string {
  if (hours !== 0) return message;
  return `${message.split(` ${NEVER_RUN_NOTE}`).join("")} ${NEVER_RUN_NOTE}`;
}

/**
 * Marks every warning naming a step of 0 h (`parameter` "profile[i]") with {@link NEVER_RUN_NOTE}, in place.
 * @param steps the cycle's steps (h)
 * @param warnings the cycle's warnings (unitless), changed in place
 */
export function markNeverRun(steps: readonly { hours: number }[], warnings: EngineWarning[]): void {
  for (const w of warnings) {
    const i = /^profile\[(\d+)\]$/.exec(w.parameter ?? "")?.[1];
    if (i !== undefined) w.message = neverRunMarked(w.message, steps[Number(i)]?.hours);
  }
}

/** Steps whose energy is in the total (see the module comment); the others leave the cycle incomplete. */
export const COUNTED_STEP_STATUSES: readonly StepStatus[] = ["ok", "gravity-flow", "no-demand", "throttled-at-min-on-curve-speed"];
const stepCounted = (s: { status: string }): boolean => (COUNTED_STEP_STATUSES as readonly string[]).includes(s.status);

/**
 * Whether a cycle's steps with hours are all counted, and their energy per year; a `cycle-incomplete` warning pushed onto
 * `warnings` when not.
 * @param steps the cycle's steps (SI; kWh per year each)
 * @param warnings the cycle's warnings (unitless), added to
 * @param pumps the duty pumps the cycle is of (count, default 1): a step not met is "not met by this pump", or with
 *   several "by the 2 pumps" (all of them running there: a staged cycle's not-met step runs all, dutyStaging.ts)
 */
export function cycleTotals(steps: readonly StepResult[], warnings: EngineWarning[], pumps = 1): { complete: boolean; annualEnergyKWh: number } {
  const complete = steps.every((s) => stepCounted(s) || s.hours === 0);
  if (!complete) {
    const missing = steps.filter((s) => !stepCounted(s) && s.hours > 0);
    const notComputed = missing.filter((s) => s.status === "no-power-data").length;
    const notMet = missing.length - notComputed;
    const of = (n: number) => `${n} of ${steps.length} step${steps.length === 1 ? "" : "s"} with running hours`;
    const parts = [notMet > 0 ? `${of(notMet)} not met by ${pumps > 1 ? `the ${pumps} pumps` : "this pump"} or on this control curve` : "", notComputed > 0 ? `${of(notComputed)} not computed (the curve has no power data there)` : ""].filter(Boolean);
    warnings.push({ code: "cycle-incomplete", message: `${parts.join("; ")}: their energy is missing from the total` });
  }
  const annualEnergyKWh = steps.reduce((sum, s) => sum + (s.energyKWh ?? 0), 0);
  return { complete, annualEnergyKWh };
}
