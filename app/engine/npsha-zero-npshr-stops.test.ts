// NPSHa at or below zero at a flow with no NPSHr: the engine's caution says where the NPSHr curve stops, with both flows
// (helper "numtext"; it said "(the curve has no NPSHr at this flow)", naming neither). NPSHa = (p_s − p_v)/(ρg) + z_s −
// h_loss (common practice); the sample curve (test/curves.ts, invented) publishes NPSHr from 10 to 80 m³/h, cut here to
// end at 60 m³/h; a suction lift of 12 m under 101 325 Pa puts NPSHa below zero (20 °C water, p_v 2.34 kPa, IAPWS-IF97).
import { describe, expect, it } from "vitest";
import { createPumpCurve, fluidAt, operatingFigures } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { M3H, samplePoints } from "./test/curves.ts";

const water = fluidAt({ kind: "water" }, 20);
const cut = samplePoints().map((p) => (p.flow > 60 * M3H ? { ...p, npshr: undefined } : p));
const curve = createPumpCurve({ points: cut });
const said = (flow: number, points = curve) => {
  const f = operatingFigures({ curve: points, flow, fluid: water, suction: { surfacePressure: 101325, staticSuctionHead: -12, suctionLoss: 0 } });
  expect(f.npsh!.available).toBeLessThan(0);
  return inSI(f.warnings.find((w) => w.code === "npsh-cavitation")!.message);
};

describe("NPSHa ≤ 0 without NPSHr at the flow names where the NPSHr curve stops", () => {
  it("past its end at 65 m³/h: 'the NPSHr curve ends at 60.0 m³/h, and the pump runs past it at 65.0 m³/h'", () => {
    expect(said(65 * M3H)).toMatch(/is not above zero: cavitation risk whatever the pump \(no NPSHr at this flow: the NPSHr curve ends at 60\.0 m³\/h, and the pump runs past it at 65\.0 m³\/h\)$/);
  });
  it("either side of the end, 1 part in 10⁸ (LIMIT_ROUNDING): within, NPSHr read there ('s NPSHr); past it, both flows apart", () => {
    expect(said(60 * M3H * (1 + 0.99e-8))).toMatch(/whatever the pump's NPSHr$/);
    const past = said(60 * M3H * (1 + 1.01e-8));
    const m = /the NPSHr curve ends at ([\d.]+) m³\/h, and the pump runs past it at ([\d.]+) m³\/h\)$/.exec(past);
    expect(m, past).not.toBeNull();
    expect(Number(m![2])).toBeGreaterThan(Number(m![1]));
  });
  it("below its first published flow, at one published point, and with none published", () => {
    expect(said(5 * M3H, createPumpCurve({ points: samplePoints() }))).toMatch(/\(no NPSHr at this flow: the NPSHr curve starts at 10\.0 m³\/h, and the pump runs below it at 5\.00 m³\/h\)$/);
    const one = createPumpCurve({ points: samplePoints().map((p) => (p.flow === 40 * M3H ? p : { ...p, npshr: undefined })) });
    expect(said(40 * M3H, one)).toMatch(/\(no NPSHr at this flow: NPSHr is published at one flow only, 40\.0 m³\/h, which judges no flow\)$/);
    expect(said(40 * M3H, createPumpCurve({ points: samplePoints({ npshr: false }) }))).toMatch(/\(no NPSHr at this flow: the curve publishes no NPSHr\)$/);
  });
});
