// When a reading's uncertainty is too wide for "at the tolerance limit": pure, for the check (evaluate.ts) on the server and
// the phone. A check is marginal when the reading misses the grade as read but some point within the readings' uncertainty
// box meets it (`gradeWithinUncertainty`). That says something only while the box is no wider than the grade's own
// tolerance: ISO 9906:2012's tolerance factors are total tolerances — the pump's deviation and the test's measurement
// uncertainty together — and the uncertainties it permits an acceptance test are a fraction of them (its table of
// permissible measurement uncertainties, from memory: about ±1 % to ±2.5 % of head and flow, against ±3 % to ±9 % of
// tolerance). Where the readings' uncertainty, in head or in flow, is wider than the grade's tolerance on that quantity, the
// box straddles the grade whatever the pump does (±1000 kPa gauges, ±144 m, reached a pump 40 % short of its 28 m), so the
// readings cannot tell a pass from a fail: no tolerance verdict, with both numbers and the instruments that would do.
// Rule (decision "gaugebound", common practice): head uncertainty ΔH = √(a_s² + a_d²)/(ρ·g) against half the head arm's
// width at the curve's head at the measured flow, (t_H− + t_H+)/2 × H_curve; the flow meter's accuracy (fraction) against
// half the flow arm's width, (t_Q− + t_Q+)/2; either one wider (strictly: equal is within) is too wide.
// The power reading's accuracy likewise (decisions "fieldmeter", "effbound"): a check marginal only because a shaft power
// within the reading's ±a meets the grade's power and efficiency limits (power-grade.ts) says nothing where a is wider than
// the tolerance of a limit it rescues. Each limit missed as read is held to its own: the power limit to t_P (+8 % for 2B:
// ±20 % let a pump drawing (1 + 8 %)/(1 − 20 %) = 1.35 × the curve's power read "at the tolerance limit"), the efficiency
// limit to t_η (−5 % for 2B; the pump's efficiency is ρ·g·Q·H over the shaft power, so the power reading's ±a is its
// uncertainty too, and ±7 % let 2B's efficiency 6.5 % short read marginal). 1E and 1U allow no efficiency shortfall
// (t_η = 0), so any accuracy is wider: a shortfall as read is never "at the tolerance limit" there (±9 % made a 1U pump
// 8.7 % short of its curve's efficiency marginal). Wider (a > t; equal is within), no tolerance verdict, with both numbers.
// A limit met as read is not held to anything (a reading met as read is not marked down for its accuracy).
// The efficiency's uncertainty is not the power reading's ±a (decision "effexact"): η = P_hyd / P, so a power read to ±a puts
// the true efficiency in [η/(1 + a), η/(1 − a)] — −a/(1 + a) to +a/(1 − a) of the reading (the relative error of a quotient,
// hand algebra). A shortfall is rescued on the upward side, so the efficiency limit is held to a/(1 − a) ≤ t_η, i.e.
// a ≤ t_η/(1 + t_η) (2B: ±4.76 %, not ±5 %: at ±5 % the efficiency may be 5.26 % above its reading).
import { G0, type ToleranceGrade } from "~/engine";
import { fmtPctExact, fmtPctLimit, fmtPctSide, qt, qtExact, qtLimit } from "~/engine/quantityText";
import { pctAsTyped } from "../shared/format";

/** The readings' uncertainty on each quantity where it is wider than the grade's tolerance on it (null where it is not). */
export type UncertaintyTooWide = {
  gradeId: string;
  /** m: the head uncertainty, the grade's head tolerance either side at this flow, the curve's head it is taken of. */
  head: { uncertainty: number; tolerance: number; curveHead: number } | null;
  /** Fractions: the flow meter's accuracy and the grade's flow tolerance either side. */
  flow: { accuracy: number; tolerance: number } | null;
  /** Fractions: the power reading's accuracy and the grade's power tolerance (above the curve's); null or missing where within. */
  power?: { accuracy: number; tolerance: number } | null;
  /**
   * Fractions: the power reading's accuracy and the grade's efficiency tolerance (below the curve's; 0 for 1E, 1U); null or
   * missing where within. Compared through {@link efficiencyUpward}, a/(1 − a), not a.
   */
  efficiency?: { accuracy: number; tolerance: number } | null;
};

/** Half the width of a tolerance band [below, above] (fractions): what either side of its middle allows. */
const half = (band: readonly [number, number]) => (band[0] + band[1]) / 2;

/**
 * The grade's head tolerance either side (m) at the curve's head `curveHead` (m): half its head arm's width.
 * @param grade tolerance grade (fractions)
 * @param curveHead the curve's head at the measured flow, m
 */
export function headTolerance(grade: Pick<ToleranceGrade, "head">, curveHead: number): number {
  return half(grade.head) * curveHead;
}

/**
 * Where the readings' uncertainty is wider than the grade's own tolerance — head uncertainty above the head tolerance at
 * this flow, or the flow meter's accuracy above the flow tolerance — the quantities that are; null where both are within.
 * @param grade tolerance grade (fractions)
 * @param curveHead the curve's head at the measured flow, m
 * @param headUncertainty the head's uncertainty, ± m (the gauges' in quadrature over ρ·g)
 * @param flowAccuracy the flow meter's accuracy, ± fraction of the reading; null when not given (unknown: not compared, as it
 *   widened nothing — the flow taken as read, and said so)
 */
export function uncertaintyTooWide(grade: Pick<ToleranceGrade, "id" | "head" | "flow">, curveHead: number, headUncertainty: number, flowAccuracy: number | null): UncertaintyTooWide | null {
  const hTol = headTolerance(grade, curveHead);
  const qTol = half(grade.flow);
  const head = headUncertainty > hTol ? { uncertainty: headUncertainty, tolerance: hTol, curveHead } : null;
  const flow = flowAccuracy !== null && flowAccuracy > qTol ? { accuracy: flowAccuracy, tolerance: qTol } : null;
  return head || flow ? { gradeId: grade.id, head, flow } : null;
}

/**
 * How far the pump's efficiency may lie above its reading when the power is read to ±`a`: η/(1 − a) − 1 = a/(1 − a)
 * (η = P_hyd / P; the lowest power within the accuracy, P(1 − a), gives the highest efficiency). Infinite for a ≥ 1.
 * @param a the power reading's accuracy, ± fraction of the reading
 */
export const efficiencyUpward = (a: number): number => (a < 1 ? a / (1 - a) : Infinity);

/**
 * How far the pump's efficiency may lie below its reading when the power is read to ±`a`: 1 − η/(1 + a) / η = a/(1 + a).
 * @param a the power reading's accuracy, ± fraction of the reading
 */
export const efficiencyDownward = (a: number): number => a / (1 + a);

/**
 * The power and efficiency limits missed as read — so met, if at all, only within the power reading's accuracy — whose own
 * tolerance the uncertainty it gives is wider than (strictly; equal is within): the power limit, a > t_P; the efficiency
 * limit, a/(1 − a) > t_η (the efficiency's upward uncertainty, {@link efficiencyUpward}; t_η is 0 for 1E and 1U, so any
 * accuracy above 0). Null where none is, where no accuracy was given (judged as read) or
 * where no limit was missed as read.
 * @param grade tolerance grade (fractions)
 * @param accuracy the power reading's accuracy, ± fraction of the reading, or null when not given
 * @param missed which limits were missed as read (the engine's `gradePower` at the reading)
 */
export function powerLimitsTooWide(
  grade: Pick<ToleranceGrade, "powerAbove" | "efficiencyBelow">,
  accuracy: number | null,
  missed: { power: boolean; efficiency: boolean },
): { power: { accuracy: number; tolerance: number } | null; efficiency: { accuracy: number; tolerance: number } | null } | null {
  if (accuracy === null) return null;
  const one = (isMissed: boolean, tolerance: number | undefined, uncertainty: number) => (isMissed && tolerance !== undefined && uncertainty > tolerance ? { accuracy, tolerance } : null);
  const power = one(missed.power, grade.powerAbove, accuracy);
  const efficiency = one(missed.efficiency, grade.efficiencyBelow, efficiencyUpward(accuracy));
  return power || efficiency ? { power, efficiency } : null;
}

/** A band's tolerance either side, and where the band is one-sided (1U, 2U) which band it is half of: "5 %", "3 %, half its 0 % to +6 % band,". */
function sideText(band: readonly [number, number]): string {
  const h = fmtPctLimit(half(band));
  return band[0] === band[1] ? h : `${h}, half its ${fmtPctSide(band[0], "−")} to ${fmtPctSide(band[1], "+")} band,`;
}

/** The numbers compared, each apart from the other (quantity tokens): "head ±144 m against ±1.4 m", "flow ±12 % against ±8 %". */
function compared(w: UncertaintyTooWide): string[] {
  return [
    w.head ? `head ±${qtExact("head", w.head.uncertainty, [w.head.tolerance])} against ±${qtLimit("head", w.head.tolerance, [w.head.uncertainty])}` : null,
    w.flow ? `flow ±${pctAsTyped(w.flow.accuracy)} against ±${fmtPctLimit(w.flow.tolerance)}` : null,
    w.power ? `power ±${pctAsTyped(w.power.accuracy)} against +${fmtPctLimit(w.power.tolerance)}` : null,
    w.efficiency ? `efficiency +${fmtPctExact(efficiencyUpward(w.efficiency.accuracy), [w.efficiency.tolerance], 2)} (the power reading's ±${pctAsTyped(w.efficiency.accuracy)}, a/(1 − a)) against ${effTol(w.efficiency.tolerance)}` : null,
  ].filter((x): x is string => x !== null);
}

/** An efficiency tolerance as the sentences write it: "−5 %", and "0 %" where the grade allows no shortfall. */
const effTol = (t: number) => (t === 0 ? "0 %" : `−${fmtPctLimit(t)}`);

/** The verdict's sentence (the result's `message`, quantity tokens): the numbers compared, the rest in the note. */
export function uncertaintyMessage(w: UncertaintyTooWide): string {
  return `Delivered point not judged against grade ${w.gradeId}: the readings' uncertainty is wider than the grade's tolerance (${compared(w).join("; ")}), so they cannot tell a pass from a fail; use finer instruments (see the warnings)`;
}

/**
 * The note beside the verdict ("No tolerance verdict: …", read by `verdictNote` on every surface; quantity tokens): each
 * quantity too wide with the grade's tolerance and what it is taken of, and the instruments that would judge it — two
 * gauges of equal accuracy within ΔH·ρ·g/√2 each, a flow meter within the flow tolerance.
 * @param w what is too wide
 * @param grade the grade's bands (fractions)
 * @param density the liquid's density, kg/m³ (the gauges' accuracy from the head tolerance)
 */
export function uncertaintyNoVerdict(w: UncertaintyTooWide, grade: Pick<ToleranceGrade, "head" | "flow">, density: number): string {
  const parts = [
    w.head
      ? `in head ±${qtExact("head", w.head.uncertainty, [w.head.tolerance])} (the two gauges' accuracies in quadrature over ρ·g) against grade ${w.gradeId}'s ±${qtLimit("head", w.head.tolerance, [w.head.uncertainty])} (${sideText(grade.head)} of the curve's ${qt("head", w.head.curveHead)} at the measured flow)`
      : null,
    w.flow ? `in flow the meter's ±${pctAsTyped(w.flow.accuracy)} against grade ${w.gradeId}'s ±${fmtPctLimit(w.flow.tolerance)}${grade.flow[0] === grade.flow[1] ? "" : ` (half its ${fmtPctSide(grade.flow[0], "−")} to ${fmtPctSide(grade.flow[1], "+")} band)`}` : null,
    w.power ? `in power the reading's ±${pctAsTyped(w.power.accuracy)} against grade ${w.gradeId}'s +${fmtPctLimit(w.power.tolerance)} above the curve's shaft power` : null,
    w.efficiency
      ? `in efficiency the power reading's ±${pctAsTyped(w.efficiency.accuracy)}, which moves the pump's efficiency by −${fmtPctExact(efficiencyDownward(w.efficiency.accuracy), [], 2)} to +${fmtPctExact(efficiencyUpward(w.efficiency.accuracy), [w.efficiency.tolerance], 2)} (it is ρ·g·Q·H over the shaft power: η/(1 + a) to η/(1 − a)), the upward +a/(1 − a) — the side that would rescue a shortfall — against grade ${w.gradeId}'s ${effTol(w.efficiency.tolerance)} below the curve's efficiency${w.efficiency.tolerance === 0 ? " (it allows no shortfall, so any accuracy is wider)" : ""}`
      : null,
  ].filter((x): x is string => x !== null);
  // One power reading serves both limits: the narrower of the accuracies that would do for those too wide that allow
  // anything at all — t_P for the power, t_η/(1 + t_η) for the efficiency (a/(1 − a) ≤ t_η).
  const powerTolerances = [w.power?.tolerance, w.efficiency && w.efficiency.tolerance > 0 ? w.efficiency.tolerance / (1 + w.efficiency.tolerance) : undefined].filter((t): t is number => t !== undefined && t > 0);
  const finer = [
    w.head ? `gauges within about ±${qt("pressure", (w.head.tolerance * density * G0) / Math.SQRT2)} each (equal gauges, for the head within ±${qtLimit("head", w.head.tolerance, [w.head.uncertainty])})` : null,
    w.flow ? `a flow meter within ±${fmtPctLimit(w.flow.tolerance)}` : null,
    powerTolerances.length ? `a power reading within ±${fmtPctLimit(Math.min(...powerTolerances))}` : null,
  ].filter((x): x is string => x !== null);
  const noShortfall = w.efficiency?.tolerance === 0
    ? ` Grade ${w.gradeId} allows no efficiency shortfall, so the efficiency is judged as read: a shortfall as read is never at the tolerance limit, whatever the power reading's accuracy.`
    : "";
  return `No tolerance verdict: the readings' uncertainty is wider than the grade's own tolerance — ${parts.join("; ")} — so the readings cannot tell a pass from a fail: a point within their uncertainty meets grade ${w.gradeId} however far off the pump is, and "at the tolerance limit" would say more than they do. A grade's tolerance already holds the test's measurement uncertainty (ISO 9906:2012, from memory).${finer.length ? ` Check again with ${finer.join(" and ")}, or finer.` : ""}${noShortfall}`;
}
