// A duty-cycle step that loads the motor above its rating but within rating × service factor is noted at its step (not a
// failure): a service factor is margin for occasional overload, not for continuous running (common practice). Edges: exactly
// 100 % load (nothing), just above (the note), exactly at the service factor (the note, no overload), just past it (the
// overload, no note). Check values: the made-up knot curve (engine/test/curves.ts: 600 W at 10 m³/h), hand arithmetic.
import { describe, expect, it } from "vitest";
import { dutyCycleEnergy, type DutyCycleInput } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { knotCycle } from "./test/curves.ts";

const base: DutyCycleInput = knotCycle(); // through the design knot: 600 W at 10 m³/h
const codes = (motor: DutyCycleInput["motor"]) => dutyCycleEnergy({ ...base, motor }).warnings.filter((w) => /^motor-(service-factor|overload)-step$/.test(w.code));

describe("a step running into the motor's service factor", () => {
  it("exactly 100 % load (600 W on 600 W, SF 1.15): nothing", () => {
    expect(codes({ rating: 600, efficiency: 0.8, serviceFactor: 1.15 })).toEqual([]);
  });
  it("just above (600 W on 599.9 W, 100.02 %): noted at its step with load, rating and service factor", () => {
    const w = codes({ rating: 599.9, efficiency: 0.8, serviceFactor: 1.15 });
    expect(w.map((x) => [x.code, x.parameter])).toEqual([["motor-service-factor-step", "profile[0]"]]);
    expect(inSI(w[0].message)).toMatch(/^at 100 % flow the motor runs at 100\.02 % load, above its rating and within rating × service factor 115 %: the shaft power 0\.6000 kW is above the 0\.5999 kW rating for \d+ h a year; a service factor is margin for occasional overload, not for continuous running \(common practice\)/);
  });
  it("exactly at the service factor (600 W on 600/1.15 W): the note, not an overload; just past it: the overload, not the note", () => {
    expect(codes({ rating: 600 / 1.15, efficiency: 0.8, serviceFactor: 1.15 }).map((x) => x.code)).toEqual(["motor-service-factor-step"]);
    expect(codes({ rating: 600 / 1.1501, efficiency: 0.8, serviceFactor: 1.15 }).map((x) => x.code)).toEqual(["motor-overload-step"]);
  });
  it("service factor 1 (no margin): above the rating is the overload alone", () => {
    expect(codes({ rating: 599.9, efficiency: 0.8 }).map((x) => x.code)).toEqual(["motor-overload-step"]);
  });
});

describe("a 0 % flow step of pumps in parallel staged by demand", () => {
  it("runs none of the duty pumps (0 of 2), 0 kWh, counted (it was refused)", async () => {
    const { stagedDutyCycleEnergy } = await import("./index.ts");
    const r = stagedDutyCycleEnergy({ ...base, pumpCurve: base.curve, dutyPumps: 2, motor: { rating: 600, efficiency: 0.8 }, profile: [{ flowFraction: 0, hours: 500 }] });
    expect(r.steps[0]).toMatchObject({ status: "no-demand", pumpsRunning: 0, dutyPumps: 2, energyKWh: 0, pumpShaftPower: 0 });
    expect(r.complete).toBe(true);
  });
});
