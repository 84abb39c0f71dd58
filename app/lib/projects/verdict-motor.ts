// The verdict's headline qualified by the motor. The duty verdict (engine verdict.ts) is about delivering the duty and
// never reads the motor, which has its own check (motor-overload.ts: the curve's largest power against motor rating ×
// service factor); but a pump that "meets the duty" on a motor that overloads is no pump to sign, so wherever the verdict
// is a headline (the candidates table, the report, the chart's label, the CSV, the APIs) an overload qualifies it on the
// same line, with its rule and numbers, as NPSH does (verdict-npsh.ts). Pure; quantities as tokens (quantityText.ts).
// Rule (common practice): a motor runs within its rating × service factor at the duty, and a "non-overloading" selection
// keeps it within that over every flow the pump can run at (the check's own words say where it does not).
import { qtExact, qtLimit } from "~/engine/quantityText";
import { limitCovers } from "~/engine/motor";
import { againstWord } from "./verdict-npsh";

type VerdictLike = { status: string } | null | undefined;
/** The candidate's figures as far as the motor goes (SI: W, fractions); a frozen selection's may lack any of them. */
type MotorFigures = {
  motorLimit?: number | null;
  nonOverloading?: boolean | null;
  motorCheck?: string | null;
  motorLoadAtDuty?: number | null;
  motor?: { rating?: number | null } | null;
} | null | undefined;

/** One pump's shaft power at the operating point, W (load × rating), or null where either is unknown. */
const shaftAtDuty = (f: NonNullable<MotorFigures>) => (f.motorLoadAtDuty != null && f.motor?.rating != null ? f.motorLoadAtDuty * f.motor.rating : null);

/**
 * What the motor says against the verdict, or null where it says nothing against it (no motor limit, non-overloading, or
 * not judged): `atDuty` where one pump's shaft power at the operating point is above the limit ("the motor is overloaded at
 * the operating point: one pump takes ⟦power|…⟧, above motor rating × service factor ⟦power|…⟧"), else, where the check
 * found an overload off the duty, its own words ("the motor can overload: largest power on the curve … exceeds …").
 */
function motorAgainst(f: MotorFigures): { atDuty: boolean; text: string } | null {
  if (!f || f.motorLimit == null || !(f.motorLimit > 0)) return null;
  const shaft = shaftAtDuty(f);
  if (shaft != null && Number.isFinite(shaft) && shaft >= 0 && !limitCovers(f.motorLimit, shaft))
    return { atDuty: true, text: `the motor is overloaded at the operating point: one pump takes ${qtExact("power", shaft, [f.motorLimit])}, above motor rating × service factor ${qtLimit("power", f.motorLimit, [shaft])}` };
  if (f.nonOverloading === false && f.motorCheck) return { atDuty: false, text: `the motor ${f.motorCheck}` };
  return null;
}

/** The qualifier on the verdict's line: "but …" after "meets the duty", "and …" after any other verdict; null where the motor says nothing against it. */
export function verdictMotorNote(verdict: VerdictLike, f: MotorFigures): string | null {
  const against = verdict ? motorAgainst(f) : null;
  return against ? `${againstWord(verdict!)} ${against.text}` : null;
}

/** The chart label's short form: ", but the motor overloads at the operating point" / ", but the motor can overload" ("" where it says nothing against it). */
export function verdictMotorShort(verdict: VerdictLike, f: MotorFigures): string {
  const against = verdict ? motorAgainst(f) : null;
  return against ? `, ${againstWord(verdict!)} the motor ${against.atDuty ? "overloads at the operating point" : "can overload"}` : "";
}

/** The rule, for the note's title. */
export const MOTOR_RULE = "A motor runs within its rating × service factor at the duty; non-overloading keeps it there at every flow the pump can run at (common practice).";
