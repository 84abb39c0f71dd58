// NPSH at a staged duty-cycle step qualifies the verdict's line (verdict-staged-npsh.ts), as NPSH over the band does: two
// pumps in parallel staged by demand, one running alone at the larger share. Rule (common practice, staging-npsh.ts):
// NPSHa / NPSHr at least the wanted 1.1; below 1 a cavitation risk. Check values: the step flow where the qualifier appears
// is bisected and the hand-worked ratio there is the wanted 1.1 (NPSHa by the engine's NPSHa formula with the suction's
// loss at the step's whole flow, aged pipe; NPSHr read off the invented pump's own published curve). The curve and its
// NPSHr column are invented (the energy fixture's pump, as in energy-staging-npsh.test.ts).
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshAvailable, npshrAt, prepareSystem, suctionLoss } from "~/engine";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";
import { verdictStagedNpshNote, verdictStagedNpshShort } from "./verdict-staged-npsh";

const M3H = 1 / 3600;
const ROWS = [[0, 22, null, null], [5, 21.8, 0.3, 1.2], [10, 21.5, 0.45, 1.3], [20, 20, 0.62, 1.6], [30, 17.5, 0.72, 2.0], [36, 15.5, 0.74, 2.4], [45, 12, 0.7, 3.2], [55, 7, 0.6, 4.5]] as const;
const SET = { points: ROWS.map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: n })), speed: 2900, impellerDiameter: 0.2 };
const onePump = createPumpCurve({ points: ROWS.filter((r) => r[3] != null).map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e!, npshr: n! })) });
const base = defaultSystemInput();
/** The pump 7.8 m above the suction level (invented); a 25 % step of 4000 h (both pumps not needed) and the step under test. */
const input = (f: number, hours = 1000): SystemInput => ({ ...base, suctionStaticHead: -7.8, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 1, hours: 2000 }, { flowFraction: f, hours }] } });
const PAIR: Adjustment = { ...DEFAULT_ADJUSTMENT, motorRating: 3000, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
const judged = (inp: SystemInput) => {
  const result = evaluateCandidate(inp, SET, PAIR);
  const energy = candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: PAIR, result }, null);
  expect(result.verdict).toBeTruthy(); // control: a verdict to qualify
  // The qualifier joins "meets the duty" with "but" (any other verdict: "and", last test); this system's own verdict is incidental.
  return { verdict: { status: "meets" }, cycle: energy.cycle };
};
const handRatio = (inp: SystemInput, q: number) => {
  const f = fluidOf(inp);
  const na = npshAvailable({ surfacePressure: inp.suctionSurfacePressure, vaporPressure: f.vaporPressure, density: f.density, staticSuctionHead: inp.suctionStaticHead, suctionLoss: suctionLoss(prepareSystem(systemSpec(inp)), q, "aged").headLoss });
  return na / npshrAt(onePump, q)!;
};

describe("NPSH at a staged step qualifies the verdict's line", () => {
  it("flips where one pump alone crosses the wanted 1.1 (bisected on the step flow), with its step, pumps running, NPSHa, NPSHr and rule", () => {
    const note = (f: number) => {
      const j = judged(input(f));
      expect(j.cycle!.steps[1].pumpsRunning).toBe(1); // control: one pump alone over the whole bracket
      return verdictStagedNpshNote(j.verdict, j.cycle);
    };
    let lo = 0.2, hi = 0.5;
    expect([note(lo), note(hi) != null]).toEqual([null, true]); // control: the bracket holds the flip
    for (let i = 0; i < 30; i++) {
      const mid = (lo + hi) / 2;
      if (note(mid) != null) hi = mid;
      else lo = mid;
    }
    expect(handRatio(input(hi), hi * 72 * M3H)).toBeCloseTo(1.1, 2); // the flip is at the wanted ratio
    expect(note(lo)).toBeNull(); // just below: nothing against the verdict
    const j = judged(input(hi));
    const text = note(hi)!;
    expect(text).toMatch(/^but at a duty-cycle step with fewer pumps running \(staged by demand\): NPSH at \d+ % flow, 1 of 2 pumps running: /);
    expect(text).toMatch(/NPSHa ⟦head\|[-\d.e]+.*⟧ at the step's whole flow .* \/ NPSHr ⟦head\|[\d.e]+.*⟧ of one pump at its share = 1\.\d+, below the wanted 1\.1: low NPSH margin/);
    expect(text).toContain("common practice: NPSHa / NPSHr at least the wanted 1.1; below 1, or NPSHa at or below zero whatever the pump, a cavitation risk");
    expect(verdictStagedNpshShort(j.verdict, j.cycle)).toMatch(/^, but NPSH low margin at \d+ % flow, 1 of 2 pumps running$/);
  });

  it("below 1: a cavitation risk on the line and in the chart's short form", () => {
    const j = judged(input(0.5));
    expect(handRatio(input(0.5), 36 * M3H)).toBeLessThan(1); // control
    expect(verdictStagedNpshNote(j.verdict, j.cycle)).toContain("below 1, NPSHa below NPSHr: cavitation risk");
    expect(verdictStagedNpshShort(j.verdict, j.cycle)).toBe(", but NPSH cavitation risk at 50 % flow, 1 of 2 pumps running");
  });

  it("a step of 0 h never runs: its warning stays at the step, the verdict's line says nothing", () => {
    const j = judged(input(0.5, 0));
    expect(j.cycle!.warnings.some((w) => w.code === "staged-npsh" && w.parameter === "profile[1]")).toBe(true); // control: the step's own warning
    expect(verdictStagedNpshNote(j.verdict, j.cycle)).toBeNull();
  });

  it("no verdict, nothing; after another verdict, 'and'", () => {
    const j = judged(input(0.5));
    expect(verdictStagedNpshNote(null, j.cycle)).toBeNull();
    expect(verdictStagedNpshNote({ status: "oversized" }, j.cycle)).toMatch(/^and at a duty-cycle step/);
  });
});
