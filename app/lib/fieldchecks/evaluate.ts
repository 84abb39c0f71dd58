// The field check itself, pure: readings against a frozen selection → the delivered duty point,
// deviations, a verdict against a labelled tolerance grade and plain hints. No database, no Node
// API: the server runs it when a check is recorded, the phone runs it offline (same numbers).
import {
  AFFINITY_SPEED_RANGE,
  createPumpCurve,
  EngineInputError,
  efficiencyAt,
  fieldCheck,
  G0,
  gradePowerWithinAccuracy,
  headAt,
  gradeWithinUncertainty,
  sampleCurve,
  scaleBySpeed,
  scaleByTrim,
  STANDARD_ATMOSPHERE,
  TOLERANCE_GRADES,
  withinGrade,
  type FieldCheckResult,
  type GradePowerWitness,
  type GradeWitness,
  type PumpCurve,
  type ToleranceGrade,
} from "~/engine";
import { fluidOf, toPumpPoints, type Adjustment, type evaluateCandidate, type evaluateSystem, type SystemInput } from "../projects/hydraulics";
import { inputPowerW, speedRpm, VERDICT_TEXT, type Readings, type Verdict } from "./form";
import { powerGradeOf, powerGradeSummary } from "./power-grade";
import { curveOnLiquid } from "./liquid-curve";
import { crossingOff, crossingOffJudged, crossingOffNoVerdict, curveEndJudgedNote, curveEndNoVerdict, curveEndOf, PUBLISHED_PART } from "./curve-ends";
import type { CheckResult, Pt } from "./result";
import { crossMissWords, crossSummary } from "./cross";
import { suctionAtVapour } from "./suction-vapour";
import { powerLimitsTooWide, uncertaintyMessage, uncertaintyNoVerdict, uncertaintyTooWide } from "./uncertainty-bound";
import { fmtNumExact, fmtPctExact, fmtPctLimit, qt } from "~/engine/quantityText";
import { pctAsTyped } from "../shared/format";

/** Measured speed / the curve's speed within which a check is judged: the engine's affinity range (about 50–120 %). */
export const SPEED_RANGE = AFFINITY_SPEED_RANGE;

/**
 * A measured speed in rpm (number only) with the decimals that keep it apart from the ends of the range the curve may be
 * translated in (the no-verdict warning's numbers) and from `others`: 1449.7 rpm of a 2900 rpm curve reads "1449.7", not
 * "1450" (50 %, inside); a speed well inside reads to the whole rpm.
 * @param measured the measured speed, rpm
 * @param rated the curve's speed, rpm (null: no range)
 * @param others other speeds printed beside it, rpm
 */
export function measuredRpmText(measured: number, rated: number | null, others: readonly (number | null)[] = []): string {
  return fmtNumExact(measured, [...(rated !== null ? SPEED_RANGE.map((f) => f * rated) : []), ...others], 0);
}

export const FIELD_CHECK_FORMAT = "dutymark-fieldcheck/1";

/**
 * The parts of a frozen selection (projects' `FrozenSelection`, which fits this shape) that a check
 * reads: spelled out here so this module imports no server module and runs on the phone.
 */
export type FrozenSelection = {
  system: { input: SystemInput };
  systemCurve: ReturnType<typeof evaluateSystem> | null;
  pump: { label?: string; speed: number | null; impellerDiameter: number | null; points: Parameters<typeof toPumpPoints>[0] };
  adjustment: Adjustment;
  result: ReturnType<typeof evaluateCandidate>;
};

/** The tolerance grade of that id (ISO 9906 grades, `TOLERANCE_GRADES` in the engine), or null. */
export function gradeById(id: string): ToleranceGrade | null {
  return TOLERANCE_GRADES.find((g) => g.id === id) ?? null;
}

/** One pump's curve as selected (trim applied; speed ratio returned separately). */
function selectedCurve(f: FrozenSelection): { base: PumpCurve; trimmed: PumpCurve; designRatio: number } {
  const base = createPumpCurve({ points: toPumpPoints(f.pump.points), speed: f.pump.speed ?? undefined, impellerDiameter: f.pump.impellerDiameter ?? undefined, riseTolerance: 1 });
  const ratio = f.result?.ratio ?? 1;
  if (f.adjustment.method === "trim" && ratio !== 1) return { base, trimmed: scaleByTrim(base, ratio).curve, designRatio: 1 };
  return { base, trimmed: base, designRatio: f.adjustment.method === "speed" ? ratio : 1 };
}

function sample(c: PumpCurve, rho: number) {
  const s = sampleCurve(c, 41, rho);
  return {
    head: s.flows.map((q, i) => ({ flow: q, y: s.head[i] })),
    eff: s.flows.map((q, i) => ({ flow: q, y: s.efficiency[i] })).filter((p): p is Pt => p.y != null),
  };
}

/**
 * Verdict against one grade. Flow meter: pass if the point is within the grade of the curve at the
 * measured speed; marginal if not, but some point within the reading uncertainty (head ± gauge
 * accuracy, flow ± meter accuracy) is (solved over the whole box: `gradeWithinUncertainty`); fail
 * otherwise. No flow meter: unknown. With a marginal verdict comes the point that meets the grade. (`evaluateCheck` then
 * gives no tolerance verdict instead of a marginal one where the readings' uncertainty is wider than the grade's own
 * tolerance: uncertainty-bound.ts.)
 * Then the grade's power and efficiency limits, where the engine judged them (`e.grades`, from a measured shaft
 * power; power-grade.ts): a limit missed as read makes it a fail, whatever flow and head say — unless the power
 * reading's accuracy was entered and some power within it meets them (`powerWithin`, the engine's
 * `gradePowerWithinAccuracy`): then the check is at most marginal (a pass on flow and head becomes marginal). The power
 * limits are judged at the flow and head as read, not over their uncertainty box (why: gradePower.ts, at that function).
 * @param powerWithin where the power limits are missed as read: a shaft power within the reading's accuracy that meets them, or null (none, or no accuracy entered)
 */
export function verdictFor(curve: PumpCurve, grade: ToleranceGrade, e: FieldCheckResult, flowAccuracy: number, headUncertainty: number, powerWithin: GradePowerWitness | null = null): { verdict: Verdict; within: GradeWitness | null } {
  if (e.flowSource !== "measured" || e.flow === null) return { verdict: "unknown", within: null };
  const powerMissed = e.grades.find((g) => g.id === grade.id)?.power?.pass === false;
  if (powerMissed && !powerWithin) return { verdict: "fail", within: null };
  const q = e.flow;
  const h = e.tdh;
  if (h > 0 && withinGrade(curve, q, h, grade)) return { verdict: powerMissed ? "marginal" : "pass", within: null };
  if (headUncertainty > 0 || flowAccuracy > 0) {
    const box = { flow: [q * (1 - flowAccuracy), q * (1 + flowAccuracy)], head: [h - headUncertainty, h + headUncertainty] } as const;
    const within = gradeWithinUncertainty(curve, box, grade);
    if (within) return { verdict: "marginal", within };
  }
  return { verdict: "fail", within: null };
}

/** A head deviation from the curve (fraction) within which the head is on it: the tolerance cross's allowance for rounding. */
const ON_CURVE = 1e-12;

/** Usual causes, worded as things to check — never a diagnosis. */
function hintsFor(r: { verdict: Verdict; deviation: CheckResult["deviation"]; speed: CheckResult["speed"]; engine: FieldCheckResult; delivered: CheckResult["delivered"] }): string[] {
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

/** The delivered duty point and verdict from readings against a frozen selection (SI in, SI out). */
export function evaluateCheck(f: FrozenSelection, readings: Readings, gradeId: string): CheckResult {
  const grade = gradeById(gradeId);
  if (!grade) throw new EngineInputError("grade", `unknown tolerance grade "${gradeId}"`);
  const fluid = fluidOf({ ...f.system.input, temperatureC: readings.temperatureC });
  const rho = fluid.density;
  const warnings: string[] = [];
  const { trimmed, designRatio } = selectedCurve(f);
  const rated = f.pump.speed ?? null;
  const design = rated !== null ? rated * designRatio : null;
  const measured = speedRpm(readings.speed);
  const designCurve = designRatio !== 1 ? scaleBySpeed(trimmed, designRatio).curve : trimmed;
  let curve = designCurve;
  let rescaled = false;
  if (measured !== null && rated !== null) {
    const s = scaleBySpeed(trimmed, measured / rated);
    curve = s.curve;
    rescaled = true;
    warnings.push(...s.warnings.map((w) => w.message));
  } else if (measured !== null) warnings.push("The pump curve has no rated speed, so it could not be rescaled to the measured speed: compared at the selected curve as stored.");
  else warnings.push("No speed entered: compared with the curve at the selection's design speed.");
  // On a viscous custom liquid: the curve corrected as the selection's figures were (or no curve to hold the pump to).
  const onLiquid = curveOnLiquid(curve, f.system.input.fluid, fluid.kinematicViscosity, measured ?? design);
  curve = onLiquid.curve;
  if (onLiquid.note) warnings.push(onLiquid.note);
  if (readings.speed.mode === "vfd") warnings.push("Speed from the drive frequency: base speed × frequency / base frequency (the motor's slip is taken as at the nameplate).");

  // Both gauges on the gauge reference; an absolute reading is taken relative to the standard atmosphere.
  const asGauge = (g: Readings["suction"]) => (g.reference === "absolute" ? g.pressure - STANDARD_ATMOSPHERE : g.pressure);
  const mixed = readings.suction.reference !== readings.discharge.reference;
  if (mixed) warnings.push(`One gauge is absolute and the other is gauge: the absolute reading was taken relative to the standard atmosphere (${qt("pressure", 101325)}); local barometric pressure differs.`);
  const ps = asGauge(readings.suction);
  const pd = asGauge(readings.discharge);

  const n = f.adjustment.arrangement === "single" ? 1 : f.adjustment.dutyPumps;
  const dutyAll = f.system.input.duty ?? f.result?.operating ?? null;
  const duty = dutyAll
    ? { flow: f.adjustment.arrangement === "parallel" ? dutyAll.flow / n : dutyAll.flow, head: f.adjustment.arrangement === "series" ? dutyAll.head / n : dutyAll.head }
    : null;
  if (n > 1) warnings.push(`The selection runs ${n} pumps in ${f.adjustment.arrangement}: readings are judged against one pump's curve and one pump's share of the duty.`);

  const input = inputPowerW(readings.power);
  const motorEff = readings.power.mode === "none" ? null : readings.power.motorEfficiency;
  const shaft = input !== null && motorEff !== null ? input * motorEff : null;

  const runEngine = (measuredPower: number | undefined) => fieldCheck({
    curve,
    fluid,
    suction: { pressure: ps, elevation: readings.suction.elevation, pipeDiameter: readings.suction.diameter, accuracy: readings.suction.accuracy ?? undefined },
    discharge: { pressure: pd, elevation: readings.discharge.elevation, pipeDiameter: readings.discharge.diameter, accuracy: readings.discharge.accuracy ?? undefined },
    measuredFlow: readings.flow ?? undefined,
    measuredPower,
    grades: [grade],
    duty: duty ?? undefined,
  });
  let engine = runEngine(shaft ?? undefined);
  // A pump efficiency above 100 % (hydraulic power ρ·g·Q·H over the shaft power) cannot be: the power reading, its unit or
  // the motor efficiency entered is wrong, so the grade's power and efficiency limits are not judged on it (they would read
  // "met", a shaft power far below the curve's); the verdict is on flow and head only, and says why.
  const pumpEfficiency = shaft !== null && shaft > 0 && engine.flow !== null ? (rho * G0 * engine.flow * engine.tdh) / shaft : null;
  const impossiblePower = pumpEfficiency !== null && pumpEfficiency > 1
    ? `the pump's efficiency comes out at ${fmtPctExact(pumpEfficiency, [1])}, above 100 % (hydraulic power over the shaft power), so a reading, its unit or the motor efficiency entered is wrong; the verdict is on flow and head only.`
    : null;
  if (impossiblePower) engine = runEngine(undefined);
  warnings.push(...engine.warnings.map((w) => w.message));
  // An accuracy not given (null: a blank field) is unknown, never a perfect instrument: it widens nothing — the reading is
  // taken as read on that quantity, and every sentence with the uncertainty says it was not given (`uncertaintyWords`).
  const headUncertainty = Math.hypot(readings.suction.accuracy ?? 0, readings.discharge.accuracy ?? 0) / (rho * G0);
  const flowAccuracy = readings.flowAccuracy ?? 0;
  // The grade's power and efficiency limits, where missed as read, within the power reading's accuracy (when entered).
  const asRead = engine.grades.find((g) => g.id === grade.id)?.power ?? null;
  const powerAccuracy = readings.power.mode === "none" ? null : (readings.power.readingAccuracy ?? null);
  const powerWithin = asRead?.pass === false && powerAccuracy !== null && shaft !== null && engine.flow !== null
    ? gradePowerWithinAccuracy(curve, engine.flow, engine.tdh, rho, shaft, grade, powerAccuracy) : null;
  const judged = verdictFor(curve, grade, engine, flowAccuracy, headUncertainty, powerWithin);
  const { within } = judged;
  let verdict = judged.verdict;
  // The curve is translated to the measured speed by the affinity laws, which a test may use only near the
  // curve's speed (ISO 9906: about 50–120 %, from memory; the engine's large-speed-change warning uses the same
  // bounds). Farther off, no tolerance verdict is given, with the reason.
  const speedRatio = rescaled && measured !== null && rated !== null ? measured / rated : null;
  if (onLiquid.noVerdict && verdict !== "unknown") {
    verdict = "unknown";
    warnings.push(onLiquid.noVerdict);
  }
  const speedOutside = speedRatio !== null && (speedRatio < SPEED_RANGE[0] || speedRatio > SPEED_RANGE[1]) && verdict !== "unknown";
  if (speedOutside) {
    verdict = "unknown";
    // The speeds with the decimals that keep the measured one off the range's ends (a drive at 24.99 Hz of 50 Hz × 1450 rpm
    // is 724.7 rpm, not "725 rpm", which is 50 % of 1450 rpm, inside the range).
    warnings.push(`No tolerance verdict: the measured speed (${fmtNumExact(measured!, SPEED_RANGE.map((f) => f * rated!), 0)} rpm) is ${fmtPctExact(speedRatio, [...SPEED_RANGE])} of the curve's ${fmtNumExact(rated!, [Math.round(rated!)], 0)} rpm, outside the ${fmtPctLimit(SPEED_RANGE[0])}–${fmtPctLimit(SPEED_RANGE[1])} within which the curve may be translated to it by the affinity laws (ISO 9906, from memory). Check nearer the curve's speed.`);
  }
  // A suction reading at or below the liquid's vapour pressure: misread, or the pump cavitating — no tolerance verdict on it
  // (suction-vapour.ts); where there is none anyway, said as a note.
  const atVapour = suctionAtVapour(readings.suction, fluid.vaporPressure, readings.temperatureC);
  const vapourNoVerdict = atVapour !== null && verdict !== "unknown";
  if (vapourNoVerdict) verdict = "unknown";
  if (atVapour) warnings.push(vapourNoVerdict ? `No tolerance verdict: ${atVapour}` : `${atVapour.charAt(0).toUpperCase()}${atVapour.slice(1)}`);
  // A measured flow outside the curve's published flows: judged only on the part of the cross that reaches the published
  // curve, and said so; where the cross does not reach it, no tolerance verdict (curve-ends.ts).
  const curveEnd = verdict !== "unknown" && engine.flowSource === "measured" && engine.flow !== null ? curveEndOf(curve, engine.flow, grade, flowAccuracy) : null;
  // Where the arm reaches the published flows but the curve there states no head like the measured one, the arm's crossing
  // is unpublished too: neither arm read as read. No verdict (a fail needs an arm read and missed), unless a point within the
  // readings' uncertainty meets the grade on the published curve (marginal, said so) — curve-ends.ts.
  const crossAsRead = engine.grades.find((g) => g.id === grade.id)?.cross ?? null;
  const unread = curveEnd?.reaches && crossAsRead && crossAsRead.head.curveValue === null && crossAsRead.flow.curveValue === null
    ? crossingOff(curve, engine.tdh, headUncertainty, readings.suction.accuracy !== null || readings.discharge.accuracy !== null)
    : null;
  const unreadNoVerdict = unread !== null && verdict !== "marginal";
  const endNote = !curveEnd ? null
    : unreadNoVerdict ? crossingOffNoVerdict(curveEnd, unread, grade.id, grade, flowAccuracy)
    : curveEnd.reaches ? `${curveEndJudgedNote(curveEnd, grade.id, grade, flowAccuracy)}${unread ? crossingOffJudged(unread) : ""}`
    : curveEndNoVerdict(curveEnd, grade.id, grade, flowAccuracy);
  if (curveEnd && (!curveEnd.reaches || unreadNoVerdict)) verdict = "unknown";
  if (endNote) warnings.push(endNote);
  // Marginal within the readings' uncertainty only while it is no wider than the grade's own tolerance (uncertainty-bound.ts):
  // wider, the box straddles the grade whatever the pump does, so no tolerance verdict, with both numbers.
  const curveHeadHere = engine.curveHead ?? (within ? headAt(curve, Math.min(Math.max(within.flow, curve.flowMin), curve.flowMax)) : null);
  const boxWide = within && verdict === "marginal" && curveHeadHere !== null ? uncertaintyTooWide(grade, curveHeadHere, headUncertainty, readings.flowAccuracy) : null;
  // The same where the marginal rests on the power reading's accuracy: each limit missed as read against its own tolerance
  // (power t_P, efficiency t_η — 0 for 1E and 1U); wider, no verdict.
  const powerWide = powerWithin && verdict === "marginal"
    ? powerLimitsTooWide(grade, powerAccuracy, { power: asRead?.power?.pass === false, efficiency: asRead?.efficiency?.pass === false })
    : null;
  const tooWide = boxWide || powerWide
    ? { gradeId: grade.id, head: boxWide?.head ?? null, flow: boxWide?.flow ?? null, power: powerWide?.power ?? null, efficiency: powerWide?.efficiency ?? null }
    : null;
  if (tooWide) {
    verdict = "unknown";
    warnings.push(uncertaintyNoVerdict(tooWide, grade, rho));
  }
  // Within the readings' uncertainty: the point that meets the grade, with the uncertainty (the note and the verdict's sentence).
  // An accuracy not given is said so (it was "flow ± 0.0 %", "head ± 0.00 m"): that quantity is taken as read.
  const withinWords = within && verdict === "marginal"
    ? `(${uncertaintyWords(readings, headUncertainty)}) ${qt("flow", within.flow)} at ${qt("head", within.head)} meets it (${within.arm === "head" ? "head" : "flow"} arm of the tolerance cross`
    : null;
  if (withinWords) warnings.push(`At the tolerance limit: the reading misses grade ${grade.id}, but within its uncertainty ${withinWords}).`);

  const q = engine.flow;
  const hydraulic = q !== null ? rho * G0 * q * engine.tdh : null;
  const power =
    input === null
      ? null
      : {
          input,
          hydraulic,
          overall: hydraulic !== null && input > 0 ? hydraulic / input : null,
          shaft,
          pump: hydraulic !== null && shaft ? hydraulic / shaft : null,
          curve: q !== null ? efficiencyAt(curve, q) : null,
        };
  if (power && power.overall !== null && power.overall > 1) warnings.push("The efficiency comes out above 100 %: a reading or its unit is wrong.");
  // The pump's own (hydraulic / shaft, the motor's efficiency taken off the input) can pass 100 % while the overall does not.
  else if (power && power.pump !== null && power.pump > 1) warnings.push(`The pump's efficiency comes out at ${fmtPctExact(power.pump, [1])}, above 100 % (hydraulic power over input × the motor's efficiency): a reading, its unit or the motor efficiency entered is wrong.`);

  const deviation = {
    curveFlow: engine.flowDeviation,
    curveHead: engine.headDeviation,
    dutyFlow: engine.dutyDeviation?.flow ?? null,
    dutyHead: engine.dutyDeviation?.head ?? null,
  };
  // Outside the grade on the cross: both arms with their numbers (cross.ts), not the engine's head deviation alone.
  const outside = "Delivered point is outside every grade checked";
  const missWords = engine.message.startsWith(outside) ? crossMissWords({ engine, delivered: { flow: q, head: engine.tdh }, deviation, grade }) : null;
  const engineMessage = missWords ? `${outside} (${missWords})` : engine.message;
  const speed = { rated, design, measured, rescaled, designRatio: rated !== null && design !== null ? design / rated : null };
  // The curve as selected: on a viscous custom liquid corrected as the selection's figures were (its own temperature, the
  // design speed), so its point on the system curve is the report's operating point, not the water curve's.
  const selectedOnLiquid = curveOnLiquid(designCurve, f.system.input.fluid, fluidOf(f.system.input).kinematicViscosity, design);
  const selectedCorrected = selectedOnLiquid.curve !== designCurve;
  const sel = sample(selectedOnLiquid.curve, rho);
  const mea = sample(curve, rho);
  const ev = f.systemCurve;
  const flowMax = Math.max(curve.flowMax, designCurve.flowMax, (q ?? 0) * 1.1, (duty?.flow ?? 0) * 1.2, engine.flowBand?.high ?? 0);
  const result: CheckResult = {
    format: FIELD_CHECK_FORMAT,
    grade: { id: grade.id, flow: grade.flow, head: grade.head, powerAbove: grade.powerAbove, efficiencyBelow: grade.efficiencyBelow, source: grade.source },
    verdict,
    verdictText: VERDICT_TEXT[verdict],
    // The engine judged the point on the translated curve; outside the speed range that judgement is not given.
    message: speedOutside ? `Delivered point not judged against grade ${grade.id}: the measured speed is outside the range the curve may be translated to (see the warnings)`
      : onLiquid.noVerdict ? `Delivered point not judged against grade ${grade.id}: no curve for this liquid (see the warnings)`
      : vapourNoVerdict ? `Delivered point not judged against grade ${grade.id}: the suction reading is at or below the liquid's vapour pressure, so it is misread or the pump is cavitating (see the warnings)`
      : tooWide ? uncertaintyMessage(tooWide)
      : unreadNoVerdict ? `Delivered point not judged against grade ${grade.id}: the measured flow is outside the flows the curve is published for and the measured head outside the heads it states there, so neither arm of the tolerance cross can be read (see the warnings)`
      : curveEnd && !curveEnd.reaches ? `Delivered point not judged against grade ${grade.id}: the measured flow is outside the flows the curve is published for, and the tolerance cross does not reach them (see the warnings)`
      : `${marginalMessage(unread ? `Delivered point is off the published curve on both arms of grade ${grade.id}'s tolerance cross` : engineMessage, withinWords, powerWithin && verdict === "marginal" ? powerAccuracy : null)}${curveEnd ? " — judged on the published part of the curve only (see the warnings)" : ""}`,
    engine,
    fluid: { name: fluid.name, density: rho },
    speed,
    gauges: { suction: ps, discharge: pd, headUncertainty, assumedAtmosphere: mixed },
    duty,
    delivered: { flow: q, head: engine.tdh },
    deviation,
    power,
    powerGrade: powerGradeOf(grade, verdict !== "unknown", readings.power, input, asRead, powerWithin, impossiblePower),
    hints: [],
    warnings: [...new Set(warnings)],
    chart: {
      selected: sel.head,
      measured: mea.head,
      selectedEff: sel.eff,
      measuredEff: mea.eff,
      system: ev && n === 1 ? ev.flows.map((x, i) => ({ flow: x, y: ev.design[i] })) : null,
      flowMax,
      band: engine.flowBand ? { low: engine.flowBand.low, high: engine.flowBand.high } : null,
      selectedLabel: `As selected${design !== null ? ` (${Math.round(design)} rpm${selectedCorrected ? `, corrected for ${f.system.input.fluid.kind === "custom" ? f.system.input.fluid.name || "the custom liquid" : "the liquid"}` : ""})` : ""}`,
      measuredLabel: rescaled ? `At the measured ${measuredRpmText(measured!, rated)} rpm` : "Curve compared",
    },
  };
  result.hints = hintsFor(result);
  return result;
}

/**
 * The readings' uncertainty as the marginal sentence states it, an accuracy not given said so (never as ±0): "flow ± 2 %,
 * head ± 0.36 m", "flow as read: the meter's accuracy not given, head ± 0.25 m (the discharge gauge's accuracy not given)",
 * "…, head as read: the gauges' accuracy not given". An entered 0 is stated as given ("flow ± 0 %").
 * @param r the readings (accuracies ± Pa and ± fraction, null when not given)
 * @param headUncertainty the gauges' given accuracies in quadrature over ρ·g, m
 */
export function uncertaintyWords(r: Pick<Readings, "suction" | "discharge" | "flowAccuracy">, headUncertainty: number): string {
  const flow = r.flowAccuracy === null ? "flow as read: the meter's accuracy not given" : `flow ± ${pctAsTyped(r.flowAccuracy)}`;
  const missing = [r.suction.accuracy === null ? "suction" : null, r.discharge.accuracy === null ? "discharge" : null].filter((x) => x !== null);
  const head = missing.length === 2 ? "head as read: the gauges' accuracy not given"
    : `head ± ${qt("head", headUncertainty)}${missing.length ? ` (the ${missing[0]} gauge's accuracy not given)` : ""}`;
  return `${flow}, ${head}`;
}

/**
 * The verdict's sentence for a check marginal as read: the engine's (missed as read), then what meets the grade within the
 * readings' uncertainty (`withinWords`: the uncertainty and the point with their numbers, quantity tokens) and/or within the power reading's
 * accuracy (`powerAccuracy`, a fraction); the engine's alone when neither.
 */
function marginalMessage(engineMessage: string, withinWords: string | null, powerAccuracy: number | null): string {
  const parts = [
    withinWords ? `the readings' uncertainty ${withinWords}; see the notes on the working)` : null,
    powerAccuracy !== null ? `the power reading's accuracy (±${pctAsTyped(powerAccuracy)}) a lower shaft power meets the grade's power and efficiency limits (see power and efficiency)` : null,
  ].filter((x): x is string => x !== null);
  return parts.length ? `${engineMessage} as read; ${parts.map((x) => `within ${x}`).join("; and ")}` : engineMessage;
}

/** The sentence with the delivered duty point, quantities as tokens (rendered in the reader's units), for the e-mail. */
export function deliveredSentence(r: CheckResult): string {
  const q = r.delivered.flow;
  const src = r.engine.flowSource === "measured" ? "measured" : "inferred from the curve";
  const first = q !== null ? `Delivered ${qt("flow", q)} (${src}) at ${qt("head", r.delivered.head)}` : `Measured head ${qt("head", r.delivered.head)}; flow could not be inferred`;
  const duty = r.duty ? ` (design duty ${qt("flow", r.duty.flow)} at ${qt("head", r.duty.head)})` : "";
  // Off the curve's published flows, judged on the part published: said with the verdict (curve-ends.ts).
  const published = r.warnings.find((w) => w.startsWith(PUBLISHED_PART));
  // The verdict's rule and numbers: each arm of the cross with the curve's value and the grade's allowance (cross.ts).
  const arms = crossSummary(r);
  return `${first}${duty}. Judged against grade ${r.grade.id}: ${r.verdictText}.${arms ? ` ${arms}` : ""}${published ? ` ${published}` : ""} ${powerGradeSummary(r)}`;
}
