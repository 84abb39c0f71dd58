// Pumps in parallel staged by demand over a duty cycle (dutyStaging.ts): each step runs the fewest duty pumps that meet
// it (duty/assist staging: common practice, from memory). Check values: hand-checks against the same pump alone, as a
// single-pump cycle (dutyCycleEnergy on its own curve and one motor), and against all pumps running (the combined curve,
// as the workbench combines them, and every motor) — what the cycle priced before staging. The curve and system are
// invented (the energy fixture's pump: 36 m³/h at 15.5 m, curve end 55 m³/h at 7 m).
import { describe, expect, it } from "vitest";
import { combinePumps, createPumpCurve, dutyCycleEnergy, solveOperatingPoint, stagedDutyCycleEnergy, type ControlMode } from "./index.ts";

const M3H = 1 / 3600;
const one = createPumpCurve({
  points: [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e })),
});
const two = combinePumps(one, { mode: "parallel", duty: 2 }).curve;
const qd = 72 * M3H; // the design flow: two pumps at 36 m³/h each
/** Closed-loop-ish system through the pair's duty point: H = 5 m + 10.5 m × (Q / 72 m³/h)² (hand algebra: 15.5 m at 72 m³/h). */
const system = (q: number) => 5 + 10.5 * (q / qd) ** 2;
const MOTOR = { rating: 3000, efficiency: 0.87 };
const common = (mode: ControlMode, fractions: number[]) => ({
  systemHead: system, designFlow: qd, mode, density: 1000, driveEfficiency: mode === "fixed-speed" ? null : 0.97,
  profile: fractions.map((flowFraction) => ({ flowFraction, hours: 1000 })),
});
const staged = (mode: ControlMode, fractions: number[], motor: { rating: number; efficiency: number } = MOTOR) =>
  stagedDutyCycleEnergy({ ...common(mode, fractions), pumpCurve: one, dutyPumps: 2, motor });
/** The same pump alone: a single-pump candidate's cycle (its curve, one motor). */
const alone = (mode: ControlMode, fractions: number[], motor = MOTOR) => dutyCycleEnergy({ ...common(mode, fractions), curve: one, motor });
/** Both pumps at every step: the combined curve and both motors (the cycle before staging). */
const both = (mode: ControlMode, fractions: number[], motor = MOTOR) => dutyCycleEnergy({ ...common(mode, fractions), curve: two, motor: { ...motor, rating: motor.rating * 2, units: 2 } });

describe("two identical pumps in parallel, fixed speed throttled", () => {
  it("25 % flow runs 1 of 2, its energy the single pump's at that flow; 100 % runs 2 of 2, as both pumps before", () => {
    const r = staged("fixed-speed", [0.25, 1]);
    const a = alone("fixed-speed", [0.25]).steps[0];
    const b = both("fixed-speed", [1]).steps[0];
    expect(r.steps.map((s) => [s.pumpsRunning, s.dutyPumps])).toEqual([[1, 2], [2, 2]]);
    // 25 %: 18 m³/h through one pump (hand-check: the same pump alone as a single-pump candidate).
    expect(a.status).toBe("ok");
    expect(r.steps[0].flow).toBeCloseTo(18 * M3H, 12);
    expect(r.steps[0].head).toBeCloseTo(a.head!, 9);
    expect(r.steps[0].shaftPower).toBeCloseTo(a.shaftPower!, 6);
    expect(r.steps[0].pumpShaftPower).toBeCloseTo(a.shaftPower!, 6);
    expect(r.steps[0].electricalPower).toBeCloseTo(a.electricalPower!, 6);
    expect(r.steps[0].energyKWh).toBeCloseTo(a.energyKWh!, 6);
    // Both throttled pumps at 9 m³/h each draw more than one at 18 (the finding that asked for staging, DEVELOPERS.md "cycleedge").
    expect(both("fixed-speed", [0.25]).steps[0].electricalPower!).toBeGreaterThan(a.electricalPower! * 1.2);
    // 100 %: 72 m³/h, past one pump's curve end (55 m³/h): both run, as the combined curve and both motors give it.
    expect(alone("fixed-speed", [1]).steps[0].status).toBe("beyond-curve");
    expect(r.steps[1].energyKWh).toBeCloseTo(b.energyKWh!, 6);
    expect(r.steps[1].pumpShaftPower).toBeCloseTo(b.shaftPower! / 2, 6);
    expect(r.annualEnergyKWh).toBeCloseTo(a.energyKWh! + b.energyKWh!, 6);
    expect(r.complete).toBe(true);
  });

  it("flips from 1 to 2 pumps at the flow where one pump alone meets the system (bisected), its single operating point", () => {
    // Hand-check: one pump throttled reaches at most the flow where its curve crosses the system's (its operating point
    // alone); above it a second pump starts. Bisect the step's flow fraction on the staged cycle's pumps running.
    let lo = 0.25, hi = 1;
    expect(staged("fixed-speed", [lo]).steps[0].pumpsRunning).toBe(1);
    expect(staged("fixed-speed", [hi]).steps[0].pumpsRunning).toBe(2);
    for (let i = 0; i < 50; i++) {
      const mid = (lo + hi) / 2;
      if (staged("fixed-speed", [mid]).steps[0].pumpsRunning === 1) lo = mid;
      else hi = mid;
    }
    const op = solveOperatingPoint(one, system);
    expect(lo * qd).toBeCloseTo(op.flow!, 6);
    // Either side of the flip: just below, one pump meets it alone; just above, it cannot and both run.
    const below = lo - 1e-4, above = hi + 1e-4;
    expect(alone("fixed-speed", [below]).steps[0].status).toBe("ok");
    expect(staged("fixed-speed", [below]).steps[0].pumpsRunning).toBe(1);
    expect(alone("fixed-speed", [above]).steps[0].status).toBe("beyond-curve");
    expect(staged("fixed-speed", [above]).steps[0]).toMatchObject({ pumpsRunning: 2, status: "ok" });
  });
});

describe("two identical pumps in parallel on a drive (system curve and constant pressure)", () => {
  it.each(["system-curve", "constant-pressure"] as const)("%s: 25 % runs 1 of 2 at the single pump's speed and energy; 100 % runs 2 of 2", (mode) => {
    const r = staged(mode, [0.25, 1]);
    const a = alone(mode, [0.25]).steps[0];
    expect(r.steps.map((s) => s.pumpsRunning)).toEqual([1, 2]);
    expect(r.steps[0].speedRatio).toBeCloseTo(a.speedRatio!, 9);
    expect(r.steps[0].energyKWh).toBeCloseTo(a.energyKWh!, 6);
    expect(r.steps[1].energyKWh).toBeCloseTo(both(mode, [1]).steps[0].energyKWh!, 6);
  });
});

describe("what a step needs beyond the flow", () => {
  it("a pump that meets the flow alone only past its motor's rating is not left alone: a second starts", () => {
    // 60 % = 43.2 m³/h: one pump alone there overloads a motor sized between the two loads (hand-check: the single-pump
    // cycle warns motor-overload-step at that rating; two pumps at 21.6 m³/h each do not).
    const aloneAt = alone("fixed-speed", [0.6]).steps[0];
    const pairAt = both("fixed-speed", [0.6]).steps[0];
    expect(aloneAt.status).toBe("ok");
    const rating = (aloneAt.shaftPower! + pairAt.shaftPower! / 2) / 2;
    expect(rating).toBeLessThan(aloneAt.shaftPower!);
    expect(alone("fixed-speed", [0.6], { rating, efficiency: 0.87 }).warnings.some((w) => w.code === "motor-overload-step")).toBe(true);
    const r = staged("fixed-speed", [0.6], { rating, efficiency: 0.87 });
    expect(r.steps[0].pumpsRunning).toBe(2);
    expect(r.warnings.some((w) => w.code === "motor-overload-step")).toBe(false);
  });

  it("a step no number of pumps meets reads as with all running: not met, with their numbers", () => {
    const r = staged("fixed-speed", [1.5]); // 108 m³/h: past the pair's curve end (110 m³/h) head-wise (system 28.6 m)
    const b = both("fixed-speed", [1.5]);
    expect(r.steps[0]).toMatchObject({ pumpsRunning: 2, status: b.steps[0].status, message: b.steps[0].message });
    expect(r.steps[0].status).toBe("beyond-curve");
    expect(r.complete).toBe(false);
    expect(r.warnings.find((w) => w.code === "cycle-incomplete")?.message).toBe(b.warnings.find((w) => w.code === "cycle-incomplete")?.message);
    // Not met by the pair, not "by this pump" (both run there); the same pump alone says "this pump".
    expect(r.warnings.find((w) => w.code === "cycle-incomplete")?.message).toContain("not met by the 2 pumps or on this control curve");
    expect(alone("fixed-speed", [1.5]).warnings.find((w) => w.code === "cycle-incomplete")?.message).toContain("not met by this pump or on this control curve");
  });

  it("a step needing no pump head runs none: 0 of 2, 0 kWh", () => {
    const r = stagedDutyCycleEnergy({ ...common("system-curve", [0.25]), systemHead: (q) => -1 + 1.49 * (q / qd) ** 2, pumpCurve: one, dutyPumps: 2, motor: MOTOR });
    expect(r.steps[0]).toMatchObject({ status: "gravity-flow", pumpsRunning: 0, dutyPumps: 2, energyKWh: 0 });
  });

  it("one duty pump staged is the single-pump cycle", () => {
    const r = stagedDutyCycleEnergy({ ...common("fixed-speed", [0.25, 0.5]), pumpCurve: one, dutyPumps: 1, motor: MOTOR });
    expect(r.steps.map((s) => s.energyKWh)).toEqual(alone("fixed-speed", [0.25, 0.5]).steps.map((s) => s.energyKWh));
  });
});
