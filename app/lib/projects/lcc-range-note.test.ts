// The life-cycle cost priced a pump's energy at duty-cycle steps where it runs below 50 % of its BEP flow, or below the
// maker's minimum continuous flow, as if it ran there like anywhere else, and its line said nothing: the step's note sat
// in the step table, the cost's line (candidates table row, the panel, the printed report, the CSV) read "25336.95 EUR over
// 15 years". Now the cost's line names each such priced step with one pump's flow, the limit and the rule
// (lcc-range-note.ts); 0 h steps (never run, not priced) and steps at or above the limit say nothing there.
// Check values by hand: an invented pump whose figures name its BEP at 36 m³/h, 15.5 m; the default system's duty 36 m³/h
// (0.01 m³/s); at fixed speed a step at f of the duty runs the pump at f × 36 m³/h, so its share of the BEP flow is f
// exactly and the 50 % rule (engine stepPor.ts, common practice, from memory) flips at f = 0.5; a maker's minimum of
// 12 m³/h flips at f = 12/36.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { CandidateEnergyPanel, energyRows, lccText } from "~/components/CandidateEnergy";
import { candidateEnergy, lccRangeNoteOf, type CandidateEnergy } from "./energy";
import { defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, DEFAULT_ADJUSTMENT, type SystemInput } from "./hydraulics";
import { selectionCsv } from "./selection-export.server";
import type { FrozenSelection } from "./selections.server";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";

const M3H = 1 / 3600;
const curve = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null }));
const minFlow = (m3h: number) => ({ published: m3h * M3H, method: "none" as const, ratio: 1, atPump: m3h * M3H, dutyFlow: 0.01, running: 1, dutyPerPump: 0.01, below: false });
const evaluated = (maker?: number) => ({
  adjustment: { method: "none" as const, arrangement: "single" as const, dutyPumps: 1, serviceFactor: 1 },
  result: { ratio: 1, curve, operating: { flow: 36.5 * M3H, head: 15.3 }, figures: { motor: { rating: 3000, efficiency: 0.87 }, bepFlow: 36 * M3H, bepHead: 15.5 }, ...(maker ? { minFlow: minFlow(maker) } : {}) },
});
const base = defaultSystemInput();
const input = (steps: [number, number][]): SystemInput => ({ ...base, energy: { ...base.energy!, control: "fixed-speed", profile: steps.map(([f, hours]) => ({ flowFraction: f, hours })) } });
/** The energy as a page shows it: quantity tokens rendered in SI (m³/h). */
const energyOf = (steps: [number, number][], maker?: number, price: number | null = 250000): CandidateEnergy => {
  const i = input(steps);
  return renderDeep(candidateEnergy(i, systemSpec(i), fluidOf(i).density, evaluated(maker), price), SI_UNITS);
};
const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const panel = (e: CandidateEnergy) => text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false })));
const tableCell = (e: CandidateEnergy) => renderToStaticMarkup(createElement("span", null, energyRows("EUR").find(([label]) => label.startsWith("Life-cycle cost"))![1]({ id: 7, label: "Pump A", energy: e })));
/** The candidates table's cell as read (tags taken out). */
const tableRow = (e: CandidateEnergy) => text(tableCell(e)).trim();
const csvFigure = (e: CandidateEnergy, name: string) => {
  const frozen = { system: { input: defaultSystemInput() }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: evaluateCandidate(defaultSystemInput(), { points: curve, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT), energy: e } as unknown as FrozenSelection;
  return Papa.parse<string[]>(selectionCsv(1, "t", frozen).trim()).data.find((r) => r[1] === name)?.[2];
};

describe("below 50 % of BEP flow: the life-cycle cost's line names the step, its flow and the rule", () => {
  const e = energyOf([[1, 2000], [0.25, 3000]]);
  const NOTE = "priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow (a common lower bound for continuous running; common practice, from memory): 25 % flow, 3000 h: 9.00 m³/h a pump, 25 % of its BEP flow 36.0 m³/h; their wear (recirculation, heating, vibration, bearings and seals) is not in this cost";
  it("the note, hand figures: 0.25 × 36 m³/h = 9.00 m³/h, 9 / 36 = 25 %", () => expect(lccRangeNoteOf(e)).toBe(NOTE));
  it("the candidates table's row, the printed line, the panel's cost line and the CSV beside the total", () => {
    // The table's cell: the note on screen, left out of print (the printed energy line carries it once).
    expect(tableCell(e)).toBe(`<span>${lccText(e, "EUR", false, false)}<span class="no-print"> — ▲ ${NOTE}</span></span>`);
    expect(lccText(e, "EUR")).toMatch(/^\d+\.\d\d EUR over 15 years — ▲ priced as if the pump ran normally at 1 step/);
    expect(lccText(e, "EUR", true)).toContain(`a discount rate of 5 %/year — ▲ ${NOTE}`);
    expect(panel(e)).toContain(`▲ Life-cycle cost ${NOTE}.`);
    expect(csvFigure(e, "lcc_range_note")).toBe(NOTE);
  });
  it("flips at 50 % of BEP flow: 49.99 % named, 50 % not (left of the POR: a note at the step only)", () => {
    expect(lccRangeNoteOf(energyOf([[1, 2000], [0.4999, 3000]]))).toMatch(/: 50 % flow, 3000 h: 17\.99\d* m³\/h a pump, 49\.99 % of its BEP flow 36\.0 m³\/h;/);
    const at = energyOf([[1, 2000], [0.5, 3000]]);
    expect(at.cycle!.warnings.map((w) => w.code)).toContain("step-outside-por");
    expect(lccRangeNoteOf(at)).toBeNull();
    expect(tableRow(at)).not.toContain("▲");
    expect(csvFigure(at, "lcc_range_note")).toBe("");
  });
  it("a step of 0 h (never run, not priced) is not named; the same step with 0.01 h is", () => {
    expect(lccRangeNoteOf(energyOf([[1, 2000], [0.25, 0]]))).toBeNull();
    expect(lccRangeNoteOf(energyOf([[1, 2000], [0.25, 0.01]]))).toContain("25 % flow, 0.01 h: 9.00 m³/h a pump");
  });
  it("two steps: both named, in order", () => {
    expect(lccRangeNoteOf(energyOf([[1, 2000], [0.25, 3000], [0.4, 1000]]))).toContain("at 2 steps outside its allowable flow range — below 50 % of BEP flow (a common lower bound for continuous running; common practice, from memory): 25 % flow, 3000 h: 9.00 m³/h a pump, 25 % of its BEP flow 36.0 m³/h; 40 % flow, 1000 h: 14.4 m³/h a pump, 40 % of its BEP flow 36.0 m³/h;");
  });
  it("a selection frozen before the note was kept: worked out again from its cycle, the ratio without the flows", () => {
    const { lccRangeNote: _n, ...old } = e;
    const oldCycle = { ...old.cycle!, warnings: old.cycle!.warnings.map((w) => { const { pumpFlow: _p, bepFlow: _b, ...rest } = w as typeof w & { pumpFlow?: number; bepFlow?: number }; return rest; }) };
    expect(lccRangeNoteOf({ ...old, cycle: oldCycle })).toContain("common practice, from memory): 25 % flow, 3000 h: 25 % of its BEP flow; their wear");
  });
});

describe("below the maker's minimum continuous flow (12 m³/h): named with both flows and the maker's rule", () => {
  it("f = 0.3: 10.8 m³/h a pump < 12.0 m³/h", () => {
    expect(lccRangeNoteOf(energyOf([[1, 2000], [0.3, 3000]], 12))).toContain("at 1 step outside its allowable flow range — below the maker's minimum continuous flow (no continuous running below it, the maker's rule): 30 % flow, 3000 h: 10.8 m³/h a pump < 12.0 m³/h;");
  });
  it("flips at the figure: 12 m³/h × (1 − 1e-6) named against the maker; exactly 12 m³/h is at it (33 % of BEP flow: the 50 % rule instead)", () => {
    expect(lccRangeNoteOf(energyOf([[1, 2000], [(1 / 3) * (1 - 1e-6), 3000]], 12))).toMatch(/below the maker's minimum continuous flow .*: 33 % flow, 3000 h: 11\.99999\d* m³\/h a pump < 12\.0 m³\/h/);
    const at = lccRangeNoteOf(energyOf([[1, 2000], [1 / 3, 3000]], 12))!;
    expect(at).not.toContain("maker's minimum continuous flow (no continuous");
    expect(at).toContain("33 % flow, 3000 h: 12.0 m³/h a pump, 33 % of its BEP flow 36.0 m³/h");
  });
});

describe("a purchase price of 0 and none (hand: 1000 h at 2356.79 W = 2356.79 kWh × 0.2 = 471.36 EUR a year)", () => {
  it("0: a price, the total the energy's present value alone, said as a price; none: the line says the cost is the energy alone", () => {
    const zero = energyOf([[1, 1000]], undefined, 0), none = energyOf([[1, 1000]], undefined, null);
    expect(zero.lcc!.total).toBe(none.lcc!.total);
    expect(zero.lcc!.total).toBeCloseTo(zero.lcc!.energyPresentValue, 9);
    expect(tableRow(zero)).toMatch(/^\d+\.\d\d EUR over 15 years$/);
    expect(tableRow(none)).toMatch(/^\d+\.\d\d EUR over 15 years \(purchase price not given: energy alone\)$/);
    expect(lccText(none, "EUR", true)).toContain("discount rate of 5 %/year (purchase price not given: energy alone)");
  });
});
