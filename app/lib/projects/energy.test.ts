// Operating hours and tariff "not given" (blank or 0, as the system form stores them): no energy cost is counted and
// no life-cycle cost is given, with a note saying what is missing; given both, the cost and the LCC are there.
// Check values: LCC from the engine's lifeCycleCost (its hand calculations in app/engine/lifeCycleCost.test.ts).
import { describe, expect, it } from "vitest";
import { lifeCycleCost } from "~/engine";
import { fixtureEnergy as energyOf } from "./energy-fixture";
import { lccRatesText } from "./energy";
import { defaultSystemInput } from "./hydraulics";
import { motorFigures } from "./candidate-judgement";


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
    const base = { shaftPower: 2000, maxCurvePower: { power: 2500, flow: 0.01, upTo: 0.02, toEnd: true, from: 0, fromStart: true }, pumps: 1, userRating: 0, serviceFactor: 1, ieClass: "IE3" as const, speedDrive: false, ratedSpeed: 2900, hoursPerYear: 4000, currency: "GBP" };
    const zero = motorFigures({ ...base, tariffPerKWh: 0 });
    expect(zero.annualEnergyKWh).toBeGreaterThan(0);
    expect(zero.annualCost).toBeNull();
    expect(motorFigures({ ...base, tariffPerKWh: 0.2 }).annualCost).toBeCloseTo(motorFigures({ ...base, tariffPerKWh: 0.2 }).annualEnergyKWh! * 0.2, 9);
  });
});

describe("the life-cycle cost's period and rates in words", () => {
  it("as computed: the rates as typed with their sign; 1 year, a falling tariff and 0 % discount; frozen before the rates were kept: the period alone", () => {
    const lcc = (years: number, escalation: number, discountRate: number) => lifeCycleCost({ purchasePrice: 100.05, annualEnergyKWh: 1000, tariffPerKWh: 0.1, years, escalation, discountRate });
    expect(lccRatesText(lcc(15, 0.03, 0.05))).toBe("over 15 years at a tariff escalation of +3 %/year and a discount rate of 5 %/year");
    expect(lccRatesText(lcc(1, -0.025, 0))).toBe("over 1 year at a tariff escalation of −2.5 %/year and a discount rate of 0 %/year");
    const { escalation: _e, discountRate: _d, ...frozenBefore } = lcc(50, 0.03, 0.03);
    expect(lccRatesText(frozenBefore)).toBe("over 50 years");
  });
});
