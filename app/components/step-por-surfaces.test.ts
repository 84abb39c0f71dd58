// A duty-cycle step off the BEP (engine stepPor.ts: outside the preferred operating region 70–120 % of BEP flow, ANSI/HI
// 9.6.3 from memory; below 50 %, a common lower bound for continuous running, from memory) on the system page's step table,
// the printed report's notes and the selection CSV's step row; one pump, two in series (each passes the whole flow) and two
// in parallel staged by demand (each its share). Check values: the energy fixture's invented pump (energy-fixture.ts, BEP
// 36 m³/h at 74 %) on the default system (duty 36 m³/h), fixed speed; ratios by hand: 9/36 = 25 %, 24.84/36 = 69 %,
// 25.56/36 = 71 %, (46.8/2)/36 = 65 %.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import Papa from "papaparse";
import { CandidateEnergyPanel } from "./CandidateEnergy";
import { SelectionEnergy } from "./SelectionEnergy";
import { cycleNoteLines } from "./cycle-notes";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { candidateEnergy } from "~/lib/projects/energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec } from "~/lib/projects/hydraulics";
import { selectionCsv } from "~/lib/projects/selection-export.server";
import type { FrozenSelection } from "~/lib/projects/selections.server";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";

type E = ReturnType<typeof fixtureEnergy>;
const M3H = 1 / 3600;
// The pages render quantity tokens in the user's units (renderDeep on the loader's data); here in SI as the CSV writes them.
const text = (html: string) => renderUnits(html, SI_UNITS).replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const ROWS = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]];
const PUMP = ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null }));
const steps = (fs: number[]) => ({ energy: { ...defaultSystemInput().energy!, control: "fixed-speed" as const, profile: fs.map((flowFraction) => ({ flowFraction, hours: 2000 })) } });
const panel = (e: E) => text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false })));
const report = (e: E) => text(renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump A", energy: e }, unitSystem: SI_UNITS, currency: "EUR" })));
const csvSteps = (e: E) => {
  const input = defaultSystemInput();
  const csv = selectionCsv(1, "t", { system: { input }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: evaluateCandidate(input, { points: PUMP, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT), energy: e } as unknown as FrozenSelection);
  return Papa.parse<string[]>(csv.trim()).data.filter((r) => r[0] === "duty_cycle").map((r) => renderUnits(r[r.length - 1], SI_UNITS));
};
/** Two of the fixture's pump in series or in parallel: the candidate's curve is theirs together (as hydraulics combines them). */
function arranged(arrangement: "series" | "parallel", fs: number[]): E {
  const input = { ...defaultSystemInput(), ...steps(fs) };
  const curve = ROWS.map(([q, h, e]) => ({ flow: (arrangement === "parallel" ? 2 : 1) * q * M3H, head: (arrangement === "series" ? 2 : 1) * h, efficiency: e, power: null, npshr: null }));
  const evaluated = { adjustment: { method: "none" as const, arrangement, dutyPumps: 2, serviceFactor: 1 }, result: { ratio: 1, curve, operating: { flow: 40 * M3H, head: 18 }, figures: { motor: { rating: 6000, efficiency: 0.87 } } } };
  return candidateEnergy(input, systemSpec(input), fluidOf(input).density, evaluated, null);
}

describe("one pump, fixed speed: the note at its step on every surface", () => {
  const e = fixtureEnergy(steps([0.25, 0.69, 0.71, 1]));
  it("25 % (25 % of BEP flow): the minimum-flow note; 69 %: outside the POR; 71 % and 100 %: nothing", () => {
    expect(e.cycle!.steps.map((s) => s.status)).toEqual(["ok", "ok", "ok", "ok"]);
    const p = panel(e);
    expect(p).toMatch(/▲ at 25 % flow the pump runs at 9\.00 m³\/h, 25 % of its BEP flow, 36\.0 m³\/h, for 2000 h a year: below 50 % of BEP flow, a common lower bound for continuous running .*no maker's minimum flow is recorded for this curve \(check the maker's data sheet\); and outside the preferred operating region 70–120 % of BEP flow \(ANSI\/HI 9\.6\.3, from memory\)/);
    expect(p).toMatch(/▲ at 69 % flow the pump runs at [\d.]+ m³\/h, 69 % of its BEP flow, 36\.0 m³\/h, for 2000 h a year: left of \(below\) the preferred operating region/);
    expect(p).not.toMatch(/at (71|100) % flow the pump runs at/);
    // The printed report's notes (no step table on paper): the steps off the BEP on one line, the rule said once, so a
    // cycle with several such steps keeps the report to its two pages (e2e/report-print.spec.ts); the screen report's
    // step table keeps each note in full.
    const lines = cycleNoteLines(e.cycle!);
    expect(lines).toEqual([
      "Steps outside the preferred operating region 70–120 % of BEP flow (ANSI/HI 9.6.3, from memory), each pump's flow as a share of its BEP flow at its speed: " +
        "25 % flow, 2000 h at 25 %*; 69 % flow, 2000 h at 69 % (* below 50 %, a common lower bound for continuous running, from memory; no maker's minimum flow is " +
        "recorded for this curve — check the maker's data sheet: recirculation, heating, vibration). Notes, not failures.",
    ]);
    const printed = report(e);
    expect(printed).toContain(lines[0]);
    expect(printed).toMatch(/▲ at 25 % flow the pump runs at 9\.00 m³\/h, 25 % of its BEP flow/);
    expect(printed).toMatch(/▲ at 69 % flow the pump runs at [\d.]+ m³\/h, 69 % of its BEP flow/);
    expect(printed).not.toMatch(/Step at (71|100) % flow, 2000 h: at/);
    // Inside the POR only by the digits: 69.96 % reads "69.96 %", never "70 %" beside the rule's 70 % (quantityText fmtPctExact).
    const edge = fixtureEnergy(steps([0.6996]));
    expect(cycleNoteLines(edge.cycle!)[0]).toMatch(/: 70 % flow, 2000 h at 69\.96 %\. Notes, not failures\.$/); // the step named by its share of the duty flow, as every step is
    const csv = csvSteps(e);
    expect(csv[0]).toMatch(/^at 25 % flow the pump runs at 9\.00 m³\/h, 25 % of its BEP flow, 36\.0 m³\/h, for 2000 h a year: below 50 % of BEP flow/);
    expect(csv[1]).toMatch(/^at 69 % flow the pump runs at [\d.]+ m³\/h, 69 % of its BEP flow/);
    expect(csv[2]).toBe("");
    expect(csv[3]).toBe("");
  });
});

describe("two pumps: each pump's ratio", () => {
  it("in series each passes the step's whole flow: at 25 %, 9 m³/h, 25 % of one pump's 36 m³/h", () => {
    const e = arranged("series", [0.25]);
    expect(panel(e)).toMatch(/▲ at 25 % flow each of the 2 pumps in series passes the step's 9\.00 m³\/h, 25 % of its BEP flow, 36\.0 m³\/h/);
  });
  it("in parallel staged by demand, 2 running at 130 %: each takes its share, 23.4 m³/h of 46.8, 65 %", () => {
    const e = arranged("parallel", [1.3, 0.25]);
    expect(e.cycle!.steps.map((s) => s.pumpsRunning)).toEqual([2, 1]);
    expect(panel(e)).toMatch(/▲ at 130 % flow each of the 2 pumps running takes its share, 23\.4 m³\/h of the step's 46\.8 m³\/h, 65 % of its BEP flow, 36\.0 m³\/h/);
    expect(panel(e)).toMatch(/▲ at 25 % flow the one pump running takes the step's whole 9\.00 m³\/h, 25 % of its BEP flow, 36\.0 m³\/h/);
  });
});
