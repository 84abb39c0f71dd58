// A duty cycle with no step counted (each step with hours not met) gives no energy and no life-cycle cost: "not computed" with
// the reason on the table, the panel, the report, the chart and the CSV (it read "0 kWh (incomplete …)" and the purchase
// price as a life-cycle cost); and the two energy costs per year each name the hours they count. Check values: the fixture's
// invented pump (energy-fixture.ts), a 150 % step it cannot reach (the engine's duty cycle says "not met"), hand arithmetic.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateEnergyPanel, energyRows } from "./CandidateEnergy";
import { SelectionEnergy } from "./SelectionEnergy";
import { CandidateTable } from "./CandidateTable";
import { fixtureEnergy as energyOf } from "~/lib/projects/energy-fixture";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate } from "~/lib/projects/hydraulics";
import { selectionCsv } from "~/lib/projects/selection-export.server";
import type { FrozenSelection } from "~/lib/projects/selections.server";
import type { WorkbenchView } from "~/lib/projects/workbench-view";
import { SI_UNITS } from "~/lib/shared/units";

type E = ReturnType<typeof energyOf>;
const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const panel = (e: E) => text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false })));
const report = (e: E) => text(renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump A", energy: e }, unitSystem: SI_UNITS, currency: "EUR" })));
const rows = (e: E) => Object.fromEntries(energyRows("EUR").map(([label, cell]) => [label, String(cell({ id: 1, label: "P", energy: e }))]));
const withSteps = (steps: { flowFraction: number; hours: number }[]) => energyOf({ energy: { ...defaultSystemInput().energy!, control: "fixed-speed", profile: steps, years: 10 } }, 250000);
/** The fixture's invented pump (energy-fixture.ts's points) evaluated on the default system, for the CSV's figures. */
const PUMP = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q / 3600, head: h, efficiency: e, power: null, npshr: null }));
const csvOf = (e: E) => selectionCsv(1, "t", { system: { input: defaultSystemInput() }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: evaluateCandidate(defaultSystemInput(), { points: PUMP, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT), energy: e } as unknown as FrozenSelection);
const csvFigure = (csv: string, name: string) => new RegExp(`^figures,${name},("[^"]*"|[^,]*),`, "m").exec(csv)?.[1] ?? null;

describe("no step counted: energy and life-cycle cost not computed, with the reason", () => {
  const none = withSteps([{ flowFraction: 1.5, hours: 1000 }]);
  const why = "no step of the duty cycle counted (1 of 1 step not met)";
  it("the edge hunt's case: one step at 150 % (fixed speed), price 2500", () => {
    expect(none.cycle!.steps[0].status).not.toMatch(/^(ok|gravity-flow|throttled-at-min-on-curve-speed)$/);
    expect(none.lcc).toBeNull();
    expect(none.annualCost).toBeNull();
    expect(none.costMissing).toBe(why);
    expect(rows(none)["Energy per year over the duty cycle"]).toBe(`not computed (${why})`);
    expect(rows(none)["Life-cycle cost (present value)"]).toBe(`not computed (${why})`);
    expect(panel(none)).toContain(`Not drawn: 1 Pump A: not computed (${why}).`);
    expect(panel(none)).not.toMatch(/2500\.00 EUR over 10 years/);
    expect(report(none)).toContain(`Energy per year over 1 step, 1000 h/yr: not computed (${why}); life-cycle cost (present value): not computed (${why}).`);
    const csv = csvOf(none);
    expect(csvFigure(csv, "cycle_annual_energy_electrical")).toBe(`not computed: ${why}`);
    expect(csvFigure(csv, "lcc_total_present_value")).toBe(`not computed: ${why}`);
    expect(csv).not.toMatch(/^life_cycle_cost,/m);
  });
  it("a selection frozen before (its life-cycle cost kept) reads the same", () => {
    const withLcc = withSteps([{ flowFraction: 1.5, hours: 1000 }, { flowFraction: 1, hours: 1 }]).lcc;
    const frozen = { ...none, lcc: withLcc, annualCost: 0, costMissing: null };
    expect(rows(frozen)["Life-cycle cost (present value)"]).toBe(`not computed (${why})`);
    expect(csvFigure(csvOf(frozen), "lcc_total_present_value")).toBe(`not computed: ${why}`);
    expect(csvOf(frozen)).not.toMatch(/^life_cycle_cost,/m);
  });
  it("flips when a step that is met gets its first hour: 0 h not computed, 0.001 h computed (and marked incomplete)", () => {
    const zero = withSteps([{ flowFraction: 1.5, hours: 1000 }, { flowFraction: 1, hours: 0 }]);
    const some = withSteps([{ flowFraction: 1.5, hours: 1000 }, { flowFraction: 1, hours: 0.001 }]);
    expect(zero.costMissing).toBe("no step of the duty cycle counted (1 of 2 steps not met)");
    expect(zero.lcc).toBeNull();
    expect(some.costMissing).toBeNull();
    expect(some.lcc).not.toBeNull();
    expect(rows(some)["Life-cycle cost (present value)"]).toMatch(/^\d+\.\d\d EUR over 10 years \(incomplete: 1 of 2 steps not met\)$/);
  });
});

describe("each energy cost per year names the hours it counts", () => {
  // Operating hours 8000 and a profile of 1000 h at 100 %: the operating point's cost counts 8000 h, the cycle's 1000 h.
  const input = { ...defaultSystemInput(), hoursPerYear: 8000, energy: { ...defaultSystemInput().energy!, profile: [{ flowFraction: 1, hours: 1000 }] } };
  const r = evaluateCandidate(input, { points: PUMP, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT, { currency: "EUR" });
  const e = energyOf({ hoursPerYear: 8000, energy: input.energy });
  it("the candidates table: at the operating point × 8000 h/yr; the duty cycle's rows and total: 1000 h/yr", () => {
    const view = { evaluation: null, systemError: null, flowMax: 0.02, needsReview: [], candidates: [{ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: DEFAULT_ADJUSTMENT, result: r, error: null, energy: e }] } as unknown as WorkbenchView;
    const html = text(renderToStaticMarkup(createElement(CandidateTable, { view, unitSystem: SI_UNITS })));
    expect(r.figures!.motor.hoursPerYear).toBe(8000);
    expect(html).toMatch(/Energy cost per year at the operating point × 8000 h\/yr \d+\.\d\d EUR /);
    expect(html).toMatch(/Energy per year at the operating point × 8000 h\/yr \(electrical, every running hour there\) \d+ kWh /);
    expect(html).toMatch(/Energy per year over the duty cycle, 1000 h\/yr \d+ kWh /);
    expect(panel(e)).toMatch(/\d+ kWh · \d+\.\d\d EUR \(duty cycle, 1000 h\/yr\)/);
    expect(report(e)).toMatch(/Energy per year over 1 step, 1000 h\/yr: \d+ kWh;/);
    // English number (common practice): one step, two steps.
    expect(report(withSteps([{ flowFraction: 1.5, hours: 1000 }, { flowFraction: 1, hours: 1 }]))).toMatch(/Energy per year over 2 steps, 1001 h\/yr: /);
  });
  it("the CSV gives each cost's hours", () => {
    const csv = selectionCsv(1, "t", { system: { input }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: r, energy: e } as unknown as FrozenSelection);
    expect(csvFigure(csv, "annual_cost_hours")).toBe("8000");
    expect(csvFigure(csv, "cycle_energy_cost_hours")).toBe("1000");
  });
});
