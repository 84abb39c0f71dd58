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
import { LifeCycleChart } from "./LifeCycleChart";
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

describe("the chart's cost axis labels each tick with the digits that tell it apart (common practice for a chart axis)", () => {
  const yLabels = (cumulative: number[]) =>
    [...renderToStaticMarkup(createElement(LifeCycleChart, { series: [{ id: 1, label: "A", cumulative }], currency: "EUR", title: "t" })).matchAll(/text-anchor="end"[^>]*>([^<]*)</g)].map((m) => m[1]);
  it("a life-cycle cost of 0 (no purchase price, every hour at 0 % flow): ticks 0 to 1 by 0.2 read as such, not 0 0 0 1 1 1", () => {
    const e = fixtureEnergy({ energy: { control: "fixed-speed", profile: [{ flowFraction: 0, hours: 8784 }], years: 15, escalation: 0.03, discountRate: 0.05 } }, null);
    expect(e.lcc!.total).toBe(0); // no demand: pump stopped, 0 kWh; no price
    expect(yLabels(e.lcc!.cumulative)).toEqual(["0.0", "0.2", "0.4", "0.6", "0.8", "1.0"]);
  });
  it("a small cost (0.27 after 3 years): every label distinct and equal to its tick", () => {
    const labels = yLabels([0, 0.1, 0.19, 0.27]);
    expect(new Set(labels).size).toBe(labels.length);
    expect(labels).toEqual(["0.00", "0.05", "0.10", "0.15", "0.20", "0.25", "0.30"]);
  });
  it("thousands keep their grouping as before: 0, 500, 1,000 … 3,000", () => {
    expect(yLabels([2500, 2500.4, 2500.8])).toEqual(["0", "500", "1,000", "1,500", "2,000", "2,500", "3,000"]);
  });
});

describe("the year axis ends at the period's last year, labelled", () => {
  const xLabels = (years: number) => {
    const html = renderToStaticMarkup(createElement(LifeCycleChart, { series: [{ id: 1, label: "A", cumulative: Array.from({ length: years + 1 }, (_, t) => 100 + 10 * t) }], currency: "EUR", title: "t" }));
    return [...html.matchAll(/text-anchor="middle"[^>]*>(\d+)</g)].map((m) => Number(m[1]));
  };
  it.each([[1, 1], [15, 15], [47, 47], [50, 50]])("%i years: the last label is year %i (where the figure beside the line is read)", (years, last) => {
    expect(xLabels(years).at(-1)).toBe(last);
  });
});
