// A downhill system (static lift below zero) under system-curve control: where the system's head at a step's flow is
// ≤ 0, gravity drives the flow and no pump head is needed (module comment of dutyCycle.ts: the pump taken as stopped,
// 0 kWh, the step met); the pressure modes keep refusing a set point ≤ 0, and system-curve control needs none.
// Check values: hand algebra on the made-up curve and system below (not any vendor's pump).
import { describe, expect, it } from "vitest";
import { dutyCycleEnergy, EngineInputError, type DutyCycleInput } from "./index.ts";
import { knotCurve } from "./test/curves.ts";

const M3H = 1 / 3600;
// H = 20 − 0.02·Q² (Q in m³/h) at the knots, shaft power given (W at 1000 kg/m³) — the curve of dutyCycle.test.ts.
const curve = knotCurve();
const qd = 10 * M3H;
/** Downhill: H = z + 4 m × (Q / 10 m³/h)². With z = −1 m the head is 3 m at the design flow and 0 at Q = 5 m³/h (f = 0.5, hand algebra). */
const downhill = (z: number) => (q: number) => z + 4 * (q / qd) ** 2;
const run = (z: number, mode: DutyCycleInput["mode"], flowFractions: number[]) =>
  dutyCycleEnergy({
    curve, systemHead: downhill(z), designFlow: qd, mode, density: 1000, motor: { rating: 750, efficiency: 0.8 }, driveEfficiency: 0.97,
    profile: flowFractions.map((flowFraction) => ({ flowFraction, hours: 1000 })),
  });

describe("system-curve control on a downhill system", () => {
  it("a step whose system head is ≤ 0 is met by gravity: pump stopped, 0 kWh, said with its assumption, the cycle complete", () => {
    // f = 0.25: H = −1 + 4 × 0.0625 = −0.75 m (hand algebra) — was "beyond-curve", "no pumping needed", energy missing.
    const r = run(-1, "system-curve", [1, 0.25]);
    const s = r.steps[1];
    expect(s.status).toBe("gravity-flow");
    expect(s.energyKWh).toBe(0);
    expect(s.electricalPower).toBe(0);
    expect(s.speedRatio).toBe(0);
    expect(s.message).toMatch(/^the system needs ⟦head\|-0\.75⟧ at ⟦flow\|[^⟧]+⟧, not above 0: its static head and pressure difference, less the pipe losses, drive this flow without a pump and a valve throttles it/); // no cause given: both named
    expect(s.message).toMatch(/pump is taken as stopped, 0 kWh \(assumed: .*check valve.*a pump kept running here is not counted\)/);
    expect(s.message).not.toMatch(/not met/);
    expect(r.steps[0].status).toBe("ok"); // 3 m at the design flow: the pump runs
    expect(r.complete).toBe(true);
    expect(r.annualEnergyKWh).toBeCloseTo(r.steps[0].energyKWh!, 12);
    expect(r.warnings.map((w) => w.code)).not.toContain("cycle-incomplete");
    expect(r.setpointHead).toBeNull(); // system-curve control holds no set point
  });

  it("flips at the step where the system head crosses 0 (f = 0.5): above it the pump runs, at and below it gravity", () => {
    expect(run(-1, "system-curve", [0.5 + 1e-6]).steps[0].status).toBe("ok"); // −1 + 4(0.5 + 1e-6)² ≈ +4e-6 m: the pump is needed (held at its lowest speed)
    expect(run(-1, "system-curve", [0.5 + 1e-6]).steps[0].energyKWh!).toBeGreaterThan(0);
    expect(run(-1, "system-curve", [0.5]).steps[0].status).toBe("gravity-flow"); // exactly 0 m
    expect(run(-1, "system-curve", [0.5 - 1e-6]).steps[0].status).toBe("gravity-flow");
  });

  it("static −5 m: every step by gravity, 0 kWh, complete — was refused whole ('must be positive … for a pressure set point')", () => {
    // H = −5 + 4 f² ≤ −1 m for f ≤ 1 (hand algebra)
    const r = run(-5, "system-curve", [1, 0.75, 0.5, 0.25]);
    expect(r.steps.map((s) => s.status)).toEqual(["gravity-flow", "gravity-flow", "gravity-flow", "gravity-flow"]);
    expect(r.annualEnergyKWh).toBe(0);
    expect(r.complete).toBe(true);
  });

  it("the pressure modes still need a set point above 0, and say what to use instead", () => {
    for (const mode of ["constant-pressure", "proportional-pressure"] as const) {
      expect(() => run(-5, mode, [1])).toThrow(EngineInputError);
      expect(() => run(-5, mode, [1])).toThrow(/must be positive at the design flow for a pressure set point \(.*\): it is ⟦head\|-1⟧; use system-curve control/);
      expect(run(-1, mode, [1]).setpointHead).toBeCloseTo(3, 12); // −1 + 4 (hand algebra)
    }
  });

  it("fixed speed on a downhill system is unchanged: the pump runs throttled on its curve at every step", () => {
    const r = run(-5, "fixed-speed", [1, 0.25]);
    expect(r.steps.map((s) => s.status)).toEqual(["ok", "ok"]);
    expect(r.steps[1].head!).toBeGreaterThan(19.5); // the curve's own head between its 0 and 5 m³/h knots (20 and 19.5 m)
    expect(r.steps[1].energyKWh!).toBeGreaterThan(0);
  });
});
