// The life-cycle cost's tariff growth over the period (year N's tariff against year 1's) judged against its 1/10–10× bound
// to 1 part in 10⁸ (LIMIT_ROUNDING), as the escalation rate beside it and every other limit printed with 9 significant
// digits (helper "numtext"; it used 1e-9). Bound: ESCALATION_PLAUSIBLE, common practice from memory; escalations worked
// back from the growth wanted over 21 years (20 steps), each within ±15 %/year so only the growth decides.
import { describe, expect, it } from "vitest";
import { lifeCycleCost } from "./lifeCycleCost.ts";

const at = (growth: number) => {
  const escalation = growth ** (1 / 20) - 1;
  const r = lifeCycleCost({ purchasePrice: 1000, annualEnergyKWh: 10_000, tariffPerKWh: 0.2, years: 21, escalation, discountRate: 0.05 });
  return r.warnings?.find((w) => w.code === "implausible-escalation")?.message ?? null;
};

describe("the growth bound 10× and 1/10, either side of 1 part in 10⁸", () => {
  for (const [end, past] of [[10, 1], [0.1, -1]] as const) {
    it(`${end}×: within 0.5e-8 and 0.99e-8 no warning; 1.01e-8 and 2e-8 past, warned, the factor printed apart`, () => {
      for (const k of [0.5e-8, 0.99e-8]) expect(at(end * (1 + past * k)), `${k}`).toBeNull(); // old (1e-9): warned at 0.5e-8
      for (const k of [1.01e-8, 2e-8]) {
        const said = at(end * (1 + past * k));
        expect(said, `${k}`).not.toBeNull();
        expect(said!).toContain(end === 10 ? "more than 10× year 1's" : "less than 1/10 of year 1's");
        const factor = Number(/year 21's energy cost ([\d.]+) × year 1's/.exec(said!)![1]);
        expect(Math.sign(factor - end), said!).toBe(past);
      }
    });
  }
});
