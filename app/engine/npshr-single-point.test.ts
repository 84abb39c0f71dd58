// A single published NPSHr point (one flow with NPSHr, the rest blank) is judged nowhere, not even at its own flow
// (decision "npshone"): the workbench's curve (createPumpCurve) and the search's index (prepareSearchIndex, raw and
// prepared sets) build no NPSHr curve from it, so the search neither leaves the pump out nor passes it on NPSH at a duty
// at that very flow, while the same curve with a second NPSHr point is judged there and flips at NPSHa = NPSHr. A guard
// of the one rule both sides share (the words: app/lib/projects/npshr-reach.test.ts, app/test/npshr-single-point.test.ts).
// Check values: the rule "NPSHa / NPSHr below 1: left out" (common practice, engine search.ts); the pump is invented.
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshrAt, searchDuty } from "./index.ts";
import { evalPacked, prepareSearchIndex } from "./searchIndex.ts";

const Q = 0.02; // m³/s, the published NPSHr's flow and the duty's
const NPSHR = 3; // m
const points = (second: boolean) => [0, 0.01, Q, 0.03].map((q) => ({ flow: q, head: 40 - 20000 * q * q, efficiency: q === 0 ? 0 : 0.7, ...(q === Q || (second && q === 0.03) ? { npshr: NPSHR } : {}) }));
const duty = { flow: Q, head: 40 - 20000 * Q * Q }; // on the curve: met as published

describe("one NPSHr point makes no NPSHr curve, in the workbench's curve and the search's index alike", () => {
  it("createPumpCurve: no NPSHr at its own flow; with a second point, NPSHr there", () => {
    expect(createPumpCurve({ points: points(false) }).npshr).toBeNull();
    expect(npshrAt(createPumpCurve({ points: points(false) }), Q)).toBeNull();
    expect(npshrAt(createPumpCurve({ points: points(true) }), Q)).toBeCloseTo(NPSHR, 12);
  });
  it("prepareSearchIndex, from raw points and from a prepared curve: no NPSHr at its own flow", () => {
    for (const curve of [{ points: points(false) }, createPumpCurve({ points: points(false) })]) expect(evalPacked(prepareSearchIndex([{ id: "1", curve }]).npshr, 0, Q)).toBeNull();
    expect(evalPacked(prepareSearchIndex([{ id: "1", curve: { points: points(true) } }]).npshr, 0, Q)).toBeCloseTo(NPSHR, 12);
  });
  it("searchDuty at that flow: kept on both sides of NPSHa = NPSHr with no NPSHr; two points: left out just below, kept just above", () => {
    for (const a of [NPSHR * (1 - 1e-6), NPSHR * (1 + 1e-6)]) {
      const one = searchDuty(prepareSearchIndex([{ id: "1", curve: { points: points(false) } }]), duty, { npshAvailable: a, methods: ["direct"] });
      expect(one.stats.rejectedByNpsh).toBe(0);
      expect(one.candidates[0]).toMatchObject({ method: "direct", npshr: null, npshMargin: null });
      const two = searchDuty(prepareSearchIndex([{ id: "1", curve: { points: points(true) } }]), duty, { npshAvailable: a, methods: ["direct"] });
      expect(two.stats.rejectedByNpsh).toBe(a < NPSHR ? 1 : 0);
    }
  });
});
