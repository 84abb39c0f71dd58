// An efficiency above 100 % at the operating point is said there (helper "verdictaudit"). A curve with a power column and no
// efficiency column gives its efficiency as ρ·g·Q·H/P (pumpCurve.ts `efficiencyAt`), the ratio of two interpolants, which
// can pass 100 % between published points that imply at most 100 %: on the curve below, 100.10 % at 155.2 m³/h (points
// imply 95 % at 100 m³/h, 100 % at 150, 90 % at 200), shown beside the candidate with no word (the curve's
// `efficiency-above-one` warning looks at the published points only). Check values: efficiency = ρ g Q H / P (its
// definition, common practice), ρ 1000 kg/m³ as the power column's basis (pumpCurve.ts `powerDensity`), g 9.80665 m/s²
// (CGPM 1901); the curve is invented. Each side of 100 %: at it (the published point), just past the allowance, under it.
import { describe, expect, it } from "vitest";
import { createPumpCurve, efficiencyAt, fluidAt, operatingFigures } from "./index.ts";
import { LIMIT_ROUNDING } from "./quantityText.ts";

const M3H = 1 / 3600; // m³/s per m³/h
const G = 9.80665, RHO = 1000;
const Q = [0, 50, 100, 150, 200], H = [40, 38, 34, 27, 17], ETA = [0, 0.7, 0.95, 1.0, 0.9]; // invented
const CURVE = createPumpCurve({ points: Q.map((q, i) => ({ flow: q * M3H, head: H[i], power: i === 0 ? 3000 : (RHO * G * q * M3H * H[i]) / ETA[i] })) });
const WATER = fluidAt({ kind: "water" }, 20); // the engine's water table (IAPWS, fluids.ts)
const above = (flow: number) => operatingFigures({ curve: CURVE, flow, fluid: WATER }).warnings.filter((w) => w.code === "efficiency-above-one");

describe("efficiency above 100 % between published points", () => {
  it("control: 100.10 % at 155.2 m³/h (the ratio of the interpolants), 100 % at the published 150 m³/h", () => {
    expect(efficiencyAt(CURVE, 155.218 * M3H)!).toBeCloseTo(1.00099, 5); // found by a scan of 10⁵ flows when written
    expect(efficiencyAt(CURVE, 150 * M3H)!).toBeCloseTo(1, 12);
  });
  it("at 155.2 m³/h the figures say it (100.1 %), with the number apart from 100 %; at 150 m³/h (100 %) and at 100 m³/h (95 %) they do not", () => {
    const w = above(155.218 * M3H);
    expect(w).toHaveLength(1); // old code: none
    expect(w[0].message).toBe("efficiency at this flow is 100.1 %, above 100 %: the curve's power column gives less shaft power than the hydraulic power ρ·g·Q·H here; check the power column and its units");
    expect(above(150 * M3H)).toEqual([]);
    expect(above(100 * M3H)).toEqual([]);
  });
  it("the flip: the flow where the efficiency crosses 100 % by more than 1 part in 10⁸, either side", () => {
    // Bisect the flow where efficiency = 1 + LIMIT_ROUNDING between 150 and 155.2 m³/h.
    let lo = 150 * M3H, hi = 155.218 * M3H;
    for (let i = 0; i < 200; i++) { const mid = (lo + hi) / 2; if (efficiencyAt(CURVE, mid)! > 1 + LIMIT_ROUNDING) hi = mid; else lo = mid; }
    expect(above(lo)).toEqual([]);
    const w = above(hi * (1 + 1e-6));
    expect(w).toHaveLength(1);
    expect(Number(/is ([\d.]+) %, above/.exec(w[0].message)![1])).toBeGreaterThan(100); // printed apart from 100 %
  });
});
