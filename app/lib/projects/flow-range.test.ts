// Flow ranges of charts and reports (pure). Check values: the product's rule (a chart or report fits
// its own pump(s), 5 % past the curve's end, at least 1.6 × the duty flow) and the affinity law Q ∝ N
// (common practice).
import { describe, expect, test } from "vitest";
import { candidateFlowEnd, candidatesFlowMax, DEFAULT_ADJUSTMENT, defaultSystemInput, resultFlowMax, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
const set = (endM3h: number) => ({ points: [{ flow: 0 }, { flow: (endM3h / 2) * M3H }, { flow: endM3h * M3H }] });
const input: SystemInput = { ...defaultSystemInput(), flowMax: 0, duty: { flow: 100 * M3H, head: 19 } };

describe("flow range of the workbench: each candidate with its own arrangement", () => {
  test("a 170 m³/h pump and a 40 m³/h pump × 4 in parallel: 170 m³/h, not 170 × 4 = 680", () => {
    const big = { set: set(170), adjustment: DEFAULT_ADJUSTMENT };
    const small4 = { set: set(40), adjustment: { ...DEFAULT_ADJUSTMENT, arrangement: "parallel" as const, dutyPumps: 4 } };
    expect(candidateFlowEnd(small4) / M3H).toBeCloseTo(160, 9);
    expect(candidatesFlowMax([big, small4]) / M3H).toBeCloseTo(170, 9);
    expect(candidatesFlowMax([]) ).toBe(0);
  });
  test("series does not widen the flow range; a speed above 100 % does (Q ∝ N)", () => {
    expect(candidateFlowEnd({ set: set(100), adjustment: { ...DEFAULT_ADJUSTMENT, arrangement: "series", dutyPumps: 3 } }) / M3H).toBeCloseTo(100, 9);
    expect(candidateFlowEnd({ set: set(100), adjustment: { ...DEFAULT_ADJUSTMENT, method: "speed", ratio: 1.1 } }) / M3H).toBeCloseTo(110, 9);
    expect(candidateFlowEnd({ set: set(100), adjustment: { ...DEFAULT_ADJUSTMENT, method: "trim", ratio: 0.9 } }) / M3H).toBeCloseTo(100, 9);
  });
});

describe("flow range of one selected candidate (report)", () => {
  test("its evaluated curve's end × 1.05, or 1.6 × the duty flow when larger", () => {
    const r = { curve: [{ flow: 0 }, { flow: 160 * M3H }], operating: { flow: 118 * M3H }, allIntersections: [] };
    expect(resultFlowMax(input, r) / M3H).toBeCloseTo(168, 9);
    const short = { curve: [{ flow: 0 }, { flow: 90 * M3H }], operating: null };
    expect(resultFlowMax(input, short) / M3H).toBeCloseTo(160, 9); // 1.6 × 100 m³/h duty
    expect(resultFlowMax(input, null) / M3H).toBeCloseTo(160, 9);
  });
  test("a flow range typed by the user wins", () => {
    expect(resultFlowMax({ ...input, flowMax: 0.1 }, { curve: [{ flow: 0.5 }], operating: null })).toBe(0.1);
  });
});
