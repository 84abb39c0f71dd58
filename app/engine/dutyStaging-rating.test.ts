// Staging by demand chooses by the motors' rating first (dutyStaging.ts): the fewest duty pumps that meet a step within
// their motors' rating; else the fewest within rating × service factor (said at the step); else the fewest that meet it,
// overloaded (said). A service factor is margin for occasional overload, not for continuous running (common practice, from
// memory of NEMA MG 1's service-factor guidance). Check values: the staging tests' invented pump and system
// (dutyCycle-staging.test.ts), each pump's shaft power read from the single-pump and both-pumps cycles (the hand-checks
// there), motors sized around them by hand arithmetic.
import { describe, expect, it } from "vitest";
import { combinePumps, createPumpCurve, dutyCycleEnergy, stagedDutyCycleEnergy, type DutyCycleResult } from "./index.ts";
import { inSI } from "./quantityText.ts";

const M3H = 1 / 3600;
const one = createPumpCurve({
  points: [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e })),
});
const two = combinePumps(one, { mode: "parallel", duty: 2 }).curve;
const qd = 72 * M3H;
const system = (q: number) => 5 + 10.5 * (q / qd) ** 2;
const common = (f: number) => ({ systemHead: system, designFlow: qd, mode: "fixed-speed" as const, density: 1000, driveEfficiency: null, profile: [{ flowFraction: f, hours: 4000 }] });
type Motor = { rating: number; efficiency: number; serviceFactor?: number };
const staged = (f: number, motor: Motor) => stagedDutyCycleEnergy({ ...common(f), pumpCurve: one, dutyPumps: 2, motor });
const alone = (f: number, motor: Motor) => dutyCycleEnergy({ ...common(f), curve: one, motor });
const both = (f: number, motor: Motor) => dutyCycleEnergy({ ...common(f), curve: two, motor: { ...motor, rating: motor.rating * 2, units: 2 } });
const motorNotes = (r: DutyCycleResult) => r.warnings.filter((w) => /^motor-(service-factor|overload)-step$/.test(w.code));
// At 50 % (36 m³/h): one pump alone about 2.05 kW, each of two about 1.69 kW (read back here, as the staging tests do).
const P1 = alone(0.5, { rating: 3000, efficiency: 0.87 }).steps[0].shaftPower!;
const P2 = both(0.5, { rating: 3000, efficiency: 0.87 }).steps[0].shaftPower! / 2;

describe("one pump alone just above or just below its motor's rating (service factor 1.15)", () => {
  it("the two loads: one pump alone more than each of two (throttled further out on its curve)", () => {
    expect(P1).toBeGreaterThan(P2 * 1.15);
  });
  it("just above (100.02 % load alone): a second pump starts, both within rating; energy the pair's, no service-factor note", () => {
    const motor = { rating: P1 / 1.0002, efficiency: 0.87, serviceFactor: 1.15 };
    const r = staged(0.5, motor);
    expect(r.steps[0].pumpsRunning).toBe(2);
    expect(r.steps[0].energyKWh).toBeCloseTo(both(0.5, motor).steps[0].energyKWh!, 6);
    expect(motorNotes(r)).toEqual([]);
    // The single pump alone would run into its service factor there (the note the staged cycle used to carry).
    expect(motorNotes(alone(0.5, motor)).map((w) => w.code)).toEqual(["motor-service-factor-step"]);
  });
  it("just below (99.98 % load alone): one pump runs, its energy the single pump's, no note", () => {
    const motor = { rating: P1 / 0.9998, efficiency: 0.87, serviceFactor: 1.15 };
    const r = staged(0.5, motor);
    expect(r.steps[0].pumpsRunning).toBe(1);
    expect(r.steps[0].energyKWh).toBeCloseTo(alone(0.5, motor).steps[0].energyKWh!, 6);
    expect(motorNotes(r)).toEqual([]);
  });
});

describe("falling back, said at the step", () => {
  it("no number runs within rating, both within rating × SF 1.25: the fewest (1 of 2) with the service-factor note and why", () => {
    const rating = (P1 / 1.25 + P2) / 2; // hand: between P1/1.25 and P2, so one alone ≤ 125 % and each of two > 100 %
    expect(P2 / rating).toBeGreaterThan(1);
    expect(P1 / rating).toBeLessThan(1.25);
    const r = staged(0.5, { rating, efficiency: 0.87, serviceFactor: 1.25 });
    expect(r.steps[0].pumpsRunning).toBe(1);
    const w = motorNotes(r);
    expect(w.map((x) => x.code)).toEqual(["motor-service-factor-step"]);
    expect(inSI(w[0].message)).toMatch(/a service factor is margin for occasional overload.*; no number of the 2 duty pumps meets this step within its motors' rating, so the fewest within rating × service factor run \(staged: the fewest within rating first; common practice\)$/);
  });
  it("only both meet the step (100 %), each 5 % above rating, SF 1.15: 2 of 2 with the note and why", () => {
    const pair = both(1, { rating: 3000, efficiency: 0.87 }).steps[0].shaftPower! / 2;
    const r = staged(1, { rating: pair / 1.05, efficiency: 0.87, serviceFactor: 1.15 });
    expect(r.steps[0].pumpsRunning).toBe(2);
    expect(motorNotes(r).map((x) => x.code)).toEqual(["motor-service-factor-step"]);
    expect(motorNotes(r)[0].message).toMatch(/; no number of the 2 duty pumps meets this step within its motors' rating/);
  });
  it("every number overloads (1 kW motors, SF 1): the fewest that meet it, overloaded, and why", () => {
    const r = staged(0.5, { rating: 1000, efficiency: 0.87 });
    expect(r.steps[0].pumpsRunning).toBe(1);
    expect(motorNotes(r).map((x) => x.code)).toEqual(["motor-overload-step"]);
    expect(motorNotes(r)[0].message).toMatch(/; no number of the 2 duty pumps meets this step within rating × service factor, so the fewest that meet it run, overloaded \(staged: the fewest within rating first; common practice\)$/);
  });
  it("one duty pump: nothing to choose, the notes as the single pump's", () => {
    const motor = { rating: P1 / 1.05, efficiency: 0.87, serviceFactor: 1.15 };
    const r = stagedDutyCycleEnergy({ ...common(0.5), pumpCurve: one, dutyPumps: 1, motor });
    expect(motorNotes(r).map((w) => w.message)).toEqual(motorNotes(alone(0.5, motor)).map((w) => w.message));
  });
});
