/**
 * A grade's power and efficiency limits (gradePower.ts) and fieldCheck's verdict with them.
 * Check values: ISO 9906:2012 grades as in TOLERANCE_GRADES (from memory: 1B power +4 %, efficiency −3 %; 1E power +4 %,
 * efficiency 0), the efficiency allowance read as a fraction of the curve's efficiency (our reading, gradePower.ts).
 * The curve is invented: H = 40 − 1000·Q (m, m³/s), efficiency 70 % at its knot Q = 0.015 m³/s (H = 25 m there).
 * Hand calculations: curve shaft power P_c = ρ·g₀·Q·H/η = 998 × 9.80665 × 0.015 × 25 / 0.7 = 5243.06 W; a measured
 * efficiency is ρ·g₀·Q·H_measured / P_measured, so at H = 1.02·H_c and P = (1 + x)·P_c it is η_c · 1.02/(1 + x).
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, fieldCheck, G0, gradePower, gradePowerWithinAccuracy, TOLERANCE_GRADES, type Fluid } from "./index.ts";
import { fmtPctSignedExact } from "./quantityText.ts";

const RHO = 998;
const grade = (id: string) => TOLERANCE_GRADES.find((g) => g.id === id)!;
const curve = createPumpCurve({
  points: [0, 0.005, 0.01, 0.015, 0.02, 0.025, 0.03].map((q, i) => ({ flow: q, head: 40 - 1000 * q, efficiency: [0, 0.45, 0.62, 0.7, 0.66, 0.55, 0.4][i] })),
});
const Q = 0.015;
const HC = 25;
const PC = (RHO * G0 * Q * HC) / 0.7; // 5243.06 W (hand calculation above)

describe("gradePower: the limits, each at its threshold", () => {
  it("reads the curve's shaft power and efficiency at the knot (control)", () => {
    const r = gradePower(curve, Q, HC, RHO, PC, grade("1B"));
    expect(r.power!.curve!).toBeCloseTo(5243.06, 1);
    expect(r.efficiency!.curve!).toBeCloseTo(0.7, 12);
    expect(r.pass).toBe(true);
  });

  it("power +3.9 % is met and +4.1 % is not (1B allows +4 %); the head 2 % high keeps the efficiency within −3 %", () => {
    const at = (x: number) => gradePower(curve, Q, 1.02 * HC, RHO, (1 + x) * PC, grade("1B"));
    const under = at(0.039);
    const over = at(0.041);
    expect([under.power!.pass, under.efficiency!.pass, under.pass]).toEqual([true, true, true]);
    expect([over.power!.pass, over.efficiency!.pass, over.pass]).toEqual([false, true, false]);
    expect(over.power!.deviation!).toBeCloseTo(0.041, 12);
    expect(over.efficiency!.deviation!).toBeCloseTo(1.02 / 1.041 - 1, 12); // −2.0 %
  });

  it("efficiency 2 % below the curve's: 1B (−3 % allowed) met, 1E (0 allowed) missed; power +2.04 % met by both", () => {
    const p = PC / 0.98; // on the curve's head: η = 0.98 × 0.7
    const b = gradePower(curve, Q, HC, RHO, p, grade("1B"));
    const e = gradePower(curve, Q, HC, RHO, p, grade("1E"));
    expect(b.efficiency!.deviation!).toBeCloseTo(-0.02, 12);
    expect([b.power!.pass, b.efficiency!.pass, b.pass]).toEqual([true, true, true]);
    expect([e.power!.pass, e.efficiency!.pass, e.pass]).toEqual([true, false, false]);
  });

  it("the efficiency threshold is relative: −2.9 % of 70 % met by 1B, −3.1 % missed (2.03 and 2.17 points)", () => {
    const at = (x: number) => gradePower(curve, Q, HC, RHO, PC / (1 - x), grade("1B")).efficiency!.pass;
    expect([at(0.029), at(0.031)]).toEqual([true, false]);
  });

  it("not judged where the curve gives no value; a grade with no limits judges nothing", () => {
    const noEff = createPumpCurve({ points: [0, 0.015, 0.03].map((q) => ({ flow: q, head: 40 - 1000 * q })) });
    expect(gradePower(noEff, Q, HC, RHO, PC, grade("1B"))).toEqual({ power: expect.objectContaining({ curve: null, pass: null }), efficiency: expect.objectContaining({ curve: null, pass: null }), pass: null });
    expect(gradePower(curve, Q, HC, RHO, PC, { id: "x", flow: [0.05, 0.05], head: [0.03, 0.03], source: "test" })).toEqual({ power: null, efficiency: null, pass: null });
  });
});

describe("fieldCheck: a grade is met on flow/head AND power AND efficiency", () => {
  const fluid: Fluid = { name: "water", density: RHO, dynamicViscosity: 1e-3, kinematicViscosity: 1e-3 / RHO, vaporPressure: 2339 };
  const gauge = (p: number) => ({ pressure: p, elevation: 0, pipeDiameter: 0.1 });
  const onCurve = (measuredPower?: number) =>
    fieldCheck({ curve, fluid, suction: gauge(0), discharge: gauge(HC * RHO * G0), measuredFlow: Q, measuredPower, grades: [grade("1B"), grade("2B")] });

  it("without a shaft power: met on flow and head, and the message says power and efficiency were not judged", () => {
    const r = onCurve();
    expect(r.bestGrade).toBe("1B");
    expect(r.grades[0].power).toBeNull();
    expect(r.message).toBe("Delivered point is within grade 1B of the curve on flow and head; power and efficiency not judged (no shaft power measured)");
  });

  it("power +12 % on the curve's flow and head: 1B and 2B (+8 %) missed, the message names the limits and numbers", () => {
    const r = onCurve(1.12 * PC);
    expect(r.grades.map((g) => [g.id, g.cross!.pass, g.pass])).toEqual([["1B", true, false], ["2B", true, false]]);
    expect(r.bestGrade).toBeNull();
    expect(r.verdict).toBe("outside-tolerance");
    // Efficiency 1/1.12 − 1 = −10.7 % (hand calculation).
    expect(r.message).toBe("Delivered point meets grade 1B on flow and head but misses its power limit (+12.0 % against +4 % allowed) and efficiency limit (−10.7 % against −3 % allowed)");
  });

  it("power +3 % on the curve: 1B met, power and efficiency included", () => {
    const r = onCurve(1.03 * PC);
    expect(r.bestGrade).toBe("1B");
    expect(r.message).toBe("Delivered point is within grade 1B of the curve, power and efficiency included");
  });

  it("a point 10 % below the curve's head: outside every grade, the deviation printed with the true minus sign (U+2212)", () => {
    const r = fieldCheck({ curve, fluid, suction: gauge(0), discharge: gauge(0.9 * HC * RHO * G0), measuredFlow: Q, grades: [grade("1B"), grade("2B")] });
    expect(r.verdict).toBe("outside-tolerance");
    expect(r.message).toBe("Delivered point is outside every grade checked (head −10.0 % from curve)"); // 0.9 × 25 m against 25 m
  });
});

describe("fmtPctSignedExact", () => {
  it("the true minus, a plus when asked, the decimals apart from the limits by size", () => {
    expect(fmtPctSignedExact(-0.0301, [0.03])).toBe("−3.01 %");
    expect(fmtPctSignedExact(0.031, [0.03])).toBe("3.1 %");
    expect(fmtPctSignedExact(0.031, [0.03], true)).toBe("+3.1 %");
    expect(fmtPctSignedExact(-0.03, [0.03])).toBe("−3.0 %"); // at the limit it reads as the limit
    expect(fmtPctSignedExact(Number.NaN)).toBe("—");
  });
});


describe("gradePowerWithinAccuracy: the limits within a power reading's ± accuracy (of the reading)", () => {
  // 1B, head 2 % high: the power bound (1 + 4 %)·P_c is the tighter; met within ±2 % while (1 + d)(1 − 0.02) ≤ 1.04 (hand algebra).
  const at = (d: number, a: number) => gradePowerWithinAccuracy(curve, Q, 1.02 * HC, RHO, (1 + d) * PC, grade("1B"), a);
  it("met as read: the reading itself; missed as read: a power in [P(1 − a), P) meeting both limits; past the bound: null", () => {
    expect(at(0.03, 0.02)!.shaft).toBe(1.03 * PC);
    const w = at(0.05, 0.02)!;
    expect(w.check.pass).toBe(true);
    expect(w.shaft).toBeGreaterThanOrEqual(1.05 * PC * 0.98 - 1e-9);
    expect(w.shaft).toBeLessThan(1.04 * PC + 1e-9);
    const t = 1.04 / 0.98 - 1;
    expect(at(t - 1e-9, 0.02)).not.toBeNull();
    expect(at(t + 1e-9, 0.02)).toBeNull();
    expect(at(0.05, 0)).toBeNull(); // ±0: as read
  });
  it("refuses an accuracy outside [0, 1)", () => {
    expect(() => at(0.05, -0.01)).toThrow(/accuracy/);
    expect(() => at(0.05, 1)).toThrow(/accuracy/);
    expect(() => at(0.05, Number.NaN)).toThrow(/accuracy/);
    expect(() => at(0.05, Infinity)).toThrow(/accuracy/);
    expect(() => at(0.05, -Infinity)).toThrow(/accuracy/);
  });
});
