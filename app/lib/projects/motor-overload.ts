// Whether a candidate's motor can overload, over every flow its pump can run at (pure; used by evaluateCandidate).
// The engine's check (app/engine/figures.ts overloadCheck) holds the largest power on one pump's curve as set (speed or
// trim at the rounded setting, corrected for viscosity) against motor rating × service factor, where the power is known
// from the curve's first flow to its last. Its published end is the last flow whose power anyone knows, so a pump that
// runs past it is not called non-overloading: at the band's least-lift edge (the run-out), or, in parallel, one pump
// running alone on that edge (the first to start, or the others tripped: a single pump runs further out on its curve
// than when it shares the flow, common practice). A known overload decides whatever the rest.
// In series, with one pump stopped or tripped, the rest lift the liquid alone at a lower flow (solveOperatingPoint, the
// start-from-rest rule; the stopped pump's own loss is left out, as if bypassed — common practice, from memory). That
// point lies on the curve, so its power is within the curve's largest: it cannot turn a "non-overloading" into an
// overload, but where the curve already overloads the check names the series edge whose power exceeds the limit. Where
// the curve is published from a flow above zero (no shut-off head) and the rest cannot reach its first point, they run
// below it, where power is not published: not judged, like past the end (arrangement-start.ts leaves that case unwarned).
import { bandEdges } from "./candidate-judgement";
import { combinePumps, headAt, overloadCheck, shaftPowerAt, solveOperatingPoint, systemHeadFunction, type MaxShaftPower, type PreparedSystem, type PumpCurve } from "~/engine";
import { limitCovers } from "~/engine/motor";
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

/** In series with one pump stopped or tripped, at each edge of the band: where the rest run and one pump's power there. */
export type SeriesStopped = { at: string; left: number; flow: number | null; head: number | null; power: number | null };

/**
 * Pumps in series with one stopped or tripped: the rest solved against the system at each edge of the band (the start-
 * from-rest rule; the stopped pump's loss left out), with one running pump's shaft power there (W, null where unknown).
 * Flow and head null where they reach no point on the published curve; edges where they dead-head at a published
 * shut-off head are left out (arrangement-start.ts warns there). Empty unless series of two or more.
 */
export function seriesStopped(ctx: RunCtx): SeriesStopped[] {
  if (ctx.arrangement !== "series" || ctx.n < 2) return [];
  const left = ctx.n - 1;
  const rest = left === 1 ? ctx.curve : combinePumps(ctx.curve, { mode: "series", duty: left }).curve;
  return bandEdges(ctx.mode).flatMap(({ name, which }): SeriesStopped[] => {
    const op = solveOperatingPoint(rest, systemHeadFunction(ctx.prepared, which));
    if (op.flow == null || op.head == null) return op.status === "no-intersection-shutoff-below-static" && rest.shutoffHead === null ? [{ at: name, left, flow: null, head: null, power: null }] : [];
    if (op.flow === 0) return [];
    return [{ at: name, left, flow: op.flow, head: op.head, power: shaftPowerAt(ctx.curve, op.flow, ctx.prepared.fluid.density) }];
  });
}

const leftText = (s: SeriesStopped, n: number) => `at ${s.at}, with one of the ${n} pumps in series stopped or tripped (its own loss left out), the ${s.left === 1 ? "pump left running" : `${s.left} left running`}`;

/**
 * The motor's overload verdict for a candidate: the engine's check over the curve, then not judged (null) where the pump
 * runs past the curve's end, or, in series with one stopped, below its published start, unless the curve already shows an
 * overload; an overload then names each series edge (one pump stopped) whose power exceeds the limit.
 * @param ctx the system and the pump's curves as set
 * @param max the largest shaft power on one pump's curve and its reach (engine maxShaftPower), null when none is known
 * @param limit motor rating × service factor, W
 */
export function judgeOverload(ctx: RunCtx, max: MaxShaftPower | null, limit: number): OverloadJudgement {
  const onCurve = overloadCheck(max, limit);
  const stopped = seriesStopped(ctx);
  if (onCurve.nonOverloading === false) {
    const over = stopped.flatMap((s) => {
      if (s.power === null || limitCovers(limit, s.power)) return [];
      const [power, lim] = qtPair("power", s.power, limit);
      return [`${leftText(s, ctx.n)} ${s.left === 1 ? "runs" : "run"} at ${qt("flow", s.flow!)} (${qt("head", s.head!)}) taking ${power}${s.left > 1 ? " each" : ""}, above motor rating × service factor ${lim}`];
    });
    if (over.length === 0) return onCurve;
    const text = `${onCurve.text}; ${over.join("; ")}`;
    return { nonOverloading: false, text, warning: `${onCurve.warning}; ${over.join("; ")}` };
  }
  const past = runsPastCurveEnd(ctx);
  for (const s of stopped) if (s.flow === null) past.push(`${leftText(s, ctx.n)} cannot reach the published curve's first point (${qt("flow", ctx.curve.flowMin)}, no shut-off head published) and ${s.left === 1 ? "runs" : "run"} below it`);
  if (past.length === 0) return onCurve;
  const known = onCurve.nonOverloading === true ? `within the curve the largest power ${qt("power", max!.power)} is within motor rating × service factor ${qt("power", limit)}` : onCurve.text.replace(/^overload not judged: /, "");
  const warning = `overload not judged: ${past.join("; ")}, where the pump's power is not published; ${known}`;
  return { nonOverloading: null, text: warning, warning };
}
