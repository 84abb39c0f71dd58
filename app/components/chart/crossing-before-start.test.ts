// The charts' crossing (curves.ts `crossingOf`) just before the first point of a pump curve published from a flow above
// zero, with the engine's rule (operatingPoint.ts `firstPointGap`, the last point's mirrored): a crossing before it by no
// more than LIMIT_ROUNDING = 1e-8 of its flow is met there, as the engine's solve meets it; further, none (the pump is not
// shown starting from rest). Check values: geometry — an invented sampled pump curve from 0.005 m³/s, 40 m, falling 1000 m
// per m³/s (a straight line), against a flat system (zero friction) at 40 m + 1000·0.005·e, which crosses the line carried
// back at 0.005·(1 − e) m³/s.
import { describe, expect, it } from "vitest";
import { solveOperatingPoint } from "~/engine";
import { crossingOf } from "./curves.ts";

const pump = [{ flow: 0.005, y: 40 }, { flow: 0.01, y: 35 }, { flow: 0.02, y: 25 }];
const flatAt = (e: number) => 40 + 1000 * 0.005 * e;
const system = (e: number) => [{ flow: 0, y: flatAt(e) }, { flow: 0.03, y: flatAt(e) }];
const engine = (e: number) => solveOperatingPoint({ points: pump.map((p) => ({ flow: p.flow, head: p.y })) }, () => flatAt(e));

describe("a flat system crossing just before the first sampled point", () => {
  it("0.99e-8 of the first flow before it: the chart's crossing is the first point, as the engine's operating point", () => {
    expect(crossingOf(pump, system(0.99e-8))).toEqual({ flow: 0.005, y: 40 }); // old code: null
    expect(engine(0.99e-8).flow).toBe(0.005); // old code: null, "no-intersection-shutoff-below-static"
  });
  it("the flip: 1.01e-8 and 1e-6 before, no crossing on the chart and no point in the engine", () => {
    for (const e of [1.01e-8, 1e-6]) {
      expect(crossingOf(pump, system(e)), `e ${e}`).toBeNull();
      expect(engine(e).status, `e ${e}`).toBe("no-intersection-shutoff-below-static");
    }
  });
});
