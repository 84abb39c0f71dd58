// Duty-cycle steps no speed can meet, each said with its rule and numbers: under a drive, a step that needs more head
// than the pump gives at full speed (the system's or a control curve's head above the curve, a set point above the
// shut-off head), a flow past the curve's end at full speed, a flow before the curve's first point at the drive's
// lowest speed; at fixed speed, a flow off the curve, never read as one of the curve's ends. Each flips at its
// threshold. Check values: hand algebra on the made-up knot curve H = 20 − 0.02·Q² m (Q in m³/h; app/engine/test/curves.ts,
// not any vendor's), whose monotone cubic gives the parabola's values (17.12 m at 12 m³/h, checked below).
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, headAt, type DutyCycleInput } from "./index.ts";
import { inSI, renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";
import { knotCurve, knotCycle, M3H } from "./test/curves.ts";

const qd = 10 * M3H;
const step = (o: Partial<DutyCycleInput>, flowFraction: number) =>
  dutyCycleEnergy({ ...knotCycle(), driveEfficiency: 0.97, ...o, profile: [{ flowFraction, hours: 1000 }] }).steps[0];
// The knot curve from 5 m³/h on (first point 5 m³/h, made up): at the lowest speed, 30 %, it starts at 1.5 m³/h (Q ∝ N).
const fromFive = createPumpCurve({ points: [5, 10, 15, 20].map((q) => ({ flow: q * M3H, head: 20 - 0.02 * q * q, efficiency: 0.6 })) });

describe("a VFD step that needs more head than the pump gives at full speed", () => {
  it("system-curve control at 120 %: the pump's 17.12 m at full speed beside the system's 25.92 m, 34.0 % below; not met, no energy", () => {
    // Hand: Q = 1.2 × 10 = 12 m³/h; system 18 m × 1.2² = 25.92 m; pump 20 − 0.02 × 144 = 17.12 m; 1 − 17.12/25.92 = 33.95 %.
    expect(headAt(knotCurve(), 12 * M3H)).toBeCloseTo(17.12, 9);
    const s = step({ mode: "system-curve" }, 1.2);
    expect(s.status).toBe("beyond-curve");
    expect(s.energyKWh).toBeNull();
    expect(inSI(s.message)).toBe("at 12.0 m³/h the pump gives 17.1 m at full speed (100 %), 34.0 % below the 25.9 m the system needs there: no speed up to 100 % meets this step (the drive does not run the pump above its full speed)");
    // US units: every quantity of the text in the reader's units (1 m = 3.28084 ft, 1 m³/h = 4.40287 gpm).
    expect(renderQuantities(s.message, UNIT_SYSTEMS.US)).toMatch(/^at 52\.8 gpm the pump gives 56\.2 ft at full speed \(100 %\), 34\.0 % below the 85\.0 ft the system needs there/);
  });
  it("flips at the design flow: 100 % is met at full speed, 100.1 % is not", () => {
    expect(step({ mode: "system-curve" }, 1).status).toBe("ok");
    expect(step({ mode: "system-curve" }, 1.001).status).toBe("beyond-curve");
  });
  it("constant pressure with a set point above the shut-off head (20.5 m against 20 m): every step not met, each with the pump's head", () => {
    // System 19 m + 1.5 m × (Q/Qd)²: H_set = 20.5 m. At 50 %: the pump gives 20 − 0.02 × 25 = 19.5 m; 1 − 19.5/20.5 = 4.88 %.
    const sys = (q: number) => 19 + 1.5 * (q / qd) ** 2;
    const s = step({ mode: "constant-pressure", systemHead: sys }, 0.5);
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toBe("at 5.00 m³/h the pump gives 19.5 m at full speed (100 %), 4.9 % below the 20.5 m the control curve asks there: no speed up to 100 % meets this step (the drive does not run the pump above its full speed)");
    // The flip: a set point of 19.4 m (system 17.9 m + 1.5 m) is met at 50 % below full speed.
    const met = step({ mode: "constant-pressure", systemHead: (q) => 17.9 + 1.5 * (q / qd) ** 2 }, 0.5);
    expect(met.status).toBe("ok");
    expect(met.speedRatio!).toBeLessThan(1);
  });
});

describe("a VFD step whose flow is off the curve at every speed of the drive", () => {
  it("past the curve's end at full speed (20 m³/h): said with both flows; not met", () => {
    const s = step({ mode: "system-curve", designFlow: 20 * M3H, systemHead: () => 0.5 }, 1.2);
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toBe("24.0 m³/h is past the curve's end at full speed (20.0 m³/h as published, 100 %): no speed up to 100 % puts it on the curve (the drive does not run the pump above its full speed)");
  });
  it("before the curve's first point at the drive's lowest speed (1.5 m³/h at 30 %): 1.4 m³/h not met, 1.6 m³/h met at 30 %", () => {
    const s = step({ curve: fromFive, mode: "system-curve" }, 0.14);
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toBe("1.40 m³/h lies before the curve's first point at every speed from the drive's lowest, 30 %, to 100 %: at 30 % speed the curve starts at 1.50 m³/h (5.00 m³/h as published at full speed); below it the curve gives no data");
    const met = step({ curve: fromFive, mode: "system-curve" }, 0.16);
    expect(met.status).toBe("ok");
    expect(met.speedRatio).toBe(0.3);
  });
});

describe("a fixed-speed step off the curve: its flow never reads as the curve's end", () => {
  it("20.00002 m³/h beside the curve's end at 20 m³/h prints apart from it; 20 m³/h exactly is on the curve", () => {
    const at = (q: number) => step({ designFlow: q * M3H, systemHead: () => 1, driveEfficiency: null }, 1);
    expect(at(20).status).toBe("ok");
    const s = at(20.00002);
    expect(s.status).toBe("beyond-curve");
    expect(inSI(s.message)).toBe("20.00002 m³/h is outside the pump's curve (0.000 m³/h–20.0 m³/h) at fixed speed"); // the reading with the decimals that set it apart (quantityText.ts qtExact)
  });
});

describe("a VFD step below the drive's lowest speed: held there, throttled, said at the step with its numbers", () => {
  it("system-curve control at 10 %: 30 % speed, the pump's 1.78 m beside the system's 0.180 m, 1.60 m throttled; met and counted", () => {
    // Hand (affinity laws): Q = 1 m³/h; at 30 % speed the full-speed point is 1/0.3 = 3.333 m³/h, H = 20 − 0.02 × 3.333² = 19.778 m,
    // × 0.3² = 1.780 m; the system needs 18 m × 0.1² = 0.180 m; 1.600 m throttled.
    const r = dutyCycleEnergy({ ...knotCycle(), mode: "system-curve", driveEfficiency: 0.97, profile: [{ flowFraction: 0.1, hours: 1000 }] });
    expect(r.steps[0].status).toBe("ok");
    expect(r.steps[0].speedRatio).toBe(0.3);
    expect(r.steps[0].head).toBeCloseTo(1.78, 2);
    expect(r.steps[0].energyKWh!).toBeGreaterThan(0);
    const w = r.warnings.filter((x) => x.code === "held-at-min-speed");
    expect(w.map((x) => x.parameter)).toEqual(["profile[0]"]);
    expect(inSI(w[0].message)).toBe("at 10 % flow the drive holds its lowest speed, 30 % (common practice, assumed: check the drive's and the pump's minimum speed): the pump gives 1.78 m at 1.00 m³/h, the system needs 0.180 m, so 1.60 m is throttled by a valve; the energy is at this speed with the pump's head");
  });
  it("flips at the lowest speed: on this system's affinity parabola a step at 30 % flow needs 30 % speed (no note), at 29.9 % it is held there", () => {
    const notes = (f: number) => dutyCycleEnergy({ ...knotCycle(), mode: "system-curve", driveEfficiency: 0.97, profile: [{ flowFraction: f, hours: 1000 }] }).warnings.filter((x) => x.code === "held-at-min-speed");
    expect(notes(0.3)).toEqual([]);
    expect(notes(0.299)).toHaveLength(1);
  });
});
