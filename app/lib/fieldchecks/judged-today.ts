// A recorded check judged again from its own stored readings, against the selection's frozen curve, under the rules the
// product applies now. Nothing recomputes a record: its stored verdict is the one recorded (and perhaps signed). But the
// check's page recomputes the arms of the tolerance cross and the power limits from the stored deviations with today's
// allowances, so where a rule changed after the check was recorded (an allowance, a bound on the readings' accuracy) the
// stored verdict could stand beside arms that contradict it ("outside tolerance" over "head +5 % … met, at the limit").
// The page then says both verdicts, each with its words, and how to record today's (amend: a new version); the lists say
// today's with its rule and numbers (listed-verdict.ts). Pure.
import { evaluateCheck } from "./evaluate";
import type { FrozenSelection } from "./frozen-curve";
import type { Readings, Verdict } from "./form";
import { verdictNote, type CheckResult } from "./result";
import { verdictRule, type RuledVerdict } from "./listed-verdict";

/** Today's verdict on a recorded check's readings, where it differs from the stored one: its sentence, its note, its rule and numbers. */
export type JudgedToday = { verdict: Verdict; message: string; note: string | null; rule: string };

/**
 * The readings worked out with today's engine, or null where today's rules cannot (a grade no longer offered, a reading
 * today's rules refuse).
 * @param frozen the selection's frozen document the check was recorded against
 * @param readings the check's stored readings, SI
 * @param gradeId the grade the check was recorded under
 */
export function judgeToday(frozen: FrozenSelection, readings: Readings, gradeId: string): CheckResult | null {
  try {
    return evaluateCheck(frozen, readings, gradeId);
  } catch {
    return null;
  }
}

/**
 * Today's verdict with its rule and numbers (listed-verdict.ts `verdictRule`), or null where today's rules cannot judge.
 * @param frozen the selection's frozen document the check was recorded against
 * @param readings the check's stored readings, SI
 * @param gradeId the grade the check was recorded under
 */
export function ruledToday(frozen: FrozenSelection, readings: Readings, gradeId: string): RuledVerdict | null {
  const today = judgeToday(frozen, readings, gradeId);
  return today ? { verdict: today.verdict, rule: verdictRule(today) } : null;
}

/**
 * Today's verdict where it differs from the stored one; null where they agree, or where the readings cannot be judged
 * today (a grade no longer offered, a reading today's rules refuse): the stored verdict then stands alone, as it did.
 * @param frozen the selection's frozen document the check was recorded against
 * @param readings the check's stored readings, SI
 * @param gradeId the grade the check was recorded under
 * @param stored the verdict stored with the check
 */
export function judgedToday(frozen: FrozenSelection, readings: Readings, gradeId: string, stored: Verdict): JudgedToday | null {
  const today = judgeToday(frozen, readings, gradeId);
  if (!today || today.verdict === stored) return null;
  return { verdict: today.verdict, message: today.message, note: verdictNote(today), rule: verdictRule(today) };
}
