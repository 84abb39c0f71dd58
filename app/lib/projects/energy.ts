// Load profile, control mode and life-cycle cost of a system's candidates (issue 17, items 3–4). Pure: the server renders
// with it, the live preview and the selection report read its output. The engine does the physics (app/engine/dutyCycle.ts,
// lifeCycleCost.ts); this file picks the inputs out of the system document and the evaluated candidate (its maker's minimum flow too).
import { currencyDigits } from "../shared/money";
import * as v from "valibot";
import {
  CIRCULATOR_PROFILE_SOURCE,
  CONTROL_MODES,
  DEFAULT_DRIVE_EFFICIENCY,
  defaultCirculatorProfile,
  dutyCycleEnergy,
  PARALLEL_STAGING_RULE,
  stagedDutyCycleEnergy,
  EngineInputError,
  MAX_FLOW_FRACTION,
  PART_LOAD_SOURCE,
  prepareSystem,
  COUNTED_STEP_STATUSES,
  systemHeadFunction,
  type ControlMode,
  type DutyCycleResult,
  type DutyStep,
  type LifeCycleResult,
} from "~/engine";
import { LIMIT_ROUNDING, fmtPct, fmtPctLimit, fmtPctSignedExact, groupThousands } from "~/engine/quantityText";
import { stagedNpshWarnings } from "./staging-npsh";
import { lccRangeNote } from "./lcc-range-note";
import { lccOrReason } from "./lcc-or-reason";
import { DISCOUNT_RANGE, ESCALATION_RANGE, rateKept, rateRefusal, rateTaken, type RateRange } from "./lcc-ranges";
import { neverRunMarked } from "~/engine/cycleTotals";
import { HOURS_IN_YEAR, stepPastYear, stepsOverYear, yearHoursRefusal } from "./year-hours";
export { HOURS_PER_YEAR_MAX, stepPastYear, stepsOverYear } from "./year-hours";
import { decimalMessage, readDecimal } from "../shared/decimal";
import { noHeadClause } from "./duty-check";
import { minFlowOnCycle } from "./verdict-min-flow";
import { cycleCurves, npshrOnCycle, withPublishedNpshr } from "./cycle-curve";
import type { NpshrPublished } from "./npshr-reach";
import type { SystemInput } from "./system-input";

const CONTROL_IDS = CONTROL_MODES.map((m) => m.id) as [ControlMode, ...ControlMode[]];
const num = (label: string) => v.pipe(v.number(`${label} must be a number.`), v.finite(`${label} must be a finite number.`));

export const MAX_PROFILE_STEPS = 8;
/** Life-cycle years: a whole number from MIN_LCC_YEARS to MAX_LCC_YEARS (the form reads its count to these). */
export const MIN_LCC_YEARS = 1;
export const MAX_LCC_YEARS = 50;

/** A life-cycle rate in the schema: the form's words (lcc-ranges.ts) for every refusal. */
const rate = (r: RateRange) => {
  const words = (i: { input: unknown }) => rateRefusal(r, typeof i.input === "number" ? i.input : null);
  return v.pipe(v.number(words), v.check((x) => rateTaken(r, x), words), v.transform((x) => rateKept(r, x)));
};

/** A step's flow outside 0 to 150 % of the duty, with the one sent (fraction; grouped as every range's ends; a negative one too
 * small for a per cent's decimals in exponent form, "not −1.00e-7 %", quantityText.ts `fmtPctExact`). */
const stepFlowRefusal = (x: number) =>
  `A step's flow must be from 0 % (no demand, the pump stopped) to ${fmtPctLimit(MAX_FLOW_FRACTION)} of the duty flow, not ${groupThousands(fmtPctSignedExact(x, [x < 0 ? 0 : MAX_FLOW_FRACTION]))}.`;
/** Life-cycle years not a whole number from MIN_LCC_YEARS to MAX_LCC_YEARS, with the years sent. */
const yearsRefusal = (x: number) => `Years (life-cycle cost) must be a whole number from ${MIN_LCC_YEARS} to ${MAX_LCC_YEARS}, not ${groupThousands(String(x))}.`;

export const DutyStepSchema = v.object({
  // 0 %: hours with the system at zero demand, the pump stopped (engine dutyCycle.ts `no-demand`).
  // 150 % to 1 part in 10⁸ (LIMIT_ROUNDING), taken as 150 %: a fraction refused prints apart from the limit beside it (1.5 +
  // 1e-9 was refused as "… to 150 % of the duty flow, not 150.000000 %").
  flowFraction: v.pipe(
    num("Flow fraction"),
    v.check((x) => x >= 0 && x <= MAX_FLOW_FRACTION * (1 + LIMIT_ROUNDING), (i) => stepFlowRefusal(i.input)),
    v.transform((x) => Math.min(x, MAX_FLOW_FRACTION)),
  ),
  hours: v.pipe(num("Hours"), v.check((x) => x >= 0 && x <= HOURS_IN_YEAR, (i) => yearHoursRefusal("Hours of a step", i.input))),
});

export const EnergySettingsSchema = v.pipe(
  v.object({
    control: v.picklist(CONTROL_IDS, "Unknown control mode."),
    /** Null: the common-practice circulator profile over the system's operating hours. */
    profile: v.nullable(v.pipe(v.array(DutyStepSchema), v.minLength(1, "Give at least one step, or use the common-practice profile."), v.maxLength(MAX_PROFILE_STEPS, `At most ${MAX_PROFILE_STEPS} steps.`))),
    /** Life-cycle cost: years, tariff escalation and discount rate per year (fractions). */
    years: v.pipe(num("Years"), v.check((x) => Number.isInteger(x) && x >= MIN_LCC_YEARS && x <= MAX_LCC_YEARS, (i) => yearsRefusal(i.input))),
    escalation: rate(ESCALATION_RANGE),
    discountRate: rate(DISCOUNT_RANGE),
  }),
  v.rawCheck(({ dataset, addIssue }) => {
    if (!dataset.typed || !dataset.value.profile) return;
    const s = dataset.value;
    const profile = s.profile!;
    const k = stepPastYear(profile);
    if (k < 0) return;
    // On the hours of the step where the running total passes the year (the form's field), not on the control mode.
    addIssue({
      message: stepsOverYear(profile, k),
      path: [
        { type: "object", origin: "value", input: s, key: "profile", value: profile },
        { type: "array", origin: "value", input: profile, key: k, value: profile[k] },
        { type: "object", origin: "value", input: profile[k], key: "hours", value: profile[k].hours },
      ],
    });
  }),
);

export type EnergySettings = v.InferOutput<typeof EnergySettingsSchema>;

/** Example values, to be set per project: 15 years, tariff +3 %/year, discount 5 %/year (common practice orders of magnitude). */
export const DEFAULT_ENERGY_SETTINGS: EnergySettings = { control: "fixed-speed", profile: null, years: 15, escalation: 0.03, discountRate: 0.05 };

type InputLike = {
  /** The system's mode and pressure difference (Pa): what a step needing no pump head names as its cause (duty-check.ts). */
  mode: SystemInput["mode"];
  pressureDifference: number;
  /** The liquid (its name in the viscosity note of a cycle under a drive). */
  fluid?: SystemInput["fluid"];
  hoursPerYear: number;
  tariffPerKWh: number;
  duty: { flow: number; head: number } | null;
  energy?: EnergySettings;
  /** Suction (Pa absolute, m) and the wanted NPSHa / NPSHr: NPSH at a staged step with fewer pumps running (staging-npsh.ts); absent: not judged. */
  suctionSurfacePressure?: number;
  suctionStaticHead?: number;
  npshMargin?: number;
};

/** The profile in use, with where it comes from. */
export function profileOf(input: InputLike): { steps: DutyStep[]; source: "user" | "common-practice"; label: string } {
  const s = input.energy ?? DEFAULT_ENERGY_SETTINGS;
  if (s.profile) return { steps: s.profile, source: "user", label: "Load profile given for this system" };
  return { steps: defaultCirculatorProfile(input.hoursPerYear), source: "common-practice", label: `${CIRCULATOR_PROFILE_SOURCE}, over the system's ${input.hoursPerYear} operating hours` };
}

export type CandidateEnergy = {
  control: ControlMode;
  controlLabel: string;
  profileSource: "user" | "common-practice";
  profileLabel: string;
  cycle: DutyCycleResult | null;
  /** Why the cycle could not be computed (no duty, no motor, bad curve…). */
  cycleError: string | null;
  /** Energy cost per year over the cycle (currency). */
  annualCost: number | null;
  purchasePrice: number | null;
  lcc: LifeCycleResult | null;
  /**
   * What is not given for an energy cost (blank or 0 operating hours, blank or 0 tariff), or why none can be counted
   * (no step of the cycle with hours counted: `noStepCounted`), or null. When set, no energy cost is counted and no
   * life-cycle cost is given. Absent in selections frozen before 2026-12-02.
   */
  costMissing?: string | null;
  /** Beside the life-cycle cost: its priced steps outside the allowable flow range (lcc-range-note.ts); absent: frozen before. */
  lccRangeNote?: string | null;
  assumptions: string[];
};

type EvaluatedLike = {
  /** serviceFactor: the motor's, for the overload warning at a step. */
  adjustment: { method: "none" | "speed" | "trim"; arrangement: "single" | "parallel" | "series"; dutyPumps: number; serviceFactor: number };
  result: {
    ratio: number;
    curve: { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null }[];
    operating: { flow: number; head: number } | null;
    /** bepFlow, bepHead: the BEP the figures name, which the cycle's POR notes judge against (cycle-curve.ts). */
    figures: { motor: { rating: number | null; efficiency: number | null }; bepFlow?: number | null; bepHead?: number | null } | null;
    /** ANSI/HI 9.6.7 B at the candidate's speed and how the curve stands on the liquid (hydraulics.ts; absent: water). */
    viscosityB?: number | null;
    viscosity?: { status: string } | null;
    /** Where one pump's NPSHr is published (npshr-reach.ts): the words of a staged step whose share has none (staging-npsh.ts). */
    npsh?: { npshrPublished?: NpshrPublished | null } | null;
  } | null;
};

/**
 * Energy over the system's duty cycle and the life-cycle cost of one evaluated candidate.
 * @param systemSpec the engine's system (for its head at each flow), from hydraulics' `systemSpec(input)`
 * @param density fluid density, kg/m³
 * @param purchasePriceCents the candidate's purchase price in cents (null: not given)
 */
export function candidateEnergy(
  input: InputLike,
  systemSpec: Parameters<typeof prepareSystem>[0],
  density: number,
  c: EvaluatedLike,
  purchasePriceCents: number | null,
): CandidateEnergy {
  const s = input.energy ?? DEFAULT_ENERGY_SETTINGS;
  const mode = CONTROL_MODES.find((m) => m.id === s.control) ?? CONTROL_MODES[0];
  const prof = profileOf(input);
  const purchasePrice = purchasePriceCents == null ? null : purchasePriceCents / 100;
  const out: CandidateEnergy = {
    control: mode.id,
    controlLabel: `${mode.label}: ${mode.relation} (${mode.source})`,
    profileSource: prof.source,
    profileLabel: prof.label,
    cycle: null,
    cycleError: null,
    annualCost: null,
    purchasePrice,
    lcc: null,
    costMissing: null,
    lccRangeNote: null,
    assumptions: [
      "Affinity laws for speed (Q ∝ N, H ∝ N², P ∝ N³; pump efficiency constant along the affinity parabola).",
      `Motor and drive losses at part load: ${PART_LOAD_SOURCE}.`,
      `Drive rated efficiency ${(DEFAULT_DRIVE_EFFICIENCY * 100).toFixed(0)} % (common practice, from memory) wherever a drive runs.`,
    ],
  };
  const r = c.result;
  const rating = r?.figures?.motor.rating ?? null;
  const etaM = r?.figures?.motor.efficiency ?? null;
  const designFlow = input.duty?.flow ?? r?.operating?.flow ?? null;
  if (!r || !r.operating) out.cycleError = "no operating point on the system: no duty cycle";
  else if (rating == null || etaM == null) out.cycleError = "no motor rating or efficiency: no duty cycle";
  else if (designFlow == null) out.cycleError = "no duty flow: no duty cycle";
  else {
    try {
      // The curve as set, and one pump's in parallel, with the figures' BEP (cycle-curve.ts). A VFD may run up to the pump's
      // full speed, or up to the candidate's set speed where it is set above its curve's (a typed ratio up to 1.2, the speed
      // its own figures meet the duty at): a speed setting is undone (affinity laws), so speeds are fractions of the curve's speed.
      const { curve, one } = cycleCurves({ adjustment: c.adjustment, result: r }, density, mode.vfd);
      const overspeed = mode.vfd && c.adjustment.method === "speed" && r.ratio > 1 ? r.ratio : undefined;
      if (overspeed) out.assumptions.push(`The drive runs the pump up to the candidate's set speed, ${fmtPct(overspeed)} of its curve's (the speeds of the duty cycle are fractions of the curve's speed).`);
      const pumps = c.adjustment.arrangement === "single" ? 1 : c.adjustment.dutyPumps;
      const drive = mode.vfd || c.adjustment.method === "speed" ? DEFAULT_DRIVE_EFFICIENCY : null;
      const prepared = prepareSystem(systemSpec);
      const sysHead = systemHeadFunction(prepared);
      // A step needing no pump head names its cause with the system's parts on the design curve (the one the cycle runs on).
      const noHeadReason = (q: number) => noHeadClause(input, prepared, q, "this flow", {});
      const common = { systemHead: sysHead, designFlow, mode: mode.id, profile: prof.steps, density, driveEfficiency: drive, noHeadReason, maxSpeedRatio: overspeed,
        fixedSpeedRatio: !mode.vfd && c.adjustment.method === "speed" && r.ratio > 0 ? r.ratio : undefined, makerMinFlow: minFlowOnCycle(r, mode.vfd, c.adjustment.method) };
      // Pumps in parallel are staged by demand (engine dutyStaging.ts) on one pump's curve: the combined curve's flows and
      // powers shared equally (combinePumps); in series every duty pump runs at every step.
      if (c.adjustment.arrangement === "parallel" && pumps > 1) {
        out.assumptions.push(`${PARALLEL_STAGING_RULE}.`);
        out.cycle = stagedDutyCycleEnergy({ ...common, pumpCurve: one!, dutyPumps: pumps, motor: { rating, efficiency: etaM, serviceFactor: c.adjustment.serviceFactor } });
        // One pump alone at the larger share Q/k needs more NPSH: judged at each step with fewer pumps running.
        if (input.suctionSurfacePressure != null && input.suctionStaticHead != null && input.npshMargin != null) {
          // One pump's NPSHr off the published points at the cycle's speed, not off the rebuilt samples (cycle-curve.ts).
          const published = npshrOnCycle({ adjustment: c.adjustment, result: r }, mode.vfd);
          out.cycle.warnings.push(...stagedNpshWarnings({ cycle: out.cycle, pumpCurve: withPublishedNpshr(one!, published), prepared, suction: { surfacePressure: input.suctionSurfacePressure, staticHead: input.suctionStaticHead }, requiredMargin: input.npshMargin, npshrPublished: published }));
        }
      } else out.cycle = dutyCycleEnergy({ ...common, curve, motor: { rating: rating * pumps, efficiency: etaM, serviceFactor: c.adjustment.serviceFactor, units: pumps }, arrangement: c.adjustment.arrangement === "series" && pumps > 1 ? "series" : undefined });
      const visc = viscousNote(input, r, c.adjustment.method, out.cycle);
      if (visc) out.assumptions.push(visc);
      // Blank hours and tariff are stored as 0 (system-form.ts), and 0 h or 0 per kWh is read as "not given", as the
      // candidate's figures read 0 h (candidate-judgement.ts): a purchase price alone is no life-cycle cost.
      const missing = [
        out.cycle.totalHours > 0 ? null : prof.source === "common-practice" ? "no operating hours given (blank or 0 h per year)" : "the load profile's steps have no hours",
        input.tariffPerKWh > 0 ? null : "no energy tariff given (blank or 0 per kWh)",
        noStepCounted(out.cycle),
      ].filter((x): x is string => x !== null);
      out.costMissing = missing.length > 0 ? missing.join("; ") : null;
      if (out.costMissing === null) {
        // A period or rate the engine refuses: the cycle stands, the reason is the cost's (lcc-or-reason.ts).
        const lcc = lccOrReason({ purchasePrice, annualEnergyKWh: out.cycle.annualEnergyKWh, tariffPerKWh: input.tariffPerKWh, years: s.years, escalation: s.escalation, discountRate: s.discountRate });
        if (typeof lcc === "string") out.costMissing = lcc;
        else {
          out.annualCost = out.cycle.annualEnergyKWh * input.tariffPerKWh;
          out.lcc = lcc;
          out.lccRangeNote = lccRangeNote(out.cycle);
        }
      }
    } catch (e) {
      if (!(e instanceof EngineInputError)) throw e;
      out.cycleError = e.message;
    }
  }
  return out;
}

/**
 * On a viscous liquid under a drive: the curve corrected (ANSI/HI 9.6.7) at the candidate's speed is taken to each step's
 * speed by the affinity laws, B not worked out again; B ∝ N^−0.5 along the affinity parabola (B ∝ H^0.0625 / (Q^0.375 ·
 * N^0.25), H ∝ N², Q ∝ N), so the slowest counted step's B is said with its numbers. Null on water, where no step runs
 * below the candidate's speed, or where the curve was not judged by B (no BEP, outside the method: their own warnings).
 */
function viscousNote(input: InputLike, r: NonNullable<EvaluatedLike["result"]>, method: EvaluatedLike["adjustment"]["method"], cycle: DutyCycleResult): string | null {
  const b = r.viscosityB;
  const status = r.viscosity?.status;
  if (b == null || !(b > 0) || (status !== "corrected" && status !== "no-correction") || cycle.mode === "fixed-speed") return null;
  const ref = method === "speed" && r.ratio > 0 ? r.ratio : 1; // the speed B was worked out at, a fraction of the curve's
  const speeds = cycle.steps.filter((s) => (COUNTED_STEP_STATUSES as readonly string[]).includes(s.status) && s.speedRatio != null && s.speedRatio > 0).map((s) => s.speedRatio!);
  const slowest = speeds.length > 0 ? Math.min(...speeds) : null;
  if (slowest === null || !(slowest < ref)) return null;
  const bStep = b * (ref / slowest) ** 0.5;
  if (status === "no-correction" && !(bStep > 1)) return null;
  const liquid = input.fluid?.kind === "custom" ? input.fluid.name || "the custom liquid" : "the liquid";
  const curveWords = status === "corrected" ? "the curve as corrected for viscosity (ANSI/HI 9.6.7)" : "the water curve, which needs no viscosity correction (ANSI/HI 9.6.7, B ≤ 1)";
  return `On ${liquid}, ${curveWords} at the candidate's speed, B = ${b.toFixed(2)}, is taken to each step's speed by the affinity laws; B is not worked out again at each speed: it grows as the speed falls (B ∝ N^−0.5 along the affinity parabola), to ${bStep.toFixed(2)} at the slowest step's ${(slowest * 100).toFixed(1)} % speed, where the correction, and the energy, may be larger than shown.`;
}

/** A duty cycle as computed or frozen: its steps and the engine's warnings (frozen before warnings named their step: no `parameter`). */
type CycleNotes = { steps?: readonly unknown[]; warnings?: readonly { parameter?: string | null; code?: string | null; message: string }[] };

/**
 * How a step that is not "ok" reads at the step: stopped at 0 % flow (no demand, 0 kWh, counted); met with the pump stopped (no pump head needed, 0 kWh, counted; the step's
 * message names the cause — gravity, the pressure difference or both),
 * met at the lowest speed that keeps the flow on the curve with the surplus head throttled (counted), not computed (no
 * data) or not met (the pump or the control cannot reach it) — said with its 0 h where it has none, as the totals count it.
 */
export function stepVerdict(s: { status: string; hours?: number }): string {
  if (s.status === "ok") return "";
  if (s.status === "gravity-flow") return "met, no pump head needed, pump stopped";
  if (s.status === "no-demand") return "stopped, no demand";
  if (s.status === "throttled-at-min-on-curve-speed") return "met, throttled at the lowest on-curve speed";
  const v = s.status === "no-power-data" ? "not computed" : "not met";
  // A step of 0 h never runs: its energy is not missing from the totals, which count it as complete (cycleTotals.ts).
  return s.hours === 0 ? `${v}, at 0 h a year: never run, so nothing is missing from the totals` : v;
}

/** "1 of 2": the duty pumps running at a step of pumps in parallel staged by demand (engine dutyStaging.ts); "" at any other step. */
export const pumpsRunningText = (s: { pumpsRunning?: number; dutyPumps?: number }): string =>
  s.pumpsRunning == null || s.dutyPumps == null ? "" : `${s.pumpsRunning} of ${s.dutyPumps}`;

/** The steps with hours whose energy is missing from the total: not met, and not computed (no power data). */
export function missingSteps(cycle: { steps: readonly { status: string; hours: number }[] }): { notMet: number; notComputed: number } {
  const missing = cycle.steps.filter((s) => !(COUNTED_STEP_STATUSES as readonly string[]).includes(s.status) && s.hours > 0);
  const notComputed = missing.filter((s) => s.status === "no-power-data").length;
  return { notMet: missing.length - notComputed, notComputed };
}

/** Why a cycle is incomplete, in the words its steps use: "1 of 4 steps not met", "2 of 4 steps not met, 1 not computed", "1 of 4 steps not computed". */
export function missingStepsText(cycle: { steps: readonly { status: string; hours: number }[] }): string {
  const { notMet, notComputed } = missingSteps(cycle);
  const of = `of ${cycle.steps.length} step${cycle.steps.length === 1 ? "" : "s"}`;
  if (notMet > 0) return `${notMet} ${of} not met${notComputed > 0 ? `, ${notComputed} not computed` : ""}`;
  return `${notComputed} ${of} not computed`;
}

/**
 * Why a cycle's energy is not computed at all: it has hours, but no step with hours was counted (each not met or not
 * computed), so its total is 0 kWh of nothing and a life-cycle cost on it is the purchase price alone:
 * "no step of the duty cycle counted (1 of 1 step not met)"; null when a step with hours was counted, or when the cycle
 * has no hours (that reason is `costMissing`'s own).
 */
export function noStepCounted(cycle: { totalHours: number; steps: readonly { status: string; hours: number }[] } | null | undefined): string | null {
  if (!cycle || !(cycle.totalHours > 0)) return null;
  const counted = cycle.steps.some((s) => (COUNTED_STEP_STATUSES as readonly string[]).includes(s.status) && s.hours > 0);
  return counted ? null : `no step of the duty cycle counted (${missingStepsText(cycle)})`;
}

/** The life-cycle cost to show: none where no step was counted (`noStepCounted`; selections frozen before kept one). */
export const lccShown = (e: { lcc: LifeCycleResult | null; cycle: CandidateEnergy["cycle"] } | null | undefined): LifeCycleResult | null =>
  e?.lcc && !noStepCounted(e.cycle) ? e.lcc : null;

/**
 * The life-cycle cost's note on its priced steps outside the allowable flow range (lcc-range-note.ts), or null: as kept with
 * the energy (flows as tokens, rendered with it), else worked out again from a cycle frozen before (its notes' ratios).
 */
export const lccRangeNoteOf = (e: Pick<CandidateEnergy, "lccRangeNote" | "cycle"> & { lcc: LifeCycleResult | null } | null | undefined): string | null =>
  !e || !lccShown(e) ? null : e.lccRangeNote !== undefined ? e.lccRangeNote : lccRangeNote(e.cycle);

/** A life-cycle cost's period: "1 year", "15 years". */
export const lccYears = (lcc: Pick<LifeCycleResult, "yearly">): string => `${lcc.yearly.length} year${lcc.yearly.length === 1 ? "" : "s"}`;

/**
 * The life-cycle cost's period and the rates it rests on, as typed: "over 15 years at a tariff escalation of +3 %/year and
 * a discount rate of 5 %/year"; the period alone for a cost frozen before the rates were kept with it.
 */
export function lccRatesText(lcc: Pick<LifeCycleResult, "yearly" | "escalation" | "discountRate">): string {
  const years = `over ${lccYears(lcc)}`;
  if (lcc.escalation == null || lcc.discountRate == null) return years;
  const e = lcc.escalation;
  return `${years} at a tariff escalation of ${e < 0 ? "−" : "+"}${fmtPctLimit(Math.abs(e))}/year and a discount rate of ${fmtPctLimit(lcc.discountRate)}/year`;
}

/** The warnings about step `i` of a cycle (motor below 10 % load, …): their messages (`parameter` "profile[i]", engine dutyCycle.ts). */
export function stepWarnings(cycle: CycleNotes, i: number): string[] {
  const hours = (cycle.steps?.[i] as { hours?: number } | undefined)?.hours;
  // A step of 0 h: every note marked as information only (engine `neverRunMarked`; once, also for cycles frozen before the mark).
  return (cycle.warnings ?? []).filter((w) => w.parameter === `profile[${i}]`).map((w) => neverRunMarked(w.message, hours));
}

/**
 * The warnings about no single step (those of cycles frozen before warnings named their step included). The
 * incomplete-cycle warning is left out: the totals say it with their "(incomplete: …)" mark.
 */
export function cycleWarnings(cycle: CycleNotes): string[] {
  return (cycle.warnings ?? []).filter((w) => w.code !== "cycle-incomplete" && !/^profile\[\d+\]$/.test(w.parameter ?? "")).map((w) => w.message);
}

/**
 * A typed purchase price → integer cents (null: blank, which clears it), through the forms' strict reader
 * (shared/decimal.ts: 1,500 is refused as ambiguous; thousands may be grouped only by spaces, 2 450,50).
 * Not a number, negative or absurd (over 10¹² in the user's currency), or with more decimals than the currency's minor
 * unit (JPY none, EUR 2: `currencyDigits`) or than the hundredths it is kept in (BHD's third): the message for the
 * field — never a price kept as typed and shown rounded (12.50 JPY shown as 13 JPY), nor rounded on the way in.
 * @param currency the workspace's currency (ISO 4217; "" when not set: 2 decimals)
 */
export function readPriceCents(raw: FormDataEntryValue | null, currency = ""): { cents: number | null; error?: undefined } | { cents?: undefined; error: string } {
  const r = readDecimal(raw, { spaceGroups: true });
  if (r.kind === "blank") return { cents: null };
  if (r.kind === "bad" && r.grouped) return { error: "The purchase price must be a number with one decimal point or comma; group thousands with spaces only (2 450,50)." };
  if (r.kind !== "number") return { error: decimalMessage(r, "the purchase price") };
  if (r.value < 0 || r.value > 1e12) return { error: "The purchase price is a number ≥ 0 (blank clears it)." };
  const digits = Math.min(currencyDigits(currency), 2); // stored in hundredths (candidates.purchase_price_cents)
  const scaled = r.value * 10 ** digits;
  if (Math.abs(scaled - Math.round(scaled)) > 1e-6 * Math.max(1, scaled)) {
    const what = currency.trim() ? `${currency.trim().toUpperCase()} prices` : "Prices";
    return { error: digits === 0 ? `${what} are whole numbers here: ${r.value} has decimals.` : `${what} are kept to ${digits} decimals here: ${r.value} has more.` };
  }
  return { cents: Math.round(r.value * 100) };
}
