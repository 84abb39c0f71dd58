// The pump curves a candidate's duty cycle runs on (energy.ts), pure. The cycle rebuilds the curve as set from the
// result's sampled points (hydraulics.ts `curve`: the arrangement's, on the system's liquid, 41 points), takes it back to
// the curve's speed under a drive, and for pumps in parallel staged by demand shares it out to one pump. A curve rebuilt
// from samples finds its own BEP among them — an interpolated peak between two published points (41.6 m³/h on a demo
// curve whose figures, chart and POR name the published 40.5 m³/h) — so a step's POR note judged a flow against another
// BEP than the figures' "Position vs BEP" beside it, and could say "outside" where they say "inside". Each curve here
// carries the BEP the candidate's figures name instead (`figures.bepFlow`, `bepHead`: one pump's, on its curve as set;
// none where they name none), moved with the curve: flow × pumps in parallel, head × pumps in series, and by the affinity
// laws (Q ∝ N, H ∝ N²) with the speed (common practice, as engine stepPor.ts moves it to a step's speed).
import { createPumpCurve, efficiencyAt, monotoneCubic, POR_FRACTION, scaleBySpeed, type PumpCurve } from "~/engine";
import type { NpshrPublished } from "./npshr-reach";

type CurvePoint = { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null };

/**
 * What the cycle needs of the evaluated candidate. `figures.bepFlow` / `bepHead` (m³/s, m; one pump's on its curve as
 * set): null where the curve names no BEP; absent (a caller that does not pass them): the rebuilt curve's own.
 */
export type CycleCurveSource = {
  adjustment: { method: "none" | "speed" | "trim"; arrangement: "single" | "parallel" | "series"; dutyPumps: number };
  result: { ratio: number; curve: readonly CurvePoint[]; figures: { bepFlow?: number | null; bepHead?: number | null } | null };
};

/** The figures' BEP on a curve of the arrangement at `speed` × the set speed, or null where the figures name none; undefined: not passed. */
function bepOn(c: CycleCurveSource, o: { together: boolean; speed: number }): { flow: number; head: number } | null | undefined {
  const f = c.result.figures;
  if (f?.bepFlow === undefined) return undefined;
  if (f.bepFlow == null || f.bepHead == null) return null;
  const n = o.together && c.adjustment.arrangement !== "single" ? c.adjustment.dutyPumps : 1;
  return { flow: f.bepFlow * (c.adjustment.arrangement === "parallel" ? n : 1) * o.speed, head: f.bepHead * (c.adjustment.arrangement === "series" ? n : 1) * o.speed ** 2 };
}

/** The curve with the given BEP and its preferred operating region (70–120 % of BEP flow, engine pumpCurve.ts); undefined keeps its own. */
export function withBep(curve: PumpCurve, bep: { flow: number; head: number } | null | undefined): PumpCurve {
  if (bep === undefined) return curve;
  if (bep === null) return { ...curve, bep: null, por: null };
  return { ...curve, bep: { flow: bep.flow, head: bep.head, efficiency: efficiencyAt(curve, bep.flow) ?? 0 }, por: { min: POR_FRACTION.min * bep.flow, max: POR_FRACTION.max * bep.flow } };
}

/**
 * The cycle's curves: `curve`, the arrangement's as set (under a drive with a speed setting, at the curve's own speed: the
 * cycle's speeds are fractions of it), and `one`, one of the duty pumps in parallel (null otherwise); each with the BEP the
 * figures name.
 * @param c the evaluated candidate (its sampled curve, speed ratio and figures)
 * @param density the liquid's density, kg/m³ (a power column read as efficiency)
 * @param undoSpeed take a speed setting back to the curve's speed (a drive's cycle)
 */
/** The speed the cycle's curves are at, as a fraction of the candidate's as set: 1 / its speed ratio where a drive's cycle undoes a speed setting, else 1. */
const cycleSpeed = (c: CycleCurveSource, undoSpeed: boolean): number =>
  undoSpeed && c.adjustment.method === "speed" && c.result.ratio > 0 && c.result.ratio !== 1 ? 1 / c.result.ratio : 1;

/**
 * The NPSHr one pump's curve publishes (the candidate's judgement's `npshrPublished`, as set), at the speed of the cycle's
 * curves: flows × speed, its one NPSHr × speed² (affinity laws, as engine scaleBySpeed moves the curve). Null: none
 * published; undefined: not kept (a result from before it was).
 * @param c the evaluated candidate
 * @param undoSpeed whether the cycle's curves undo a speed setting (as `cycleCurves`)
 */
export function npshrOnCycle(c: CycleCurveSource & { result: { npsh?: { npshrPublished?: NpshrPublished | null } | null } }, undoSpeed: boolean): NpshrPublished | null | undefined {
  const pub = c.result.npsh?.npshrPublished;
  if (pub == null) return pub;
  const s = cycleSpeed(c, undoSpeed);
  const column = pub.column?.map((p) => ({ flow: p.flow * s, npshr: p.npshr * s * s }));
  return { ...pub, from: pub.from * s, to: pub.to * s, single: pub.single == null ? null : pub.single * s * s, ...(column ? { column } : {}) };
}

/**
 * One pump's cycle curve with its NPSHr read off the published points (`npshrOnCycle`'s column, at the cycle's speed)
 * rather than off the result's 41 samples rebuilt into a curve: a monotone cubic through samples of a monotone cubic is
 * not the published curve, and under a drive a staged step's NPSHr, s² · NPSHr(share / s) (affinity laws: Q ∝ N, NPSHr ∝
 * N², common practice), read off the samples printed "NPSHr 0.8230 m" and "= 0.9997" where the published points give
 * 0.8239 m and 0.9990. Fewer than two published points: no NPSHr curve (decision "npshone"). A result from before the
 * column was kept (undefined) keeps the rebuilt curve's.
 * @param curve one pump's curve the cycle runs on (SI)
 * @param pub what one pump's curve publishes at the cycle's speed (`npshrOnCycle`)
 */
export function withPublishedNpshr(curve: PumpCurve, pub: NpshrPublished | null | undefined): PumpCurve {
  if (pub === undefined || (pub !== null && !pub.column)) return curve;
  const col = pub?.column ?? [];
  return { ...curve, npshr: col.length >= 2 ? monotoneCubic(col.map((p) => p.flow), col.map((p) => p.npshr)) : null };
}

export function cycleCurves(c: CycleCurveSource, density: number, undoSpeed: boolean): { curve: PumpCurve; one: PumpCurve | null } {
  const r = c.result;
  let curve = createPumpCurve({
    points: r.curve.map((p) => {
      const o: { flow: number; head: number; efficiency?: number; power?: number; npshr?: number } = { flow: p.flow, head: p.head };
      if (p.efficiency != null) o.efficiency = p.efficiency;
      if (p.power != null) o.power = p.power;
      if (p.npshr != null && p.npshr > 0) o.npshr = p.npshr; // staged steps' NPSH (staging-npsh.ts); no energy figure uses it
      return o;
    }),
    powerDensity: density,
    riseTolerance: 1,
  });
  const speed = cycleSpeed(c, undoSpeed);
  if (speed !== 1) curve = scaleBySpeed(curve, speed).curve;
  curve = withBep(curve, bepOn(c, { together: true, speed }));
  const pumps = c.adjustment.arrangement === "parallel" ? c.adjustment.dutyPumps : 1;
  return { curve, one: pumps > 1 ? withBep(onePump(curve, pumps, density), bepOn(c, { together: false, speed })) : null };
}

/** One of n identical pumps in parallel from their combined curve: flow and power ÷ n at equal head (multiple.ts, inverted). */
function onePump(combined: PumpCurve, n: number, density: number): PumpCurve {
  const points = combined.points.map((p) => ({ ...p, flow: p.flow / n, ...(p.power !== undefined ? { power: p.power / n } : {}) }));
  return createPumpCurve({ points, powerDensity: density, riseTolerance: 1 });
}
