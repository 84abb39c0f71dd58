/**
 * Energy over a duty cycle (load profile) with a control mode.
 *
 * A duty cycle is a list of steps: a fraction of the design flow and the hours run at it per year.
 * At each step the pump's operating point follows the control mode:
 * - `fixed-speed`: the pump stays on its own curve at full (as-set) speed; the reduced flow comes
 *   from the circuit's valves throttling (common practice model of a constant-speed pump in a
 *   variable-flow circuit). Head = the pump's head at that flow; a step the pump cannot reach
 *   (flow past its curve end, or its head below the system's) is not computed.
 * - VFD, the speed is set so the pump delivers the step's flow at the head the control asks for:
 *   `constant-pressure`      H = H_set                                    (control-curve definition, common practice)
 *   `proportional-pressure`  H = H_set · (z + (1 − z) · Q/Q_design), z = 0.5 (common practice; the same
 *                            reference control curve as EN 16297-1 for circulators, from memory)
 *   `system-curve`           H = the system's head at Q (ideal control: no excess head)
 *   with H_set = the system's head at the design flow. Speed by the affinity laws (Q ∝ N, H ∝ N²,
 *   P ∝ N³; efficiency constant along the affinity parabola), as in affinity.ts; speeds 30–100 % of the curve's
 *   (up to a candidate's set speed where it is set above its curve's, at most 120 %: `maxSpeedRatio`). A step
 *   that would need less than the lowest speed runs at the lowest speed, throttled (common practice).
 *   A step whose duty point lies past the curve's end at every speed that keeps its flow on the curve (the pump gives more
 *   head than asked where the flow first reaches the curve's last published point, and below that speed the flow is off
 *   the curve, where the curve says nothing) runs at that lowest on-curve speed, N = Q / Q_end, and a valve (or the
 *   system's balancing) takes the surplus head: met, status `throttled-at-min-on-curve-speed`, counted; its energy is at
 *   that speed and flow with the pump's head there (N² · H(Q_end)), not the system's. Common practice for a
 *   drive-controlled pump (from memory of pump makers' drive guidance: a drive is not run to a speed where the duty leaves
 *   the published curve; the surplus is throttled). It is `beyond-curve` (not met) only where no speed within the drive's
 *   limits puts the flow on the curve (Q above the curve's end at full speed) or the duty's head is above it.
 *   Where the control curve asks less head than the system needs at the step's flow (an open system whose
 *   static head lies above 0.5 · H_set under proportional pressure, or any step above the design flow), the
 *   step is NOT met (status `control-below-system`): a differential-pressure controller holds the pump on its
 *   control curve and the flow settles where that curve crosses the system curve, below the demanded flow; the
 *   controller does not add head to reach it. Common practice (pump makers' control-mode guidance, from memory):
 *   proportional pressure suits circuits whose head is mostly friction; with a large static head or a high
 *   minimum differential, raise the set point or control on the system curve (or constant pressure). Running
 *   such a step at max(control head, system head) instead would price a controller that is not the mode chosen.
 *   Hence, step by step where all are met, energy: constant pressure ≥ proportional pressure ≥ system curve;
 *   a step not met drops out of the total (`complete` false), so compare totals only when complete.
 *   A step at 0 % flow (`no-demand`): hours with no demand, the pump taken as stopped, 0 kWh, met and counted.
 *   No pump head needed (`system-curve` only: a pressure set point must be above 0): where the system's head at the
 *   step's flow is ≤ 0, its static head and pressure difference (gravity, a lower pressure on the discharge surface, or
 *   both) drive at least that flow, so no pump head is needed and a valve throttles the flow to the step's. The step
 *   (status `gravity-flow`, the name kept) takes the pump as stopped, 0 kWh, and counts as met; its text names the cause
 *   with the system's parts where the caller gives them (`noHeadReason`). Assumed (common practice for gravity-fed
 *   transfer, from memory): the flow passes the stopped pump or a bypass; the stopped pump's own loss and a check valve's
 *   are not in the system curve, so the step's text says to check that enough head is left to drive the flow through
 *   them. A pump that must keep running there (a minimum speed, a process rule) is a design matter this model does not
 *   price: its energy at that step is not counted, as the text says.
 * A drooping curve, on a drive or at fixed speed: a step left of the (slowed) peak, or whose (slowed) shut-off head is
 *   below the system's head at zero flow, gets a note at the step (stepDroop.ts, common practice).
 * Electrical input P_el = P_shaft / (η_motor(x) · η_drive(x)), x = P_shaft / motor rating:
 * - motor part load (common practice assumption, from memory of typical IE3 induction-motor part-load
 *   data: nearly flat from 50 to 100 % load, falling below): η = η_rated × k_m(x), k_m = 1 at x ≥ 0.5,
 *   0.93 at 0.25, 0.80 at 0.10, linear between; below 10 % load the 10 % value with a warning.
 * - drive part load (common practice assumption, from memory of published part-load efficiency curves of
 *   low-voltage PWM drives, e.g. the US DOE Motor Systems tip sheet on adjustable speed drive part-load
 *   efficiency; check the drive maker's data): η = η_rated × k_d(x), k_d = 1 at x ≥ 1, 0.995 at 0.75,
 *   0.985 at 0.5, 0.95 at 0.25, 0.88 at 0.10, linear between.
 * Energy per step E = P_el × hours; the total per year is the sum. Units: SI (m³/s, m, W, h, kWh).
 */
import { EngineInputError, requireFinite, requireNonNegative, requirePositive, type EngineWarning } from "./errors.ts";
import { ensurePumpCurve, headAt, efficiencyAt, shaftPowerAt, type PumpCurve, type PumpCurveInput } from "./pumpCurve.ts";
import { speedForDuty } from "./affinity.ts";
import { G0 } from "./units.ts";
import { fmtPct, fmtPctExact, fmtPctLimit, LIMIT_ROUNDING, pastBelow, pctLimitWithDecimals, qt, qtExact, qtLimit, qtPair } from "./quantityText.ts";
import { limitCovers, motorLimit } from "./motor.ts";
import { cycleTotals, markNeverRun } from "./cycleTotals.ts";
import { stepPorWarning } from "./stepPor.ts";
import { noSpeedMeets } from "./stepNoSpeed.ts";
import { stepDroopWarnings } from "./stepDroop.ts";
import { decimalSum } from "./decimalSum.ts";
import { DRIVE_PART_LOAD, MOTOR_PART_LOAD, partLoadFactor } from "./partLoad.ts";
import { flowOnCurveEnds } from "./stepFlow.ts";

export { DRIVE_PART_LOAD, MOTOR_PART_LOAD, PART_LOAD_SOURCE } from "./partLoad.ts";

export type ControlMode = "fixed-speed" | "constant-pressure" | "proportional-pressure" | "system-curve";

/** Control modes as data: label and the relation, with its source. */
export const CONTROL_MODES: readonly { id: ControlMode; label: string; vfd: boolean; relation: string; source: string }[] = [
  { id: "fixed-speed", label: "Fixed speed, throttled on the system", vfd: false, relation: "pump on its own curve at full speed; flow reduced by valves", source: "common practice" },
  { id: "constant-pressure", label: "VFD, constant pressure", vfd: true, relation: "H = H_set (system head at design flow)", source: "control-curve definition, common practice" },
  { id: "proportional-pressure", label: "VFD, proportional pressure", vfd: true, relation: "H = H_set · (0.5 + 0.5 · Q/Q_design)", source: "common practice; EN 16297-1 reference control curve (from memory)" },
  { id: "system-curve", label: "VFD, following the system curve", vfd: true, relation: "H = system head at Q", source: "ideal control (affinity laws), common practice" },
];
export const isControlMode = (x: unknown): x is ControlMode => CONTROL_MODES.some((m) => m.id === x);

/** Head at zero flow of the proportional-pressure curve, fraction of H_set (common practice). */
export const PROPORTIONAL_ZERO_FLOW = 0.5;

/** One step of a duty cycle: a fraction of the design flow (0 ≤ f ≤ 1.5; 0: no demand, the pump stopped) and hours per year at it. */
export interface DutyStep {
  flowFraction: number;
  hours: number;
}

/** Largest flow fraction accepted (an overload step may be given; beyond this it is surely a typo). */
export const MAX_FLOW_FRACTION = 1.5;
export const MAX_STEPS = 24;

/** Share of the running time at 100 / 75 / 50 / 25 % flow for circulators (EN 16297-1 reference profile, from memory). */
export const CIRCULATOR_PROFILE_SHARES: readonly (readonly [number, number])[] = [[1, 0.06], [0.75, 0.15], [0.5, 0.35], [0.25, 0.44]];
export const CIRCULATOR_PROFILE_SOURCE = "Common practice for circulators in variable-flow heating and cooling: the EN 16297-1 reference load profile, 100/75/50/25 % flow for 6/15/35/44 % of the time (from memory)";

/**
 * The common-practice circulator profile spread over a year's running hours.
 * @param hoursPerYear running hours per year, h (0–8784)
 */
export function defaultCirculatorProfile(hoursPerYear: number): DutyStep[] {
  const h = requireNonNegative("hoursPerYear", hoursPerYear);
  if (h > 8784) throw new EngineInputError("hoursPerYear", "cannot exceed 8784 h");
  return CIRCULATOR_PROFILE_SHARES.map(([flowFraction, share]) => ({ flowFraction, hours: h * share }));
}


/** `gravity-flow`: no pump head needed at the step (system head ≤ 0), pump taken as stopped, 0 kWh; met like `ok`. */
/** `no-demand`: a step at 0 % flow — hours with the system at zero demand: the pump is stopped, 0 kWh; met like `ok`. */
/** `throttled-at-min-on-curve-speed`: run at the lowest speed keeping the flow on the curve, the surplus head throttled; met, computed like `ok`. */
export type StepStatus = "ok" | "gravity-flow" | "no-demand" | "throttled-at-min-on-curve-speed" | "beyond-curve" | "control-below-system" | "below-speed-range" | "no-power-data";

export { COUNTED_STEP_STATUSES, NEVER_RUN_NOTE } from "./cycleTotals.ts";

export interface StepResult {
  flowFraction: number;
  hours: number;
  /** Flow, m³/s, and the head the pump delivers there, m. */
  flow: number;
  head: number | null;
  /** Speed ratio N/N_full (1 at fixed speed). */
  speedRatio: number | null;
  /** Pump efficiency at the point (fraction). */
  efficiency: number | null;
  /** Shaft power, W. */
  shaftPower: number | null;
  /** Shaft power / motor rating. */
  loadFraction: number | null;
  motorEfficiency: number | null;
  driveEfficiency: number | null;
  /** Electrical input, W. */
  electricalPower: number | null;
  /** kWh per year at this step (null when the step cannot be computed). */
  energyKWh: number | null;
  status: StepStatus;
  message: string;
  /** Pumps in parallel staged by demand (dutyStaging.ts; absent otherwise): duty pumps running at this step (count, 0 when stopped), of `dutyPumps` (count). */
  pumpsRunning?: number;
  dutyPumps?: number;
  /** Staged: one running pump's shaft power, W (`shaftPower` is the running pumps' together). */
  pumpShaftPower?: number | null;
}

export interface DutyCycleResult {
  mode: ControlMode;
  steps: StepResult[];
  totalHours: number;
  /** Sum over the steps that could be computed, kWh per year. */
  annualEnergyKWh: number;
  /** False when a step with hours could not be computed (its energy is missing from the total). */
  complete: boolean;
  /** Set-point head H_set, m (null at fixed speed and under system-curve control, which has no set point). */
  setpointHead: number | null;
  warnings: EngineWarning[];
}

export interface DutyCycleInput {
  /** The pump as installed at full speed (trim and arrangement applied), SI. */
  curve: PumpCurve | PumpCurveInput;
  /** The system's head at a flow, m (m³/s in). */
  systemHead: (flow: number) => number;
  /** Flow at 100 %, m³/s. */
  designFlow: number;
  mode: ControlMode;
  profile: readonly DutyStep[];
  /** Fluid density, kg/m³. */
  density: number;
  /**
   * Motor rated output W (all duty motors together), rated efficiency (fraction) and service factor (dimensionless,
   * 1–1.5; absent: 1, the strictest): a step that loads the motor above rating × service factor is warned of. `units`:
   * the number of equal motors sharing the load (duty pumps in parallel or series; absent: 1), whose notes are each one's.
   */
  motor: { rating: number; efficiency: number; serviceFactor?: number; units?: number };
  /** Drive rated efficiency (fraction), or null without a drive (VFD modes need one). */
  driveEfficiency: number | null;
  /** Lowest speed ratio (default 0.3, as the verdict's speed range). */
  minSpeedRatio?: number;
  /**
   * Highest speed ratio the drive runs the curve at (default 1, its full speed; up to 1.2 for a candidate set above its
   * curve's speed, the candidate's set speed). Speed ratios stay fractions of the curve's speed.
   */
  maxSpeedRatio?: number;
  /** At fixed speed: the speed the curve is at, a fraction of the curve's own (a candidate set to a speed by a drive; default 1), named in the step's text and speed ratio. */
  fixedSpeedRatio?: number;
  /**
   * Why the system needs no pump head at a flow (m³/s) where its head is ≤ 0, in words with its parts and numbers — one
   * clause naming what drives the flow (the caller knows the system's static head and pressure difference; without it
   * the step names both together).
   */
  noHeadReason?: (flow: number) => string;
  /** How the `motor.units` pumps of the curve share the flow (parallel: each Q/units; series: each Q), for the BEP note at a step (stepPor.ts); absent: one pump. */
  arrangement?: "parallel" | "series";
  /** The maker's minimum continuous flow of ONE pump on `curve` as given (at its speed), m³/s, for the note at a step below it (stepPor.ts); null or absent: none recorded. */
  makerMinFlow?: number | null;
}

/**
 * Operating point, speed, efficiencies, electrical input and energy at each step, and the total per year.
 * @param input see {@link DutyCycleInput} (SI: m³/s, m, W, kg/m³, h)
 */
export function dutyCycleEnergy(input: DutyCycleInput): DutyCycleResult {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const curve = ensurePumpCurve(input.curve);
  if (typeof input.systemHead !== "function") throw new EngineInputError("systemHead", "must be a function of flow");
  if (input.noHeadReason !== undefined && typeof input.noHeadReason !== "function") throw new EngineInputError("noHeadReason", "must be a function of flow giving words");
  const qDesign = requirePositive("designFlow", input.designFlow);
  if (!isControlMode(input.mode)) throw new EngineInputError("mode", `must be one of ${CONTROL_MODES.map((m) => m.id).join(", ")}`);
  const mode = input.mode;
  const vfd = CONTROL_MODES.find((m) => m.id === mode)!.vfd;
  const rho = requirePositive("density", input.density);
  if (!input.motor || typeof input.motor !== "object") throw new EngineInputError("motor", "is required");
  const rating = requirePositive("motor.rating", input.motor.rating);
  const etaM = requirePositive("motor.efficiency", input.motor.efficiency);
  if (etaM > 1) throw new EngineInputError("motor.efficiency", "is a fraction 0–1");
  const sf = input.motor.serviceFactor === undefined ? 1 : requirePositive("motor.serviceFactor", input.motor.serviceFactor);
  if (sf < 1 || sf > 1.5) throw new EngineInputError("motor.serviceFactor", "must be between 1.0 and 1.5");
  // Equal motors sharing the load (pumps in parallel or series; absent: 1): the motor notes are each one's.
  const units = input.motor.units === undefined ? 1 : requirePositive("motor.units", input.motor.units);
  if (!Number.isInteger(units)) throw new EngineInputError("motor.units", "is a whole number of motors");
  if (input.arrangement !== undefined && input.arrangement !== "parallel" && input.arrangement !== "series") throw new EngineInputError("arrangement", "must be 'parallel' or 'series' (or absent: one pump)");
  const makerMinFlow = input.makerMinFlow == null ? null : requirePositive("makerMinFlow", input.makerMinFlow);
  const theMotor = units === 1 ? "the motor" : `each of the ${units} motors`;
  const pumpGives = units === 1 ? "the pump gives" : `the ${units} pumps together give`; // the curve is theirs together
  const etaD = input.driveEfficiency === null || input.driveEfficiency === undefined ? null : requirePositive("driveEfficiency", input.driveEfficiency);
  if (etaD !== null && etaD > 1) throw new EngineInputError("driveEfficiency", "is a fraction 0–1");
  if (vfd && etaD === null) throw new EngineInputError("driveEfficiency", `control mode "${mode}" runs on a drive: give its efficiency`);
  const minSpeed = requirePositive("minSpeedRatio", input.minSpeedRatio ?? 0.3);
  if (minSpeed >= 1) throw new EngineInputError("minSpeedRatio", "must be below 1");
  const maxSpeed = requirePositive("maxSpeedRatio", input.maxSpeedRatio ?? 1);
  const fixedRatio = requirePositive("fixedSpeedRatio", input.fixedSpeedRatio ?? 1);
  if (maxSpeed < 1 || maxSpeed > 1.2) throw new EngineInputError("maxSpeedRatio", `must be from 1 (full speed) to 1.2 (the candidate's ratio's bound, exactly), not ${maxSpeed}`);
  if (!Array.isArray(input.profile)) throw new EngineInputError("profile", "must be a list of steps");
  if (input.profile.length === 0) throw new EngineInputError("profile", "is empty: give at least one step (flow fraction and hours)");
  if (input.profile.length > MAX_STEPS) throw new EngineInputError("profile", `has more than ${MAX_STEPS} steps`);
  let totalHours = 0;
  for (const [i, s] of input.profile.entries()) {
    const f = requireNonNegative(`profile[${i}].flowFraction`, s?.flowFraction); // 0: no demand, the pump stopped
    if (f > MAX_FLOW_FRACTION) throw new EngineInputError(`profile[${i}].flowFraction`, `is above ${MAX_FLOW_FRACTION} (150 % of the design flow)`);
    totalHours += requireNonNegative(`profile[${i}].hours`, s.hours);
  }
  // The hours added up as typed, exactly (decimalSum.ts: 8783.99 + 0.01 is 8784); the total to 2 decimals, or as typed where those read 8784.
  const hoursTyped = decimalSum(input.profile.map((s) => s.hours));
  if (hoursTyped.compare(8784) > 0) throw new EngineInputError("profile", `adds up to ${Number(totalHours.toFixed(2)) > 8784 ? Number(totalHours.toFixed(2)) : hoursTyped.text} h, more than a year (8784 h)`);
  // Only the pressure modes hold a set point; system-curve control follows the system, downhill included.
  const pressureSet = mode === "constant-pressure" || mode === "proportional-pressure";
  const hSet = pressureSet ? requireFinite("systemHead(designFlow)", input.systemHead(qDesign)) : null;
  if (hSet !== null && !(hSet > 0)) throw new EngineInputError("systemHead", `must be positive at the design flow for a pressure set point (${mode}): it is ${qt("head", hSet)}; use system-curve control for a system that runs by gravity`);
  const warnings: EngineWarning[] = [];
  // A drooping curve, on a drive or throttled at fixed speed: each step judged against the peak and the system's head at zero flow (stepDroop.ts).
  const zeroFlowHead = curve.drooping ? requireFinite("systemHead(0)", input.systemHead(0)) : null;

  const steps = input.profile.map((s, i): StepResult => {
    const q = qDesign * s.flowFraction;
    const base = { flowFraction: s.flowFraction, hours: s.hours, flow: q };
    const none = (status: StepStatus, message: string, head: number | null = null, speedRatio: number | null = null): StepResult => ({
      ...base, head, speedRatio, efficiency: null, shaftPower: null, loadFraction: null, motorEfficiency: null, driveEfficiency: null, electricalPower: null, energyKWh: null, status, message,
    });
    // Hours at zero demand are real (a plant idle at night, a season off): the pump is stopped, 0 kWh, and the step is met
    // and counted (common practice: a pump with nothing to deliver is switched off, not run against a closed valve).
    if (s.flowFraction === 0) {
      return {
        ...base, head: null, speedRatio: 0, efficiency: null, shaftPower: 0, loadFraction: 0, motorEfficiency: null, driveEfficiency: null, electricalPower: 0, energyKWh: 0,
        status: "no-demand",
        message: "0 % flow: no demand, so the pump is taken as stopped, 0 kWh (assumed: it is switched off, not run against a closed valve; a pump kept running at zero flow is not counted and overheats)",
      };
    }
    let head: number;
    let n: number;
    let shaft: number | null;
    let eta: number | null;
    let lowest = false;
    let throttled: string | null = null; // the text of a step held at its lowest on-curve speed
    if (!vfd) {
      const hSys = requireFinite("systemHead", input.systemHead(q));
      const qc = flowOnCurveEnds(q, curve.flowMin, curve.flowMax); // a rounding error past an end is the end (stepFlow.ts)
      const hp = qc >= curve.flowMin && qc <= curve.flowMax ? headAt(curve, qc) : null;
      // The flow kept apart from both ends (never "20.0 m³/h is outside … –20.0 m³/h").
      if (hp === null) return none("beyond-curve", `${qtExact("flow", q, [curve.flowMin, curve.flowMax])} is outside the pump's curve (${qtLimit("flow", curve.flowMin, [q])}–${qtLimit("flow", curve.flowMax, [q])}) at fixed speed`);
      // Below the system by more than LIMIT_ROUNDING (1 part in 10⁸, the words' digits): further under, the two heads print apart.
      if (hp < hSys * (1 - LIMIT_ROUNDING)) {
        const [gives, system] = qtPair("head", hp, hSys); // never read as equal beside "below"
        return none("beyond-curve", `at ${qt("flow", q)} ${pumpGives} ${gives}, ${fmtPctExact(1 - hp / hSys)} below the system's ${system}: a throttled fixed-speed pump cannot reach this flow`, hp, 1);
      }
      head = hp;
      n = fixedRatio;
      shaft = shaftPowerAt(curve, qc, rho);
      eta = efficiencyAt(curve, qc);
    } else {
      const f = q / qDesign;
      head = mode === "constant-pressure" ? hSet! : mode === "proportional-pressure" ? hSet! * (PROPORTIONAL_ZERO_FLOW + (1 - PROPORTIONAL_ZERO_FLOW) * f) : requireFinite("systemHead", input.systemHead(q));
      // Only under system-curve control (a set point is > 0): gravity drives the flow; the pump is taken as stopped (module comment).
      if (!(head > 0)) {
        return {
          ...base, head: null, speedRatio: 0, efficiency: null, shaftPower: 0, loadFraction: 0, motorEfficiency: null, driveEfficiency: null, electricalPower: 0, energyKWh: 0,
          status: "gravity-flow",
          message: `the system needs ${qt("head", head)} at ${qt("flow", q)}, not above 0: ${input.noHeadReason ? input.noHeadReason(q) : "its static head and pressure difference, less the pipe losses, drive this flow without a pump"} and a valve throttles it to the step's, so the pump is taken as stopped, 0 kWh (assumed: the flow passes the stopped pump or a bypass — check that the stopped pump's and any check valve's loss, not in the system curve, leave enough head to drive it; a pump kept running here is not counted)`,
        };
      }
      if (mode !== "system-curve") {
        // The control curve below the system curve at this flow: not met (see the module comment for why not max(control, system)).
        const hSys = requireFinite("systemHead", input.systemHead(q));
        if (head < hSys * (1 - LIMIT_ROUNDING)) { // as at fixed speed: the two heads print apart
          const fix = mode === "proportional-pressure" ? "raise the set point, or use constant-pressure or system-curve control" : "raise the set point or use system-curve control";
          // Both heads kept apart at their rounding (qtPair), and the shortfall as a percentage (fmtPctExact).
          const [gives, needs] = qtPair("head", head, hSys);
          return none("control-below-system", `the control curve gives ${gives} at ${qt("flow", q)} but the system needs ${needs} there, ${fmtPctExact(hSys / head - 1)} more: the flow cannot reach this step on this control curve — ${fix}`, head);
        }
      }
      const qOn = flowOnCurveEnds(q, curve.flowMin * minSpeed, curve.flowMax * maxSpeed); // a rounding error past an end is the end (stepFlow.ts)
      const sol = speedForDuty(curve, { flow: qOn, head }, { min: minSpeed, max: maxSpeed });
      if (sol.status === "duty-below-limit") {
        // Below the drive's lowest speed the pump is held there and the flow throttled (common practice):
        // the point on the lowest-speed curve at this flow (affinity laws).
        const q1 = flowOnCurveEnds(q / minSpeed, curve.flowMin, curve.flowMax);
        const h1 = q1 >= curve.flowMin && q1 <= curve.flowMax ? headAt(curve, q1) : null;
        if (h1 === null) return none("below-speed-range", `${qt("flow", q)} needs less than the lowest speed ${fmtPctLimit(minSpeed)} and lies off the curve there (at ${fmtPctLimit(minSpeed)} speed it spans ${qt("flow", curve.flowMin * minSpeed)}–${qt("flow", curve.flowMax * minSpeed)})`, head);
        const asked = head;
        head = h1 * minSpeed * minSpeed;
        n = minSpeed;
        lowest = true;
        // Said at the step with its numbers: the energy is at the pump's head at the lowest speed, not the head asked.
        const [gives, needs] = qtPair("head", head, asked);
        warnings.push({ code: "held-at-min-speed", parameter: `profile[${i}]`, message: `at ${Math.round(s.flowFraction * 100)} % flow the drive holds its lowest speed, ${fmtPctLimit(minSpeed)} (common practice, assumed: check the drive's and the pump's minimum speed): ${pumpGives} ${gives} at ${qt("flow", q)}, ${mode === "system-curve" ? "the system needs" : "the control curve asks"} ${needs}, so ${qt("head", head - asked)} is throttled by a valve; the energy is at this speed with the pump's head` });
      } else if (sol.status === "outside-curve" && sol.edge?.at === "end") {
        // Past the curve's end at every on-curve speed: held at the lowest on-curve speed, the surplus throttled (module comment).
        n = sol.edge.ratio;
        const hPump = n * n * headAt(curve, curve.flowMax)!;
        const [gives, needs] = qtPair("head", hPump, head);
        const asks = mode === "system-curve" ? "the system needs" : "the control curve asks";
        throttled = `at ${fmtPct(n)} speed, the lowest where ${qt("flow", q)} is on the curve (its end: ${qt("flow", curve.flowMax)} as published at full speed); ${pumpGives} ${gives}, ${asks} ${needs}: ${qt("head", hPump - head)} throttled by a valve or the system's balancing (common practice: a drive is not run below the speed at which the flow leaves the curve); energy at this speed and flow with the pump's head`;
        head = hPump;
      } else if (sol.status !== "ok" || sol.ratio === null) {
        const asks = mode === "system-curve" ? "the system needs" : "the control curve asks";
        return none("beyond-curve", noSpeedMeets(curve, qOn, head, minSpeed, maxSpeed, asks, pumpGives) ?? `${qt("flow", q)} at ${qt("head", head)}: ${sol.message}`, head);
      } else n = sol.ratio;
      const q1 = Math.min(curve.flowMax, Math.max(curve.flowMin, q / n)); // the full-speed point on the same affinity parabola
      const p1 = shaftPowerAt(curve, q1, rho);
      shaft = p1 === null ? null : p1 * n ** 3;
      eta = efficiencyAt(curve, q1);
    }
    if (shaft === null || !(shaft > 0)) {
      const e = eta;
      if (e !== null && e > 0) shaft = (rho * G0 * q * head) / e;
      else return { ...none("no-power-data", `the curve has no efficiency or power at ${qt("flow", q)}`, head, n) };
    }
    if (eta === null) eta = (rho * G0 * q * head) / shaft;
    const x = shaft / rating;
    // `parameter` names the step (profile[i]), so a page can show the warning at it.
    // (1 part in 10⁸, LIMIT_ROUNDING: a load computed a rounding error below 10 %, as 75 W / 750 W at half speed, is 10 %,
    // and one called below prints apart from it; at 1e-9 "9.99999999 %" of 10 % read "10.0000000 %".)
    if (pastBelow(x, MOTOR_PART_LOAD[0][0])) warnings.push({ code: "motor-very-light-load", parameter: `profile[${i}]`, message: `at ${Math.round(s.flowFraction * 100)} % flow ${theMotor} runs at ${fmtPctExact(x, [MOTOR_PART_LOAD[0][0]])} load: part-load efficiencies below 10 % load are taken at their 10 % values` });
    // Above rating × service factor the motor overloads at this step (a drive run faster than the candidate's set speed,
    // or a flow past the design flow): said with the numbers, the energy still counted at the full-load efficiency.
    // The service factor is a limit, as given (fmtPctLimit: 1.155 → "115.5 %"); the load to its decimals at the least, apart from it.
    const { text: sfText, decimals: sfDecimals } = pctLimitWithDecimals(sf);
    if (!limitCovers(motorLimit(rating, sf), shaft))
      warnings.push({ code: "motor-overload-step", parameter: `profile[${i}]`, message: `at ${Math.round(s.flowFraction * 100)} % flow ${theMotor} runs at ${fmtPctExact(x, [sf], sfDecimals)} load, above its rating × service factor ${sfText}: ${units === 1 ? "the" : "one pump's"} shaft power ${qtExact("power", shaft / units, [(rating / units) * sf])} exceeds ${qtLimit("power", motorLimit(rating / units, sf), [shaft / units])}, so ${units === 1 ? "the" : "each"} motor overloads at this step (its efficiency taken at full load)` });
    // Above the rating but within rating × service factor: not an overload, but the step runs into the service factor for
    // its hours; a service factor is margin for occasional overload, not for continuous running (common practice, from
    // memory of NEMA MG 1's service-factor guidance: running there shortens insulation life). A note, not a failure.
    else if (!limitCovers(rating, shaft))
      warnings.push({ code: "motor-service-factor-step", parameter: `profile[${i}]`, message: `at ${Math.round(s.flowFraction * 100)} % flow ${theMotor} runs at ${fmtPctExact(x, [1, sf], Math.max(1, sfDecimals))} load, above its rating and within rating × service factor ${sfText}: ${units === 1 ? "the" : "one pump's"} shaft power ${qtExact("power", shaft / units, [rating / units])} is above the ${qtLimit("power", rating / units, [shaft / units])} rating for ${Number(s.hours.toFixed(2))} h a year; a service factor is margin for occasional overload, not for continuous running (common practice): a motor of the next rating up is the usual choice` });
    // Off the BEP for the step's hours (stepPor.ts): at a drive's speed the BEP flow scales by it; a fixed-speed curve is as run.
    const por = stepPorWarning({ curve, index: i, flowFraction: s.flowFraction, hours: s.hours, flow: q, speed: vfd ? n : 1, vfd, units, arrangement: input.arrangement, makerMinFlow });
    if (por) warnings.push(por);
    if (zeroFlowHead !== null) warnings.push(...stepDroopWarnings({ curve, index: i, flowFraction: s.flowFraction, flow: q, speed: n, zeroFlowHead, units, fixed: !vfd }));
    const motorEfficiency = etaM * partLoadFactor(MOTOR_PART_LOAD, x);
    const driveEfficiency = etaD === null ? null : etaD * partLoadFactor(DRIVE_PART_LOAD, x);
    const electricalPower = shaft / (motorEfficiency * (driveEfficiency ?? 1));
    return {
      ...base, head, speedRatio: n, efficiency: eta, shaftPower: shaft, loadFraction: x, motorEfficiency, driveEfficiency, electricalPower,
      energyKWh: (electricalPower * s.hours) / 1000, status: throttled ? "throttled-at-min-on-curve-speed" : "ok",
      message: throttled ?? (lowest ? `held at the lowest speed ${fmtPctLimit(n)}, throttled` : vfd ? `${fmtPct(n)} speed` : n === 1 ? "full speed, throttled" : `at its set speed ${fmtPct(n)}, throttled`),
    };
  });
  const { complete, annualEnergyKWh } = cycleTotals(steps, warnings, units);
  markNeverRun(steps, warnings); // a 0 h step's notes: information only (cycleTotals.ts)
  return { mode, steps, totalHours, annualEnergyKWh, complete, setpointHead: hSet, warnings };
}
