// The verdict of one check against one grade from the engine's result: the tolerance cross as read, then within the
// readings' uncertainty, then the grade's power and efficiency limits. Pure.
import { gradeWithinUncertainty, withinGrade, type FieldCheckResult, type GradePowerWitness, type GradeWitness, type PumpCurve, type ToleranceGrade } from "~/engine";
import type { Verdict } from "./form";

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
