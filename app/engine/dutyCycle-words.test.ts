// Duty-cycle step texts said of what they are about, in SI and US units:
// - the drive's lowest speed is a limit and reads as given (fmtPctLimit): a lowest speed of 30.4 % read "30 %" beside a
//   step held there because it needs 30.2 %, and beside the curve's first point worked out at 30.4 %;
// - the curve of duty pumps in parallel (or series) is theirs together: "the 2 pumps together give …", not "the pump gives".
// Check values: hand algebra with the affinity laws (Q ∝ N, H ∝ N², common practice) on the made-up knot curve
// H = 20 − 0.02·Q² m (Q in m³/h; app/engine/test/curves.ts, not any vendor's) on its closed loop H = 18 m × (Q/10 m³/h)²,
// whose steps need a speed equal to their flow fraction.
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, type DutyCycleInput } from "./index.ts";
import { inSI, renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";
import { knotCycle, M3H } from "./test/curves.ts";

const US = (t: string) => renderQuantities(t, UNIT_SYSTEMS.US);
const cycle = (o: Partial<DutyCycleInput>, flowFraction: number) =>
  dutyCycleEnergy({ ...knotCycle(), mode: "system-curve", driveEfficiency: 0.97, ...o, profile: [{ flowFraction, hours: 1000 }] });
// The knot curve from 5 m³/h on (first point 5 m³/h, made up): at a lowest speed of 30.4 % it starts at 1.52 m³/h.
const fromFive = createPumpCurve({ points: [5, 10, 15, 20].map((q) => ({ flow: q * M3H, head: 20 - 0.02 * q * q, efficiency: 0.6 })) });

describe("a drive's lowest speed of 30.4 %, read as given", () => {
  it("a step needing 30.2 % is held at 30.4 %, said so (it read 'its lowest speed, 30 %'); a step needing 30.5 % is not", () => {
    const r = cycle({ minSpeedRatio: 0.304 }, 0.302);
    expect(r.steps[0].speedRatio).toBe(0.304);
    expect(r.steps[0].message).toBe("held at the lowest speed 30.4 %, throttled");
    const w = r.warnings.find((x) => x.code === "held-at-min-speed")!;
    expect(inSI(w.message)).toMatch(/^at 30 % flow the drive holds its lowest speed, 30\.4 % \(common practice, assumed: check the drive's and the pump's minimum speed\): the pump gives \d+\.\d+ m at 3\.02 m³\/h,/);
    expect(US(w.message)).toMatch(/^at 30 % flow the drive holds its lowest speed, 30\.4 % \(.*\): the pump gives \d+\.\d+ ft at 13\.3 gpm,/);
    const free = cycle({ minSpeedRatio: 0.304 }, 0.305);
    expect(free.warnings.filter((x) => x.code === "held-at-min-speed")).toEqual([]);
    expect(free.steps[0].speedRatio!).toBeCloseTo(0.305, 9);
  });
  it("a flow before the curve's first point at 30.4 % (1.52 m³/h): 1.51 m³/h said against the speed it was worked out at", () => {
    const s = cycle({ curve: fromFive, minSpeedRatio: 0.304 }, 0.151).steps[0];
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toBe("1.51 m³/h lies before the curve's first point at every speed from the drive's lowest, 30.4 %, to 100 %: at 30.4 % speed the curve starts at 1.52 m³/h (5.00 m³/h as published at full speed); below it the curve gives no data");
    expect(US(s.message)).toMatch(/^6\.65 gpm lies before the curve's first point at every speed from the drive's lowest, 30\.4 %, to 100 %: at 30\.4 % speed the curve starts at 6\.69 gpm/);
    expect(cycle({ curve: fromFive, minSpeedRatio: 0.304 }, 0.153).steps[0].status).toBe("ok"); // on the curve at 30.4 %
  });
});

describe("two duty pumps: their curve is theirs together", () => {
  const two = { motor: { rating: 1500, efficiency: 0.8, units: 2 } };
  it("held at the lowest speed: 'the 2 pumps together give', one pump 'the pump gives'", () => {
    const w = (o: Partial<DutyCycleInput>) => cycle(o, 0.1).warnings.find((x) => x.code === "held-at-min-speed")!.message;
    expect(inSI(w(two))).toContain("minimum speed): the 2 pumps together give 1.78 m at 1.00 m³/h, the system needs 0.180 m,");
    expect(US(w(two))).toMatch(/minimum speed\): the 2 pumps together give \d+\.\d+ ft at 4\.40 gpm, the system needs 0\.591 ft,/);
    expect(inSI(w({}))).toContain("minimum speed): the pump gives 1.78 m at 1.00 m³/h,");
  });
  it("a head above the curve at full speed (120 % flow) and at fixed speed past the system's head", () => {
    expect(inSI(cycle(two, 1.2).steps[0].message)).toMatch(/^at 12\.0 m³\/h the 2 pumps together give 17\.1 m at full speed \(100 %\), 34\.0 % below the 25\.9 m the system needs there/);
    // Fixed speed on a system with 19 m static head: at 50 % flow the curve's 19.5 m is below 19 m + 18 m × 0.25 = 23.5 m.
    const fixed = dutyCycleEnergy({ ...knotCycle(), ...two, systemHead: (q) => 19 + 18 * (q / (10 * M3H)) ** 2, profile: [{ flowFraction: 0.5, hours: 1000 }] });
    expect(inSI(fixed.steps[0].message)).toMatch(/^at 5\.00 m³\/h the 2 pumps together give 19\.5 m, 17\.0 % below the system's 23\.5 m/);
  });
  it("held at the lowest on-curve speed (past the curve's end below 90 %): the 2 pumps together give 9.72 m", () => {
    // 18 m³/h reaches the curve's end (20 m³/h) at 90 %, where the curve gives 0.81 × 12 = 9.72 m against the system's 0.5 m.
    const s = dutyCycleEnergy({ ...knotCycle(), ...two, mode: "system-curve", driveEfficiency: 0.97, designFlow: 20 * M3H, systemHead: () => 0.5, profile: [{ flowFraction: 0.9, hours: 1000 }] }).steps[0];
    expect(s.status).toBe("throttled-at-min-on-curve-speed");
    expect(inSI(s.message)).toContain("as published at full speed); the 2 pumps together give 9.72 m, the system needs 0.500 m:");
  });
});

describe("a candidate set above its curve's speed: the drive's highest speed is a limit, read as given", () => {
  it("set at 115.5 %: a step the pump cannot reach names 115.5 %, not '116 %' (it read fmtPct(1.155, 0)), in SI and US", () => {
    // 12 m³/h on the loop needs 18 × 1.2² = 25.92 m; at 115.5 % the curve gives 1.155² × H(12 / 1.155) ≈ 23.8 m (hand algebra).
    const s = cycle({ maxSpeedRatio: 1.155 }, 1.2).steps[0];
    expect(s.status).toBe("beyond-curve");
    for (const t of [inSI(s.message), US(s.message)]) {
      expect(t).toMatch(/^at (?:12\.0 m³\/h|52\.8 gpm) the pump gives \d+\.\d+ (?:m|ft) at 115\.5 % speed \(the candidate's set speed\), /);
      expect(t).toContain(": no speed up to 115.5 % meets this step (the drive does not run the pump above the candidate's set speed)");
    }
  });
});
