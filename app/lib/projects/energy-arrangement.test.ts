// Pumps in parallel: the duty cycle's flows, heads and powers are the duty pumps' together, and each motor is one pump's
// (the cycle's basis line), so a step that overloads says so of each motor with one pump's shaft power beside its own
// rating (it said "the motor … 4.03 kW exceeds 3.00 kW" for two 1.5 kW motors). Check values: the typed 1.5 kW motor; equal
// pumps in parallel share the flow and power equally (common practice). The curve is invented (the energy fixture's pump).
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
const ROWS = [[0, 22, null], [5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]] as const;
const SET = { points: ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 };

describe("two pumps in parallel with 1.5 kW motors, a step above their rating", () => {
  it("said of each motor: one pump's shaft power (half the pair's) beside its 1.50 kW", () => {
    const base = defaultSystemInput();
    const input: SystemInput = { ...base, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 0.9, hours: 100 }] } };
    const adj = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel" as const, dutyPumps: 2, motorRating: 1500 };
    const result = evaluateCandidate(input, SET, adj);
    const cycle = candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: adj, result }, null).cycle!;
    const w = cycle.warnings.filter((x) => x.code === "motor-overload-step");
    expect(w).toHaveLength(1);
    const m = /^at 90 % flow each of the 2 motors runs at \d+ % load, above its rating × service factor 100 %: one pump's shaft power ([\d.]+) kW exceeds 1\.50 kW, so each motor overloads at this step/.exec(inSI(w[0].message));
    expect(m, inSI(w[0].message)).not.toBeNull();
    expect(Number(m![1])).toBeCloseTo(cycle.steps[0].shaftPower! / 2 / 1000, 2); // the step's shaft power is the pair's
  });
});
