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
// The power reading's accuracy likewise (decision "fieldmeter"): a check marginal only because a shaft power within the
// reading's ±a meets the grade's power and efficiency limits (power-grade.ts) says nothing where a is wider than the grade's
// power tolerance t_P (+8 % for 2B): ±20 % let a pump drawing (1 + 8 %)/(1 − 20 %) = 1.35 × the curve's power read
// "at the tolerance limit". Wider (a > t_P; equal is within), no tolerance verdict, with both numbers.
import { G0, type ToleranceGrade } from "~/engine";
import { fmtPctExact, fmtPctLimit, fmtPctSide, qt, qtExact, qtLimit } from "~/engine/quantityText";

/** The readings' uncertainty on each quantity where it is wider than the grade's tolerance on it (null where it is not). */
export type UncertaintyTooWide = {
  gradeId: string;
  /** m: the head uncertainty, the grade's head tolerance either side at this flow, the curve's head it is taken of. */
  head: { uncertainty: number; tolerance: number; curveHead: number } | null;
  /** Fractions: the flow meter's accuracy and the grade's flow tolerance either side. */
  flow: { accuracy: number; tolerance: number } | null;
  /** Fractions: the power reading's accuracy and the grade's power tolerance (above the curve's); null or missing where within. */
  power?: { accuracy: number; tolerance: number } | null;
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
 * Where the power reading's accuracy is wider than the grade's power tolerance (a > t_P, strictly): both numbers; null
 * where it is within, where no accuracy was given (the power judged as read) or where the grade sets no power limit.
 * @param grade tolerance grade (fractions)
 * @param accuracy the power reading's accuracy, ± fraction of the reading, or null when not given
 */
export function powerAccuracyTooWide(grade: Pick<ToleranceGrade, "powerAbove">, accuracy: number | null): { accuracy: number; tolerance: number } | null {
  if (accuracy === null || grade.powerAbove === undefined) return null;
  return accuracy > grade.powerAbove ? { accuracy, tolerance: grade.powerAbove } : null;
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
    w.flow ? `flow ±${fmtPctExact(w.flow.accuracy, [w.flow.tolerance])} against ±${fmtPctLimit(w.flow.tolerance)}` : null,
    w.power ? `power ±${fmtPctExact(w.power.accuracy, [w.power.tolerance])} against +${fmtPctLimit(w.power.tolerance)}` : null,
  ].filter((x): x is string => x !== null);
}

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
    w.flow ? `in flow the meter's ±${fmtPctExact(w.flow.accuracy, [w.flow.tolerance])} against grade ${w.gradeId}'s ±${fmtPctLimit(w.flow.tolerance)}${grade.flow[0] === grade.flow[1] ? "" : ` (half its ${fmtPctSide(grade.flow[0], "−")} to ${fmtPctSide(grade.flow[1], "+")} band)`}` : null,
    w.power ? `in power the reading's ±${fmtPctExact(w.power.accuracy, [w.power.tolerance])} against grade ${w.gradeId}'s +${fmtPctLimit(w.power.tolerance)} above the curve's shaft power` : null,
  ].filter((x): x is string => x !== null);
  const finer = [
    w.head ? `gauges within about ±${qt("pressure", (w.head.tolerance * density * G0) / Math.SQRT2)} each (equal gauges, for the head within ±${qtLimit("head", w.head.tolerance, [w.head.uncertainty])})` : null,
    w.flow ? `a flow meter within ±${fmtPctLimit(w.flow.tolerance)}` : null,
    w.power ? `a power reading within ±${fmtPctLimit(w.power.tolerance)}` : null,
  ].filter((x): x is string => x !== null);
  return `No tolerance verdict: the readings' uncertainty is wider than the grade's own tolerance — ${parts.join("; ")} — so the readings cannot tell a pass from a fail: a point within their uncertainty meets grade ${w.gradeId} however far off the pump is, and "at the tolerance limit" would say more than they do. A grade's tolerance already holds the test's measurement uncertainty (ISO 9906:2012, from memory). Check again with ${finer.join(" and ")}, or finer.`;
}
