// The cumulative life-cycle cost chart beside the candidates table: every candidate of the table is either drawn or named
// under the chart with why (no duty cycle, no energy cost, no step counted), and a line with no purchase price says it is
// the energy alone, as the table's row does — a chart that drops a candidate unsaid, or draws a price-less line beside
// priced ones unmarked, compares what the table does not. Check values: the fixture's invented pump (energy-fixture.ts)
// and the table's own cells (one computation: the chart's figure is the table's total, checked equal as printed).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateEnergyPanel, energyRows, NO_PRICE_WORDS } from "./CandidateEnergy";
import { SelectionEnergy } from "./SelectionEnergy";
import { moneyText } from "./energy-numbers";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";

type E = ReturnType<typeof fixtureEnergy>;
const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const panel = (cands: [string, E][], units = SI_UNITS) =>
  text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: cands.map(([label, energy], i) => ({ id: i + 1, label, energy })), unitSystem: units, currency: "EUR", canWrite: false })));
const lccCell = (e: E) => {
  const v = energyRows("EUR").find(([l]) => l.startsWith("Life-cycle cost"))![1]({ id: 1, label: "P", energy: e });
  return typeof v === "string" ? v : text(renderToStaticMarkup(createElement("td", null, v))).trim();
};
const priced = fixtureEnergy({}, 250000);
const noPrice = fixtureEnergy({}, null);
// What candidateEnergy returns for a candidate whose motor has no rating (energy.ts: cycle null, cycleError set).
const noMotor: E = { ...priced, cycle: null, cycleError: "no motor rating or efficiency: no duty cycle", annualCost: null, lcc: null, costMissing: null, lccRangeNote: null };

describe("every candidate drawn or named under the chart", () => {
  it("a candidate with no duty cycle is named with why, beside one drawn", () => {
    const p = panel([["Pump A", noMotor], ["Pump B", priced]]);
    expect(p).toContain("Not drawn: 1 Pump A: no motor rating or efficiency: no duty cycle.");
    expect(p).toContain(`2 Pump B: ${moneyText(priced.lcc!.total, "EUR")}`);
  });
  it("no energy tariff: nothing drawn, and each candidate named with the reason the table gives", () => {
    const none = fixtureEnergy({ tariffPerKWh: 0 }, 250000);
    expect(lccCell(none)).toBe("— (no energy tariff given (blank or 0 per kWh))");
    expect(panel([["Pump A", none]])).toContain("Not drawn: 1 Pump A: no life-cycle cost (no energy tariff given (blank or 0 per kWh)).");
  });
});

describe("a line with no purchase price is marked as the table marks it; the figures are the table's, SI and US alike", () => {
  it("price absent: the line's label says energy alone; a price of 0 is a price (no mark)", () => {
    for (const units of [SI_UNITS, US_UNITS]) {
      const p = panel([["Pump A", priced], ["Pump B", noPrice], ["Pump C", fixtureEnergy({}, 0)]], units);
      expect(lccCell(noPrice)).toContain(`(${NO_PRICE_WORDS})`);
      expect(p).toContain(`2 Pump B (${NO_PRICE_WORDS}): ${moneyText(noPrice.lcc!.total, "EUR")}`);
      expect(p).toContain(`3 Pump C: ${moneyText(noPrice.lcc!.total, "EUR")}`); // energy the same, price 0: same total, unmarked
      expect(p).toContain(`1 Pump A: ${moneyText(priced.lcc!.total, "EUR")}`);
      expect(lccCell(priced).startsWith(moneyText(priced.lcc!.total, "EUR"))).toBe(true);
    }
  });
  it("the report's chart marks it too", () => {
    const r = text(renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump B", energy: noPrice }, unitSystem: SI_UNITS, currency: "EUR" })));
    expect(r).toContain(`Pump B (${NO_PRICE_WORDS}): ${moneyText(noPrice.lcc!.total, "EUR")}`);
  });
});
