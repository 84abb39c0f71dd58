// The charts' crossing (curves.ts `crossingOf`) by the engine's own meeting rule (engine/meetings.ts): a touch within
// TOUCH_GAP (1e-8 of the head) is one point, curves within it over COINCIDE_SHARE (1 %) of the flows have none, and the
// chart's point is the engine's (operatingPoint.ts `solveOperatingPoint`) for every demo curve set (fixtures/demo, invented
// data) with a system curve shifted to touch, and through its first and last published points ± 1e-9 of the head and flow.
// Check values: geometry. The pump is stored as the field check stores it (41 samples, evaluate.ts `sample`); a touching
// system lies A·(Q − Q₀)² + off·H(Q₀) below the lower of the pump's cubic and its samples' straight lines (A = H(Q₀)/span²),
// so both see g's least, off·H(Q₀), at the sample flow Q₀ (algebra); the engine's solve is the reference.
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, sampleCurve, solveOperatingPoint, type PumpCurve } from "~/engine";
import { demoCurveInputs } from "~/engine/test/demoCurves";
import { crossingOf, interpolateAt } from "./curves.ts";
import type { Pt } from "./types.ts";

const demo = demoCurveInputs().map((d) => ({ id: d.id, c: createPumpCurve(d.curve) }));
const sampled = (c: PumpCurve): Pt[] => { const s = sampleCurve(c, 41); return s.flows.map((flow, i) => ({ flow, y: s.head[i] })); };
/** A system function sampled at the pump's stored flows and at 0 (the chart's system curve). */
const pts = (fn: (q: number) => number, flows: number[]): Pt[] => [...new Set([0, ...flows])].map((flow) => ({ flow, y: fn(flow) }));
/** The chart's point against the engine's: both none, or the same flow to `rel` of the curve's last flow. */
function agree(c: PumpCurve, pump: Pt[], sys: (q: number) => number, rel: number): string | null {
  const op = solveOperatingPoint(c, sys);
  const x = crossingOf(pump, pts(sys, pump.map((p) => p.flow)));
  if (op.flow === null || x === null) return op.flow === x ? null : `engine ${op.status} ${op.flow}, chart ${x?.flow}`;
  return Math.abs(x.flow - op.flow) <= rel * c.flowMax ? null : `engine ${op.flow}, chart ${x.flow}`;
}

describe("a touch: the chart draws the engine's one point", () => {
  it(`every demo curve set (${demo.length}) × 3 sample flows: a touch (0, ±0.5e-8 of the head) one point at Q₀; 2e-8 apart none; 2e-8 deep, the first crossing`, () => {
    const wrong: string[] = [];
    let all = 0;
    for (const { id, c } of demo) {
      const pump = sampled(c), span = c.flowMax - c.flowMin;
      for (const k of [10, 20, 30]) {
        const q0 = pump[k].flow, h0 = pump[k].y, A = h0 / span ** 2;
        const sys = (off: number) => (q: number) => Math.min(evalCubic(c.head, q) as number, interpolateAt(pump, q) ?? Infinity) - A * (q - q0) ** 2 - off * h0;
        for (const off of [0, 0.5e-8, -0.5e-8]) {
          all++;
          const op = solveOperatingPoint(c, sys(off));
          expect(op.flow, `${id} k ${k} off ${off}: ${op.message}`).toBeCloseTo(q0, 9); // control: the engine's touch
          const x = crossingOf(pump, pts(sys(off), pump.map((p) => p.flow)));
          if (x === null || Math.abs(x.flow - q0) > 1e-9 * c.flowMax) wrong.push(`${id} k ${k} off ${off}: chart ${x?.flow}, engine ${op.flow}`);
        }
        for (const off of [2e-8, -2e-8]) {
          all++;
          const e = agree(c, pump, sys(off), 1e-4); // 2e-8 deep: the crossings lie within 1e-4 of the span of Q₀ (√2e-8)
          if (e) wrong.push(`${id} k ${k} off ${off}: ${e}`);
        }
      }
    }
    // old code: every touch without a sign change at the samples (off 0, +0.5e-8: no point; the pump "past its end")
    expect(wrong, `${wrong.length} of ${all}`).toEqual([]);
  });
  it("a stretch 5e-9 of the head below the pump's over 30 % of the flows: no point drawn, as the engine's coincident", () => {
    for (const { id, c } of demo.slice(0, 12)) {
      const pump = sampled(c), span = c.flowMax - c.flowMin;
      const v = (q: number) => (q - c.flowMin) / span;
      const g = (q: number) => (v(q) < 0.3 ? 0.5 * (0.3 - v(q)) : v(q) > 0.6 ? -0.5 * (v(q) - 0.6) : 0) + 5e-9;
      const sys = (q: number) => (interpolateAt(pump, Math.max(q, c.flowMin)) as number) * (1 - g(q));
      const op = solveOperatingPoint(c, (q) => (evalCubic(c.head, Math.max(q, c.flowMin)) as number) * (1 - g(q)));
      expect(op.status, id).toBe("coincident");
      expect(crossingOf(pump, pts(sys, pump.map((p) => p.flow))), id).toBeNull(); // old code: a point at the stretch's far end
    }
  });
});

describe("through the first and last published points ± 1e-9 of the head and the flow: the chart's point is the engine's", () => {
  it(`every demo curve set (${demo.length}) × 2 ends × 5 shifts × 2 statics`, () => {
    const wrong: string[] = [];
    let all = 0;
    for (const { id, c } of demo) {
      const pump = sampled(c);
      for (const end of [c.flowMin, c.flowMax]) {
        const h = evalCubic(c.head, end) as number;
        for (const [dq, dh] of [[0, 0], [1e-9, 0], [-1e-9, 0], [0, 1e-9], [0, -1e-9]]) {
          const q = end * (1 + dq), hs = h * (1 + dh);
          for (const f of [0.3, 0.8]) {
            // s + k·Q² through (q, hs), its static a share f of hs; through a first point at zero flow, k from the last point
            const k = q > 0 ? (hs * (1 - f)) / (q * q) : (h * (1 - f)) / c.flowMax ** 2, s = q > 0 ? hs * f : hs;
            all++;
            const e = agree(c, pump, (x) => s + k * x * x, 1e-6);
            if (e) wrong.push(`${id} at ${end} dq ${dq} dh ${dh} f ${f}: ${e}`);
          }
        }
      }
    }
    expect(wrong, `${wrong.length} of ${all}`).toEqual([]);
  });
});
