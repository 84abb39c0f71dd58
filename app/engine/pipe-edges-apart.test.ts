/**
 * A pipe's figures beside the range they are judged outside of read apart from its ends: a bore of 610 mm (24.016 in)
 * beside the butterfly valve's 2–24 in read "bore 610 mm is outside the 50.8 mm–610 mm" (US: "24.0 in … 24.0 in"), and
 * Hazen-Williams at Re 3999.6 (not turbulent) read "assumes turbulent flow; Re = 4000". Check values: 1 in = 25.4 mm
 * exactly (NIST SP 811); the butterfly valve's K entry for 2–24 in (Crane TP-410, from memory, fittings.ts); turbulent
 * from Re 4000 (common practice); Re = 4Q/(π·D·ν) (definition); C = 130 and the pipe are made up.
 */
import { describe, expect, it } from "vitest";
import { fittingKDetailed, pipeHeadLoss } from "./index.ts";
import { renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";

const NUM = String.raw`(\d+(?:\.\d+)?)`;
const CHOICES = { SI: UNIT_SYSTEMS.SI, US: UNIT_SYSTEMS.US };

describe("a bore a hair past a fitting's size range", () => {
  it("610 mm reads above the range's 24 in end, in SI and US units", () => {
    const w = fittingKDetailed("butterfly-valve-open", 0.61).warnings.find((x) => x.code === "fitting-size-outside-range")!;
    expect(w).toBeDefined();
    for (const [name, units] of Object.entries(CHOICES)) {
      const text = renderQuantities(w.message, units);
      const m = text.match(new RegExp(`bore ${NUM} \\S+ is outside the ${NUM} \\S+–${NUM} \\S+ the reference covers`));
      expect(m, `${name}: ${text}`).not.toBeNull();
      expect(Number(m![1]), `${name}: ${text}`).toBeGreaterThan(Number(m![3]));
    }
  });
  it("a nominal size reads as before", () => {
    const w = fittingKDetailed("butterfly-valve-open", 0.66, "26").warnings.find((x) => x.code === "fitting-size-outside-range")!;
    expect(renderQuantities(w.message, CHOICES.SI)).toMatch(/nominal size 26 in is outside the 50\.8 mm–610 mm the reference covers/);
  });
});

describe("Hazen-Williams just below turbulent flow", () => {
  it("Re 3999.6 reads below 4000 beside the rule", () => {
    const nu = 1e-6, D = 0.1;
    const r = pipeHeadLoss({ flow: (3999.6 * nu * Math.PI * D) / 4, diameter: D, length: 10, roughness: 0, kinematicViscosity: nu, model: { type: "hazen-williams", c: 130 } });
    const w = r.warnings.find((x) => x.code === "not-turbulent")!;
    const m = w.message.match(new RegExp(`^Hazen-Williams assumes turbulent flow \\(Re ≥ 4000\\); Re = ${NUM}$`));
    expect(m, w.message).not.toBeNull();
    expect(Number(m![1]), w.message).toBeLessThan(4000);
  });
});
