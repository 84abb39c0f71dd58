/**
 * A reading's uncertainty box against a tolerance grade (gradeUncertainty.ts), at its edges.
 * Check values: ISO 9906 grade 1B, flow ±5 %, head ±3 % (the engine's TOLERANCE_GRADES); the cross passes when
 * either arm holds (gradeCross). The circulator curve is invented: H = 4 m × (1 − (Q/Qmax)²), Qmax = 3 m³/h.
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, gradeCross, gradeWithinUncertainty, TOLERANCE_GRADES, withinGrade } from "./index.ts";
import { prng } from "../../fixtures/prng";

const M3H = 1 / 3600;
const G1B = TOLERANCE_GRADES.find((g) => g.id === "1B")!;
const curve = createPumpCurve({ points: [0, 0.2, 0.4, 0.5, 0.6, 0.8, 1].map((f) => ({ flow: f * 3 * M3H, head: 4 * (1 - f * f) })) });
const H = (q: number) => evalCubic(curve.head, q) as number;

/** The grid the verdict used before: 5 × 5 points over the box, corners included. */
function gridFinds(q: number, h: number, fa: number, dH: number) {
  const steps = [-1, -0.5, 0, 0.5, 1];
  return steps.some((a) => steps.some((b) => q * (1 + a * fa) > 0 && h + b * dH > 0 && withinGrade(curve, q * (1 + a * fa), h + b * dH, G1B)));
}

describe("gradeWithinUncertainty", () => {
  const q = 1.5 * M3H; // H = 3.0 m here

  it("finds the head band between the rows of a 5 × 5 grid (low-head pump, coarse gauges: ±1.0 m)", () => {
    const h = 2.25;
    const dH = 1.0; // gauges ±7 kPa each: hypot(7, 7) kPa / (ρg) ≈ 1.0 m (common practice: 0–10 bar gauges at 1 % of span)
    expect(withinGrade(curve, q, h, G1B)).toBe(false);
    expect(gridFinds(q, h, 0, dH)).toBe(false); // rows at 1.25, 1.75, 2.25, 2.75, 3.25 m all miss the band
    const w = gradeWithinUncertainty(curve, { flow: [q, q], head: [h - dH, h + dH] }, G1B);
    expect(w).not.toBeNull();
    expect(gradeCross(curve, w!.flow, w!.head, G1B).pass).toBe(true);
    expect(w!.flow).toBe(q);
    expect(w!.head).toBeGreaterThanOrEqual(h - dH);
    expect(w!.head).toBeLessThanOrEqual(h + dH);
  });

  it("flips where the box's top edge reaches the curve's head at Q/0.95 (the flow arm's limit, −5 %)", () => {
    const h = 2.25;
    const edge = H(q / (1 - G1B.flow[0])); // the curve's head where the measured flow is 5 % past its flow
    expect(H(q) * (1 - G1B.head[0])).toBeGreaterThan(edge); // the head arm needs more: the flow arm decides
    const box = (dH: number) => ({ flow: [q, q] as const, head: [h - dH, h + dH] as const });
    expect(gradeWithinUncertainty(curve, box(edge - h + 1e-9), G1B)?.arm).toBe("flow");
    expect(gradeWithinUncertainty(curve, box(edge - h - 1e-9), G1B)).toBeNull();
  });

  it("above the curve: flips where the box's bottom edge reaches the flow arm's other limit (Q/1.05)", () => {
    const h = 3.6;
    const edge = H(q / (1 + G1B.flow[1]));
    const box = (dH: number) => ({ flow: [q, q] as const, head: [h - dH, h + dH] as const });
    expect(gradeWithinUncertainty(curve, box(h - edge + 1e-9), G1B)).not.toBeNull();
    expect(gradeWithinUncertainty(curve, box(h - edge - 1e-9), G1B)).toBeNull();
  });

  it("agrees with a dense scan of the box on 400 random readings, and never names a point that fails", () => {
    const r = prng(11);
    let found = 0;
    for (let i = 0; i < 400; i++) {
      const qq = (0.1 + 2.8 * r()) * M3H;
      const hh = H(qq) * (0.6 + 0.8 * r());
      const fa = 0.1 * r();
      const dH = 0.8 * r();
      const w = gradeWithinUncertainty(curve, { flow: [qq * (1 - fa), qq * (1 + fa)], head: [hh - dH, hh + dH] }, G1B);
      if (w) {
        found++;
        expect(gradeCross(curve, w.flow, w.head, G1B).pass).toBe(true);
        expect(w.flow).toBeGreaterThanOrEqual(qq * (1 - fa) * (1 - 1e-12));
        expect(w.flow).toBeLessThanOrEqual(qq * (1 + fa) * (1 + 1e-12));
      } else {
        // No point of a 25 × 25 scan meets the grade either (a scan can only find fewer points than exist).
        for (let a = 0; a <= 24; a++)
          for (let b = 0; b <= 24; b++) {
            const x = qq * (1 - fa + (2 * fa * a) / 24);
            const y = hh - dH + (2 * dH * b) / 24;
            if (x > 0 && y > 0) expect(withinGrade(curve, x, y, G1B), `${i}: ${x}, ${y}`).toBe(false);
          }
      }
    }
    expect(found).toBeGreaterThan(40); // the draw reaches both answers
    expect(found).toBeLessThan(360);
  });

  it("refuses a box given the wrong way round or with NaN, and meets nothing at zero head", () => {
    expect(() => gradeWithinUncertainty(curve, { flow: [2, 1], head: [1, 2] }, G1B)).toThrow(/box.flow/);
    expect(() => gradeWithinUncertainty(curve, { flow: [1, 1], head: [Number.NaN, 2] }, G1B)).toThrow(/box.head/);
    expect(gradeWithinUncertainty(curve, { flow: [q, q], head: [-2, 0] }, G1B)).toBeNull();
  });
});
