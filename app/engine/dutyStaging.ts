/**
 * Identical pumps in parallel over a duty cycle, staged by demand (duty/assist staging).
 *
 * Rule (common practice for pumps in parallel on a variable-flow duty, from memory): at each step run the fewest duty
 * pumps that meet it — k = 1, 2, … N, the first k whose combined curve (k pumps, flows added at equal head: combinePumps)
 * meets the step's flow under the cycle's control mode (fixed speed throttled, or a drive on constant or proportional
 * pressure or the system curve), each pump on its own share Q/k; one more is started only where fewer cannot meet it.
 * A step k pumps "meet" is one dutyCycleEnergy does not call not met (computed, held at the lowest on-curve speed,
 * no power data). Among those the motors decide: the fewest k whose motors run within their rating (no
 * `motor-service-factor-step` or `motor-overload-step`); else the fewest within rating × service factor, the note at the
 * step saying no number runs within rating; else the fewest that meet it, overloaded, its warning saying no number runs
 * within rating × service factor. A service factor is margin for occasional overload, not for continuous running, so k
 * pumps are not left running into it while k + 1 would run within rating (common practice, from memory of NEMA MG 1's
 * service-factor guidance; the energy is then the k + 1 pumps'). A step needing no
 * pump head (`gravity-flow`) or at 0 % flow (`no-demand`) runs none (0 of N). A step no k ≤ N meets reads as with all N running, its numbers as
 * dutyCycleEnergy gives them then (not met, as without staging). Standby pumps never run.
 * Each running pump has its own motor (and drive) on one pump's load: motor and drive losses per motor as in
 * dutyCycle.ts (`motor.units` = k), electrical input and energy the k motors' together.
 * Valid for identical pumps on a common header sharing the flow equally; starting one against the others' head is judged
 * apart (lib/projects/arrangement-start.ts). Units: SI (m³/s, m, W, kg/m³, h; kWh per year).
 */
import { EngineInputError, requireInteger, requirePositive, type EngineWarning } from "./errors.ts";
import { ensurePumpCurve, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { combinePumps, MAX_PUMPS } from "./multiple.ts";
import { dutyCycleEnergy, type DutyCycleInput, type DutyCycleResult, type StepResult } from "./dutyCycle.ts";
import { cycleTotals, markNeverRun } from "./cycleTotals.ts";

/** The rule in words, for every surface that shows a staged cycle (common practice, from memory). */
export const PARALLEL_STAGING_RULE =
  "Pumps in parallel staged by demand: each step runs the fewest duty pumps that meet it with their motors within rating (else within rating × service factor, else overloaded, said at the step; common practice, from memory); standby pumps never run";

/** Steps dutyCycleEnergy reads as not met: the flow or head is out of reach of the pumps running (or of the control curve). */
const NOT_MET: readonly string[] = ["beyond-curve", "control-below-system", "below-speed-range"];

export interface StagedDutyCycleInput extends Omit<DutyCycleInput, "curve" | "motor"> {
  /** ONE pump's curve as installed at full speed (trim applied), SI. */
  pumpCurve: PumpCurve | PumpCurveInput;
  /** Duty pumps in parallel (count, 1–MAX_PUMPS); standby pumps are not given: they never run. */
  dutyPumps: number;
  /** ONE pump's motor: rated output W, rated efficiency (fraction), service factor (dimensionless, 1–1.5; absent 1). */
  motor: { rating: number; efficiency: number; serviceFactor?: number };
}

/**
 * Energy over a duty cycle of identical pumps in parallel, staged by demand: at each step the fewest duty pumps that meet
 * it (module comment), with how many run (`pumpsRunning` of `dutyPumps`), one pump's shaft power (`pumpShaftPower`) and
 * the running pumps' shaft power, electrical input and energy together.
 * @param input see {@link StagedDutyCycleInput} (SI: m³/s, m, W, kg/m³, h; counts dimensionless)
 */
export function stagedDutyCycleEnergy(input: StagedDutyCycleInput): DutyCycleResult {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const n = requireInteger("dutyPumps", input.dutyPumps, 1);
  if (n > MAX_PUMPS) throw new EngineInputError("dutyPumps", `must be at most ${MAX_PUMPS} (got ${n})`);
  if (!input.motor || typeof input.motor !== "object") throw new EngineInputError("motor", "is required");
  const rating = requirePositive("motor.rating", input.motor.rating);
  const one = ensurePumpCurve(input.pumpCurve);
  // One run of the whole cycle per number of pumps running: k pumps' combined curve, k motors each on one pump's load.
  const runs: DutyCycleResult[] = [];
  for (let k = 1; k <= n; k++) {
    const curve = k === 1 ? one : combinePumps(one, { mode: "parallel", duty: k }).curve;
    runs.push(dutyCycleEnergy({ ...input, curve, motor: { ...input.motor, rating: rating * k, units: k }, arrangement: "parallel" }));
  }
  const atStep = (run: DutyCycleResult, i: number) => run.warnings.filter((w) => w.parameter === `profile[${i}]`);
  const meets = (run: DutyCycleResult, i: number) => !NOT_MET.includes(run.steps[i].status);
  const overloaded = (run: DutyCycleResult, i: number) => atStep(run, i).some((w) => w.code === "motor-overload-step");
  const intoSf = (run: DutyCycleResult, i: number) => atStep(run, i).some((w) => w.code === "motor-service-factor-step");
  const why = "(staged: the fewest within rating first; common practice)";
  const warnings: EngineWarning[] = [];
  const steps = runs[0].steps.map((_, i): StepResult => {
    // The fewest within rating; else within rating × service factor; else the fewest that meet it (module comment).
    const withinRating = runs.find((r) => meets(r, i) && !overloaded(r, i) && !intoSf(r, i));
    const withinSf = withinRating ?? runs.find((r) => meets(r, i) && !overloaded(r, i));
    const run = withinSf ?? runs.find((r) => meets(r, i)) ?? runs[n - 1];
    const k = runs.indexOf(run) + 1;
    const s = run.steps[i];
    // With more than one duty pump to choose from, a fallback says why no other number of pumps was started.
    const fellBack = n > 1 && meets(run, i) && !withinRating;
    warnings.push(...atStep(run, i).map((w) =>
      !fellBack ? w
      : w.code === "motor-service-factor-step" ? { ...w, message: `${w.message}; no number of the ${n} duty pumps meets this step within its motors' rating, so the fewest within rating × service factor run ${why}` }
      : w.code === "motor-overload-step" && !withinSf ? { ...w, message: `${w.message}; no number of the ${n} duty pumps meets this step within rating × service factor, so the fewest that meet it run, overloaded ${why}` }
      : w));
    const running = s.status === "gravity-flow" || s.status === "no-demand" ? 0 : k;
    return { ...s, pumpsRunning: running, dutyPumps: n, pumpShaftPower: s.shaftPower == null ? null : running === 0 ? 0 : s.shaftPower / k };
  });
  const { complete, annualEnergyKWh } = cycleTotals(steps, warnings, n);
  markNeverRun(steps, warnings); // a 0 h step's notes, the staging's words included: marked once, at the end
  const first = runs[0];
  return { mode: first.mode, steps, totalHours: first.totalHours, annualEnergyKWh, complete, setpointHead: first.setpointHead, warnings };
}
