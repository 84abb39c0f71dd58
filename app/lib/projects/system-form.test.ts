// The system editor's numbers through the forms' strict reader (shared/decimal.ts): product rules, US units
// where the edge hunt found 1,500 gpm read as 1.5 gpm. Conversions: 1 gpm = 6.30901964e-5 m³/s (NIST SP 811).
import { describe, expect, it } from "vitest";
import { readSystemForm } from "./system-form";
import { US_UNITS, SI_UNITS } from "~/lib/shared/units";

const GPM = 6.30901964e-5; // m³/s per US gallon per minute (NIST SP 811)
const base: Record<string, string> = {
  name: "Loop", temperature: "68", staticLow: "30", staticHigh: "30", suctionSurfacePressure: "14.696", runCount: "1",
  "run.0.side": "discharge", "run.0.diameter": "4", "run.0.length": "200", dutyFlow: "150", dutyHead: "60", hoursPerYear: "4000", tariffPerKWh: "0.2",
};
const read = (o: Record<string, string>, sys = US_UNITS) => {
  // Read in SI, the 4 in bore would be 4 mm, below the smallest bore taken (6.2 mm, system-form-ranges.test.ts): 100 mm.
  const m = new Map(Object.entries({ ...base, ...(sys === SI_UNITS ? { "run.0.diameter": "100" } : {}), ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, sys);
};

describe("readSystemForm: numbers as typed (product rules)", () => {
  it("refuses 1,500 gpm as ambiguous, with how to write it; takes 1500 and 1,5", () => {
    const bad = read({ dutyFlow: "1,500" });
    expect(bad.input).toBeNull();
    expect(bad.errors.dutyFlow).toBe("Duty flow “1,500” is ambiguous: 1500 (a thousands comma) or 1.500 (a decimal comma)? Write 1500 or 1 500 for the first, 1.500 or 1.5 for the second.");
    expect(read({ dutyFlow: "1500" }).input!.duty!.flow).toBeCloseTo(1500 * GPM, 9);
    expect(read({ dutyFlow: "1,5" }).input!.duty!.flow).toBeCloseTo(1.5 * GPM, 12);
  });
  it("refuses the other ambiguous fields the same way: hours per year, a run's length", () => {
    expect(read({ hoursPerYear: "8,760" }).errors.hoursPerYear).toMatch(/ambiguous.*Write 8760 or 8 760 for the first, 8\.760 or 8\.76 for the second\./);
    expect(read({ "run.0.length": "1,200" }).errors["run.0.length"]).toMatch(/ambiguous.*Write 1200 or 1 200 for the first, 1\.200 or 1\.2 for the second\./);
    expect(read({ hoursPerYear: "8760" }).input!.hoursPerYear).toBe(8760);
  });
  it("refuses hex and binary (Number() would read 0x10 as 16)", () => {
    // With the range it takes (duty-ranges.ts): 1e-5 to 100 m³/s is 0.1585 to 1585032 gpm (1 gpm = 6.30901964e-5 m³/s).
    expect(read({ dutyFlow: "0x10" }).errors.dutyFlow).toBe("Duty flow must be a number; it takes from 0.159 gpm to 1\u202f585\u202f032 gpm.");
    expect(read({ dutyFlow: "0b11" }).errors.dutyFlow).toBe("Duty flow must be a number; it takes from 0.159 gpm to 1\u202f585\u202f032 gpm.");
  });
  it("keeps the field's own message for 1e309: the cross-field check never overwrites it", () => {
    const r = read({ dutyFlow: "1e309" });
    expect(r.errors.dutyFlow).toBe("Duty flow must be a number; it takes from 0.159 gpm to 1\u202f585\u202f032 gpm.");
    expect(read({ dutyFlow: "1.5e3" }).errors).toEqual({});
    // A blank flow with a head still gets the cross-field message.
    expect(read({ dutyFlow: "" }).errors.dutyFlow).toBe("Give both duty flow and head, or neither.");
  });
  it("a bad optional field is an error, not its default", () => {
    expect(read({ npshMargin: "abc" }).errors.npshMargin).toBe("The NPSH margin ratio must be a number.");
    expect(read({ "run.0.extraK": "Infinity" }).errors["run.0.extraK"]).toBe("Extra ΣK must be a number; it takes from 0 to 10\u202f000."); // the field's label and range (run-ranges.ts)
    expect(read({ npshMargin: "" }).input!.npshMargin).toBe(1.1);
  });
  it("load profile and life-cycle fields: an ambiguous number is refused on its field, its pair message does not replace it", () => {
    const energy = { "energy.control": "fixed-speed", "energy.profileKind": "user", "energy.step.0.pct": "100", "energy.step.0.hours": "1,000" };
    const r = read(energy, SI_UNITS);
    expect(r.errors["energy.step.0.hours"]).toMatch(/ambiguous.*Write 1000 or 1 000 for the first, 1\.000 or 1 for the second\./);
    expect(read({ ...energy, "energy.step.0.hours": "1000", "energy.years": "abc" }, SI_UNITS).errors["energy.years"]).toBe("Years must be a whole number from 1 to 50, written in digits: “abc” is not.");
    expect(read({ ...energy, "energy.step.0.hours": "1000" }, SI_UNITS).input!.energy!.profile).toEqual([{ flowFraction: 1, hours: 1000 }]);
  });
});

describe("readSystemForm: water outside the range its properties cover (engine fluids.ts: 0–100 °C)", () => {
  it("is refused at the temperature field when the form is sent, with what to do; 100 °C is taken, 100.1 °C is not; a user-defined fluid may be hotter", () => {
    const hot = read({ temperature: "100.1" }, SI_UNITS);
    expect(hot.input).toBeNull();
    // The range's ends as typed ("0 °C", not "0.000 °C"), the value typed apart from them (100.1, not 100).
    expect(hot.errors.temperature).toBe("Temperature is too high: it takes from 0 °C to 100 °C (water's properties are computed for this range only; for a temperature outside it, describe the liquid as a user-defined fluid), not 100.1 °C; check the value and its unit.");
    // In °F: 0 °C = 32 °F, 100 °C = 212 °F (definition of the Fahrenheit scale); 213 °F typed.
    expect(read({ temperature: "213" }).errors.temperature).toBe("Temperature is too high: it takes from 32 °F to 212 °F (water's properties are computed for this range only; for a temperature outside it, describe the liquid as a user-defined fluid), not 213 °F; check the value and its unit.");
    expect(read({ temperature: "100" }, SI_UNITS).input!.temperatureC).toBe(100);
    expect(read({ temperature: "-0.1" }, SI_UNITS).errors.temperature).toMatch(/^Temperature is too low: it takes from 0 °C to 100 °C \(water's/);
    const oil = read({ temperature: "120", fluidKind: "custom", fluidName: "Thermal oil", density: "900", viscosity: "0.01", vaporPressure: "0" }, SI_UNITS);
    expect(oil.errors).toEqual({});
    expect(oil.input!.temperatureC).toBe(120);
  });
});

describe("readSystemForm: counts are whole numbers typed in digits (product rule; shared/decimal.ts countField)", () => {
  const FIT = "run.0.fit.elbow-90-standard";
  const elbows = (o: Record<string, string>) => read(o).input?.runs[0].fittings.find((x) => x.id === "elbow-90-standard")?.count;
  // What Number() made of them before: 16, 10, 3 (rounded), NaN (dropped), 0 (clamped), 3, Infinity, 3, 10 000…
  it.each(["0x10", "1e1", "2.5", "2,0", "-1", "+3", "Infinity", "NaN", "abc", "1 000", "1_0", "0b11", "٣"])(
    "a fitting count of %j is an error on that field, naming it, its range and what was typed",
    (typed) => {
      const r = read({ [FIT]: typed });
      expect(r.input).toBeNull();
      expect(r.errors[FIT]).toBe(`The number of 90° elbows must be a whole number from 0 to 500, written in digits: “${typed}” is not.`);
      expect(Object.keys(r.errors)).toEqual([FIT]);
    },
  );
  it.each(["501", "99999999999999999999"])("a fitting count of %j, digits past 500, is too many, with the range", (typed) => {
    const r = read({ [FIT]: typed });
    expect(r.input).toBeNull();
    expect(r.errors[FIT]).toBe(`The number of 90° elbows must be at most 500 (a whole number from 0 to 500): “${typed}” is too many.`);
  }
  );
  it("takes digits, trimmed as every field is (0 to 500, leading zeros); blank or no field is none", () => {
    expect(elbows({ [FIT]: "3" })).toBe(3);
    expect(elbows({ [FIT]: " 3 " })).toBe(3);
    expect(elbows({ [FIT]: "03" })).toBe(3);
    expect(elbows({ [FIT]: "500" })).toBe(500); // the schema's limit (system-input.ts MAX_FITTING_COUNT)
    for (const none of [{ [FIT]: "" }, { [FIT]: "0" }, {}] as Record<string, string>[]) {
      const r = read(none);
      expect(r.errors).toEqual({});
      expect(r.input!.runs[0].fittings).toEqual([]);
    }
  });
  it("the editor's run count the same way: a bad one is an error, never runs read or dropped silently", () => {
    expect(read({ runCount: "41" }).errors.runCount).toBe("The number of pipe runs must be at most 40 (a whole number from 0 to 40): “41” is too many.");
    for (const typed of ["0x1", "1e0", "1.5", "-1", "abc"]) {
      const r = read({ runCount: typed });
      expect(r.input, typed).toBeNull();
      expect(r.errors.runCount, typed).toBe(`The number of pipe runs must be a whole number from 0 to 40, written in digits: “${typed}” is not.`);
    }
    expect(read({ runCount: "1" }).input!.runs).toHaveLength(1);
    expect(read({ runCount: "" }).input!.runs).toHaveLength(0); // blank: no runs, as before
  });
  it("life-cycle years the same way, from 1 to 50 (EnergySettingsSchema's limits, energy.ts): 1e1, 15,0 or 15.0 are errors, never 10 or 15 years", () => {
    const energy = { "energy.control": "fixed-speed", "energy.profileKind": "common" };
    expect(read({ ...energy, "energy.years": "51" }, SI_UNITS).errors["energy.years"]).toBe("Years must be at most 50 (a whole number from 1 to 50): “51” is too many.");
    for (const typed of ["1e1", "15,0", "15.0", "0x0F", "+15", "-1", "Infinity"]) {
      const r = read({ ...energy, "energy.years": typed }, SI_UNITS);
      expect(r.input, typed).toBeNull();
      expect(r.errors["energy.years"], typed).toBe(`Years must be a whole number from 1 to 50, written in digits: “${typed}” is not.`);
    }
    expect(read({ ...energy, "energy.years": "0" }, SI_UNITS).errors["energy.years"]).toBe("Years must be at least 1 (a whole number from 1 to 50): “0” is too few.");
    expect(read({ ...energy, "energy.years": " 25 " }, SI_UNITS).input!.energy!.years).toBe(25);
    expect(read({ ...energy, "energy.years": "50" }, SI_UNITS).input!.energy!.years).toBe(50);
    expect(read({ ...energy, "energy.years": "" }, SI_UNITS).input!.energy!.years).toBe(15); // blank: the default 15 years (energy.ts DEFAULT_ENERGY_SETTINGS)
  });
});
