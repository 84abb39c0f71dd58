import { describe, expect, it } from "vitest";
import { readAdjustForm } from "./adjust-form";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { formOf as form } from "~/test/form-data";
const base = { method: "speed", ratio: "", arrangement: "single", dutyPumps: "1", standbyPumps: "0", motorRating: "", serviceFactor: "1", ieClass: "IE3" };

describe("readAdjustForm", () => {
  it("reads a blank ratio as 'solve for the duty' and a blank motor as 'suggested'", () => {
    const r = readAdjustForm(form(base), SI_UNITS);
    expect(r.adjustment).toMatchObject({ method: "speed", ratio: null, motorRating: 0, serviceFactor: 1 });
  });
  it("takes a decimal comma and converts the motor rating from the user's power unit", () => {
    // 1 hp = 745.69987158227 W (NIST SP 811, from 550 ft·lbf/s)
    const us = readAdjustForm(form({ ...base, ratio: "92,5", motorRating: "10", serviceFactor: "1,15" }), US_UNITS);
    expect(us.adjustment?.ratio).toBeCloseTo(0.925, 12);
    expect(us.adjustment?.motorRating).toBeCloseTo(7456.9987158227, 6);
    expect(us.adjustment?.serviceFactor).toBeCloseTo(1.15, 12);
    expect(readAdjustForm(form({ ...base, motorRating: "7,5" }), SI_UNITS).adjustment?.motorRating).toBe(7500);
  });
  it("refuses a ratio just outside 30–120 % and accepts it at the edge", () => {
    expect(readAdjustForm(form({ ...base, ratio: "29.9" }), SI_UNITS).error).toMatch(/0\.3|30|ratio|Invalid/i);
    expect(readAdjustForm(form({ ...base, ratio: "30" }), SI_UNITS).adjustment?.ratio).toBeCloseTo(0.3, 12);
    expect(readAdjustForm(form({ ...base, ratio: "120" }), SI_UNITS).adjustment?.ratio).toBeCloseTo(1.2, 12);
    expect(readAdjustForm(form({ ...base, ratio: "120.1" }), SI_UNITS).adjustment).toBeNull();
  });
  it("a bad motor rating or service factor is an error naming the field, never the default (product rule)", () => {
    expect(readAdjustForm(form({ ...base, motorRating: "abc" }), US_UNITS)).toEqual({ adjustment: null, error: "The motor rating must be a number." });
    expect(readAdjustForm(form({ ...base, motorRating: "-5" }), US_UNITS).error).toBe("The motor rating must be 0 or more (blank or 0: suggested).");
    expect(readAdjustForm(form({ ...base, motorRating: "0" }), US_UNITS).adjustment?.motorRating).toBe(0); // 0 is "suggested", as blank
    expect(readAdjustForm(form({ ...base, serviceFactor: "abc" }), SI_UNITS)).toEqual({ adjustment: null, error: "The service factor must be a number." });
    expect(readAdjustForm(form({ ...base, serviceFactor: "0" }), SI_UNITS)).toEqual({ adjustment: null, error: "The service factor is 1 to 1.5." }); // below 1: the schema refuses it
    expect(readAdjustForm(form({ ...base, dutyPumps: "2,5" }), SI_UNITS).error).toBe("The number of duty pumps must be a whole number from 1 to 8, written in digits: “2,5” is not.");
    expect(readAdjustForm(form({ ...base, serviceFactor: "" }), SI_UNITS).adjustment?.serviceFactor).toBe(1);
    // Two bad fields: a message for each.
    expect(readAdjustForm(form({ ...base, motorRating: "abc", serviceFactor: "x" }), SI_UNITS).error).toBe("The motor rating must be a number. The service factor must be a number.");
  });
  it("an efficiency class that is none of IE2–IE4 is refused in words that name the field and the choices (IEC 60034-30-1)", () => {
    for (const ie of ["IE5", "", "NaN", "ie3"]) expect(readAdjustForm(form({ ...base, ieClass: ie }), SI_UNITS), ie).toEqual({ adjustment: null, error: "The motor efficiency class is one of IE2, IE3, IE4 (IEC 60034-30-1)." });
    for (const ie of ["IE2", "IE3", "IE4"]) expect(readAdjustForm(form({ ...base, ieClass: ie }), SI_UNITS).adjustment?.ieClass).toBe(ie);
  });
  it("refuses 1,000 hp as ambiguous and says how to write it; 1000 is 1000 hp", () => {
    expect(readAdjustForm(form({ ...base, motorRating: "1,000" }), US_UNITS).error).toBe("The motor rating “1,000” is ambiguous: 1000 (a thousands comma) or 1.000 (a decimal comma)? Write 1000 or 1 000 for the first, 1.000 or 1 for the second.");
    // 1 hp = 745.69987158227 W (NIST SP 811)
    expect(readAdjustForm(form({ ...base, motorRating: "1000" }), US_UNITS).adjustment?.motorRating).toBeCloseTo(745699.87158227, 4);
    expect(readAdjustForm(form({ ...base, ratio: "0x50" }), SI_UNITS).error).toBe("The ratio must be a number.");
  });
  it("refuses an unknown method, NaN and Infinity", () => {
    expect(readAdjustForm(form({ ...base, method: "magic" }), SI_UNITS).adjustment).toBeNull();
    expect(readAdjustForm(form({ ...base, ratio: "NaN" }), SI_UNITS).adjustment).toBeNull();
    expect(readAdjustForm(form({ ...base, serviceFactor: "Infinity" }), SI_UNITS).adjustment).toBeNull();
  });
});

describe("readAdjustForm: duty and standby pumps are counts typed in digits (product rule; shared/decimal.ts countField, AdjustmentSchema's limits)", () => {
  // What the decimal reader made of them before: 1e0 → 1, 2,0 → 2, 2.0 → 2 (accepted as pumps).
  it.each(["1e0", "2,0", "2.0", "0x2", "+2", "-1", "2.5", "Infinity", "abc"])("%j duty pumps is an error naming the field, its range and what was typed", (typed) => {
    const r = readAdjustForm(form({ ...base, arrangement: "parallel", dutyPumps: typed }), SI_UNITS);
    expect(r.adjustment).toBeNull();
    expect(r.error).toBe(`The number of duty pumps must be a whole number from 1 to 8, written in digits: “${typed}” is not.`);
  });
  it.each(["1e0", "1,0", "1.0", "-1"])("%j standby pumps is an error the same way (0 to 8)", (typed) => {
    expect(readAdjustForm(form({ ...base, standbyPumps: typed }), SI_UNITS).error).toBe(`The number of standby pumps must be a whole number from 0 to 8, written in digits: “${typed}” is not.`);
  });
  it("9 duty or standby pumps, digits past 8: too many, with the range", () => {
    expect(readAdjustForm(form({ ...base, arrangement: "parallel", dutyPumps: "9" }), SI_UNITS).error).toBe("The number of duty pumps must be at most 8 (a whole number from 1 to 8): “9” is too many.");
    expect(readAdjustForm(form({ ...base, standbyPumps: "9" }), SI_UNITS).error).toBe("The number of standby pumps must be at most 8 (a whole number from 0 to 8): “9” is too many.");
  });
  it("0 duty pumps is below the minimum, said so; 1 to 8 and standby 0 to 8 are taken; blank is 1 duty and 0 standby", () => {
    expect(readAdjustForm(form({ ...base, dutyPumps: "0" }), SI_UNITS)).toEqual({ adjustment: null, error: "The number of duty pumps must be at least 1 (a whole number from 1 to 8): “0” is too few." });
    expect(readAdjustForm(form({ ...base, arrangement: "parallel", dutyPumps: " 8 ", standbyPumps: "8" }), SI_UNITS).adjustment).toMatchObject({ dutyPumps: 8, standbyPumps: 8 });
    expect(readAdjustForm(form({ ...base, dutyPumps: "", standbyPumps: "" }), SI_UNITS).adjustment).toMatchObject({ dutyPumps: 1, standbyPumps: 0 });
  });
});
