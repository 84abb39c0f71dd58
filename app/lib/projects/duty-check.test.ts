// The duty check where the system needs no pump head at the duty flow: its parts with their numbers and the cause
// named (the pressure difference, gravity, or both), not "gravity alone" whatever the cause. Check values: head of a
// pressure = Δp/(ρ·g₀) (definition; water at 20 °C ρ = 998.2 kg/m³, IAPWS: −200 kPa = −20.4 m); the default system
// (system-input.ts: static 10–12 m, duty 36 m³/h at 15 m). The speed/trim note and the duty cycle's step say the same.
import { describe, expect, it } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, evaluateSystem, type SystemInput } from "./hydraulics";
import { fixtureEnergy } from "./energy-fixture";
import { inSI, renderQuantities } from "~/engine/quantityText";
import { UNIT_SYSTEMS } from "~/engine";

const check = (over: Partial<SystemInput>) => evaluateSystem({ ...defaultSystemInput(), ...over }).dutyCheck!;

describe("the duty check of a system that needs no pump head", () => {
  it("a negative pressure difference (−200 kPa, static 10–12 m): named as the cause with the sum of the parts; gravity is not", () => {
    const c = check({ pressureDifference: -200_000 });
    expect(c.difference).toBeNull();
    const m = inSI(c.message);
    expect(m).toMatch(/^The system needs no pump head at 36\.0 m³\/h: its head there at most lift, aged pipe is static head 12\.0 m \+ pressure difference −200 kPa \(−20\.4 m of liquid\) \+ pipe losses \d+\.\d+ m = −\d+\.\d+ m, not above zero/);
    expect(m).toContain("The pressure difference (the discharge surface's pressure 200 kPa below the suction surface's), more than the static head and the losses, delivers the duty flow without a pump");
    expect(m).not.toMatch(/gravity/i);
  });
  it("a discharge surface below the suction surface: gravity, the pressure difference left out of the sum when zero", () => {
    const m = inSI(check({ staticLow: -20, staticHigh: -18 }).message);
    expect(m).toMatch(/is static head −18\.0 m \+ pipe losses \d+\.\d+ m = −\d+\.\d+ m, not above zero/);
    expect(m).toContain("Gravity (the discharge surface below the suction surface) delivers the duty flow");
  });
  it("both below zero: both named", () => {
    expect(inSI(check({ staticLow: -20, staticHigh: -18, pressureDifference: -50_000 }).message)).toContain("Gravity (the discharge surface below the suction surface) and the lower pressure on the discharge surface together deliver the duty flow");
  });
  it("renders in US units: no SI unit word left (−200 kPa = −29.0 psi, 12 m = 39.4 ft: NIST SP 811)", () => {
    const us = renderQuantities(check({ pressureDifference: -200_000 }).message, UNIT_SYSTEMS.US);
    expect(us).toContain("pressure difference −29.0 psi");
    expect(us).toContain("static head 39.4 ft");
    expect(us).not.toMatch(/\d (m|kPa|m³\/h)\b/);
  });
});

describe("the speed/trim note and the duty cycle's step name the same cause (not 'gravity alone')", () => {
  // An invented pump near the default duty (flow m³/h, head m, efficiency), as energy-fixture.ts's.
  const pts = [[0, 22, null], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]].map(([q, h, e]) => ({ flow: q! / 3600, head: h!, efficiency: e, power: null, npshr: null }));
  const note = (over: Partial<SystemInput>, method: "speed" | "trim") =>
    inSI(evaluateCandidate({ ...defaultSystemInput(), ...over }, { points: pts, speed: 2900, impellerDiameter: 0.2 }, { ...DEFAULT_ADJUSTMENT, method }).ratioNote!);
  it("−200 kPa at the static 10–12 m: the note names the pressure difference with the parts, never gravity", () => {
    for (const method of ["speed", "trim"] as const) {
      const m = note({ pressureDifference: -200_000 }, method);
      expect(m).toMatch(/is not above zero \(static head 12\.0 m \+ pressure difference −200 kPa \(−20\.4 m of liquid\) \+ pipe losses \d+\.\d+ m = −\d+\.\d+ m; the pressure difference \(the discharge surface's pressure 200 kPa below the suction surface's\), more than the static head and the losses, delivers the duty flow without a pump\), so there is no head to/);
      expect(m).not.toMatch(/gravity/i); // old code: "so gravity alone delivers the duty flow"
    }
  });
  it("a discharge surface 20 m below the suction surface: gravity named, with the sum", () => {
    expect(note({ staticLow: -20, staticHigh: -18 }, "speed")).toMatch(/\(static head −18\.0 m \+ pipe losses \d+\.\d+ m = −\d+\.\d+ m; gravity \(the discharge surface below the suction surface\) delivers the duty flow without a pump\)/);
  });
  it("the duty cycle under system-curve control at −200 kPa: each step needing no pump head names the pressure difference on the design curve", () => {
    const e = fixtureEnergy({ pressureDifference: -200_000, energy: { ...defaultSystemInput().energy!, control: "system-curve" } });
    const steps = e.cycle!.steps.filter((x) => x.status === "gravity-flow");
    expect(steps.length).toBe(e.cycle!.steps.length); // −20.4 m of pressure head against 11 m static: none needs the pump
    for (const x of steps) {
      const m = inSI(x.message);
      expect(m).toMatch(/not above 0: static head 11\.0 m \+ pressure difference −200 kPa \(−20\.4 m of liquid\) \+ pipe losses \d+\.\d+ m = −\d+\.\d+ m; the pressure difference .* delivers this flow without a pump and a valve throttles it/);
      expect(m).not.toMatch(/gravity/i); // old code: "gravity alone drives this flow … leave gravity enough head"
    }
  });
});
