// The transition warning's duty flow and its Reynolds number read apart from the band's ends they are judged against,
// in SI and US units: a duty 10⁻⁵ above the band's top read "the duty flow 1.13 m³/h (Re = 4000) is above it" beside
// "flows from 0.566 m³/h to 1.13 m³/h (Re 2000–4000 …)". Check values: Re = 4Q/(π·D·ν) (definition); water's ν at
// 20 °C from the engine's fluids.ts (IAPWS); the default system's suction run, 5 m of 0.1 m steel
// (app/lib/projects/system-input.ts); the band Re 2000–4000 (common practice).
import { describe, expect, it } from "vitest";
import { fluidAt } from "./fluids.ts";
import { systemCurve, type SystemSpec } from "./system.ts";
import { renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";

const SPEC: SystemSpec = { fluid: fluidAt({ kind: "water" }, 20), staticHead: 10, suction: [{ name: "Suction line", length: 5, diameter: 0.1, roughness: 0.045e-3 }] };
const dutyAtRe = (re: number) => (re * SPEC.fluid.kinematicViscosity * Math.PI * 0.1) / 4; // Q = Re·ν·π·D/4, m³/s
const NUM = String.raw`(\d+(?:\.\d+)?)`;

describe("the duty just outside the transition band", () => {
  for (const [re, side] of [[4000 * (1 + 1e-5), "above"], [2000 * (1 - 1e-5), "below"]] as const) {
    it(`at Re ${re}: its flow and Re read ${side} the band's end, in SI and US units`, () => {
      const w = systemCurve(SPEC, { flowMax: 0.016, points: 41, duty: dutyAtRe(re) }).warnings.find((x) => x.code === "transition-flow")!;
      for (const [name, units] of Object.entries({ SI: UNIT_SYSTEMS.SI, US: UNIT_SYSTEMS.US })) {
        const text = renderQuantities(w.message, units);
        const m = text.match(new RegExp(`flows from ${NUM} \\S+ to ${NUM} \\S+ \\(Re 2000–4000.*the duty flow ${NUM} \\S+ \\(Re = ${NUM}\\) is ${side} it`));
        expect(m, `${name}: ${text}`).not.toBeNull();
        const [low, high, duty, dutyRe] = m!.slice(1).map(Number);
        if (side === "above") {
          expect(duty, `${name}: ${text}`).toBeGreaterThan(high);
          expect(dutyRe, `${name}: ${text}`).toBeGreaterThan(4000);
          // The band's top as a share of the duty flow never reads as the duty itself ("100.0 % of the duty flow").
          expect(Number(text.match(/\(([\d.]+) % of the duty flow/)![1]), `${name}: ${text}`).toBeLessThan(100);
        } else {
          expect(duty, `${name}: ${text}`).toBeLessThan(low);
          expect(dutyRe, `${name}: ${text}`).toBeLessThan(2000);
        }
      }
    });
  }
});
