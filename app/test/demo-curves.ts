// The demo libraries' curves (invented, fixtures/demo/generate.ts) for property sweeps, and one of them as a curve set
// in SI as stored (m³/s, m, fraction, W, m), the shape `evaluateCandidate` takes. Pure.
import { generateDemo, type DemoCurve } from "../../fixtures/demo/generate";
import type { CurvePointsIn } from "~/lib/projects/hydraulics";

export type { DemoCurve };

const M3H = 1 / 3600;

/** Every curve of every demo library, generated once. */
export const demoCurves: DemoCurve[] = generateDemo().flatMap((d) => d.curves);

/** A demo curve as a curve set in SI (points as stored; the maker's minimum flow where the demo records one, else null). */
export function demoCurveSI(c: DemoCurve): { points: CurvePointsIn; speed: number; impellerDiameter: number; minFlow: number | null } {
  return {
    speed: c.speed,
    minFlow: c.minFlowM3h != null ? c.minFlowM3h * M3H : null,
    impellerDiameter: c.impellerMm / 1000,
    points: c.points.map((p) => ({ flow: p.flowM3h * M3H, head: p.headM, efficiency: p.effPct / 100, power: p.powerKw * 1000, npshr: p.npshrM })),
  };
}
