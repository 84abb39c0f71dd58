// A duty-cycle step of pumps in parallel staged by demand where fewer run and one pump's share has no NPSHr
// (`staged-npsh-not-judged`, staging-npsh.ts) said only "not judged: the curve has no NPSHr at one pump's share". It now
// says where the NPSHr curve stops with one pump's flow, in the verdict's line's words (npshr-reach.ts, decision
// "npshone"): "the NPSHr curve ends at 30.0 m³/h, and the pump runs past it at 36.0 m³/h"; two running "one pump's NPSHr
// curve ends at …, and each pump runs past it at …"; none published "the curve publishes no NPSHr at …"; one point "the
// curve publishes NPSHr at one flow only (…)". Under a drive the NPSHr curve's flows move with the step's speed (Q ∝ N,
// affinity laws, as the step's NPSHr is read). And the step reads NPSHr as far as it is published: the duty cycle's curve
// is rebuilt from the result's 41 samples, whose NPSHr stopped at the last sample before the published end (28.9 m³/h of
// one pump here, on a column published to 30.0 m³/h), so a step at 29.5 m³/h was "not judged"; the samples now keep the
// NPSHr curve's ends (npshr-reach.ts `samplesWithNpshrEnds`). Check values: the rules "NPSHr is read off the published
// curve, never beyond it" and "NPSHa / NPSHr at least the wanted 1.1" (common practice); the invented pump of
// energy-staging-npsh.test.ts; 36 m³/h = 50 % of 72 m³/h, 28.8 m³/h = 80 % of 72 m³/h ÷ 2 (arithmetic).
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshrAt } from "~/engine";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
/** Flow m³/h, head m, efficiency, NPSHr m (energy-staging-npsh.test.ts). */
const ROWS = [[0, 22, null, null], [5, 21.8, 0.3, 1.2], [10, 21.5, 0.45, 1.3], [20, 20, 0.62, 1.6], [30, 17.5, 0.72, 2.0], [36, 15.5, 0.74, 2.4], [45, 12, 0.7, 3.2], [55, 7, 0.6, 4.5]] as const;
/** The curve set with NPSHr published where `keep` (m³/h) says. */
const set = (keep: (q: number) => boolean) => ({ points: ROWS.map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: n != null && keep(q) ? n : null })), speed: 2900, impellerDiameter: 0.2 });
const upTo = (end: number) => (q: number) => q <= end;
const base = defaultSystemInput();
const input = (fractions: number[], control = "fixed-speed", suctionStaticHead = -7.8): SystemInput => ({ ...base, suctionStaticHead, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, control: control as never, profile: fractions.map((flowFraction) => ({ flowFraction, hours: 1000 })) } });
const pumps = (duty: number): Adjustment => ({ ...DEFAULT_ADJUSTMENT, motorRating: 3000, arrangement: "parallel", dutyPumps: duty, standbyPumps: 1 });
const energyOf = (inp: SystemInput, s: ReturnType<typeof set>, adj = pumps(2)) => candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: adj, result: evaluateCandidate(inp, s, adj) }, null);
/** Step 0's staged NPSH warnings, rendered in SI, with the step. */
const step0 = (inp: SystemInput, s: ReturnType<typeof set>, adj = pumps(2)) => {
  const e = energyOf(inp, s, adj);
  const notes = e.cycle!.warnings.filter((w) => /^staged-npsh/.test(w.code) && w.parameter === "profile[0]");
  return { step: e.cycle!.steps[0], codes: notes.map((w) => w.code), text: notes.map((w) => renderUnits(w.message, SI_UNITS)).join(" | ") };
};
const NOT = String.raw`; not judged: `;
const AFTER = String.raw` \(NPSHa \d+\.\d+ m at the step's whole flow`;

describe("a staged step past the NPSHr curve's end says where it ends, with one pump's flow", () => {
  it("1 of 2 running at 36.0 m³/h, NPSHr published to 30 m³/h: 'the NPSHr curve ends at 30.0 m³/h, and the pump runs past it at 36.0 m³/h' (old code: 'not judged: the curve has no NPSHr at one pump's share')", () => {
    const r = step0(input([0.5]), set(upTo(30)));
    expect(r.step.pumpsRunning).toBe(1); // control: one pump alone takes 36 m³/h
    expect(r.codes).toEqual(["staged-npsh-not-judged"]);
    expect(r.text).toMatch(new RegExp(`${NOT}the NPSHr curve ends at 30\\.0 m³/h, and the pump runs past it at 36\\.0 m³/h${AFTER}`));
  });
  it("2 of 3 running at 28.8 m³/h each, NPSHr published to 20 m³/h: 'one pump's NPSHr curve ends at 20.0 m³/h, and each pump runs past it at 28.8 m³/h'", () => {
    const r = step0(input([0.8]), set(upTo(20)), pumps(3));
    expect([r.step.pumpsRunning, r.step.dutyPumps]).toEqual([2, 3]); // control
    expect(r.text).toMatch(new RegExp(`${NOT}one pump's NPSHr curve ends at 20\\.0 m³/h, and each pump runs past it at 28\\.8 m³/h${AFTER}`));
  });
  it("before its first flow: 'the NPSHr curve starts at 45.0 m³/h, and the pump runs below it at 36.0 m³/h'", () => {
    const r = step0(input([0.5]), set((q) => q >= 45));
    expect(r.text).toMatch(new RegExp(`${NOT}the NPSHr curve starts at 45\\.0 m³/h, and the pump runs below it at 36\\.0 m³/h${AFTER}`));
  });
  it("none published: 'the curve publishes no NPSHr at 36.0 m³/h'; 2 of 3 running: '…, and each pump runs at 28.8 m³/h' (one pump's flow)", () => {
    expect(step0(input([0.5]), set(() => false)).text).toMatch(new RegExp(`${NOT}the curve publishes no NPSHr at 36\\.0 m³/h${AFTER}`));
    expect(step0(input([0.8]), set(() => false), pumps(3)).text).toMatch(new RegExp(`${NOT}the curve publishes no NPSHr, and each pump runs at 28\\.8 m³/h${AFTER}`));
  });
  it("one point published (2.0 m at 30 m³/h): 'the curve publishes NPSHr at one flow only (2.00 m at 30.0 m³/h): one point is no curve to read it at 36.0 m³/h'", () => {
    const r = step0(input([0.5]), set((q) => q === 30));
    expect(r.text).toMatch(new RegExp(`${NOT}the curve publishes NPSHr at one flow only \\(2\\.00 m at 30\\.0 m³/h\\): one point is no curve to read it at 36\\.0 m³/h${AFTER}`));
  });
  it("under a drive following the system curve: the NPSHr curve's end at the step's speed (20 m³/h × speed), said with the speed", () => {
    const r = step0(input([0.4], "system-curve"), set(upTo(20)));
    const speed = r.step.speedRatio!;
    expect(speed).toBeGreaterThan(0.8); // control: the step runs slowed (85.6 %), one pump alone at 28.8 m³/h
    expect(speed).toBeLessThan(0.9);
    expect(r.step.pumpsRunning).toBe(1);
    const m = new RegExp(`${NOT}the NPSHr curve ends at (\\d+\\.\\d+) m³/h, and the pump runs past it at 28\\.8 m³/h \\(its flows at (\\d+(?:\\.\\d+)?) % speed, Q ∝ N, affinity laws\\)${AFTER}`).exec(r.text);
    expect(m, r.text).not.toBeNull();
    expect(Number(m![1])).toBeCloseTo(20 * speed, 1);
    expect(Number(m![2])).toBeCloseTo(speed * 100, 0);
  });
});

describe("a staged step reads NPSHr as far as it is published, not to the last sample before its end", () => {
  // One pump's samples lie every 1.375 m³/h (41 over 0–110 m³/h for two): 28.875 and 30.25 m³/h either side of 30.
  it("1 of 2 running at 29.5 m³/h, NPSHr published to 30 m³/h: judged, with NPSHr read off the published curve (old code: not judged)", () => {
    const q = 29.5;
    // The pump 8.2 m above the suction level: NPSHa 1.79 m against NPSHr about 1.98 m, a warning that shows its NPSHr.
    const r = step0(input([q / 72], "fixed-speed", -8.2), set(upTo(30)));
    expect(r.step.pumpsRunning).toBe(1); // control
    expect(r.codes).toEqual(["staged-npsh"]);
    const published = npshrAt(createPumpCurve({ points: set(upTo(30)).points.map((p) => ({ ...p, efficiency: p.efficiency ?? undefined, power: undefined, npshr: p.npshr ?? undefined })) }), q * M3H)!;
    const shown = Number(/NPSHr (\d+\.\d+) m of one pump at its share/.exec(r.text)![1]);
    expect(shown).toBeCloseTo(published, 2);
  });
  it("the result's sampled curve carries the NPSHr curve's first and last flows, 10 and 60 m³/h for two (41 samples and them)", () => {
    const curve = evaluateCandidate(input([0.5]), set(upTo(30)), pumps(2)).curve;
    expect(curve).toHaveLength(43);
    const withNpshr = curve.filter((p) => p.npshr != null);
    expect(withNpshr[0].flow / M3H).toBeCloseTo(10, 9);
    expect(withNpshr[0].npshr).toBeCloseTo(1.2, 12);
    expect(withNpshr.at(-1)!.flow / M3H).toBeCloseTo(60, 9);
    expect(withNpshr.at(-1)!.npshr).toBeCloseTo(2.0, 12);
    expect(curve.every((p, i) => i === 0 || p.flow > curve[i - 1].flow)).toBe(true); // in order, no flow twice
    // The whole column: its last flow is the curve's last, a sample already; its first, 5 m³/h (10 for two), is added.
    expect(evaluateCandidate(input([0.5]), set(() => true), pumps(2)).curve).toHaveLength(42);
  });
});
