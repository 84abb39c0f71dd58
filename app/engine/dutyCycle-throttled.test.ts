// A VFD step whose duty point lies past the curve's end at every speed that keeps its flow on the curve: the drive runs
// the pump at the lowest speed where the flow is on the curve, N = Q / Q_end, and a valve (or the system's balancing)
// takes the surplus head — met, `throttled-at-min-on-curve-speed`, counted (module comment of dutyCycle.ts, common
// practice). "Not met" stays where no speed up to full puts the flow on the curve. Check values: hand algebra on the
// made-up curve below (the invented pump of app/lib/projects/energy-fixture.ts, not any vendor's).
import { describe, expect, it } from "vitest";
import { dutyCycleEnergy, createPumpCurve, type DutyCycleInput } from "./index.ts";

const M3H = 1 / 3600;
const G = 9.80665; // standard gravity, m/s² (CGPM 1901)
// flow m³/h, head m, efficiency — the curve ends at 55 m³/h, 7 m, 60 % (invented).
const curve = createPumpCurve({
  points: [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e })),
});
const qd = 36 * M3H;
/** Downhill system through 0.49 m at 36 m³/h: H = −1 m + 1.49 m × (Q / 36 m³/h)² (hand algebra). */
const downhill = (q: number) => -1 + 1.49 * (q / qd) ** 2;
const run = (o: Partial<DutyCycleInput> & { flowFractions?: number[] } = {}) =>
  dutyCycleEnergy({
    curve, systemHead: downhill, designFlow: qd, mode: "system-curve", density: 1000, motor: { rating: 3000, efficiency: 0.87 }, driveEfficiency: 0.97,
    profile: (o.flowFractions ?? [1]).map((flowFraction) => ({ flowFraction, hours: 1000 })), ...o,
  });

describe("a VFD step past the curve's end at every on-curve speed: held at the lowest on-curve speed, throttled, met", () => {
  it("the downhill 100 % step: 65.5 % speed, the pump's 3.00 m not the system's 0.49 m, shaft power by hand", () => {
    // Hand calculation (affinity laws Q ∝ N, H ∝ N²; P = ρ g Q H / η with η constant along the affinity parabola):
    //   N = 36 / 55 = 0.654545 (the speed at which 36 m³/h is the scaled curve's end, 55 m³/h at full speed)
    //   H = N² × 7 m = 0.428430 × 7 = 2.999008 m (the scaled end point); the system needs −1 + 1.49 = 0.49 m: 2.509 m throttled
    //   η = 0.60 (the curve's efficiency at its end, the full-speed point on the same parabola)
    //   P_shaft = 1000 kg/m³ × 9.80665 m/s² × 0.01 m³/s × 2.999008 m / 0.60 = 490.1704 W
    // Was: "beyond-curve", not met, its energy missing from the total.
    const r = run();
    const s = r.steps[0];
    expect(s.status).toBe("throttled-at-min-on-curve-speed");
    expect(s.speedRatio).toBeCloseTo(36 / 55, 12);
    expect(s.head).toBeCloseTo(2.999008, 6);
    expect(s.efficiency).toBeCloseTo(0.6, 9);
    expect(s.shaftPower).toBeCloseTo((1000 * G * 0.01 * 2.99900826) / 0.6, 4);
    expect(s.shaftPower).toBeCloseTo(490.1704, 3);
    expect(s.energyKWh!).toBeCloseTo((s.electricalPower! * 1000) / 1000, 9);
    expect(s.energyKWh!).toBeGreaterThan(0);
    expect(r.complete).toBe(true);
    expect(r.annualEnergyKWh).toBeCloseTo(s.energyKWh!, 9);
    expect(r.warnings.map((w) => w.code)).not.toContain("cycle-incomplete");
    // The rule and its numbers: the speed, the flow, the curve's end, both heads (kept apart, qtPair) and their difference.
    expect(s.message).toMatch(/^at 65\.5 % speed, the lowest where ⟦flow\|0\.01⟧ is on the curve \(its end: ⟦flow\|0\.0152778⟧ as published at full speed\); the pump gives ⟦head\|2\.999008[\d]*\|0\.49[\d]*⟧, the system needs ⟦head\|0\.49[\d]*\|limit:2\.999008[\d]*⟧: ⟦head\|2\.50901⟧ throttled/);
    expect(s.message).toMatch(/common practice/);
    expect(s.message).not.toMatch(/not met/);
  });

  it("flips at the curve's end at full speed: a flow just inside is throttled near 100 % speed, just beyond is not met", () => {
    // System head 0.5 m everywhere below the curve (7 m at its 55 m³/h end): only the flow decides.
    const at = (qM3h: number) => run({ designFlow: qM3h * M3H, systemHead: () => 0.5 }).steps[0];
    const inside = at(55 * (1 - 1e-6));
    expect(inside.status).toBe("throttled-at-min-on-curve-speed");
    expect(inside.speedRatio).toBeCloseTo(1 - 1e-6, 9); // N = Q / 55 m³/h (affinity laws)
    expect(inside.head).toBeCloseTo(7, 4); // the curve's end head × N²
    const beyond = at(55 * (1 + 1e-6));
    expect(beyond.status).toBe("beyond-curve"); // no speed up to 100 % puts 55.000055 m³/h on the curve
    expect(beyond.energyKWh).toBeNull();
    expect(run({ designFlow: 55 * (1 + 1e-6) * M3H, systemHead: () => 0.5 }).complete).toBe(false);
  });

  it("the pressure modes alike: a constant set point below the curve's end head, said as the control curve's ask", () => {
    // H_set = the system's 0.5 m at the design flow; at 36 m³/h the lowest on-curve speed gives 2.999 m (above).
    for (const mode of ["constant-pressure", "proportional-pressure"] as const) {
      const s = run({ mode, systemHead: () => 0.5 }).steps[0];
      expect(s.status, mode).toBe("throttled-at-min-on-curve-speed");
      expect(s.head).toBeCloseTo(2.999008, 6);
      expect(s.message).toMatch(/the control curve asks ⟦head\|0\.5\|/);
    }
  });

  it("a step whose flow the drive can reach on the curve at a root is unchanged (ok at its own speed)", () => {
    // A system needing 15 m at 36 m³/h: the curve gives 15.5 m there at full speed, so a speed below 100 % meets it exactly.
    const s = run({ systemHead: (q) => 15 * (q / qd) ** 2 }).steps[0];
    expect(s.status).toBe("ok");
    expect(s.speedRatio!).toBeLessThan(1);
    expect(s.head).toBeCloseTo(15, 6);
  });
});
