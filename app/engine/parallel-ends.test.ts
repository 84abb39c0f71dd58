/**
 * Tier 3 — pumps in parallel at the end of the combined curve, swept over every demo curve (fixtures/demo,
 * invented data read from the clean CSVs) and 2–6 duty pumps.
 * Check values: in parallel, flows add at equal head (common practice), so a point on the combined curve at
 * flow Q is each pump at Q/n on its own curve; the combined curve's last point is each pump's last point.
 */
import { describe, expect, it } from "vitest";
import { combinePumps, createPumpCurve, efficiencyAt, evalCubic, flowPerPump, operatingFigures, solveOperatingPoint, fluidAt } from "./index.ts";
import { demoCurveInputs } from "./test/demoCurves.ts";

const demo = demoCurveInputs().map((d) => ({ ...d, c: createPumpCurve(d.curve) }));
const water = fluidAt({ kind: "water" }, 20); // water at 20 °C from the engine (fluids.ts)
const suction = { surfacePressure: 101325, staticSuctionHead: 3, suctionLoss: 0.2 };

describe("parallel pumps: the combined curve's end is each pump's end", () => {
  it("every demo curve × 2–6 pumps: the operating point at the combined end reads each pump's figures at its own end", () => {
    let cases = 0;
    let offBefore = 0; // how many per-pump flows Q/n alone land past the pump's curve (rounding), kept for the record
    for (const d of demo) {
      for (let n = 2; n <= 6; n++) {
        const comb = combinePumps(d.c, { mode: "parallel", duty: n }).curve;
        const hEnd = evalCubic(comb.head, comb.flowMax) as number;
        // A flat system curve through the combined curve's end: the curves meet exactly there.
        const op = solveOperatingPoint(comb, () => hEnd);
        expect(op.flow, `${d.id} × ${n}`).toBe(comb.flowMax);
        if (op.flow! / n > d.c.flowMax) offBefore++;
        const q1 = flowPerPump(op.flow!, { mode: "parallel", duty: n }, d.c);
        // On the pump's curve (Q/n may also land an ulp below its end: that is on it), and at its end.
        expect(q1, `${d.id} × ${n}`).toBeLessThanOrEqual(d.c.flowMax);
        expect((d.c.flowMax - q1) / d.c.flowMax, `${d.id} × ${n}`).toBeLessThan(1e-15);
        const f = operatingFigures({ curve: d.c, flow: q1, head: op.head!, fluid: water, suction, requiredMargin: 1.1 });
        if (d.c.efficiency) expect(f.efficiency!, `${d.id} × ${n}`).toBeCloseTo(efficiencyAt(d.c, d.c.flowMax)!, 12);
        cases++;
      }
    }
    expect(cases).toBe(demo.length * 5);
    // Q/n alone fell past the end for some of them (measured: see the count in the failure message if this changes).
    expect(offBefore, "cases where Q/n rounds past the pump's last flow").toBeGreaterThan(0);
  });

  it("inside the range Q/n is returned as it is; outside the combined range it is not pulled in", () => {
    const c = demo[0].c;
    const mid = ((c.flowMin + c.flowMax) / 2) * 3;
    expect(flowPerPump(mid, { mode: "parallel", duty: 3 }, c)).toBe(mid / 3);
    const past = c.flowMax * 3 * 1.01; // 1 % past the combined curve: a real runout, left for the caller to judge
    expect(flowPerPump(past, { mode: "parallel", duty: 3 }, c)).toBe(past / 3);
    expect(flowPerPump(past, { mode: "parallel", duty: 3 }, c)).toBeGreaterThan(c.flowMax);
    expect(flowPerPump(0.02, { mode: "series", duty: 3 }, c)).toBe(0.02); // series: the same flow through each pump
  });
});
