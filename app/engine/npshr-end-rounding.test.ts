// A flow a rounding error outside the NPSHr curve's first or last published flow reads the NPSHr there (npshrEnds.ts
// `NPSHR_END_ROUNDING`: 1 part in 10⁹), in the workbench's curve (`npshrAt`) and the search's index (`evalNpshrPacked`:
// the search from raw and prepared sets) alike, so the search leaves a pump out, or keeps it, at the same flows the workbench judges.
// Before, both read none a hair past an end: the search kept a pump whose NPSHa is below NPSHr at such a duty (NPSHr
// null), and the workbench printed "the NPSHr curve ends at 43.2 m³/h, and the pump runs past it at 43.2000000 m³/h".
// 1 part in 10⁶ out is a flow apart: no NPSHr, on both sides. Check values: the rules "NPSHr read off the published
// curve, never beyond it" and "NPSHa / NPSHr below 1: left out" (common practice, engine search.ts); the allowance is
// the app's own for a flow at a limit (verdict-min-flow.ts); the pump is invented (NPSHr published 0.01–0.03 m³/s).
import { describe, expect, it } from "vitest";
import { createPumpCurve, headAt, npshrAt, searchDuty } from "./index.ts";
import { prepareSearchIndex } from "./searchIndex.ts";

const FIRST = 0.01, LAST = 0.03; // m³/s: the NPSHr column's first and last published flows
const NPSHR = { [FIRST]: 1.5, 0.02: 2.2, [LAST]: 3.4 } as Record<number, number>; // m
const points = [0, FIRST, 0.02, LAST, 0.04].map((q) => ({ flow: q, head: 40 - 15000 * q * q, efficiency: q === 0 ? 0 : 0.7, ...(NPSHR[q] != null ? { npshr: NPSHR[q] } : {}) }));
const curve = createPumpCurve({ points });
const raw = prepareSearchIndex([{ id: "1", curve: { points } }]);
const prepared = prepareSearchIndex([{ id: "1", curve }]);
/** The search's NPSHr at a duty on the curve at flow q (m³/s), the pump met as published, and whether NPSHa `a` (m) leaves it out. */
const search = (q: number, a: number, index = raw) => {
  const r = searchDuty(index, { flow: q, head: headAt(curve, q)! }, { npshAvailable: a, methods: ["direct"] });
  return { npshr: r.candidates[0]?.npshr ?? null, leftOut: r.stats.rejectedByNpsh === 1 };
};

describe("a rounding error outside the NPSHr curve's ends reads the end; 1 part in 10⁶ does not", () => {
  const cases = [
    { name: "last × (1 + 1e-12)", q: LAST * (1 + 1e-12), reads: NPSHR[LAST] },
    { name: "last × (1 + 1e-9)", q: LAST * (1 + 1e-9), reads: NPSHR[LAST] },
    { name: "first × (1 − 1e-12)", q: FIRST * (1 - 1e-12), reads: NPSHR[FIRST] },
    { name: "last × (1 + 1e-6)", q: LAST * (1 + 1e-6), reads: null },
    { name: "last × (1 + 2e-9)", q: LAST * (1 + 2e-9), reads: null },
    { name: "first × (1 − 1e-6)", q: FIRST * (1 - 1e-6), reads: null },
  ];
  for (const c of cases) {
    it(`${c.name}: ${c.reads == null ? "no NPSHr" : `the end's NPSHr, ${c.reads} m`} in the workbench's curve and the search's index (raw and prepared)`, () => {
      expect(c.q > LAST || c.q < FIRST).toBe(true); // control: the flow lies outside the column
      const got = [npshrAt(curve, c.q), search(c.q, 10, raw).npshr, search(c.q, 10, prepared).npshr];
      expect(got).toEqual(Array(3).fill(c.reads));
    });
  }
  it("inside the column nothing moves: the ends themselves and a flow between read the curve", () => {
    for (const q of [FIRST, 0.015, LAST]) expect([search(q, 10, raw).npshr, search(q, 10, prepared).npshr]).toEqual([npshrAt(curve, q), npshrAt(curve, q)]);
    expect(npshrAt(curve, LAST)).toBe(NPSHR[LAST]);
  });
});

describe("the search leaves the pump out where the workbench finds NPSHa below NPSHr: NPSHa either side of the end's NPSHr", () => {
  // Old code: at last × (1 + 1e-12) the search read no NPSHr and kept the pump on both sides (leftOut false, false).
  for (const [name, q] of [["last × (1 + 1e-12)", LAST * (1 + 1e-12)], ["first × (1 − 1e-12)", FIRST * (1 - 1e-12)]] as const) {
    it(`duty at ${name}: left out just below NPSHr, kept just above (old code: kept on both sides)`, () => {
      const nr = npshrAt(curve, q)!;
      expect([search(q, nr * (1 - 1e-6)).leftOut, search(q, nr * (1 + 1e-6)).leftOut]).toEqual([true, false]);
    });
  }
  it("1 part in 10⁶ past the end: no NPSHr, kept on both sides (the pump is not judged on NPSH there, as the workbench)", () => {
    const q = LAST * (1 + 1e-6);
    expect([search(q, 0.1).leftOut, search(q, 100).leftOut, npshrAt(curve, q)]).toEqual([false, false, null]);
  });
});
