// A duty-cycle step of 0 h a year never runs. Its figures are still worked out and shown, and so were the notes at it —
// a motor into its service factor "for 0 h a year", a motor overloading, a staged step's NPSH shortfall — said as at a step
// that runs, while the BEP note (stepPor.ts) was dropped there: two rules for one step. Decided (decision "npshzero"): every
// note at a 0 h step is kept and marked "(0 h a year: information only)" — its figures are on the row beside it, and a
// load of 116 % or an NPSH short there is worth knowing before the hours are ever set, but it is no finding about the
// pump as it will run; none of them qualifies the verdict (verdict-staged-npsh.ts) or counts against the cycle. The same
// words on the step table (system page, report), the printed report's notes and the CSV's step rows. A step of 0.01 h
// carries the same notes unmarked (the flip).
// Check values: the knot curve of engine/test/curves.ts (600 W at its design knot), the energy fixture's invented pump
// (BEP near 36 m³/h, so 25 % of the duty is about 25 % of its BEP flow: the below-50 % note), the staging fixture of
// energy-staging-npsh.test.ts (one pump alone short of NPSH margin at 40 % flow); hand arithmetic.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { dutyCycleEnergy, NEVER_RUN_NOTE, stagedDutyCycleEnergy } from "~/engine";
import { knotCycle } from "~/engine/test/curves";
import { CandidateEnergyPanel } from "./CandidateEnergy";
import { cycleNoteLines } from "./cycle-notes";
import { candidateEnergy, stepWarnings } from "~/lib/projects/energy";
import { fixtureEnergy } from "~/lib/projects/energy-fixture";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import { selectionCsv } from "~/lib/projects/selection-export.server";
import type { FrozenSelection } from "~/lib/projects/selections.server";
import { verdictStagedNpshNote } from "~/lib/projects/verdict-staged-npsh";
import { SI_UNITS } from "~/lib/shared/units";

const MARK = "(0 h a year: information only)";
const at = (r: { warnings: { parameter?: string | null; message: string; code: string }[] }, i: number) => r.warnings.filter((w) => w.parameter === `profile[${i}]`);
const motorAt = (r: Parameters<typeof at>[0], i: number) => at(r, i).filter((w) => /^motor-/.test(w.code));

describe("the engine: every note at a 0 h step marked, the same step with 0.01 h not", () => {
  const base = knotCycle(); // 600 W at its design knot
  it("the mark's words", () => expect(NEVER_RUN_NOTE).toBe(MARK));
  it("a motor into its service factor (599.9 W rating, SF 1.15): marked at 0 h (it read 'for 0 h a year; …' as a finding)", () => {
    const r = dutyCycleEnergy({ ...base, motor: { rating: 599.9, efficiency: 0.8, serviceFactor: 1.15 }, profile: [{ flowFraction: 1, hours: 0 }, { flowFraction: 1, hours: 0.01 }] });
    expect(motorAt(r, 0).map((w) => w.code)).toEqual(["motor-service-factor-step"]);
    expect(motorAt(r, 0)[0].message.endsWith(` ${MARK}`)).toBe(true);
    expect(motorAt(r, 1).map((w) => w.code)).toEqual(["motor-service-factor-step"]);
    expect(motorAt(r, 1)[0].message).not.toContain(MARK);
    for (const w of at(r, 0)) expect(w.message.endsWith(` ${MARK}`), w.code).toBe(true); // every note at the step (its BEP note too)
  });
  it("a motor overloading (SF 1): marked at 0 h, not at 0.01 h", () => {
    const r = dutyCycleEnergy({ ...base, motor: { rating: 500, efficiency: 0.8 }, profile: [{ flowFraction: 1, hours: 0 }, { flowFraction: 1, hours: 0.01 }] });
    expect(motorAt(r, 0).map((w) => [w.code, w.message.endsWith(` ${MARK}`)])).toEqual([["motor-overload-step", true]]);
    expect(motorAt(r, 1).map((w) => [w.code, w.message.includes(MARK)])).toEqual([["motor-overload-step", false]]);
  });
  it("pumps in parallel staged by demand: a 0 h step's notes marked once, after the staging's own words", () => {
    // 20 % flow: one pump runs, far left of its BEP (the below-50 % note); its motor small enough to run into its service factor.
    const r = stagedDutyCycleEnergy({ ...base, pumpCurve: base.curve, dutyPumps: 2, motor: { rating: 600, efficiency: 0.8 }, profile: [{ flowFraction: 0.2, hours: 0 }, { flowFraction: 0.2, hours: 0.01 }] });
    const zero = at(r, 0), some = at(r, 1);
    expect(zero.length).toBeGreaterThan(0);
    for (const w of zero) {
      expect(w.message.endsWith(` ${MARK}`), w.message).toBe(true);
      expect(w.message.split(MARK).length).toBe(2); // once
    }
    expect(some.map((w) => w.code)).toEqual(zero.map((w) => w.code));
    for (const w of some) expect(w.message).not.toContain(MARK);
  });
});

const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const PUMP = [[5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q / 3600, head: h, efficiency: e, power: null, npshr: null }));
type E = ReturnType<typeof fixtureEnergy>;
const page = (e: E) => text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false })));
const csvStepWarnings = (e: E) => Papa.parse<string[]>(selectionCsv(1, "t", { system: { input: defaultSystemInput() }, pump: { library: { traced: null } }, adjustment: DEFAULT_ADJUSTMENT, result: evaluateCandidate(defaultSystemInput(), { points: PUMP, speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT), energy: e } as unknown as FrozenSelection).trim()).data.filter((r) => r[0] === "duty_cycle").map((r) => r[r.length - 1]);

describe("the BEP note at a 0 h step (25 % flow, below 50 % of BEP flow): given and marked, on the step table, the printed notes and the CSV", () => {
  const e = fixtureEnergy({ energy: { ...defaultSystemInput().energy!, control: "fixed-speed", profile: [{ flowFraction: 1, hours: 2000 }, { flowFraction: 0.25, hours: 0 }, { flowFraction: 0.25, hours: 0.01 }] } });
  it("the engine gives it at 0 h, marked (it gave none), and at 0.01 h unmarked", () => {
    const zero = at(e.cycle!, 1), some = at(e.cycle!, 2);
    expect(zero.map((w) => w.code)).toEqual(["step-below-min-flow"]);
    expect(zero[0].message).toMatch(/for 0 h a year: .* \(0 h a year: information only\)$/);
    expect(some.map((w) => [w.code, w.message.includes(MARK)])).toEqual([["step-below-min-flow", false]]);
  });
  it("the step table, the printed notes and the CSV's step row say it with the mark; the 0.01 h step without", () => {
    expect(page(e)).toContain(`for 0 h a year: below 50 % of BEP flow`);
    expect(page(e).split(MARK).length - 1).toBe(1);
    const printed = cycleNoteLines(e.cycle!).join("\n");
    expect(printed).toMatch(/25 % flow, 0 h at \d+ %\* \(0 h a year: information only\); 25 % flow, 0\.01 h at \d+ %\*/);
    const csv = csvStepWarnings(e);
    expect(csv[1]).toMatch(/\(0 h a year: information only\)$/);
    expect(csv[2]).not.toContain(MARK);
    expect(csv[2]).toMatch(/for 0\.01 h a year/);
  });
  it("a cycle frozen before the mark (its 0 h notes unmarked) reads the same on every surface", () => {
    const old = { ...e.cycle!, warnings: e.cycle!.warnings.map((w) => ({ ...w, message: w.message.replace(` ${MARK}`, "") })) };
    expect(stepWarnings(old, 1)).toEqual(stepWarnings(e.cycle!, 1));
    expect(stepWarnings(old, 1)[0].endsWith(MARK)).toBe(true);
    expect(stepWarnings(old, 2)[0]).not.toContain(MARK);
  });
});

describe("a staged step's NPSH at 0 h (one of two pumps running, short of margin): marked, and it qualifies no verdict", () => {
  const M3H = 1 / 3600;
  const ROWS = [[0, 22, null, null], [5, 21.8, 0.3, 1.2], [10, 21.5, 0.45, 1.3], [20, 20, 0.62, 1.6], [30, 17.5, 0.72, 2.0], [36, 15.5, 0.74, 2.4], [45, 12, 0.7, 3.2], [55, 7, 0.6, 4.5]] as const;
  const set = { points: ROWS.map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: n })), speed: 2900, impellerDiameter: 0.2 };
  const base = defaultSystemInput();
  const input = (hours: number): SystemInput => ({ ...base, suctionStaticHead: -7.8, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 0.45, hours }, { flowFraction: 1, hours: 1000 }] } });
  const PAIR: Adjustment = { ...DEFAULT_ADJUSTMENT, motorRating: 3000, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
  const energyOf = (inp: SystemInput) => { const result = evaluateCandidate(inp, set, PAIR); return { result, e: candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: PAIR, result }, null) }; };
  it("0 h: the staged-npsh note marked, no qualifier on the verdict; 0.01 h: unmarked, and it qualifies the verdict", () => {
    const zero = energyOf(input(0)), some = energyOf(input(0.01));
    const z = at(zero.e.cycle!, 0).filter((w) => w.code === "staged-npsh");
    const s = at(some.e.cycle!, 0).filter((w) => w.code === "staged-npsh");
    expect(z.length).toBe(1);
    expect(s.length).toBe(1);
    expect(z[0].message.endsWith(` ${MARK}`)).toBe(true);
    expect(s[0].message).not.toContain(MARK);
    expect(verdictStagedNpshNote(zero.result.verdict ?? { status: "meets" }, zero.e.cycle)).toBeNull();
    expect(verdictStagedNpshNote(some.result.verdict ?? { status: "meets" }, some.e.cycle)).toMatch(/^(but|and) at a duty-cycle step with fewer pumps running/);
  });
});
