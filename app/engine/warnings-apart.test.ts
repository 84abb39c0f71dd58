/**
 * Engine warnings whose number sits beside the limit it is past read apart from it: the viscosity parameter B just above
 * the method's end read "B = 40.0 is above 40", a speed ratio just below the affinity laws' range read "speed ratio 0.500"
 * (its range starts at 0.5). B and the ratio are dimensionless: the same in every unit system. Check values: ANSI/HI
 * 9.6.7's range B ≤ 40 (from memory, VISCOSITY_B_MAX); the affinity laws within about 50–120 % of the tested speed
 * (common practice, AFFINITY_SPEED_RANGE); the curve is an invented straight line.
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, scaleBySpeed, viscosityFactors } from "./index.ts";

const NUM = String.raw`(\d+(?:\.\d+)?)`;

describe("a dimensionless number past its limit", () => {
  it("B = 40.01 reads above 40", () => {
    const w = viscosityFactors(40.01).warnings.find((x) => x.code === "outside-validity")!;
    const m = w.message.match(new RegExp(`^B = ${NUM} is above 40,`));
    expect(m, w.message).not.toBeNull();
    expect(Number(m![1]), w.message).toBeGreaterThan(40);
    expect(viscosityFactors(43.8).warnings[0].message).toMatch(/^B = 43\.8 is above 40,/); // as before, well past it
  });

  it("a speed ratio of 0.49996 reads below 0.5, and 1.20004 above 1.2, beside the range it is outside", () => {
    const curve = createPumpCurve({ points: [0, 0.01, 0.02, 0.03].map((q) => ({ flow: q, head: 40 - 1000 * q })) });
    for (const [r, below] of [[0.49996, true], [1.20004, false]] as const) {
      const w = scaleBySpeed(curve, r).warnings.find((x) => x.code === "large-speed-change")!;
      const m = w.message.match(new RegExp(`^speed ratio ${NUM}, outside 0\\.5–1\\.2: affinity laws are less reliable`));
      expect(m, w.message).not.toBeNull();
      if (below) expect(Number(m![1]), w.message).toBeLessThan(0.5);
      else expect(Number(m![1]), w.message).toBeGreaterThan(1.2);
    }
  });
});
