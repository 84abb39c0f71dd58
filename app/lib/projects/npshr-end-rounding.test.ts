// A band corner a rounding error past the NPSHr curve's last published flow (or before its first) is judged there, with
// the NPSHr at that end (engine npshrEnds.ts `NPSHR_END_ROUNDING`: a flow within 1 part in 10⁸ of an end is at it; it was
// 1 part in 10⁹, and a corner 5 parts in 10⁹ past 43.2 m³/h read "runs past it at 43.2000000 m³/h": the words' 9 significant
// digits cannot tell it from the end, so the allowance now follows them).
// Before, such a corner was not judged and the verdict's line read "but NPSH not checked: the NPSHr curve ends at
// 43.2 m³/h, and the pump runs past it at 43.2000000 m³/h (least lift, new pipe)", two flows a text cannot tell apart.
// 1 part in 10⁶ past the end stays unjudged, its flow read apart (43.20004 m³/h). The corner is placed by bisecting the
// static head (the operating point's root finder holds the flow to about 1 part in 10¹³, engine operatingPoint.ts),
// then its offset from the end is checked before anything is judged. Check values: the rule "NPSHr is read off the
// published curve, never beyond it; a flow a rounding error from a limit is at it" (common practice; the app's
// allowance, verdict-min-flow.ts); the invented pump of npshr-reach.test.ts (flat NPSHr 2.5 m on the flows kept);
// 0.012 m³/s = 43.2 m³/h, 0.008 m³/s = 28.8 m³/h (arithmetic). The search reads NPSHr with the same allowance
// (engine/npshr-end-rounding.test.ts: the same flows, the same NPSHr, left out on the same side).
import { describe, expect, it } from "vitest";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import { npshrAt, searchDuty, prepareSearchIndex, headAt, createPumpCurve } from "~/engine";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";
import { verdictNpshNote } from "./verdict-npsh";

import { npshrPump as pump, upTo, from } from "./npshr-fixture";
type R = ReturnType<typeof evaluateCandidate>;
const note = (r: R) => renderUnits(verdictNpshNote(r.verdict, r.npsh) ?? "", SI_UNITS);
const corner = (r: R, at: string) => r.npsh.judgedAt!.find((p) => p.at === at)!;

/**
 * The evaluation whose corner `at` runs at `target` (m³/s) or just beyond it, away from the NPSHr curve (`sign` +1: above,
 * −1: below), the static head `key` bisected between `lo` and `hi` (m).
 */
function placed(keep: (q: number) => boolean, key: "staticLow" | "staticHigh", at: string, target: number, sign: 1 | -1, lo: number, hi: number, input: SystemInput = defaultSystemInput()): R {
  const run = (s: number) => evaluateCandidate({ ...input, [key]: s }, pump(keep), DEFAULT_ADJUSTMENT);
  const beyond = (r: R) => sign * (corner(r, at).pumpFlow! - target) >= 0;
  let best = run(lo);
  expect(beyond(best)).toBe(true); // control: the bracket holds the crossing
  expect(beyond(run(hi))).toBe(false);
  for (let i = 0; i < 80; i++) {
    const mid = (lo + hi) / 2;
    const r = run(mid);
    if (beyond(r)) { lo = mid; best = r; } else hi = mid;
  }
  return best;
}

describe("a band corner a rounding error past the NPSHr curve's last flow (43.2 m³/h) is judged there", () => {
  const END = 0.012;
  const near = placed(upTo(END), "staticLow", "least lift, new pipe", END * (1 + 1e-12), 1, 0, 10);
  const far = placed(upTo(END), "staticLow", "least lift, new pipe", END * (1 + 1e-6), 1, 0, 10);
  it("the cases: the corner past the end by less than 1 part in 10⁹, and by 1 part in 10⁶", () => {
    const off = (r: R) => corner(r, "least lift, new pipe").pumpFlow! / END - 1;
    expect(off(near)).toBeGreaterThan(0);
    expect(off(near)).toBeLessThan(1e-10);
    expect(off(far)).toBeCloseTo(1e-6, 12);
    expect(near.verdict?.status).toBe("meets");
  });
  it("end × (1 + 1e-12): judged with the end's NPSHr, 2.5 m; no \"not checked\" (old code: 'the NPSHr curve ends at 43.2 m³/h, and the pump runs past it at 43.2000000 m³/h')", () => {
    expect(corner(near, "least lift, new pipe").required).toBe(2.5);
    expect(near.npsh.unjudged).toEqual([]);
    expect(near.npsh.status).toBe("ok");
    expect(verdictNpshNote(near.verdict, near.npsh)).toBeNull();
  });
  it("end × (1 + 1e-6): not judged, both flows read apart", () => {
    expect(far.npsh.status).toBe("unknown");
    expect(note(far)).toMatch(/^but NPSH not checked: the NPSHr curve ends at 43\.2 m³\/h, and the pump runs past it at 43\.20004\d* m³\/h \(least lift, new pipe\); where judged, /);
  });
  // Either side of the allowance's edge, 1 part in 10⁸: 5e-9 past is judged (old code: "… runs past it at 43.2000000 m³/h"),
  // 2e-8 past is not, its flow printed apart from the end (43.2 × (1 + 2e-8) = 43.200000864 m³/h, arithmetic: "43.200001").
  const inside = placed(upTo(END), "staticLow", "least lift, new pipe", END * (1 + 5e-9), 1, 0, 10);
  const outside = placed(upTo(END), "staticLow", "least lift, new pipe", END * (1 + 2e-8), 1, 0, 10);
  it("end × (1 + 5e-9): judged with the end's NPSHr, 2.5 m (old code: 'the NPSHr curve ends at 43.2 m³/h, and the pump runs past it at 43.2000000 m³/h')", () => {
    expect(corner(inside, "least lift, new pipe").pumpFlow! / END - 1).toBeCloseTo(5e-9, 15); // control: placed there
    expect(corner(inside, "least lift, new pipe").required).toBe(2.5);
    expect(inside.npsh.status).toBe("ok");
    expect(verdictNpshNote(inside.verdict, inside.npsh)).toBeNull();
  });
  it("end × (1 + 2e-8): not judged, and the words read the flow apart from the end: 43.200001 m³/h beside 43.2 m³/h", () => {
    expect(corner(outside, "least lift, new pipe").pumpFlow! / END - 1).toBeCloseTo(2e-8, 15); // control: placed there
    expect(outside.npsh.status).toBe("unknown");
    expect(note(outside)).toMatch(/^but NPSH not checked: the NPSHr curve ends at 43\.2 m³\/h, and the pump runs past it at 43\.200001 m³\/h \(least lift, new pipe\); where judged, /);
  });
  it("the search reads the same NPSHr at the corner's flow as the workbench: 2.5 m at end × (1 + 1e-12) and (1 + 5e-9), none at (1 + 2e-8) and (1 + 1e-6)", () => {
    // The same points as the engine takes them (no blank columns), as the search's index is built from a curve set.
    const points = pump(upTo(END)).points.map(({ power: _, npshr, ...p }) => ({ ...p, ...(npshr != null ? { npshr } : {}) }));
    const curve = createPumpCurve({ points });
    const index = prepareSearchIndex([{ id: "1", curve: { points } }]);
    for (const [r, want] of [[near, 2.5], [inside, 2.5], [outside, null], [far, null]] as const) {
      const q = corner(r, "least lift, new pipe").pumpFlow!;
      const found = searchDuty(index, { flow: q, head: headAt(curve, q)! }, { npshAvailable: 10, methods: ["direct"] }).candidates[0];
      expect([found.npshr, npshrAt(curve, q), corner(r, "least lift, new pipe").required]).toEqual([want, want, want]);
    }
  });
});

describe("a band corner a rounding error before the NPSHr curve's first flow (28.8 m³/h) is judged there", () => {
  const START = 0.008;
  const input = { ...defaultSystemInput(), duty: { flow: 0.006, head: 12 } }; // 21.6 m³/h: oversized, a pass
  const near = placed(from(START), "staticHigh", "most lift, aged pipe", START * (1 - 1e-12), -1, 20, 12, input);
  const far = placed(from(START), "staticHigh", "most lift, aged pipe", START * (1 - 1e-6), -1, 20, 12, input);
  it("the cases: the corner below the start by less than 1 part in 10⁹, and by 1 part in 10⁶", () => {
    const off = (r: R) => 1 - corner(r, "most lift, aged pipe").pumpFlow! / START;
    expect(off(near)).toBeGreaterThan(0);
    expect(off(near)).toBeLessThan(1e-10);
    expect(off(far)).toBeCloseTo(1e-6, 12);
    expect(["meets", "oversized"]).toContain(near.verdict?.status);
  });
  it("start × (1 − 1e-12): judged with the start's NPSHr; start × (1 − 1e-6): 'starts at 28.8 m³/h, and the pump runs below it at 28.79997… m³/h'", () => {
    expect(corner(near, "most lift, aged pipe").required).toBe(2.5);
    expect(near.npsh.status).toBe("ok");
    expect(verdictNpshNote(near.verdict, near.npsh)).toBeNull();
    expect(note(far)).toMatch(/^(but|and) NPSH not checked: the NPSHr curve starts at 28\.8 m³\/h, and the pump runs below it at 28\.79997\d* m³\/h \(most lift, aged pipe\); where judged, /);
  });
});
