// The tolerance grade explained as ISO 9906's cross (2012, 6.4.2, from memory): a head arm and a flow
// arm around the curve at the delivered point; meeting either arm meets the grade. Pure: built from a
// stored check result (older results without the engine's cross are read from their deviations, which
// are the same two numbers), so the page and the e-mail explain every stored check the same way.
import type { CheckResult } from "./result";
import { fmtPctExact, fmtPctLimit } from "~/engine/quantityText";

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

function arm(name: "head" | "flow", curveValue: number | null, measured: number, deviation: number | null, allowed: readonly [number, number]): CrossArm {
  const margin = deviation === null ? null : Math.min(deviation + allowed[0], allowed[1] - deviation);
  return { arm: name, curveValue, measured, deviation, allowed, pass: margin !== null && margin >= -1e-12, margin };
}

/** Null without a flow meter (no verdict) or without a delivered flow. */
export function crossOf(r: Pick<CheckResult, "engine" | "delivered" | "deviation" | "grade">): CrossExplanation | null {
  if (r.engine.flowSource !== "measured" || r.delivered.flow === null) return null;
  const q = r.delivered.flow;
  const h = r.delivered.head;
  const dq = r.deviation.curveFlow;
  const head = arm("head", r.engine.curveHead, h, r.deviation.curveHead, r.grade.head);
  const flow = arm("flow", dq !== null ? q / (1 + dq) : null, q, dq, r.grade.flow);
  const passedOn = head.pass && flow.pass ? "both" : head.pass ? "head" : flow.pass ? "flow" : "neither";
  return { grade: r.grade.id, head, flow, passedOn };
}

// A deviation never reads as the limit it is judged against; limits read as typed (2.5 %, not rounded to 3 %).
const pc = (x: number, allowed: readonly [number, number]) => `${x >= 0 ? "+" : "−"}${fmtPctExact(Math.abs(x), allowed)}`;
const tol = (a: readonly [number, number]) => `−${fmtPctLimit(a[0])} to +${fmtPctLimit(a[1])}`;

/** Sentences for the page and mail; flows and heads formatted by the caller's units. */
export function crossSentences(x: CrossExplanation, fmt: { flow: (v: number) => string; head: (v: number) => string }): string[] {
  const out = [
    `Grade ${x.grade} is judged with ISO 9906's tolerance cross around the curve at the delivered point: a head arm and a flow arm; meeting either arm meets the grade.`,
  ];
  const line = (a: CrossArm) => {
    const at = a.arm === "head" ? `at the measured ${fmt.flow(x.flow.measured)} the curve gives ${a.curveValue !== null ? fmt.head(a.curveValue) : "no head"}` : `at the measured ${fmt.head(x.head.measured)} the curve gives ${a.curveValue !== null ? fmt.flow(a.curveValue) : "no flow"}`;
    const meas = a.arm === "head" ? fmt.head(a.measured) : fmt.flow(a.measured);
    if (a.deviation === null || a.margin === null) return `${a.arm === "head" ? "Head" : "Flow"} arm: ${at} — not met (off the curve).`;
    const by = `${fmtPctExact(Math.abs(a.margin)).replace(" %", "")} points ${a.margin >= 0 ? "inside" : "outside"}`;
    return `${a.arm === "head" ? "Head" : "Flow"} arm: ${at}; the measured ${meas} is ${pc(a.deviation, a.allowed)} (allowed ${tol(a.allowed)}) — ${a.pass ? "met" : "not met"}, ${by}.`;
  };
  out.push(line(x.head), line(x.flow));
  if (x.passedOn === "head") out.push("Met on the head arm. The flow arm's larger percentage is not a contradiction: where the curve is flat, a small head difference is a large flow difference.");
  else if (x.passedOn === "flow") out.push("Met on the flow arm. Where the curve is steep, a small flow difference is a large head difference, so the head arm can miss while the flow arm is met.");
  else if (x.passedOn === "both") out.push("Met on both arms.");
  else out.push("Neither arm is met as read.");
  return out;
}
