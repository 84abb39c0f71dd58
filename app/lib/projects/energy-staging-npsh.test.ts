// NPSH at the steps of pumps in parallel staged by demand where fewer than all duty pumps run (staging-npsh.ts): one pump
// alone takes the whole step flow Q (share Q/1, not Q/2) and needs more NPSH there. Judged by common practice: NPSHa /
// NPSHr at least the system's wanted margin ratio (1.1 by default); below 1 a cavitation risk. Check values: NPSHa worked
// out here by the engine's NPSHa formula with the suction's loss at the step's whole flow (aged pipe: the lower NPSHa, as at the band's demanding
// corners), NPSHr read off the pump's own published curve at one pump's share; the step where the margin crosses 1.1 is
// found by bisecting the step's flow. The curve and its NPSHr column are invented (the energy fixture's pump).
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshAvailable, npshrAt, prepareSystem, suctionLoss } from "~/engine";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
/** Flow m³/h, head m, efficiency, NPSHr m (invented; NPSHr rising with flow, as is usual). */
const ROWS = [[0, 22, null, null], [5, 21.8, 0.3, 1.2], [10, 21.5, 0.45, 1.3], [20, 20, 0.62, 1.6], [30, 17.5, 0.72, 2.0], [36, 15.5, 0.74, 2.4], [45, 12, 0.7, 3.2], [55, 7, 0.6, 4.5]] as const;
/** The curve set, its NPSHr published up to `npshrTo` m³/h. */
const set = (npshrTo = Infinity) => ({ points: ROWS.map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: n != null && q <= npshrTo ? n : null })), speed: 2900, impellerDiameter: 0.2 });
const onePump = createPumpCurve({ points: ROWS.filter((r) => r[3] != null).map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e!, npshr: n! })) });
const base = defaultSystemInput();
/** The pump 7.8 m above the suction level (invented): NPSHa about 2 m, so one pump alone runs short of margin at larger flows. */
const input = (fractions: number[]): SystemInput => ({ ...base, suctionStaticHead: -7.8, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, profile: fractions.map((flowFraction) => ({ flowFraction, hours: 1000 })) } });
const PAIR: Adjustment = { ...DEFAULT_ADJUSTMENT, motorRating: 3000, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
const energyOf = (inp: SystemInput, s = set()) => candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: PAIR, result: evaluateCandidate(inp, s, PAIR) }, null);
const npshNotes = (inp: SystemInput, s = set()) => energyOf(inp, s).cycle!.warnings.filter((w) => /^staged-npsh/.test(w.code) && w.parameter === "profile[0]");
/** NPSHa / NPSHr of one pump alone at the step flow q (m³/s), worked out here (see the header). */
const handRatio = (inp: SystemInput, q: number) => {
  const f = fluidOf(inp);
  const na = npshAvailable({ surfacePressure: inp.suctionSurfacePressure, vaporPressure: f.vaporPressure, density: f.density, staticSuctionHead: inp.suctionStaticHead, suctionLoss: suctionLoss(prepareSystem(systemSpec(inp)), q, "aged").headLoss });
  return na / npshrAt(onePump, q)!;
};

describe("2 pumps in parallel (+1 standby), fixed speed throttled: NPSH where 1 of 2 runs", () => {
  it("the warning appears at the step flow where one pump's NPSHa / NPSHr crosses the wanted 1.1 (bisected)", () => {
    const warned = (f: number) => {
      const e = energyOf(input([f]));
      expect(e.cycle!.steps[0].pumpsRunning).toBe(1); // control: one pump alone runs over the whole bracket
      return npshNotes(input([f])).length > 0;
    };
    let lo = 0.2; // 14.4 m³/h
    let hi = 0.5; // 36 m³/h (the most one pump runs alone here: at 60 % both run)
    expect([warned(lo), warned(hi)]).toEqual([false, true]); // control: the bracket holds the flip
    for (let i = 0; i < 30; i++) {
      const mid = (lo + hi) / 2;
      if (warned(mid)) hi = mid;
      else lo = mid;
    }
    // At the flip, the hand-worked ratio is the wanted 1.1 (NPSHr on the candidate's sampled curve: within 0.5 %).
    expect(handRatio(input([hi]), hi * 72 * M3H)).toBeCloseTo(1.1, 2);
    const msg = npshNotes(input([hi]))[0].message;
    expect(msg).toMatch(/^NPSH at \d+ % flow, 1 of 2 pumps running: each takes /);
    expect(msg).toContain("below the wanted 1.1: low NPSH margin");
    expect(msg).toContain("common practice: NPSHa / NPSHr at least the wanted 1.1; below 1, or NPSHa at or below zero whatever the pump, a cavitation risk");
  });

  it("further out, below 1: a cavitation risk, with NPSHa, NPSHr and their ratio", () => {
    const inp = input([0.5]);
    expect(handRatio(inp, 0.5 * 72 * M3H)).toBeLessThan(1); // control: the hand ratio is below 1 there
    const msg = npshNotes(inp)[0].message;
    expect(msg).toContain("below 1, NPSHa below NPSHr: cavitation risk");
    expect(msg).toMatch(/NPSHa ⟦head\|[\d.]+.*⟧ at the step's whole flow through the suction \(aged pipe, the lower NPSHa\) \/ NPSHr ⟦head\|[\d.]+.*⟧ of one pump at its share = 0\.\d+,/);
  });

  it("all duty pumps running: not judged by the staging check (the candidate's own NPSH covers each pump at Q/N)", () => {
    const e = energyOf(input([0.9]));
    expect(e.cycle!.steps[0].pumpsRunning).toBe(2); // control: both run at 64.8 m³/h
    expect(e.cycle!.warnings.filter((w) => /^staged-npsh/.test(w.code))).toEqual([]);
  });

  it("no NPSHr at one pump's share (published to 30 m³/h only): not judged, said at the step", () => {
    const notes = npshNotes(input([0.5]), set(30)); // 36 m³/h on one pump
    expect(notes.map((w) => w.code)).toEqual(["staged-npsh-not-judged"]);
    // Where the NPSHr curve ends, with one pump's flow (staged-npshr-reach.test.ts; it said "the curve has no NPSHr at one pump's share").
    expect(renderUnits(notes[0].message, SI_UNITS)).toContain("not judged: the NPSHr curve ends at 30.0 m³/h, and the pump runs past it at 36.0 m³/h (NPSHa");
  });
});
