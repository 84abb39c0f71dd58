/**
 * The trim and diameter limits as the curve's warnings (scaleByTrim) and the verdict (catalogueReasons) judge them:
 * one round-off allowance for both (LIMIT_ROUNDOFF, 1 part in 10⁶), so they never disagree about one pump.
 * The search's smallest-impeller check shares it too. Limits: a trim of at most 20 % (MAX_TRIM_FRACTION, common practice); the
 * model's smallest impeller (made-up, 160 mm).
 */
import { describe, expect, it } from "vitest";
import { catalogueReasons, createPumpCurve, scaleByTrim, searchDuty } from "./index.ts";
import { samplePoints } from "./test/curves.ts";

const curve = createPumpCurve({ points: samplePoints(), impellerDiameter: 0.2, minDiameter: 0.16 });
const flags = (r: number) => scaleByTrim(curve, r).warnings.map((w) => w.code).filter((c) => c !== "trim-approximate");

describe("trim limits: the curve's flags and the verdict agree (LIMIT_ROUNDOFF)", () => {
  it("0.8·(1 − 5e-7), inside the allowance: neither the verdict nor the flags call it outside", () => {
    const r = 0.8 * (1 - 5e-7);
    expect(catalogueReasons({ diameter: 0.2 * r, minDiameter: 0.16 })).toEqual([]);
    expect(catalogueReasons({ trimRatio: r })).toEqual([]);
    expect(flags(r)).toEqual([]);
  });
  it("0.79999999 (a service's solved ratio): no 'trim exceeds 20 %' warning beside a verdict that finds it inside", () => {
    expect(catalogueReasons({ trimRatio: 0.79999999 })).toEqual([]);
    expect(flags(0.79999999)).toEqual([]);
  });
  it("0.8·(1 − 2e-6), past the allowance: both say outside", () => {
    const r = 0.8 * (1 - 2e-6);
    expect(catalogueReasons({ diameter: 0.2 * r, minDiameter: 0.16 })).toHaveLength(1);
    expect(catalogueReasons({ trimRatio: r })).toHaveLength(1);
    expect(flags(r)).toEqual(["large-trim", "below-min-diameter"]);
  });
  it("a larger impeller: 1 + 5e-7 is the published one for both, 1 + 2e-6 larger for both", () => {
    expect(catalogueReasons({ trimRatio: 1 + 5e-7 })).toEqual([]);
    expect(flags(1 + 5e-7)).toEqual([]);
    expect(catalogueReasons({ trimRatio: 1 + 2e-6 })).toHaveLength(1);
    expect(flags(1 + 2e-6)).toEqual(["diameter-increase"]);
  });
});

describe("the search's smallest impeller uses the same allowance (LIMIT_ROUNDOFF)", () => {
  // The made-up sample curve (Ø200 mm) trimmed to a duty of 40 m³/h at 25 m (its own 31 m there): the search's solved ratio
  // r gives Ø200·r; the model's smallest impeller is set just above it. Only trim is tried, so a refused trim is no row.
  const duty = { flow: 40 / 3600, head: 25 };
  const trimmedAt = (minDiameter?: number) =>
    searchDuty([{ id: "a", curve: { points: samplePoints(), impellerDiameter: 0.2, minDiameter } }], duty, { methods: ["trim"] }).candidates;
  const d = trimmedAt()[0].diameter!;
  it("smallest impeller at Ø·(1 + 5e-7), inside the allowance: the search offers the trim, and the verdict finds it inside", () => {
    const dMin = d * (1 + 5e-7);
    expect(trimmedAt(dMin).map((c) => c.method)).toEqual(["trim"]); // old code: [] (refused past 1e-9)
    expect(catalogueReasons({ diameter: d, minDiameter: dMin })).toEqual([]);
  });
  it("the flip: at Ø·(1 + 2e-6) both refuse it", () => {
    const dMin = d * (1 + 2e-6);
    expect(trimmedAt(dMin)).toEqual([]);
    expect(catalogueReasons({ diameter: d, minDiameter: dMin })).toHaveLength(1);
  });
});
