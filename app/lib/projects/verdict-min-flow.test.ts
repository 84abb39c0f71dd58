// The maker's minimum continuous flow against a candidate's duty (verdict-min-flow.ts): the duty each running pump takes
// (duty ÷ duty pumps in parallel) below the figure — × the speed or trim ratio the pump runs at, affinity laws — qualifies
// the verdict's line, with both numbers; exactly at it, and 1e-6 relative above it, it does not. Through evaluateCandidate
// (the service's pure core) and the duty cycle (candidateEnergy: the step's note). Check values: construction (the
// figures are set from the duty itself); the curve is invented (the staged-NPSH fixture's pump) and the figures made up.
import { describe, expect, it } from "vitest";
import { STEP_BELOW_MAKER_MIN_FLOW } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";
import { minFlowCheck, verdictMinFlowNote, verdictMinFlowShort } from "./verdict-min-flow";

const M3H = 1 / 3600;
const ROWS = [[0, 22, null], [5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]] as const;
const POINTS = ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null }));
const set = (minFlow: number | null) => ({ points: POINTS, speed: 2900, impellerDiameter: 0.2, minFlow });
const input = (duty: number): SystemInput => ({ ...defaultSystemInput(), duty: { flow: duty, head: 14 } });
const PAIR: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
const noteOf = (duty: number, minFlow: number | null, adj: Adjustment = DEFAULT_ADJUSTMENT) => {
  const r = evaluateCandidate(input(duty), set(minFlow), adj);
  expect(r.verdict).toBeTruthy(); // control: a verdict to qualify
  return { r, note: verdictMinFlowNote(r.verdict, r.minFlow) };
};

describe("one pump as published: the duty against the figure", () => {
  const duty = 20 * M3H;
  it.each([
    ["exactly at it", duty, false],
    ["1e-6 relative above the duty", duty * (1 + 1e-6), true],
    ["1e-6 relative below the duty", duty * (1 - 1e-6), false],
  ])("the figure %s", (_, minFlow, below) => {
    const { r, note } = noteOf(duty, minFlow);
    expect(r.minFlow?.below).toBe(below);
    expect(note !== null).toBe(below);
  });
  it("the words: both flows, in the reader's units (SI here), after the verdict's own", () => {
    const { r, note } = noteOf(8 * M3H, 12 * M3H);
    expect(inSI(note!)).toBe(`${r.verdict!.status === "meets" ? "but" : "and"} runs below the maker's minimum flow: 8.00 m³/h < 12.0 m³/h`); // flows below 10 m³/h to 3 significant figures (shared/units.ts)
    expect(verdictMinFlowShort(r.verdict, r.minFlow)).toMatch(/^, (but|and) runs below the maker's minimum flow$/);
    expect(verdictMinFlowNote({ status: "meets" }, r.minFlow)!.startsWith("but ")).toBe(true); // "but" after meets (verdict-npsh.ts againstWord)
  });
  it("no figure recorded, or no duty: nothing on the line, and the check says so", () => {
    expect(noteOf(8 * M3H, null).r.minFlow).toBeNull();
    expect(noteOf(8 * M3H, null).note).toBeNull();
    expect(minFlowCheck(12 * M3H, null, DEFAULT_ADJUSTMENT, 1)?.below).toBe(false); // source: definition (no duty, nothing judged)
  });
});

describe("pumps in parallel: each running pump's share (standby pumps never run)", () => {
  const duty = 40 * M3H; // 20 m³/h each of the 2 duty pumps
  it.each([
    ["exactly at the share", duty / 2, false],
    ["1e-6 relative above it", (duty / 2) * (1 + 1e-6), true],
    ["1e-6 relative below it", (duty / 2) * (1 - 1e-6), false],
  ])("the figure %s", (_, minFlow, below) => {
    const { r } = noteOf(duty, minFlow, PAIR);
    expect(r.minFlow).toMatchObject({ running: 2, below });
    expect(r.minFlow!.dutyPerPump).toBe(duty / 2);
  });
  it("the words name the share", () => {
    expect(inSI(noteOf(40 * M3H, 25 * M3H, PAIR).note!)).toMatch(/runs below the maker's minimum flow: 20\.0 m³\/h < 25\.0 m³\/h \(each of the 2 duty pumps in parallel takes the duty's 40\.0 m³\/h ÷ 2\)$/);
  });
});

describe("a pump set to a speed or trimmed: the figure × the ratio (affinity laws)", () => {
  const SPEED: Adjustment = { ...DEFAULT_ADJUSTMENT, method: "speed", ratio: 0.9 };
  const duty = 18 * M3H;
  it.each([
    ["exactly at it", 1, false],
    ["1e-6 relative above", 1 + 1e-6, true],
    ["1e-6 relative below", 1 - 1e-6, false],
  ])("the figure × the speed ratio 0.9 %s the duty", (_, k, below) => {
    const { r } = noteOf(duty, (duty / 0.9) * k, SPEED);
    expect(r.ratio).toBe(0.9); // control: the speed as typed (2610 rpm, a whole rpm)
    expect(r.minFlow?.below).toBe(below);
  });
  it("the words name the figure as run and as published", () => {
    const { note } = noteOf(duty, 30 * M3H, SPEED);
    expect(inSI(note!)).toMatch(/runs below the maker's minimum flow: 18\.0 m³\/h < 27\.0 m³\/h \(30\.0 m³\/h at the curve's speed × 90\.0 % speed, affinity laws Q ∝ N\)$/);
    const trim = noteOf(duty, 30 * M3H, { ...DEFAULT_ADJUSTMENT, method: "trim", ratio: 0.95 });
    expect(inSI(trim.note!)).toMatch(/18\.0 m³\/h < 28\.5 m³\/h \(30\.0 m³\/h on the published impeller × 95\.0 % trim, affinity laws Q ∝ D\)$/);
  });
});

describe("the duty cycle carries the figure to its steps", () => {
  const energyOf = (adj: Adjustment, minFlow: number | null, control: "fixed-speed" | "system-curve" = "fixed-speed") => {
    const inp: SystemInput = { ...input(30 * M3H), energy: { ...defaultSystemInput().energy!, control, profile: [{ flowFraction: 1, hours: 2000 }, { flowFraction: 0.3, hours: 3000 }] } };
    const result = evaluateCandidate(inp, set(minFlow), { ...adj, motorRating: 3000 });
    return candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: adj, result }, null).cycle!;
  };
  it("a 30 % step (9 m³/h) below a 10 m³/h figure: the maker's note at the step, naming both; none below 8 m³/h", () => {
    const below = energyOf(DEFAULT_ADJUSTMENT, 10 * M3H);
    const w = below.warnings.find((x) => x.code === STEP_BELOW_MAKER_MIN_FLOW);
    expect(w?.parameter).toBe("profile[1]");
    expect(inSI(w!.message)).toMatch(/^at 30 % flow the pump runs at 9\.00 m³\/h, for 3000 h a year: below the maker's minimum continuous flow, 10\.0 m³\/h/);
    expect(energyOf(DEFAULT_ADJUSTMENT, 8 * M3H).warnings.some((x) => x.code === STEP_BELOW_MAKER_MIN_FLOW)).toBe(false);
  });
  it("without a figure the 50 % note says none is recorded", () => {
    const none = energyOf(DEFAULT_ADJUSTMENT, null).warnings.find((x) => x.code === "step-below-min-flow");
    expect(none?.message).toContain("no maker's minimum flow is recorded for this curve");
  });
  it("a candidate set to 90 % speed at fixed speed: the figure as run (× 0.9); under a drive: at the curve's speed, × the step's", () => {
    const SPEED: Adjustment = { ...DEFAULT_ADJUSTMENT, method: "speed", ratio: 0.9 };
    // 9 m³/h at the step against 10 × 0.9 = 9.0 m³/h as run: at it, no maker's note; 10.1 × 0.9 = 9.09: below.
    expect(energyOf(SPEED, 10 * M3H).warnings.some((x) => x.code === STEP_BELOW_MAKER_MIN_FLOW)).toBe(false);
    expect(energyOf(SPEED, 10.1 * M3H).warnings.some((x) => x.code === STEP_BELOW_MAKER_MIN_FLOW)).toBe(true);
    const drive = energyOf(SPEED, 30 * M3H, "system-curve");
    const n = drive.steps[1].speedRatio!;
    expect(inSI(drive.warnings.find((x) => x.code === STEP_BELOW_MAKER_MIN_FLOW)!.message)).toContain(`(30.0 m³/h at the curve's speed × ${(n * 100).toFixed(1)} %, affinity laws`);
  });
});
