// A candidate set above its curve's speed (a typed speed ratio up to 120 %, e.g. a 50 Hz curve run at 57.5 Hz): under a
// drive's control the duty cycle may run it up to that set speed, the speed its own figures meet the duty at; speeds stay
// fractions of the curve's speed. It was scaled back to the curve's speed and capped there, so the 100 % step the
// candidate meets read "not met". Check values: the affinity laws (Q ∝ N, H ∝ N²) on the invented curve below (not any
// vendor's); the system is the default one (hydraulics.ts) with the duty 50 m³/h at 15 m.
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
// flow m³/h, head m, efficiency (invented; the energy fixture's pump with a shut-off point)
const ROWS = [[0, 22, null], [5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]] as const;
const SET = { points: ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: null })), speed: 2900, impellerDiameter: 0.2 };

function cycleAt(ratio: number, control: "constant-pressure" | "system-curve") {
  const base = defaultSystemInput();
  const input: SystemInput = { ...base, duty: { flow: 50 * M3H, head: 15 }, energy: { ...base.energy!, control, profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: 0.5, hours: 1000 }] } };
  const adj = { ...DEFAULT_ADJUSTMENT, method: "speed" as const, ratio };
  const result = evaluateCandidate(input, SET, adj);
  return { result, e: candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: adj, result }, null) };
}

describe("a candidate set at 115 % of its curve's speed, under a drive's control", () => {
  for (const control of ["constant-pressure", "system-curve"] as const) {
    it(`${control}: the 100 % step is met below the set speed (the candidate meets the duty there), counted; at a set speed of 100 % it is not`, () => {
      const { result, e } = cycleAt(1.15, control);
      expect(result.operating!.flow).toBeGreaterThan(50 * M3H); // the candidate's own point passes the duty flow at 115 %
      const s = e.cycle!.steps[0];
      expect(s.status, inSI(s.message)).toBe("ok");
      expect(s.speedRatio!).toBeGreaterThan(1); // a fraction of the curve's speed, above it
      expect(s.speedRatio!).toBeLessThanOrEqual(1.15);
      expect(s.energyKWh!).toBeGreaterThan(0);
      expect(e.cycle!.complete).toBe(true);
      expect(e.assumptions).toContain("The drive runs the pump up to the candidate's set speed, 115.0 % of its curve's (the speeds of the duty cycle are fractions of the curve's speed).");
      // The flip: set at the curve's own speed, the drive's highest is 100 % and the 100 % step is not met (9.57 m there).
      const at1 = cycleAt(1, control).e.cycle!.steps[0];
      expect(at1.status).toBe("beyond-curve");
      expect(inSI(at1.message)).toMatch(/^at 50\.0 m³\/h the pump gives 9\.57 m at full speed \(100 %\)/);
    });
  }
  it("a step the set speed cannot meet names it as the drive's highest: 'at 115 % speed (the candidate's set speed)'", () => {
    const base = defaultSystemInput();
    const input: SystemInput = { ...base, duty: { flow: 50 * M3H, head: 15 }, energy: { ...base.energy!, control: "system-curve", profile: [{ flowFraction: 1.2, hours: 1000 }] } };
    const adj = { ...DEFAULT_ADJUSTMENT, method: "speed" as const, ratio: 1.15 };
    const result = evaluateCandidate(input, SET, adj);
    const s = candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: adj, result }, null).cycle!.steps[0];
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toMatch(/^at 60\.0 m³\/h the pump gives [\d.]+ m at 115 % speed \(the candidate's set speed\), [\d.]+ % below the [\d.]+ m the system needs there: no speed up to 115 % meets this step \(the drive does not run the pump above the candidate's set speed\)$/);
  });
});

describe("a candidate set to a speed by a drive, on a fixed-speed cycle", () => {
  it("reads its set speed, not 'full speed': 90.0 % of the curve's, throttled; at its curve's own speed, 'full speed, throttled'", () => {
    const base = defaultSystemInput();
    const input: SystemInput = { ...base, energy: { ...base.energy!, control: "fixed-speed", profile: [{ flowFraction: 0.5, hours: 1000 }] } };
    const at = (ratio: number) => {
      const adj = { ...DEFAULT_ADJUSTMENT, method: "speed" as const, ratio };
      return candidateEnergy(input, systemSpec(input), fluidOf(input).density, { adjustment: adj, result: evaluateCandidate(input, SET, adj) }, null).cycle!.steps[0];
    };
    const s = at(0.9);
    expect(s.status).toBe("ok");
    expect(s.message).toBe("at its set speed 90.0 %, throttled");
    expect(s.speedRatio).toBeCloseTo(0.9, 9); // a fraction of the curve's speed, as under a drive's control
    expect(at(1).message).toBe("full speed, throttled");
  });
});
