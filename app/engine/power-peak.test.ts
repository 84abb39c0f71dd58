// The motor's overload verdict at the curve's power peak (helper "verdictaudit"). A curve with an efficiency column and no
// power column gives its shaft power as ρ·g·Q·H/η (pumpCurve.ts `shaftPowerAt`), whose peak can fall between any two flows
// the check looks at: before, `maxShaftPower` took the largest of the knots and 200 evenly spaced samples, 6.2 parts in 10⁶
// under the peak on the curve below (13 387.61 W at 151.2 m³/h, the peak 13 387.69 W at 151.59 m³/h), so a motor limit
// between the two was called "non-overloading" when the pump takes more at 151.6 m³/h. The peak is now solved
// (golden-section search about each sampled local maximum within 1e-3 of the largest). Check values: the peak of the engine's own interpolant found by
// a scan of 10⁶ evenly spaced flows (independent of the search; its spacing, 2.1e-4 m³/h, puts it within 1e-9 of the peak's
// power); the rule "within motor rating × service factor, to 1 part in 10⁸" (motor.ts `limitCovers`, common practice);
// the curve is invented (the shape of a non-overloading end-suction curve, from memory), and every demo curve set
// (fixtures/demo, invented) as published and with its power column left out.
import { describe, expect, it } from "vitest";
import { COVERS_SLACK } from "./motor.ts";
import { createPumpCurve, maxShaftPower, overloadCheck, shaftPowerAt, type PumpCurve } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";

const M3H = 1 / 3600; // m³/s per m³/h
const RHO = 998.2; // kg/m³, water at 20 °C (IAPWS-95, as the demo data)

/** The largest shaft power among `n + 1` evenly spaced flows of the curve, W, and its flow, m³/s (the scan: the check value). */
function scanPeak(c: PumpCurve, n: number): { power: number; flow: number } {
  let best = { power: -Infinity, flow: NaN };
  for (let i = 0; i <= n; i++) {
    const q = i === n ? c.flowMax : c.flowMin + ((c.flowMax - c.flowMin) * i) / n; // the last flow exactly (not an ulp past it)
    const p = shaftPowerAt(c, q, RHO);
    if (p !== null && p > best.power) best = { power: p, flow: q };
  }
  return best;
}

// Invented: m³/h, m, efficiency (fraction); no power column, so power is ρgQH/η, peaking between 140 and 210 m³/h.
const PEAKED = createPumpCurve({ points: [[0, 40, 0], [70, 37, 0.62], [140, 28, 0.8], [210, 12, 0.66]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e })) });

describe("the largest power on a curve is its peak, not the largest sample", () => {
  const peak = scanPeak(PEAKED, 1_000_000);
  it("the peak of ρgQH/η between samples (13 387.69 W at 151.59 m³/h by the scan)", () => {
    expect(peak.power).toBeCloseTo(13387.694, 2); // the scan (check value), as found when this test was written
    const m = maxShaftPower(PEAKED, RHO)!;
    // Old code: 13 387.61 W at 151.2 m³/h, 6.2e-6 under the scan's peak.
    expect((peak.power - m.power) / peak.power).toBeLessThan(1e-9);
    expect(Math.abs(m.flow - peak.flow)).toBeLessThan(1e-3 * M3H);
  });
  it("a motor limit a hair under the peak can overload; at the peak, or a rounding error under it, it cannot", () => {
    const m = maxShaftPower(PEAKED, RHO)!;
    // Between the old sample's 13 387.61 W and the peak's 13 387.69 W: called non-overloading before.
    for (const k of [1e-6, 5e-6, 2 * COVERS_SLACK]) {
      const v = overloadCheck(m, peak.power * (1 - k));
      expect(v.nonOverloading, `limit = peak × (1 − ${k})`).toBe(false);
      expect(inSI(v.text)).toMatch(/^can overload: largest power on the curve 13\.38\d* kW at 152 m³\/h exceeds motor rating × service factor 13\.38\d* kW$/);
    }
    for (const k of [0, COVERS_SLACK / 2]) expect(overloadCheck(m, peak.power * (1 - k)).nonOverloading, `limit = peak × (1 − ${k})`).toBe(true);
  });
});

describe("every demo curve set: the check's largest power is the scan's, and the verdict flips at it", () => {
  const cases = demoCurves.flatMap((d) => {
    const s = demoCurveSI(d);
    const name = `${d.model} ${d.speed} rpm Ø${d.impellerMm}`;
    const pts = s.points.map((p) => ({ flow: p.flow, head: p.head, efficiency: p.efficiency ?? undefined, power: p.power ?? undefined, npshr: p.npshr ?? undefined }));
    return [
      { name: `${name}, as published`, curve: createPumpCurve({ points: pts, riseTolerance: 1 }) },
      { name: `${name}, efficiency only`, curve: createPumpCurve({ points: pts.map(({ power: _p, ...rest }) => rest), riseTolerance: 1 }) },
    ];
  });
  it(`${cases.length} curves`, () => {
    const wrong: string[] = [];
    for (const { name, curve } of cases) {
      const peak = scanPeak(curve, 20_000);
      const m = maxShaftPower(curve, RHO)!;
      if (m.power < peak.power * (1 - 1e-9)) wrong.push(`${name}: ${m.power} W < scan ${peak.power} W`);
      if (overloadCheck(m, peak.power * (1 - 2 * COVERS_SLACK)).nonOverloading !== false) wrong.push(`${name}: not an overload 2e-8 under the peak`);
      // At the peak: within the limit — "non-overloading" where power is known over the whole curve, else not judged.
      const atPeak = overloadCheck(m, peak.power).nonOverloading;
      if (atPeak !== (m.toEnd && m.fromStart ? true : null)) wrong.push(`${name}: ${atPeak} at the peak`);
    }
    expect(wrong).toEqual([]);
  });
});
