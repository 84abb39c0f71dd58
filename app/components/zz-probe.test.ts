import { it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateEnergyPanel } from "./CandidateEnergy";
import { SelectionEnergy } from "./SelectionEnergy";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";
const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const cases: [string, any, number | null][] = [
  ["zero-h", { energy: { ...defaultSystemInput().energy!, control: "fixed-speed", profile: [{ flowFraction: 1, hours: 0 }] } }, 250000],
  ["nodemand", { energy: { ...defaultSystemInput().energy!, control: "fixed-speed", profile: [{ flowFraction: 0, hours: 8784 }] } }, null],
  ["nodemand0", { energy: { ...defaultSystemInput().energy!, control: "system-curve", profile: [{ flowFraction: 0, hours: 8784 }] } }, 0],
  ["tariff0", { tariffPerKWh: 0, energy: { ...defaultSystemInput().energy!, control: "constant-pressure", profile: [{ flowFraction: 1, hours: 10 }] } }, 0],
  ["y1", { energy: { ...defaultSystemInput().energy!, control: "proportional-pressure", years: 1, escalation: 1, discountRate: 1, profile: [{ flowFraction: 1, hours: 8784 }, { flowFraction: 0.01, hours: 0 }] } }, 100],
  ["y50", { energy: { ...defaultSystemInput().energy!, control: "proportional-pressure", years: 50, escalation: 1, discountRate: 0, profile: [{ flowFraction: 1, hours: 8784 }] } }, 100],
  ["common", { hoursPerYear: 0 }, 100],
];
it("probe", () => {
  for (const [name, o, price] of cases) {
    const e = fixtureEnergy(o, price);
    for (const u of [SI_UNITS, US_UNITS]) {
      const p = text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }, { id: 8, label: "Pump B", energy: fixtureEnergy({}, null) }], unitSystem: u, currency: "EUR", canWrite: false })));
      const r = text(renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump A", energy: e }, unitSystem: u, currency: "EUR" })));
      const bad = /NaN|Infinity|undefined|null|\[object/.exec(p + r);
      console.log("C", name, u === US_UNITS ? "US" : "SI", bad ? "BAD " + bad[0] + " …" + (p + r).slice(Math.max(0, bad.index - 200), bad.index + 50) : "clean");
      if (name === "y50" || name === "tariff0") console.log(p.slice(0, 3000));
    }
  }
});
