/**
 * Operating point: where pump head equals system head. The difference g(Q) = H_pump(Q) −
 * H_system(Q) is sampled over the curve (each curve interval split into equal parts) to
 * bracket every sign change, then each bracket is solved with Brent's method (Brent 1973;
 * iteration cap, bisection as the named fallback — see roots.ts). Every crossing is stable (the pump's head falls below the
 * system's past it) or unstable (it rises above it again). Started from rest against a closed check valve (common
 * practice, from memory), the pump runs only when its head at the curve's first point exceeds the system's there,
 * and then settles at the first stable crossing. Every outcome is named:
 * - `ok`: one intersection, reached from rest (at zero flow when the shut-off head equals the system's head
 *   there: the warning `dead-head`, no delivery);
 * - `multiple`: several (drooping curve); all are listed, the one reached from rest (the first stable one) is
 *   reported; each unstable crossing above it is a warning `unstable-crossing`, saying where a pump pushed past
 *   it runs on to;
 * - `no-intersection-shutoff-below-static`: the pump's head at its first point is below the system head there
 *   (for a curve starting at zero flow: shut-off head below the static head, so the pump cannot open its check
 *   valve); no operating point is reachable from rest, whatever crossings lie further out (they are listed in
 *   `points` and named in the message, the first one unstable);
 * - `beyond-curve-end`: pump head still exceeds system head at the last point — the pump
 *   would run out past the end of its published curve;
 * - `coincident`: the curves coincide (heads equal to rounding on consecutive samples) over a stretch the pump reaches
 *   from rest: no single operating point (flow/head null), the stretch in `stretch` and the message.
 * Heads equal to rounding at one sample with the same sign on both sides are a touch: one point (the warning
 * `touching-curves`), where a pump flowing up to it from above stops.
 * A reported point where the curves do not actually meet (the system curve jumps across the pump's head,
 * as Darcy friction does at Re 2000) carries the warning `system-curve-jump` with both heads.
 */
import { EngineInputError, requireFinite, requireFiniteResult, requireInteger, type EngineWarning } from "./errors.ts";
import { evalCubic } from "./interp.ts";
import { createPumpCurve, ensurePumpCurve, type PumpCurve, type PumpCurveInput, type PumpPoint } from "./pumpCurve.ts";
import { fluidAt } from "./fluids.ts";
import { prepareSystem, systemHeadFunction, type PreparedSystem, type SystemCase, type SystemSpec } from "./system.ts";
import { fmtPctLimit, pastBelow, qt, qtExact, qtLimit, qtPair } from "./quantityText.ts";
import { LIMIT_ROUNDING } from "./limitText.ts";
import { coincideRuleText, crossingFromRest, LAST_POINT_MATCH, meetingsOf } from "./meetings.ts";

export { crossingFromRest };

export type OperatingStatus = "ok" | "multiple" | "no-intersection-shutoff-below-static" | "beyond-curve-end" | "coincident";

/** A flow/head pair, m³/s and m. */
export interface DutyPoint {
  flow: number;
  head: number;
}

/** Result of an operating-point solve. flow/head are null when there is no intersection. */
export interface OperatingPointResult {
  status: OperatingStatus;
  /** Operating flow, m³/s (null without an intersection). */
  flow: number | null;
  /** Operating head, m (null without an intersection). */
  head: number | null;
  /** All intersections, ascending flow. */
  points: DutyPoint[];
  /** Solver that produced the reported point. */
  method: "brent" | "bisection" | null;
  /** Function evaluations spent in root solves (count). */
  iterations: number;
  /** Pump and system head at the curve's first and last points, m (for messages and charts). */
  atFirstPoint: { flow: number; pumpHead: number; systemHead: number };
  atLastPoint: { flow: number; pumpHead: number; systemHead: number };
  /** Human-readable summary. */
  message: string;
  /**
   * With `no-intersection-shutoff-below-static` and crossings further out: the crossings the pump never reaches from rest,
   * and the first one's instability, in words with the numbers (the message's own clause); absent otherwise.
   */
  unreached?: string;
  /**
   * With `coincident`: the stretch where the curves coincide, flows m³/s and head m, and `share`, the share of the published
   * flows (dimensionless) over which their heads stay within TOUCH_GAP of the pump's about it (meetings.ts); absent otherwise.
   */
  stretch?: { flowFrom: number; flowTo: number; head: number; share: number };
  warnings: EngineWarning[];
}

/**
 * Solves pump curve against a system head function H_sys(Q).
 * @param curve pump curve (prepared or raw; flow m³/s, head m)
 * @param systemHead function flow m³/s → system head m
 * @param options.subdivisions samples per curve interval for bracketing (count, dimensionless; a whole number 1–10 000, default 8)
 * @param options.maxIterations Brent iteration cap per root (count, dimensionless; a whole number 1–10 000, default 100)
 */
export function solveOperatingPoint(
  curve: PumpCurve | PumpCurveInput,
  systemHead: (flow: number) => number,
  options: { subdivisions?: number; maxIterations?: number } = {},
): OperatingPointResult {
  return requireFiniteResult("system", solveInner(curve, systemHead, options));
}

/**
 * Most samples per curve interval `solveOperatingPoint` takes (count; engine bound): 10 000 per interval already
 * resolves roots closer than a ten-thousandth of an interval apart, and the samples are held in memory at once.
 */
const MAX_SUBDIVISIONS = 10_000;
/**
 * Most Brent iterations per root `solveOperatingPoint` takes (count; engine bound): Brent converges in tens of steps and
 * falls back to bisection (see roots.ts), so a cap past 10 000 only hides a typo (NaN, Infinity or 2.5 were taken before).
 */
const MAX_ITERATIONS = 10_000;

/** Share of the curve's last published flow (dimensionless) from which an operating point is at its runout end: 98 % (common practice, from memory). */
export const RUNOUT_SHARE = 0.98;

/**
 * Pump head − system head at the pump curve's last point, with the last-point rule: heads apart by at most LAST_POINT_MATCH
 * of the pump's head are rounding (a system curve drawn through the last published point computes an ulp or two off it),
 * and the curves meet there (0): above, the pump would otherwise be said to run past its curve; below, the crossing would
 * land an ulp short of the point. The one rule of `solveOperatingPoint` and the charts' `crossingOf`.
 * With `past`, also a crossing past the last point by no more than LIMIT_ROUNDING of its flow (limitText.ts: within it a
 * value is at its limit, and prints as it) is a meeting there: the pump's head above the system's by no more than the
 * system gains on it over that flow (nothing is read past the end).
 * @param pumpHead the pump's head at its curve's last flow, m (or any one head unit)
 * @param systemHead the system's head at that flow, same unit
 * @param past the curve's last flow (m³/s, or any unit) and `gains`, the system's slope less the curve's end slope there,
 *   read just inside the curve (m per m³/s, or the same units)
 * @returns pumpHead − systemHead (dimension of the heads), 0 where they differ by rounding only or meet within LIMIT_ROUNDING past
 */
export function lastPointGap(pumpHead: number, systemHead: number, past?: { flow: number; gains: number }): number {
  requireFinite("pumpHead", pumpHead);
  requireFinite("systemHead", systemHead);
  const gap = pumpHead - systemHead;
  if (Math.abs(gap) <= LAST_POINT_MATCH * Math.abs(pumpHead)) return 0;
  if (past && gap > 0 && past.gains > 0 && past.flow > 0 && gap <= past.gains * LIMIT_ROUNDING * past.flow) return 0;
  return gap;
}

/**
 * Pump head − system head at the pump curve's first point, with the first-point rule, the last point's mirrored: heads apart
 * by at most LAST_POINT_MATCH of the pump's head are rounding, and they meet there; with `before`, a crossing before the
 * first point by no more than LIMIT_ROUNDING of its flow (a curve published from a flow above zero) is a meeting there too:
 * the pump's head below the system's by no more than the system gains on the curve's start slope over that flow (nothing is
 * read before the start). At zero flow there is no such allowance (no flow lies before it). The one rule of
 * `solveOperatingPoint` and the charts' `crossingOf`.
 * @param pumpHead the pump's head at its curve's first flow, m (or any one head unit)
 * @param systemHead the system's head at that flow, same unit
 * @param before the curve's first flow (m³/s, or any unit) and `gains`, the system's slope less the curve's start slope
 *   there, read just inside the curve (m per m³/s, or the same units)
 * @returns pumpHead − systemHead (dimension of the heads), 0 where they differ by rounding only or meet within LIMIT_ROUNDING before
 */
export function firstPointGap(pumpHead: number, systemHead: number, before?: { flow: number; gains: number }): number {
  requireFinite("pumpHead", pumpHead);
  requireFinite("systemHead", systemHead);
  const gap = pumpHead - systemHead;
  if (Math.abs(gap) <= LAST_POINT_MATCH * Math.abs(pumpHead)) return 0;
  if (before && gap < 0 && before.gains > 0 && before.flow > 0 && -gap <= before.gains * LIMIT_ROUNDING * before.flow) return 0;
  return gap;
}


function solveInner(
  curve: PumpCurve | PumpCurveInput,
  systemHead: (flow: number) => number,
  options: { subdivisions?: number; maxIterations?: number },
): OperatingPointResult {
  const c = ensurePumpCurve(curve);
  if (typeof systemHead !== "function") throw new EngineInputError("systemHead", "must be a function of flow");
  // Samples per interval: a whole number 1–MAX_SUBDIVISIONS (more gains nothing and only costs memory and time).
  const sub = requireInteger("subdivisions", options.subdivisions ?? 8, 1);
  if (sub > MAX_SUBDIVISIONS) throw new EngineInputError("subdivisions", `must be at most ${MAX_SUBDIVISIONS} (got ${sub})`);
  const maxIt = requireInteger("maxIterations", options.maxIterations ?? 100, 1);
  if (maxIt > MAX_ITERATIONS) throw new EngineInputError("maxIterations", `must be at most ${MAX_ITERATIONS} (got ${maxIt})`);
  const g = (q: number) => {
    const hs = systemHead(q);
    requireFinite("systemHead(flow)", hs);
    return (evalCubic(c.head, q) as number) - hs;
  };
  const knots = c.head.x;
  const qs: number[] = [];
  for (let i = 0; i < knots.length - 1; i++) {
    for (let j = 0; j < sub; j++) qs.push(knots[i] + ((knots[i + 1] - knots[i]) * j) / sub);
  }
  qs.push(knots[knots.length - 1]);
  const gs = qs.map(g);
  // At the curve's last point, a pump head above the system's by rounding only (a system curve drawn through the last
  // published point computes an ulp or two below it: 30.509999999999998 m against 30.51 m) is a meeting there, not a
  // pump running past its curve: within LAST_POINT_MATCH of the head the curves meet at the last point.
  const lastI = gs.length - 1;
  // A crossing past the last point by no more than LIMIT_ROUNDING of its flow is a meeting there too, not a pump running
  // past its curve (lastPointGap's `past`): the system's slope less the curve's end slope, read just inside the curve.
  const qL = qs[lastI], dq = Math.min(qL * 1e-6, qL - qs[Math.max(0, lastI - 1)]);
  const gains = dq > 0 ? (systemHead(qL) - systemHead(qL - dq)) / dq - c.head.m[c.head.m.length - 1] : 0; // m per m³/s
  gs[lastI] = lastPointGap(evalCubic(c.head, qL) as number, systemHead(qL), Number.isFinite(gains) ? { flow: qL, gains } : undefined);
  // The same at the first point, mirrored (firstPointGap): a crossing before a first flow above zero by no more than
  // LIMIT_ROUNDING of it is a meeting there (before, 1e-8 of the first flow before it read "cannot start").
  const q0 = qs[0], dq0 = Math.min(q0 * 1e-6, qs[1] - q0);
  const gains0 = dq0 > 0 ? (systemHead(q0 + dq0) - systemHead(q0)) / dq0 - c.head.m[0] : 0; // m per m³/s
  if (Number.isFinite(gains0)) gs[0] = firstPointGap(evalCubic(c.head, q0) as number, systemHead(q0), { flow: q0, gains: gains0 });
  // The meetings (meetings.ts, the charts' rule too): crossings, touches, and stretches where the curves coincide (their
  // heads within TOUCH_GAP of the pump's over COINCIDE_SHARE of the published flows or more; before, equal to 1e-12 on two
  // samples in a row, however short, and a long stretch within 1e-8 but not 1e-12 was one "touch").
  const { roots, afterSign, fromRest, iterations } = meetingsOf({ g, qs, gs, pumpHead: (q) => evalCubic(c.head, q) as number, xtol: 1e-13 * c.flowMax, maxIt });
  const points = roots.map((r) => ({ flow: r.x, head: evalCubic(c.head, r.x) as number }));
  const first = { flow: qs[0], pumpHead: evalCubic(c.head, qs[0]) as number, systemHead: systemHead(qs[0]) };
  const lastQ = qs[qs.length - 1];
  const last = { flow: lastQ, pumpHead: evalCubic(c.head, lastQ) as number, systemHead: systemHead(lastQ) };
  const warnings: EngineWarning[] = [...c.warnings];
  const [pumpFirst, systemFirst] = qtPair("head", first.pumpHead, first.systemHead); // never read as equal beside "below"
  const lastText = qtPair("head", last.pumpHead, last.systemHead).join(" against the system's ");
  const listText = (idx: number[]) => idx.map((i) => {
    const r = roots[i], at = `${qt("flow", points[i].flow)} (${qt("head", points[i].head)})`;
    return r.xEnd !== undefined ? `the stretch from ${at} to ${qt("flow", r.xEnd)} where they coincide` : r.kind === "touch" ? `${at}, where they touch` : at;
  }).join(", ");
  // Where a pump flowing past an unstable crossing ends: the next stable crossing above it, or past the curve's end.
  const runsOnTo = (i: number) => {
    const k = roots.findIndex((r, j) => j > i && afterSign[j] < 0);
    return k >= 0 ? `to the crossing at ${listText([k])}` : `past the published curve's end (at its last point the pump still gives ${lastText})`;
  };
  const unstableText = (i: number, which = `the crossing at ${listText([i])}`) =>
    `${which} is unstable: the pump's head rises above the system's again past it, so a pump pushed past it runs on ${runsOnTo(i)}`;
  // Common practice (from memory): a pump starts against a closed check valve from rest, so its head at zero flow (the
  // shut-off head) must exceed the system's head there; below it the valve never opens, whatever crossings lie further out.
  // A stretch where the curves coincide, and a touch from above, are where a pump flowing up to them stops (meetings.ts).
  if (fromRest === "cannot-start") {
    const all = roots.map((_, i) => i);
    const unreached = `the curves ${roots.every((r) => r.kind === "cross") ? "cross" : "meet"} at ${listText(all)}, which it never reaches from rest${afterSign[0] > 0 ? `; ${unstableText(0, roots.length > 1 ? "the first" : "that crossing")}` : ""}`;
    const crossings = `; ${unreached}`;
    return { status: "no-intersection-shutoff-below-static", flow: null, head: null, points, method: null, iterations,
      atFirstPoint: first, atLastPoint: last, warnings, ...(roots.length ? { unreached } : {}),
      message: c.shutoffHead !== null
        ? `Shutoff head ${pumpFirst} is below the system head ${systemFirst} at zero flow: the pump cannot open its check valve${roots.length ? crossings : " and cannot deliver into this system"}`
        : `At the curve's first published point, ${qt("flow", first.flow)}, the pump's head ${pumpFirst} is below the system head there (${systemFirst})${roots.length ? `: the published curve does not show the pump starting from rest (its shut-off head is not published)${crossings}` : " and the curves never meet"}` };
  }
  // From rest (pump head above the system's at the first point, or equal and falling below it) the flow rises to the first
  // crossing where the pump's head falls under the system's: the point it settles at. A start exactly at equal heads with the
  // pump's head rising above the system's next is no settling point: the flow moves on.
  if (fromRest === "beyond-curve-end") {
    return { status: "beyond-curve-end", flow: null, head: null, points, method: null, iterations,
      atFirstPoint: first, atLastPoint: last, warnings,
      message: `At the curve's last published point, ${qt("flow", last.flow)}, the pump still gives ${qtPair("head", last.pumpHead, last.systemHead).join(" against ")}: it would run out past the end of its published curve (the curves meet further out, where it has no data)` };
  }
  const chosenAt = fromRest; // a sign of 0 past it: nothing sampled past it (the curve's last point)
  const chosen = roots[chosenAt];
  const op = points[chosenAt];
  // Curves that coincide over a stretch (common practice, from memory): no single operating point; the pump may run at
  // any flow on the stretch and drifts along it. Said with the stretch's flows and head; no flow or head reported.
  if (chosen.xEnd !== undefined) {
    const stretch = { flowFrom: chosen.x, flowTo: chosen.xEnd, head: op.head, share: chosen.share ?? 0 };
    return { status: "coincident", flow: null, head: null, points, method: null, iterations, atFirstPoint: first, atLastPoint: last,
      warnings, stretch,
      message: `The pump and system curves coincide from ${qt("flow", stretch.flowFrom)} to ${qt("flow", stretch.flowTo)} at ${qt("head", stretch.head)} (${coincideRuleText(stretch.share)}): the operating point is undefined — the pump may run at any flow on that stretch and drifts along it; change the system or the pump so the curves cross` };
  }
  if (chosen.kind === "touch") {
    warnings.push({ code: "touching-curves",
      message: `the pump and system curves touch at ${qt("flow", op.flow)} (${qt("head", op.head)}) without crossing (${coincideRuleText(chosen.share ?? 0)}): one operating point, but a marginal one — a system head slightly lower and they part, the flow running on ${runsOnTo(chosenAt)}; slightly higher and they cross twice near it` });
  }
  // A sign change that is a jump, not a crossing: the system curve steps there (Darcy friction goes from 64/Re
  // to the turbulent correlation at Re 2000, see headLoss.ts), and the pump's head lies inside the step. The
  // curves never meet; the flow there is unsettled. Said with the numbers, the point kept (the best estimate).
  if (Math.abs(chosen.fx) > 1e-6 * Math.max(1, Math.abs(op.head))) { // fx: pump − system head at the root
    const d = Math.max(op.flow * 1e-9, 1e-15);
    warnings.push({ code: "system-curve-jump",
      message: `the pump and system curves do not meet at ${qt("flow", op.flow)}: the system's head jumps there from ${qt("head", systemHead(op.flow - d))} to ${qt("head", systemHead(op.flow + d))} (friction at the laminar–turbulent change) and the pump's ${qt("head", op.head)} lies between; the flow will not settle steadily near this point` });
  }
  // Runout: at or past 98 % of the last published flow to 1 part in 10⁸ (pastBelow; before, none: 1e-12 either side flipped it).
  const runoutFrom = c.flowMax * RUNOUT_SHARE;
  if (c.flowMax > 0 && !pastBelow(op.flow, runoutFrom)) {
    warnings.push({ code: "near-curve-end", message: `operating point at ${qtExact("flow", op.flow, [runoutFrom])} is at the far end of the published curve (runout): at or past ${fmtPctLimit(RUNOUT_SHARE)} of its last published flow ${qt("flow", c.flowMax)}, ${qtLimit("flow", runoutFrom, [op.flow])} (to 1 part in 10⁸)` });
  }
  // Dead-head (common practice, from memory): at zero flow the pump only churns the liquid, which heats; pumps have a
  // minimum continuous flow (the maker's), and running below it damages them.
  const deadHead = op.flow === 0;
  if (deadHead) {
    warnings.push({ code: "dead-head",
      message: `no flow: the pump's shut-off head ${qt("head", op.head)} only balances the system's ${qt("head", systemHead(0))} at zero flow, so it runs against the closed check valve (dead-head), churning and heating the liquid; a pump must not run below its minimum continuous flow (the maker's figure)` });
  }
  const unstable = roots.map((_, i) => i).filter((i) => i > chosenAt && roots[i].kind === "cross" && afterSign[i] > 0);
  for (const i of unstable) warnings.push({ code: "unstable-crossing", message: unstableText(i) });
  if (points.length > 1) {
    return { status: "multiple", flow: op.flow, head: op.head, points, method: chosen.method, iterations,
      atFirstPoint: first, atLastPoint: last, warnings,
      message: `${points.length} intersections (drooping curve): from rest the pump settles at the first where its head ${chosen.kind === "touch" ? "no longer exceeds" : "falls below"} the system's, ${listText([chosenAt])}, reported${unstable.length ? `; ${unstableText(unstable[0])}` : "; operation may be unstable"}` };
  }
  return { status: "ok", flow: op.flow, head: op.head, points, method: chosen.method, iterations,
    atFirstPoint: first, atLastPoint: last, warnings,
    message: deadHead ? `Operating point at zero flow: the shut-off head equals the system's head there (dead-head), no delivery` : "Operating point found" };
}

/**
 * Operating point of a pump curve in a full system (see system.ts).
 * @param curve pump curve (prepared or raw; SI)
 * @param system system spec or prepared system (SI)
 * @param which level ("min" | "max" | "nominal") and pipe condition ("new" | "aged") (unitless)
 */
export function operatingPointInSystem(
  curve: PumpCurve | PumpCurveInput,
  system: SystemSpec | PreparedSystem,
  which: SystemCase = {},
): OperatingPointResult {
  return solveOperatingPoint(curve, systemHeadFunction(system, which));
}

/** A simple system for {@link operatingPoint}: static head plus pipe segments in series, water. */
export interface SimpleSystem {
  /** Static head, m. */
  staticHead: number;
  /** Pipe segments in series. */
  segments: readonly { length: number; diameter: number; roughness: number; minorK?: number }[];
  /** Water temperature, °C. */
  temperatureC: number;
}

/**
 * Operating point of a pump (points flow m³/s, head m) against a simple water system.
 * @param pumpPoints curve points (flow m³/s, head m, optional efficiency fraction, power W, NPSHr m)
 * @param system.staticHead static head, m
 * @param system.segments pipe segments (length m, diameter m, roughness m, minorK dimensionless)
 * @param system.temperatureC water temperature, °C
 */
export function operatingPoint(pumpPoints: readonly PumpPoint[], system: SimpleSystem): OperatingPointResult {
  if (!system || typeof system !== "object") throw new EngineInputError("system", "is required");
  const curve = createPumpCurve({ points: pumpPoints });
  const fluid = fluidAt({ kind: "water" }, system.temperatureC);
  if (!Array.isArray(system.segments)) throw new EngineInputError("system.segments", "must be an array");
  const prepared = prepareSystem({ fluid, staticHead: system.staticHead, discharge: system.segments.map((s) => ({ ...s })) });
  return solveOperatingPoint(curve, systemHeadFunction(prepared));
}
