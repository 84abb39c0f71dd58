// Operating hours and tariff "not given" (blank or 0, as the system form stores them): no energy cost is counted and
// no life-cycle cost is given, with a note saying what is missing; given both, the cost and the LCC are there.
// Check values: LCC from the engine's lifeCycleCost (its hand calculations in app/engine/lifeCycleCost.test.ts).
import { describe, expect, it } from "vitest";
import { lifeCycleCost } from "~/engine";
import { candidateEnergy } from "./energy";
import { defaultSystemInput, fluidOf, systemSpec, type SystemInput } from "./hydraulics";
import { motorFigures } from "./candidate-judgement";

const M3H = 1 / 3600;
// An invented pump near the default system's duty (36 m³/h at 15 m): flow m³/h, head m, efficiency.
const curve = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null }));
const evaluated = { adjustment: { method: "none" as const, arrangement: "single" as const, dutyPumps: 1 }, result: { ratio: 1, curve, operating: { flow: 36.5 * M3H, head: 15.3 }, figures: { motor: { rating: 3000, efficiency: 0.87 } } } };
const energyOf = (o: Partial<SystemInput>) => {
  const input = { ...defaultSystemInput(), ...o };
  return candidateEnergy(input, systemSpec(input), fluidOf(input).density, evaluated, 250000);
};

describe("energy cost with hours or tariff not given", () => {
  it("4000 h at 0.2 per kWh: energy cost and life-cycle cost given, nothing missing", () => {
    const e = energyOf({ hoursPerYear: 4000, tariffPerKWh: 0.2 });
    expect(e.costMissing).toBeNull();
    expect(e.annualCost).toBeCloseTo(e.cycle!.annualEnergyKWh * 0.2, 9);
    const ref = lifeCycleCost({ purchasePrice: 2500, annualEnergyKWh: e.cycle!.annualEnergyKWh, tariffPerKWh: 0.2, years: 15, escalation: 0.03, discountRate: 0.05 });
    expect(e.lcc!.total).toBeCloseTo(ref.total, 6);
    expect(e.lcc!.total).toBeGreaterThan(2500);
  });
  it("0 h (blank): no energy cost, no LCC (not the purchase price alone), and the note says the hours are missing", () => {
    const e = energyOf({ hoursPerYear: 0 });
    expect(e.cycle!.totalHours).toBe(0); // the operating points are still shown
    expect(e.costMissing).toMatch(/no operating hours given/);
    expect(e.annualCost).toBeNull();
    expect(e.lcc).toBeNull();
    // the flip: 1 h is given
    expect(energyOf({ hoursPerYear: 1 }).lcc).not.toBeNull();
  });
  it("0 per kWh (blank): no energy cost, no LCC, the note says the tariff is missing; a user profile with hours needs no system hours", () => {
    const e = energyOf({ tariffPerKWh: 0 });
    expect(e.cycle!.annualEnergyKWh).toBeGreaterThan(0);
    expect(e.costMissing).toMatch(/no energy tariff given/);
    expect(e.costMissing).not.toMatch(/hours/);
    expect(e.annualCost).toBeNull();
    expect(e.lcc).toBeNull();
    expect(energyOf({ tariffPerKWh: 0.01 }).lcc).not.toBeNull();
    const both = energyOf({ hoursPerYear: 0, tariffPerKWh: 0 });
    expect(both.costMissing).toMatch(/hours.*; .*tariff/);
    const own = energyOf({ hoursPerYear: 0, energy: { ...defaultSystemInput().energy!, profile: [{ flowFraction: 1, hours: 2000 }] } });
    expect(own.costMissing).toBeNull();
    expect(own.lcc).not.toBeNull();
  });
  it("the candidate's figures read a 0 tariff as not given too: no energy cost per year, the kWh still shown", () => {
    const base = { shaftPower: 2000, maxCurvePower: 2500, pumps: 1, userRating: 0, serviceFactor: 1, ieClass: "IE3" as const, speedDrive: false, ratedSpeed: 2900, hoursPerYear: 4000, currency: "GBP" };
    const zero = motorFigures({ ...base, tariffPerKWh: 0 });
    expect(zero.annualEnergyKWh).toBeGreaterThan(0);
    expect(zero.annualCost).toBeNull();
    expect(motorFigures({ ...base, tariffPerKWh: 0.2 }).annualCost).toBeCloseTo(motorFigures({ ...base, tariffPerKWh: 0.2 }).annualEnergyKWh! * 0.2, 9);
  });
});
