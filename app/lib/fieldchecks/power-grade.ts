// A tolerance grade's power and efficiency limits on a field check (the engine's gradePower.ts: shaft power at most
// (1 + tP) × the curve's, pump efficiency at least (1 − tη) × the curve's, ISO 9906:2012 from memory — tη read as a
// fraction of the curve's efficiency, to be verified against the standard). The form records the motor's INPUT power
// (a meter, the drive, or V·I·PF); the curve gives the pump's SHAFT power. They are compared only through the motor
// efficiency the contractor entered (shaft = input × η_motor); without it power and efficiency are not judged, and
// the check says so. Pure: evaluate.ts stores `PowerGrade` with the result, the page and the e-mail read the sentences.
import type { GradeLimitCheck, GradePowerCheck } from "~/engine";
import { fmtPctExact, fmtPctLimit, fmtPctSignedExact, qtPair, qt } from "~/engine/quantityText";
import type { PowerSI } from "./form";

/** What a check judged of its grade's power and efficiency limits, stored with its result. */
export type PowerGrade = {
  /** Why power and efficiency were not judged (plain text, no quantity tokens); null when judged. */
  notJudged: string | null;
  /** The shaft power judged: the input power (W) × the motor efficiency entered (fraction); null when not judged. */
  basis: { input: number; motorEfficiency: number } | null;
  /** The engine's judgement at the measured point; null when not judged. */
  check: GradePowerCheck | null;
};

type GradeWords = { id: string; powerAbove?: number; efficiencyBelow?: number };

/**
 * Whether and how a check's power was judged against its grade.
 * @param grade the grade judged (fractions)
 * @param tolerance whether the check has a tolerance verdict at all (a flow meter, a speed near the curve's)
 * @param power the power as recorded (SI)
 * @param input the motor's input power, W, or null
 * @param check the engine's judgement (fieldCheck's grade entry), or null
 */
export function powerGradeOf(grade: GradeWords, tolerance: boolean, power: PowerSI, input: number | null, check: GradePowerCheck | null): PowerGrade {
  const not = (why: string): PowerGrade => ({ notJudged: `Power and efficiency were not judged against grade ${grade.id}: ${why}`, basis: null, check: null });
  if (!tolerance) return not("there is no tolerance verdict (the notes on the working say why).");
  if (power.mode === "none" || input === null) return not("no power was recorded, so the verdict is on flow and head only.");
  if (power.motorEfficiency === null)
    return not(
      "the motor's input power was recorded without the motor's efficiency, and the curve gives the pump's shaft power (input × motor efficiency), so the two cannot be compared. The verdict is on flow and head only; enter the motor's nameplate efficiency to judge them.",
    );
  if (grade.powerAbove === undefined && grade.efficiencyBelow === undefined) return not("the grade sets no power or efficiency limit.");
  if (!check || check.pass === null) return not("the curve gives neither power nor efficiency at the measured flow, so the verdict is on flow and head only.");
  return { notJudged: null, basis: { input, motorEfficiency: power.motorEfficiency }, check };
}

/** A deviation with its sign, never reading as the allowance it is judged against (a fraction ≥ 0). */
const signed = (x: number, allowed: number) => fmtPctSignedExact(x, [allowed], true);
/** An allowance as typed, with its side: "+4 %", "−3 %", and "0 %" for none. */
const allowance = (a: number, side: "+" | "−") => (a === 0 ? "0 %" : `${side}${fmtPctLimit(a)}`);

function powerLine(p: GradeLimitCheck | null, basis: NonNullable<PowerGrade["basis"]>): string | null {
  if (!p) return null;
  const from = `input ${qt("power", basis.input)} × motor efficiency ${fmtPctLimit(basis.motorEfficiency)}`;
  if (p.curve === null || p.deviation === null || p.pass === null) return `Power: shaft ${qt("power", p.measured)} (${from}); the curve gives no power at the measured flow — not judged.`;
  const [measured, curve] = qtPair("power", p.measured, p.curve);
  return `Power: shaft ${measured} (${from}) vs curve ${curve}: ${signed(p.deviation, p.allowed)} ${p.pass ? "≤" : ">"} ${allowance(p.allowed, "+")} allowed — ${p.pass ? "met" : "not met"}.`;
}

function efficiencyLine(e: GradeLimitCheck | null): string | null {
  if (!e) return null;
  if (e.curve === null || e.deviation === null || e.pass === null) return `Efficiency: pump ${fmtPctExact(e.measured)} (ρ·g·Q·H / shaft power); the curve gives no efficiency at the measured flow — not judged.`;
  return `Efficiency: pump ${fmtPctExact(e.measured, [e.curve])} (ρ·g·Q·H / shaft power) vs curve ${fmtPctExact(e.curve, [e.measured])}: ${signed(e.deviation, e.allowed)} of it ${e.pass ? "≥" : "<"} ${allowance(e.allowed, "−")} allowed — ${e.pass ? "met" : "not met"}.`;
}

/**
 * The grade's power and efficiency limits in words, each with its rule and numbers (quantity tokens: render them in the
 * reader's units). A result recorded before these limits were judged (no `powerGrade`) says so.
 * @param r the stored result's grade and power judgement
 */
export function powerGradeSentences(r: { grade: GradeWords; powerGrade?: PowerGrade | null }): string[] {
  const g = r.grade;
  if (!r.powerGrade) return [`Power and efficiency were not judged against grade ${g.id}: this check was recorded before a grade's power and efficiency limits were judged, so its verdict is on flow and head only.`];
  const { notJudged, basis, check } = r.powerGrade;
  if (notJudged !== null || !basis || !check) return [notJudged ?? `Power and efficiency were not judged against grade ${g.id}.`];
  const rule = [
    g.powerAbove !== undefined ? `the shaft power to at most ${fmtPctLimit(g.powerAbove)} above the curve's at the measured flow` : null,
    g.efficiencyBelow === undefined ? null
      : g.efficiencyBelow === 0 ? "the pump's efficiency to at least the curve's"
      : `the pump's efficiency to at least the curve's less ${fmtPctLimit(g.efficiencyBelow)} of it (a fraction of the curve's efficiency, not percentage points)`,
  ].filter(Boolean);
  return [
    `Grade ${g.id} also limits ${rule.join(", and ")} (ISO 9906:2012 from memory; our reading, to be verified against the standard). Judged as read; the grade is met only when flow/head, power and efficiency all are.`,
    ...[powerLine(check.power, basis), efficiencyLine(check.efficiency)].filter((x): x is string => x !== null),
    "The shaft power is the input power × the motor efficiency entered: an error in that efficiency moves the power and the efficiency judged one for one.",
  ];
}

/**
 * One clause for the e-mail: the limits missed with their numbers, "met", or why not judged.
 * @param r the stored result's grade and power judgement
 */
export function powerGradeSummary(r: { grade: GradeWords; powerGrade?: PowerGrade | null }): string {
  const pg = r.powerGrade;
  if (!pg || pg.notJudged !== null || !pg.check) return powerGradeSentences(r)[0];
  const { power, efficiency } = pg.check;
  const part = (name: string, x: GradeLimitCheck | null, sign: "+" | "−") =>
    x && x.deviation !== null && x.pass !== null ? `${name} ${signed(x.deviation, x.allowed)} (${allowance(x.allowed, sign)} allowed, ${x.pass ? "met" : "not met"})` : `${name} not judged (no curve value)`;
  return `Against grade ${r.grade.id}'s power and efficiency limits: ${[power ? part("shaft power", power, "+") : null, efficiency ? part("pump efficiency", efficiency, "−") : null].filter(Boolean).join(", ")}.`;
}
