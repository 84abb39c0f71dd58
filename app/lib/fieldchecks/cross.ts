// The tolerance grade explained as ISO 9906's cross (2012, 6.4.2, from memory): a head arm and a flow
// arm around the curve at the delivered point; meeting either arm meets the grade. Pure: built from a
// stored check result (older results without the engine's cross are read from their deviations, which
// are the same two numbers), so the page and the e-mail explain every stored check the same way.
import type { CheckResult } from "./result";
import { fmtPctExact, fmtPctLimit, fmtPctSide, gradeAllows, gradeSlack, qt, qtExact, qtLimit } from "~/engine/quantityText";

export type CrossArm = {
  arm: "head" | "flow";
  /** Curve value at the other measured quantity: head at the measured flow (m), or flow at the measured head (m³/s). */
  curveValue: number | null;
  measured: number;
  /** (measured − curve)/curve, fraction; null off the curve. */
  deviation: number | null;
  allowed: readonly [number, number];
  pass: boolean;
  /** Fraction points inside (negative: outside). */
  margin: number | null;
};

export type CrossExplanation = { grade: string; head: CrossArm; flow: CrossArm; passedOn: "head" | "flow" | "both" | "neither" };

/** Fraction points within which a reading is on an arm's end: the engine's `gradeCross` allowance (limitText.ts `gradeSlack`). */
const nearEnd = (deviation: number, end: number) => Math.abs(deviation - end) <= gradeSlack(end);

function arm(name: "head" | "flow", curveValue: number | null, measured: number, deviation: number | null, allowed: readonly [number, number]): CrossArm {
  const margin = deviation === null ? null : Math.min(deviation + allowed[0], allowed[1] - deviation);
  return { arm: name, curveValue, measured, deviation, allowed, pass: deviation !== null && gradeAllows(deviation, allowed[0], allowed[1]), margin };
}

/** Null without a flow meter (no verdict) or without a delivered flow. */
export function crossOf(r: Pick<CheckResult, "engine" | "delivered" | "deviation" | "grade">): CrossExplanation | null {
  if (r.engine.flowSource !== "measured" || r.delivered.flow === null) return null;
  const q = r.delivered.flow;
  const h = r.delivered.head;
  const dq = r.deviation.curveFlow;
  const head = arm("head", r.engine.curveHead, h, r.deviation.curveHead, r.grade.head);
  // The curve's flow at the measured head: as the engine judged it; in a result without its cross, worked back from the
  // deviation — which cannot give it at a measured flow of zero (0 / (1 − 1)).
  const judged = r.engine.grades?.find((g) => g.id === r.grade.id)?.cross?.flow.curveValue;
  const flowAtHead = judged != null ? judged : dq !== null && 1 + dq !== 0 ? q / (1 + dq) : null;
  const flow = arm("flow", flowAtHead, q, dq, r.grade.flow);
  const passedOn = head.pass && flow.pass ? "both" : head.pass ? "head" : flow.pass ? "flow" : "neither";
  return { grade: r.grade.id, head, flow, passedOn };
}

// A deviation never reads as the limit it is judged against; limits read as typed (2.5 %, not rounded to 3 %).
const pc = (x: number, allowed: readonly [number, number]) => `${x >= 0 ? "+" : "−"}${fmtPctExact(Math.abs(x), allowed)}`;
const tol = (a: readonly [number, number]) => `${fmtPctSide(a[0], "−")} to ${fmtPctSide(a[1], "+")}`; // grade 1U's flow: "0 % to +10 %", not "−0 %"

/** Whether an arm is met on its edge, within the rounding allowance (`gradeSlack`): said with the limit's own number. */
const onEdge = (a: CrossArm) => a.pass && a.deviation !== null && (nearEnd(a.deviation, a.allowed[1]) || nearEnd(a.deviation, -a.allowed[0]));

/**
 * One arm's deviation from the curve as the verdict reads it: signed, with the decimals that keep it apart from the arm's
 * allowance ("+5.0001 %" beside a limit of +5 %, never "+5.0 %"); met on the edge within the rounding allowance, the limit's
 * own number ("+5 %", "0 %"); "—" off the curve. The cross's sentences and the check page's row beside the verdict.
 */
export function armDeviationText(a: CrossArm): string {
  if (a.deviation === null || a.margin === null) return "—";
  if (!onEdge(a)) return pc(a.deviation, a.allowed);
  const upper = a.allowed[1] - a.deviation <= a.deviation + a.allowed[0];
  const limit = upper ? a.allowed[1] : a.allowed[0];
  return limit === 0 ? "0 %" : `${upper ? "+" : "−"}${fmtPctLimit(limit)}`;
}

/**
 * The gap between an arm's deviation and its nearer end, percentage points, to the decimals its deviation is printed with
 * beside the allowance ("+5.00000006 %" → "0.00000006 points outside"), never in exponent form where the deviation is not
 * ("6.00e-8 points"): a gap judged outside is past the end by more than `gradeSlack`, 1 part in 10⁸ of the allowance (of
 * the curve's value at a 0 % side), which those decimals show.
 * @param margin fraction points inside (negative: outside)
 * @param deviation the deviation as printed (`armDeviationText`)
 */
function gapText(margin: number, deviation: string): string {
  const decimals = /\.(\d+) %$/.exec(deviation)?.[1].length ?? 1;
  return fmtPctExact(Math.abs(margin), [], decimals).replace(" %", "");
}

/**
 * Formats a flow (m³/s) or a head (m) in the reader's units; with `against`, the values it is judged beside, with the
 * decimals that keep it apart from them (`fmtQExact`; `limit`: the curve's value, its added zeros dropped).
 */
type CrossFormat = (v: number, against?: readonly number[], limit?: boolean) => string;

/** Sentences for the page and mail; flows and heads formatted by the caller's units. */
export function crossSentences(x: CrossExplanation, fmt: { flow: CrossFormat; head: CrossFormat }): string[] {
  const out = [
    `Grade ${x.grade} is judged with ISO 9906's tolerance cross around the curve at the delivered point: a head arm and a flow arm; meeting either arm meets the grade.`,
  ];
  const line = (a: CrossArm) => {
    const edgeMet = onEdge(a);
    // The measured value and the curve's read apart (a grade allowing 0 % on one side misses by less than the unit's
    // digits: "the curve gives 33.0 m³/h; the measured 33.0 m³/h is −0.01 % … not met"); on the edge they are one value.
    const own = a.arm === "head" ? fmt.head : fmt.flow;
    const apart = a.curveValue !== null && !edgeMet;
    const curve = a.curveValue === null ? null : apart ? own(a.curveValue, [a.measured], true) : own(a.curveValue);
    const at = a.arm === "head" ? `at the measured ${fmt.flow(x.flow.measured)} the curve gives ${curve ?? "no head"}` : `at the measured ${fmt.head(x.head.measured)} the curve gives ${curve ?? "no flow"}`;
    const meas = apart ? own(a.measured, [a.curveValue!]) : own(a.measured);
    if (a.deviation === null || a.margin === null) return `${a.arm === "head" ? "Head" : "Flow"} arm: ${at} — not met (off the curve).`;
    // On the edge within the rounding allowance: met, and said with the limit's own number (never "met, … outside").
    if (edgeMet) return `${a.arm === "head" ? "Head" : "Flow"} arm: ${at}; the measured ${meas} is ${armDeviationText(a)} (allowed ${tol(a.allowed)}) — met, at the limit (the allowance includes its edge).`;
    const by = `${gapText(a.margin, armDeviationText(a))} points ${a.margin >= 0 ? "inside" : "outside"}`;
    return `${a.arm === "head" ? "Head" : "Flow"} arm: ${at}; the measured ${meas} is ${armDeviationText(a)} (allowed ${tol(a.allowed)}) — ${a.pass ? "met" : "not met"}, ${by}.`;
  };
  out.push(line(x.head), line(x.flow));
  // The other arm off the curve has no percentage to compare: it cannot be read, and the grade rests on the arm met.
  if (x.passedOn === "head" && x.flow.deviation === null)
    out.push("Met on the head arm. The flow arm cannot be read here: the curve gives no flow above zero at the measured head, so the grade is judged on the head arm alone.");
  else if (x.passedOn === "flow" && x.head.deviation === null)
    out.push("Met on the flow arm. The head arm cannot be read here: the published curve gives no head at the measured flow, so the grade is judged on the flow arm alone.");
  else if (x.passedOn === "head") out.push("Met on the head arm. The flow arm's larger percentage is not a contradiction: where the curve is flat, a small head difference is a large flow difference.");
  else if (x.passedOn === "flow") out.push("Met on the flow arm. Where the curve is steep, a small flow difference is a large head difference, so the head arm can miss while the flow arm is met.");
  else if (x.passedOn === "both") out.push("Met on both arms.");
  else out.push("Neither arm is met as read.");
  return out;
}

/**
 * The verdict's rule and numbers in one sentence, for the surfaces that show a check's verdict without its page — the
 * engineer's e-mail, the selection's list of checks, the field page's history (quantity tokens, rendered in the reader's
 * units): each arm's deviation as the verdict reads it (`armDeviationText`), the curve's value it is taken from and the
 * grade's allowance, met or not. Null where no verdict rests on the cross (no flow meter, or no tolerance verdict given).
 */
export function crossSummary(r: Pick<CheckResult, "engine" | "delivered" | "deviation" | "grade" | "verdict">): string | null {
  const x = r.verdict === "unknown" ? null : crossOf(r);
  if (!x) return null;
  const said = (a: CrossArm) => {
    const other = a.arm === "head" ? "flow" : "head";
    if (a.deviation === null || a.curveValue === null) return `${a.arm} arm not read (the curve gives no ${a.arm} at the measured ${other})`;
    const state = !a.pass ? "not met" : onEdge(a) ? "met, at the limit" : "met";
    return `${a.arm} ${armDeviationText(a)} of the curve's ${qt(a.arm, a.curveValue)} at the measured ${other} (allowed ${tol(a.allowed)}), ${state}`;
  };
  return `Tolerance cross of grade ${x.grade}, as read (either arm meets it): ${said(x.head)}; ${said(x.flow)}.`;
}

/**
 * Both arms of a cross missed as read, each with its numbers (quantity tokens): the measured value, the deviation as the
 * verdict reads it, the curve's value it is taken of and the arm's allowance — "head: the measured ⟦30 m⟧ is +7.1 % of the
 * curve's ⟦28 m⟧ at the measured flow (allowed −5 % to +5 %); flow: the measured ⟦43.2 m³/h⟧ is +20.0 % of the curve's
 * ⟦36 m³/h⟧ at the measured head (allowed −8 % to +8 %)"; an arm off the curve "not read". For the verdict's sentence of a
 * check outside the grade (evaluate.ts), which named the head arm's deviation alone. Null without a cross (no flow meter).
 * @param r the check's engine result, delivered point, deviations and grade
 */
export function crossMissWords(r: Pick<CheckResult, "engine" | "delivered" | "deviation" | "grade">): string | null {
  const x = crossOf(r);
  if (!x) return null;
  const said = (a: CrossArm) => {
    const other = a.arm === "head" ? "flow" : "head";
    if (a.deviation === null || a.curveValue === null) return `${a.arm} arm not read (the curve gives no ${a.arm} at the measured ${other})`;
    return `${a.arm}: the measured ${qtExact(a.arm, a.measured, [a.curveValue])} is ${armDeviationText(a)} of the curve's ${qtLimit(a.arm, a.curveValue, [a.measured])} at the measured ${other} (allowed ${tol(a.allowed)})`;
  };
  return `${said(x.head)}; ${said(x.flow)}`;
}
