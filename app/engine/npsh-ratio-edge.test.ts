// NPSH verdicts at their edges in the engine (decision "npshzero", the ratio's edge). Rules (common practice): NPSHa / NPSHr
// below 1 is a cavitation risk, below the wanted ratio a low margin; NPSHa at or below zero is a cavitation risk whatever the
// pump, NPSHr 0 included. (1) The ratio at its threshold: judged to 1 part in 10⁸ (limitText.ts LIMIT_ROUNDING) — NPSHa
// 3.3 m over NPSHr 3 m is 1.0999999999999999 in doubles (IEEE 754) and was a low margin "1.10000000 … below the required
// 1.1"; past the allowance the words print the ratio apart from the threshold. (2) The search at NPSHa 0 left a pump in
// whose NPSHr at the duty reads 0 (5e-324 m × a speed ratio² below ½ underflows to 0: no ratio, so never cut). (3) An NPSHr
// column with values some 1e-323 m apart made a NaN tangent (α past the largest double, 0 × Infinity), every NPSHr read in
// that interval NaN, and the whole search threw. Check values: arithmetic on the rule's numbers; 5e-324 is Number.MIN_VALUE.
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshrAt, npshStatus, operatingFigures, prepareSearchIndex, searchDuty } from "./index";
import { LIMIT_ROUNDING, inSI } from "./quantityText";

const M3H = 1 / 3600;
const water = { density: 998.2, vaporPressure: 2339, dynamicViscosity: 1.0016e-3, kinematicViscosity: 1.0034e-6 }; // 20 °C, IAPWS (from memory, rounded)
const pointsWith = (npshr: readonly number[]) => [0, 10, 20, 30].map((q, i) => ({ flow: q * M3H, head: [20, 19, 17, 14][i], efficiency: [0, 0.6, 0.7, 0.65][i], npshr: npshr[i] }));

describe("the NPSH margin ratio at its thresholds (1 and the wanted 1.1), to 1 part in 10⁸", () => {
  it("3.3 m / 3 m against 1.1 is at the wanted ratio: ok (was low-margin)", () => {
    expect(3.3 / 3).toBeLessThan(1.1); // control: the division falls a rounding error short
    expect(npshStatus(3.3 / 3, 1.1)).toBe("ok");
  });
  for (const [threshold, below] of [[1, "cavitation-risk"], [1.1, "low-margin"]] as const) {
    it(`at ${threshold}: within the allowance at it, past it ${below}`, () => {
      const above = threshold === 1 ? "low-margin" : "ok";
      expect(npshStatus(threshold * (1 - 0.5 * LIMIT_ROUNDING), 1.1)).toBe(above);
      expect(npshStatus(threshold * (1 - 0.99 * LIMIT_ROUNDING), 1.1)).toBe(above);
      expect(npshStatus(threshold, 1.1)).toBe(above);
      expect(npshStatus(threshold * (1 - 1.01 * LIMIT_ROUNDING), 1.1)).toBe(below);
      expect(npshStatus(threshold * (1 - 2 * LIMIT_ROUNDING), 1.1)).toBe(below);
    });
  }
  it("the figures' low-margin words print the ratio apart from the required 1.1 just past the allowance", () => {
    // NPSHa set so that NPSHa / NPSHr = 1.1 × (1 − 1.01e-8): NPSHr 1 m published flat, NPSHa from the static suction head.
    const curve = createPumpCurve({ points: pointsWith([1, 1, 1, 1]) });
    const atm = 101325, pv = water.vaporPressure, g = 9.80665;
    const staticFor = (ratio: number) => ratio * 1 - (atm - pv) / (water.density * g);
    const f = (ratio: number) => operatingFigures({ curve, flow: 15 * M3H, fluid: water as never, suction: { surfacePressure: atm, staticSuctionHead: staticFor(ratio), suctionLoss: 0 } });
    const past = f(1.1 * (1 - 1.01e-8));
    expect(past.npsh!.status).toBe("low-margin");
    const w = past.warnings.find((x) => x.code === "npsh-low-margin")!.message;
    const printed = /ratio (\S+) is below the required 1\.1/.exec(inSI(w))![1];
    expect(Number(printed)).toBeLessThan(1.1); // apart from the limit it is judged below
    expect(f(1.1 * (1 - 0.99e-8)).npsh!.status).toBe("ok");
  });
});

describe("the search at NPSHa 0 (the caller's NPSHa ≤ 0) leaves out any pump with an NPSHr at the duty, 0 included", () => {
  // NPSHr 5e-324 m published everywhere; slowed to below half speed, NPSHr × s² reads 0 at the duty.
  const idx = prepareSearchIndex([{ id: "tiny", curve: { points: pointsWith([Number.MIN_VALUE, Number.MIN_VALUE, Number.MIN_VALUE, Number.MIN_VALUE]) } }]);
  const duty = { flow: 4 * M3H, head: 3 };
  const opts = { methods: ["speed"] as ("speed")[], minSpeedRatio: 0.3 };
  it("control: the pump reaches the duty below half speed with NPSHr 0 there", () => {
    const r = searchDuty(idx, duty, opts);
    expect(r.candidates.map((c) => [c.ratio < 0.5, c.npshr])).toEqual([[true, 0]]);
  });
  it("NPSHa 0: left out, counted (was kept with no margin)", () => {
    const r = searchDuty(idx, duty, { ...opts, npshAvailable: 0 });
    expect([r.candidates.length, r.stats.rejectedByNpsh]).toEqual([0, 1]);
  });
  it("NPSHa 1e-9 m above zero beside NPSHr 0: no ratio (NPSHa / 0), kept with no margin — not judged, as the figures say", () => {
    const r = searchDuty(idx, duty, { ...opts, npshAvailable: 1e-9 });
    expect(r.candidates.map((c) => [c.npshr, c.npshMargin])).toEqual([[0, null]]);
  });
  it("the ratio's cut at 1: NPSHa = NPSHr × (1 − 1.01e-8) left out, × (1 − 0.99e-8) kept", () => {
    const one = prepareSearchIndex([{ id: "one", curve: { points: pointsWith([2, 2, 2, 2]) } }]);
    const d = { flow: 15 * M3H, head: 17.5 };
    expect(searchDuty(one, d, { npshAvailable: 2 * (1 - 1.01e-8) }).stats.rejectedByNpsh).toBe(1);
    expect(searchDuty(one, d, { npshAvailable: 2 * (1 - 0.99e-8) }).candidates.length).toBe(1);
  });
  it("the row's words: NPSHa 3.3 m over NPSHr 3 m is at the wanted 1.1, not \"(below 1.1)\"", () => {
    const three = prepareSearchIndex([{ id: "three", curve: { points: pointsWith([3, 3, 3, 3]) } }]);
    const row = searchDuty(three, { flow: 15 * M3H, head: 17.5 }, { npshAvailable: 3.3, requiredNpshMargin: 1.1 }).candidates[0];
    expect(row.npshMargin).toBeLessThan(1.1); // control: the division's rounding error
    expect(row.reason).toMatch(/NPSH margin at duty 1\.10(?!\d)/);
    expect(row.reason).not.toMatch(/below 1\.1/);
  });
});

describe("an NPSHr column with values a few 1e-324 m apart reads a number, not NaN", () => {
  const points = pointsWith([1, 2 * Number.MIN_VALUE, Number.MIN_VALUE, 3]);
  it("npshrAt between 10 and 20 m³/h is finite and between the published values", () => {
    const c = createPumpCurve({ points });
    for (const q of [12, 15, 18]) {
      const n = npshrAt(c, q * M3H)!;
      expect(Number.isNaN(n)).toBe(false);
      expect(n).toBeGreaterThanOrEqual(0);
      expect(n).toBeLessThanOrEqual(2 * Number.MIN_VALUE);
    }
  });
  it("the search does not throw (it threw 'npshr = NaN … is not finite'); NPSHa 0 leaves the pump out", () => {
    const idx = prepareSearchIndex([{ id: "a", curve: { points } }]);
    expect(searchDuty(idx, { flow: 15 * M3H, head: 17.5 }, { npshAvailable: 2 }).candidates.length).toBe(1);
    expect(searchDuty(idx, { flow: 15 * M3H, head: 17.5 }, { npshAvailable: 0 }).stats.rejectedByNpsh).toBe(1);
  });
});
