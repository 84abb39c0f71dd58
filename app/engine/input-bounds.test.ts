/**
 * Engine inputs refused with the parameter named, where they once ran out of memory, returned NaN silently, or were
 * blamed on the curve's points. Bounds (engine bounds, each stated where it is defined): subdivisions 1–10 000 per curve
 * interval (operatingPoint.ts); speed and trim ratios 1/1000–1000 (SCALE_RATIO_RANGE, affinity.ts); at most MAX_PUMPS
 * = 100 duty and 100 standby pumps (multiple.ts; the project form takes 1–8 and 0–8). Curves are made-up.
 */
import { describe, expect, it } from "vitest";
import { combinePumps, createPumpCurve, EngineInputError, flowPerPump, judgeCandidate, MAX_PUMPS, scaleBySpeed, scaleByTrim, solveOperatingPoint, type VerdictInput } from "./index.ts";
import { samplePoints } from "./test/curves.ts";

const points = samplePoints({ power: true });
const curve = createPumpCurve({ points, speed: 2900, impellerDiameter: 0.2 });

function refusal(fn: () => unknown): string {
  try { fn(); } catch (e) {
    expect(e).toBeInstanceOf(EngineInputError);
    return (e as EngineInputError).parameter;
  }
  throw new Error("not refused");
}

describe("solveOperatingPoint subdivisions: a whole number 1–10 000 (engine bound)", () => {
  const sys = (q: number) => 10 + 2e4 * q * q; // made-up system curve, m
  it("Infinity, NaN, 1e7, 0 and 2.5 are refused naming subdivisions (Infinity ran out of memory, NaN made a false 'shutoff head below')", () => {
    for (const s of [Infinity, NaN, 1e7, 10_001, 0, 2.5]) expect(refusal(() => solveOperatingPoint(curve, sys, { subdivisions: s }))).toBe("subdivisions");
  });
  it("1 and 10 000 are taken and find the same point as the default 8", () => {
    const q8 = solveOperatingPoint(curve, sys).flow!;
    expect(solveOperatingPoint(curve, sys, { subdivisions: 1 }).flow).toBeCloseTo(q8, 12);
    expect(solveOperatingPoint(curve, sys, { subdivisions: 10_000 }).flow).toBeCloseTo(q8, 12);
  });
});

describe("flowPerPump with a raw curve as `single`", () => {
  it("prepares it: the same share as with the prepared curve, not NaN", () => {
    const total = curve.flowMax * 3; // the combined curve's end (3 pumps in parallel)
    const prepared = flowPerPump(total, { mode: "parallel", duty: 3 }, curve);
    expect(flowPerPump(total, { mode: "parallel", duty: 3 }, { points })).toBe(prepared);
    expect(prepared).toBe(curve.flowMax); // the combined curve's end is the pump's end (multiple.ts)
  });
});

describe("judgeCandidate: powers and heads refused with the field named", () => {
  const base: VerdictInput = { dutyFlow: 0.01, edges: [{ name: "most lift, aged pipe", flow: 0.02, head: 10 }] };
  const saving = (power: number) => [{ means: "throttling" as const, power, how: "valve closed to the duty" }];
  it("powerNow NaN, −1, Infinity", () => {
    for (const p of [NaN, -1, Infinity]) expect(refusal(() => judgeCandidate({ ...base, powerNow: p, savings: saving(4000) }))).toBe("powerNow");
  });
  it("savings[].power NaN, −1, Infinity", () => {
    for (const p of [NaN, -1, Infinity]) expect(refusal(() => judgeCandidate({ ...base, powerNow: 5000, savings: saving(p) }))).toBe("savings[0].power");
  });
  it("an edge head of −5 m (a head on a pump curve is never below zero)", () => {
    expect(refusal(() => judgeCandidate({ dutyFlow: 0.01, edges: [{ name: "a", flow: 0.02, head: -5 }] }))).toBe("edges.head");
  });
  it("an unknown means", () => {
    expect(refusal(() => judgeCandidate({ ...base, powerNow: 5000, savings: [{ means: "Speed" as never, power: 4000, how: "x" }] }))).toBe("savings[0].means");
  });
});

describe("scaleBySpeed and scaleByTrim: the ratio named, not the curve's points", () => {
  it("1e-200 and 1e103 are refused as the ratio", () => {
    for (const r of [1e-200, 1e103, 9e-4, 1001]) {
      expect(refusal(() => scaleBySpeed(curve, r))).toBe("ratio");
      expect(refusal(() => scaleByTrim(curve, r))).toBe("ratio");
    }
  });
  it("the range's ends are taken", () => {
    expect(scaleBySpeed(curve, 1e-3).curve.flowMax).toBeCloseTo(curve.flowMax * 1e-3, 15);
    expect(scaleBySpeed(curve, 1e3).curve.flowMax).toBeCloseTo(curve.flowMax * 1e3, 9);
  });
});

describe("combinePumps and flowPerPump: pump counts up to MAX_PUMPS (engine bound)", () => {
  it("duty 2^53, 1e300 and 101 and standby 1e9 are refused naming the count", () => {
    for (const d of [2 ** 53, 1e300, MAX_PUMPS + 1]) {
      expect(refusal(() => combinePumps(curve, { mode: "parallel", duty: d }))).toBe("arrangement.duty");
      expect(refusal(() => flowPerPump(0.01, { mode: "parallel", duty: d }))).toBe("arrangement.duty");
    }
    expect(refusal(() => combinePumps(curve, { mode: "parallel", duty: 2, standby: 1e9 }))).toBe("arrangement.standby");
  });
  it("the form's 8 duty and 8 standby, and 100 of each, are taken", () => {
    expect(combinePumps(curve, { mode: "parallel", duty: 8, standby: 8 }).installed).toBe(16);
    expect(combinePumps(curve, { mode: "series", duty: MAX_PUMPS, standby: MAX_PUMPS }).running).toBe(100);
  });
});
