// A duty-cycle step that loads the motor above rating × service factor is warned of at its step, with the numbers:
// a drive run faster than the candidate's set speed, or a flow past the design flow, can overload a motor chosen for the
// curve as set. Bisected across the limit. Check values: the made-up knot curve (engine/test/curves.ts: 600 W at
// 10 m³/h), service factors 1.0–1.5 (common practice), the product rule (motor.ts limitCovers).
import { describe, expect, it } from "vitest";
import { dutyCycleEnergy, type DutyCycleInput } from "./index.ts";
import { inSI, renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";
import { knotCycle } from "./test/curves.ts";

const base: DutyCycleInput = knotCycle(); // through the design knot: 600 W at 10 m³/h
const overloads = (motor: DutyCycleInput["motor"]) => dutyCycleEnergy({ ...base, motor }).warnings.filter((w) => w.code === "motor-overload-step");

describe("a step above the motor's rating × service factor", () => {
  it("600 W at 100 % flow: a 600 W motor is not warned of, 599 W is, at its step with its numbers", () => {
    expect(overloads({ rating: 600, efficiency: 0.8 })).toEqual([]);
    const w = overloads({ rating: 599, efficiency: 0.8 });
    expect(w.map((x) => x.parameter)).toEqual(["profile[0]"]);
    expect(inSI(w[0].message)).toBe("at 100 % flow the motor runs at 100.2 % load, above its rating × service factor 100 %: the shaft power 0.600 kW exceeds 0.599 kW, so the motor overloads at this step (its efficiency taken at full load)");
  });
  it("with service factor 1.15: 522 W × 1.15 = 600.3 W covers 600 W, 521 W × 1.15 = 599.15 W does not (shown 0.599 kW beside 0.600 kW)", () => {
    expect(overloads({ rating: 522, efficiency: 0.8, serviceFactor: 1.15 })).toEqual([]);
    const w = overloads({ rating: 521, efficiency: 0.8, serviceFactor: 1.15 });
    expect(inSI(w[0].message)).toMatch(/^at 100 % flow the motor runs at 115\.2 % load, above its rating × service factor 115 %: the shaft power 0\.600 kW exceeds 0\.599 kW, so the motor overloads at this step/);
  });
  it("service factor 1.155 (a limit as given, '115.5 %'): a load of 115.8 % reads above it, not '115.8 %' beside '116 %' (US too)", () => {
    // 600 W / 1.158 = 518.13 W rated: load 115.8 %, limit 518.13 W × 1.155 = 598.4 W < 600 W (hand arithmetic).
    const w = overloads({ rating: 600 / 1.158, efficiency: 0.8, serviceFactor: 1.155 });
    for (const t of [inSI(w[0].message), renderQuantities(w[0].message, UNIT_SYSTEMS.US)])
      expect(t).toMatch(/^at 100 % flow the motor runs at 115\.8 % load, above its rating × service factor 115\.5 %: the shaft power /);
    // A load just above the limit, 115.52 %: shown to the limit's decimal at the least, and apart from it.
    const near = overloads({ rating: 600 / 1.1552, efficiency: 0.8, serviceFactor: 1.155 });
    expect(inSI(near[0].message)).toMatch(/^at 100 % flow the motor runs at 115\.52 % load, above its rating × service factor 115\.5 %:/);
  });
});

describe("pumps in parallel or series: each motor is one pump's, so the motor notes are per motor", () => {
  it("2 motors of 299.5 W (599 W together) at 600 W together: each runs at 100.2 % load, one pump's 0.300 kW beside its 0.2995 kW (printed 0.299 kW)", () => {
    // The same load shared by 2 equal pumps: 600 W / 2 = 300 W each against 299.5 W × service factor 1.
    const w = overloads({ rating: 599, efficiency: 0.8, units: 2 });
    expect(w.map((x) => x.parameter)).toEqual(["profile[0]"]);
    expect(inSI(w[0].message)).toBe("at 100 % flow each of the 2 motors runs at 100.2 % load, above its rating × service factor 100 %: one pump's shaft power 0.300 kW exceeds 0.299 kW, so each motor overloads at this step (its efficiency taken at full load)");
    expect(overloads({ rating: 600, efficiency: 0.8, units: 2 })).toEqual([]); // the flip: 300 W each is covered
  });
  it("below 10 % load: said of each motor", () => {
    // 2 × 3000 W motors, 600 W together: each at 10 % of 3000 W… 300 W / 3000 W = 10 % (no note); 6001 W together: 9.998 %.
    const light = (rating: number) => dutyCycleEnergy({ ...base, motor: { rating, efficiency: 0.8, units: 2 }, profile: [{ flowFraction: 1, hours: 1000 }] }).warnings.filter((x) => x.code === "motor-very-light-load");
    expect(light(6000)).toEqual([]);
    expect(light(6001).map((x) => x.message)).toEqual(["at 100 % flow each of the 2 motors runs at 9.998 % load: part-load efficiencies below 10 % load are taken at their 10 % values"]);
  });
});
