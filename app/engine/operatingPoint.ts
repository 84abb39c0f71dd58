/**
 * Operating point: where pump head equals system head. The difference g(Q) = H_pump(Q) −
 * H_system(Q) is sampled over the curve (each curve interval split into equal parts) to
 * bracket every sign change, then each bracket is solved with Brent's method (Brent 1973;
 * iteration cap, bisection as the named fallback — see roots.ts). Every outcome is named:
 * - `ok`: one intersection;
 * - `multiple`: several (drooping curve); all are listed, the highest-flow one is reported
 *   as the operating point (the stable one on the falling part of the curve);
 * - `no-intersection-shutoff-below-static`: the pump's head at its first point is already
 *   below the system head there (for a curve starting at zero flow: shutoff head below the
 *   static head), and the curves never meet;
 * - `beyond-curve-end`: pump head still exceeds system head at the last point — the pump
 *   would run out past the end of its published curve.
 * A reported point where the curves do not actually meet (the system curve jumps across the pump's head,
 * as Darcy friction does at Re 2000) carries the warning `system-curve-jump` with both heads.
 */
import { EngineInputError, requireFinite, requireFiniteResult, requireInteger, type EngineWarning } from "./errors.ts";
import { evalCubic } from "./interp.ts";
import { createPumpCurve, ensurePumpCurve, type PumpCurve, type PumpCurveInput, type PumpPoint } from "./pumpCurve.ts";
import { brent } from "./roots.ts";
import { fluidAt } from "./fluids.ts";
import { prepareSystem, systemHeadFunction, type PreparedSystem, type SystemCase, type SystemSpec } from "./system.ts";
import { qt, qtPair } from "./quantityText.ts";

export type OperatingStatus = "ok" | "multiple" | "no-intersection-shutoff-below-static" | "beyond-curve-end";

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
  warnings: EngineWarning[];
}

/**
 * Solves pump curve against a system head function H_sys(Q).
 * @param curve pump curve (prepared or raw; flow m³/s, head m)
 * @param systemHead function flow m³/s → system head m
 * @param options.subdivisions samples per curve interval for bracketing (count, dimensionless; a whole number 1–10 000, default 8)
 * @param options.maxIterations Brent iteration cap per root (count, dimensionless; default 100)
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
  const maxIt = Math.max(1, Math.round(options.maxIterations ?? 100));
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
  const roots: { x: number; fx: number; method: "brent" | "bisection"; iterations: number }[] = [];
  const xtol = 1e-13 * c.flowMax;
  let iterations = 0;
  for (let i = 0; i < qs.length; i++) {
    if (gs[i] === 0) {
      roots.push({ x: qs[i], fx: 0, method: "brent", iterations: 0 });
      continue;
    }
    if (i < qs.length - 1 && gs[i] * gs[i + 1] < 0) {
      const r = brent(g, qs[i], qs[i + 1], xtol, maxIt);
      if (r) {
        roots.push({ x: r.x, fx: r.fx, method: r.method, iterations: r.iterations });
        iterations += r.iterations;
      }
    }
  }
  const points = roots.map((r) => ({ flow: r.x, head: evalCubic(c.head, r.x) as number }));
  const first = { flow: qs[0], pumpHead: gs[0] + systemHead(qs[0]), systemHead: systemHead(qs[0]) };
  const lastQ = qs[qs.length - 1];
  const last = { flow: lastQ, pumpHead: evalCubic(c.head, lastQ) as number, systemHead: systemHead(lastQ) };
  const warnings: EngineWarning[] = [...c.warnings];
  if (points.length === 0) {
    const [pumpFirst, systemFirst] = qtPair("head", first.pumpHead, first.systemHead); // never read as equal beside "below"
    if (gs[0] < 0) {
      return { status: "no-intersection-shutoff-below-static", flow: null, head: null, points, method: null, iterations,
        atFirstPoint: first, atLastPoint: last, warnings,
        message: c.shutoffHead !== null
          ? `Shutoff head ${pumpFirst} is below the system head ${systemFirst} at zero flow: the pump cannot deliver into this system`
          : `Pump head at its first point (${pumpFirst}) is below the system head there (${systemFirst}) and the curves never meet` };
    }
    return { status: "beyond-curve-end", flow: null, head: null, points, method: null, iterations,
      atFirstPoint: first, atLastPoint: last, warnings,
      message: `At the last curve point the pump still gives ${qtPair("head", last.pumpHead, last.systemHead).join(" against ")}: it would run out past the end of its published curve` };
  }
  const chosen = roots[roots.length - 1];
  const op = points[points.length - 1];
  // A sign change that is a jump, not a crossing: the system curve steps there (Darcy friction goes from 64/Re
  // to the turbulent correlation at Re 2000, see headLoss.ts), and the pump's head lies inside the step. The
  // curves never meet; the flow there is unsettled. Said with the numbers, the point kept (the best estimate).
  if (Math.abs(chosen.fx) > 1e-6 * Math.max(1, Math.abs(op.head))) { // fx: pump − system head at the root
    const d = Math.max(op.flow * 1e-9, 1e-15);
    warnings.push({ code: "system-curve-jump",
      message: `the pump and system curves do not meet at ${qt("flow", op.flow)}: the system's head jumps there from ${qt("head", systemHead(op.flow - d))} to ${qt("head", systemHead(op.flow + d))} (friction at the laminar–turbulent change) and the pump's ${qt("head", op.head)} lies between; the flow will not settle steadily near this point` });
  }
  if (op.flow >= c.flowMax * 0.98 && c.flowMax > 0) {
    warnings.push({ code: "near-curve-end", message: "operating point is at the far end of the published curve (runout)" });
  }
  if (points.length > 1) {
    return { status: "multiple", flow: op.flow, head: op.head, points, method: chosen.method, iterations,
      atFirstPoint: first, atLastPoint: last, warnings,
      message: `${points.length} intersections (drooping curve): operation may be unstable; the highest-flow one is reported` };
  }
  return { status: "ok", flow: op.flow, head: op.head, points, method: chosen.method, iterations,
    atFirstPoint: first, atLastPoint: last, warnings, message: "Operating point found" };
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
  const sys = "fixedHead" in system && "static" in system ? system : prepareSystem(system as SystemSpec);
  return solveOperatingPoint(curve, systemHeadFunction(sys, which));
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
