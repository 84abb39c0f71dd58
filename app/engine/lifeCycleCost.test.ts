import { describe, expect, it } from "vitest";
import { EngineInputError, lifeCycleCost } from "./index.ts";

describe("life-cycle cost (present value, ISO 15686-5 method from memory; common practice)", () => {
  it("matches a hand calculation: 10 000 kWh/yr at 0.20, +3 %/yr tariff, 5 % discount, 3 years, 3 000 purchase", () => {
    // Year t energy cost C_t = 10 000 × 0.20 × 1.03^(t−1); present value C_t / 1.05^t (end of year):
    //  t=1: 2000.00 / 1.05      = 1904.7619
    //  t=2: 2060.00 / 1.1025    = 1868.4807
    //  t=3: 2121.80 / 1.157625  = 1832.8906
    //  energy PV = 5606.1332; LCC = 3000 + 5606.1332 = 8606.1332
    const r = lifeCycleCost({ purchasePrice: 3000, annualEnergyKWh: 10_000, tariffPerKWh: 0.2, years: 3, escalation: 0.03, discountRate: 0.05 });
    expect(r.yearly.map((y) => y.energyCost)).toEqual([2000, expect.closeTo(2060, 9), expect.closeTo(2121.8, 9)]);
    expect(r.yearly[0].presentValue).toBeCloseTo(1904.7619, 4);
    expect(r.yearly[1].presentValue).toBeCloseTo(1868.4807, 4);
    expect(r.yearly[2].presentValue).toBeCloseTo(1832.8906, 4);
    expect(r.energyPresentValue).toBeCloseTo(5606.1332, 3);
    expect(r.total).toBeCloseTo(8606.1332, 3);
    expect(r.cumulative).toHaveLength(4);
    expect(r.cumulative[0]).toBe(3000);
    expect(r.cumulative[3]).toBeCloseTo(r.total, 9);
    // Closed form for e ≠ d (geometric series): C₁ · (1 − ((1+e)/(1+d))^N) / (d − e)
    expect(r.energyPresentValue).toBeCloseTo((2000 * (1 - (1.03 / 1.05) ** 3)) / (0.05 - 0.03), 6);
  });
  it("with no discount and no escalation the energy PV is N × the yearly cost; no purchase price counts as 0 and says so", () => {
    const r = lifeCycleCost({ purchasePrice: null, annualEnergyKWh: 1234, tariffPerKWh: 0.1, years: 10, escalation: 0, discountRate: 0 });
    expect(r.energyPresentValue).toBeCloseTo(1234, 9); // 10 × 123.4
    expect(r.purchaseGiven).toBe(false);
    expect(r.total).toBeCloseTo(1234, 9);
  });
  it("refuses years outside 1–50 or fractional, rates out of range, negative money and NaN", () => {
    const ok = { purchasePrice: 0, annualEnergyKWh: 1, tariffPerKWh: 1, years: 1, escalation: 0, discountRate: 0 };
    for (const bad of [{ years: 0 }, { years: 51 }, { years: 2.5 }, { discountRate: -0.1 }, { escalation: 2 }, { purchasePrice: -1 }, { annualEnergyKWh: NaN }, { tariffPerKWh: Infinity }]) {
      expect(() => lifeCycleCost({ ...ok, ...bad })).toThrow(EngineInputError);
    }
  });
});
