// A duty-cycle step whose flow lands on the pump's last (or first) published flow: met on the curve, never refused as
// "outside the pump's curve" because the step's flow, duty × fraction, came out of the binary product a rounding error
// past the published end (100 m³/h × 0.55 = 55.000000000000007 m³/h beside the curve's 55 m³/h). The step's flow is taken
// at the curve's end within 1 part in 10⁸ of it (LIMIT_ROUNDING, the words' digits); beyond that it is off the curve, as
// before. Check values: the made-up curve below (not any vendor's), read at its published points (no interpolation), and
// the affinity laws (common practice) for the drive at full speed.
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, type DutyCycleInput } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { M3H } from "./test/curves.ts";

// Made up: published 10–55 m³/h, 30 m → 15 m, shaft power at the points (W, 1000 kg/m³).
const curve = createPumpCurve({
  points: [[10, 30, 2200], [25, 28, 3000], [40, 23, 3600], [55, 15, 4000]].map(([q, head, power]) => ({ flow: q * M3H, head, power })),
  powerDensity: 1000,
});
const cycle = (o: Partial<DutyCycleInput>, flowFraction: number) =>
  dutyCycleEnergy({ curve, systemHead: () => 5, designFlow: 100 * M3H, mode: "fixed-speed", profile: [{ flowFraction, hours: 1000 }], density: 1000, motor: { rating: 5500, efficiency: 0.9 }, driveEfficiency: null, ...o });

describe("a step on the curve's last published flow, 55 m³/h (100 m³/h × 55 %)", () => {
  it("the binary product lands a rounding error past the published end (the case under test)", () => {
    expect((100 * M3H) * 0.55).toBeGreaterThan(55 * M3H); // 1.7e-18 m³/s past it (IEEE 754 doubles)
  });
  it("fixed speed: met at the published point, 15 m and 4000 W; E = 4000 W / 0.90 × 1000 h / 1000 = 4444.4 kWh (hand, motor at 4000/5500 = 73 % load, part-load factor 1)", () => {
    const s = cycle({}, 0.55).steps[0];
    expect(s.status).toBe("ok");
    expect(s.head).toBeCloseTo(15, 9);
    expect(s.shaftPower).toBeCloseTo(4000, 6);
    expect(s.energyKWh).toBeCloseTo(4000 / 0.9, 6);
  });
  it("under a drive on the system curve (5 m asked, 15 m given at full speed): met at full speed, the surplus throttled, not 'past the curve's end'", () => {
    const s = cycle({ mode: "system-curve", driveEfficiency: 0.97 }, 0.55).steps[0];
    expect(s.status).toBe("throttled-at-min-on-curve-speed");
    expect(s.speedRatio).toBeCloseTo(1, 12);
    expect(s.head).toBeCloseTo(15, 9);
  });
  it("under a drive, where the system needs more than the pump's 15 m there (20 m): not met for its head, said with both heads, not 'past the curve's end'", () => {
    const s = cycle({ mode: "system-curve", driveEfficiency: 0.97, systemHead: () => 20 }, 0.55).steps[0];
    expect(s.status).toBe("beyond-curve");
    // 1 − 15/20 = 25 % (hand)
    expect(inSI(s.message)).toBe("at 55.0 m³/h the pump gives 15.0 m at full speed (100 %), 25.0 % below the 20.0 m the system needs there: no speed up to 100 % meets this step (the drive does not run the pump above its full speed)");
  });
  it("flips past the allowance: 55 m³/h × (1 + 2e-8) is off the curve, said with its own decimals", () => {
    const s = cycle({ designFlow: 55 * (1 + 2e-8) * M3H }, 1).steps[0];
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toMatch(/^55\.000001\d* m³\/h is outside the pump's curve \(10\.0 m³\/h–55\.0 m³\/h\) at fixed speed$/);
  });
});

describe("a step on the curve's first published flow, 10 m³/h, a rounding error before it", () => {
  it("fixed speed: met at the published point, 30 m", () => {
    const q = 10 * M3H * (1 - 1e-15);
    const s = cycle({ designFlow: q }, 1).steps[0];
    expect(s.status).toBe("ok");
    expect(s.head).toBeCloseTo(30, 9);
  });
});
