// The frozen selection as a field check reads it: its shape (spelled out so the phone runs it without a server module),
// the tolerance grades by id, one pump's curve as selected and the curves sampled for the check's chart. Pure.
import { createPumpCurve, sampleCurve, scaleByTrim, TOLERANCE_GRADES, type PumpCurve, type ToleranceGrade } from "~/engine";
import { toPumpPoints, type Adjustment, type evaluateCandidate, type evaluateSystem, type SystemInput } from "../projects/hydraulics";
import type { Pt } from "./result";

/**
 * The parts of a frozen selection (projects' `FrozenSelection`, which fits this shape) that a check
 * reads: spelled out here so this module imports no server module and runs on the phone.
 */
export type FrozenSelection = {
  system: { input: SystemInput };
  systemCurve: ReturnType<typeof evaluateSystem> | null;
  pump: { label?: string; speed: number | null; impellerDiameter: number | null; points: Parameters<typeof toPumpPoints>[0] };
  adjustment: Adjustment;
  result: ReturnType<typeof evaluateCandidate>;
};

/** The tolerance grade of that id (ISO 9906 grades, `TOLERANCE_GRADES` in the engine), or null. */
export function gradeById(id: string): ToleranceGrade | null {
  return TOLERANCE_GRADES.find((g) => g.id === id) ?? null;
}

/** One pump's curve as selected (trim applied; speed ratio returned separately). */
export function selectedCurve(f: FrozenSelection): { base: PumpCurve; trimmed: PumpCurve; designRatio: number } {
  const base = createPumpCurve({ points: toPumpPoints(f.pump.points), speed: f.pump.speed ?? undefined, impellerDiameter: f.pump.impellerDiameter ?? undefined, riseTolerance: 1 });
  const ratio = f.result?.ratio ?? 1;
  if (f.adjustment.method === "trim" && ratio !== 1) return { base, trimmed: scaleByTrim(base, ratio).curve, designRatio: 1 };
  return { base, trimmed: base, designRatio: f.adjustment.method === "speed" ? ratio : 1 };
}

/** A curve sampled at 41 flows: its head and, where the curve has one, its efficiency (the check's chart). */
export function sampleForChart(c: PumpCurve, rho: number) {
  const s = sampleCurve(c, 41, rho);
  return {
    head: s.flows.map((q, i) => ({ flow: q, y: s.head[i] })),
    eff: s.flows.map((q, i) => ({ flow: q, y: s.efficiency[i] })).filter((p): p is Pt => p.y != null),
  };
}
