// ANSI/HI 9.6.7 (from memory: verify against the standard). python3-fluids has no HI 9.6.7 function (its pump.py has
// motor, VFD and specific-speed figures only: checked), so every check value below is a hand calculation of the
// equations in viscous.ts, done with python3 as a calculator and written beside it.
import { describe, expect, it } from "vitest";
import {
  bisection, correctCurveForViscosity, createPumpCurve, efficiencyAt, EngineInputError, equivalentWaterDuty, findCorrelation, G0, headAt, judgeCandidate, shaftPowerAt,
  viscosityCorrectionText, viscosityFactors, viscosityParameterB, VISCOSITY_B_MAX, VISCOSITY_B_NO_CORRECTION,
} from "./index.ts";

// The hunt's case: oil 900 kg/m³, 0.5 Pa·s (ν = 555.6 cSt), pump BEP 39.6 m³/h at 27 m, 2900 rpm.
const oil = { kinematicViscosity: 0.5 / 900, bepFlow: 39.6 / 3600, bepHead: 27, speed: 2900 };
const M3H = 1 / 3600;

describe("ANSI/HI 9.6.7 parameter B (viscous.ts)", () => {
  it("is computed in its US units (ν cSt, H ft, Q US gpm, N rpm): a hand calculation", () => {
    // Hand: 39.6 m³/h = 174.354 gpm, 27 m = 88.583 ft; 26.6 · 555.56^0.5 · 88.583^0.0625 / (174.354^0.375 · 2900^0.25) = 16.324.
    expect(viscosityParameterB(oil).b).toBeCloseTo(16.324, 3);
    // Water 1 cSt on the same pump: 0.6926 (same equation by hand), no correction.
    const water = viscosityParameterB({ ...oil, kinematicViscosity: 1e-6 });
    expect(water.b).toBeCloseTo(0.6926, 4);
    expect(water.needsCorrection).toBe(false);
    expect(viscosityParameterB(oil).needsCorrection).toBe(true);
  });

  it("the standard's SI form (16.5, m³/h and m) is the same equation with its constant rounded: 0.4 % apart", () => {
    // Hand: 16.5 · 555.56^0.5 · 27^0.0625 / (39.6^0.375 · 2900^0.25) = 16.390; 26.6 · 3.2808^0.0625 / 4.4029^0.375 = 16.43.
    const si = (16.5 * Math.sqrt(555.56) * 27 ** 0.0625) / (39.6 ** 0.375 * 2900 ** 0.25);
    expect(si).toBeCloseTo(16.39, 2);
    expect(Math.abs(viscosityParameterB(oil).b / si - 1)).toBeLessThan(0.005);
  });

  it("flips at B = 1: a viscosity a hair below the one that gives B = 1 needs no correction, a hair above does", () => {
    const nu1 = bisection((nu) => viscosityParameterB({ ...oil, kinematicViscosity: nu }).b - 1, 1e-7, 1e-4, 1e-15)!.x;
    expect(viscosityParameterB({ ...oil, kinematicViscosity: nu1 * (1 - 1e-6) }).needsCorrection).toBe(false);
    expect(viscosityParameterB({ ...oil, kinematicViscosity: nu1 * (1 + 1e-6) }).needsCorrection).toBe(true);
    // B ∝ ν^0.5: B = 1 at ν = (1 / 0.69256)² cSt = 2.085 cSt for this pump (hand, from the water value above).
    expect(nu1 * 1e6).toBeCloseTo(2.085, 2);
  });

  it("says above B = 40 that it is outside the method", () => {
    expect(viscosityParameterB(oil).warnings).toEqual([]);
    expect(viscosityParameterB({ ...oil, kinematicViscosity: 4e-3 }).warnings[0].message).toMatch(/B = 43\.8 is above 40.*outside the method/); // hand: 16.324·(4000/555.56)^0.5 = 43.80
  });
});

describe("ANSI/HI 9.6.7 correction factors at the BEP", () => {
  it("match hand values", () => {
    // Hand: B = 16.4 → C_Q = 2.71^(−0.165·1.2148^3.15) = 0.7381, C_η = 16.4^(−0.0547·16.4^0.69) = 0.3484.
    const f = viscosityFactors(16.4);
    expect(f.flow).toBeCloseTo(0.7381, 4);
    expect(f.head).toBeCloseTo(0.7381, 4);
    expect(f.efficiency).toBeCloseTo(0.3484, 4);
    // Hand, same equations: B = 5 → 0.9482, 0.7655; B = 10 → 0.8483, 0.5396; B = 40 (the range's end) → 0.4839, 0.0764.
    expect(viscosityFactors(5).flow).toBeCloseTo(0.9482, 4);
    expect(viscosityFactors(5).efficiency).toBeCloseTo(0.7655, 4);
    expect(viscosityFactors(10).flow).toBeCloseTo(0.8483, 4);
    expect(viscosityFactors(10).efficiency).toBeCloseTo(0.5396, 4);
    expect(viscosityFactors(40).flow).toBeCloseTo(0.4839, 4);
    expect(viscosityFactors(40).efficiency).toBeCloseTo(0.0764, 4);
  });
  it("are 1 at and below B = 1 and below 1 just above it", () => {
    expect(viscosityFactors(VISCOSITY_B_NO_CORRECTION)).toEqual({ flow: 1, head: 1, efficiency: 1, warnings: [] });
    expect(viscosityFactors(1.01).efficiency).toBeLessThan(1);
  });
  it("are registered with their range, source and units (registry.ts)", () => {
    const c = findCorrelation("hi-viscosity");
    expect(c?.kind).toBe("pump-viscosity");
    if (c?.kind !== "pump-viscosity") return;
    expect(c.validity.b).toEqual([1, 40]);
    expect(c.reference).toMatch(/ANSI\/HI 9\.6\.7.*from memory/);
    expect(c.fn(16.4).efficiency).toBe(viscosityFactors(16.4).efficiency);
  });
});

// A water curve (invented): 0/20/40/50/60 m³/h at 40/38/33/30/26 m, η 0/0.50/0.72/0.75/0.70, BEP 50 m³/h at 30 m, 2900 rpm.
const waterPoints = [[0, 40, 0], [20, 38, 0.5], [40, 33, 0.72], [50, 30, 0.75], [60, 26, 0.7]].map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, npshr: 2 + q / 20 }));
const water = createPumpCurve({ points: waterPoints, speed: 2900 });
const at200cSt = { kinematicViscosity: 200e-6, speed: 2900 };

describe("a water curve corrected for viscosity (correctCurveForViscosity)", () => {
  it("200 cSt: every point as the hand calculation gives it", () => {
    // Hand: B = 26.6 · 200^0.5 · 98.425^0.0625 / (220.14^0.375 · 2900^0.25) = 9.033; C_Q = C_BEP-H = 0.8670, C_η = 0.5771.
    const v = correctCurveForViscosity(water, at200cSt);
    expect(v.status).toBe("corrected");
    expect(v.b!).toBeCloseTo(9.033, 3);
    expect(v.factors!.flow).toBeCloseTo(0.867, 4);
    expect(v.factors!.efficiency).toBeCloseTo(0.5771, 4);
    // Hand, C_H = 1 − (1 − 0.8670)·(Q_W/50)^0.75: at 0 → 1 (shut-off head kept), 20 → 0.93312, 40 → 0.88752, 50 → 0.86702, 60 → 0.84754.
    const hand = [[0, 40, 0], [17.3405, 35.4584, 0.28856], [34.681, 29.288, 0.41553], [43.3512, 26.0107, 0.43284], [52.0215, 22.036, 0.40398]];
    v.curve.points.forEach((p, i) => {
      expect(p.flow / M3H).toBeCloseTo(hand[i][0], 3);
      expect(p.head).toBeCloseTo(hand[i][1], 3);
      expect(p.efficiency!).toBeCloseTo(hand[i][2], 4);
      expect(p.npshr).toBe(waterPoints[i].npshr); // NPSHr carried, not corrected
    });
    // The BEP moves with the correction: 43.35 m³/h at 26.01 m (hand, above).
    expect(v.curve.bep!.flow / M3H).toBeCloseTo(43.351, 3);
    expect(v.curve.bep!.head).toBeCloseTo(26.011, 3);
    // P_vis = ρ·g·Q_vis·H_vis/η_vis at the BEP, ρ 900 kg/m³: 900 · 9.80665 · 0.012042 · 26.011 / 0.43284 = 6 386.9 W (water curve: 4 903.3 W).
    expect(shaftPowerAt(v.curve, v.curve.bep!.flow, 900)).toBeCloseTo(6386.9, 0);
    expect(shaftPowerAt(water, water.bep!.flow, 900)).toBeCloseTo(4903.3, 0);
  });

  it("a curve with a power column and no efficiency is corrected the same (η_W = ρ_test·g·Q·H/P)", () => {
    const powered = createPumpCurve({ speed: 2900, points: waterPoints.map((p) => ({ flow: p.flow, head: p.head, ...(p.flow > 0 ? { power: (1000 * G0 * p.flow * p.head) / p.efficiency } : { power: 2500 }) })) });
    const a = correctCurveForViscosity(powered, at200cSt), b = correctCurveForViscosity(water, at200cSt);
    expect(a.b).toBeCloseTo(b.b!, 12);
    for (const q of [10, 30, 45, 52].map((x) => x * M3H)) {
      expect(headAt(a.curve, q)).toBeCloseTo(headAt(b.curve, q)!, 9);
      expect(efficiencyAt(a.curve, q)).toBeCloseTo(efficiencyAt(b.curve, q)!, 9);
    }
  });

  it("B ≤ 1 leaves the curve unchanged (the same curve, no factors)", () => {
    // Hand: B = 1 on this pump at ν = (1/0.63875)² = 2.451 cSt (B at 1 cSt: 26.6 · 98.425^0.0625 / (220.14^0.375 · 2900^0.25) = 0.6388).
    const v = correctCurveForViscosity(water, { ...at200cSt, kinematicViscosity: 2.4e-6 });
    expect(v.b!).toBeLessThanOrEqual(1);
    expect(v.status).toBe("no-correction");
    expect(v.curve).toBe(water);
    expect(v.factors).toBeNull();
    expect(correctCurveForViscosity(water, { ...at200cSt, kinematicViscosity: 2.5e-6 }).status).toBe("corrected");
  });

  it("flips at B = 40, the method's end: at 40 corrected, just above it outside the method and the curve left as on water", () => {
    const nu40 = bisection((nu) => correctCurveForViscosity(water, { ...at200cSt, kinematicViscosity: nu }).b! - VISCOSITY_B_MAX, 1e-3, 1e-2, 1e-15)!.x;
    expect(nu40 * 1e6).toBeCloseTo(3921.4, 0); // hand: (40/0.63875)² cSt
    const edge = correctCurveForViscosity(water, { ...at200cSt, kinematicViscosity: nu40 * (1 - 1e-9) });
    const above = correctCurveForViscosity(water, { ...at200cSt, kinematicViscosity: nu40 * (1 + 1e-6) });
    expect(edge.status).toBe("corrected");
    expect(edge.factors!.efficiency).toBeCloseTo(0.0764, 4); // hand, above
    expect(above.status).toBe("outside-method");
    expect(above.b!).toBeGreaterThan(40);
    expect(above.curve).toBe(water);
    expect(above.factors).toBeNull();
    expect(above.warnings[0].message).toMatch(/above 40.*outside the method/);
  });

  it("a curve without efficiency or power has no BEP to correct from", () => {
    const bare = createPumpCurve({ speed: 2900, points: waterPoints.map((p) => ({ flow: p.flow, head: p.head })) });
    expect(correctCurveForViscosity(bare, at200cSt)).toMatchObject({ status: "no-bep", b: null, curve: bare });
  });
});

describe("the verdict on a viscous liquid (verdict.ts)", () => {
  const edges = (q: number) => [{ name: "least lift, new pipe", flow: q * 1.05, head: 20 }, { name: "most lift, aged pipe", flow: q, head: 22 }];
  it("judged on the corrected curve: the status as judged, saying so with B and the factors", () => {
    const v = judgeCandidate({ dutyFlow: 0.01, edges: edges(0.0105), viscosity: { b: 16.4, corrected: true } })!;
    expect(v.status).toBe("meets");
    expect(v.rule).toMatch(/^meets: .*; judged on the curve corrected for viscosity per ANSI\/HI 9\.6\.7: B = 16\.40, C_Q 0\.738, C_H at BEP 0\.738, C_η 0\.348$/);
    expect(v.reasons[0]).toMatch(/^Figures on the pumped liquid: curve corrected for viscosity per ANSI\/HI 9\.6\.7: B = 16\.40, C_Q 0\.738, C_H at BEP 0\.738, C_η 0\.348 \(head at other flows C_H = 1 − \(1 − C_BEP-H\)·\(Q_W\/Q_BEP-W\)\^0\.75; .*from memory: verify against the standard\)\.$/);
    expect(v.reasons[1]).toMatch(/^Delivers/);
    expect(judgeCandidate({ dutyFlow: 0.01, edges: edges(0.009), viscosity: { b: 16.4, corrected: true } })!.status).toBe("short");
    expect(viscosityCorrectionText(16.4, false)).toBe("curve corrected for viscosity per ANSI/HI 9.6.7: B = 16.40, C_Q 0.738, C_H at BEP 0.738, C_η 0.348");
  });
  it("B ≤ 1 says nothing; B above 40 uncorrected is 'viscosity-uncorrected', outside the method; short stays short", () => {
    expect(judgeCandidate({ dutyFlow: 0.01, edges: edges(0.0105), viscosity: { b: 1, corrected: false } })).toEqual(judgeCandidate({ dutyFlow: 0.01, edges: edges(0.0105) }));
    const out = judgeCandidate({ dutyFlow: 0.01, edges: edges(0.0105), viscosity: { b: 40 * (1 + 1e-6), corrected: false } })!;
    expect(out.status).toBe("viscosity-uncorrected");
    expect(out.rule).toMatch(/^viscosity-uncorrected: outside the method — ANSI\/HI 9\.6\.7 corrects a water curve only for B up to 40 \(B = 40\.0+\d+\)$/);
    expect(out.reasons[0]).toMatch(/above 40, outside the ANSI\/HI 9\.6\.7 method's range, so no correction is possible.*cannot be signed off as is/);
    expect(out.reasons[1]).toMatch(/^On the water curve \(meets the duty\): Delivers/);
    expect(judgeCandidate({ dutyFlow: 0.01, edges: edges(0.013), viscosity: { b: 44, corrected: false } })?.status).toBe("viscosity-uncorrected");
    const short = judgeCandidate({ dutyFlow: 0.01, edges: edges(0.009), viscosity: { b: 44, corrected: false } })!;
    expect(short.status).toBe("short");
    expect(short.reasons.at(-1)).toMatch(/B is 44\.00, above 1.*outside the ANSI\/HI 9\.6\.7 method's range.*falls further short/);
  });
  it("refuses a curve said to be corrected above B = 40", () => {
    expect(() => judgeCandidate({ dutyFlow: 0.01, edges: edges(0.0105), viscosity: { b: 41, corrected: true } })).toThrow(EngineInputError);
  });
});

describe("the equivalent water duty for a viscous duty (equivalentWaterDuty)", () => {
  // ANSI/HI 9.6.7, its procedure for choosing a pump for a given viscous duty (from memory): B with the duty taken as the BEP,
  // C_Q and C_H at 1.0 × Q_BEP, Q_W = Q_vis / C_Q, H_W = H_vis / C_H. Hand calculation (python3 as a calculator):
  // 100 m³/h = 440.287 gpm, 30 m = 98.425 ft, 200 cSt, 2900 rpm → B = 26.6·200^0.5·98.425^0.0625 / (440.287^0.375·2900^0.25)
  // = 6.9657; C_Q = C_H = 2.71^(−0.165·(log₁₀ 6.9657)^3.15) = 0.90843; C_η = 6.9657^(−0.0547·6.9657^0.69) = 0.66685;
  // Q_W = 100 / 0.90843 = 110.080 m³/h, H_W = 30 / 0.90843 = 33.024 m.
  const duty = { flow: 100 * M3H, head: 30, kinematicViscosity: 200e-6, speed: 2900 };
  it("inside the method's range: B, the factors and the water duty as the hand calculation gives them", () => {
    const w = equivalentWaterDuty(duty);
    expect(w.status).toBe("corrected");
    expect(w.b).toBeCloseTo(6.9657, 4);
    expect(w.factors!.flow).toBeCloseTo(0.90843, 5);
    expect(w.factors!.head).toBeCloseTo(0.90843, 5);
    expect(w.factors!.efficiency).toBeCloseTo(0.66685, 5);
    expect(w.flow / M3H).toBeCloseTo(110.080, 3);
    expect(w.head).toBeCloseTo(33.024, 3);
  });
  it("B above 40 (8000 cSt: hand B = 44.06) is outside the method: the duty itself, with the warning", () => {
    const w = equivalentWaterDuty({ ...duty, kinematicViscosity: 8000e-6 });
    expect(w.status).toBe("outside-method");
    expect(w.b).toBeCloseTo(44.06, 2);
    expect(w.factors).toBeNull();
    expect([w.flow, w.head]).toEqual([duty.flow, duty.head]);
    expect(w.warnings[0].message).toMatch(/B = 44\.1 is above 40.*outside the method/);
  });
  it("B ≤ 1 (water, 1 cSt: hand B = 0.4926) needs no correction: the duty itself", () => {
    const w = equivalentWaterDuty({ ...duty, kinematicViscosity: 1e-6 });
    expect(w.status).toBe("no-correction");
    expect(w.b).toBeCloseTo(0.4926, 4);
    expect([w.flow, w.head]).toEqual([duty.flow, duty.head]);
  });
});
