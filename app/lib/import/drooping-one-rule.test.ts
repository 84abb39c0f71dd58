// PumpCurve `drooping` is headShape.ts's rule (`droops`): a curve is drooping where its peak lies more than the tighter
// of its rise allowance and DROOP_FROM (5 %, the importer's rounding rise, × (1 + 1e-6)) above its first head. Before,
// any head above the first by 1 part in 10⁹ made it drooping, so a 2.5 % hump the importer takes as rounding (no
// warning) carried the engine's `drooping-curve` warning and the duty cycle's step notes. Check values: invented curves
// (not any maker's), 40 m at shut-off; 5 % of 40 m = 2 m (arithmetic).
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, type PumpPoint } from "../../engine";
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
const EDGE = 40 * (1 + 0.05 * (1 + 1e-6)); // 42.00004 m: engine headShape.ts DROOP_FROM 5 % × (1 + DROOP_FROM_SLACK 1e-6), ours

describe("drooping: a peak past the rounding rise, at the engine's 10 % and the app's 100 % allowance", () => {
  it.each([
    ["a 2.5 % hump (41 m), rounding", 41, false],
    ["exactly 5 % (42 m), rounding", 42, false],
    ["at the slack's end", EDGE, false],
    ["1e-6 relative past it", EDGE * (1 + 1e-6), true],
    ["a 15 % droop (46 m)", 46, true],
  ])("%s", (_, peak, drooping) => {
    expect(droopAt(peak)).toBe(drooping); // riseTolerance 10 % (default)
    expect(droopAt(peak, 1)).toBe(drooping); // the app's own curves
    expect(importerWarns(peak)).toBe(drooping); // the importer's warning says the same
  });

  it("an allowance tighter than 5 % is the shape's own: at 2 %, 0.8 m (arithmetic), a peak 1e-6 past it droops", () => {
    expect(droopAt(40.8 * (1 - 1e-6), 0.02)).toBe(false);
    expect(droopAt(40.8 * (1 + 1e-6), 0.02)).toBe(true);
  });

  it("a rounding hump gets no drooping-curve warning and no duty-cycle step note; a droop gets both", () => {
    for (const [peak, notes] of [[41, 0], [46, 1]] as const) {
      const curve = createPumpCurve({ points: humped(peak) });
      expect(curve.warnings.filter((w) => w.code === "drooping-curve")).toHaveLength(notes);
      // constant pressure at 36 m, a step at 10 m³/h, left of either hump's 18 m³/h at full speed (and slowed)
      const r = dutyCycleEnergy({ curve, systemHead: (q) => 10 + (26 * q * q) / (80 * M3H) ** 2, designFlow: 80 * M3H, mode: "constant-pressure",
        profile: [{ flowFraction: 0.125, hours: 1000 }], density: 1000, motor: { rating: 15000, efficiency: 0.9 }, driveEfficiency: 0.97 });
      expect(r.warnings.filter((w) => w.code === "step-rising-branch")).toHaveLength(notes);
    }
  });
});
