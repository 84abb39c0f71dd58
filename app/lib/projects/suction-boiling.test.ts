// A suction tank at or below the liquid's vapour pressure (suction-boiling.ts): said as a system warning with its numbers,
// flipping at p_surface = p_vapour; and no NPSH verdict reads as met, or shows a margin ratio, where NPSHa ≤ 0.
// Check values: NPSHa = (p_surface − p_vapour)/(ρ g) + z_suction − h_f (common practice); water's vapour pressure at
// 100 °C 101.42 kPa and at 80 °C 47.4 kPa (IAPWS-IF97 saturation line, from memory; the engine's table is used at the flip);
// the demo curves (fixtures/demo, invented) for the verdict sweep.
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, evaluateSystem, fluidOf, type SystemInput } from "./hydraulics";
import { verdictNpshNote } from "./verdict-npsh";

const boilingWords = (input: SystemInput) => evaluateSystem(input, { points: 5 }).warnings.filter((w) => w.startsWith("The suction tank's surface pressure"));

describe("a suction tank at or below the vapour pressure", () => {
  it("water at 100 °C and 80 °C: the engine's vapour pressure is IAPWS-IF97's to 0.5 % (the threshold's source)", () => {
    expect(fluidOf({ ...defaultSystemInput(), temperatureC: 100 }).vaporPressure / 101_420).toBeCloseTo(1, 2);
    expect(fluidOf({ ...defaultSystemInput(), temperatureC: 80 }).vaporPressure / 47_400).toBeCloseTo(1, 2);
  });
  it.each([
    ["water at 100 °C", { ...defaultSystemInput(), temperatureC: 100 }],
    ["water at 80 °C", { ...defaultSystemInput(), temperatureC: 80 }],
    ["a custom liquid, vapour pressure 50 kPa", { ...defaultSystemInput(), fluid: { kind: "custom" as const, name: "Solvent", density: 790, dynamicViscosity: 0.0005, vaporPressure: 50_000 } }],
  ])("the flip at p_surface = p_vapour ± 1e-6 of it, %s (before: nothing said on either side)", (_, base) => {
    const pv = fluidOf(base).vaporPressure;
    const at = (p: number) => boilingWords({ ...base, suctionSurfacePressure: p, suctionStaticHead: 3 });
    expect(at(pv * (1 + 1e-6))).toEqual([]);
    const equal = at(pv);
    expect(equal).toHaveLength(1);
    expect(inSI(equal[0])).toContain("is equal to the liquid's vapour pressure");
    expect(inSI(equal[0])).toContain("the liquid is boiling at its surface");
    expect(inSI(equal[0])).toContain("NPSHa then comes from the static head alone, less the suction losses (common practice): at most the suction static head 3.00 m");
    const below = at(pv * (1 - 1e-6));
    expect(below).toHaveLength(1);
    expect(inSI(below[0])).toContain("below the liquid's vapour pressure");
    expect(inSI(below[0])).toContain("NPSHa is understated (the safe side)");
    // Both pressures, read apart from each other (never "x kPa … below … x kPa").
    const m = inSI(below[0]).match(/surface pressure (\S+) kPa \(absolute\) is below the liquid's vapour pressure (\S+) kPa/);
    expect(m, inSI(below[0])).not.toBeNull();
    expect(m![1]).not.toBe(m![2]);
  });
  it("the pressure term of the warning is (p − p_vapour)/(ρ g) (water at 100 °C, 10 kPa below: about −1.04 m)", () => {
    const base = { ...defaultSystemInput(), temperatureC: 100 };
    const f = fluidOf(base);
    const w = boilingWords({ ...base, suctionSurfacePressure: f.vaporPressure - 10_000 })[0];
    const term = -10_000 / (f.density * 9.80665);
    expect(inSI(w)).toContain(`(p − p_vapour)/(ρ g) ${term.toFixed(2).replace("-", "−")} m`);
  });
});

describe("NPSH verdicts where NPSHa ≤ 0: cavitation risk by NPSHa, never met, never a margin ratio", () => {
  it("every demo curve set with NPSHr × surface pressures around the vapour pressure (100 °C water) × suction heads −1 to 2 m", () => {
    const base = { ...defaultSystemInput(), temperatureC: 100 };
    const pv = fluidOf(base).vaporPressure;
    let zero = 0, positive = 0;
    for (const c of demoCurves.filter((_, i) => i % 7 === 0)) {
      const s = demoCurveSI(c);
      const qMax = Math.max(...s.points.map((p) => p.flow));
      const duty = { flow: 0.6 * qMax, head: s.points.reduce((a, p) => (Math.abs(p.flow - 0.6 * qMax) < Math.abs(a.flow - 0.6 * qMax) ? p : a)).head * 0.9 };
      for (const dp of [-2000, -1, 0, 1, 2000]) {
        for (const z of [-1, 0, 0.5, 2]) {
          const input: SystemInput = { ...base, staticLow: duty.head * 0.5, staticHigh: duty.head * 0.5, duty, suctionSurfacePressure: pv + dp, suctionStaticHead: z, flowMax: 0 };
          const r = evaluateCandidate(input, s, DEFAULT_ADJUSTMENT);
          if (!r.npsh || !r.verdict) continue;
          const atOrBelow = (r.npsh.judgedAt ?? []).filter((p) => p.available != null && p.available <= 0);
          if (atOrBelow.length) {
            zero++;
            expect(r.npsh.status, `${c.model} ${dp} Pa ${z} m`).toBe("cavitation-risk");
            expect(r.npsh.marginRatio).toBeNull();
            expect(r.npsh.available!).toBeLessThanOrEqual(0);
            expect(inSI(verdictNpshNote(r.verdict, r.npsh) ?? "")).toContain("at or below zero");
          } else positive++;
          if (r.figures?.npshAvailable != null && r.figures.npshAvailable <= 0) expect(r.figures.npshStatus).toBe("cavitation-risk");
        }
      }
    }
    expect(zero).toBeGreaterThan(0); // both sides swept
    expect(positive).toBeGreaterThan(0);
  });
});
