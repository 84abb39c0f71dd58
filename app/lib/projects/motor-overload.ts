// Whether a candidate's motor can overload, over every flow its pump can run at (pure; used by evaluateCandidate).
// The engine's check (app/engine/figures.ts overloadCheck) holds the largest power on one pump's curve as set (speed or
// trim at the rounded setting, corrected for viscosity) against motor rating × service factor, where the power is known
// from the curve's first flow to its last. Its published end is the last flow whose power anyone knows, so a pump that
// runs past it is not called non-overloading: at the band's least-lift edge (the run-out), or, in parallel, one pump
// running alone on that edge (the first to start, or the others tripped: a single pump runs further out on its curve
// than when it shares the flow, common practice). A known overload decides whatever the rest.
import { bandEdges } from "./candidate-judgement";
import { headAt, overloadCheck, solveOperatingPoint, systemHeadFunction, type MaxShaftPower, type PreparedSystem, type PumpCurve } from "~/engine";
import { qt, qtPair } from "~/engine/quantityText";

export type OverloadJudgement = {
  nonOverloading: boolean | null;
  /** The verdict with its rule and numbers, as shown beside the motor. */
  text: string;
  /** For the candidate's warnings; null when non-overloading. */
  warning: string | null;
};

type RunCtx = {
  mode: "open" | "closed-loop";
  prepared: PreparedSystem;
  /** One pump's curve as set, and the arrangement's curve. */
  curve: PumpCurve;
  combined: PumpCurve;
  arrangement: "single" | "parallel" | "series";
  n: number;
};

/**
 * Where the pump runs past its published curve's end on the band's least-lift edge (the run-out), as the arrangement
 * and, in parallel, as one pump alone: each with the reason in words and numbers.
 */
export function runsPastCurveEnd(ctx: RunCtx): string[] {
  const runOut = bandEdges(ctx.mode)[0];
  const sys = systemHeadFunction(ctx.prepared, runOut.which);
  const out: string[] = [];
  // Past the end as the engine's solve says (solveOperatingPoint): beyond-curve-end; or settled at a stable crossing with an
  // unstable one further out past which it runs on off the curve (a drooping curve). A pump whose head at zero flow is below
  // the system's never starts there (no-intersection-shutoff-below-static): it runs nowhere, so not past the end either.
  const past = (who: string, c: PumpCurve) => {
    const op = solveOperatingPoint(c, sys);
    const pumpHead = headAt(c, c.flowMax), systemHead = sys(c.flowMax);
    if (op.status === "no-intersection-shutoff-below-static" || pumpHead === null || !(pumpHead > systemHead)) return;
    const [pump, system] = qtPair("head", pumpHead, systemHead);
    const unstable = op.flow != null ? op.points[op.points.length - 1] : null;
    const pushed = unstable ? ` once pushed past the unstable crossing at ${qt("flow", unstable.flow)} (${qt("head", unstable.head)})` : "";
    out.push(`at ${runOut.name} ${who} past the published curve's end${pushed} (${qt("flow", c.flowMax)}, still giving ${pump} against the system's ${system})`);
  };
  past(ctx.arrangement === "single" ? "the pump runs" : `the ${ctx.n} pumps run`, ctx.combined);
  if (ctx.arrangement === "parallel" && ctx.n > 1) past("one pump running alone (the first to start, or the others tripped) runs", ctx.curve);
  return out;
}

/**
 * The motor's overload verdict for a candidate: the engine's check over the curve, then not judged (null) where the pump
 * runs past the curve's end, unless the curve already shows an overload.
 * @param ctx the system and the pump's curves as set
 * @param max the largest shaft power on one pump's curve and its reach (engine maxShaftPower), null when none is known
 * @param limit motor rating × service factor, W
 */
export function judgeOverload(ctx: RunCtx, max: MaxShaftPower | null, limit: number): OverloadJudgement {
  const onCurve = overloadCheck(max, limit);
  if (onCurve.nonOverloading === false) return onCurve;
  const past = runsPastCurveEnd(ctx);
  if (past.length === 0) return onCurve;
  const known = onCurve.nonOverloading === true ? `within the curve the largest power ${qt("power", max!.power)} is within motor rating × service factor ${qt("power", limit)}` : onCurve.text.replace(/^overload not judged: /, "");
  const warning = `overload not judged: ${past.join("; ")}, where the pump's power is not published; ${known}`;
  return { nonOverloading: null, text: warning, warning };
}
