// A candidate's pump as adjusted: the speed or impeller trim as set, or solved so one pump meets its share of the
// duty against the system's head at the duty flow at the band's demanding edge — on the system's liquid — then rounded
// up to what a site sets and the page shows (whole rpm, whole mm: setting-step.ts), the ratio every figure is judged at. Where the
// water curve is corrected for viscosity (ANSI/HI 9.6.7: viscosity-check.ts), the ratio is solved on the corrected
// curve: B changes with the speed and the BEP, so the correction is made again at each ratio tried. Pure: used by
// evaluateCandidate (hydraulics.ts) and the oversized verdict's savings (candidate-judgement.ts).
import { bisection, correctCurveForViscosity, headAt, scaleBySpeed, scaleByTrim, speedForDuty, trimForDuty, type PumpCurve, type RatioSolution } from "~/engine";
import { qt, qtPair } from "~/engine/quantityText";
import type { Adjustment } from "./candidate-input";
import type { Liquid } from "./viscosity-check";
import { roundUpSetting, roundingNote } from "./setting-step";

type Method = "speed" | "trim";

/** One pump on the liquid at a speed or trim ratio, and the ratio that meets a duty on it. */
export type LiquidSolver = {
  /** One pump's curve on the liquid at this ratio (corrected when the method allows, else the water curve scaled). */
  at: (method: Method, ratio: number) => PumpCurve;
  /**
   * The ratio that meets `duty` (one pump, m³/s and m) on the liquid, from the ratio found on water (`water`, ok): the
   * same when the curve is not corrected there; null when even the largest ratio (1) falls short on the liquid.
   */
  solve: (method: Method, duty: { flow: number; head: number }, water: RatioSolution) => number | null;
};

/**
 * The solver for one candidate's pump on a liquid; null for water or when no correction can apply (no speed).
 * @param base the pump's water curve as published
 * @param fluid the liquid (kinematic viscosity m²/s)
 * @param curveSpeed the curve's speed, rpm, null when it names none
 */
export function liquidSolver(base: PumpCurve, fluid: Liquid, curveSpeed: number | null): LiquidSolver | null {
  if (fluid.kind === "water" || curveSpeed == null) return null;
  const scaled = (method: Method, r: number) => (method === "speed" ? scaleBySpeed(base, r) : scaleByTrim(base, r)).curve;
  const corrected = (method: Method, r: number) => correctCurveForViscosity(scaled(method, r), { kinematicViscosity: fluid.kinematicViscosity, speed: curveSpeed * (method === "speed" ? r : 1) });
  return {
    at: (method, r) => corrected(method, r).curve,
    solve: (method, duty, water) => {
      if (water.status !== "ok" || water.ratio == null) return null;
      // Head short of the duty on the liquid: negative (a flow past the corrected curve's end is short too).
      const gap = (r: number) => {
        const c = corrected(method, r);
        if (c.status !== "corrected") return NaN;
        const h = duty.flow > c.curve.flowMax ? null : headAt(c.curve, duty.flow);
        return h === null ? -1 : h - duty.head;
      };
      const lo = water.ratio, atLo = gap(lo);
      if (!(atLo < 0)) return lo; // not corrected at the water ratio, or it already meets the duty there
      const atHi = gap(1);
      if (Number.isNaN(atHi) || atHi < 0) return null;
      return bisection(gap, lo, 1, 1e-10)?.x ?? null;
    },
  };
}

/** The ratio in use and how it was found, in words; `solved`: the ratio solved to the duty before it was rounded up (null when none was). */
export type AdjustedRatio = { ratio: number; note: string | null; warnings: string[]; solved?: number | null };

/**
 * The speed or trim ratio for a candidate: as set, or solved for one pump's share of the duty (parallel: the flow
 * shared; series: the head shared) against the system's head at the duty flow at the demanding edge.
 * @param base the pump's water curve as published
 * @param adj the adjustment (method, ratio or null to solve, arrangement, duty pumps)
 * @param duty the duty flow (m³/s) with the system's head there (m), its place in words, the typed duty head (m) and, where
 *   that head is ≤ 0, why in words with the parts (`noHeadClause`); null without a duty
 * @param liquid the solver on a viscous liquid, null on water
 */
export function adjustedRatio(base: PumpCurve, adj: Adjustment, duty: { flow: number; systemHead: number; edge: string; typedHead: number; noHead?: string | null } | null, liquid: LiquidSolver | null): AdjustedRatio {
  if (adj.method === "none") return { ratio: 1, note: null, warnings: [] };
  if (adj.ratio != null) return { ratio: adj.ratio, note: null, warnings: [] };
  if (!duty) return { ratio: 1, note: null, warnings: [] };
  const n = adj.arrangement === "single" ? 1 : adj.dutyPumps;
  const hSys = duty.systemHead;
  const perPump = adj.arrangement === "parallel" ? { flow: duty.flow / n, head: hSys } : adj.arrangement === "series" ? { flow: duty.flow, head: hSys / n } : { flow: duty.flow, head: hSys };
  const whereWith = (head: string) => `the system's head at the duty flow ${qt("flow", duty.flow)}, ${head} at ${duty.edge} (typed duty head ${qt("head", duty.typedHead)})`;
  const where = whereWith(qt("head", hSys));
  const full = adj.method === "trim" ? "impeller" : "speed";
  const pub = { speed: base.speed ?? null, impellerDiameter: base.impellerDiameter ?? null };
  // Downhill: no pump head is needed at the duty flow, so there is no speed or trim to solve for (the engine
  // refuses a duty head ≤ 0); the pump is judged as published, with the reason.
  // Its cause in words with the system's parts (duty-check.ts `noHeadClause`): gravity, the pressure difference or both.
  if (hSys <= 0) return { ratio: 1, warnings: [], note: `not solved: ${where} is not above zero (${duty.noHead ?? "the system needs no pump head there"}), so there is no head to ${adj.method === "trim" ? "trim" : "slow"} the pump to; judged at full ${full}` };
  const sol = adj.method === "speed" ? speedForDuty(base, perPump, { min: 0.3, max: 1 }) : trimForDuty(base, perPump);
  const warnings = sol.warnings.map((w) => w.message);
  // The solved ratio rounded up to a whole rpm or mm (setting-step.ts): the setting shown is the setting judged.
  const rounded = (r: number, how: string): AdjustedRatio => {
    const set = roundUpSetting(adj.method as "speed" | "trim", r, pub);
    return { ratio: set.ratio, solved: r, warnings, note: `${how}; ${roundingNote(adj.method as "speed" | "trim", set, pub)}` };
  };
  if (sol.status === "ok" && sol.ratio) {
    if (!liquid) return rounded(sol.ratio, `solved to deliver the duty flow against ${where}`);
    const r = liquid.solve(adj.method, perPump, sol);
    if (r === null) return { ratio: 1, warnings, note: `could not be solved on the curve corrected for viscosity (ANSI/HI 9.6.7): ${where} is above what the ${adj.method === "trim" ? "untrimmed impeller" : "pump at full speed"} gives on the liquid (on water ${adj.method === "trim" ? "a trim" : "a speed"} of ${(sol.ratio * 100).toFixed(1)} % would do); judged at full ${full}` };
    return rounded(r, r === sol.ratio ? `solved to deliver the duty flow against ${where}` : `solved on the curve corrected for viscosity (ANSI/HI 9.6.7) to deliver the duty flow against ${where} (on water: ${(sol.ratio * 100).toFixed(1)} %)`);
  }
  if (sol.status === "duty-above-curve") {
    const h1 = perPump.flow >= base.flowMin && perPump.flow <= base.flowMax ? headAt(base, perPump.flow) : null;
    // Where one pump must give the system's head (single, parallel), the two read apart: never "30.0 m is above … (30.0 m per pump)".
    const [needs, gives] = h1 != null && perPump.head === hSys ? qtPair("head", hSys, h1) : [qt("head", hSys), h1 != null ? qt("head", h1) : ""];
    return { ratio: 1, warnings, note: `could not be solved: ${whereWith(needs)} is above what the ${adj.method === "trim" ? "untrimmed impeller" : "pump at full speed"} gives${h1 != null ? ` (${gives} per pump at ${qt("flow", perPump.flow)})` : ""}; ${adj.method === "trim" ? "trimming" : "slowing down"} cannot raise it` };
  }
  return { ratio: 1, warnings, note: `could not be solved against ${where}: ${sol.message}` };
}
