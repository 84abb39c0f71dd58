// Duty-cycle steps below the maker's minimum continuous flow (stepPor.ts `step-below-maker-min-flow`): a note at the step,
// stronger than the 50 % BEP note, naming the step's flow (one pump's) and the maker's figure; at a drive's speed the figure
// scales as the BEP flow does (Q ∝ N, affinity laws: common practice, from memory). Flips exactly at the figure and 1e-6
// relative either side. Without a figure the 50 % note says none is recorded; above it, that the step is at or above it.
// Check values: the made-up sample curve (engine/test/curves.ts, BEP 50 m³/h at 78 %), an invented system
// H = 15 m + 0.002 m/(m³/h)² · Q², and made-up maker's figures (no maker's data).
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, EngineInputError, NEVER_RUN_NOTE, stagedDutyCycleEnergy, STEP_BELOW_MAKER_MIN_FLOW, type ControlMode, type DutyCycleResult } from "./index.ts";
import { inSI } from "./quantityText.ts";
import { M3H, samplePoints } from "./test/curves.ts";

const curve = createPumpCurve({ points: samplePoints({ npshr: false }) });
const QB = 50 * M3H; // the sample curve's BEP flow
const system = (q: number) => 15 + 0.002 * (q / M3H) ** 2;
const MOTOR = { rating: 7500, efficiency: 0.9 };
const run = (mode: ControlMode, f: number, makerMinFlow: number | null | undefined, c = curve): DutyCycleResult =>
  dutyCycleEnergy({ curve: c, systemHead: system, designFlow: QB, mode, profile: [{ flowFraction: f, hours: 3000 }], density: 1000, motor: MOTOR, driveEfficiency: mode === "fixed-speed" ? null : 0.97, makerMinFlow });
const codes = (r: DutyCycleResult) => r.warnings.filter((w) => w.code.startsWith("step-")).map((w) => w.code);
const note = (r: DutyCycleResult, code: string) => inSI(r.warnings.find((w) => w.code === code)?.message ?? "");

describe("fixed speed, one pump: the step's flow against the maker's figure as given", () => {
  // At 40 % flow the pump runs at 20 m³/h (40 % of its BEP flow: below 50 %, the common bound, whatever the maker says).
  const q = QB * 0.4; // the step's flow exactly as the engine computes it (design flow × fraction)
  it.each([
    ["exactly at it", q, "step-below-min-flow"],
    ["1e-6 relative above the step's flow", q * (1 + 1e-6), STEP_BELOW_MAKER_MIN_FLOW],
    ["1e-6 relative below it", q * (1 - 1e-6), "step-below-min-flow"],
  ])("the maker's figure %s: %s", (_, maker, code) => {
    const r = run("fixed-speed", 0.4, maker);
    expect(r.steps[0].status).toBe("ok"); // a note, never a failure of the step
    expect(codes(r)).toEqual([code]); // one note at the step: the maker's replaces the BEP's
  });

  it("the note names both figures, the rule and what to do", () => {
    expect(note(run("fixed-speed", 0.4, 25 * M3H), STEP_BELOW_MAKER_MIN_FLOW)).toBe(
      "at 40 % flow the pump runs at 20.0 m³/h, for 3000 h a year: below the maker's minimum continuous flow, 25.0 m³/h — the maker does not allow continuous running below its minimum continuous flow; expect recirculation in the impeller, heating of the liquid, vibration and bearing and seal damage — pumps staged, a smaller pump for these hours or a minimum-flow bypass (a note at the step; the verdict judges the duty against the same figure)",
    );
  });

  it("above the maker's figure the 50 % note says so; with none recorded it says that", () => {
    expect(note(run("fixed-speed", 0.4, 15 * M3H), "step-below-min-flow")).toContain("(common practice, from memory), though at or above the maker's minimum continuous flow, 15.0 m³/h, and outside");
    for (const none of [null, undefined]) expect(note(run("fixed-speed", 0.4, none), "step-below-min-flow")).toContain("no maker's minimum flow is recorded for this curve (check the maker's data sheet)");
    // The record the printed report reads: the figure at the step's speed, or null (source: stepPor.ts StepPorWarning).
    expect((run("fixed-speed", 0.4, 15 * M3H).warnings[0] as { makerMinFlow?: number }).makerMinFlow).toBeCloseTo(15 * M3H, 15);
    expect((run("fixed-speed", 0.4, null).warnings[0] as { makerMinFlow?: number | null }).makerMinFlow).toBeNull();
  });

  it("inside the POR a step below the maker's figure still gets the note; at 0 h it is marked information only; 0 % flow says nothing", () => {
    expect(codes(run("fixed-speed", 0.8, 45 * M3H))).toEqual([STEP_BELOW_MAKER_MIN_FLOW]); // 40 m³/h: 80 % of BEP, below 45
    expect(codes(run("fixed-speed", 0.8, 35 * M3H))).toEqual([]); // inside the POR, above the figure
    const r = dutyCycleEnergy({ curve, systemHead: system, designFlow: QB, mode: "fixed-speed", profile: [{ flowFraction: 0.2, hours: 0 }, { flowFraction: 0, hours: 100 }], density: 1000, motor: MOTOR, driveEfficiency: null, makerMinFlow: 30 * M3H });
    // A 0 h step keeps its note, marked as every note at such a step is (cycleTotals.ts markNeverRun).
    expect(r.warnings.filter((w) => w.code.startsWith("step-")).map((w) => [w.code, w.parameter, w.message.endsWith(NEVER_RUN_NOTE)])).toEqual([[STEP_BELOW_MAKER_MIN_FLOW, "profile[0]", true]]);
  });

  it("a curve with no BEP: the maker's figure is judged all the same", () => {
    const rising = createPumpCurve({ points: samplePoints({ npshr: false }).slice(0, 6) }); // efficiency still rising at its end
    expect(rising.bep).toBeNull();
    expect(codes(run("fixed-speed", 0.4, 25 * M3H, rising))).toEqual([STEP_BELOW_MAKER_MIN_FLOW]);
    expect(codes(run("fixed-speed", 0.4, 15 * M3H, rising))).toEqual([]);
  });

  it("refuses a figure that is no flow", () => {
    for (const bad of [0, -1, Number.NaN, Number.POSITIVE_INFINITY]) expect(() => run("fixed-speed", 0.4, bad)).toThrow(EngineInputError);
  });
});

describe("under a drive the figure scales with the step's speed (Q ∝ N)", () => {
  const base = run("system-curve", 0.4, null).steps[0]; // the step's flow and speed with no figure
  const n = base.speedRatio!;
  it.each([
    ["exactly at it", 1, false],
    ["1e-6 relative above", 1 + 1e-6, true],
    ["1e-6 relative below", 1 - 1e-6, false],
  ])("the figure × speed %s the step's flow", (_, k, below) => {
    const r = run("system-curve", 0.4, (base.flow / n) * k);
    expect(r.steps[0].speedRatio).toBe(n); // the figure changes no step's speed
    expect(codes(r).includes(STEP_BELOW_MAKER_MIN_FLOW)).toBe(below);
  });
  it("the note names the speed, the figure at it and at the curve's speed", () => {
    const said = note(run("system-curve", 0.4, 30 * M3H), STEP_BELOW_MAKER_MIN_FLOW);
    expect(n).toBeLessThan(1);
    expect(said).toContain(`below the maker's minimum continuous flow, ${(30 * n).toFixed(1)} m³/h at ${(n * 100).toFixed(1)} % speed (30.0 m³/h at the curve's speed × ${(n * 100).toFixed(1)} %, affinity laws`);
  });
});

describe("pumps in parallel staged by demand: each running pump's share against one pump's figure", () => {
  const pair = (q: number) => 15 + 0.0005 * (q / M3H) ** 2;
  const staged = (f: number, maker: number) =>
    stagedDutyCycleEnergy({ pumpCurve: curve, dutyPumps: 2, systemHead: pair, designFlow: 2 * QB, mode: "fixed-speed", profile: [{ flowFraction: f, hours: 3000 }], density: 1000, motor: MOTOR, driveEfficiency: null, makerMinFlow: maker });
  it("one pump alone at 0.2 × 100 m³/h: its whole 20 m³/h against the figure, flipping either side of it", () => {
    const q = 2 * QB * 0.2;
    expect(staged(0.2, q).steps[0].pumpsRunning).toBe(1);
    expect(codes(staged(0.2, q))).toEqual(["step-below-min-flow"]);
    expect(codes(staged(0.2, q * (1 + 1e-6)))).toEqual([STEP_BELOW_MAKER_MIN_FLOW]);
    expect(codes(staged(0.2, q * (1 - 1e-6)))).toEqual(["step-below-min-flow"]);
  });
  it("both running at 1.2 × 100 m³/h: each one's 60 m³/h share is judged, not the 120 m³/h together", () => {
    const r = staged(1.2, 61 * M3H);
    expect(r.steps[0].pumpsRunning).toBe(2);
    expect(note(r, STEP_BELOW_MAKER_MIN_FLOW)).toMatch(/^at 120 % flow each of the 2 pumps running takes its share, 60\.0 m³\/h of the step's 120 m³\/h, for 3000 h a year: below the maker's minimum continuous flow, 61\.0 m³\/h/);
    expect(codes(staged(1.2, 59 * M3H))).not.toContain(STEP_BELOW_MAKER_MIN_FLOW);
  });
});
