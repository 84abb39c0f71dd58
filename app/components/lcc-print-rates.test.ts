// The report's printed life-cycle cost line names the rates it was computed with — years, tariff escalation and discount rate
// — as the screen's assumption line does (lccRatesText); it gave the years alone. Check values: the fixture's invented pump
// (energy-fixture.ts) with the rates typed here; the printed words are the rates as stored.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { SelectionEnergy } from "./SelectionEnergy";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { SI_UNITS } from "~/lib/shared/units";

const printed = (escalation: number, discountRate: number, years = 12) => {
  const e = fixtureEnergy({ energy: { ...defaultSystemInput().energy!, years, escalation, discountRate } });
  const html = renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 1, label: "Pump A", energy: e }, unitSystem: SI_UNITS, currency: "EUR" }));
  return /data-testid="energy-print"[^>]*>([\s\S]*?)<\/p>/.exec(html)![1].replace(/<!-- -->/g, "");
};

describe("the printed life-cycle cost line", () => {
  it("names years, tariff escalation and discount rate", () => {
    expect(printed(0.025, 0.06)).toMatch(/; life-cycle cost \(present value\): [\d.]+ EUR over 12 years at a tariff escalation of \+2\.5 %\/year and a discount rate of 6 %\/year — ▲ priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow.*? is not in this cost \(present-value method/);
    expect(printed(-0.01, 0, 1)).toMatch(/ EUR over 1 year at a tariff escalation of −1 %\/year and a discount rate of 0 %\/year — ▲ priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow.*? is not in this cost \(/);
  });
});
