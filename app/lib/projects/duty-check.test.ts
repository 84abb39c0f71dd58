// The duty check where the system needs no pump head at the duty flow: its parts with their numbers and the cause
// named (the pressure difference, gravity, or both), not "gravity alone" whatever the cause. Check values: head of a
// pressure = Δp/(ρ·g₀) (definition; water at 20 °C ρ = 998.2 kg/m³, IAPWS: −200 kPa = −20.4 m); the default system
// (system-input.ts: static 10–12 m, duty 36 m³/h at 15 m).
import { describe, expect, it } from "vitest";
import { defaultSystemInput, evaluateSystem, type SystemInput } from "./hydraulics";
import { inSI, renderQuantities } from "~/engine/quantityText";
import { UNIT_SYSTEMS } from "~/engine";

const check = (over: Partial<SystemInput>) => evaluateSystem({ ...defaultSystemInput(), ...over }).dutyCheck!;

describe("the duty check of a system that needs no pump head", () => {
  it("a negative pressure difference (−200 kPa, static 10–12 m): named as the cause with the sum of the parts; gravity is not", () => {
    const c = check({ pressureDifference: -200_000 });
    expect(c.difference).toBeNull();
    const m = inSI(c.message);
    expect(m).toMatch(/^The system needs no pump head at 36\.0 m³\/h: its head there at most lift, aged pipe is static head 12\.0 m \+ pressure difference -200 kPa \(-20\.4 m of liquid\) \+ pipe losses \d+\.\d+ m = -\d+\.\d+ m, not above zero/);
    expect(m).toContain("The pressure difference (the discharge surface's pressure 200 kPa below the suction surface's), more than the static head and the losses, delivers the duty flow without a pump");
    expect(m).not.toMatch(/gravity/i);
  });
  it("a discharge surface below the suction surface: gravity, the pressure difference left out of the sum when zero", () => {
    const m = inSI(check({ staticLow: -20, staticHigh: -18 }).message);
    expect(m).toMatch(/is static head -18\.0 m \+ pipe losses \d+\.\d+ m = -\d+\.\d+ m, not above zero/);
    expect(m).toContain("Gravity (the discharge surface below the suction surface) delivers the duty flow");
  });
  it("both below zero: both named", () => {
    expect(inSI(check({ staticLow: -20, staticHigh: -18, pressureDifference: -50_000 }).message)).toContain("Gravity (the discharge surface below the suction surface) and the lower pressure on the discharge surface together deliver the duty flow");
  });
  it("renders in US units: no SI unit word left (−200 kPa = −29.0 psi, 12 m = 39.4 ft: NIST SP 811)", () => {
    const us = renderQuantities(check({ pressureDifference: -200_000 }).message, UNIT_SYSTEMS.US);
    expect(us).toContain("pressure difference -29.0 psi");
    expect(us).toContain("static head 39.4 ft");
    expect(us).not.toMatch(/\d (m|kPa|m³\/h)\b/);
  });
});
