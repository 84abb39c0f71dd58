/**
 * Without a flow meter, a flow band from the gauges' accuracy a hair wider than the ±10 % the check warns past reads
 * wider than it, and the warning says its rule: it read "a flow band of ±10 %". The band's half-width is a fraction of
 * the flow: the same in every unit system. Check values: the warning past ±10 % of the flow (common practice, from
 * memory); an invented flat straight-line curve H = 30 − 100·Q (m, m³/s); water at 20 °C (engine fluids.ts).
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, fieldCheck, fluidAt, G0 } from "./index.ts";
import { bisection } from "./roots.ts";

const WATER = fluidAt({ kind: "water" }, 20);
const CURVE = createPumpCurve({ points: [0, 0.01, 0.02, 0.03].map((q) => ({ flow: q, head: 30 - 100 * q })) });
const gauge = (pressure: number, accuracy: number) => ({ pressure, elevation: 0, pipeDiameter: 0.1, accuracy });
// 28.8 m measured (the curve's at 0.012 m³/s), the discharge gauge's accuracy in Pa.
const check = (accuracy: number) => fieldCheck({ curve: CURVE, fluid: WATER, suction: gauge(0, 0), discharge: gauge(28.8 * WATER.density * G0, accuracy) });
const halfWidth = (accuracy: number) => {
  const r = check(accuracy);
  return (r.flowBand!.high! - r.flowBand!.low!) / 2 / r.flow!;
};

describe("the wide-flow-band warning at its edge", () => {
  it("a band 10.00001 % wide either side reads wider than ±10 %, with its rule", () => {
    const acc = bisection((a) => halfWidth(a) - 0.1000001, 100, 5000, 1e-9)!.x;
    const w = check(acc).warnings.find((x) => x.code === "wide-flow-band")!;
    expect(w, `half-width ${halfWidth(acc)}`).toBeDefined();
    const m = w.message.match(/a flow band of ±(\d+(?:\.\d+)?) %, wider than ±10 %; fit a flow meter/);
    expect(m, w.message).not.toBeNull();
    expect(Number(m![1]), w.message).toBeGreaterThan(10);
  });
});
