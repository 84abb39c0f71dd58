// The charts' crossing (curves.ts `crossingOf`) at the pump curve's last published point, against the engine's operating
// point (operatingPoint.ts `solveOperatingPoint`, with its last-point rule `LAST_POINT_MATCH`). Check values: geometry — a
// system curve H = s + k·Q² is built through the curve's last point (Q_end, H_pump(Q_end)), so the curves meet there by
// construction (its head there computes an ulp or two off the pump's); the engine's solve is the reference. Curves: every
// curve set of the demo libraries (fixtures/demo, invented data, read from the clean CSVs as stored).
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, lastPointGap, sampleCurve, solveOperatingPoint, type PumpCurve } from "~/engine";
import { demoCurveInputs } from "~/engine/test/demoCurves";
import { prng } from "../../../fixtures/prng";
import { crossingOf } from "./curves.ts";
import type { Pt } from "./types.ts";

const demo = demoCurveInputs().map((d) => ({ id: d.id, c: createPumpCurve(d.curve) }));
/** A pump curve as the field check stores it: 41 points (evaluate.ts `sample`). */
const sampled = (c: PumpCurve): Pt[] => { const s = sampleCurve(c, 41); return s.flows.map((flow, i) => ({ flow, y: s.head[i] })); };
/** A system curve s + k·Q² through (q, pump head at q), its static head a share `f` of that head. */
function through(c: PumpCurve, q: number, f: number) {
  const h = evalCubic(c.head, q) as number;
  const s = h * f;
  const k = (h - s) / (q * q);
  return (x: number) => s + k * x * x;
}
/** A system curve sampled at n points from zero flow to `to` (the last sample at `to` itself). */
const systemPts = (fn: (q: number) => number, to: number, n = 41): Pt[] =>
  Array.from({ length: n }, (_, i) => { const flow = i === n - 1 ? to : (to * i) / (n - 1); return { flow, y: fn(flow) }; });

describe("a system curve drawn through the pump curve's last point: the chart's crossing is the engine's operating point", () => {
  it(`every demo curve set (${demo.length}) × 40 statics, the system sampled up to the last point`, () => {
    const r = prng(11);
    let all = 0, same = 0, ulp = 0;
    const missed: string[] = [];
    for (const { id, c } of demo) {
      const pump = sampled(c);
      for (let i = 0; i < 40; i++) {
        const sys = through(c, c.flowMax, 0.05 + 0.9 * r());
        const op = solveOperatingPoint(c, sys);
        expect(op.flow, `${id}: ${op.message}`).toBe(c.flowMax); // control: the engine meets at the last point
        if (sys(c.flowMax) !== op.head) ulp++; // the system's head there is off the pump's by rounding
        const x = crossingOf(pump, systemPts(sys, c.flowMax));
        all++;
        if (x && x.flow === op.flow && x.y === op.head) same++;
        else if (missed.length < 3) missed.push(`${id}: engine ${op.flow} m³/s, ${op.head} m; chart ${x ? `${x.flow} m³/s, ${x.y} m` : "none"}`);
      }
    }
    expect(ulp).toBeGreaterThan(0); // the case swept: heads an ulp apart at the last point
    // Old code: 4866 of 5640 (seed 11) — 481 no crossing where the system's head came out an ulp below the pump's, 293 a
    // crossing an ulp short of the last point where it came out an ulp above.
    expect(`${same} of ${all}`, missed.join("\n")).toBe(`${all} of ${all}`);
  });
  it("the system sampled on past the curve's end (to 1.2 × its last flow): the chart's crossing is within 1 % of the engine's", () => {
    // Past the end the system's samples lie off the pump's flows, so the chart's straight segments meet a little before the
    // last point or at it; never "no crossing" (1 %: about a pixel on a chart a few hundred wide, our choice).
    const r = prng(12);
    for (const { id, c } of demo) {
      const pump = sampled(c);
      for (let i = 0; i < 10; i++) {
        const sys = through(c, c.flowMax, 0.05 + 0.9 * r());
        const op = solveOperatingPoint(c, sys);
        const x = crossingOf(pump, systemPts(sys, 1.2 * c.flowMax));
        expect(x, id).not.toBeNull();
        expect(Math.abs(x!.flow - op.flow!) / c.flowMax, id).toBeLessThan(0.01);
        expect(Math.abs(x!.y - op.head!) / op.head!, id).toBeLessThan(0.01);
      }
    }
  });
  it("the flip at the last point: a system 1e-6 of the head below the pump's there is past the curve's end (no crossing), above it a crossing", () => {
    for (const { id, c } of demo.slice(0, 20)) {
      const pump = sampled(c);
      for (const [f, engine] of [[1 - 1e-6, "beyond-curve-end"], [1 + 1e-6, "ok"]] as const) {
        const sys = (q: number) => through(c, c.flowMax, 0.5)(q) * f;
        const op = solveOperatingPoint(c, sys);
        expect(op.status === "multiple" ? "ok" : op.status, `${id} × ${f}`).toBe(engine);
        const x = crossingOf(pump, systemPts(sys, c.flowMax));
        if (engine === "beyond-curve-end") expect(x, `${id} × ${f}`).toBeNull();
        else expect(x, `${id} × ${f}`).not.toBeNull();
      }
    }
  });
  it("lastPointGap: the rounding allowance is 1e-12 of the head, both sides of it", () => {
    // Check values: LAST_POINT_MATCH = 1e-12 (operatingPoint.ts, our choice); 30 m head: 3e-11 m allowed.
    expect(lastPointGap(30, 30 - 2.9e-11)).toBe(0);
    expect(lastPointGap(30, 30 - 3.1e-11)).toBeGreaterThan(0);
    expect(lastPointGap(30, 30 + 2.9e-11)).toBe(0); // the system above by rounding: they meet at the point, not an ulp short
    expect(lastPointGap(30, 30 + 3.1e-11)).toBeLessThan(0);
  });
});
