/**
 * Operating point at the end of the published curve (operatingPoint.ts), swept over every demo curve (fixtures/demo,
 * invented data read from the clean CSVs) and over short curves of two and three points.
 * Check values: geometry — a system curve H = s + k·Q² is built through a chosen point (Q*, H_pump(Q*)) of the pump's
 * curve, so the curves meet at Q* by construction; the solver must find that point, not "runs past the curve's end".
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, solveOperatingPoint, type PumpCurve } from "./index.ts";
import { demoCurveInputs } from "./test/demoCurves.ts";
import { prng } from "../../fixtures/prng";

const demo = demoCurveInputs().map((d) => ({ ...d, c: createPumpCurve(d.curve) }));

/** A system curve s + k·Q² through (q, pump head at q), its static head a share `f` of that head. */
function through(c: PumpCurve, q: number, f: number) {
  const h = evalCubic(c.head, q) as number;
  const s = h * f;
  const k = (h - s) / (q * q);
  return (x: number) => s + k * x * x;
}

/** How many of the cases (curve, share of static head, Q*) the solver finds at Q* to 1e-9 of the curve's flow range. */
function found(curves: { c: PumpCurve }[], flowsOf: (c: PumpCurve, r: () => number) => number[], perCurve: number, seed: number) {
  const r = prng(seed);
  let hit = 0, all = 0;
  const missed: string[] = [];
  for (const { c } of curves) {
    for (const q of flowsOf(c, r)) {
      for (let i = 0; i < perCurve; i++) {
        const op = solveOperatingPoint(c, through(c, q, 0.05 + 0.9 * r()));
        all++;
        if ((op.status === "ok" || op.status === "multiple") && Math.abs((op.flow as number) - q) <= 1e-9 * (c.flowMax - c.flowMin)) hit++;
        else if (missed.length < 3) missed.push(`${q} → ${op.status}: ${op.message}`);
      }
    }
  }
  return { hit, all, missed };
}

describe("a system curve through the pump curve's last published point: the operating point is there", () => {
  it(`every demo curve (${demo.length}) × 40 system curves exactly through its last point`, () => {
    // Before the fix 463 of the 5640 (and 14 of the 6400 on short curves below) ended "beyond-curve-end": s + k·Q² at the last flow came out an ulp or two below
    // the pump's head there, so no sign change was seen and the pump was said to run past its curve (seed 5).
    const r = found(demo, (c) => [c.flowMax], 40, 5);
    expect(`${r.hit} of ${r.all}`, r.missed.join("\n")).toBe(`${r.all} of ${r.all}`);
  });
  it("every demo curve × 200 system curves crossing in its last 1 % of flow (and 1e-12, 1e-9 of the range below its end)", () => {
    const r = found(demo, (c, g) => {
      const span = c.flowMax - c.flowMin;
      return [c.flowMax - 1e-12 * span, c.flowMax - 1e-9 * span, ...Array.from({ length: 20 }, () => c.flowMax - g() * 0.01 * span)];
    }, 10, 6);
    expect(`${r.hit} of ${r.all}`, r.missed.join("\n")).toBe(`${r.all} of ${r.all}`);
  });
  it("curves of two and three points (invented, m³/s and m): through the last point and between the last two", () => {
    const short = [
      [[0, 30], [0.02, 18]],
      [[0.004, 25], [0.011, 9.3]],
      [[0, 40], [0.01, 37], [0.02, 28]],
      [[0.002, 12.7], [0.0075, 11.1], [0.013, 6.05]],
    ].map((rows) => ({ c: createPumpCurve({ points: rows.map(([flow, head]) => ({ flow, head })) }) }));
    const r = found(short, (c, g) => {
      const x = c.head.x;
      const a = x[x.length - 2], b = x[x.length - 1];
      return [b, b - 1e-9 * (b - a), ...Array.from({ length: 30 }, () => a + g() * (b - a))];
    }, 50, 7);
    expect(`${r.hit} of ${r.all}`, r.missed.join("\n")).toBe(`${r.all} of ${r.all}`);
  });
  it("a system just above the pump's head at the last point still meets it inside the curve; just below it, the pump runs past its end", () => {
    // The flip at the last point (both sides, 1e-6 of the head apart): rounding-level differences are a meeting there,
    // a real shortfall of the system's head is "beyond-curve-end" as before.
    for (const { c } of demo.slice(0, 20)) {
      const hEnd = evalCubic(c.head, c.flowMax) as number;
      const above = solveOperatingPoint(c, () => hEnd * (1 + 1e-6));
      const below = solveOperatingPoint(c, () => hEnd * (1 - 1e-6));
      expect(above.status === "ok" || above.status === "multiple").toBe(true);
      expect(above.flow!).toBeLessThan(c.flowMax);
      expect(below.status).toBe("beyond-curve-end");
    }
  });
});
