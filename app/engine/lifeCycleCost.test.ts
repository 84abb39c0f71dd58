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
  it("each refusal names the value refused, beside its range (our rule: a number refused is said with its numbers)", () => {
    const ok = { purchasePrice: 0, annualEnergyKWh: 1, tariffPerKWh: 1, years: 1, escalation: 0, discountRate: 0 };
    const said = (bad: Partial<typeof ok>) => { try { lifeCycleCost({ ...ok, ...bad }); return ""; } catch (e) { return (e as Error).message; } };
    expect(said({ years: 51 })).toBe("years: is at most 50 (got 51)");
    expect(said({ years: 0 })).toBe("years: must be a whole number ≥ 1 (got 0)");
    expect(said({ escalation: -1 })).toBe("escalation: must be between −50 % and +100 % per year (got −100.0 %)");
    expect(said({ escalation: 2 })).toBe("escalation: must be between −50 % and +100 % per year (got +200.0 %)");
    expect(said({ discountRate: -1 })).toBe("discountRate: must be between 0 and 100 % per year (got −100.0 %)");
    expect(said({ discountRate: 1e6 })).toBe("discountRate: must be between 0 and 100 % per year (got +100000000.0 %)");
  });
  it("refuses years outside 1–50 or fractional, rates out of range, negative money and NaN", () => {
    const ok = { purchasePrice: 0, annualEnergyKWh: 1, tariffPerKWh: 1, years: 1, escalation: 0, discountRate: 0 };
    for (const bad of [{ years: 0 }, { years: 51 }, { years: 2.5 }, { discountRate: -0.1 }, { escalation: 2 }, { purchasePrice: -1 }, { annualEnergyKWh: NaN }, { tariffPerKWh: Infinity }]) {
      expect(() => lifeCycleCost({ ...ok, ...bad })).toThrow(EngineInputError);
    }
  });
});

describe("an implausible tariff escalation is warned about, with its rule and numbers (the cost is still computed)", () => {
  const lcc = (escalation: number, years: number) => lifeCycleCost({ purchasePrice: 1000, annualEnergyKWh: 10_000, tariffPerKWh: 0.2, years, escalation, discountRate: 0.05 });
  const codes = (escalation: number, years: number) => (lcc(escalation, years).warnings ?? []).map((w) => w.code);

  it("+100 %/year over 50 years: year 50's tariff is 2^49 ≈ 5.6e14 × year 1's (hand calculation)", () => {
    const r = lcc(1, 50);
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings![0]).toMatchObject({ code: "implausible-escalation", parameter: "escalation" });
    expect(r.warnings![0].message).toMatch(/^tariff escalation 100\.0 %\/year makes year 50's energy cost 5\.6e14 × year 1's \(above 15 %\/year; more than 10× year 1's\): implausible/);
    expect(r.warnings![0].message).toMatch(/rule, common practice from memory: within ±15 %\/year and year 50's tariff within 1\/10–10× year 1's/);
    expect(r.total).toBeGreaterThan(1e10); // computed all the same
  });
  it("the default 3 %/year over 15 years (1.03^14 ≈ 1.51×) and over 50 years (1.03^49 ≈ 4.26×) say nothing", () => {
    expect(codes(0.03, 15)).toEqual([]);
    expect(codes(0.03, 50)).toEqual([]);
  });
  it("the rate rule flips at 15 %/year (2 years, so the growth is only 1.15×)", () => {
    expect(codes(0.15, 2)).toEqual([]);
    expect(codes(0.15 + 1e-9, 2)).toEqual([]); // within print rounding of the bound: it would read "15.000000 %"
    expect(codes(0.15 + 1e-6, 2)).toEqual(["implausible-escalation"]);
    expect(lcc(0.15 + 1e-6, 2).warnings![0].message).toMatch(/^tariff escalation 15\.0001 %\/year makes year 2's energy cost 1\.15 × year 1's \(above 15 %\/year\)/);
    expect(codes(-0.15, 2)).toEqual([]);
    expect(lcc(-0.15 - 1e-6, 2).warnings![0].message).toMatch(/^tariff escalation −15\.0001 %\/year .*\(below −15 %\/year\)/);
  });
  it("a falling tariff's rate prints with the true minus sign (U+2212), as the bound beside it, never a hyphen-minus (typographic convention)", () => {
    // −50 %/year, the lowest allowed, over 10 years: 0.5^9 = 0.00195 of year 1's (hand calculation; printed 0.002), so both rules are crossed.
    const m = lcc(-0.5, 10).warnings![0].message;
    expect(m).toMatch(/^tariff escalation −50\.0 %\/year makes year 10's energy cost 0\.002 × year 1's \(below −15 %\/year; less than 1\/10 of year 1's\)/);
    expect(m).not.toMatch(/-\d/); // no hyphen-minus before any number in the sentence
  });
  it("the growth rule flips where year 50's tariff reaches 10× year 1's: e = 10^(1/49) − 1 ≈ 4.81 %/year (hand algebra)", () => {
    const e = 10 ** (1 / 49) - 1;
    expect(codes(e - 1e-6, 50)).toEqual([]);
    const w = lcc(e + 1e-6, 50).warnings!;
    expect(w.map((x) => x.code)).toEqual(["implausible-escalation"]);
    const shown = /makes year 50's energy cost ([\d.]+) × year 1's \(more than 10× year 1's\)/.exec(w[0].message)?.[1];
    expect(Number(shown)).toBeGreaterThan(10); // printed apart from the limit 10 (fmtNumExact), never "10.0"
    // falling: below a tenth of year 1's, e = 10^(−1/49) − 1 ≈ −4.59 %/year
    const f = 10 ** (-1 / 49) - 1;
    expect(codes(f + 1e-6, 50)).toEqual([]);
    expect(lcc(f - 1e-6, 50).warnings![0].message).toMatch(/\(less than 1\/10 of year 1's\)/);
  });
  it("a single year has no escalation to judge", () => expect(codes(1, 1)).toEqual([]));
});
