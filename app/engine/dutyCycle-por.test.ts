// Duty-cycle steps judged against the BEP (stepPor.ts): a step with hours outside the preferred operating region, 70–120 %
// of BEP flow (ANSI/HI 9.6.3, from memory), gets a note with its ratio, hours and the rule; below 50 % of BEP flow (common
// practice, from memory: a typical minimum continuous stable flow) a stronger one. Flips tested just either side of 70 %,
// 120 % and 50 % at fixed speed, under a drive (BEP flow × n, affinity laws) and for pumps in parallel staged by demand
// (each running pump's share). Check values: the made-up sample curve (engine/test/curves.ts, BEP 50 m³/h at 78 %) and
// hand algebra on an invented system H = 15 m + 0.002 m/(m³/h)² · Q²; the drive's flips solved by hand from the
// affinity laws: at a ratio r of one pump's BEP flow Q_b, Q/n = r·Q_b, so n² · (H(r·Q_b) − k·(r·Q_b)²) = 15 m.
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, headAt, stagedDutyCycleEnergy, type ControlMode, type DutyCycleResult } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { M3H, samplePoints } from "./test/curves.ts";

const curve = createPumpCurve({ points: samplePoints({ npshr: false }) });
const QB = 50 * M3H; // BEP flow of the sample curve (its 78 % point, interior)
const HS = 15; // static head, m
const K = 0.002; // m per (m³/h)²
const single = (q: number) => HS + K * (q / M3H) ** 2; // 20 m at the 50 m³/h design flow
const MOTOR = { rating: 7500, efficiency: 0.9 }; // covers every step here (about 5.3 kW at 60 m³/h, hand: ρgQH/η)

const run = (mode: ControlMode, f: number, systemHead = single): DutyCycleResult =>
  dutyCycleEnergy({ curve, systemHead, designFlow: QB, mode, profile: [{ flowFraction: f, hours: 3000 }], density: 1000, motor: MOTOR, driveEfficiency: mode === "fixed-speed" ? null : 0.97 });
const porCodes = (r: DutyCycleResult) => r.warnings.filter((w) => /^step-(outside-por|below-min-flow)$/.test(w.code)).map((w) => [w.code, w.parameter]);
const note = (r: DutyCycleResult) => inSI(r.warnings.find((w) => /^step-(outside-por|below-min-flow)$/.test(w.code))?.message ?? "");
/**
 * The design-flow fraction where a drive on the system curve runs each pump at r of its BEP flow (hand algebra above):
 * pumps running share the system flow Q = pumps · r · Q_b · n; the design flow qd; k of the system in m per (m³/h)².
 */
function vfdFlip(r: number, pumps = 1, k = K, qd = QB): { f: number; n: number } {
  const h = headAt(curve, r * QB)!;
  const n = Math.sqrt(HS / (h - k * (pumps * r * QB / M3H) ** 2));
  return { f: (pumps * r * QB * n) / qd, n };
}

describe("fixed speed, throttled: the ratio is the step's flow over the BEP flow (the curve as run)", () => {
  it.each([
    [0.701, null], [0.699, "step-outside-por"], // 70 %: the POR's lower edge
    [1.199, null], [1.201, "step-outside-por"], // 120 %: its upper edge
    [0.501, "step-outside-por"], [0.499, "step-below-min-flow"], // 50 %: the common minimum-flow bound
  ])("a step at %s of the BEP flow: %s", (f, code) => {
    const r = run("fixed-speed", f);
    expect(r.steps[0].status).toBe("ok");
    expect(porCodes(r)).toEqual(code ? [[code, "profile[0]"]] : []);
  });
  it("the notes' words: ratio, flows, hours and the rule", () => {
    expect(note(run("fixed-speed", 0.699))).toBe("at 70 % flow the pump runs at 34.9 m³/h, 69.9 % of its BEP flow, 50.0 m³/h, for 3000 h a year: left of (below) the preferred operating region 70–120 % of BEP flow (ANSI/HI 9.6.3, from memory); more vibration and radial load, shorter bearing and seal life the longer it runs there (a note, not a failure)");
    expect(note(run("fixed-speed", 1.201))).toMatch(/^at 120 % flow the pump runs at 60\.1 m³\/h, 120\.1 % of its BEP flow, 50\.0 m³\/h, for 3000 h a year: right of \(above\) the preferred operating region 70–120 % of BEP flow \(ANSI\/HI 9\.6\.3, from memory\); more NPSH needed/);
    expect(note(run("fixed-speed", 0.25))).toBe("at 25 % flow the pump runs at 12.5 m³/h, 25 % of its BEP flow, 50.0 m³/h, for 3000 h a year: below 50 % of BEP flow, a common lower bound for continuous running where a pump's minimum continuous stable flow typically lies (common practice, from memory); no maker's minimum flow is recorded for this curve (check the maker's data sheet); and outside the preferred operating region 70–120 % of BEP flow (ANSI/HI 9.6.3, from memory); expect recirculation in the impeller, heating of the liquid, vibration and shorter bearing and seal life — a smaller pump, pumps staged, a drive or a minimum-flow bypass for these hours (a note, not a failure)");
  });
  it("a candidate set to 80 % speed and run fixed: the curve is as run, its BEP flow not scaled again (69.9 %, not 87.4 %)", () => {
    const r = dutyCycleEnergy({ curve, systemHead: single, designFlow: QB, mode: "fixed-speed", fixedSpeedRatio: 0.8, profile: [{ flowFraction: 0.699, hours: 3000 }], density: 1000, motor: MOTOR, driveEfficiency: 0.97 });
    expect(note(r)).toMatch(/^at 70 % flow the pump runs at 34\.9 m³\/h, 69\.9 % of its BEP flow, 50\.0 m³\/h,/);
  });
  it("a step at 0 % flow says nothing; one of 0 h says it marked as information only (decision \"npshzero\"; it said nothing); a note is not a failure (the step met, the cycle complete)", () => {
    const r = dutyCycleEnergy({ curve, systemHead: single, designFlow: QB, mode: "fixed-speed", profile: [{ flowFraction: 0.25, hours: 0 }, { flowFraction: 0, hours: 500 }, { flowFraction: 0.25, hours: 0.01 }], density: 1000, motor: MOTOR, driveEfficiency: null });
    expect(porCodes(r)).toEqual([["step-below-min-flow", "profile[0]"], ["step-below-min-flow", "profile[2]"]]);
    expect(r.warnings.find((w) => w.parameter === "profile[0]")!.message).toMatch(/ \(0 h a year: information only\)$/);
    expect(r.warnings.find((w) => w.parameter === "profile[2]")!.message).not.toMatch(/information only/);
    expect(r.complete).toBe(true);
    expect(r.steps[2].status).toBe("ok");
  });
});

describe("under a drive the BEP flow scales with speed (Q_BEP × n)", () => {
  it("on a friction-only system through the BEP, 25 % flow stays at the BEP (no note); throttled at fixed speed it is 25 %", () => {
    const friction = (q: number) => 28 * (q / QB) ** 2; // through the BEP, 50 m³/h at 28 m: the affinity parabola
    expect(porCodes(run("system-curve", 0.25, friction))).toEqual([]);
    expect(porCodes(run("fixed-speed", 0.25, friction))).toEqual([["step-below-min-flow", "profile[0]"]]);
  });
  it.each([[0.7, "step-outside-por"], [1.2, "step-outside-por"], [0.5, "step-below-min-flow"]] as const)("system curve with 15 m static head: the flip at %s of BEP flow (hand-solved speed)", (ratio, outside) => {
    const { f, n } = vfdFlip(ratio);
    const at = run("system-curve", f);
    expect(at.steps[0].speedRatio).toBeCloseTo(n, 6); // the engine's speed is the hand-solved one
    const [inner, outer] = ratio === 1.2 ? [f * (1 - 1e-4), f * (1 + 1e-4)] : [f * (1 + 1e-4), f * (1 - 1e-4)];
    const innerCodes = porCodes(run("system-curve", inner)).map((x) => x[0]);
    expect(innerCodes).not.toContain(outside);
    expect(porCodes(run("system-curve", outer)).map((x) => x[0])).toEqual([outside]);
  });
  it("the note names the speed and the BEP flow at it", () => {
    const { f, n } = vfdFlip(0.6);
    expect(note(run("system-curve", f))).toContain(`60 % of its BEP flow at ${(n * 100).toFixed(1)} % speed, ${(50 * n).toFixed(1)} m³/h (50.0 m³/h at the curve's speed × ${(n * 100).toFixed(1)} %, affinity laws)`);
  });
});

describe("pumps in parallel staged by demand: each running pump's share", () => {
  const QD = 2 * QB; // two pumps at their BEP
  const pair = (q: number) => HS + (K / 4) * (q / M3H) ** 2; // 20 m at 100 m³/h (hand: 15 + 0.0005 · 100²)
  const staged = (mode: ControlMode, f: number) =>
    stagedDutyCycleEnergy({ pumpCurve: curve, dutyPumps: 2, systemHead: pair, designFlow: QD, mode, profile: [{ flowFraction: f, hours: 3000 }], density: 1000, motor: MOTOR, driveEfficiency: mode === "fixed-speed" ? null : 0.97 });
  it.each([
    [0.351, 1, null], [0.349, 1, "step-outside-por"], // one pump alone at 35 m³/h: 70 % of its BEP flow
    [0.251, 1, "step-outside-por"], [0.249, 1, "step-below-min-flow"], // 25 m³/h: 50 %
    [0.599, 1, null], [0.601, 1, "step-outside-por"], // one alone at 60 m³/h: 120 %
    [1.199, 2, null], [1.201, 2, "step-outside-por"], // both at 60 m³/h each: 120 %
  ])("fixed speed, a step at %s of the design flow runs %s of 2: %s", (f, k, code) => {
    const r = staged("fixed-speed", f);
    expect(r.steps[0]).toMatchObject({ status: "ok", pumpsRunning: k });
    expect(porCodes(r)).toEqual(code ? [[code, "profile[0]"]] : []);
  });
  it("the note names each pump's share", () => {
    expect(note(staged("fixed-speed", 1.201))).toMatch(/^at 120 % flow each of the 2 pumps running takes its share, 60\.1 m³\/h of the step's 120 m³\/h, 120\.1 % of its BEP flow, 50\.0 m³\/h, for 3000 h a year: right of \(above\)/);
    expect(note(staged("fixed-speed", 0.2))).toMatch(/^at 20 % flow the one pump running takes the step's whole 20\.0 m³\/h, 40 % of its BEP flow, 50\.0 m³\/h, for 3000 h a year: below 50 % of BEP flow/);
  });
  it.each([[0.7, 1, null, "step-outside-por"], [1.2, 2, null, "step-outside-por"], [0.5, 1, "step-outside-por", "step-below-min-flow"]] as const)("system curve: the flip at %s of one pump's BEP flow with %s running (hand-solved speed)", (ratio, k, inner, outer) => {
    const { f } = vfdFlip(ratio, k, K / 4, QD);
    const fIn = ratio === 1.2 ? f * (1 - 1e-4) : f * (1 + 1e-4), fOut = ratio === 1.2 ? f * (1 + 1e-4) : f * (1 - 1e-4);
    expect(staged("system-curve", fIn).steps[0].pumpsRunning).toBe(k);
    expect(porCodes(staged("system-curve", fIn))).toEqual(inner ? [[inner, "profile[0]"]] : []);
    expect(staged("system-curve", fOut).steps[0].pumpsRunning).toBe(k);
    expect(porCodes(staged("system-curve", fOut))).toEqual([[outer, "profile[0]"]]);
  });
});

describe("a curve with no BEP (bep-not-published): no note at any step, nothing thrown", () => {
  // The sample curve cut at 50 m³/h: its efficiency still rising at the curve's end, so no BEP (pumpCurve.ts).
  const rising = createPumpCurve({ points: samplePoints({ npshr: false }).slice(0, 6) });
  it("the curve says why; the cycle and the staged cycle at 25 % and 100 % say nothing of the BEP", () => {
    expect(rising.bep).toBeNull();
    expect(rising.warnings.map((w) => w.code)).toContain("bep-not-published");
    const profile = [{ flowFraction: 0.25, hours: 3000 }, { flowFraction: 1, hours: 1000 }];
    const common = { systemHead: (q: number) => HS + 0.004 * (q / M3H) ** 2, designFlow: 40 * M3H, profile, density: 1000, motor: MOTOR };
    for (const mode of ["fixed-speed", "system-curve"] as const) {
      const r = dutyCycleEnergy({ ...common, curve: rising, mode, driveEfficiency: mode === "fixed-speed" ? null : 0.97 });
      expect(r.steps.map((s) => s.status)).toEqual(["ok", "ok"]);
      expect(porCodes(r)).toEqual([]);
      const st = stagedDutyCycleEnergy({ ...common, pumpCurve: rising, dutyPumps: 2, mode, driveEfficiency: mode === "fixed-speed" ? null : 0.97 });
      expect(porCodes(st)).toEqual([]);
    }
  });
});
