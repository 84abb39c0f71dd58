/** Tier 3 — affinity laws (common practice: Q ∝ N, H ∝ N², P ∝ N³), trim, several pumps. */
import { describe, expect, it } from "vitest";
import {
  affinityPoint, combinePumps, createPumpCurve, EngineInputError, flowPerPump, headAt, scaleBySpeed, scaleByTrim,
  shaftPowerAt, solveOperatingPoint, speedForDuty, trimForDuty,
} from "./index.ts";
import { M3H, samplePoints } from "./test/curves.ts";

const curve = createPumpCurve({ points: samplePoints({ power: true }), speed: 2900, impellerDiameter: 0.2, minDiameter: 0.17, maxDiameter: 0.21 });

describe("speed (affinity laws)", () => {
  it("round trip: scale by r then 1/r returns the original points (1e-12 relative)", () => {
    for (const r of [0.6, 0.85, 1.1]) {
      const back = scaleBySpeed(scaleBySpeed(curve, r).curve, 1 / r).curve;
      back.points.forEach((p, i) => {
        const o = curve.points[i];
        expect(Math.abs(p.flow - o.flow)).toBeLessThanOrEqual(1e-12 * Math.max(o.flow, 1e-9));
        expect(p.head / o.head).toBeCloseTo(1, 12);
        if (o.power) expect(p.power! / o.power).toBeCloseTo(1, 12);
      });
      expect(back.speed).toBeCloseTo(2900, 9);
    }
  });
  it("Q ∝ N, H ∝ N², P ∝ N³ on the interpolated curve", () => {
    const r = 0.8;
    const s = scaleBySpeed(curve, r).curve;
    for (const q of [10, 33, 50, 71]) {
      expect(headAt(s, r * q * M3H)! / headAt(curve, q * M3H)!).toBeCloseTo(r * r, 12);
      expect(shaftPowerAt(s, r * q * M3H, 1000)! / shaftPowerAt(curve, q * M3H, 1000)!).toBeCloseTo(r ** 3, 12);
    }
    expect(affinityPoint({ flow: 0.01, head: 20, power: 3000 }, 0.5)).toEqual({ flow: 0.005, head: 5, power: 375 });
  });
  it("speedForDuty: the slowed curve passes through the duty; against a system through the duty it operates at the duty flow", () => {
    const duty = { flow: 40 * M3H, head: 22 };
    const sol = speedForDuty(curve, duty);
    expect(sol.status).toBe("ok");
    const slowed = scaleBySpeed(curve, sol.ratio!).curve;
    expect(headAt(slowed, duty.flow)!).toBeCloseTo(22, 9);
    const k = (22 - 10) / duty.flow ** 2;
    const op = solveOperatingPoint(slowed, (q) => 10 + k * q * q);
    expect(op.flow! / duty.flow).toBeCloseTo(1, 9);
    expect(sol.speed!).toBeCloseTo(2900 * sol.ratio!, 9);
  });
  it("duty above the curve at full speed → duty-above-curve", () => {
    expect(speedForDuty(curve, { flow: 40 * M3H, head: 40 }).status).toBe("duty-above-curve");
    expect(speedForDuty(curve, { flow: 40 * M3H, head: 40 }, { max: 1.2 }).status).toBe("ok");
  });
});

describe("impeller trim (approximate)", () => {
  it("linear law: Q ∝ D, H ∝ D²; square law: Q ∝ D², H ∝ D²", () => {
    const lin = scaleByTrim(curve, 0.9).curve;
    const sq = scaleByTrim(curve, 0.9, "square").curve;
    expect(headAt(lin, 0.9 * 40 * M3H)! / headAt(curve, 40 * M3H)!).toBeCloseTo(0.81, 12);
    expect(headAt(sq, 0.81 * 40 * M3H)! / headAt(curve, 40 * M3H)!).toBeCloseTo(0.81, 12);
    expect(lin.impellerDiameter!).toBeCloseTo(0.18, 12);
  });
  it("trimForDuty meets the duty and says it is approximate", () => {
    const duty = { flow: 45 * M3H, head: 25 };
    const sol = trimForDuty(curve, duty);
    expect(sol.status).toBe("ok");
    expect(headAt(scaleByTrim(curve, sol.ratio!).curve, duty.flow)!).toBeCloseTo(25, 9);
    expect(sol.warnings.map((w) => w.code)).toContain("trim-approximate");
  });
  it("flags trims over 20 % and below the model's minimum diameter", () => {
    const codes = scaleByTrim(curve, 0.75).warnings.map((w) => w.code);
    expect(codes).toContain("large-trim");
    expect(codes).toContain("below-min-diameter");
    expect(scaleByTrim(curve, 0.9).warnings.map((w) => w.code)).not.toContain("large-trim");
  });
  it("rejects a bad ratio or law with a typed error", () => {
    expect(() => scaleByTrim(curve, 0)).toThrow(EngineInputError);
    expect(() => scaleByTrim(curve, 0.9, "cubic" as never)).toThrow(EngineInputError);
  });
});

describe("several identical pumps (common practice)", () => {
  it("parallel: flows add at equal head; power adds", () => {
    const p = combinePumps(curve, { mode: "parallel", duty: 3 }).curve;
    for (const q of [10, 40, 70]) {
      expect(headAt(p, 3 * q * M3H)!).toBeCloseTo(headAt(curve, q * M3H)!, 12);
      expect(shaftPowerAt(p, 3 * q * M3H, 1000)! / shaftPowerAt(curve, q * M3H, 1000)!).toBeCloseTo(3, 12);
    }
    expect(flowPerPump(0.03, { mode: "parallel", duty: 3 })).toBeCloseTo(0.01, 15);
  });
  it("series: heads add at equal flow", () => {
    const s = combinePumps(curve, { mode: "series", duty: 2 }).curve;
    for (const q of [0, 25, 80]) expect(headAt(s, q * M3H)!).toBeCloseTo(2 * headAt(curve, q * M3H)!, 12);
  });
  it("duty/standby: standby pumps are not counted", () => {
    const a = combinePumps(curve, { mode: "parallel", duty: 2, standby: 1 });
    const b = combinePumps(curve, { mode: "parallel", duty: 2 });
    expect(a.running).toBe(2);
    expect(a.installed).toBe(3);
    expect(a.curve.flowMax).toBe(b.curve.flowMax);
    expect(a.warnings.map((w) => w.code)).toContain("standby-not-counted");
  });
  it("two in parallel against a system with friction give less than twice one pump's flow", () => {
    const sys = (q: number) => 10 + 25000 * q * q;
    const one = solveOperatingPoint(curve, sys).flow!;
    const two = solveOperatingPoint(combinePumps(curve, { mode: "parallel", duty: 2 }).curve, sys).flow!;
    expect(two).toBeGreaterThan(one);
    expect(two).toBeLessThan(2 * one);
  });
  it("zero duty pumps is a typed error", () => {
    expect(() => combinePumps(curve, { mode: "parallel", duty: 0 })).toThrow(EngineInputError);
  });
});
