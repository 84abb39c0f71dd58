// A flow a rounding error outside the NPSHr curve's first or last published flow reads the NPSHr there (npshrEnds.ts
// `NPSHR_END_ROUNDING`: 1 part in 10⁸), in the workbench's curve (`npshrAt`) and the search's index (`evalNpshrPacked`:
// the search from raw and prepared sets) alike, so the search leaves a pump out, or keeps it, at the same flows the workbench judges.
// Before, both read none a hair past an end: the search kept a pump whose NPSHa is below NPSHr at such a duty (NPSHr
// null), and the workbench printed "the NPSHr curve ends at 43.2 m³/h, and the pump runs past it at 43.2000000 m³/h".
// 1 part in 10⁶ out is a flow apart: no NPSHr, on both sides. The allowance was 1 part in 10⁹, finer than the 9 significant
// digits a text prints a flow to: 5 parts in 10⁹ past an end read no NPSHr, and the words "runs past it at 43.2000000 m³/h"
// beside "ends at 43.2 m³/h"; now 1 part in 10⁸, and every flow further out than that prints apart from the end in every
// unit of flow (last describe block). Check values: the rules "NPSHr read off the published
// curve, never beyond it" and "NPSHa / NPSHr below 1: left out" (common practice, engine search.ts); the allowance is
// the app's own for a flow at a limit (verdict-min-flow.ts); the pump is invented (NPSHr published 0.01–0.03 m³/s).
import { describe, expect, it } from "vitest";
import { createPumpCurve, headAt, npshrAt, NPSHR_END_ROUNDING, searchDuty, UNITS } from "./index.ts";
import { qtExact, qtLimit, renderQuantities } from "./quantityText.ts";
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
    // Either side of the allowance's edge, 1 part in 10⁸ (old code: 5e-9 out read none, its words "43.2000000").
    { name: "last × (1 + 5e-9)", q: LAST * (1 + 5e-9), reads: NPSHR[LAST] },
    { name: "first × (1 − 5e-9)", q: FIRST * (1 - 5e-9), reads: NPSHR[FIRST] },
    { name: "last × (1 + 0.99e-8)", q: LAST * (1 + 0.99e-8), reads: NPSHR[LAST] },
    { name: "first × (1 − 0.99e-8)", q: FIRST * (1 - 0.99e-8), reads: NPSHR[FIRST] },
    { name: "last × (1 + 1.01e-8)", q: LAST * (1 + 1.01e-8), reads: null },
    { name: "first × (1 − 1.01e-8)", q: FIRST * (1 - 1.01e-8), reads: null },
    { name: "last × (1 + 1e-6)", q: LAST * (1 + 1e-6), reads: null },
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

describe("the allowance follows the words' digits: a flow just past it prints apart from the end it is past", () => {
  // The words put the end (`qtLimit`) beside the flow past it (`qtExact`) at up to 9 significant digits (quantityText.ts
  // MAX_SIGNIFICANT): one step of the 9th digit is at most 1 part in 10⁸ of a value, so a flow further out than the
  // allowance reads apart from its end in every unit of flow. Ends over every leading digit and many decades, and hard
  // against a power of ten (9.99999999…, 1.00000000…) in the unit shown. Old allowance, 1e-9: "43.2000000 m³/h" beside
  // "43.2 m³/h" (and the same for 5 parts in 10⁹ past a flow written with a leading 1).
  const ends: number[] = [];
  for (let e = -6; e <= 2; e++) for (let lead = 100; lead < 1000; lead += 7) ends.push((lead / 100) * 10 ** e);
  for (let e = -6; e <= 2; e++) for (const k of [1, 3, 7, 12]) ends.push(10 ** e * (1 - k * 1e-9), 10 ** e * (1 + k * 1e-9));
  // Past by 1 part in 10⁷ of the allowance (1e-15, a few ulps): at (1 + 1e-9) the product rounded back onto the allowance's edge.
  const past = (end: number, sign: 1 | -1) => end * (1 + sign * NPSHR_END_ROUNDING * (1 + 1e-7));
  /** The number a rendered flow reads as: "43.2 m³/h" and "43.2000000 m³/h" are one number, though not one string. */
  const num = (t: string) => Number(t.split(" ")[0].replace(/,/g, ""));
  it("the allowance is 1 part in 10⁸", () => expect(NPSHR_END_ROUNDING).toBe(1e-8));
  for (const unit of UNITS.flow.map((u) => u.id)) {
    it(`in ${unit}: every end (SI, and ${unit} as shown) and a flow just beyond the allowance either side print apart`, () => {
      const factor = UNITS.flow.find((u) => u.id === unit)!.factor; // the unit in m³/s
      const preset = { flow: unit } as Parameters<typeof renderQuantities>[1];
      const alike: string[] = [];
      for (const shown of ends) for (const end of [shown, shown * factor]) for (const sign of [1, -1] as const) {
        const q = past(end, sign);
        const a = renderQuantities(qtLimit("flow", end, [q]), preset), b = renderQuantities(qtExact("flow", q, [end]), preset);
        if (num(a) === num(b)) alike.push(`${a} (end ${end}, flow ${q})`);
      }
      expect(alike).toEqual([]);
      // Control: 1 part in 10⁹ past 43.2 m³/h read alike (the old allowance's edge).
      const end = 43.2 / 3600;
      expect(renderQuantities(qtExact("flow", end * (1 + 1.1e-9), [end]), { flow: "m3/h" } as never)).toBe("43.2000000 m³/h");
    });
  }
});
