// NPSHa at the duty flow itself, which the search judges NPSHr against: it was the system curve's nearest sample, up to
// half a grid step off. Check values: the system curve's own NPSHa samples (the same formula, aged suction pipe: identity
// where the duty is a sample) and that NPSHa falls as the flow rises (suction friction grows with flow, common practice).
import { describe, expect, it } from "vitest";
import { defaultSystemInput, evaluateSystem, type SystemInput } from "./hydraulics";
import { npshaAtDutyOf } from "./search.server";

const M3H = 1 / 3600;
/** A suction run long enough for NPSHa to move with flow (invented): 60 m of 100 mm, 0.5 m flooded. */
function system(dutyM3h: number, flowMaxM3h: number): SystemInput {
  const base = defaultSystemInput();
  return { ...base, flowMax: flowMaxM3h * M3H, suctionStaticHead: 0.5, duty: { flow: dutyM3h * M3H, head: 20 }, runs: [{ ...base.runs[0], length: 60, diameter: 0.1 }, base.runs[1]] };
}

describe("NPSHa at the duty flow", () => {
  it("a duty on a sample of the curve: the curve's own value there", () => {
    const e = evaluateSystem(system(40, 400)); // 41 samples, 10 m³/h apart: 40 m³/h is one
    const sample = e.npsha.find((p) => Math.abs(p.flow - 40 * M3H) < 1e-12)!;
    expect(npshaAtDutyOf(system(40, 400), e)).toBeCloseTo(sample.y, 12);
  });
  it("a duty between samples (44.9 m³/h, samples at 40 and 50): between their values, not the nearer one's (it was)", () => {
    const input = system(44.9, 400);
    const e = evaluateSystem(input);
    const at = (q: number) => e.npsha.find((p) => Math.abs(p.flow - q * M3H) < 1e-12)!.y;
    const got = npshaAtDutyOf(input, e)!;
    expect(at(40)).toBeGreaterThan(at(50));
    expect(got).toBeLessThan(at(40));
    expect(got).toBeGreaterThan(at(50));
    expect(Math.abs(got - at(40))).toBeGreaterThan(0.01); // the nearest sample (40) was off by this much at least
  });
  it("without a duty: none", () => expect(npshaAtDutyOf({ ...system(40, 400), duty: null }, evaluateSystem({ ...system(40, 400), duty: null }))).toBeNull());
});
