// A drooping curve on a drive (stepDroop.ts): a step left of the curve's peak as slowed to the step's speed n (q < n · Q_peak)
// gets `step-rising-branch` (the pump may hunt between two flows of one head); a step whose slowed shut-off head n² · H0
// is below the system's head at zero flow gets `step-no-start` (started against its closed check valve it could not open
// it). Both rules common practice, at fixed speed (throttled) too. Each flips 1e-6 relative either side of its threshold; a curve that is not drooping
// gets neither. Check values: an invented drooping curve (not any maker's): 40 m at shut-off, peak 46 m at 36 m³/h,
// 20 m at 120 m³/h; invented systems H = S + k · Q² with H = 36 m at the design flow 80 m³/h.
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, type ControlMode, type DutyCycleResult, type PumpPoint } from "./index.ts";
import { STEP_NO_START, STEP_RISING_BRANCH } from "./stepDroop.ts";
import { inSI } from "./quantityText.ts";
import { M3H } from "./test/curves.ts";

const pts = (rows: [number, number, number][]): PumpPoint[] => rows.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e }));
// [m³/h, m, efficiency] — invented.
const droop = createPumpCurve({ points: pts([[0, 40, 0], [18, 44, 0.45], [36, 46, 0.62], [60, 42, 0.72], [90, 33, 0.74], [120, 20, 0.65]]) });
const QD = 80 * M3H;
const H_SET = 36; // the system's head at the design flow, m (so every constant-pressure step asks 36 m whatever S)
const QP = 36 * M3H; // the peak's flow at full speed
const run = (mode: ControlMode, S: number, fractions: number[], curve = droop): DutyCycleResult =>
  dutyCycleEnergy({ curve, systemHead: (q) => S + ((H_SET - S) * q * q) / (QD * QD), designFlow: QD, mode, profile: fractions.map((f) => ({ flowFraction: f, hours: 1000 })),
    density: 1000, motor: { rating: 15000, efficiency: 0.9 }, driveEfficiency: mode === "fixed-speed" ? null : 0.97 });
const droopCodes = (r: DutyCycleResult) => r.warnings.filter((w) => w.code === STEP_RISING_BRANCH || w.code === STEP_NO_START).map((w) => [w.code, w.parameter]);

describe("the rising branch: the step's flow against the slowed peak's flow n · Q_peak", () => {
  // Constant pressure at 36 m: a step at the slowed peak runs at n0 = √(36/46) (H ∝ N², the peak's 46 m), flow n0 · 36 m³/h.
  const n0 = Math.sqrt(H_SET / 46);
  const fAtPeak = (n0 * QP) / QD;
  it.each([
    ["1e-6 relative left of the peak", 1 - 1e-6, [[STEP_RISING_BRANCH, "profile[0]"]]],
    ["1e-6 relative right of it", 1 + 1e-6, []],
  ])("%s", (_, by, codes) => {
    const r = run("constant-pressure", 10, [fAtPeak * by]); // static 10 m: n0² · 40 m = 31.3 m, well above it
    expect(r.steps[0].status).toBe("ok"); // a note, never a failure of the step
    expect(r.steps[0].speedRatio).toBeCloseTo(n0, 6);
    expect(droopCodes(r)).toEqual(codes);
  });

  it("the note names the step, its speed, its flow, the slowed peak's flow and the rule", () => {
    const r = run("constant-pressure", 10, [0.25]); // 20 m³/h at 89.7 % speed: left of 0.897 × 36 = 32.3 m³/h
    expect(inSI(r.warnings.find((w) => w.code === STEP_RISING_BRANCH)!.message)).toBe(
      "at 25 % flow the pump runs at 89.7 % speed, 20.0 m³/h: left of the drooping curve's peak at this speed, 37.0 m at 32.3 m³/h (46.0 m at 36.0 m³/h at full speed), on the rising branch, where the pump gives one head at two flows and may hunt between them (common practice: run a drooping curve right of its peak)",
    );
  });
});

describe("starting from rest: the slowed shut-off head n² · H0 against the system's head at zero flow", () => {
  // At 60 % flow (48 m³/h) on constant pressure the speed does not depend on S (the step asks 36 m): right of the peak.
  const n = run("constant-pressure", 10, [0.6]).steps[0].speedRatio!;
  const h0 = n * n * 40;
  it.each([
    ["the static head 1e-6 relative above n² · H0", 1 + 1e-6, [[STEP_NO_START, "profile[0]"]]],
    ["1e-6 relative below it", 1 - 1e-6, []],
  ])("%s", (_, by, codes) => {
    const r = run("constant-pressure", h0 * by, [0.6]);
    expect(r.steps[0].status).toBe("ok");
    expect(r.steps[0].speedRatio).toBeCloseTo(n, 12);
    expect(droopCodes(r)).toEqual(codes);
  });

  it("the note names n² · H0, the system's head at zero flow and the rule", () => {
    const r = run("system-curve", 30, [0.125, 0.6]);
    expect(droopCodes(r)).toEqual([[STEP_RISING_BRANCH, "profile[0]"], [STEP_NO_START, "profile[0]"], [STEP_NO_START, "profile[1]"]]);
    const text = "at 60 % flow the pump runs at 86.4 % speed, where its shut-off head 40.0 m slows to 29.9 m (× 86.4 % squared, affinity laws), below the system's head at zero flow, 30.0 m (static head and pressure difference): started from rest at this speed against its closed check valve it could not open it (common practice: a pump starts against its closed check valve; set the drive's lowest speed so that its shut-off head there exceeds the system's head at zero flow)";
    expect(inSI(r.warnings.find((w) => w.code === STEP_NO_START && w.parameter === "profile[1]")!.message)).toBe(text);
  });
});

describe("a curve that is not drooping gets neither note", () => {
  // Invented: level at 40 m from shut-off to 18 m³/h, then falling (its head never above its first: pumpCurve.ts `drooping` false).
  const level = createPumpCurve({ points: pts([[0, 40, 0], [18, 40, 0.45], [36, 39, 0.62], [60, 36, 0.72], [90, 29, 0.74], [120, 20, 0.65]]) });
  it("the same steps as on the drooping curve, on a drive: no note", () => {
    expect(level.drooping).toBe(false);
    for (const [mode, S, fractions] of [["system-curve", 30, [0.125, 0.6]], ["constant-pressure", 10, [0.25, 0.6]]] as const) {
      const r = run(mode, S, [...fractions], level);
      expect(r.steps.map((s) => s.status)).toEqual(["ok", "ok"]);
      expect(droopCodes(r)).toEqual([]);
    }
  });
  it("nor at fixed speed", () => {
    expect(droopCodes(run("fixed-speed", 10, [0.25, 0.6], level))).toEqual([]);
  });
});

describe("at fixed speed, throttled: the same notes on the curve as run", () => {
  // Throttled on the system, the pump runs on its own curve at the step's flow: left of the peak's 36 m³/h it is on
  // the rising branch as on a drive. Before, only a drive's steps were judged (20 m³/h at fixed speed: no note).
  it.each([
    ["1e-6 relative left of the peak's flow", 1 - 1e-6, [[STEP_RISING_BRANCH, "profile[0]"]]],
    ["1e-6 relative right of it", 1 + 1e-6, []],
  ])("%s", (_, by, codes) => {
    const r = run("fixed-speed", 10, [(QP / QD) * by]);
    expect(r.steps[0].status).toBe("ok");
    expect(droopCodes(r)).toEqual(codes);
  });

  it("the note names the step, its flow, the peak and the rule", () => {
    const r = run("fixed-speed", 10, [0.25, 0.6]); // 20 m³/h left of 36 m³/h; 48 m³/h right of it
    expect(droopCodes(r)).toEqual([[STEP_RISING_BRANCH, "profile[0]"]]);
    expect(inSI(r.warnings.find((w) => w.code === STEP_RISING_BRANCH)!.message)).toBe(
      "at 25 % flow the pump runs at fixed speed, throttled, 20.0 m³/h: left of the drooping curve's peak, 46.0 m at 36.0 m³/h, on the rising branch, where the pump gives one head at two flows and may hunt between them (common practice: run a drooping curve right of its peak)",
    );
  });

  it("a shut-off head below the system's head at zero flow: step-no-start, flipping 1e-6 relative either side of 40 m", () => {
    // static 40 m × (1 ± 1e-6): the step at 60 % (48 m³/h) still met (the pump's 43.3 m or so above the system's 40 m + losses)
    for (const [by, codes] of [[1 + 1e-6, [[STEP_NO_START, "profile[0]"]]], [1 - 1e-6, []]] as const) {
      const r = dutyCycleEnergy({ curve: droop, systemHead: (q) => 40 * by + (q * q) / (QD * QD), designFlow: QD, mode: "fixed-speed", profile: [{ flowFraction: 0.6, hours: 1000 }],
        density: 1000, motor: { rating: 15000, efficiency: 0.9 }, driveEfficiency: null });
      expect(r.steps[0].status).toBe("ok");
      expect(droopCodes(r)).toEqual(codes);
    }
    const r = dutyCycleEnergy({ curve: droop, systemHead: (q) => 40.5 + (q * q) / (QD * QD), designFlow: QD, mode: "fixed-speed", profile: [{ flowFraction: 0.6, hours: 1000 }],
      density: 1000, motor: { rating: 15000, efficiency: 0.9 }, driveEfficiency: null });
    expect(inSI(r.warnings.find((w) => w.code === STEP_NO_START)!.message)).toBe(
      "at 60 % flow the pump runs at fixed speed, throttled, where its shut-off head 40.0 m is below the system's head at zero flow, 40.5 m (static head and pressure difference): started from rest at this speed against its closed check valve it could not open it (common practice: a pump starts against its closed check valve)",
    );
  });
});
