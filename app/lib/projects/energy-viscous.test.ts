// A duty cycle under a drive on a viscous liquid: the curve as corrected per ANSI/HI 9.6.7 at the candidate's speed is
// taken to each step's speed by the affinity laws; B is not worked out again at each speed. B grows as the speed falls:
// B ∝ H^0.0625 / (Q^0.375 · N^0.25) (ANSI/HI 9.6.7, from memory) with H ∝ N², Q ∝ N (affinity laws) gives B ∝ N^−0.5, so
// the slowest step's B is B × (1 / N)^0.5 — said with its numbers among the cycle's assumptions (it was not said). None on
// water, nor at fixed speed (no step below the candidate's speed). Invented pump (the energy fixture's).
import { describe, expect, it } from "vitest";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
const ROWS = [[0, 22, null], [5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]] as const;
const SET = { points: ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 };
const OIL = { kind: "custom" as const, name: "oil", density: 900, dynamicViscosity: 0.1, vaporPressure: 100 }; // 111 cSt (invented)

function energyOn(fluid: SystemInput["fluid"] | null, control: "system-curve" | "fixed-speed") {
  const base = defaultSystemInput();
  const input: SystemInput = { ...base, ...(fluid ? { fluid } : {}), energy: { ...base.energy!, control } };
  const result = evaluateCandidate(input, SET, DEFAULT_ADJUSTMENT);
  return { result, e: candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: DEFAULT_ADJUSTMENT, result }, null) };
}
const viscousLines = (xs: string[]) => xs.filter((a) => /ANSI\/HI 9\.6\.7/.test(a));

describe("the cycle's assumptions on a viscous liquid under a drive", () => {
  it("the 111 cSt oil under system-curve control: B at the candidate's speed and at the slowest counted step's, by B ∝ N^−0.5", () => {
    const { result, e } = energyOn(OIL, "system-curve");
    expect(result.viscosity?.status).toBe("corrected");
    const slowest = Math.min(...e.cycle!.steps.filter((s) => s.status === "ok").map((s) => s.speedRatio!));
    expect(slowest).toBeLessThan(1);
    const bStep = result.viscosityB! * (1 / slowest) ** 0.5;
    const lines = viscousLines(e.assumptions);
    expect(lines).toEqual([
      `On oil, the curve as corrected for viscosity (ANSI/HI 9.6.7) at the candidate's speed, B = ${result.viscosityB!.toFixed(2)}, is taken to each step's speed by the affinity laws; B is not worked out again at each speed: it grows as the speed falls (B ∝ N^−0.5 along the affinity parabola), to ${bStep.toFixed(2)} at the slowest step's ${(slowest * 100).toFixed(1)} % speed, where the correction, and the energy, may be larger than shown.`,
    ]);
  });
  it("none on water, none at fixed speed on the oil", () => {
    expect(viscousLines(energyOn(null, "system-curve").e.assumptions)).toEqual([]);
    expect(viscousLines(energyOn(OIL, "fixed-speed").e.assumptions)).toEqual([]);
  });
  it("flips where the slowest step's B crosses 1 on a liquid whose B at the candidate's speed is below 1 (B ∝ ν^0.5: 111 cSt × (0.95/7.31)² ≈ 1.9 cSt)", () => {
    const light = (cst: number) => energyOn({ ...OIL, name: "light oil", dynamicViscosity: cst * 1e-6 * 900 }, "system-curve");
    const near = light(1.9);
    expect(near.result.viscosity?.status).toBe("no-correction");
    expect(near.result.viscosityB!).toBeLessThan(1);
    const slowest = Math.min(...near.e.cycle!.steps.filter((s) => s.status === "ok").map((s) => s.speedRatio!));
    expect(near.result.viscosityB! / slowest ** 0.5).toBeGreaterThan(1);
    expect(viscousLines(near.e.assumptions)).toHaveLength(1);
    expect(viscousLines(near.e.assumptions)[0]).toMatch(/^On light oil, the water curve, which needs no viscosity correction \(ANSI\/HI 9\.6\.7, B ≤ 1\) at the candidate's speed, B = 0\.9\d, /);
    const far = light(1.2); // B ≈ 7.31 × (1.2/111)^0.5 ≈ 0.76, its slowest step's B below 1
    expect(far.result.viscosityB! / Math.min(...far.e.cycle!.steps.filter((s) => s.status === "ok").map((s) => s.speedRatio!)) ** 0.5).toBeLessThanOrEqual(1);
    expect(viscousLines(far.e.assumptions)).toEqual([]);
  });
});
