// Two edges of a duty cycle said alike on the system page's step table, the report's printed notes and the selection CSV:
// (1) a step of 0 h that the pump cannot reach: it never runs, so the totals count nothing missing (cycleTotals.ts); the
// step said "not met" beside a total with no incomplete mark and the CSV's cycle_steps_not_met 0; now "not met, at 0 h a
// year: never run, so nothing is missing from the totals" everywhere. (2) A 0 % flow step: hours with the system at zero
// demand are real; it was refused ("must be above 0 %"); now the pump is stopped, 0 kWh, "stopped, no demand", counted
// (common practice: a pump with nothing to deliver is switched off). Check values: the fixture's invented pump
// (energy-fixture.ts), whose curve ends at 55 m³/h (a 150 % step of the 36 m³/h duty, 54 m³/h, is not reached: the engine
// says so); hand arithmetic (0 kWh).
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateEnergyPanel } from "./CandidateEnergy";
import { cycleNoteLines } from "./cycle-notes";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate } from "~/lib/projects/hydraulics";
import { readSystemForm } from "~/lib/projects/system-form";
import { selectionCsv } from "~/lib/projects/selection-export.server";
import type { FrozenSelection } from "~/lib/projects/selections.server";
import { SI_UNITS } from "~/lib/shared/units";
import Papa from "papaparse";

const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const PUMP = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q / 3600, head: h, efficiency: e, power: null, npshr: null }));
const energyOf = (profile: { flowFraction: number; hours: number }[]) => fixtureEnergy({ energy: { ...defaultSystemInput().energy!, control: "fixed-speed", profile } });
type E = ReturnType<typeof energyOf>;
const page = (e: E) => text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false })));
const csvSteps = (e: E) => {
  const csv = selectionCsv(1, "t", { system: { input: defaultSystemInput() }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: evaluateCandidate(defaultSystemInput(), { points: PUMP, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT), energy: e } as unknown as FrozenSelection);
  return { csv, steps: Papa.parse<string[]>(csv.trim()).data.filter((r) => r[0] === "duty_cycle") };
};

describe("a step of 0 h the pump cannot reach", () => {
  const e = energyOf([{ flowFraction: 1, hours: 2000 }, { flowFraction: 1.5, hours: 0 }]);
  const SAID = "not met, at 0 h a year: never run, so nothing is missing from the totals";
  it("the engine: not met, but the cycle is complete (control)", () => {
    expect(e.cycle!.steps[1].status).toBe("beyond-curve");
    expect(e.cycle!.complete).toBe(true);
  });
  it("page, printed notes and CSV say the same words, in agreement with the complete totals", () => {
    expect(page(e)).toContain(`▲ ${SAID}: at `);
    expect(cycleNoteLines(e.cycle!)).toEqual([expect.stringMatching(new RegExp(`^Step at 150 % flow, 0 h: ${SAID} — at `))]);
    const { csv, steps } = csvSteps(e);
    expect(steps[1].slice(0, 7)).toEqual(["duty_cycle", "2", "1.5", "0", "0.015", "7.505", SAID]);
    expect(csv).toMatch(/^figures,cycle_complete,true,/m);
    expect(csv).toMatch(/^figures,cycle_steps_not_met,0,/m);
  });
  it("with hours, the same step is plainly not met and the cycle incomplete (the flip at 0 h)", () => {
    const with1 = energyOf([{ flowFraction: 1, hours: 2000 }, { flowFraction: 1.5, hours: 1 }]);
    expect(with1.cycle!.complete).toBe(false);
    expect(csvSteps(with1).steps[1].slice(3, 7)).toEqual(["1", "0.015", "7.505", "not met"]);
  });
});

/** A whole system form (closed loop, one discharge run), as the editor posts it. */
const FORM: Record<string, string> = {
  name: "Loop", mode: "closed-loop", temperature: "20", staticLow: "0", staticHigh: "0", suctionSurfacePressure: "101.325", dutyFlow: "60", dutyHead: "20",
  hoursPerYear: "5000", tariffPerKWh: "0.2", runCount: "1", "run.0.side": "discharge", "run.0.diameter": "125", "run.0.length": "400", "run.0.material": "steel", "energy.years": "15",
};

describe("a 0 % flow step: no demand, the pump stopped", () => {
  const e = energyOf([{ flowFraction: 1, hours: 2000 }, { flowFraction: 0, hours: 3000 }]);
  it("the engine: stopped, 0 kWh, counted; the hours in the total, the energy only the 100 % step's", () => {
    const s = e.cycle!.steps[1];
    expect([s.status, s.energyKWh, s.electricalPower, s.flow]).toEqual(["no-demand", 0, 0, 0]);
    expect(e.cycle!.complete).toBe(true);
    expect(e.cycle!.totalHours).toBe(5000);
    expect(e.cycle!.annualEnergyKWh).toBe(e.cycle!.steps[0].energyKWh);
  });
  it("page, printed notes and CSV: 'stopped, no demand', 0 kWh", () => {
    expect(page(e)).toMatch(/0 % 0\.000 m³\/h — stopped, no demand: 0 % flow: no demand, so the pump is taken as stopped, 0 kWh .* 3000 0 kWh/);
    expect(cycleNoteLines(e.cycle!)).toEqual([expect.stringMatching(/^Step at 0 % flow, 3000 h: stopped, no demand — 0 % flow: no demand, so the pump is taken as stopped, 0 kWh/)]);
    const cells = csvSteps(e).steps[1];
    expect([cells[2], cells[3], cells[6], cells[14], cells[15]]).toEqual(["0", "3000", "stopped, no demand", "0", "no-demand"]); // flow fraction, hours, status, energy_kwh, engine_status
  });
  it("the form takes 0 % (it refused it); a negative flow is still refused, with what 0 % means", () => {
    const form = (pct: string) => {
      const vals: Record<string, string> = { ...FORM, "energy.control": "fixed-speed", "energy.profileKind": "user", "energy.step.0.pct": "100", "energy.step.0.hours": "2000", "energy.step.1.pct": pct, "energy.step.1.hours": "3000" };
      return readSystemForm({ get: (k: string) => vals[k] ?? null }, SI_UNITS);
    };
    const ok = form("0");
    expect(ok.errors).toEqual({});
    expect(ok.input!.energy!.profile).toEqual([{ flowFraction: 1, hours: 2000 }, { flowFraction: 0, hours: 3000 }]);
    expect(form("-5").errors["energy.step.1.pct"]).toBe("A step's flow must be from 0 % (no demand, the pump stopped) to 150 % of the duty flow, not −5.0 %.");
  });
});
