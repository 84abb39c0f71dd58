// A crossing at so shallow an angle that the heads stay within TOUCH_GAP (1 part in 10⁸ of the pump's head) over
// COINCIDE_SHARE (1 %) of the published flows or more is where the curves coincide, as a touch or a run of samples that
// close is (meetings.ts, the rule every coincident message states: "their heads within 1 part in 10⁸ of the pump's head
// over … of the published flows; coincident from 1 %"). Before, only touches and stretches were judged by it: a crossing
// was a crossing however shallow, so a system whose heads' difference bends by κ read "coincident" with a dip within the
// gap and one 1e-10 deeper read "ok" at a single point, the heads still within 1e-8 over more than 1 % either side of it.
// Engine (solveOperatingPoint) and chart (components/chart/curves.ts `crossingOf`, on the 41 samples stored) by one rule,
// each side of 1 %. Check values: geometry — the system is the pump's head less s·(Q₀ − Q), so the heads' difference is
// that line and stays within 1e-8·H over 2·1e-8·H/s of the flows (H the pump's head about Q₀, to 1 part in 200 over 1 %);
// the demo curve sets are invented (fixtures/demo).
import { describe, expect, it } from "vitest";
import { createPumpCurve, evalCubic, sampleCurve, solveOperatingPoint, type PumpCurve } from "~/engine";
import { demoCurveInputs } from "~/engine/test/demoCurves";
import { crossingOf, interpolateAt } from "./curves.ts";
import { TOUCH_GAP } from "~/engine/curveTouch";

const demo = demoCurveInputs().slice(0, 24).map((d) => ({ id: d.id, c: createPumpCurve(d.curve) }));
const sampled = (c: PumpCurve) => { const s = sampleCurve(c, 41); return s.flows.map((flow, i) => ({ flow, y: s.head[i] })); };

describe("a shallow crossing: coincident from 1 % of the published flows within 1e-8 of the head, a crossing below", () => {
  for (const share of [0.0098, 0.0102, 0.05])
    it(`heads within 1e-8 over ${share * 100} % of the flows: ${share >= 0.01 ? "coincident, no point drawn" : "one crossing, drawn where the engine has it"} (${demo.length} demo curve sets × 2 flows)`, () => {
      const wrong: string[] = [];
      for (const { id, c } of demo) {
        const pump = sampled(c), span = c.flowMax - c.flowMin;
        for (const k of [15, 25]) {
          const q0 = pump[k].flow + 0.3 * (pump[k + 1].flow - pump[k].flow); // between samples
          const s = (2 * TOUCH_GAP * (evalCubic(c.head, q0) as number)) / (share * span); // m per m³/s
          const op = solveOperatingPoint(c, (q) => (evalCubic(c.head, q) as number) - s * (q0 - q));
          const chartSys = [...new Set([0, ...pump.map((p) => p.flow)])].map((flow) => ({ flow, y: (interpolateAt(pump, flow) as number) - s * (q0 - flow) }));
          const x = crossingOf(pump, chartSys);
          const at = `${id} k ${k}`;
          if (share >= 0.01) {
            if (op.status !== "coincident") wrong.push(`${at}: engine ${op.status} at ${op.flow}`);
            else if (!/over 1\.0[12]\d* % of the published flows; coincident from 1 %|over 5\.0\d* % of the published flows/.test(op.message)) wrong.push(`${at}: ${op.message}`);
            if (x !== null) wrong.push(`${at}: chart point at ${x.flow}`);
          } else {
            if (op.status !== "ok" || Math.abs((op.flow as number) - q0) > 1e-9 * c.flowMax) wrong.push(`${at}: engine ${op.status} at ${op.flow}, not ${q0}`);
            if (x === null || Math.abs(x.flow - q0) > 1e-9 * c.flowMax) wrong.push(`${at}: chart ${x?.flow}, engine ${op.flow}`);
          }
        }
      }
      expect(wrong).toEqual([]);
    });
});
