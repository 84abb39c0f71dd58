import { describe, expect, it } from "vitest";
import { bisection, judgeCandidate, viscosityFactors, viscosityParameterB, VISCOSITY_B_NO_CORRECTION } from "./index.ts";

// The hunt's case: oil 900 kg/m³, 0.5 Pa·s (ν = 555.6 cSt), pump BEP 39.6 m³/h at 27 m, 2900 rpm.
const oil = { kinematicViscosity: 0.5 / 900, bepFlow: 39.6 / 3600, bepHead: 27, speed: 2900 };

describe("ANSI/HI 9.6.7 parameter B (viscous.ts)", () => {
  it("matches a hand calculation in the SI form (Q m³/h, H m, ν cSt)", () => {
    // Hand: 16.5 · 555.56^0.5 · 27^0.0625 / (39.6^0.375 · 2900^0.25) = 16.39 (ANSI/HI 9.6.7, from memory).
    expect(viscosityParameterB(oil).b).toBeCloseTo(16.39, 2);
    // Water 1 cSt on the same pump: 0.695 (same equation by hand), no correction.
    const water = viscosityParameterB({ ...oil, kinematicViscosity: 1e-6 });
    expect(water.b).toBeCloseTo(0.695, 3);
    expect(water.needsCorrection).toBe(false);
    expect(viscosityParameterB(oil).needsCorrection).toBe(true);
  });

  it("agrees with the US form (constant 26.6, Q US gpm, H ft) to the constants' printed digits", () => {
    // ANSI/HI 9.6.7 from memory: 26.6 with gpm and ft; 16.5 with m³/h and m. The units converted exactly (NIST SP 811):
    const gpm = (oil.bepFlow / 0.003785411784) * 60, ft = oil.bepHead / 0.3048, cst = oil.kinematicViscosity * 1e6;
    const us = (26.6 * Math.sqrt(cst) * ft ** 0.0625) / (gpm ** 0.375 * oil.speed ** 0.25);
    expect(Math.abs(viscosityParameterB(oil).b / us - 1)).toBeLessThan(0.01); // 16.39 vs 16.32
    // The constant 16.5 with gpm and ft (a units slip) would give B 1.6 times too small, 10.2 here: not this.
    const slip = (16.5 * Math.sqrt(cst) * ft ** 0.0625) / (gpm ** 0.375 * oil.speed ** 0.25);
    expect(Math.abs(viscosityParameterB(oil).b / slip - 1)).toBeGreaterThan(0.5);
  });

  it("flips at B = 1: a viscosity a hair below the one that gives B = 1 needs no correction, a hair above does", () => {
    const nu1 = bisection((nu) => viscosityParameterB({ ...oil, kinematicViscosity: nu }).b - 1, 1e-7, 1e-4, 1e-15)!.x;
    expect(viscosityParameterB({ ...oil, kinematicViscosity: nu1 * (1 - 1e-6) }).needsCorrection).toBe(false);
    expect(viscosityParameterB({ ...oil, kinematicViscosity: nu1 * (1 + 1e-6) }).needsCorrection).toBe(true);
    // B ∝ ν^0.5: B = 1 at ν = (1 / 0.6954)² cSt = 2.07 cSt for this pump (hand, from the water value above).
    expect(nu1 * 1e6).toBeCloseTo(2.068, 2);
  });

  it("warns above B = 40, the method's range", () => {
    expect(viscosityParameterB(oil).warnings).toEqual([]);
    expect(viscosityParameterB({ ...oil, kinematicViscosity: 4e-3 }).warnings[0].message).toMatch(/above 40/); // B ≈ 44
  });
});

describe("ANSI/HI 9.6.7 correction factors at the BEP", () => {
  it("match hand values", () => {
    // Hand, ANSI/HI 9.6.7 from memory: B = 16.4 → C_Q = 2.71^(−0.165·1.2148^3.15) = 0.738, C_η = 16.4^(−0.0547·16.4^0.69) = 0.348.
    const f = viscosityFactors(16.4);
    expect(f.flow).toBeCloseTo(0.738, 3);
    expect(f.head).toBeCloseTo(0.738, 3);
    expect(f.efficiency).toBeCloseTo(0.348, 3);
    // B = 5: C_Q 0.948, C_η 0.765 (same equations by hand).
    expect(viscosityFactors(5).flow).toBeCloseTo(0.948, 3);
    expect(viscosityFactors(5).efficiency).toBeCloseTo(0.765, 3);
  });
  it("are 1 at and below B = 1 and below 1 just above it", () => {
    expect(viscosityFactors(VISCOSITY_B_NO_CORRECTION)).toEqual({ flow: 1, head: 1, efficiency: 1, warnings: [] });
    expect(viscosityFactors(1.01).efficiency).toBeLessThan(1);
  });
});

describe("verdict on a liquid with B above 1 (verdict.ts)", () => {
  const edges = (q: number) => [{ name: "least lift, new pipe", flow: q * 1.05, head: 20 }, { name: "most lift, aged pipe", flow: q, head: 22 }];
  it("meets on water becomes viscosity-uncorrected just above B = 1 and stays meets at B = 1", () => {
    const at = (b: number | null) => judgeCandidate({ dutyFlow: 0.01, edges: edges(0.0105), viscosityB: b });
    expect(at(null)?.status).toBe("meets");
    expect(at(1)?.status).toBe("meets");
    const v = at(1 + 1e-9)!;
    expect(v.status).toBe("viscosity-uncorrected");
    expect(v.rule).toMatch(/B above 1/);
    expect(v.reasons[0]).toMatch(/B is 1\.0+1?, above 1.*cannot be signed off/);
    expect(v.reasons[1]).toMatch(/^On the water curve \(meets the duty\): Delivers/);
  });
  it("oversized becomes viscosity-uncorrected; short stays short with the reason", () => {
    expect(judgeCandidate({ dutyFlow: 0.01, edges: edges(0.013), viscosityB: 16.4 })?.status).toBe("viscosity-uncorrected");
    const short = judgeCandidate({ dutyFlow: 0.01, edges: edges(0.009), viscosityB: 16.4 })!;
    expect(short.status).toBe("short");
    expect(short.reasons.at(-1)).toMatch(/B is 16\.40.*74 % of the head and flow and 35 % of the efficiency.*falls further short/);
  });
});
