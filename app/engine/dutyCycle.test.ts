import { describe, expect, it } from "vitest";
import { defaultCirculatorProfile, dutyCycleEnergy, EngineInputError, type DutyCycleInput } from "./index.ts";
import { KNOT_DESIGN_FLOW, knotCycle } from "./test/curves.ts";

// A made-up pump (not any vendor's): knots every 5 m³/h, H = 20 − 0.02·Q² (Q in m³/h), shaft power given
// at the knots (W, at 1000 kg/m³, the curve's power density). Steps fall on knots, so the monotone cubic
// returns the knot values exactly and the hand calculation needs no interpolation.
const M3H = 1 / 3600;
const qd = KNOT_DESIGN_FLOW;
// Closed loop through the design point: H = 18 m × (Q / 10 m³/h)² (no static head); fixed speed, 750 W motor at 80 %.
const base: DutyCycleInput = knotCycle();

describe("duty-cycle energy against a hand calculation", () => {
  it("fixed speed, throttled: the pump stays on its curve", () => {
    // Hand calculation (relations: P_el = P_shaft / (η_m · η_d), E = P_el · h; motor part-load factor 1 at ≥ 50 % load,
    // the module's stated common-practice assumption):
    //  100 %: Q 10 m³/h, P_shaft 600 W (curve), load 600/750 = 0.8 → η_m = 0.8 → P_el 750 W × 1000 h = 750 kWh
    //   50 %: Q  5 m³/h, P_shaft 450 W (curve), load 0.6 → η_m = 0.8 → P_el 562.5 W × 3000 h = 1687.5 kWh
    //  total 2437.5 kWh per year
    const r = dutyCycleEnergy(base);
    expect(r.steps.map((s) => s.status)).toEqual(["ok", "ok"]);
    expect(r.steps[0].head).toBeCloseTo(18, 9);
    expect(r.steps[1].head).toBeCloseTo(19.5, 9); // throttled: the pump's own head at 5 m³/h
    expect(r.steps[0].energyKWh).toBeCloseTo(750, 6);
    expect(r.steps[1].energyKWh).toBeCloseTo(1687.5, 6);
    expect(r.annualEnergyKWh).toBeCloseTo(2437.5, 6);
    expect(r.complete).toBe(true);
  });

  it("VFD following the system curve: affinity laws, P ∝ N³, with motor and drive part-load losses", () => {
    // The system parabola H = 18·(Q/Qd)² is also the affinity parabola through the design point, so at
    // 50 % flow the speed is 50 % and the full-speed point is the design knot (affinity laws, Q ∝ N, H ∝ N², P ∝ N³):
    //  100 %: N = 1, P_shaft 600 W, load 0.8: η_m = 0.8 × 1 = 0.8; η_d = 0.97 × (0.995 + 0.005 × (0.8 − 0.75)/0.25) = 0.97 × 0.996 = 0.96612
    //         P_el = 600 / (0.8 × 0.96612) = 776.3011 W → × 1000 h = 776.3011 kWh
    //   50 %: N = 0.5, P_shaft = 600 × 0.5³ = 75 W, load 0.1: η_m = 0.8 × 0.80 = 0.64; η_d = 0.97 × 0.88 = 0.8536
    //         P_el = 75 / (0.64 × 0.8536) = 137.2862 W → × 3000 h = 411.8586 kWh
    //  total 1188.1597 kWh per year (part-load factors: the module's common-practice assumption)
    const r = dutyCycleEnergy({ ...base, mode: "system-curve", driveEfficiency: 0.97 });
    expect(r.steps[0].speedRatio).toBeCloseTo(1, 6);
    expect(r.steps[1].speedRatio).toBeCloseTo(0.5, 6);
    expect(r.steps[1].shaftPower).toBeCloseTo(75, 3);
    expect(r.steps[0].driveEfficiency).toBeCloseTo(0.96612, 9);
    expect(r.steps[1].motorEfficiency).toBeCloseTo(0.64, 6);
    expect(r.steps[0].energyKWh).toBeCloseTo(776.3011, 2);
    expect(r.steps[1].energyKWh).toBeCloseTo(411.8586, 2);
    expect(r.annualEnergyKWh).toBeCloseTo(1188.1597, 2);
  });

  it("a motor below 10 % load is warned about at its step (parameter profile[i]), its load never read as the 10 % limit", () => {
    // System-curve control at 50 % flow runs the motor at exactly 75 / 750 = 10 % load (hand calculation above; computed a
    // rounding error below): no warning, nor at 50.01 %. At 49.99 % flow: N = 0.4999, P = 600 × 0.4999³ = 74.955 W,
    // 9.994 % load (affinity laws): warned, shown as 9.99 % (10.0 % at one decimal would read as the limit).
    const at = (f: number) => dutyCycleEnergy({ ...base, mode: "system-curve", driveEfficiency: 0.97, profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: f, hours: 3000 }] }).warnings;
    for (const f of [0.5, 0.5001]) expect(at(f).filter((w) => w.code === "motor-very-light-load"), String(f)).toEqual([]);
    const w = at(0.4999).filter((x) => x.code === "motor-very-light-load");
    expect(w).toHaveLength(1);
    expect(w[0].parameter).toBe("profile[1]");
    expect(w[0].message).toMatch(/runs at 9\.99 % load/);
  });

  it("control curves order the energy: constant pressure ≥ proportional ≥ system curve (same pump, same profile)", () => {
    const e = (mode: DutyCycleInput["mode"]) => dutyCycleEnergy({ ...base, mode, driveEfficiency: 0.97 });
    const cp = e("constant-pressure"), pp = e("proportional-pressure"), sc = e("system-curve");
    expect(cp.setpointHead).toBeCloseTo(18, 9);
    // proportional pressure at 50 % flow: H = 18 × (0.5 + 0.5 × 0.5) = 13.5 m (common-practice curve)
    expect(pp.steps[1].head).toBeCloseTo(13.5, 9);
    expect(cp.steps[1].head).toBeCloseTo(18, 9);
    expect(cp.annualEnergyKWh).toBeGreaterThan(pp.annualEnergyKWh);
    expect(pp.annualEnergyKWh).toBeGreaterThan(sc.annualEnergyKWh);
  });
});

describe("a control curve below the system curve: the step is not met", () => {
  // Open system through the design point: H = 12 m static + 6 m × (Q / 10 m³/h)², so H_set = 18 m.
  // Proportional pressure asks 18 × (0.5 + 0.5 f) = 9 + 9 f; the system needs 12 + 6 f². They cross where
  // 2f² − 3f + 1 = 0, at f = 0.5 and f = 1 (hand algebra): below 50 % flow the control curve lies under the system curve.
  const open = (q: number) => 12 + 6 * (q / qd) ** 2;
  const run = (mode: DutyCycleInput["mode"], flowFraction: number) =>
    dutyCycleEnergy({ ...base, systemHead: open, mode, driveEfficiency: 0.97, profile: [{ flowFraction, hours: 1000 }] });

  it("at 25 % flow proportional pressure asks 11.25 m where the system needs 12.375 m: not met, the numbers and the remedy given", () => {
    const r = run("proportional-pressure", 0.25);
    expect(r.steps[0].status).toBe("control-below-system");
    expect(r.steps[0].energyKWh).toBeNull();
    expect(r.complete).toBe(false);
    expect(r.warnings.map((w) => w.code)).toContain("cycle-incomplete");
    // 18 × (0.5 + 0.5 × 0.25) = 11.25 m; 12 + 6 × 0.25² = 12.375 m (hand calculation)
    // each head's token carries the other (qtPair); 12.375 / 11.25 − 1 = 10 % (hand calculation)
    expect(r.steps[0].message).toMatch(/⟦head\|11\.25\|12\.375⟧ at ⟦flow\|[^⟧]+⟧ but the system needs ⟦head\|12\.375\|limit:11\.25⟧ there, 10\.0 % more/);
    expect(r.steps[0].message).toMatch(/raise the set point.*system-curve control/);
  });

  it("flips between met and not met exactly where the control head equals the system head (f = 0.5)", () => {
    expect(run("proportional-pressure", 0.5).steps[0].status).toBe("ok"); // 13.5 m both (hand calculation)
    expect(run("proportional-pressure", 0.5).steps[0].head).toBeCloseTo(13.5, 9);
    expect(run("proportional-pressure", 0.5 + 1e-6).steps[0].status).toBe("ok");
    expect(run("proportional-pressure", 0.5 - 1e-6).steps[0].status).toBe("control-below-system");
    expect(run("proportional-pressure", 0.75).steps[0].status).toBe("ok"); // 15.75 m asked ≥ 15.375 m needed
    // Constant pressure holds 18 m ≥ the system's head at every flow up to the design flow: met throughout.
    for (const f of [0.25, 0.5 - 1e-6, 0.75, 1]) expect(run("constant-pressure", f).steps[0].status).toBe("ok");
    // System-curve control asks exactly the system's head: never below it.
    expect(run("system-curve", 0.25).steps[0].status).toBe("ok");
  });

  it("just past the crossing the message's shortfall never reads as 0 % (both heads may round alike there)", () => {
    // 18 × (0.5 + 0.5 f) vs 12 + 6 f² at f = 0.5 − 10⁻⁶: the system needs ~2 × 10⁻⁷ more, relatively (hand algebra)
    const msg = run("proportional-pressure", 0.5 - 1e-6).steps[0].message;
    const pct = Number(/there, ([\d.]+) % more/.exec(msg)?.[1]);
    expect(pct).toBeGreaterThan(0);
    expect(pct).toBeLessThan(1e-4);
  });

  it("no step reported as met runs below the system's head, in any controlled mode", () => {
    for (const mode of ["constant-pressure", "proportional-pressure", "system-curve"] as const)
      for (let f = 0.05; f <= 1.0001; f += 0.05) {
        const s = run(mode, f).steps[0];
        if (s.status === "ok") expect(s.head!).toBeGreaterThanOrEqual(open(s.flow) * (1 - 1e-9));
      }
  });
});

describe("duty-cycle edges", () => {
  it("a step beyond the pump's curve end is not computed and the total says it is incomplete", () => {
    // 150 % of 10 m³/h = 15 m³/h: the system needs 18 × 1.5² = 40.5 m, the pump gives 15.5 m.
    const r = dutyCycleEnergy({ ...base, profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: 1.5, hours: 100 }] });
    expect(r.steps[1].status).toBe("beyond-curve");
    expect(r.steps[1].energyKWh).toBeNull();
    expect(r.complete).toBe(false);
    expect(r.annualEnergyKWh).toBeCloseTo(750, 6); // only the 100 % step (hand calculation above)
    expect(r.warnings.map((w) => w.code)).toContain("cycle-incomplete");
    expect(r.steps[1].message).toMatch(/gives ⟦head\|15\.5\|40\.5⟧, 61\.7 % below the system.s ⟦head\|40\.5\|limit:15\.5⟧/); // 1 − 15.5/40.5 = 61.7 % (hand calculation); each head token carries the other (qtPair)
    // With the VFD the same step needs more than full speed.
    const v = dutyCycleEnergy({ ...base, mode: "system-curve", driveEfficiency: 0.97, profile: [{ flowFraction: 1.5, hours: 100 }] });
    expect(v.steps[0].status).toBe("beyond-curve");
    // A fixed-speed flow past the last published point (20 m³/h) in an open system with a low curve.
    const open = dutyCycleEnergy({ ...base, systemHead: () => 1, profile: [{ flowFraction: 1.5, hours: 10 }, { flowFraction: 1, hours: 10 }] });
    expect(open.steps[0].status).toBe("ok"); // 15 m³/h is on the curve
    const past = dutyCycleEnergy({ ...base, designFlow: 16 * M3H, systemHead: () => 1, profile: [{ flowFraction: 1.5, hours: 10 }] });
    expect(past.steps[0].status).toBe("beyond-curve"); // 24 m³/h > 20 m³/h, the curve's end
  });
  it("a step needing less than the lowest speed runs at the lowest speed, throttled (common practice)", () => {
    // System curve, 50 % flow needs 50 % speed; with a 60 % lowest speed the pump is held at 60 %.
    const r = dutyCycleEnergy({ ...base, mode: "system-curve", driveEfficiency: 0.97, minSpeedRatio: 0.6 });
    expect(r.steps[1].status).toBe("ok");
    expect(r.steps[1].speedRatio).toBe(0.6);
    expect(r.steps[1].message).toMatch(/lowest speed 60 %/);
    // Head on the 60 % curve at 5 m³/h: 0.36 × H(5/0.6 m³/h) > the system's 4.5 m (affinity laws).
    expect(r.steps[1].head!).toBeGreaterThan(4.5);
    expect(r.steps[1].shaftPower!).toBeGreaterThan(75); // more than the ideal 600 × 0.5³ W
  });
  it("zero hours: the point is computed, its energy is zero, and a zero-hour step the pump cannot meet leaves the total complete", () => {
    const r = dutyCycleEnergy({ ...base, profile: [{ flowFraction: 1, hours: 0 }, { flowFraction: 1.5, hours: 0 }] });
    expect(r.steps[0].status).toBe("ok");
    expect(r.steps[0].energyKWh).toBe(0);
    expect(r.annualEnergyKWh).toBe(0);
    expect(r.complete).toBe(true);
  });
  it("fractions above 1 are computed up to 150 %; above that, below 0, NaN or Infinity are refused; 0 is no demand, the pump stopped", () => {
    const r = dutyCycleEnergy({ ...base, systemHead: (q) => 15.5 * (q / (15 * M3H)) ** 2, profile: [{ flowFraction: 1.5, hours: 10 }] });
    expect(r.steps[0].status).toBe("ok");
    expect(r.steps[0].shaftPower).toBeCloseTo(720, 6); // the 15 m³/h knot
    expect(dutyCycleEnergy({ ...base, profile: [{ flowFraction: 0, hours: 10 }] }).steps[0]).toMatchObject({ status: "no-demand", energyKWh: 0 }); // was refused
    for (const f of [1.6, -0.5, NaN, Infinity]) expect(() => dutyCycleEnergy({ ...base, profile: [{ flowFraction: f, hours: 10 }] })).toThrow(EngineInputError);
    expect(() => dutyCycleEnergy({ ...base, profile: [{ flowFraction: 0.5, hours: NaN }] })).toThrow(EngineInputError);
  });
  it("an empty profile, a year of more than 8784 h, and an unknown mode are refused", () => {
    expect(() => dutyCycleEnergy({ ...base, profile: [] })).toThrow(/empty/);
    expect(() => dutyCycleEnergy({ ...base, profile: [{ flowFraction: 1, hours: 5000 }, { flowFraction: 0.5, hours: 4000 }] })).toThrow(/8784/);
    // Just over the year (8000 + 784.01 h): said apart from 8784 h (was "adds up to 8784 h, more than a year (8784 h)").
    expect(() => dutyCycleEnergy({ ...base, profile: [{ flowFraction: 1, hours: 8000 }, { flowFraction: 0.5, hours: 784.01 }] })).toThrow("profile: adds up to 8784.01 h, more than a year (8784 h)");
    expect(() => dutyCycleEnergy({ ...base, profile: [{ flowFraction: 1, hours: 8000 }, { flowFraction: 0.5, hours: 784 }] })).not.toThrow(); // a leap year exactly (366 × 24 h)
    expect(() => dutyCycleEnergy({ ...base, mode: "throttle" as never })).toThrow(EngineInputError);
  });
  it("the common-practice circulator profile spreads the year's hours 6/15/35/44 % over 100/75/50/25 % flow (EN 16297-1, from memory)", () => {
    const p = defaultCirculatorProfile(5000);
    expect(p).toEqual([{ flowFraction: 1, hours: 300 }, { flowFraction: 0.75, hours: 750 }, { flowFraction: 0.5, hours: 1750 }, { flowFraction: 0.25, hours: 2200 }]);
    expect(p.reduce((s, x) => s + x.hours, 0)).toBeCloseTo(5000, 9);
  });
});
