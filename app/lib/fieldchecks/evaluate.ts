// The field check itself, pure: readings against a frozen selection → the delivered duty point,
// deviations, a verdict against a labelled tolerance grade and plain hints. No database, no Node
// API: the server runs it when a check is recorded, the phone runs it offline (same numbers). Its parts, one concept
// a file: frozen-curve.ts (the selection's curve, the grades), speed-range.ts, verdict-for.ts, hints.ts, sentences.ts.
import {
  EngineInputError,
  efficiencyAt,
  fieldCheck,
  G0,
  gradePowerWithinAccuracy,
  headAt,
  scaleBySpeed,
  STANDARD_ATMOSPHERE,
} from "~/engine";
import { fluidOf } from "../projects/hydraulics";
import { inputPowerW, speedRpm, VERDICT_TEXT, type Readings } from "./form";
import { powerGradeOf } from "./power-grade";
import { curveOnLiquid } from "./liquid-curve";
import { crossingOff, crossingOffJudged, crossingOffNoVerdict, curveEndJudgedNote, curveEndNoVerdict, curveEndOf } from "./curve-ends";
import { FIELD_CHECK_FORMAT, MARGINAL_NOTE, type CheckResult } from "./result";
import { crossMissWords } from "./cross";
import { suctionAtVapour } from "./suction-vapour";
import { powerLimitsTooWide, uncertaintyMessage, uncertaintyNoVerdict, uncertaintyTooWide } from "./uncertainty-bound";
import { fmtNumExact, fmtPctExact, fmtPctLimit, qt } from "~/engine/quantityText";
import { gradeById, sampleForChart, selectedCurve, type FrozenSelection } from "./frozen-curve";
import { measuredRpmText, SPEED_RANGE } from "./speed-range";
import { verdictFor } from "./verdict-for";
import { hintsFor } from "./hints";
import { marginalMessage, uncertaintyWords } from "./sentences";

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
  if (withinWords) warnings.push(`${MARGINAL_NOTE} the reading misses grade ${grade.id}, but within its uncertainty ${withinWords}).`);

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
  const sel = sampleForChart(selectedOnLiquid.curve, rho);
  const mea = sampleForChart(curve, rho);
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
