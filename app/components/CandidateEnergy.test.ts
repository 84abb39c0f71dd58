// The candidates table rows, the cumulative-cost chart and the selection report mark an energy total and a
// life-cycle cost built on a duty cycle with unmet steps (their energy is missing, so the figure is too low),
// and say why there is no life-cycle cost when hours or tariff are not given. Server-rendered markup
// (react-dom/server, node environment); the cycles come from the engine (app/engine/dutyCycle.ts).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateEnergyPanel, energyRows } from "./CandidateEnergy";
import { SelectionEnergy } from "./SelectionEnergy";
import { fixtureEnergy as energyOf } from "~/lib/projects/energy-fixture";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { SI_UNITS } from "~/lib/shared/units";

// Fixed speed, throttled: at 150 % of 36 m³/h (54 m³/h) the pump gives about 7.6 m, below the open system's ≥ 12 m static head: not met.
const steps = (over: number) => [{ flowFraction: 1, hours: 1000 }, { flowFraction: 0.5, hours: 2000 }, { flowFraction: 1.5, hours: over }];
const withProfile = (over: number) => energyOf({ energy: { ...defaultSystemInput().energy!, profile: steps(over) } });
const rowText = (e: ReturnType<typeof energyOf>) => Object.fromEntries(energyRows("GBP").map(([label, cell]) => [label, renderToStaticMarkup(createElement("span", null, cell({ id: 1, label: "P", energy: e }))).replace(/<[^>]*>/g, "").replace(/&#x27;/g, "'").replace(/&amp;/g, "&")]));
const panel = (e: ReturnType<typeof energyOf>) => renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "GBP", canWrite: false }));
const report = (e: ReturnType<typeof energyOf>) => renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump A", energy: e }, unitSystem: SI_UNITS, currency: "GBP" }));
const MARK = "(incomplete: 1 of 3 steps not met)";

describe("a life-cycle cost on an incomplete duty cycle is marked wherever it is shown", () => {
  it("a step not met (500 h at 150 %): table rows, chart label, detail and report carry the mark", () => {
    const e = withProfile(500);
    expect(e.cycle!.complete).toBe(false);
    expect(e.cycle!.steps[2].status).toBe("beyond-curve");
    const rows = rowText(e);
    expect(rows["Energy per year over the duty cycle"]).toContain(MARK);
    expect(rows["Life-cycle cost (present value)"]).toContain(MARK);
    const html = panel(e);
    expect(html).toMatch(new RegExp(`1 Pump A \\(incomplete: 1 of 3 steps not met\\): \\d+\\.\\d\\d GBP`)); // the chart's label
    expect(html).toMatch(/understated \(incomplete: 1 of 3 steps not met\)/);
    const rep = report(e);
    expect(rep).toMatch(/Pump A \(incomplete: 1 of 3 steps not met\): \d+\.\d\d GBP/); // the report's chart
    expect(rep).toMatch(/life-cycle cost \(present value\): \d+\.\d\d GBP over 15 years at a tariff escalation of \+3 %\/year and a discount rate of 5 %\/year \(incomplete: 1 of 3 steps not met\)/); // the printed line
  });
  it("the same step with 0 h leaves the cycle complete: no mark anywhere", () => {
    const e = withProfile(0);
    expect(e.cycle!.complete).toBe(true);
    for (const t of [...Object.values(rowText(e)), panel(e), report(e)]) expect(t).not.toContain("incomplete");
    expect(panel(e)).toMatch(/1 Pump A: \d+\.\d\d GBP/);
  });
});

describe("no operating hours or no tariff: no life-cycle cost shown, and why", () => {
  it("0 h: the rows say the hours are missing, no chart, a warning in the detail and the report", () => {
    const e = energyOf({ hoursPerYear: 0 });
    const rows = rowText(e);
    expect(rows["Energy per year over the duty cycle"]).toBe("— (no operating hours given)");
    expect(rows["Life-cycle cost (present value)"]).toMatch(/^— \(no operating hours given/);
    const html = panel(e);
    expect(html).toContain('data-testid="cost-missing-7"');
    expect(html).toMatch(/no operating hours given \(blank or 0 h per year\): no energy cost counted and no life-cycle cost/);
    expect(html).not.toContain("lcc-line-7");
    expect(report(e)).toMatch(/life-cycle cost \(present value\): — \(no operating hours given/);
  });
  it("0 per kWh: the energy is shown, the life-cycle cost is not; with a tariff it is", () => {
    const e = energyOf({ tariffPerKWh: 0 });
    expect(rowText(e)["Energy per year over the duty cycle"]).toMatch(/^\d+ kWh$/);
    expect(rowText(e)["Life-cycle cost (present value)"]).toMatch(/^— \(no energy tariff given/);
    const given = energyOf({ tariffPerKWh: 0.2 });
    expect(rowText(given)["Life-cycle cost (present value)"]).toMatch(/^\d+\.\d\d GBP over 15 years — ▲ priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow.*? is not in this cost$/); // the circulator profile's 25 % step (lcc-range-note.ts)
    expect(panel(given)).not.toContain("cost-missing-7");
    expect(panel(given)).toContain("lcc-line-7");
  });
});
