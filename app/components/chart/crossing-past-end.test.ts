// The charts' crossing (curves.ts `crossingOf`) just past the pump curve's last point, with the engine's rule
// (operatingPoint.ts `lastPointGap` with `past`): a crossing past it by no more than LIMIT_ROUNDING = 1e-8 of its flow is
// met there, as the engine's solve meets it; further, none (the pump runs past its curve). Check values: geometry — an
// invented sampled pump curve ending at 0.02 m³/s, 25 m, falling 1000 m per m³/s over its last segment, against a flat system
// (zero friction) at 25 m − 1000·0.02·e, which crosses the curve's last segment carried on at 0.02·(1 + e) m³/s.
import { describe, expect, it } from "vitest";
import { solveOperatingPoint } from "~/engine";
import { crossingOf } from "./curves.ts";

const pump = [{ flow: 0, y: 40 }, { flow: 0.01, y: 35 }, { flow: 0.02, y: 25 }];
const flatAt = (e: number) => 25 - 1000 * 0.02 * e;
const system = (e: number) => [{ flow: 0, y: flatAt(e) }, { flow: 0.03, y: flatAt(e) }];

describe("a flat system crossing just past the last sampled point", () => {
  it("0.99e-8 of the last flow past: the chart's crossing is the last point, as the engine's operating point", () => {
    expect(crossingOf(pump, system(0.99e-8))).toEqual({ flow: 0.02, y: 25 }); // old code: null
    const op = solveOperatingPoint({ points: pump.map((p) => ({ flow: p.flow, head: p.y })) }, () => flatAt(0.99e-8));
    expect(op.flow).toBe(0.02);
  });
  it("the flip: 1.01e-8 and 1e-6 past, no crossing on the chart and beyond-curve-end in the engine", () => {
    for (const e of [1.01e-8, 1e-6]) {
      expect(crossingOf(pump, system(e)), `e ${e}`).toBeNull();
      const op = solveOperatingPoint({ points: pump.map((p) => ({ flow: p.flow, head: p.y })) }, () => flatAt(e));
      expect(op.status, `e ${e}`).toBe("beyond-curve-end");
    }
  });
});
