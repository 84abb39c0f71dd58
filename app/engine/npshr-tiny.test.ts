// An NPSHr above zero but so small that NPSHa / NPSHr is no finite number (5e-324 m, the smallest double: a cell the
// importer took as written) made the whole duty search throw ("values are outside any physical range … npshMargin =
// Infinity") for every system searching that library, and the operating point's figures throw too. Now such an NPSHr is
// no requirement to judge against: the search keeps the pump with no NPSH margin (as one with no NPSHr at the duty), and
// the figures say NPSH not judged ("unknown") with the NPSHr, never "low margin". At NPSHa zero the pump is left out as
// before (0 / NPSHr = 0). Check values: the rule NPSHa / NPSHr (common practice); 5e-324 is Number.MIN_VALUE (IEEE 754).
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshMarginRatio, operatingFigures, prepareSearchIndex, searchDuty } from "./index";
import { inSI } from "./quantityText";

const M3H = 1 / 3600;
const points = [0, 10, 20, 30].map((q, i) => ({ flow: q * M3H, head: [20, 19, 17, 14][i], efficiency: [0, 0.6, 0.7, 0.65][i], npshr: [1, 1.1, Number.MIN_VALUE, 3.1][i] }));
const water = { density: 998.2, vaporPressure: 2339, dynamicViscosity: 1.0016e-3, kinematicViscosity: 1.0034e-6 }; // 20 °C, IAPWS (from memory, rounded)

describe("an NPSHr of 5e-324 m at the duty", () => {
  it("the margin ratio is none (was Infinity)", () => {
    expect(npshMarginRatio(2, Number.MIN_VALUE)).toBeNull();
    expect(npshMarginRatio(2, 1e-300)).toBeCloseTo(2e300, -290); // finite: a ratio (the importer warns of such an NPSHr)
  });
  it("the search does not throw; NPSHa 2 m keeps the pump with no margin; NPSHa 0 leaves it out", () => {
    const idx = prepareSearchIndex([{ id: "a", curve: { points } }]);
    const kept = searchDuty(idx, { flow: 20 * M3H, head: 16.5 }, { npshAvailable: 2 });
    expect(kept.candidates.map((c) => [c.npshr, c.npshMargin])).toEqual([[Number.MIN_VALUE, null]]);
    const out = searchDuty(idx, { flow: 20 * M3H, head: 16.5 }, { npshAvailable: 0 });
    expect(out.candidates).toEqual([]);
    expect(out.stats.rejectedByNpsh).toBe(1);
  });
  it("the figures: NPSH unknown with the NPSHr named, no ratio, never a low margin (nor a throw)", () => {
    const f = operatingFigures({ curve: createPumpCurve({ points }), flow: 20 * M3H, fluid: water as never, suction: { surfacePressure: 101325, staticSuctionHead: 0, suctionLoss: 0 } });
    expect(f.npsh).toMatchObject({ required: Number.MIN_VALUE, marginRatio: null, status: "unknown" });
    const w = f.warnings.find((x) => x.code === "npsh-unknown")!;
    expect(inSI(w.message)).toMatch(/^the curve's NPSHr here, 4\.94e-324 m, is too small to judge NPSHa .* against/);
    expect(f.warnings.some((x) => x.code === "npsh-low-margin")).toBe(false);
  });
});
