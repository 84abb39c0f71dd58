// PumpCurve `drooping` (the solver's start from rest, the `drooping-curve` warning, the duty cycle's step notes) is any
// head above the first point's, compared exactly: before, a head up to 1 part in 10⁹ above it was not drooping (a bare
// slack with no rounding to absorb: the heads compared are the points' own). Deliberately wider than the importer's
// warning, which is a plausibility judgement past its 5 % rounding rise (point-rules.ts RISE_FRACTION × (1 + 1e-6)): a
// 41 m hump over 40 m is imported without a warning, and the engine still says why no point is reached from rest
// above 40 m (app/lib/projects/search-start.server.test.ts's 4.75 % pump). Check values: invented curves (not any
// maker's), 40 m at shut-off; 5 % of 40 m = 2 m (arithmetic).
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, solveOperatingPoint, type PumpPoint } from "../../engine";
import { importHeadShape } from "./point-rules";
import { M3H } from "../../engine/test/curves.ts";

// [m³/h, m, efficiency]: 40 m at shut-off, a peak of `peak` m at 18 m³/h, then falling — invented.
const humped = (peak: number): PumpPoint[] =>
  ([[0, 40, 0], [18, peak, 0.45], [36, 39, 0.62], [60, 36, 0.72], [90, 29, 0.74], [120, 20, 0.65]] as const).map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e }));
const droopAt = (peak: number, riseTolerance?: number) => createPumpCurve({ points: humped(peak), riseTolerance }).drooping;
const importerWarns = (peak: number) => {
  const pts = humped(peak);
  const s = importHeadShape(pts[0].head, pts[0].flow, 1);
  pts.slice(1).forEach((p, i) => { expect(s.judge(p.head)).toBeNull(); s.take(p.head, p.flow, i + 2); });
  return s.drooping; // curve-sequence.ts: the `drooping-curve` warning
};

describe("drooping: any head above the first, exactly, at the engine's 10 % and the app's 100 % allowance", () => {
  it.each([
    ["level at 40 m", 40, false, false],
    ["5e-10 relative above 40 m (the old slack took it as level)", 40 * (1 + 5e-10), true, false],
    ["a 2.5 % hump (41 m): drooping; the importer takes it as rounding", 41, true, false],
    ["a 15 % droop (46 m): both", 46, true, true],
  ])("%s", (_, peak, drooping, importer) => {
    expect(droopAt(peak)).toBe(drooping); // riseTolerance 10 % (default)
    expect(droopAt(peak, 1)).toBe(drooping); // the app's own curves
    expect(importerWarns(peak)).toBe(importer);
  });

  it("a hump within the importer's rounding still decides the verdict from rest, and its warning says why", () => {
    const curve = createPumpCurve({ points: humped(41), riseTolerance: 1 });
    expect(solveOperatingPoint(curve, () => 40.5).flow).toBeNull(); // 40.5 m static above the 40 m shut-off: no point from rest
    expect(curve.warnings.filter((w) => w.code === "drooping-curve")).toHaveLength(1);
    // constant pressure at 36 m, a step at 10 m³/h, left of the hump's 18 m³/h at full speed (and slowed)
    const r = dutyCycleEnergy({ curve, systemHead: (q) => 10 + (26 * q * q) / (80 * M3H) ** 2, designFlow: 80 * M3H, mode: "constant-pressure",
      profile: [{ flowFraction: 0.125, hours: 1000 }], density: 1000, motor: { rating: 15000, efficiency: 0.9 }, driveEfficiency: 0.97 });
    expect(r.warnings.filter((w) => w.code === "step-rising-branch")).toHaveLength(1);
  });
});
