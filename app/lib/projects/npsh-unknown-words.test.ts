// A candidate whose curve has no NPSHr at its operating point carried the engine's bare caution "curve has no NPSHr at
// this flow" (candidates table and report cautions, CSV `warning_N`), naming neither the flow nor where the NPSHr curve
// stops, while the verdict's line said both (npshr-reach.ts). Now the caution says it in the verdict's words, one pump's
// flow in parallel. Check values: the invented pump of npshr-fixture.ts on the default system (design point 41.1 m³/h);
// 0.008 m³/s = 28.8 m³/h, 0.012 m³/s = 43.2 m³/h, 0.004 m³/s = 14.4 m³/h (arithmetic); the rule "NPSHr is read off the
// published curve, never beyond it" (common practice, decision "npshone").
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment } from "./hydraulics";
import { from, npshrPump, upTo } from "./npshr-fixture";

const npshCautions = (keep: (q: number) => boolean, adj: Adjustment = DEFAULT_ADJUSTMENT) =>
  evaluateCandidate(defaultSystemInput(), npshrPump(keep), adj).warnings.map(inSI).filter((w) => /NPSHr/.test(w));

describe("the caution at an operating point without NPSHr names where", () => {
  it("past the curve's end: both flows (was 'curve has no NPSHr at this flow')", () => {
    expect(npshCautions(upTo(0.008))).toEqual(["NPSH not judged at the operating point: the NPSHr curve ends at 28.8 m³/h, and the pump runs past it at 41.1 m³/h (design point)"]);
  });
  it("the flip: NPSHr published to 43.2 m³/h, past 41.1 m³/h: judged, no such caution", () => {
    expect(npshCautions(upTo(0.012))).toEqual([]);
  });
  it("before the curve's start, none published, one point only", () => {
    expect(npshCautions(from(0.012))).toEqual(["NPSH not judged at the operating point: the NPSHr curve starts at 43.2 m³/h, and the pump runs below it at 41.1 m³/h (design point)"]);
    expect(npshCautions(() => false)).toEqual(["NPSH not judged at the operating point: the curve publishes no NPSHr at 41.1 m³/h (design point)"]);
    expect(npshCautions((q) => q === 0.008)).toEqual(["NPSH not judged at the operating point: the curve publishes NPSHr at one flow only (2.50 m at 28.8 m³/h): one point is no curve to read it at 41.1 m³/h (design point)"]);
  });
  it("2 pumps in parallel: one pump's flow beside one pump's NPSHr curve", () => {
    const two: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 };
    expect(npshCautions(upTo(0.004), two)).toEqual([expect.stringMatching(/^NPSH not judged at the operating point: one pump's NPSHr curve ends at 14\.4 m³\/h, and each pump runs past it at \d+\.\d m³\/h \(design point\)$/)]);
  });
});
