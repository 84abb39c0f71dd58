/** Tier 3 — pump curve consistency and limits. Curves are synthetic (test/curves.ts). */
import { describe, expect, it } from "vitest";
import { createPumpCurve, efficiencyAt, EngineInputError, flowsAtHead, headAt, npshrAt, sampleCurve, shaftPowerAt } from "./index.ts";
import { M3H, SAMPLE_ROWS, samplePoints } from "./test/curves.ts";

function expectInputError(fn: () => unknown, parameter: string | RegExp) {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(EngineInputError);
    const p = (e as EngineInputError).parameter;
    if (typeof parameter === "string") expect(p).toBe(parameter);
    else expect(p).toMatch(parameter);
    return;
  }
  throw new Error("expected an EngineInputError");
}

describe("interpolation (Fritsch & Carlson 1980 monotone cubic)", () => {
  const c = createPumpCurve({ points: samplePoints() });
  it("passes through every point; at zero flow gives the shutoff head (definition)", () => {
    for (const [q, h] of SAMPLE_ROWS) expect(headAt(c, q * M3H)).toBeCloseTo(h, 12);
    expect(c.shutoffHead).toBe(36);
    expect(headAt(c, 0)).toBe(36);
  });
  it("never oscillates: between two points the head stays within their values and keeps the data's direction", () => {
    for (let i = 0; i < SAMPLE_ROWS.length - 1; i++) {
      const [q0, h0] = SAMPLE_ROWS[i], [q1, h1] = SAMPLE_ROWS[i + 1];
      let prev = h0;
      for (let k = 1; k <= 50; k++) {
        const h = headAt(c, (q0 + ((q1 - q0) * k) / 50) * M3H)!;
        expect(h).toBeLessThanOrEqual(Math.max(h0, h1) + 1e-12);
        expect(h).toBeGreaterThanOrEqual(Math.min(h0, h1) - 1e-12);
        expect(h).toBeLessThanOrEqual(prev + 1e-12);
        prev = h;
      }
    }
  });
  it("efficiency peak is not overshot between points (max of interpolant = max of data)", () => {
    const s = sampleCurve(c, 801);
    const maxEta = Math.max(...s.efficiency.map((e) => e ?? 0));
    expect(maxEta).toBeLessThanOrEqual(0.78 + 1e-12);
  });
  it("outside the first..last point → null (flagged, not extrapolated)", () => {
    expect(headAt(c, 81 * M3H)).toBeNull();
    expect(headAt(c, -1e-9)).toBeNull();
    expect(efficiencyAt(c, 81 * M3H)).toBeNull();
    expect(npshrAt(c, 5 * M3H)).toBeNull(); // NPSHr column starts at 10 m³/h
  });
  it("BEP from efficiency; POR 70–120 % of BEP flow (ANSI/HI 9.6.3, from memory)", () => {
    expect(c.bep!.flow).toBeCloseTo(50 * M3H, 15);
    expect(c.bep!.efficiency).toBe(0.78);
    expect(c.por!.min).toBeCloseTo(0.7 * 50 * M3H, 15);
    expect(c.por!.max).toBeCloseTo(1.2 * 50 * M3H, 15);
  });
  it("flowsAtHead inverts headAt", () => {
    for (const q of [5, 25, 47, 66, 79]) {
      const h = headAt(c, q * M3H)!;
      const qs = flowsAtHead(c, h);
      expect(qs.length).toBe(1);
      expect(qs[0] / (q * M3H)).toBeCloseTo(1, 9);
    }
  });
});

describe("efficiency and power columns are consistent (P = ρ·g₀·Q·H/η, definition)", () => {
  const withEta = createPumpCurve({ points: samplePoints({ efficiency: true }) });
  const withPower = createPumpCurve({ points: samplePoints({ efficiency: false, power: true }) });
  it("same efficiency and shaft power at the data points", () => {
    for (const [q, , e] of SAMPLE_ROWS.slice(1)) {
      expect(efficiencyAt(withPower, q * M3H)!).toBeCloseTo(e, 12);
      expect(shaftPowerAt(withPower, q * M3H, 1000)! / shaftPowerAt(withEta, q * M3H, 1000)!).toBeCloseTo(1, 12);
    }
    expect(withPower.bep!.flow).toBeCloseTo(withEta.bep!.flow, 15);
  });
  it("between points the two interpolations agree within 3 % (different quantities interpolated)", () => {
    for (let q = 12; q < 80; q += 3.7) {
      expect(Math.abs(shaftPowerAt(withPower, q * M3H, 998)! / shaftPowerAt(withEta, q * M3H, 998)! - 1)).toBeLessThan(0.03);
    }
  });
  it("shaft power scales with fluid density for a power-column curve", () => {
    const q = 40 * M3H;
    expect(shaftPowerAt(withPower, q, 1200)! / shaftPowerAt(withPower, q, 1000)!).toBeCloseTo(1.2, 12);
  });
});

describe("validation: bad curves throw EngineInputError naming the parameter", () => {
  it("empty curve", () => expectInputError(() => createPumpCurve({ points: [] }), "points"));
  it("single point", () => expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }] }), "points"));
  it("duplicate flows", () =>
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: 0.01, head: 9 }, { flow: 0.01, head: 8 }] }), "points[2].flow"));
  it("decreasing flows", () =>
    expectInputError(() => createPumpCurve({ points: [{ flow: 0.02, head: 10 }, { flow: 0.01, head: 9 }] }), "points[1].flow"));
  it("non-finite values", () => {
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: NaN }, { flow: 0.01, head: 9 }] }), "points[0].head");
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: Infinity, head: 9 }] }), "points[1].flow");
  });
  it("negative head, efficiency given in percent", () => {
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: 0.01, head: -1 }] }), "points[1].head");
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10, efficiency: 0 }, { flow: 0.01, head: 9, efficiency: 75 }] }), "points[1].efficiency");
  });
  it("head rising with flow beyond the tolerance (default 10 % of the first head) and beyond a drooping peak (25 %, headShape.ts)", () => {
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: 0.01, head: 12.6 }, { flow: 0.02, head: 8 }] }), "points[1].head"); // 26 % > 25 %
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: 0.01, head: 10.5 }, { flow: 0.02, head: 11.5 }, { flow: 0.03, head: 8 }] }), "points[2].head"); // highest at 2/3 of its flows
    // ... and a rise after a fall (S-shaped) is also caught.
    expectInputError(() => createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: 0.01, head: 7 }, { flow: 0.02, head: 8.5 }] }), "points[2].head");
  });
  it("drooping curve within the tolerance is accepted and flagged", () => {
    const c = createPumpCurve({ points: [{ flow: 0, head: 10 }, { flow: 0.01, head: 10.6 }, { flow: 0.02, head: 9 }, { flow: 0.03, head: 6 }] });
    expect(c.drooping).toBe(true);
    expect(c.warnings.map((w) => w.code)).toContain("drooping-curve");
  });
});
