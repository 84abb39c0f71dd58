// Refusals a user can see name the field, the range and what was sent, grouped as the ranges' ends (decision "inputedge").
// Were: "Years are whole.", "At most 50 years.", "A year has at most 8784 hours (…)." and "Temperature above 300 °C?" —
// no value sent, and 8784 ungrouped beside grouped ends. Check values: a leap year 366 × 24 = 8784 h (arithmetic); the
// ranges are our rules (energy.ts, year-hours.ts, temperature-range.ts).
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { DEFAULT_ENERGY_SETTINGS, EnergySettingsSchema } from "./energy";
import { SystemInputSchema } from "./system-input";
import { boosterInput } from "./test-kit";
import { inSI } from "~/engine/quantityText";

const energyIssue = (o: Record<string, unknown>) => {
  const r = v.safeParse(EnergySettingsSchema, { ...DEFAULT_ENERGY_SETTINGS, ...o });
  return r.success ? "taken" : r.issues.map((i) => i.message).join(" | ");
};
const inputIssue = (o: Record<string, unknown>) => {
  const r = v.safeParse(SystemInputSchema, { ...boosterInput(), ...o });
  return r.success ? "taken" : inSI(r.issues.map((i) => i.message).join(" | "));
};

describe("life-cycle years: a whole number from 1 to 50, either side", () => {
  it("1 and 50 taken; 0, 51 and 2.5 refused with the range and the years sent (was “Years are whole.”, “At most 50 years.”)", () => {
    expect(energyIssue({ years: 1 })).toBe("taken");
    expect(energyIssue({ years: 50 })).toBe("taken");
    expect(energyIssue({ years: 2.5 })).toBe("Years (life-cycle cost) must be a whole number from 1 to 50, not 2.5.");
    expect(energyIssue({ years: 51 })).toBe("Years (life-cycle cost) must be a whole number from 1 to 50, not 51.");
    expect(energyIssue({ years: 0 })).toBe("Years (life-cycle cost) must be a whole number from 1 to 50, not 0.");
    expect(energyIssue({ years: 2026 })).toBe("Years (life-cycle cost) must be a whole number from 1 to 50, not 2\u202f026.");
  });
});

describe("hours: 0 to 8 784 h a year, either side", () => {
  it("a step's hours: 8784 taken, 8784.01 and −0.01 refused, grouped as the end", () => {
    const step = (hours: number) => energyIssue({ profile: [{ flowFraction: 1, hours }] });
    expect(step(8784)).toBe("taken");
    expect(step(8784.01)).toMatch(/^Hours of a step must be from 0 to 8\u202f784 h a year \(a leap year: 366 days × 24 h\), not 8\u202f784\.01 h\./);
    expect(step(-0.01)).toMatch(/^Hours of a step must be from 0 to 8\u202f784 h a year \(a leap year: 366 days × 24 h\), not −0\.010 h\./);
  });
  it("operating hours: 8784 taken, 8784.01 refused (was “A year has at most 8784 hours …”)", () => {
    expect(inputIssue({ hoursPerYear: 8784 })).toBe("taken");
    expect(inputIssue({ hoursPerYear: 8784.01 })).toBe("Operating hours must be from 0 to 8\u202f784 h a year (a leap year: 366 days × 24 h), not 8\u202f784.01 h.");
    expect(inputIssue({ hoursPerYear: -1 })).toBe("Operating hours must be from 0 to 8\u202f784 h a year (a leap year: 366 days × 24 h), not −1.00 h.");
  });
  it("a step's flow: 150 % taken, 150.01 % refused with the flow sent", () => {
    expect(energyIssue({ profile: [{ flowFraction: 1.5, hours: 100 }] })).toBe("taken");
    expect(energyIssue({ profile: [{ flowFraction: 1.5001, hours: 100 }] })).toBe("A step's flow must be from 0 % (no demand, the pump stopped) to 150 % of the duty flow, not 150.01 %.");
  });
});

describe("the stored schema's temperature (any liquid, −50 °C to 300 °C)", () => {
  it("300 taken, 300.01 refused with the range and the value (was “Temperature above 300 °C?”)", () => {
    expect(inputIssue({ temperatureC: 300, fluid: { kind: "custom", name: "Oil", density: 900, dynamicViscosity: 0.01, vaporPressure: 0 } })).toBe("taken");
    expect(inputIssue({ temperatureC: 300.01 })).toBe("Temperature is too high: it takes from −50 °C to 300 °C, not 300.01 °C; check the value and its unit.");
    expect(inputIssue({ temperatureC: -50.01 })).toBe("Temperature is too low: it takes from −50 °C to 300 °C, not −50.01 °C; check the value and its unit.");
  });
});
