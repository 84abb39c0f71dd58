// A life-cycle cost the engine refuses (lifeCycleCost throws: a period past 50 years, a rate outside its range — inputs
// the system form's schema would refuse, reaching candidateEnergy from a stored or hand-made input) had left the cycle,
// the yearly cost and a cycleError set together, and the table's cost row read "—" with no reason. Now the cycle stands,
// no energy cost is counted, and the engine's reason is the cost's `costMissing`, shown where the cost would be.
// Check values: the engine's limits (app/engine/lifeCycleCost.ts: years ≤ 50, discount rate 0…100 %/year).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { energyRows } from "./CandidateEnergy";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { DEFAULT_ENERGY_SETTINGS } from "~/lib/projects/energy";

const LCC_ROW = "Life-cycle cost (present value)";
const row = (e: ReturnType<typeof fixtureEnergy>, label: string) => {
  const cell = energyRows("GBP").find(([l]) => l.startsWith(label))![1];
  return renderToStaticMarkup(createElement("span", null, cell({ id: 1, label: "P", energy: e }))).replace(/<[^>]*>/g, "").replace(/&#x27;/g, "'");
};
const withSettings = (o: Partial<typeof DEFAULT_ENERGY_SETTINGS>) => fixtureEnergy({ hoursPerYear: 4000, tariffPerKWh: 0.2, energy: { ...DEFAULT_ENERGY_SETTINGS, ...o } });

describe("a life-cycle cost the engine refuses", () => {
  it("51 years: the cycle stands, no cost counted, and the cost row gives the engine's reason (years ≤ 50, lifeCycleCost.ts)", () => {
    const e = withSettings({ years: 51 });
    expect(e.cycle).not.toBeNull(); // source: the duty cycle does not depend on the LCC period
    expect(e.cycleError).toBeNull(); // source: same
    expect([e.annualCost, e.lcc]).toEqual([null, null]); // source: costMissing set ⇒ no energy cost counted (energy.ts CandidateEnergy)
    expect(e.costMissing).toMatch(/years.*at most 50 \(got 51\)/); // source: engine lifeCycleCost.ts
    expect(row(e, LCC_ROW)).toBe(`— (${e.costMissing})`); // source: lccText, the reason where the cost would be
    expect(row(e, "Energy per year")).toMatch(/kWh$/); // source: the cycle's energy still shown
  });

  it("the verdict flips at the limit: 50 years gives a cost, 51 gives the reason (lifeCycleCost.ts)", () => {
    const ok = withSettings({ years: 50 });
    expect(ok.costMissing).toBeNull(); // source: lifeCycleCost.ts, years ≤ 50
    expect(ok.lcc).not.toBeNull();
    expect(row(ok, LCC_ROW)).toMatch(/over 50 years/); // source: lccText
    expect(withSettings({ years: 51 }).costMissing).not.toBeNull(); // source: same limit
  });

  it("a discount rate of 150 %/year: the reason names the rate (0…100 %/year, lifeCycleCost.ts)", () => {
    const e = withSettings({ discountRate: 1.5 });
    expect([e.cycleError, e.annualCost, e.lcc]).toEqual([null, null, null]); // source: as above
    expect(row(e, LCC_ROW)).toMatch(/^— \(.*discountRate.*between 0 and 100 %/); // source: engine lifeCycleCost.ts
  });
});
